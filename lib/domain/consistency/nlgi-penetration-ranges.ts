import type { NlgiPenetrationRange } from "./types";

/**
 * NLGI consistency grades by ASTM D217 worked penetration (60 double strokes, 25 °C), in 0.1 mm, softest first.
 *
 * Source: ASTM D217, scope Note 1, as shown on realservices.com/Services/Test-Std/d217.htm; the same ranges on
 * thelubricantstore.com and engineersedge.com; descriptions from the Wikipedia article "NLGI consistency number".
 * As digested in the project's reference/domain.md §3. The bands are 30 units wide with 14-unit gaps between them
 * (e.g. 296–309 between grades 1 and 2). D217's penetration procedures cover 85–475 only; some sources list a
 * grade 7, which D217 does not, so it is left out.
 */
export const NLGI_PENETRATION_RANGES: readonly NlgiPenetrationRange[] = [
  { nlgiGrade: "000", workedPenetrationMin: 445, workedPenetrationMax: 475, description: "fluid" },
  { nlgiGrade: "00", workedPenetrationMin: 400, workedPenetrationMax: 430, description: "semi-fluid" },
  { nlgiGrade: "0", workedPenetrationMin: 355, workedPenetrationMax: 385, description: "very soft" },
  { nlgiGrade: "1", workedPenetrationMin: 310, workedPenetrationMax: 340, description: "soft" },
  { nlgiGrade: "2", workedPenetrationMin: 265, workedPenetrationMax: 295, description: "normal grease" },
  { nlgiGrade: "3", workedPenetrationMin: 220, workedPenetrationMax: 250, description: "firm" },
  { nlgiGrade: "4", workedPenetrationMin: 175, workedPenetrationMax: 205, description: "very firm" },
  { nlgiGrade: "5", workedPenetrationMin: 130, workedPenetrationMax: 160, description: "hard" },
  { nlgiGrade: "6", workedPenetrationMin: 85, workedPenetrationMax: 115, description: "very hard" },
];
