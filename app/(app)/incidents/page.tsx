import type { Metadata } from "next";
import Link from "next/link";
import { VerdictBadge } from "@/components/compatibility/verdict-badge";
import { ExportButtons } from "@/components/incidents/export-buttons";
import { IncidentStateBadge, KIND_LABEL } from "@/components/incidents/labels";
import { Forbidden } from "@/components/shell/forbidden";
import { buttonClasses } from "@/components/ui/button";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import type { Verdict } from "@/lib/domain/compatibility";
import { can } from "@/lib/domain/permissions";
import { pageUserCan } from "@/lib/server/auth";
import { countIncidents, listIncidents } from "@/lib/server/queries/incidents";
import { listAreas } from "@/lib/server/queries/points";
import { listLocations } from "@/lib/server/queries/stock-lots";
import { INCIDENT_KINDS, INCIDENT_STATES, incidentFilterSchema } from "@/lib/validation/incidents";

export const metadata: Metadata = { title: "Mixing incidents" };

const select = "min-h-10 rounded-md border border-line-strong bg-paper-raised px-3";

export default async function IncidentsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | undefined>>;
}) {
  const { user, allowed } = await pageUserCan("incidents.read");
  if (!allowed) return <Forbidden what="Mixing incidents" />;
  const raw = await searchParams;
  const parsed = incidentFilterSchema.safeParse(raw);
  const filter = parsed.success ? parsed.data : {};
  const [items, counts, areas, locations] = await Promise.all([
    listIncidents(user.id, filter),
    countIncidents(user.id, filter),
    listAreas(user.id),
    listLocations(user.id),
  ]);
  const sites = [...new Map(locations.map((l) => [l.qualifiedCode.split("/")[0]!, l.site])).entries()];
  return (
    <>
      <PageHeader
        title="Mixing incidents"
        lead="Every refused mix, changeover exception and mix found after the fact, with its investigation. The record cannot be edited afterwards: each step is added to the incident's timeline and to the audit trail."
        actions={
          can(user.role, "incidents.report") ? (
            <Link href="/incidents/report" className={buttonClasses("primary")}>
              Report a mix found
            </Link>
          ) : undefined
        }
      />
      {!parsed.success ? (
        <Notice tone="danger">
          {parsed.error.issues.map((i) => `${i.path.join(".")}: ${i.message}`).join(" ")}
        </Notice>
      ) : null}
      <Card className="mb-6">
        <form method="get" className="flex flex-wrap items-end gap-3" aria-label="Filter incidents">
          <label className="flex flex-col gap-1 text-sm font-bold">
            From
            <input type="date" name="from" defaultValue={filter.from} className={select} />
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            To
            <input type="date" name="to" defaultValue={filter.to} className={select} />
          </label>
          {sites.length > 1 ? (
            <label className="flex flex-col gap-1 text-sm font-bold">
              Site
              <select name="site" defaultValue={filter.site ?? ""} className={select}>
                <option value="">All sites</option>
                {sites.map(([code, name]) => (
                  <option key={code} value={code}>
                    {name}
                  </option>
                ))}
              </select>
            </label>
          ) : null}
          <label className="flex flex-col gap-1 text-sm font-bold">
            Area
            <select name="area" defaultValue={filter.area ?? ""} className={select}>
              <option value="">All areas</option>
              {areas.map((a) => (
                <option key={a.id} value={a.id}>
                  {sites.length > 1 ? `${a.site} — ` : ""}
                  {a.name}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            Kind
            <select name="kind" defaultValue={filter.kind ?? ""} className={select}>
              <option value="">All kinds</option>
              {INCIDENT_KINDS.map((k) => (
                <option key={k} value={k}>
                  {KIND_LABEL[k]}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            State
            <select name="state" defaultValue={filter.state ?? ""} className={select}>
              <option value="">All states</option>
              {INCIDENT_STATES.map((s) => (
                <option key={s} value={s}>
                  {s}
                </option>
              ))}
            </select>
          </label>
          <button type="submit" className={buttonClasses("primary")}>
            Show
          </button>
          <Link href="/incidents" className="min-h-10 content-center text-sm">
            Clear
          </Link>
        </form>
        {can(user.role, "incidents.export") ? (
          <div className="mt-4">
            <ExportButtons
              query={new URLSearchParams(
                Object.entries(filter).flatMap(([k, v]) =>
                  v === undefined || v === "" ? [] : [[k, String(v)]],
                ),
              ).toString()}
            />
          </div>
        ) : null}
        <p className="mt-3 text-sm" data-testid="incident-counts">
          {counts.total} incident(s): {counts.byState.open} open, {counts.byState.investigating}{" "}
          investigating, {counts.byState.closed} closed · {counts.byKind.refused_mix} refused at the point,{" "}
          {counts.byKind.changeover_exception} changeover exceptions, {counts.byKind.found_after_fact} found
          after the fact.
        </p>
      </Card>
      <Card>
        {items.length === 0 ? (
          <EmptyState title="No incident matches">
            <p>
              When the compatibility check refuses a grease at a lube point, an incident opens here by itself.
              Widen the period or clear the filters to see more.
            </p>
          </EmptyState>
        ) : (
          <div className="overflow-x-auto">
            <table className="w-full text-sm" data-testid="incident-table">
              <caption className="sr-only">Mixing incidents, newest first</caption>
              <thead>
                <tr className="border-b-2 border-line-strong text-left">
                  <th className="p-1">#</th>
                  <th className="p-1">Opened</th>
                  <th className="p-1">Where</th>
                  <th className="p-1">Kind</th>
                  <th className="p-1">Greases</th>
                  <th className="p-1">Verdict</th>
                  <th className="p-1">State</th>
                </tr>
              </thead>
              <tbody>
                {items.map((i) => (
                  <tr key={i.id} className="border-b border-line align-top">
                    <td className="p-1">
                      <Link href={`/incidents/${i.id}`} className="font-bold">
                        #{i.id}
                      </Link>
                    </td>
                    <td className="p-1 whitespace-nowrap">{i.openedAt.slice(0, 16).replace("T", " ")}</td>
                    <td className="p-1">
                      {i.point ? `${i.point.name} · ` : ""}
                      {i.asset ?? ""}
                      <span className="block text-2xs text-ink-soft">
                        {i.area ? `${i.area} · ` : ""}
                        {i.site}
                      </span>
                    </td>
                    <td className="p-1">{KIND_LABEL[i.kind]}</td>
                    <td className="p-1">
                      in the point: {i.greaseInPoint?.name ?? "—"}
                      <span className="block">offered/found: {i.greaseOffered?.name ?? "—"}</span>
                    </td>
                    <td className="p-1">
                      <VerdictBadge verdict={i.verdict as Verdict} size="sm" />
                    </td>
                    <td className="p-1">
                      <IncidentStateBadge state={i.state} />
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        )}
      </Card>
    </>
  );
}
