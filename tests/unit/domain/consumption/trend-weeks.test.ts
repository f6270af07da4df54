import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { TREND_WHOLE_WEEKS, trendWeeks } from "@/lib/domain/consumption";

// Weekdays checked with GNU `date -u -d <day> +%A`; ISO 8601 weeks start on Monday.
describe("trendWeeks (Monday-to-Sunday weeks in UTC)", () => {
  it.each([
    {
      now: "2026-03-11T10:00:00Z",
      first: "2025-12-15",
      last: "2026-03-09",
      source: "a Wednesday; 9 Mar 2026 is the Monday before (GNU date)",
    },
    {
      now: "2026-03-09T00:00:00Z",
      first: "2025-12-15",
      last: "2026-03-09",
      source: "the first instant of a Monday starts its own week",
    },
    {
      now: "2026-03-15T23:59:59.999Z",
      first: "2025-12-15",
      last: "2026-03-09",
      source: "the last millisecond of that Sunday is still the same week",
    },
    {
      now: "2026-03-16T00:00:00Z",
      first: "2025-12-22",
      last: "2026-03-16",
      source: "the next Monday moves everything by one week",
    },
    {
      now: "2026-01-01T12:00:00Z",
      first: "2025-10-06",
      last: "2025-12-29",
      source: "1 Jan 2026 is a Thursday; its week began on Monday 29 Dec 2025 (GNU date)",
    },
    {
      now: "2024-03-03T08:00:00Z",
      first: "2023-12-04",
      last: "2024-02-26",
      source: "a Sunday in a leap year; 26 Feb 2024 is a Monday (GNU date)",
    },
    {
      now: "2026-03-15T23:30:00-02:00",
      first: "2025-12-22",
      last: "2026-03-16",
      source: "hand-worked: Sunday evening at UTC−2 is Monday 01:30 UTC",
    },
  ])("$now → $first … $last ($source)", ({ now, first, last }) => {
    const weeks = trendWeeks(new Date(now))!;
    expect(weeks.weekStarts).toHaveLength(TREND_WHOLE_WEEKS + 1);
    expect(weeks.weekStarts[0]).toBe(first);
    expect(weeks.weekStarts.at(-1)).toBe(last);
    expect(weeks.from.toISOString()).toBe(`${first}T00:00:00.000Z`);
    expect(weeks.to.getTime() - new Date(`${last}T00:00:00Z`).getTime()).toBe(7 * 86_400_000);
  });

  it("holds `now` in the range [from, to) and lists consecutive Mondays (property)", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: Date.UTC(1971, 0, 1), max: Date.UTC(2090, 0, 1) }),
        fc.integer({ min: 0, max: 60 }),
        (t, whole) => {
          const weeks = trendWeeks(new Date(t), whole)!;
          expect(weeks.weekStarts).toHaveLength(whole + 1);
          expect(weeks.from.getTime()).toBeLessThanOrEqual(t);
          expect(weeks.to.getTime()).toBeGreaterThan(t);
          expect(weeks.to.getTime() - weeks.from.getTime()).toBe((whole + 1) * 7 * 86_400_000);
          for (const [i, day] of weeks.weekStarts.entries()) {
            const monday = new Date(`${day}T00:00:00Z`);
            expect(monday.getUTCDay()).toBe(1);
            expect(monday.getTime()).toBe(weeks.from.getTime() + i * 7 * 86_400_000);
          }
        },
      ),
    );
  });

  it.each([
    { whole: 0, length: 1, source: "the current week only" },
    { whole: -3, length: 1, source: "negative: taken as 0" },
    { whole: Number.NaN, length: 1, source: "not a number: taken as 0" },
    { whole: 2.7, length: 3, source: "a fraction is rounded down" },
  ])("whole weeks $whole → $length week(s) ($source)", ({ whole, length }) => {
    expect(trendWeeks(new Date("2026-03-11T10:00:00Z"), whole)!.weekStarts).toHaveLength(length);
  });

  it("gives null for an invalid date, not a made-up week", () => {
    expect(trendWeeks(new Date("not a date"))).toBeNull();
  });
});
