import Link from "next/link";

export default function NotFound() {
  return (
    <main className="mx-auto max-w-xl px-6 py-16">
      <p className="text-2xs font-bold uppercase tracking-widest text-amber">404 · not found</p>
      <h1 className="mt-2 text-2xl font-bold">There is nothing at this address</h1>
      <p className="mt-2 text-ink-soft">
        The link may be old, or the item was removed, or it belongs to a site you cannot see.
      </p>
      <p className="mt-6">
        <Link href="/overview">Go to the overview</Link>
      </p>
    </main>
  );
}
