import type { Metadata } from "next";
import { VerifyPanel } from "@/components/audit/verify-panel";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { can } from "@/lib/domain/permissions";
import { listAudit } from "@/lib/server/audit";
import { pageUserCan } from "@/lib/server/auth";

export const metadata: Metadata = { title: "Audit trail" };

export default async function AuditPage({
  searchParams,
}: {
  searchParams: Promise<{ before?: string; event?: string }>;
}) {
  const { user, allowed } = await pageUserCan("audit.read");
  if (!allowed) return <Forbidden what="The audit trail" />;
  const params = await searchParams;
  const before = params.before && /^\d{1,15}$/.test(params.before) ? Number(params.before) : undefined;
  const event = params.event && /^[a-z_.]{1,60}$/.test(params.event) ? params.event : undefined;
  const entries = await listAudit({ before, event, limit: 100 });
  const oldest = entries.at(-1)?.seq;
  return (
    <>
      <PageHeader
        title="Audit trail"
        lead="The append-only record of significant events. Each entry carries the SHA-256 hash of the one before it, so changing or removing an entry afterwards breaks the chain from that point on."
      />
      {can(user.role, "audit.verify") ? (
        <Card className="mb-6">
          <h2 className="mb-2 text-lg font-bold">Check the chain</h2>
          <VerifyPanel />
        </Card>
      ) : null}
      <Card>
        <form method="get" className="mb-3 flex flex-wrap items-end gap-3">
          <label className="flex flex-col gap-1 text-sm font-bold">
            Events starting with
            <input
              name="event"
              defaultValue={event}
              placeholder="e.g. stock. or session."
              className="min-h-10 rounded-md border border-line-strong bg-paper-raised px-3"
            />
          </label>
          <button
            type="submit"
            className="min-h-10 rounded-md border border-steel-dark bg-steel px-4 text-sm font-bold text-white"
          >
            Show
          </button>
        </form>
        {entries.length === 0 ? (
          <EmptyState title="No entries yet">
            <p>
              Sign-ins, role changes, catalogue and rule changes, services, stock movements and incidents are
              written here as they happen.
            </p>
          </EmptyState>
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-sm" data-testid="audit-table">
              <caption className="sr-only">Audit entries, newest first</caption>
              <thead>
                <tr className="border-b-2 border-line-strong text-left">
                  <th className="p-1">#</th>
                  <th className="p-1">When (UTC)</th>
                  <th className="p-1">Event</th>
                  <th className="p-1">Who</th>
                  <th className="p-1">About</th>
                  <th className="p-1">Details</th>
                  <th className="p-1">Hash</th>
                </tr>
              </thead>
              <tbody>
                {entries.map((e) => (
                  <tr key={e.seq} className="border-b border-line align-top">
                    <td className="p-1 tabular-nums">{e.seq}</td>
                    <td className="p-1 whitespace-nowrap">{e.at.slice(0, 19).replace("T", " ")}</td>
                    <td className="p-1 font-bold">{e.event}</td>
                    <td className="p-1">{e.actor ?? "—"}</td>
                    <td className="p-1">{e.subject ?? "—"}</td>
                    <td className="p-1 font-mono text-2xs [overflow-wrap:anywhere]">
                      {e.payload.length > 160 ? `${e.payload.slice(0, 160)}…` : e.payload}
                    </td>
                    <td className="p-1 font-mono text-2xs" title={e.hash}>
                      {e.hash.slice(0, 12)}…
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
        {oldest && oldest > 1 ? (
          <p className="mt-3 text-sm">
            <a href={`/audit?before=${oldest}${event ? `&event=${event}` : ""}`}>Older entries</a>
          </p>
        ) : null}
      </Card>
    </>
  );
}
