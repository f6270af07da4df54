import { formatNumber } from "../units/format-number";
import { IMPERIAL_QUANTITY_FACTORS } from "./quantity-factors";
import type { CalcStep, ImperialQuantityInput, ImperialQuantityResult } from "./types";

function isPositiveFinite(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x) && x > 0;
}

/**
 * Decides how many ounces of grease to give a rolling bearing at each relubrication, from inch dimensions.
 *
 * G = 0.114·D·B oz from the side (Machinery Lubrication ML #31524, the imperial form of 0.005·D·B; about 0.2 %
 * above it because 0.11379 is rounded up); G = 0.0455·D·B oz through the centre, derived from the metric
 * 0.002·D·B (no published imperial form seen). D = outside diameter and B = width in inches.
 *
 * @returns `quantityOunces` > 0, not rounded; null with a warning when D or B is not a positive number.
 */
export function replenishmentQuantityImperial(input: ImperialQuantityInput): ImperialQuantityResult {
  const side = input.replenishment ?? "side";
  const rule = IMPERIAL_QUANTITY_FACTORS[side];
  const method = `Replenishment quantity ${rule.formula}, D and B in inches (${rule.source})`;
  const steps: CalcStep[] = [];
  const warnings: string[] = [];
  const { outsideDiameterIn: D, widthIn: B } = input;
  if (!isPositiveFinite(D) || !isPositiveFinite(B)) {
    warnings.push(
      `The outside diameter and width must be positive numbers of inches (got D = ${String(D)}, ` +
        `B = ${String(B)}): outside the method's range.`,
    );
    return { quantityOunces: null, method, steps, warnings };
  }
  const ounces = rule.factor * D * B;
  steps.push({
    label: `Quantity ${rule.formula} (${side === "side" ? "from the side" : "through the centre of a ring"})`,
    value: `${formatNumber(rule.factor, 6)} oz/in² × ${formatNumber(D, 3)} in × ${formatNumber(B, 3)} in = ${formatNumber(ounces, 3)} oz`,
  });
  return { quantityOunces: ounces, method, steps, warnings };
}
