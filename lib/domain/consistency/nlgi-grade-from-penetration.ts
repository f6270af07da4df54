import { NLGI_PENETRATION_RANGES } from "./nlgi-penetration-ranges";
import type { NlgiFromPenetration } from "./types";

/**
 * Decides the NLGI consistency grade of a grease from its ASTM D217 worked penetration.
 *
 * @param workedPenetration worked penetration after 60 double strokes at 25 °C, in 0.1 mm.
 * @returns `{ nlgiGrade }` when the value lies inside a band, limits included (265 and 295 are both grade 2).
 *   A value in the gap between two bands is not forced into either: it gives `{ nlgiGrade: null, between }`
 *   with the two neighbours, softer first (300 → between "1" and "2"). Values are taken as real numbers, so
 *   295.5 is already in the gap; round to D217's whole units first if that is wanted. Above 475, below 85 or not
 *   a finite number → `{ nlgiGrade: null }` with no `between`.
 *   The half grades "1.5" and "2.5" have no published band and are never returned.
 */
export function nlgiGradeFromPenetration(workedPenetration: number): NlgiFromPenetration {
  if (!Number.isFinite(workedPenetration)) return { nlgiGrade: null };
  for (let i = 0; i < NLGI_PENETRATION_RANGES.length; i++) {
    const band = NLGI_PENETRATION_RANGES[i]!;
    if (workedPenetration > band.workedPenetrationMax) {
      // Softer than this band: either in the gap above it (below the previous, softer band) or out of range.
      const softer = NLGI_PENETRATION_RANGES[i - 1];
      return softer ? { nlgiGrade: null, between: [softer.nlgiGrade, band.nlgiGrade] } : { nlgiGrade: null };
    }
    if (workedPenetration >= band.workedPenetrationMin) return { nlgiGrade: band.nlgiGrade };
  }
  return { nlgiGrade: null };
}
