import { formatNumber } from "../units/format-number";
import { GRAMS_EPSILON, isNonNegative, isPositive } from "./quantities";
import type { CalcStep, OrderQuantityInput, OrderQuantityResult } from "./types";

/** Weeks of demand held above the reorder point once an order is in: 8. Common practice, no source. */
export const DEFAULT_COVER_WEEKS = 8;

/**
 * Decides how many whole packs of a grease to order.
 *
 * target = reorderPointGrams + coverWeeks × gramsPerWeek; position = onHandGrams + onOrderGrams;
 * shortfall = target − position; packs = ⌈shortfall ÷ packGrams⌉. The order is sized whenever asked; deciding
 * *when* to order (stock position below the reorder point) is the caller's.
 *
 * - position at or above the target → 0 packs;
 * - packGrams not a positive number → 0 packs, with a step and a warning (an order cannot be sized); likewise
 *   when the target or position overflows to ∞, or the pack count is not a safe integer (absurd inputs);
 * - a shortfall within GRAMS_EPSILON (1 µg) of a whole number of packs is not rounded up to one pack more;
 * - onHandGrams, onOrderGrams, reorderPointGrams or gramsPerWeek negative or not a number → taken as 0, and
 *   coverWeeks negative or not a number → DEFAULT_COVER_WEEKS, each with a warning.
 *
 * @returns `packs` a whole number ≥ 0 and `grams` = packs × packGrams ≥ shortfall (within 1 µg).
 */
export function orderQuantity(input: OrderQuantityInput): OrderQuantityResult {
  const steps: CalcStep[] = [];
  const warnings: string[] = [];
  const nonNegative = (value: number | undefined, what: string, fallback: number, unit: string): number => {
    if (value === undefined) return fallback;
    if (isNonNegative(value)) return value;
    warnings.push(`${what} ${String(value)} ${unit} is not a number ≥ 0: taken as ${fallback} ${unit}.`);
    return fallback;
  };
  const onHand = nonNegative(input.onHandGrams, "On hand", 0, "g");
  const onOrder = nonNegative(input.onOrderGrams, "On order", 0, "g");
  const reorderPointGrams = nonNegative(input.reorderPointGrams, "Reorder point", 0, "g");
  const gramsPerWeek = nonNegative(input.gramsPerWeek, "Demand", 0, "g/week");
  const coverWeeks = nonNegative(input.coverWeeks, "Cover", DEFAULT_COVER_WEEKS, "weeks");

  const coverGrams = coverWeeks * gramsPerWeek;
  const target = reorderPointGrams + coverGrams;
  const position = onHand + onOrder;
  steps.push({
    label: "Target after receipt (reorder point + cover)",
    value:
      `${formatNumber(reorderPointGrams, 2)} g + ${formatNumber(coverWeeks, 2)} weeks × ` +
      `${formatNumber(gramsPerWeek, 3)} g/week = ${formatNumber(target, 2)} g`,
  });
  steps.push({
    label: "Stock position (on hand + on order)",
    value: `${formatNumber(onHand, 2)} g + ${formatNumber(onOrder, 2)} g = ${formatNumber(position, 2)} g`,
  });

  const shortfall = target - position;
  if (!Number.isFinite(shortfall)) {
    steps.push({ label: "Shortfall", value: "too large to compute: no order sized" });
    warnings.push("The target or stock is too large to compute (check the units): no order sized.");
    return { packs: 0, grams: 0, steps, warnings };
  }
  if (shortfall <= GRAMS_EPSILON) {
    steps.push({
      label: "Shortfall",
      value: `${formatNumber(position, 2)} g is at or above the ${formatNumber(target, 2)} g target: no order`,
    });
    return { packs: 0, grams: 0, steps, warnings };
  }
  steps.push({
    label: "Shortfall",
    value: `${formatNumber(target, 2)} g − ${formatNumber(position, 2)} g = ${formatNumber(shortfall, 2)} g`,
  });

  const packGrams = input.packGrams;
  if (!isPositive(packGrams)) {
    steps.push({
      label: "Packs",
      value: `no order sized: the pack size ${String(packGrams)} g is not a positive mass`,
    });
    warnings.push(
      `The pack size must be a positive number of grams (got ${String(packGrams)}): set the pack's net content ` +
        `to order the ${formatNumber(shortfall, 2)} g shortfall.`,
    );
    return { packs: 0, grams: 0, steps, warnings };
  }
  const packs = Math.ceil((shortfall - GRAMS_EPSILON) / packGrams);
  const grams = packs * packGrams;
  if (!Number.isSafeInteger(packs) || !Number.isFinite(grams)) {
    steps.push({ label: "Packs", value: `no order sized: ${String(packGrams)} g packs would need too many to count` });
    warnings.push(`The pack size ${String(packGrams)} g is too small for this shortfall (check its unit): no order sized.`);
    return { packs: 0, grams: 0, steps, warnings };
  }
  steps.push({
    label: "Packs (whole packs, rounded up)",
    value:
      `⌈${formatNumber(shortfall, 2)} g ÷ ${formatNumber(packGrams, 2)} g⌉ = ${packs} ` +
      `pack${packs === 1 ? "" : "s"} = ${formatNumber(grams, 2)} g`,
  });
  return { packs, grams, steps, warnings };
}
