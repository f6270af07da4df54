import { formatNumber } from "../units/format-number";
import { isNonNegative } from "./quantities";
import { SOURCE_REORDER_DESIGN_NOTE } from "./sources";
import type { CalcStep, ReorderPointInput, ReorderPointResult } from "./types";

/** Safety stock held on top of the lead-time demand: 2 weeks of demand. Common practice, no source. */
export const DEFAULT_SAFETY_STOCK_WEEKS = 2;

/**
 * Decides the stock level at which a grease should be reordered: the demand during the lead time plus a safety
 * stock, both in weeks of the forecast demand.
 *
 * reorderPointGrams = gramsPerWeek × (leadTimeDays ÷ 7 + safetyStockWeeks). The lead-time cover is the domain.md
 * §10.3 design note; "lead-time demand + safety stock" is the textbook reorder-point rule, from memory.
 *
 * Guards, each with a warning: a gramsPerWeek that is negative or not a number is taken as 0 (reorder point 0:
 * no demand, no reorder); a leadTimeDays that is negative or not a number is taken as 0 (the reorder point then
 * holds only the safety stock); a safetyStockWeeks that is negative or not a number is taken as
 * DEFAULT_SAFETY_STOCK_WEEKS; a product that overflows to ∞ (absurd inputs such as 1e308 g/week) gives 0.
 *
 * @returns `reorderPointGrams` ≥ 0, never NaN, rounded to 0.001 g (floating-point noise removed; round for display).
 */
export function reorderPoint(input: ReorderPointInput): ReorderPointResult {
  const steps: CalcStep[] = [];
  const warnings: string[] = [];

  let gramsPerWeek = input.gramsPerWeek;
  if (!isNonNegative(gramsPerWeek)) {
    warnings.push(`Demand ${String(gramsPerWeek)} g/week is not a number of grams ≥ 0: taken as 0.`);
    gramsPerWeek = 0;
  }
  let leadTimeDays = input.leadTimeDays;
  if (!isNonNegative(leadTimeDays)) {
    warnings.push(
      `Lead time ${String(leadTimeDays)} days is not a number of days ≥ 0: taken as 0, so the reorder point ` +
        "holds only the safety stock. Enter the supplier's lead time.",
    );
    leadTimeDays = 0;
  }
  let safetyWeeks = input.safetyStockWeeks ?? DEFAULT_SAFETY_STOCK_WEEKS;
  if (!isNonNegative(safetyWeeks)) {
    warnings.push(
      `Safety stock ${String(safetyWeeks)} weeks is not a number of weeks ≥ 0: taken as ${DEFAULT_SAFETY_STOCK_WEEKS}.`,
    );
    safetyWeeks = DEFAULT_SAFETY_STOCK_WEEKS;
  }

  const leadWeeks = leadTimeDays / 7;
  const leadGrams = gramsPerWeek * leadWeeks;
  const safetyGrams = gramsPerWeek * safetyWeeks;
  // Rounded to the milligram: the reorder point is a threshold compared strictly with stock, and 1.1 g/week ×
  // 3 weeks is 3.3000000000000003 in binary, which would make 3.3 g on hand "below" it.
  let reorderPointGrams = Math.round((leadGrams + safetyGrams) * 1000) / 1000;
  if (!Number.isFinite(reorderPointGrams)) {
    warnings.push("The reorder point is too large to compute (check the demand's and lead time's units): taken as 0.");
    reorderPointGrams = 0;
  }
  steps.push({
    label: "Demand during the lead time",
    value:
      `${formatNumber(gramsPerWeek, 3)} g/week × ${formatNumber(leadTimeDays, 2)} days ÷ 7 = ` +
      `${formatNumber(leadGrams, 2)} g (${SOURCE_REORDER_DESIGN_NOTE})`,
  });
  steps.push({
    label: "Safety stock",
    value: `${formatNumber(gramsPerWeek, 3)} g/week × ${formatNumber(safetyWeeks, 2)} weeks = ${formatNumber(safetyGrams, 2)} g`,
  });
  steps.push({
    label: "Reorder point",
    value: `${formatNumber(leadGrams, 2)} g + ${formatNumber(safetyGrams, 2)} g = ${formatNumber(reorderPointGrams, 2)} g`,
  });
  return { reorderPointGrams, steps, warnings };
}
