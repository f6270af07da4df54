import type { NextDueInput } from "./types";

const MS_PER_HOUR = 3_600_000;

/**
 * Decides the calendar time at which a lube point is next due, from its interval in operating hours.
 *
 * The machine runs `runningHoursPerDay` hours a day, so the interval takes intervalHours / runningHoursPerDay
 * calendar days: due = lastServicedAt + (intervalHours / runningHoursPerDay) × 24 h. The days are exact 24-hour
 * days (UTC arithmetic; a daylight-saving change moves the local clock time by an hour).
 *
 * Guards, all in the safe direction (the point comes due sooner, never later):
 * - runningHoursPerDay above 24 is taken as 24; zero, negative or not a number is also taken as 24 (a machine
 *   whose running time is unknown is assumed to run all day);
 * - an intervalHours that is not a positive number gives lastServicedAt itself (due at once).
 *
 * @returns a new Date; an invalid lastServicedAt gives an invalid Date.
 */
export function nextDueAt(input: NextDueInput): Date {
  const { lastServicedAt, intervalHours } = input;
  const perDay = input.runningHoursPerDay;
  const hoursPerDay = Number.isFinite(perDay) && perDay > 0 ? Math.min(perDay, 24) : 24;
  const start = lastServicedAt.getTime();
  if (!Number.isFinite(intervalHours) || intervalHours <= 0) return new Date(start);
  const calendarHours = (intervalHours / hoursPerDay) * 24;
  return new Date(start + Math.round(calendarHours * MS_PER_HOUR));
}
