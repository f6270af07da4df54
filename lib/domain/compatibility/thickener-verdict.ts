import type { Thickener } from "../catalogue";
import { CHARTS } from "./charts";
import { strictestVerdict } from "./strictest-verdict";
import type { ChartId, ChartVerdict, Verdict } from "./types";

/**
 * Decides the thickener verdict for a pair of thickeners across the enabled charts.
 *
 * Each enabled chart is asked for the pair; a chart that does not cover both thickeners, or that prints the
 * pair's diagonal as "n/a", answers null. Diagonals are taken as printed (Chart A's Clay–Clay is borderline).
 * When a chart reads two of our thickeners under one label (Chart A's "Lithium" for lithium and lithium
 * 12-hydroxystearate) the printed diagonal cell for that label is used.
 *
 * @param enabledCharts chart ids; ids that are not in CHARTS are ignored, duplicates count once.
 * @returns the strictest verdict among the charts that cover the pair (incompatible > unknown > borderline >
 *   compatible), or "unknown" when no enabled chart covers it (including when none is enabled, and always for
 *   ptfe, silica and other, which no chart has). `charts` lists every enabled chart in CHARTS order with its own
 *   answer (null = not covered).
 */
export function thickenerVerdict(
  a: Thickener,
  b: Thickener,
  enabledCharts: readonly ChartId[],
): { verdict: Verdict; charts: ChartVerdict[] } {
  const charts: ChartVerdict[] = CHARTS.filter((c) => enabledCharts.includes(c.id)).map((c) => ({
    chartId: c.id,
    source: c.source,
    verdict: c.cell(a, b),
  }));
  const covered = charts.flatMap((c) => (c.verdict === null ? [] : [c.verdict]));
  return { verdict: covered.length === 0 ? "unknown" : strictestVerdict(covered), charts };
}
