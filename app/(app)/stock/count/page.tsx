import type { Metadata } from "next";
import Link from "next/link";
import { Forbidden } from "@/components/shell/forbidden";
import { CountSheet } from "@/components/stock/count-sheet";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { cn } from "@/lib/cn";
import { pageUserCan } from "@/lib/server/auth";
import { countSheet, listLocations } from "@/lib/server/queries/stock-lots";
import { countAction } from "../actions";

export const metadata: Metadata = { title: "Cycle count" };

export default async function CountPage({ searchParams }: { searchParams: Promise<{ location?: string }> }) {
  const { user, allowed } = await pageUserCan("stock.count");
  if (!allowed) return <Forbidden what="Cycle counts" />;
  const { location } = await searchParams;
  const locations = await listLocations(user.id);
  const chosen =
    location && /^\d{1,9}$/.test(location) ? locations.find((l) => l.id === Number(location)) : undefined;
  const sheet = chosen ? await countSheet(user.id, chosen.id) : null;
  const several = new Set(locations.map((l) => l.siteId)).size > 1;
  return (
    <>
      <PageHeader
        title="Cycle count"
        lead="Count one location at a time. Type what is on the shelf for every lot; differences from the books are posted as adjustments with your reason."
      />
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[16rem_minmax(0,1fr)]">
        <Card>
          <h2 className="mb-2 font-bold">Locations</h2>
          {locations.length === 0 ? (
            <p className="text-sm">No storage locations on your sites.</p>
          ) : (
            <ul className="space-y-1 text-sm">
              {locations.map((l) => (
                <li key={l.id}>
                  <Link
                    href={`/stock/count?location=${l.id}`}
                    className={cn(
                      "block rounded px-2 py-1",
                      chosen?.id === l.id && "bg-steel-light font-bold",
                    )}
                    aria-current={chosen?.id === l.id ? "page" : undefined}
                  >
                    {several ? `${l.site} — ` : ""}
                    {l.name} ({l.lots} lots)
                  </Link>
                </li>
              ))}
            </ul>
          )}
        </Card>
        <Card>
          {!sheet ? (
            <EmptyState title="Choose a location to count">
              <p>Pick a location on the left; its count sheet lists every lot the books say is there.</p>
            </EmptyState>
          ) : sheet.lines.length === 0 ? (
            <EmptyState title="Nothing on the books here">
              <p>
                The books show no stock at {sheet.location.name}. Containers found there belong to a lot: book
                them with a <Link href="/stock/receive">receipt</Link> or a return on the lot&apos;s page.
              </p>
            </EmptyState>
          ) : (
            <>
              <h2 className="mb-3 text-lg font-bold">
                {sheet.location.name} ({several ? sheet.location.qualifiedCode : sheet.location.code})
              </h2>
              <CountSheet
                key={sheet.location.id}
                location={several ? sheet.location.qualifiedCode : sheet.location.code}
                lines={sheet.lines}
                action={countAction}
              />
            </>
          )}
        </Card>
      </div>
    </>
  );
}
