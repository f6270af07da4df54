/**
 * Adds whole calendar months to a date in UTC, keeping the time of day and clamping the day to the end of the
 * target month: 31 Jan + 1 month = 29 Feb in a leap year, 28 Feb otherwise; 29 Feb 2024 + 12 months = 28 Feb 2025.
 *
 * @param months a whole number (may be negative).
 * @returns a new Date; an invalid date gives an invalid Date.
 */
export function addMonthsUtc(date: Date, months: number): Date {
  const t = date.getTime();
  if (!Number.isFinite(t) || !Number.isInteger(months)) return new Date(Number.NaN);
  const year = date.getUTCFullYear();
  const targetMonth = date.getUTCMonth() + months;
  // Day 0 of the month after the target is the target month's last day.
  const lastDay = new Date(0);
  lastDay.setUTCFullYear(year, targetMonth + 1, 0);
  const day = Math.min(date.getUTCDate(), lastDay.getUTCDate());
  const result = new Date(t);
  result.setUTCFullYear(year, targetMonth, day);
  return result;
}
