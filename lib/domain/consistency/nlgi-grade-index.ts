import type { NlgiGrade } from "../catalogue";

/**
 * Ordinal position of each grade, one step per full grade: 000 → −2, 00 → −1, 0 → 0, 1 → 1 … 6 → 6. Successive
 * band midpoints are 45 units of penetration apart (460, 415, 370, 325 …), so the index is linear in the band
 * midpoint: index = (370 − midpoint) / 45. The half grades sit halfway between their neighbours (our reading;
 * they have no band).
 */
const NLGI_GRADE_INDEX: Readonly<Record<NlgiGrade, number>> = {
  "000": -2,
  "00": -1,
  "0": 0,
  "1": 1,
  "1.5": 1.5,
  "2": 2,
  "2.5": 2.5,
  "3": 3,
  "4": 4,
  "5": 5,
  "6": 6,
};

/**
 * Gives the ordinal step of an NLGI grade, for grade-distance arithmetic (how many grades apart two greases are).
 *
 * @returns −2 for "000", −1 for "00", 0 for "0" and the number itself for "1" to "6"; "1.5" → 1.5 and
 *   "2.5" → 2.5 (halfway between their neighbours). So |index(a) − index(b)| is the distance in full grades:
 *   "000" to "0" is 2 grades, "2" to "2.5" is half a grade.
 */
export function nlgiGradeIndex(grade: NlgiGrade): number {
  return NLGI_GRADE_INDEX[grade];
}
