import type { Metadata } from "next";
import Link from "next/link";
import { CompatibilityMatrix, type MatrixView } from "@/components/compatibility/matrix";
import { Forbidden } from "@/components/shell/forbidden";
import { buttonClasses } from "@/components/ui/button";
import { Card, PageHeader } from "@/components/ui/card";
import { THICKENERS, THICKENER_LABELS, type Thickener } from "@/lib/domain/catalogue";
import { CHARTS, thickenerVerdict } from "@/lib/domain/compatibility";
import { can } from "@/lib/domain/permissions";
import { pageUserCan } from "@/lib/server/auth";
import { settingsForUser } from "@/lib/server/queries/compatibility";

export const metadata: Metadata = { title: "Compatibility matrix" };

const PROVENANCE = {
  transcribed: "Every cell was read in the published table.",
  partly_transcribed: "Only part of this chart was read in its source; the other cells are recalled from memory and not yet checked.",
  from_memory: "This chart is recalled from memory and has not been checked against the published table.",
} as const;

export default async function MatrixPage() {
  const { user, allowed } = await pageUserCan("compatibility.evaluate");
  if (!allowed) return <Forbidden what="The compatibility matrix" />;
  const settings = await settingsForUser(user.id);
  const enabled = settings.enabledCharts;
  const names = new Map(CHARTS.map((c) => [c.id, c.shortName]));

  const strictest: MatrixView = {
    id: "strictest",
    title: "Strictest of the enabled charts",
    note: `What the pair check uses: the strictest verdict of ${enabled.map((id) => names.get(id) ?? id).join(", ") || "no chart"}. A pair no enabled chart covers is unknown and is not mixed.`,
    labels: THICKENERS.map((t) => ({ key: t, label: THICKENER_LABELS[t] })),
    cells: THICKENERS.map((a) =>
      THICKENERS.map((b) => {
        const result = thickenerVerdict(a, b, enabled);
        return {
          verdict: result.verdict,
          detail: result.charts.map((c) => ({ chart: names.get(c.chartId) ?? c.chartId, verdict: c.verdict, source: c.source })),
        };
      }),
    ),
  };
  const perChart: MatrixView[] = CHARTS.map((chart) => ({
    id: chart.id,
    title: `${chart.title}${enabled.includes(chart.id) ? "" : " (not enabled)"}`,
    caution: chart.provenance === "transcribed" ? undefined : PROVENANCE[chart.provenance],
    note: `${chart.title}. ${chart.provenanceNote}`,
    labels: chart.thickeners.map((t: Thickener) => ({ key: t, label: THICKENER_LABELS[t] })),
    cells: chart.thickeners.map((a) =>
      chart.thickeners.map((b) => ({ verdict: chart.cell(a, b), detail: [{ chart: chart.shortName, verdict: chart.cell(a, b), source: chart.source }] })),
    ),
  }));

  return (
    <>
      <PageHeader
        title="Thickener compatibility"
        lead="Published charts disagree with each other and ignore base oils and additives; they are a first screen, not proof. Product-specific lab evidence overrides them."
        actions={
          <>
            <Link href="/compatibility/check" className={buttonClasses("primary")}>
              Check a pair
            </Link>
            <Link href="/compatibility/evidence" className={buttonClasses("secondary")}>
              Evidence
            </Link>
            {can(user.role, "compatibility.rules.manage") ? (
              <Link href="/compatibility/settings" className={buttonClasses("secondary")}>
                Settings
              </Link>
            ) : null}
          </>
        }
      />
      <Card>
        <CompatibilityMatrix views={[strictest, ...perChart]} />
      </Card>
    </>
  );
}
