import type { NlgiGrade } from "../catalogue";
import { nlgiGradeIndex } from "../consistency";
import { formatNumber } from "./names";
import type { Reason } from "./types";

const DILUTION_SOURCE =
  "Our setting (common practice, no source); ASTM D6185-24 §5.1 notes that mixing greases whose base-oil " +
  "viscosities differ a lot dilutes them";

function isViscosity(value: number | null | undefined): value is number {
  return typeof value === "number" && Number.isFinite(value) && value > 0;
}

/**
 * Decides whether the two base-oil viscosities are far enough apart that mixing dilutes one with the other.
 *
 * @param viscosity40A, viscosity40B kinematic viscosity at 40 °C, mm²/s.
 * @param ratioLimit the largest higher/lower ratio still counted compatible (settings.viscosityRatioLimit).
 * @returns null when either viscosity is missing or not a positive finite number (nothing to judge);
 *   "borderline" when higher/lower > ratioLimit; "compatible" otherwise (a ratio exactly at the limit passes).
 */
export function viscosityReason(
  viscosity40A: number | null | undefined,
  viscosity40B: number | null | undefined,
  ratioLimit: number,
): Reason | null {
  if (!isViscosity(viscosity40A) || !isViscosity(viscosity40B)) return null;
  const ratio = Math.max(viscosity40A, viscosity40B) / Math.min(viscosity40A, viscosity40B);
  const values = `${formatNumber(viscosity40A)} and ${formatNumber(viscosity40B)} mm²/s at 40 °C, a ratio of ${formatNumber(ratio)} (limit ${formatNumber(ratioLimit)})`;
  return ratio > ratioLimit
    ? {
        kind: "viscosity",
        verdict: "borderline",
        message: `Base-oil viscosities differ a lot: ${values}. Mixing dilutes the thicker oil and may cost film thickness.`,
        source: DILUTION_SOURCE,
      }
    : {
        kind: "viscosity",
        verdict: "compatible",
        message: `Base-oil viscosities are close: ${values}.`,
        source: DILUTION_SOURCE,
      };
}

/**
 * Decides whether the two NLGI grades are too far apart to mix without changing the consistency at the point.
 *
 * @param stepLimit the largest grade distance still counted compatible (settings.nlgiStepLimit), in full grades
 *   as given by nlgiGradeIndex (half grades count half).
 * @returns null when either grade is missing; "borderline" when the distance > stepLimit; "compatible" otherwise.
 */
export function consistencyReason(
  gradeA: NlgiGrade | null | undefined,
  gradeB: NlgiGrade | null | undefined,
  stepLimit: number,
): Reason | null {
  if (!gradeA || !gradeB) return null;
  const steps = Math.abs(nlgiGradeIndex(gradeA) - nlgiGradeIndex(gradeB));
  const apart = `NLGI ${gradeA} and NLGI ${gradeB} are ${formatNumber(steps)} grade ${steps === 1 ? "step" : "steps"} apart (limit ${formatNumber(stepLimit)})`;
  const source = "Our setting (common practice, no source)";
  return steps > stepLimit
    ? {
        kind: "consistency",
        verdict: "borderline",
        message: `${apart}. The mix will be softer or firmer than the point is meant to have.`,
        source,
      }
    : { kind: "consistency", verdict: "compatible", message: `${apart}.`, source };
}
