import type { FoodGrade } from "../catalogue";
import type { GreaseProfile, Reason } from "./types";

const H1_SOURCE =
  "NSF H1 category (incidental food contact, at most 10 mg/kg in the food); charts-verified.md §5";
const FLUSH_SOURCE =
  "A lubricant maker's food-grade FAQ: flush the equipment when switching to a food-grade lubricant (charts-verified.md §5)";

function gradeInWords(grade: FoodGrade | null | undefined): string {
  switch (grade) {
    case "H1":
      return "H1";
    case "H2":
    case "H3":
      return `rated ${grade}, not H1`;
    case "none":
      return "not food grade";
    default:
      return "of unknown food-grade status";
  }
}

/**
 * Decides the food-grade gate at a point that requires H1. This is a regulatory gate on top of the mixing checks;
 * evidence never overrides it, and it applies to the same product too.
 *
 * Only what goes INTO the point is blocked: a candidate that is not H1 (a missing grade counts as not H1) gives an
 * "incompatible" reason. A non-H1 grease already in the bearing gives a "borderline" reason: the point must be
 * flushed when switching to food grade. The check is therefore deliberately not symmetric in its two arguments.
 *
 * @returns no reasons when the point does not require food grade, or when both greases are H1.
 */
export function foodGradeReasons(
  inBearing: GreaseProfile,
  candidate: GreaseProfile,
  foodGradeRequired: boolean,
): Reason[] {
  if (!foodGradeRequired) return [];
  const reasons: Reason[] = [];
  if (candidate.foodGrade !== "H1") {
    reasons.push({
      kind: "food_grade",
      verdict: "incompatible",
      message: `This point requires an H1 (incidental food contact) grease; ${candidate.name ?? "the grease to be added"} is ${gradeInWords(candidate.foodGrade)}.`,
      source: H1_SOURCE,
    });
  }
  if (inBearing.foodGrade !== "H1") {
    reasons.push({
      kind: "food_grade",
      verdict: "borderline",
      message: `This food-grade point holds ${inBearing.name ?? "a grease"}, which is ${gradeInWords(inBearing.foodGrade)}; flush it out before continuing with an H1 grease.`,
      source: FLUSH_SOURCE,
    });
  }
  return reasons;
}
