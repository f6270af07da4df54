import type { Metadata } from "next";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { pageUserCan } from "@/lib/server/auth";

export const metadata: Metadata = { title: "Lube points" };

export default async function Page() {
  const { allowed } = await pageUserCan("points.read");
  if (!allowed) return <Forbidden what="Lube points" />;
  return (
    <>
      <PageHeader title="Lube points" lead="Sites, areas, assets and their lube points, with intervals, quantities and due dates." />
      <EmptyState title="No lube points yet.">
        <p>The lubrication lead adds assets and their lube points here (or imports them from a spreadsheet). Each point&apos;s relubrication interval and quantity are computed with a published method and shown step by step.</p>
      </EmptyState>
    </>
  );
}
