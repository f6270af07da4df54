import { formatNumber } from "../units/format-number";
import { METRIC_QUANTITY_FACTORS } from "./quantity-factors";
import type { CalcStep, QuantityInput, QuantityResult } from "./types";

function isPositiveFinite(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x) && x > 0;
}

/**
 * Decides how many grams of grease to give a rolling bearing at each relubrication.
 *
 * G = 0.005·D·B from the side of the bearing, G = 0.002·D·B through an annular groove and holes in a ring
 * (METRIC_QUANTITY_FACTORS; SKF Rolling bearings catalogue p. 115, The Tribology Handbook §A20). D = outside
 * diameter and B = width in mm; for a thrust bearing pass the total height H as the width. This is the
 * replenishment amount, not the initial fill.
 *
 * @returns `quantityGrams` > 0, not rounded (round for display, see formatMass); null with a warning when D or B
 *   is not a positive number.
 */
export function replenishmentQuantity(input: QuantityInput): QuantityResult {
  const side = input.replenishment ?? "side";
  const rule = METRIC_QUANTITY_FACTORS[side];
  const method = `Replenishment quantity ${rule.formula} (${rule.source})`;
  const steps: CalcStep[] = [];
  const warnings: string[] = [];
  const { outsideDiameterMm: D, widthMm: B } = input;
  if (!isPositiveFinite(D) || !isPositiveFinite(B)) {
    warnings.push(
      `The outside diameter and width must be positive numbers of millimetres (got D = ${String(D)}, ` +
        `B = ${String(B)}): outside the method's range.`,
    );
    return { quantityGrams: null, method, steps, warnings };
  }
  const grams = rule.factor * D * B;
  steps.push({
    label: `Quantity ${rule.formula} (${side === "side" ? "from the side" : "through the centre of a ring"})`,
    value: `${rule.factor} g/mm² × ${formatNumber(D, 2)} mm × ${formatNumber(B, 2)} mm = ${formatNumber(grams, 2)} g`,
  });
  return { quantityGrams: grams, method, steps, warnings };
}
