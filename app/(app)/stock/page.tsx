import type { Metadata } from "next";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { pageUserCan } from "@/lib/server/auth";
import { listPurchaseRequests, listStock } from "@/lib/server/queries/stock";
import { listExpiringLots, listLocations } from "@/lib/server/queries/stock-lots";
import { listGreases } from "@/lib/server/queries/greases";
import { PurchaseRequestActions } from "@/components/stock/purchase-request-actions";
import { ReorderSettingsForm } from "@/components/stock/reorder-settings-form";
import { StockTable } from "@/components/stock/stock-table";
import { buttonClasses } from "@/components/ui/button";
import { can } from "@/lib/domain/permissions";
import Link from "next/link";
import { purchaseRequestAction, stockPolicyAction } from "./actions";
import { ConsumptionPanel } from "@/components/stock/consumption-trend";
import { StockLevelPanel } from "@/components/stock/stock-level-chart";
import { stockChartData } from "@/lib/server/queries/stock-trend";

export const metadata: Metadata = { title: "Stock" };

const STATE = {
  requested: "✉ requested",
  ordered: "↗ ordered",
  received: "✔ received",
  cancelled: "⊘ cancelled",
} as const;

export default async function StockPage() {
  const { user, allowed } = await pageUserCan("stock.read");
  if (!allowed) return <Forbidden what="Stock" />;
  const [items, requests, charts] = await Promise.all([
    listStock(user.id),
    listPurchaseRequests(user.id),
    stockChartData(user.id),
  ]);
  const low = items.filter((i) => i.low);
  const [expiring, locations, greases] = await Promise.all([
    listExpiringLots(user.id),
    listLocations(user.id),
    can(user.role, "stock.reorder.manage") ? listGreases() : Promise.resolve([]),
  ]);
  const sites = [...new Map(locations.map((l) => [l.siteId, { id: l.siteId, name: l.site }])).values()];
  const several = sites.length > 1;
  return (
    <>
      <PageHeader
        title="Stock"
        lead={`Containers on hand per grease, pack and location. Reorder points follow the lubrication schedule: demand during the supplier's lead time plus safety stock. ${low.length ? `${new Set(low.map((i) => i.greaseId)).size} grease(s) below their reorder point.` : "Nothing is below its reorder point."}`}
        actions={
          <>
            {can(user.role, "stock.receive") ? (
              <Link href="/stock/receive" className={buttonClasses("primary")}>
                Receive
              </Link>
            ) : null}
            {can(user.role, "stock.issue") ? (
              <Link href="/stock/issue" className={buttonClasses("secondary")}>
                Issue
              </Link>
            ) : null}
            {can(user.role, "stock.count") ? (
              <Link href="/stock/count" className={buttonClasses("secondary")}>
                Count
              </Link>
            ) : null}
          </>
        }
      />
      {charts.some((site) => site.greases.length) ? (
        <div className="mb-6 grid gap-6">
          <Card>
            <h2 className="mb-1 text-lg font-bold">On hand against reorder point</h2>
            <StockLevelPanel sites={charts} />
          </Card>
          <Card>
            <h2 className="mb-1 text-lg font-bold">Grease used per week</h2>
            <ConsumptionPanel sites={charts} />
          </Card>
        </div>
      ) : null}
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <Card>
          <h2 className="mb-2 text-lg font-bold">On hand</h2>
          <StockTable
            rows={items.map((i) => ({
              greaseId: i.greaseId,
              grease: i.grease,
              pack: i.pack,
              site: i.site,
              location: several ? `${i.site}/${i.location}` : i.location,
              onHand: i.onHand,
              reorderPoint: i.reorderPoint,
              reorderPointGrams: i.reorderPointGrams,
              weeksOfCover: i.weeksOfCover,
              state: i.low ? "low" : "enough",
            }))}
          />
        </Card>
        <Card>
          <h2 className="mb-2 text-lg font-bold">Purchase requests</h2>
          {requests.length === 0 ? (
            <EmptyState title="No purchase requests">
              <p>
                When stock falls below a reorder point, a request is raised here and the leads get a mail.
              </p>
            </EmptyState>
          ) : (
            <ul className="divide-y divide-line text-sm">
              {requests.map((r) => (
                <li key={r.id} className="py-2">
                  <span className="font-bold">{r.grease}</span> · {r.packs} × {r.pack}
                  <span className="block text-2xs text-ink-soft">
                    #{r.id} · {STATE[r.state as keyof typeof STATE] ?? r.state} · {r.createdAt.slice(0, 10)} ·{" "}
                    {r.site}
                    {r.reference ? ` · ${r.reference}` : ""}
                  </span>
                  <PurchaseRequestActions
                    id={r.id}
                    state={r.state}
                    canManage={can(user.role, "stock.reorder.manage")}
                    canReceive={can(user.role, "stock.receive")}
                    action={purchaseRequestAction}
                  />
                </li>
              ))}
            </ul>
          )}
        </Card>
      </div>
      <div className="mt-6 grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-2">
        <Card>
          <h2 className="mb-2 text-lg font-bold">Expired and expiring within 60 days</h2>
          {expiring.length === 0 ? (
            <EmptyState title="Nothing close to its expiry date">
              <p>
                Lots that expire within 60 days show here, soonest first, so they are issued before the
                others.
              </p>
            </EmptyState>
          ) : (
            <ul className="divide-y divide-line text-sm" data-testid="expiring-lots">
              {expiring.map((l) => (
                <li
                  key={`${l.labelCode}-${l.location}`}
                  className="flex flex-wrap items-baseline justify-between gap-2 py-2"
                >
                  <span>
                    <Link href={`/stock/lots/${l.labelCode}`} className="font-bold">
                      {l.grease}
                    </Link>{" "}
                    · lot {l.lotNumber} · {l.onHand} at {several ? l.location : l.location.split("/")[1]}
                  </span>
                  {l.expired ? (
                    <span className="font-bold text-bad">✖ expired {l.expiresOn}: test or scrap</span>
                  ) : (
                    <span className="font-bold text-caution">
                      ⏳ use by {l.expiresOn} ({l.daysToExpiry} days)
                    </span>
                  )}
                </li>
              ))}
            </ul>
          )}
        </Card>
        <Card>
          <h2 className="mb-2 text-lg font-bold">Storage locations</h2>
          {locations.length === 0 ? (
            <EmptyState title="No storage locations">
              <p>
                An administrator adds the storerooms and cabinets of each site; stock is received into them.
              </p>
            </EmptyState>
          ) : (
            <ul className="divide-y divide-line text-sm">
              {locations.map((l) => (
                <li key={l.id} className="flex items-baseline justify-between gap-2 py-2">
                  <span>
                    <span className="font-bold">{l.name}</span>{" "}
                    <span className="font-mono text-2xs">{several ? l.qualifiedCode : l.code}</span>
                    {several ? <span className="block text-2xs text-ink-soft">{l.site}</span> : null}
                  </span>
                  <span className="text-right">
                    {l.containers} container(s) in {l.lots} lot(s)
                    {can(user.role, "stock.count") ? (
                      <Link href={`/stock/count?location=${l.id}`} className="ml-3 text-2xs">
                        count
                      </Link>
                    ) : null}
                  </span>
                </li>
              ))}
            </ul>
          )}
        </Card>
        {can(user.role, "stock.reorder.manage") ? (
          <Card className="lg:col-span-2">
            <h2 className="mb-2 text-lg font-bold">Reorder settings</h2>
            <p className="mb-3 text-sm text-ink-soft">
              A fixed reorder point overrides the one worked out from the lubrication schedule. Use it for
              greases the schedule does not describe well, such as ones used for repairs.
            </p>
            <ReorderSettingsForm
              sites={sites}
              greases={greases.map((g) => ({ id: g.id, code: g.code, name: g.name }))}
              action={stockPolicyAction}
            />
          </Card>
        ) : null}
      </div>
    </>
  );
}
