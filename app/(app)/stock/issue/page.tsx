import type { Metadata } from "next";
import Link from "next/link";
import { Forbidden } from "@/components/shell/forbidden";
import { IssuePanel } from "@/components/stock/issue-panel";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { pageUserCan } from "@/lib/server/auth";
import { listGreases } from "@/lib/server/queries/greases";
import { listIssueRecipients, listLocations } from "@/lib/server/queries/stock-lots";

export const metadata: Metadata = { title: "Issue stock" };

export default async function IssuePage() {
  const { user, allowed } = await pageUserCan("stock.issue");
  if (!allowed) return <Forbidden what="Issuing stock" />;
  const [greases, locations, recipients] = await Promise.all([
    listGreases(),
    listLocations(user.id),
    listIssueRecipients(user.id),
  ]);
  const sites = new Set(locations.map((l) => l.siteId));
  return (
    <>
      <PageHeader
        title="Issue stock"
        lead="Hand containers out from the store. Scan the label of the container you pick up, or choose the grease: the lot that expires first is marked."
      />
      <Card>
        {locations.length === 0 ? (
          <EmptyState title="No storage location yet">
            <p>Your site has no storage location, so there is nothing to issue from.</p>
          </EmptyState>
        ) : (
          <IssuePanel
            greases={greases.map((g) => ({
              id: g.id,
              code: g.code,
              name: g.name,
              packs: g.packs.map((p) => ({ id: p.id, kind: p.kind, netMassGrams: p.netMassGrams })),
            }))}
            locations={locations.map((l) => ({
              value: sites.size > 1 ? l.qualifiedCode : l.code,
              label: sites.size > 1 ? `${l.site} — ${l.name}` : l.name,
            }))}
            recipients={recipients}
          />
        )}
      </Card>
      <p className="mt-4 text-sm">
        <Link href="/stock">Back to stock</Link>
      </p>
    </>
  );
}
