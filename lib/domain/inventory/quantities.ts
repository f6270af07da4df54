// Small guards shared by the inventory functions. Not part of the public API.

/**
 * Grams below which a remainder is treated as nothing: 1 µg, far below any scale in a store. Keeps
 * floating-point noise (16.8 × 3 = 50.400000000000006) from adding a pack or flagging a lot. Our choice.
 */
export const GRAMS_EPSILON = 1e-6;

export const MS_PER_DAY = 86_400_000;
export const MS_PER_WEEK = 7 * MS_PER_DAY;

/** True for a finite number > 0. */
export function isPositive(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x) && x > 0;
}

/** True for a finite number ≥ 0. */
export function isNonNegative(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x) && x >= 0;
}

/** A finite non-negative number, or 0 for anything else (negative, NaN, ±∞, not a number). */
export function gramsOrZero(x: unknown): number {
  return isNonNegative(x) ? x : 0;
}

/** True for a Date holding a real instant. */
export function isValidDate(d: unknown): d is Date {
  return d instanceof Date && Number.isFinite(d.getTime());
}

/** "2025-01-31" for a valid date (UTC), "an invalid date" otherwise. */
export function isoDay(d: Date): string {
  return isValidDate(d) ? d.toISOString().slice(0, 10) : "an invalid date";
}
