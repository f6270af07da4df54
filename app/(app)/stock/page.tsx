import type { Metadata } from "next";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { pageUserCan } from "@/lib/server/auth";

export const metadata: Metadata = { title: "Stock" };

export default async function Page() {
  const { allowed } = await pageUserCan("stock.read");
  if (!allowed) return <Forbidden what="Stock" />;
  return (
    <>
      <PageHeader title="Stock" lead="Lots on hand per location, movements, and reorder points that follow the schedule." />
      <EmptyState title="No stock has been received yet.">
        <p>The storeroom clerk receives cartridges, kegs and drums here with lot number and expiry date, prints container labels, and issues stock — earliest expiry first.</p>
      </EmptyState>
    </>
  );
}
