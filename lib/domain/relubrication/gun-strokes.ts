import { formatNumber } from "../units/format-number";
import type { CalcStep, GunStrokesResult } from "./types";

/**
 * Plausible output of one stroke of a manual grease gun, grams. Common practice, no source: the bounds bracket
 * the figures in domain.md §8 — 1–3 g (Machinery Lubrication "Grease gun" tip, ML #206), 1–1.5 g (a practitioner
 * article), a pistol-grip gun's 0.86 cm³ (≈ 0.8 g at 0.9–1.0 g/cm³, density from memory) and a lever gun's
 * 2.5–2.7 cm³. Outside them the gun's calibration is probably wrong (a volume typed as grams, ounces as grams).
 */
export const PLAUSIBLE_GRAMS_PER_STROKE = { min: 0.5, max: 5 } as const;

/**
 * When the whole strokes deliver more than this share above or below the required quantity, a warning says so.
 * Common practice, no source.
 */
const DELIVERY_TOLERANCE = 0.25;

/**
 * Decides how many strokes of a calibrated grease gun deliver a quantity of grease.
 *
 * strokes = quantityGrams / gramsPerStroke, rounded to the nearest whole stroke (halves up) and at least 1, so
 * that a point needing less than half a stroke still gets one. Nearest rounding is the common practice named in
 * domain.md §8; rounding down would be safer against over-greasing but can leave a point with none. The steps
 * show the grams the whole strokes actually deliver.
 *
 * @param quantityGrams grease needed, g (e.g. from replenishmentQuantity).
 * @param gramsPerStroke the gun's calibrated output, g per stroke.
 * @returns `strokes` ≥ 1, or null with a warning when either input is not a positive number. Warns when the
 *   gun's output is outside PLAUSIBLE_GRAMS_PER_STROKE (0.5–5 g) and when the whole strokes deliver more than
 *   25 % more or less than required.
 */
export function gunStrokes(quantityGrams: number, gramsPerStroke: number): GunStrokesResult {
  const steps: CalcStep[] = [];
  const warnings: string[] = [];
  const valid = (x: number) => typeof x === "number" && Number.isFinite(x) && x > 0;
  if (!valid(quantityGrams) || !valid(gramsPerStroke)) {
    warnings.push(
      `The quantity and the gun's output per stroke must be positive numbers of grams (got ${String(quantityGrams)} g ` +
        `and ${String(gramsPerStroke)} g per stroke).`,
    );
    return { strokes: null, steps, warnings };
  }
  if (gramsPerStroke < PLAUSIBLE_GRAMS_PER_STROKE.min || gramsPerStroke > PLAUSIBLE_GRAMS_PER_STROKE.max) {
    warnings.push(
      `${formatNumber(gramsPerStroke, 3)} g per stroke is outside the usual ${PLAUSIBLE_GRAMS_PER_STROKE.min}–` +
        `${PLAUSIBLE_GRAMS_PER_STROKE.max} g of a manual grease gun: check the gun's calibration (dispense a counted ` +
        "number of strokes onto a scale and divide).",
    );
  }
  const exact = quantityGrams / gramsPerStroke;
  const strokes = Math.max(1, Math.round(exact));
  const delivered = strokes * gramsPerStroke;
  steps.push({
    label: "Strokes needed",
    value: `${formatNumber(quantityGrams, 2)} g ÷ ${formatNumber(gramsPerStroke, 3)} g per stroke = ${formatNumber(exact, 2)}`,
  });
  steps.push({
    label: "Rounded (nearest whole stroke, at least 1)",
    value: `${strokes} stroke${strokes === 1 ? "" : "s"} × ${formatNumber(gramsPerStroke, 3)} g = ${formatNumber(delivered, 2)} g`,
  });
  const deviation = (delivered - quantityGrams) / quantityGrams;
  if (Math.abs(deviation) > DELIVERY_TOLERANCE) {
    warnings.push(
      `${strokes} stroke${strokes === 1 ? "" : "s"} deliver ${formatNumber(delivered, 2)} g for ` +
        `${formatNumber(quantityGrams, 2)} g needed (${deviation > 0 ? "+" : ""}${formatNumber(deviation * 100, 0)} %)` +
        (deviation > 0 ? ": risk of over-greasing; a gun with a smaller stroke would be closer." : "."),
    );
  }
  return { strokes, steps, warnings };
}
