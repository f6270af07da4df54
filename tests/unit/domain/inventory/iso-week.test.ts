import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { isoWeek } from "@/lib/domain/inventory";

// Expected weeks: the ISO 8601 week-date examples (as listed on Wikipedia "ISO week date", from memory), each
// checked with GNU `date -u -d <day> +%G-W%V`.
const ISO = "ISO 8601 week-date example, checked with GNU date +%G-W%V";

describe("isoWeek (ISO 8601 weeks, in UTC)", () => {
  it.each([
    { at: "2026-01-01T00:00:00Z", label: "2026-W01", source: `${ISO}: 1 Jan 2026 is a Thursday` },
    { at: "2027-01-01T00:00:00Z", label: "2026-W53", source: `${ISO}: a Friday, belongs to the year before` },
    { at: "2021-01-03T00:00:00Z", label: "2020-W53", source: `${ISO}: a Sunday, belongs to the year before` },
    { at: "2021-01-04T00:00:00Z", label: "2021-W01", source: `${ISO}: the Monday after` },
    { at: "2005-01-01T00:00:00Z", label: "2004-W53", source: ISO },
    { at: "2005-01-02T00:00:00Z", label: "2004-W53", source: ISO },
    { at: "2005-12-31T00:00:00Z", label: "2005-W52", source: ISO },
    { at: "2007-01-01T00:00:00Z", label: "2007-W01", source: `${ISO}: 1 Jan on a Monday` },
    { at: "2007-12-30T00:00:00Z", label: "2007-W52", source: ISO },
    { at: "2007-12-31T00:00:00Z", label: "2008-W01", source: `${ISO}: 31 Dec in the next year's week 1` },
    { at: "2008-12-28T00:00:00Z", label: "2008-W52", source: ISO },
    { at: "2008-12-29T00:00:00Z", label: "2009-W01", source: ISO },
    { at: "2009-12-31T00:00:00Z", label: "2009-W53", source: ISO },
    { at: "2010-01-03T00:00:00Z", label: "2009-W53", source: ISO },
    { at: "2010-01-04T00:00:00Z", label: "2010-W01", source: ISO },
    { at: "2024-12-30T00:00:00Z", label: "2025-W01", source: "checked with GNU date +%G-W%V" },
    { at: "2026-03-09T00:00:00Z", label: "2026-W11", source: "checked with GNU date +%G-W%V: a Monday" },
    {
      at: "2026-03-15T23:59:59.999Z",
      label: "2026-W11",
      source: "the last millisecond of that week's Sunday, UTC",
    },
    {
      at: "2026-03-16T00:00:00Z",
      label: "2026-W12",
      source: "checked with GNU date +%G-W%V: the next Monday",
    },
    {
      at: "2026-03-15T23:30:00-02:00",
      label: "2026-W12",
      source: "hand-worked: Sunday evening at UTC−2 is Monday 01:30 UTC",
    },
  ])("$at → $label ($source)", ({ at, label }) => {
    expect(isoWeek(new Date(at))?.label).toBe(label);
  });

  it("gives the year and week as numbers too", () => {
    expect(isoWeek(new Date("2027-01-01T12:00:00Z"))).toEqual({ isoYear: 2026, week: 53, label: "2026-W53" });
  });

  it("gives null for an invalid date, not a made-up week", () => {
    expect(isoWeek(new Date("not a date"))).toBeNull();
  });

  it("keeps Monday to Sunday together and moves on by one week every 7 days (property)", () => {
    const ordinal = (w: { isoYear: number; week: number }) => w.isoYear * 100 + w.week;
    fc.assert(
      fc.property(fc.integer({ min: Date.UTC(1971, 0, 1), max: Date.UTC(2090, 0, 1) }), (t) => {
        const at = new Date(t);
        const week = isoWeek(at)!;
        expect(week.week).toBeGreaterThanOrEqual(1);
        expect(week.week).toBeLessThanOrEqual(53);
        const weekday = (at.getUTCDay() + 6) % 7;
        const monday = new Date(Date.UTC(at.getUTCFullYear(), at.getUTCMonth(), at.getUTCDate() - weekday));
        const sunday = new Date(monday.getTime() + 6 * 86_400_000 + 86_399_999);
        expect(isoWeek(monday)).toEqual(week);
        expect(isoWeek(sunday)).toEqual(week);
        const next = isoWeek(new Date(t + 7 * 86_400_000))!;
        expect(ordinal(next)).toBe(
          next.isoYear === week.isoYear ? ordinal(week) + 1 : (week.isoYear + 1) * 100 + 1,
        );
        // 4 January is always in week 1 (ISO 8601: week 1 holds the year's first Thursday).
        expect(isoWeek(new Date(Date.UTC(at.getUTCFullYear(), 0, 4)))?.week).toBe(1);
      }),
    );
  });
});
