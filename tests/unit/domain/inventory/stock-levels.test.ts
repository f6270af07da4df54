import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  DEFAULT_SAFETY_STOCK_WEEKS,
  isBelowReorderPoint,
  lowStockEpisode,
  reorderPoint,
  weeksOfCover,
} from "@/lib/domain/inventory";

describe("weeksOfCover (on hand ÷ demand)", () => {
  it.each([
    { onHand: 84, perWeek: 16.8, weeks: 5, source: "hand-worked: 84 ÷ 16.8 = 5" },
    { onHand: 1000, perWeek: 100, weeks: 10, source: "hand-worked: 1000 ÷ 100 = 10" },
    { onHand: 50, perWeek: 100, weeks: 0.5, source: "hand-worked: 50 ÷ 100 = 0.5" },
    { onHand: 0, perWeek: 16.8, weeks: 0, source: "nothing on hand" },
    { onHand: -5, perWeek: 16.8, weeks: 0, source: "negative stock counts as none (guard)" },
    { onHand: Number.NaN, perWeek: 16.8, weeks: 0, source: "unknown stock counts as none (guard)" },
    { onHand: 100, perWeek: 0, weeks: null, source: "no demand: never runs out" },
    { onHand: 0, perWeek: 0, weeks: null, source: "no demand, nothing on hand: still never short" },
    { onHand: 100, perWeek: -1, weeks: null, source: "negative demand counts as none (guard)" },
    { onHand: 100, perWeek: Number.NaN, weeks: null, source: "unknown demand: no figure rather than NaN (guard)" },
    { onHand: 1e10, perWeek: 5e-324, weeks: null, source: "a demand so small the division overflows is no demand (guard)" },
  ])("$onHand g at $perWeek g/week → $weeks weeks ($source)", ({ onHand, perWeek, weeks }) => {
    const result = weeksOfCover(onHand, perWeek);
    if (weeks === null) expect(result).toBeNull();
    else expect(result).toBeCloseTo(weeks, 9);
  });
});

describe("reorderPoint (lead-time demand + safety stock)", () => {
  it.each([
    {
      name: "the worked example",
      // hand-worked: 16.8 g/week × 21 days ÷ 7 = 50.4 g; + 16.8 × 2 weeks = 33.6 g; 50.4 + 33.6 = 84 g
      input: { gramsPerWeek: 16.8, leadTimeDays: 21, safetyStockWeeks: 2 },
      grams: 84,
      warnings: 0,
    },
    {
      name: "default safety stock of 2 weeks",
      // hand-worked: as above, 84 g
      input: { gramsPerWeek: 16.8, leadTimeDays: 21 },
      grams: 84,
      warnings: 0,
    },
    {
      name: "no safety stock, 10 days lead time",
      // hand-worked: 100 × 10 ÷ 7 = 142.857142… g, rounded to the milligram: 142.857 g
      input: { gramsPerWeek: 100, leadTimeDays: 10, safetyStockWeeks: 0 },
      grams: 142.857,
      warnings: 0,
    },
    {
      name: "no demand",
      input: { gramsPerWeek: 0, leadTimeDays: 21 },
      grams: 0,
      warnings: 0,
    },
    {
      name: "unknown demand is taken as 0, with a warning",
      input: { gramsPerWeek: Number.NaN, leadTimeDays: 21 },
      grams: 0,
      warnings: 1,
    },
    {
      name: "negative lead time is taken as 0: safety stock only, with a warning",
      // hand-worked: 16.8 × 2 = 33.6 g
      input: { gramsPerWeek: 16.8, leadTimeDays: -3 },
      grams: 33.6,
      warnings: 1,
    },
    {
      name: "unknown lead time is taken as 0, with a warning",
      input: { gramsPerWeek: 16.8, leadTimeDays: Number.NaN },
      grams: 33.6,
      warnings: 1,
    },
    {
      name: "negative safety stock is taken as the default 2 weeks, with a warning",
      // hand-worked: 10 × 7 ÷ 7 = 10 g; + 10 × 2 = 20 g; = 30 g
      input: { gramsPerWeek: 10, leadTimeDays: 7, safetyStockWeeks: -1 },
      grams: 30,
      warnings: 1,
    },
  ])("$name → $grams g (hand-worked)", ({ input, grams, warnings }) => {
    const result = reorderPoint(input);
    expect(result.reorderPointGrams).toBeCloseTo(grams, 9);
    expect(result.warnings).toHaveLength(warnings);
  });

  it("the worked example is exactly 84 g, so 84 g on hand is not below it", () => {
    const { reorderPointGrams } = reorderPoint({ gramsPerWeek: 16.8, leadTimeDays: 21, safetyStockWeeks: 2 });
    expect(reorderPointGrams).toBe(84);
    expect(isBelowReorderPoint(84, reorderPointGrams)).toBe(false);
  });

  it("a reorder point worked out by hand is the one compared: 1.1 g/week × 3 weeks = 3.3 g, and 3.3 g is not below it", () => {
    // hand-worked: 1.1 × 7 ÷ 7 + 1.1 × 2 = 3.3 g (3.3000000000000003 in binary before rounding to the milligram)
    const { reorderPointGrams } = reorderPoint({ gramsPerWeek: 1.1, leadTimeDays: 7, safetyStockWeeks: 2 });
    expect(reorderPointGrams).toBe(3.3);
    expect(isBelowReorderPoint(3.3, reorderPointGrams)).toBe(false);
  });

  it("shows the arithmetic", () => {
    const { steps } = reorderPoint({ gramsPerWeek: 16.8, leadTimeDays: 21 });
    expect(steps.map((s) => s.value.split(" (")[0])).toEqual([
      "16.8 g/week × 21 days ÷ 7 = 50.4 g",
      "16.8 g/week × 2 weeks = 33.6 g",
      "50.4 g + 33.6 g = 84 g",
    ]);
  });

  it("the default safety stock is 2 weeks (common practice, no source)", () => {
    expect(DEFAULT_SAFETY_STOCK_WEEKS).toBe(2);
  });

  it("never NaN or negative, and never lower for more demand or a longer lead time (property)", () => {
    const any = fc.oneof(
      fc.double({ min: -1e4, max: 1e6, noNaN: true }),
      fc.double(),
      fc.constantFrom(Number.NaN, Number.MAX_VALUE, 5e-324),
    );
    fc.assert(
      fc.property(any, any, fc.option(any, { nil: undefined }), (gramsPerWeek, leadTimeDays, safetyStockWeeks) => {
        const r = reorderPoint({ gramsPerWeek, leadTimeDays, safetyStockWeeks }).reorderPointGrams;
        expect(Number.isFinite(r)).toBe(true);
        expect(r).toBeGreaterThanOrEqual(0);
      }),
    );
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1e5, noNaN: true }),
        fc.double({ min: 0, max: 1e3, noNaN: true }),
        fc.double({ min: 0, max: 100, noNaN: true }),
        (gramsPerWeek, leadTimeDays, extra) => {
          const r = reorderPoint({ gramsPerWeek, leadTimeDays }).reorderPointGrams;
          expect(reorderPoint({ gramsPerWeek: gramsPerWeek + extra, leadTimeDays }).reorderPointGrams).toBeGreaterThanOrEqual(r);
          expect(reorderPoint({ gramsPerWeek, leadTimeDays: leadTimeDays + extra }).reorderPointGrams).toBeGreaterThanOrEqual(r);
        },
      ),
    );
  });
});

describe("isBelowReorderPoint (strictly below)", () => {
  it.each([
    { onHand: 83, rop: 84, low: true, source: "hand-worked: 83 < 84" },
    { onHand: 84, rop: 84, low: false, source: "at the reorder point is not below it" },
    { onHand: 85, rop: 84, low: false, source: "hand-worked: 85 > 84" },
    { onHand: 0, rop: 0, low: false, source: "no demand, no stock: nothing to reorder" },
    { onHand: 0, rop: 84, low: true, source: "empty" },
    { onHand: Number.NaN, rop: 84, low: true, source: "unknown stock counts as none (guard, safe side)" },
    { onHand: -10, rop: 84, low: true, source: "negative stock counts as none (guard)" },
    { onHand: 10, rop: Number.NaN, low: false, source: "no reorder point, no alert (guard)" },
  ])("$onHand g against $rop g → $low ($source)", ({ onHand, rop, low }) => {
    expect(isBelowReorderPoint(onHand, rop)).toBe(low);
  });
});

describe("lowStockEpisode (one alert per episode; common practice, no source)", () => {
  it.each([
    { wasLow: false, isLow: true, episode: "starts" },
    { wasLow: true, isLow: true, episode: "continues" },
    { wasLow: true, isLow: false, episode: "ends" },
    { wasLow: false, isLow: false, episode: "none" },
  ] as const)("was low $wasLow, is low $isLow → $episode", ({ wasLow, isLow, episode }) => {
    expect(lowStockEpisode({ wasLow, isLow })).toBe(episode);
  });

  it("over any run of checks, the alerts sent equal the low episodes (property)", () => {
    fc.assert(
      fc.property(fc.array(fc.boolean()), (checks) => {
        let wasLow = false;
        let alerts = 0;
        for (const isLow of checks) {
          if (lowStockEpisode({ wasLow, isLow }) === "starts") alerts += 1;
          wasLow = isLow;
        }
        // An episode is a maximal run of consecutive low checks.
        const episodes = checks.filter((low, i) => low && (i === 0 || !checks[i - 1])).length;
        expect(alerts).toBe(episodes);
      }),
    );
  });
});
