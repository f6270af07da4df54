import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Forbidden } from "@/components/shell/forbidden";
import { MoveForm } from "@/components/stock/move-form";
import { buttonClasses } from "@/components/ui/button";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { can } from "@/lib/domain/permissions";
import { normaliseTagCode } from "@/lib/domain/service";
import { pageUserCan } from "@/lib/server/auth";
import { NotFoundError } from "@/lib/server/errors";
import { getLotLabel, labelMovements, listLocations } from "@/lib/server/queries/stock-lots";
import { returnAction, scrapAction, transferAction } from "../../actions";

export const metadata: Metadata = { title: "Lot" };

const KIND: Record<string, string> = {
  receipt: "⊕ received",
  issue: "⊖ issued",
  return: "↩ returned",
  transfer_in: "→ moved in",
  transfer_out: "← moved out",
  count_adjustment: "± count adjustment",
  scrap: "✖ scrapped",
};

const SOURCE: Record<string, string> = {
  label: "from the label",
  shelf_life_from_manufacture: "shelf life from the manufacture date",
  shelf_life_from_receipt: "shelf life from the receipt date",
  unknown: "unknown",
};

export default async function LotPage({
  params,
  searchParams,
}: {
  params: Promise<{ code: string }>;
  searchParams: Promise<{ received?: string }>;
}) {
  const { user, allowed } = await pageUserCan("stock.read");
  if (!allowed) return <Forbidden what="Stock" />;
  const code = normaliseTagCode((await params).code);
  if (!code) notFound();
  const lot = await getLotLabel(code, user.id).catch((error: unknown) => {
    if (error instanceof NotFoundError) notFound();
    throw error;
  });
  const { received } = await searchParams;
  const [movements, locations] = await Promise.all([labelMovements(code, user.id), listLocations(user.id)]);
  const siteLocations = locations
    .filter((l) => l.siteId === lot.site.id)
    .map((l) => ({ value: l.code, label: `${l.name} (${l.code})` }));
  const held = lot.locations.filter((l) => l.onHand > 0);
  const mayMove = can(user.role, "stock.move");
  const copies = Math.max(1, Math.min(lot.onHand || Number(received) || 1, 120));

  return (
    <>
      <PageHeader
        title={`Lot ${lot.lotNumber} · ${lot.grease.name}`}
        lead={`${lot.grease.code} · ${lot.pack.kind} of ${lot.pack.netMassGrams} g · label ${lot.labelCode} · ${lot.site.name}`}
        actions={
          <Link
            href={`/stock/labels?code=${lot.labelCode}&copies=${copies}`}
            className={buttonClasses("primary")}
          >
            Print labels
          </Link>
        }
      />
      {received ? (
        <Notice tone="success" title="Received">
          {received} container(s) booked in at {lot.locations.map((l) => l.code).join(", ")}. Print the labels
          and stick one on each container before it goes to the shelf.
        </Notice>
      ) : null}
      {lot.expired ? (
        <Notice tone="danger" title="This lot has expired">
          It expired on {lot.expiresOn}. It is not issued any more. Expired grease is not always unusable:
          have a sample checked against new product (consistency, oil separation) before any use, or scrap it
          below.
        </Notice>
      ) : lot.daysToExpiry !== null && lot.daysToExpiry <= 60 ? (
        <Notice tone="caution" title={`Expires in ${lot.daysToExpiry} day(s)`}>
          Issue this lot before the others of the same grease.
        </Notice>
      ) : null}
      {lot.expiresSooner && !lot.expired ? (
        <Notice tone="caution" title="Another lot expires sooner">
          Lot {lot.expiresSooner.lotNumber} (
          <Link href={`/stock/lots/${lot.expiresSooner.labelCode}`}>{lot.expiresSooner.labelCode}</Link>, at{" "}
          {lot.expiresSooner.location}) expires on {lot.expiresSooner.expiresOn}: issue it first.
        </Notice>
      ) : null}
      <div className="mt-6 grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,1fr)_22rem]">
        <div className="space-y-6">
          <Card>
            <h2 className="mb-3 text-lg font-bold">The lot</h2>
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
              <dt className="font-bold">Grease</dt>
              <dd>
                <Link href={`/catalogue/${lot.grease.id}`}>{lot.grease.name}</Link> ({lot.grease.code}) · NLGI{" "}
                {lot.grease.nlgiGrade} · food grade {lot.grease.foodGrade}
              </dd>
              <dt className="font-bold">Lot number</dt>
              <dd>{lot.lotNumber}</dd>
              <dt className="font-bold">Label code</dt>
              <dd className="font-mono">{lot.labelCode}</dd>
              <dt className="font-bold">Manufactured</dt>
              <dd>{lot.manufacturedOn ?? "—"}</dd>
              <dt className="font-bold">Expires</dt>
              <dd>
                {lot.expiresOn ?? "no date"}{" "}
                <span className="text-ink-faint">({SOURCE[lot.expirySource] ?? lot.expirySource})</span>
              </dd>
              <dt className="font-bold">Received</dt>
              <dd>
                {lot.receivedOn}
                {lot.purchaseRequestId ? ` against purchase request #${lot.purchaseRequestId}` : ""}
              </dd>
              <dt className="font-bold">Delivery note</dt>
              <dd>
                {lot.deliveryDocumentId ? (
                  <a href={`/api/v1/stock/labels/${lot.labelCode}/delivery-note`}>Download (PDF)</a>
                ) : (
                  "none kept"
                )}
              </dd>
              <dt className="font-bold">On hand</dt>
              <dd data-testid="lot-on-hand">
                {lot.onHand} {lot.pack.kind}(s)
                {held.length ? ` — ${held.map((l) => `${l.onHand} at ${l.code}`).join(", ")}` : ""}
              </dd>
            </dl>
          </Card>
          <Card>
            <h2 className="mb-3 text-lg font-bold">Movements</h2>
            {movements.length === 0 ? (
              <EmptyState title="No movements">
                <p>Receipts, issues, returns, moves, counts and scrap of this lot will be listed here.</p>
              </EmptyState>
            ) : (
              <div className="overflow-x-auto">
                <table className="w-full text-sm" data-testid="lot-movements">
                  <caption className="sr-only">Movements of lot {lot.lotNumber}</caption>
                  <thead>
                    <tr className="border-b-2 border-line-strong text-left">
                      <th className="p-1">When</th>
                      <th className="p-1">What</th>
                      <th className="p-1 text-right">Containers</th>
                      <th className="p-1">Where</th>
                      <th className="p-1">Who</th>
                      <th className="p-1">Details</th>
                    </tr>
                  </thead>
                  <tbody>
                    {movements.map((m) => (
                      <tr key={m.id} className="border-b border-line">
                        <td className="p-1 whitespace-nowrap">{m.at.slice(0, 16).replace("T", " ")}</td>
                        <td className="p-1">{KIND[m.kind] ?? m.kind}</td>
                        <td className="p-1 text-right tabular-nums">
                          {m.quantity > 0 ? `+${m.quantity}` : m.quantity}
                        </td>
                        <td className="p-1">
                          {m.location}
                          {m.otherLocation
                            ? m.kind === "transfer_out"
                              ? ` → ${m.otherLocation}`
                              : ` ← ${m.otherLocation}`
                            : ""}
                        </td>
                        <td className="p-1">{m.by}</td>
                        <td className="p-1">
                          {[m.issuedTo ? `to ${m.issuedTo}` : null, m.point, m.reason]
                            .filter(Boolean)
                            .join(" · ")}
                        </td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            )}
          </Card>
        </div>
        {mayMove ? (
          <div className="space-y-6">
            {held.length ? (
              <Card>
                <MoveForm
                  id="transfer"
                  title="Move to another location"
                  labelCode={lot.labelCode}
                  action={transferAction}
                  submit="Move"
                  pending="Moving…"
                  fields={[
                    {
                      kind: "select",
                      name: "fromLocation",
                      label: "From",
                      options: held.map((l) => ({ value: l.code, label: `${l.name} (${l.onHand})` })),
                    },
                    {
                      kind: "select",
                      name: "toLocation",
                      label: "To",
                      options: siteLocations,
                      initial: siteLocations.find((l) => l.value !== held[0]?.code)?.value,
                    },
                    { kind: "text", name: "quantity", label: "Containers", numeric: true },
                  ]}
                />
              </Card>
            ) : null}
            <Card>
              <MoveForm
                id="return"
                title="Return unused containers"
                labelCode={lot.labelCode}
                action={returnAction}
                submit="Book the return"
                pending="Booking…"
                fields={[
                  { kind: "select", name: "location", label: "Back to", options: siteLocations },
                  {
                    kind: "text",
                    name: "quantity",
                    label: "Containers",
                    numeric: true,
                    hint: "Only sealed, clean containers go back on the shelf.",
                  },
                  { kind: "text", name: "reason", label: "Note (optional)" },
                ]}
              />
            </Card>
            {held.length ? (
              <Card>
                <MoveForm
                  id="scrap"
                  title="Scrap"
                  labelCode={lot.labelCode}
                  action={scrapAction}
                  submit="Scrap and write off"
                  pending="Scrapping…"
                  tone="danger"
                  fields={[
                    {
                      kind: "select",
                      name: "location",
                      label: "At",
                      options: held.map((l) => ({ value: l.code, label: `${l.name} (${l.onHand})` })),
                    },
                    {
                      kind: "text",
                      name: "quantity",
                      label: "Containers",
                      numeric: true,
                      initial: lot.expired ? String(held[0]?.onHand ?? "") : undefined,
                    },
                    {
                      kind: "text",
                      name: "reason",
                      label: "Reason",
                      initial: lot.expired ? "Expired" : undefined,
                      hint: "Dispose of grease as its safety data sheet and the site's waste rules say.",
                    },
                  ]}
                />
              </Card>
            ) : null}
          </div>
        ) : null}
      </div>
      <p className="mt-6 text-sm">
        <Link href="/stock">Back to stock</Link>
      </p>
    </>
  );
}
