import type { Metadata } from "next";
import Link from "next/link";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import { proposeConsolidation } from "@/lib/domain/consolidation";
import { pageUserCan } from "@/lib/server/auth";
import { listGreases } from "@/lib/server/queries/greases";

export const metadata: Metadata = { title: "Consolidate products" };

export default async function ConsolidationPage() {
  const { allowed } = await pageUserCan("catalogue.read");
  if (!allowed) return <Forbidden what="The grease catalogue" />;
  const greases = await listGreases();
  const proposals = proposeConsolidation(greases);
  const byReplaced = new Map<number, typeof proposals>();
  for (const p of proposals) byReplaced.set(p.replace.id, [...(byReplaced.get(p.replace.id) ?? []), p]);

  return (
    <>
      <PageHeader
        title="Consolidate products"
        lead="Fewer greases mean fewer mix-ups and less stock. Each proposal keeps the thickener family, base oils that mix, close base-oil viscosity and consistency, a temperature range at least as wide, and food grade."
      />
      <Notice tone="caution" title="A proposal, not a decision" className="mb-6">
        Check each change against the machine maker&apos;s grease specification, run it as a planned changeover, and
        get the supplier&apos;s or a lab&apos;s confirmation where the products differ.
      </Notice>
      {byReplaced.size === 0 ? (
        <EmptyState title="No product could replace another">
          <p>With the catalogue as it is, no two products meet all the conditions. Add greases, or check that temperature ranges are filled in.</p>
        </EmptyState>
      ) : (
        <div className="space-y-4">
          {[...byReplaced.values()].map((group) => (
            <Card key={group[0]!.replace.id}>
              <h2 className="text-lg font-bold">
                <Link href={`/catalogue/${group[0]!.replace.id}`}>{group[0]!.replace.name}</Link> could be replaced by
              </h2>
              <ul className="mt-2 space-y-3">
                {group.map((p) => (
                  <li key={p.by.id} className="rounded-md border border-line p-3">
                    <p className="font-bold">
                      <Link href={`/catalogue/${p.by.id}`}>{p.by.name}</Link>
                    </p>
                    <ul className="mt-1 list-disc pl-5 text-sm text-ink-soft">
                      {p.reasons.map((r) => (
                        <li key={r}>{r}</li>
                      ))}
                    </ul>
                    <p className="mt-2 text-2xs text-ink-faint">Lube points this merge would touch: none recorded yet (lube points are not set up).</p>
                  </li>
                ))}
              </ul>
            </Card>
          ))}
        </div>
      )}
    </>
  );
}
