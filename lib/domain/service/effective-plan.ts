export type PlanSource = "override" | "maker" | "calculated" | "none";

export interface EffectiveValue {
  value: number | null;
  source: PlanSource;
}

/**
 * Which interval or quantity applies at a point: a lead's override (with its reason) first, then the
 * equipment maker's value (lubrication plate or manual), then the calculator. Values that are not positive
 * numbers are skipped.
 */
export function effectiveValue(candidates: { override?: number | null; maker?: number | null; calculated?: number | null }): EffectiveValue {
  const ok = (v: number | null | undefined): v is number => typeof v === "number" && Number.isFinite(v) && v > 0;
  if (ok(candidates.override)) return { value: candidates.override, source: "override" };
  if (ok(candidates.maker)) return { value: candidates.maker, source: "maker" };
  if (ok(candidates.calculated)) return { value: candidates.calculated, source: "calculated" };
  return { value: null, source: "none" };
}
