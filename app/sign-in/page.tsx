import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { Logo } from "@/components/shell/logo";
import { getCurrentSession, safeNextPath } from "@/lib/server/auth";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ next?: string | string[] }> }) {
  const raw = (await searchParams).next;
  const next = safeNextPath(typeof raw === "string" ? raw : null) ?? "/overview";
  if (await getCurrentSession()) redirect(next);
  return (
    <div className="grid min-h-screen md:grid-cols-[1fr_minmax(22rem,28rem)]">
      <section className="hidden flex-col justify-between bg-steel p-10 text-white md:flex">
        <div className="flex items-center gap-3">
          <Logo size={40} />
          <span className="text-2xl font-bold tracking-wide">Greaseledger</span>
        </div>
        <div className="max-w-lg space-y-4">
          <p className="text-2xl font-bold leading-snug">The right grease, in the right amount, and never two that must not meet.</p>
          <p className="text-steel-light">
            Catalogue, compatibility checks at the lube point, stock that follows the lubrication schedule, and an
            incident log an auditor can trust.
          </p>
        </div>
        <p className="text-2xs text-steel-light">
          Before work on machinery: isolate and lock out as your site requires. Grease guns can inject grease through
          skin — treat any injection as a medical emergency.
        </p>
      </section>
      <section className="flex flex-col justify-center px-6 py-10">
        <div className="mb-8 flex items-center gap-2 text-steel md:hidden">
          <Logo size={32} />
          <span className="text-xl font-bold">Greaseledger</span>
        </div>
        <h1 className="mb-1 text-2xl font-bold">Sign in</h1>
        <p className="mb-6 text-sm text-ink-soft">Use the e-mail address your administrator registered.</p>
        <SignInForm next={next} />
        <p className="mt-6 text-2xs text-ink-faint">
          No account yet? An administrator sends you an invitation by mail.
        </p>
      </section>
    </div>
  );
}
