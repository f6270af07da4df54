import { QueryProvider } from "@/components/providers/query-provider";
import { AppShell } from "@/components/shell/app-shell";
import { requirePageUser } from "@/lib/server/auth";
import { signOutAction } from "./actions";

export default async function SignedInLayout({ children }: { children: React.ReactNode }) {
  const user = await requirePageUser();
  return (
    <QueryProvider>
      <AppShell user={user} signOut={signOutAction}>
        {children}
      </AppShell>
    </QueryProvider>
  );
}
