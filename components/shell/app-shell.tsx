import Link from "next/link";
import { can, ROLE_LABELS, type Role } from "@/lib/domain/permissions";
import { NAV_ITEMS } from "./nav-items";
import { NavLinks } from "./nav-links";
import { Logo } from "./logo";

export interface AppShellProps {
  user: { name: string; email: string; role: Role };
  signOut: () => Promise<void>;
  children: React.ReactNode;
}

/** The signed-in frame: brand, the sections this role may use, who is signed in, sign-out. */
export function AppShell({ user, signOut, children }: AppShellProps) {
  const items = NAV_ITEMS.filter((item) => can(user.role, item.action)).map(({ href, label }) => ({ href, label }));
  return (
    <div className="flex min-h-screen flex-col">
      <a href="#main" className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:bg-paper-raised focus:p-2">
        Skip to content
      </a>
      <header className="no-print bg-steel text-white">
        <div className="mx-auto flex max-w-7xl flex-wrap items-center gap-x-6 gap-y-2 px-4 py-3">
          <Link href="/overview" className="flex items-center gap-2 text-white no-underline hover:no-underline">
            <Logo />
            <span className="text-lg font-bold tracking-wide">Greaseledger</span>
          </Link>
          <div className="order-3 w-full md:order-2 md:w-auto md:flex-1">
            <NavLinks items={items} />
          </div>
          <div className="order-2 ml-auto flex items-center gap-3 md:order-3">
            <div className="text-right leading-tight">
              <Link href="/account" className="text-sm font-bold text-white" data-testid="signed-in-name">
                {user.name}
              </Link>
              <p className="text-2xs text-steel-light" data-testid="signed-in-role">
                {ROLE_LABELS[user.role]}
              </p>
            </div>
            <form action={signOut}>
              <button type="submit" className="min-h-10 rounded-md border border-white/40 px-3 text-sm font-bold text-white hover:bg-white/15">
                Sign out
              </button>
            </form>
          </div>
        </div>
      </header>
      <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-4 py-6">
        {children}
      </main>
      <footer className="no-print border-t border-line px-4 py-3 text-center text-2xs text-ink-faint">
        Greaseledger supports planning and record keeping. Site rules, lock-out procedures and the equipment
        maker&apos;s instructions come first.
      </footer>
    </div>
  );
}
