import type { Metadata } from "next";
import Link from "next/link";
import { Forbidden } from "@/components/shell/forbidden";
import { ReceiveForm } from "@/components/stock/receive-form";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { pageUserCan } from "@/lib/server/auth";
import { listGreases } from "@/lib/server/queries/greases";
import { listLocations, listOpenPurchaseRequests } from "@/lib/server/queries/stock-lots";
import { receiveAction } from "../actions";

export const metadata: Metadata = { title: "Receive stock" };

export default async function ReceivePage({ searchParams }: { searchParams: Promise<{ request?: string }> }) {
  const { user, allowed } = await pageUserCan("stock.receive");
  if (!allowed) return <Forbidden what="Receiving stock" />;
  const { request } = await searchParams;
  const [greases, locations, requests] = await Promise.all([
    listGreases(),
    listLocations(user.id),
    listOpenPurchaseRequests(user.id),
  ]);
  const sites = new Set(locations.map((l) => l.siteId));
  return (
    <div className="mx-auto max-w-3xl">
      <PageHeader
        title="Receive stock"
        lead="Book a delivery in with the lot number and dates printed on the containers. Each lot gets its own label code; print the labels next and stick one on every container."
      />
      <Notice tone="caution" title="At the goods-in bench">
        Check that the product on the delivery is the one ordered and that the containers are sealed and
        undamaged. Keep the safety data sheet of every grease at hand, and store grease indoors, between about
        0 and 30 °C, in its closed container.
      </Notice>
      <Card className="mt-6">
        {locations.length === 0 ? (
          <EmptyState title="No storage location yet">
            <p>Your site has no storage location. Ask an administrator to add one, then come back.</p>
          </EmptyState>
        ) : (
          <ReceiveForm
            greases={greases.map((g) => ({
              id: g.id,
              code: g.code,
              name: g.name,
              shelfLifeMonths: g.shelfLifeMonths ?? null,
              packs: g.packs.map((p) => ({
                id: p.id,
                kind: p.kind,
                netMassGrams: p.netMassGrams,
                label: p.label ?? null,
              })),
            }))}
            locations={locations.map((l) => ({
              value: sites.size > 1 ? l.qualifiedCode : l.code,
              label: sites.size > 1 ? `${l.site} — ${l.name} (${l.code})` : `${l.name} (${l.code})`,
            }))}
            requests={requests}
            initialRequestId={request && /^\d{1,9}$/.test(request) ? Number(request) : undefined}
            action={receiveAction}
          />
        )}
      </Card>
      <p className="mt-4 text-sm">
        <Link href="/stock">Back to stock</Link>
      </p>
    </div>
  );
}
