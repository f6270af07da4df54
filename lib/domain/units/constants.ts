/**
 * Exact conversion constants. Both are definitions, not measurements: the international inch is 25.4 mm exactly
 * and the avoirdupois ounce is 28.349523125 g exactly (1 lb = 0.45359237 kg, 1 oz = 1/16 lb), per the 1959
 * international yard and pound agreement (NIST Handbook 44, Appendix C, "General tables of units of
 * measurement").
 */
export const MM_PER_INCH = 25.4;

/** Grams per avoirdupois ounce, exact (0.45359237 kg / 16). See MM_PER_INCH for the source. */
export const GRAMS_PER_OUNCE = 28.349523125;
