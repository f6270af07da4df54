import type { Thickener } from "../catalogue";
import { CHARTS } from "./charts";
import { capitalise, listInWords, THICKENER_NAMES } from "./names";
import { thickenerVerdict } from "./thickener-verdict";
import type { ChartId, ChartVerdict, CompatibilityChart, Reason, Verdict } from "./types";

/**
 * SKF *Rolling bearings* catalogue, lubrication chapter (tpsbearing.com/catalog/Rollingbearings/files/basic-html/
 * page120.html; also skf.com "Selecting a suitable grease"): PTFE-thickened greases need their own rule, read as
 * "not compatible with standard greases". The sentence was seen only in part (charts-verified.md §5).
 */
const PTFE_SOURCE =
  "SKF Rolling bearings catalogue, lubrication chapter (tpsbearing.com …/page120.html), sentence seen only in part";

function pairPhrase(a: Thickener, b: Thickener): string {
  return a === b
    ? `two ${THICKENER_NAMES[a]}-thickened greases`
    : `${THICKENER_NAMES[a]} and ${THICKENER_NAMES[b]} thickeners`;
}

function chartNote(chart: CompatibilityChart, a: Thickener, b: Thickener): string {
  const notes: string[] = [];
  if (chart.cellProvenance(a, b) === "from_memory") notes.push("cell from memory, unverified");
  const label = chart.labelFor(a);
  if (a !== b && label !== null && label === chart.labelFor(b)) notes.push(`it lists both as "${label}"`);
  return notes.length === 0 ? chart.shortName : `${chart.shortName} (${notes.join("; ")})`;
}

/**
 * Decides the thickener finding of a mix, with a plain-English message naming every enabled chart's verdict.
 * The verdict is thickenerVerdict's; see there for the rules.
 *
 * @returns the reason and the per-chart answers. A pair no enabled chart covers gives an "unknown" reason that
 *   says mixing needs evidence for the two products; PTFE adds that PTFE-thickened greases need their own rule.
 */
export function thickenerReason(
  a: Thickener,
  b: Thickener,
  enabledCharts: readonly ChartId[],
): { reason: Reason; charts: ChartVerdict[] } {
  const { verdict, charts } = thickenerVerdict(a, b, enabledCharts);
  const byId = new Map(CHARTS.map((c) => [c.id, c]));
  const covering = charts.filter((c) => c.verdict !== null);
  const silent = charts.filter((c) => c.verdict === null).map((c) => byId.get(c.chartId)!.shortName);

  if (covering.length === 0) {
    const consulted =
      charts.length === 0
        ? "no thickener chart is enabled"
        : `no enabled chart covers this pair (${listInWords(silent)} checked)`;
    let message = `${capitalise(pairPhrase(a, b))}: ${consulted}, so their compatibility is unknown. Do not mix without evidence for these two products.`;
    const sources = charts.map((c) => c.source);
    if (a === "ptfe" || b === "ptfe") {
      message +=
        " PTFE-thickened greases need a rule of their own: a bearing maker's catalogue says they do not mix with standard greases.";
      sources.push(PTFE_SOURCE);
    }
    return {
      reason: {
        kind: "thickener",
        verdict,
        message,
        ...(sources.length ? { source: sources.join("; ") } : {}),
      },
      charts,
    };
  }

  const distinct = new Set<Verdict | null>(covering.map((c) => c.verdict));
  let message: string;
  if (distinct.size === 1) {
    const names = covering.map((c) => chartNote(byId.get(c.chartId)!, a, b));
    message = `${capitalise(pairPhrase(a, b))} are ${verdict} according to ${listInWords(names)}.`;
  } else {
    const said = covering.map((c) => `${chartNote(byId.get(c.chartId)!, a, b)} says ${c.verdict}`);
    message = `The charts disagree on ${pairPhrase(a, b)}: ${listInWords(said)}. The strictest, ${verdict}, applies.`;
  }
  if (silent.length > 0)
    message += ` ${capitalise(listInWords(silent))} ${silent.length === 1 ? "does" : "do"} not cover this pair.`;
  const sameClass =
    a === b || covering.some((c) => byId.get(c.chartId)!.labelFor(a) === byId.get(c.chartId)!.labelFor(b));
  if (sameClass) {
    // FIST 2-4, text beside Table 2: same-thickener greases from different makers are occasionally incompatible.
    message +=
      " Greases with the same thickener from different makers are occasionally incompatible; evidence for the two products is better.";
  }
  return {
    reason: { kind: "thickener", verdict, message, source: covering.map((c) => c.source).join("; ") },
    charts,
  };
}
