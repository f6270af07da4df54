export default function Loading() {
  return (
    <div role="status" aria-live="polite" className="flex items-center gap-3 py-10 text-ink-soft">
      <span className="inline-block h-4 w-4 animate-spin rounded-full border-2 border-steel border-t-transparent" aria-hidden="true" />
      Loading…
    </div>
  );
}
