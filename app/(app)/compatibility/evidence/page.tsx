import type { Metadata } from "next";
import { EvidenceForm } from "@/components/compatibility/evidence-form";
import { VerdictBadge } from "@/components/compatibility/verdict-badge";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { evaluateMixtureTest } from "@/lib/domain/compatibility";
import { can } from "@/lib/domain/permissions";
import { pageUserCan } from "@/lib/server/auth";
import { listEvidence, settingsForUser } from "@/lib/server/queries/compatibility";
import { listGreases } from "@/lib/server/queries/greases";

export const metadata: Metadata = { title: "Compatibility evidence" };

const OUTCOME = { pass: "✔ pass", dilution: "≈ dilution", fail: "✖ fail", not_tested: "— not tested" } as const;

export default async function EvidencePage() {
  const { user, allowed } = await pageUserCan("catalogue.read");
  if (!allowed) return <Forbidden what="Compatibility evidence" />;
  const [evidence, settings, greases] = await Promise.all([listEvidence(), settingsForUser(user.id), listGreases()]);
  const canWrite = can(user.role, "compatibility.rules.manage");
  return (
    <>
      <PageHeader
        title="Evidence about product pairs"
        lead="A lab test of the two actual products, or the supplier's written statement, overrides every chart for that pair — in either direction."
      />
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_30rem]">
        <div className="space-y-4">
          {evidence.length === 0 ? (
            <EmptyState title="No evidence recorded yet">
              <p>When a lab tests a mixture of two products, or a supplier confirms in writing that two of its greases mix, record it here.</p>
            </EmptyState>
          ) : null}
          {evidence.map((e) => {
            const judged = e.testData ? evaluateMixtureTest(e.testData, settings) : null;
            return (
              <Card key={e.id} aria-label={e.title}>
                <div className="flex flex-wrap items-center gap-2">
                  <VerdictBadge verdict={e.verdict} />
                  <h2 className="font-bold">{e.title}</h2>
                </div>
                <p className="mt-1 text-sm">
                  {e.greaseAName} + {e.greaseBName} · {e.kind === "lab_mixture_test" ? "lab mixture test" : "supplier statement"} · recorded{" "}
                  {e.recordedAt.slice(0, 10)}
                  {e.documentId ? (
                    <>
                      {" · "}
                      <a href={`/api/v1/compatibility/evidence/${e.id}/document`}>{e.documentName ?? "document"}</a>
                    </>
                  ) : null}
                </p>
                {e.summary ? <p className="mt-1 text-sm text-ink-soft">{e.summary}</p> : null}
                {judged ? (
                  <div className="mt-3 overflow-x-auto">
                    <table className="w-full text-2xs">
                      <caption className="text-left text-2xs text-ink-faint">
                        Judged against allowances: dropping point {settings.droppingPointAllowanceC} °C, worked penetration{" "}
                        {settings.workedPenetrationAllowance}, storage change {settings.storagePenetrationChangeAllowance} (0.1 mm) — our
                        settings, not the standard&apos;s figures.
                      </caption>
                      <thead>
                        <tr className="text-left">
                          <th className="p-1">Mixture</th>
                          <th className="p-1">Property</th>
                          <th className="p-1">Outcome</th>
                          <th className="p-1">Why</th>
                        </tr>
                      </thead>
                      <tbody>
                        {judged.judgements.map((j, i) => (
                          <tr key={i} className="border-t border-line">
                            <td className="p-1">{j.ratio}</td>
                            <td className="p-1">{j.property.replace(/_/g, " ")}</td>
                            <td className="p-1 font-bold">{OUTCOME[j.outcome]}</td>
                            <td className="p-1">{j.message}</td>
                          </tr>
                        ))}
                      </tbody>
                    </table>
                  </div>
                ) : null}
              </Card>
            );
          })}
        </div>
        {canWrite ? (
          <Card>
            <h2 className="mb-3 text-lg font-bold">Record evidence</h2>
            <EvidenceForm greases={greases.map((g) => ({ id: g.id, name: g.name, code: g.code }))} />
          </Card>
        ) : null}
      </div>
    </>
  );
}
