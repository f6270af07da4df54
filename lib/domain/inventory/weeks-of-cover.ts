import { gramsOrZero, isPositive } from "./quantities";

/**
 * Decides how many weeks the stock on hand lasts at the forecast demand: onHandGrams ÷ gramsPerWeek.
 *
 * @returns weeks, not rounded; null when there is no demand (gramsPerWeek zero, negative or not a number: the stock
 *   never runs out, even an empty shelf, and also when the division overflows); 0 when nothing is on hand (zero, negative or not a number) and there is
 *   demand. Never NaN or negative.
 */
export function weeksOfCover(onHandGrams: number, gramsPerWeek: number): number | null {
  if (!isPositive(gramsPerWeek)) return null;
  const weeks = gramsOrZero(onHandGrams) / gramsPerWeek;
  // A demand so small that the division overflows (1e-320 g/week) is no demand.
  return Number.isFinite(weeks) ? weeks : null;
}
