import type { TrendWeeks } from "./types";

const MS_PER_DAY = 86_400_000;

/** Whole weeks before the current one that a trend shows: 12 (about a quarter). Our choice. */
export const TREND_WHOLE_WEEKS = 12;

/**
 * Decides which weeks a consumption trend covers: the week holding `now` and the `wholeWeeks` whole weeks
 * before it. Weeks run Monday 00:00 to Sunday 24:00 in UTC (ISO 8601 weeks start on Monday), so the same
 * instant falls in the same week on every server, whatever its time zone.
 *
 * A `wholeWeeks` that is negative or not a number is taken as 0 (the current week only); a fraction is
 * rounded down.
 *
 * @returns `wholeWeeks + 1` Mondays, oldest first, with the half-open range [from, to) they span;
 *   null when `now` is not a valid date.
 */
export function trendWeeks(now: Date, wholeWeeks: number = TREND_WHOLE_WEEKS): TrendWeeks | null {
  const t = now.getTime();
  if (!Number.isFinite(t)) return null;
  const back = Number.isFinite(wholeWeeks) && wholeWeeks > 0 ? Math.floor(wholeWeeks) : 0;
  const daysSinceMonday = (now.getUTCDay() + 6) % 7;
  const monday = Date.UTC(now.getUTCFullYear(), now.getUTCMonth(), now.getUTCDate() - daysSinceMonday);
  const weekStarts: string[] = [];
  for (let i = back; i >= 0; i--)
    weekStarts.push(new Date(monday - i * 7 * MS_PER_DAY).toISOString().slice(0, 10));
  return {
    weekStarts,
    from: new Date(monday - back * 7 * MS_PER_DAY),
    to: new Date(monday + 7 * MS_PER_DAY),
  };
}
