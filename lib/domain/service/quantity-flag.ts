/**
 * How far an applied quantity may stray from the planned one before it is flagged: more than 30 % over is
 * over-greasing (heat, seal damage), more than 30 % under is under-greasing. Common practice, no source; the
 * tolerance is an argument.
 */
export const QUANTITY_TOLERANCE = 0.3;

export type QuantityFlag = "ok" | "over" | "under";

/** Compares applied grams with the plan; null when there is no plan to compare with. */
export function quantityFlag(appliedGrams: number, plannedGrams: number | null | undefined, tolerance = QUANTITY_TOLERANCE): QuantityFlag | null {
  if (!plannedGrams || plannedGrams <= 0 || !Number.isFinite(appliedGrams)) return null;
  if (appliedGrams > plannedGrams * (1 + tolerance)) return "over";
  if (appliedGrams < plannedGrams * (1 - tolerance)) return "under";
  return "ok";
}
