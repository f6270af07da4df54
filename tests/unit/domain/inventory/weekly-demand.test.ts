import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  DEFAULT_FORECAST_WEEKS,
  weeklyDemand,
  type DemandPoint,
  type PlannedPurge,
  type WeeklyDemandOptions,
} from "@/lib/domain/inventory";

const FROM = new Date("2025-01-06T00:00:00Z");
const point = (quantityGrams: number, intervalHours: number, runningHoursPerDay: number, greaseId = 1): DemandPoint => ({
  greaseId,
  quantityGrams,
  intervalHours,
  runningHoursPerDay,
});
const times = (n: number, p: DemandPoint): DemandPoint[] => Array.from({ length: n }, () => ({ ...p }));

describe("weeklyDemand — relubrication (Σ quantity ÷ interval × running hours per week)", () => {
  it.each([
    {
      name: "10 points of 20 g every 2000 h at 24 h/day",
      // hand-worked: 10 × 20 g ÷ 2000 h × (24 × 7 = 168 h/week) = 16.8 g/week
      points: times(10, point(20, 2000, 24)),
      gramsPerWeek: 16.8,
      warnings: 0,
    },
    {
      name: "one point of 5 g every 500 h at 8 h/day",
      // hand-worked: 5 ÷ 500 × 56 = 0.56 g/week
      points: [point(5, 500, 8)],
      gramsPerWeek: 0.56,
      warnings: 0,
    },
    {
      name: "two kinds of point on one grease",
      // hand-worked: 10 ÷ 1000 × 168 = 1.68; 4 ÷ 200 × 56 = 1.12; 1.68 + 1.12 = 2.8 g/week
      points: [point(10, 1000, 24), point(4, 200, 8)],
      gramsPerWeek: 2.8,
      warnings: 0,
    },
    {
      name: "a sealed-for-life point takes nothing",
      // hand-worked: only the first point counts, 1.68 g/week
      points: [point(10, 1000, 24), { ...point(100, 100, 24), sealedForLife: true }],
      gramsPerWeek: 1.68,
      warnings: 0,
    },
    {
      name: "interval 0 is skipped, not divided by",
      // hand-worked: 1.68 + nothing
      points: [point(10, 1000, 24), point(10, 0, 24)],
      gramsPerWeek: 1.68,
      warnings: 1,
    },
    {
      name: "negative and missing intervals are skipped",
      points: [point(10, -1000, 24), point(10, Number.NaN, 24)],
      gramsPerWeek: 0,
      warnings: 1,
    },
    {
      name: "negative and missing quantities are skipped",
      points: [point(-10, 1000, 24), point(Number.NaN, 1000, 24), point(10, 1000, 24)],
      gramsPerWeek: 1.68,
      warnings: 1,
    },
    {
      name: "an interval so small that the demand overflows is skipped, not ∞",
      // hand-worked: 10 × 168 ÷ 5e-324 = ∞ in binary → not counted; only the 1.68 g/week point remains
      points: [point(10, 1000, 24), point(10, 5e-324, 24)],
      gramsPerWeek: 1.68,
      warnings: 1,
    },
    {
      name: "more than 24 running hours a day are taken as 24",
      // hand-worked: 10 ÷ 1000 × 168 = 1.68 (30 h/day would give 2.1)
      points: [point(10, 1000, 30)],
      gramsPerWeek: 1.68,
      warnings: 1,
    },
    {
      name: "0 running hours a day are taken as 24, as nextDueAt does",
      // hand-worked: 10 ÷ 1000 × 168 = 1.68
      points: [point(10, 1000, 0)],
      gramsPerWeek: 1.68,
      warnings: 1,
    },
  ])("$name → $gramsPerWeek g/week (hand-worked)", ({ points, gramsPerWeek, warnings }) => {
    const demand = weeklyDemand(points).get(1);
    expect(demand?.gramsPerWeek).toBeCloseTo(gramsPerWeek, 9);
    expect(demand?.warnings).toHaveLength(warnings);
  });

  it("keeps greases apart, in order of first mention", () => {
    // hand-worked: grease 7: 20 ÷ 2000 × 168 = 1.68; grease 3: 2 × 5 ÷ 500 × 56 = 1.12
    const demand = weeklyDemand([point(20, 2000, 24, 7), point(5, 500, 8, 3), point(5, 500, 8, 3)]);
    expect([...demand.keys()]).toEqual([7, 3]);
    expect(demand.get(7)?.gramsPerWeek).toBeCloseTo(1.68, 9);
    expect(demand.get(3)?.gramsPerWeek).toBeCloseTo(1.12, 9);
  });

  it("a grease whose points are all sealed appears with 0 g/week and says why", () => {
    const demand = weeklyDemand([{ ...point(10, 1000, 24), sealedForLife: true }]).get(1);
    expect(demand?.gramsPerWeek).toBe(0);
    expect(demand?.steps.map((s) => s.label)).toContain("Sealed for life, not counted");
  });

  it("writes the arithmetic a person can redo", () => {
    const steps = weeklyDemand(times(10, point(20, 2000, 24))).get(1)?.steps ?? [];
    expect(steps[0]?.value).toBe("10 × 20 g ÷ 2000 h × 168 h/week = 16.8 g/week");
    expect(steps.at(-1)?.value).toBe("16.8 g/week relubrication + 0 g/week purges = 16.8 g/week");
  });

  it("lists 10 kinds of point and sums the rest in one step, without changing the total", () => {
    // hand-worked: 12 points of 1..12 g every 1000 h at 24 h/day: Σ = 78 g × 168 ÷ 1000 = 13.104 g/week
    const points = Array.from({ length: 12 }, (_, i) => point(i + 1, 1000, 24));
    const demand = weeklyDemand(points).get(1);
    expect(demand?.gramsPerWeek).toBeCloseTo(13.104, 9);
    expect(demand?.steps.filter((s) => s.label.startsWith("1 point:"))).toHaveLength(10);
    expect(demand?.steps.some((s) => s.label.startsWith("2 other points"))).toBe(true);
  });
});

describe("weeklyDemand — planned purges spread over the horizon", () => {
  const base = times(10, point(20, 2000, 24)); // 16.8 g/week, as above
  const purge = (grams: number, on: string, greaseId = 1): PlannedPurge => ({ greaseId, grams, on: new Date(on) });

  it.each([
    {
      name: "130 g inside the default 13 weeks",
      // hand-worked: 16.8 + 130 ÷ 13 = 16.8 + 10 = 26.8 g/week
      purges: [purge(130, "2025-02-01T00:00:00Z")],
      options: { from: FROM } as WeeklyDemandOptions | undefined,
      gramsPerWeek: 26.8,
      warnings: 0,
    },
    {
      name: "a purge at the horizon's first instant counts",
      // hand-worked: 16.8 + 100 ÷ 4 = 41.8 g/week
      purges: [purge(100, "2025-01-06T00:00:00Z")],
      options: { from: FROM, weeks: 4 },
      gramsPerWeek: 41.8,
      warnings: 0,
    },
    {
      name: "a purge at the horizon's end does not (13 weeks = 91 days: 6 Jan + 91 days = 7 Apr)",
      // hand-worked: 6 Jan → 31 Jan 25 days, Feb 28, Mar 31: 84 days to 31 Mar, + 7 = 7 Apr; only the 6 Apr purge counts
      // 16.8 + 130 ÷ 13 = 26.8 g/week
      purges: [purge(130, "2025-04-06T23:59:59Z"), purge(999, "2025-04-07T00:00:00Z")],
      options: { from: FROM },
      gramsPerWeek: 26.8,
      warnings: 0,
    },
    {
      name: "a purge before the horizon does not count",
      purges: [purge(999, "2025-01-05T23:59:59Z")],
      options: { from: FROM },
      gramsPerWeek: 16.8,
      warnings: 0,
    },
    {
      name: "without a start date purges are not counted, with a warning",
      purges: [purge(130, "2025-02-01T00:00:00Z")],
      options: undefined,
      gramsPerWeek: 16.8,
      warnings: 1,
    },
    {
      name: "a horizon of 0 weeks is taken as 13, with a warning",
      // hand-worked: 16.8 + 130 ÷ 13 = 26.8
      purges: [purge(130, "2025-02-01T00:00:00Z")],
      options: { from: FROM, weeks: 0 },
      gramsPerWeek: 26.8,
      warnings: 1,
    },
    {
      name: "a purge of negative grams or an invalid date is not counted, with a warning",
      purges: [purge(-50, "2025-02-01T00:00:00Z"), purge(50, "not a date")],
      options: { from: FROM },
      gramsPerWeek: 16.8,
      warnings: 1,
    },
  ])("$name → $gramsPerWeek g/week (hand-worked)", ({ purges, options, gramsPerWeek, warnings }) => {
    const demand = weeklyDemand(base, purges, options).get(1);
    expect(demand?.gramsPerWeek).toBeCloseTo(gramsPerWeek, 9);
    expect(demand?.warnings).toHaveLength(warnings);
  });

  it("a grease with only a planned purge appears in the forecast", () => {
    // hand-worked: 260 g ÷ 13 weeks = 20 g/week
    const demand = weeklyDemand(base, [purge(260, "2025-03-01T00:00:00Z", 9)], { from: FROM });
    expect(demand.get(9)?.gramsPerWeek).toBeCloseTo(20, 9);
    expect(demand.get(1)?.gramsPerWeek).toBeCloseTo(16.8, 9);
  });

  it("the default horizon is 13 weeks (common practice, no source)", () => {
    expect(DEFAULT_FORECAST_WEEKS).toBe(13);
  });
});

describe("weeklyDemand — properties", () => {
  const anyNumber = fc.oneof(
    fc.double({ min: -1e4, max: 1e5, noNaN: true }),
    fc.double({ noNaN: true }),
    fc.constantFrom(Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 0, 5e-324, Number.MAX_VALUE),
  );
  const anyPoint: fc.Arbitrary<DemandPoint> = fc.record({
    greaseId: fc.integer({ min: 1, max: 3 }),
    quantityGrams: anyNumber,
    intervalHours: anyNumber,
    runningHoursPerDay: anyNumber,
    sealedForLife: fc.boolean(),
  });
  const anyPurge: fc.Arbitrary<PlannedPurge> = fc.record({
    greaseId: fc.integer({ min: 1, max: 3 }),
    grams: anyNumber,
    on: fc.integer({ min: -200, max: 200 }).map((days) => new Date(FROM.getTime() + days * 86_400_000)),
  });

  it("never NaN, never negative, never infinite (common practice, no source: the house rule)", () => {
    fc.assert(
      fc.property(fc.array(anyPoint), fc.array(anyPurge), (points, purges) => {
        for (const d of weeklyDemand(points, purges, { from: FROM }).values()) {
          expect(Number.isFinite(d.gramsPerWeek)).toBe(true);
          expect(d.gramsPerWeek).toBeGreaterThanOrEqual(0);
        }
      }),
    );
  });

  it("a sealed-for-life point never changes the demand", () => {
    fc.assert(
      fc.property(fc.array(anyPoint), anyPoint, (points, extra) => {
        const before = weeklyDemand(points).get(extra.greaseId)?.gramsPerWeek ?? 0;
        const after = weeklyDemand([...points, { ...extra, sealedForLife: true }]).get(extra.greaseId)?.gramsPerWeek;
        expect(after).toBe(before);
      }),
    );
  });
});
