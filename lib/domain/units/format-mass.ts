import { gramsToOunces } from "./convert";
import { formatFixed, formatNumber } from "./format-number";
import type { UnitSystem } from "./types";

/**
 * Writes a grease mass given in grams for display in the chosen unit system.
 *
 * Rounding (our choice, common practice, no source), chosen so that a relubrication quantity of a few grams is
 * not rounded away and a gun stroke (about 1–3 g, domain.md §8) stays visible:
 * - metric: below 10 g to 0.1 g with a trailing ".0" dropped ("4.9 g", "5 g"); from 10 g on, whole grams
 *   ("400 g", "12000 g"). No change to kilograms.
 * - imperial: below 1 oz two decimals ("0.17 oz"); from 1 oz on, one decimal ("14.1 oz").
 *
 * @param grams mass in grams.
 * @returns e.g. "400 g" or "14.1 oz"; "—" (em dash) for a value that is not a finite number.
 */
export function formatMass(grams: number, system: UnitSystem): string {
  if (!Number.isFinite(grams)) return "—";
  if (system === "imperial") {
    const ounces = gramsToOunces(grams);
    return `${formatFixed(ounces, Math.abs(ounces) < 1 ? 2 : 1)} oz`;
  }
  return `${formatNumber(grams, Math.abs(grams) < 10 ? 1 : 0)} g`;
}
