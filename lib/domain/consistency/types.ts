import type { NlgiGrade } from "../catalogue";

/**
 * The NLGI grades that have a published worked-penetration band. The half grades "1.5" and "2.5" of the
 * catalogue vocabulary are trade usage with no band of their own.
 */
export type BandedNlgiGrade = Exclude<NlgiGrade, "1.5" | "2.5">;

/** One NLGI consistency band. Penetrations are ASTM D217 worked penetration (60 double strokes, 25 °C), in 0.1 mm. */
export interface NlgiPenetrationRange {
  nlgiGrade: BandedNlgiGrade;
  /** Lowest worked penetration in the grade (inclusive), 0.1 mm. */
  workedPenetrationMin: number;
  /** Highest worked penetration in the grade (inclusive), 0.1 mm. */
  workedPenetrationMax: number;
  description: string;
}

/**
 * The grade a worked penetration belongs to. `nlgiGrade` is null when the value is in no band; `between` then
 * names the two neighbouring grades (softer first, in the order of NLGI_GRADES) when the value lies in the gap
 * between them, and is absent when the value is outside the classification altogether.
 */
export interface NlgiFromPenetration {
  nlgiGrade: NlgiGrade | null;
  between?: [NlgiGrade, NlgiGrade];
}
