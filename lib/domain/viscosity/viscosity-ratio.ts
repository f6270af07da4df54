import { formatNumber } from "../units/format-number";
import type { CalcStep, ViscosityRatioInput, ViscosityRatioResult } from "./types";

/**
 * Decides the viscosity ratio κ = ν/ν1 of a lubricated rolling bearing and what it means.
 *
 * Guidance bands (skf.com "Lubrication conditions – the viscosity ratio κ", domain.md §7.2): below 0.1 the load is
 * carried by asperity contact; below 0.4 an oil needs EP additives; below 1 the film is not sufficient and metal
 * contact is possible (EP/AW grease advised); 1–4 is the usual design range; above 4 there is no further benefit
 * and the extra friction heats the lubricant.
 *
 * @param input ν, the operating viscosity (for grease the base oil's, at the operating temperature), and ν1, both
 *   mm²/s.
 * @returns `kappa` (not rounded) with one warning for κ < 1 (worded by band) or κ > 4, none from 1 to 4 inclusive;
 *   null with a warning when either viscosity is not a positive number.
 */
export function viscosityRatio(input: ViscosityRatioInput): ViscosityRatioResult {
  const steps: CalcStep[] = [];
  const warnings: string[] = [];
  const { viscosity: v, ratedViscosity: v1 } = input;
  const valid = (x: number) => typeof x === "number" && Number.isFinite(x) && x > 0;
  if (!valid(v) || !valid(v1)) {
    warnings.push(
      `Both viscosities must be positive numbers of mm²/s (got ν = ${String(v)}, ν1 = ${String(v1)}).`,
    );
    return { kappa: null, steps, warnings };
  }
  const kappa = v / v1;
  steps.push({
    label: "κ = ν / ν1",
    value: `${formatNumber(v, 3)} / ${formatNumber(v1, 3)} = ${formatNumber(kappa, 3)}`,
  });
  if (kappa < 0.1) {
    warnings.push(
      `κ = ${formatNumber(kappa, 2)} is below 0.1: the load is carried by asperity contact (boundary lubrication). ` +
        "Use a lubricant with EP/AW additives or a much higher base-oil viscosity, and ask the bearing maker.",
    );
  } else if (kappa < 0.4) {
    warnings.push(
      `κ = ${formatNumber(kappa, 2)} is below 0.4: an oil would need EP additives; use a grease with EP/AW ` +
        "additives or a higher base-oil viscosity.",
    );
  } else if (kappa < 1) {
    warnings.push(
      `κ = ${formatNumber(kappa, 2)} is below 1: the lubricant film cannot fully separate the surfaces and metal ` +
        "contact is possible. Consider a grease with EP/AW additives or a higher base-oil viscosity.",
    );
  } else if (kappa > 4) {
    warnings.push(
      `κ = ${formatNumber(kappa, 2)} is above 4: a thicker oil brings no further benefit and its extra friction heats ` +
        "the bearing; a lower base-oil viscosity would do.",
    );
  }
  return { kappa, steps, warnings };
}
