import type { Metadata } from "next";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { pageUserCan } from "@/lib/server/auth";

export const metadata: Metadata = { title: "Audit trail" };

export default async function Page() {
  const { allowed } = await pageUserCan("audit.read");
  if (!allowed) return <Forbidden what="The audit trail" />;
  return (
    <>
      <PageHeader title="Audit trail" lead="The append-only, hash-chained record of significant events." />
      <EmptyState title="The audit trail has no entries yet.">
        <p>Sign-ins, role changes, catalogue and rule changes, services, stock movements and incidents are written here as a chain in which each entry carries the hash of the one before, so a later edit shows.</p>
      </EmptyState>
    </>
  );
}
