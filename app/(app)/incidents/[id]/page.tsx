import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ReasonList } from "@/components/compatibility/reason-list";
import { VerdictBadge } from "@/components/compatibility/verdict-badge";
import { IncidentWork } from "@/components/incidents/incident-work";
import { IncidentStateBadge, KIND_LABEL } from "@/components/incidents/labels";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import type { Reason, Verdict } from "@/lib/domain/compatibility";
import { can } from "@/lib/domain/permissions";
import { pageUserCan } from "@/lib/server/auth";
import { NotFoundError } from "@/lib/server/errors";
import { getIncident } from "@/lib/server/queries/incidents";
import { incidentNoteAction, moveIncidentAction } from "../actions";

export const metadata: Metadata = { title: "Incident" };

const STEP: Record<string, string> = {
  opened: "● Opened",
  investigating: "◐ Investigation started",
  note: "✎ Note",
  closed: "○ Closed",
  reopened: "● Reopened",
};

export default async function IncidentPage({ params }: { params: Promise<{ id: string }> }) {
  const { user, allowed } = await pageUserCan("incidents.read");
  if (!allowed) return <Forbidden what="Mixing incidents" />;
  const raw = (await params).id;
  if (!/^[1-9]\d{0,9}$/.test(raw)) notFound();
  const { incident: i, steps } = await getIncident(Number(raw), user.id).catch((error: unknown) => {
    if (error instanceof NotFoundError) notFound();
    throw error;
  });
  return (
    <>
      <PageHeader
        title={`Incident #${i.id}`}
        lead={`${KIND_LABEL[i.kind]} · ${i.point ? `${i.point.name} · ` : ""}${i.asset ?? ""} · ${i.site}`}
      />
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,1fr)_24rem]">
        <div className="space-y-6">
          <Card>
            <div className="mb-3 flex flex-wrap items-center gap-2">
              <IncidentStateBadge state={i.state} />
              <VerdictBadge verdict={i.verdict as Verdict} />
            </div>
            <dl className="grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
              <dt className="font-bold">Lube point</dt>
              <dd>
                {i.point ? (
                  <Link href={`/points/${i.point.tag}`}>{`${i.point.name} (${i.point.tag})`}</Link>
                ) : (
                  "—"
                )}
              </dd>
              <dt className="font-bold">Area</dt>
              <dd>{i.area ?? "—"}</dd>
              <dt className="font-bold">Grease in the point</dt>
              <dd>
                {i.greaseInPoint ? `${i.greaseInPoint.name} (${i.greaseInPoint.code})` : "none recorded"}
              </dd>
              <dt className="font-bold">
                {i.kind === "found_after_fact" ? "Grease found" : "Grease offered"}
              </dt>
              <dd>{i.greaseOffered ? `${i.greaseOffered.name} (${i.greaseOffered.code})` : "—"}</dd>
              <dt className="font-bold">Opened</dt>
              <dd>
                {i.openedAt.slice(0, 16).replace("T", " ")} UTC by {i.openedBy ?? "—"}
              </dd>
              {i.description ? (
                <>
                  <dt className="font-bold">What was found</dt>
                  <dd className="whitespace-pre-line">{i.description}</dd>
                </>
              ) : null}
              {i.state === "closed" ? (
                <>
                  <dt className="font-bold">Root cause</dt>
                  <dd className="whitespace-pre-line">{i.rootCause}</dd>
                  <dt className="font-bold">Corrective action</dt>
                  <dd className="whitespace-pre-line">{i.correctiveAction}</dd>
                  <dt className="font-bold">Closed</dt>
                  <dd>
                    {i.closedAt?.slice(0, 16).replace("T", " ")} UTC by {i.closedBy ?? "—"}
                  </dd>
                </>
              ) : null}
            </dl>
            <h2 className="mt-4 mb-2 font-bold">The engine&apos;s reasons at the time</h2>
            <ReasonList reasons={i.reasons as Reason[]} />
          </Card>
          <Card>
            <h2 className="mb-3 text-lg font-bold">Timeline</h2>
            <ol className="space-y-3 border-l-2 border-line-strong pl-4" data-testid="incident-timeline">
              {steps.map((s, n) => (
                <li key={n}>
                  <p className="text-sm">
                    <span className="font-bold">{STEP[s.kind] ?? s.kind}</span> ·{" "}
                    {s.at.slice(0, 16).replace("T", " ")} UTC · {s.by ?? "—"}
                  </p>
                  {s.note ? <p className="text-sm whitespace-pre-line text-ink-soft">{s.note}</p> : null}
                </li>
              ))}
            </ol>
          </Card>
        </div>
        {can(user.role, "incidents.work") ? (
          <Card>
            <h2 className="mb-3 text-lg font-bold">Work the incident</h2>
            <IncidentWork
              id={i.id}
              version={i.version}
              state={i.state}
              move={moveIncidentAction}
              note={incidentNoteAction}
            />
          </Card>
        ) : (
          <Card>
            <p className="text-sm text-ink-soft">
              You can read this incident. The lubrication lead investigates and closes it.
            </p>
          </Card>
        )}
      </div>
      <p className="mt-6 text-sm">
        <Link href="/incidents">All incidents</Link>
      </p>
    </>
  );
}
