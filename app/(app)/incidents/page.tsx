import type { Metadata } from "next";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { pageUserCan } from "@/lib/server/auth";

export const metadata: Metadata = { title: "Mixing incidents" };

export default async function Page() {
  const { allowed } = await pageUserCan("incidents.read");
  if (!allowed) return <Forbidden what="Mixing incidents" />;
  return (
    <>
      <PageHeader title="Mixing incidents" lead="Every refused or discovered mix, with its investigation trail." />
      <EmptyState title="No incidents have been recorded.">
        <p>When the compatibility check refuses a grease at a lube point, an incident opens here automatically. The lead investigates and closes it with a root cause and corrective action; auditors export the log.</p>
      </EmptyState>
    </>
  );
}
