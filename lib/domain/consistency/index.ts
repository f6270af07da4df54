export type { BandedNlgiGrade, NlgiPenetrationRange, NlgiFromPenetration } from "./types";
export { NLGI_PENETRATION_RANGES } from "./nlgi-penetration-ranges";
export { nlgiGradeFromPenetration } from "./nlgi-grade-from-penetration";
export { nlgiGradeIndex } from "./nlgi-grade-index";
export { penetrationMatchesGrade } from "./penetration-matches-grade";
