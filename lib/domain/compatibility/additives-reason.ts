import { listInWords, solidAdditiveName } from "./names";
import type { Reason } from "./types";

const SOURCE =
  "Our rule: no published statement on how solids change thickener compatibility was found, so solids are a " +
  "separate check that never upgrades a verdict (charts-verified.md §5)";

function normalise(additives: readonly string[] | undefined): string[] {
  return [...new Set(additives ?? [])].sort();
}

function inWords(additives: readonly string[]): string {
  return additives.length === 0 ? "no solids" : listInWords(additives.map(solidAdditiveName));
}

/**
 * Decides the solid-additive finding (MoS₂, graphite, PTFE …), comparing the two sets regardless of order and
 * repeats.
 *
 * @returns null when neither grease has solids; "borderline" naming both sets when they differ; "compatible" when
 *   both carry the same non-empty set. A compatible finding can never raise the overall verdict, since the
 *   strictest reason wins.
 */
export function additivesReason(
  inBearing: readonly string[] | undefined,
  candidate: readonly string[] | undefined,
): Reason | null {
  const a = normalise(inBearing);
  const b = normalise(candidate);
  if (a.length === 0 && b.length === 0) return null;
  if (a.length === b.length && a.every((x, i) => x === b[i])) {
    return {
      kind: "additives",
      verdict: "compatible",
      message: `Both greases carry the same solids: ${inWords(a)}.`,
      source: SOURCE,
    };
  }
  return {
    kind: "additives",
    verdict: "borderline",
    message: `The solid additives differ: the grease in the bearing has ${inWords(a)}, the new grease has ${inWords(b)}. Check the mix with the supplier.`,
    source: SOURCE,
  };
}
