import type { Metadata } from "next";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { pageUserCan } from "@/lib/server/auth";
import { listPurchaseRequests, listStock } from "@/lib/server/queries/stock";

export const metadata: Metadata = { title: "Stock" };

const STATE = { requested: "✉ requested", ordered: "↗ ordered", received: "✔ received", cancelled: "⊘ cancelled" } as const;

export default async function StockPage() {
  const { user, allowed } = await pageUserCan("stock.read");
  if (!allowed) return <Forbidden what="Stock" />;
  const [items, requests] = await Promise.all([listStock(user.id), listPurchaseRequests(user.id)]);
  const low = items.filter((i) => i.low);
  return (
    <>
      <PageHeader
        title="Stock"
        lead={`Containers on hand per grease, pack and location. Reorder points follow the lubrication schedule: demand during the supplier's lead time plus safety stock. ${low.length ? `${new Set(low.map((i) => i.greaseId)).size} grease(s) below their reorder point.` : "Nothing is below its reorder point."}`}
      />
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_24rem]">
        <Card>
          {items.length === 0 ? (
            <EmptyState title="No stock has been received yet">
              <p>The storeroom clerk receives containers with lot number and expiry date; they appear here.</p>
            </EmptyState>
          ) : (
            <div className="overflow-x-auto">
              <table className="w-full text-sm" data-testid="stock-table">
                <caption className="sr-only">Stock on hand</caption>
                <thead>
                  <tr className="border-b-2 border-line-strong text-left">
                    <th className="p-1">Grease</th>
                    <th className="p-1">Pack</th>
                    <th className="p-1">Location</th>
                    <th className="p-1 text-right">On hand</th>
                    <th className="p-1 text-right">Reorder point</th>
                    <th className="p-1">State</th>
                  </tr>
                </thead>
                <tbody>
                  {items.map((i) => (
                    <tr key={`${i.greaseId}-${i.packId}-${i.location}`} className="border-b border-line">
                      <td className="p-1 font-bold">{i.grease}</td>
                      <td className="p-1">{i.pack}</td>
                      <td className="p-1">{i.location}</td>
                      <td className="p-1 text-right tabular-nums">{i.onHand}</td>
                      <td className="p-1 text-right tabular-nums">
                        {i.reorderPoint} <span className="text-2xs text-ink-faint">({(i.reorderPointGrams / 1000).toFixed(1)} kg)</span>
                      </td>
                      <td className="p-1">{i.low ? <span className="font-bold text-bad">▼ below reorder point</span> : <span className="text-good">✔ enough</span>}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
          )}
        </Card>
        <Card>
          <h2 className="mb-2 text-lg font-bold">Purchase requests</h2>
          {requests.length === 0 ? (
            <EmptyState title="No purchase requests">
              <p>When stock falls below a reorder point, a request is raised here and the leads get a mail.</p>
            </EmptyState>
          ) : (
            <ul className="divide-y divide-line text-sm">
              {requests.map((r) => (
                <li key={r.id} className="py-2">
                  <span className="font-bold">{r.grease}</span> · {r.packs} × {r.pack}
                  <span className="block text-2xs text-ink-soft">
                    {STATE[r.state as keyof typeof STATE] ?? r.state} · {r.createdAt.slice(0, 10)} · {r.site}
                  </span>
                </li>
              ))}
            </ul>
          )}
        </Card>
      </div>
    </>
  );
}
