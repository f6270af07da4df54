import type { NlgiGrade } from "../catalogue";
import { NLGI_PENETRATION_RANGES } from "./nlgi-penetration-ranges";
import type { BandedNlgiGrade } from "./types";

/**
 * The half grades span from the harder neighbour's lowest to the softer neighbour's highest penetration
 * ("1.5" → 265–340, "2.5" → 220–295). Our reading, common practice, no source: the half grades are trade usage for
 * greases made between two bands, so the form only warns when a value lies clearly in some other grade.
 */
const HALF_GRADE_NEIGHBOURS: Readonly<Record<"1.5" | "2.5", readonly [BandedNlgiGrade, BandedNlgiGrade]>> = {
  "1.5": ["1", "2"],
  "2.5": ["2", "3"],
};

function band(grade: BandedNlgiGrade) {
  return NLGI_PENETRATION_RANGES.find((r) => r.nlgiGrade === grade)!;
}

/**
 * Decides whether a worked penetration agrees with a declared NLGI grade (the catalogue form warns when it does
 * not).
 *
 * @param grade the declared grade.
 * @param workedPenetration ASTM D217 worked penetration (60 double strokes, 25 °C), in 0.1 mm.
 * @returns for a full grade, `true` when the value lies inside its D217 band, limits included; a value in a gap
 *   matches no full grade. For "1.5" and "2.5", `true` from the harder neighbour's minimum to the softer
 *   neighbour's maximum (see HALF_GRADE_NEIGHBOURS). `false` for a value that is not a finite number.
 */
export function penetrationMatchesGrade(grade: NlgiGrade, workedPenetration: number): boolean {
  if (!Number.isFinite(workedPenetration)) return false;
  if (grade === "1.5" || grade === "2.5") {
    const [softer, harder] = HALF_GRADE_NEIGHBOURS[grade];
    return (
      workedPenetration >= band(harder).workedPenetrationMin &&
      workedPenetration <= band(softer).workedPenetrationMax
    );
  }
  const b = band(grade);
  return workedPenetration >= b.workedPenetrationMin && workedPenetration <= b.workedPenetrationMax;
}
