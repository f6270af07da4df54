import { MS_PER_DAY, MS_PER_WEEK, isValidDate } from "./quantities";

/** An ISO 8601 week: weeks start on Monday and week 1 is the week holding the year's first Thursday. */
export interface IsoWeek {
  /** The week-numbering year, which differs from the calendar year around 1 January (2027-01-01 is in 2026-W53). */
  isoYear: number;
  /** 1–53. */
  week: number;
  /** "2026-W01": zero-padded, sorts as text. */
  label: string;
}

/**
 * Decides the ISO 8601 week an instant falls in, reckoned in UTC (Monday 00:00 UTC starts a week).
 *
 * The week belongs to the year of its Thursday, so 1–3 January can fall in the last week of the previous year and
 * 29–31 December in week 1 of the next.
 *
 * @returns the week, or null for an invalid date.
 */
export function isoWeek(date: Date): IsoWeek | null {
  if (!isValidDate(date)) return null;
  const dayStartMs = Math.floor(date.getTime() / MS_PER_DAY) * MS_PER_DAY;
  // Monday = 0 … Sunday = 6.
  const weekday = (new Date(dayStartMs).getUTCDay() + 6) % 7;
  const thursday = new Date(dayStartMs + (3 - weekday) * MS_PER_DAY);
  const isoYear = thursday.getUTCFullYear();
  const week = 1 + Math.floor((thursday.getTime() - Date.UTC(isoYear, 0, 1)) / MS_PER_WEEK);
  return { isoYear, week, label: `${String(isoYear).padStart(4, "0")}-W${String(week).padStart(2, "0")}` };
}
