import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  axisReach,
  kg,
  mass,
  massAxis,
  niceScale,
  percentOf,
  shortDay,
} from "@/components/stock/chart-scale";

// Axis steps of 1, 2, 2.5 and 5 × 10ⁿ: common practice for chart axes, no source; cases hand-worked.
describe("niceScale", () => {
  it.each([
    { max: 10, ticks: 5, expected: [0, 2, 4, 6, 8, 10], why: "exactly on a step" },
    { max: 47.3, ticks: 5, expected: [0, 10, 20, 30, 40, 50], why: "47.3 / 5 = 9.46 → step 10" },
    { max: 101, ticks: 5, expected: [0, 25, 50, 75, 100, 125], why: "101 / 5 = 20.2 → step 25" },
    { max: 0.37, ticks: 4, expected: [0, 0.1, 0.2, 0.3, 0.4], why: "0.37 / 4 = 0.0925 → step 0.1" },
    { max: 0.3, ticks: 3, expected: [0, 0.1, 0.2, 0.3], why: "0.3 / 3 is 0.0999… in binary; still step 0.1" },
    { max: 3.2, ticks: 1, expected: [0, 5], why: "one interval: the next round number" },
    { max: 0, ticks: 5, expected: [0, 0.2, 0.4, 0.6, 0.8, 1], why: "nothing to show: 0–1" },
    { max: Number.NaN, ticks: 5, expected: [0, 0.2, 0.4, 0.6, 0.8, 1], why: "not a number: 0–1" },
  ])("$max in at most $ticks intervals → $expected ($why)", ({ max, ticks, expected }) => {
    const scale = niceScale(max, ticks);
    expect(scale.ticks).toEqual(expected);
    expect(scale.max).toBe(expected.at(-1));
  });

  it("reaches the largest value with evenly spaced ticks, never more intervals than asked (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-3, max: 1e7, noNaN: true }),
        fc.integer({ min: 1, max: 10 }),
        (max, intervals) => {
          const scale = niceScale(max, intervals);
          // Within floating-point rounding (0.0010000000000000002 gives an axis to 0.001); bars are clamped to the axis.
          expect(scale.max).toBeGreaterThanOrEqual(max * (1 - 1e-9));
          expect(scale.ticks[0]).toBe(0);
          expect(scale.ticks.length - 1).toBeLessThanOrEqual(intervals);
          const step = scale.ticks[1]! - scale.ticks[0]!;
          for (let i = 1; i < scale.ticks.length; i++)
            expect(scale.ticks[i]! - scale.ticks[i - 1]!).toBeCloseTo(step, 9);
          // Not wastefully large: the last interval is needed to reach the value.
          expect(scale.ticks.at(-2)!).toBeLessThan(max);
        },
      ),
    );
  });
});

describe("percentOf", () => {
  it.each([
    { value: 2.5, max: 10, expected: 25 },
    { value: 12, max: 10, expected: 100 },
    { value: -1, max: 10, expected: 0 },
    { value: 5, max: 0, expected: 0 },
    { value: Number.NaN, max: 10, expected: 0 },
  ])("$value of $max → $expected %", ({ value, max, expected }) => {
    expect(percentOf(value, max)).toBe(expected);
  });
});

describe("kg and shortDay", () => {
  it.each([
    { grams: 350, text: "0.35 kg" },
    { grams: 12_440, text: "12.4 kg" },
    { grams: 4000, text: "4 kg" },
    { grams: 180_400, text: "180 kg" },
    { grams: 0, text: "0 kg" },
  ])("$grams g → $text", ({ grams, text }) => {
    expect(kg(grams)).toBe(text);
  });

  it("writes a Monday as day and month, and leaves a bad date as it came", () => {
    expect(shortDay("2025-11-03")).toBe("3 Nov");
    expect(shortDay("soon")).toBe("soon");
  });
});

describe("axisReach", () => {
  it.each([
    {
      values: [1.6, 1.6, 3.2, 72],
      always: [0.5],
      reach: 3.2,
      why: "median 2.4 kg, so a 72 kg pail (> 4 × 2.4) is cut",
    },
    { values: [1.6, 1.6, 3.2, 72], always: [80], reach: 80, why: "a reorder point is always on the axis" },
    { values: [2, 4, 8], always: [], reach: 8, why: "median 4: 8 is within 4 × 4" },
    { values: [1, 1, 17], always: [], reach: 1, why: "median 1: 17 > 4 is cut" },
    { values: [5], always: [], reach: 5, why: "a single value is its own median" },
    { values: [0, 0, 3], always: [], reach: 3, why: "empty stock does not pull the median down" },
    { values: [], always: [], reach: 0, why: "nothing to show" },
    {
      values: [Number.NaN, -2],
      always: [Number.NaN],
      reach: 0,
      why: "not numbers and negatives are ignored",
    },
  ])("$values with $always → $reach ($why)", ({ values, always, reach }) => {
    expect(axisReach(values, always)).toBe(reach);
  });
});

describe("massAxis and mass", () => {
  it.each([
    {
      grams: 470,
      unit: "g",
      labels: ["0", "100", "200", "300", "400", "500"],
      why: "below 1 kg the axis is in grams",
    },
    { grams: 130, unit: "g", labels: ["0", "50", "100", "150"], why: "130 / 4 = 32.5 → step 50" },
    {
      grams: 2300,
      unit: "kg",
      labels: ["0", "0.5", "1", "1.5", "2", "2.5"],
      why: "2300 / 5 = 460 → step 500 g, in kg",
    },
    { grams: 1000, unit: "kg", labels: ["0", "0.2", "0.4", "0.6", "0.8", "1"], why: "exactly 1 kg: in kg" },
  ])("$grams g → $labels $unit ($why)", ({ grams, unit, labels }) => {
    const axis = massAxis(grams, labels.length === 4 ? 4 : 5);
    expect(axis.unit).toBe(unit);
    expect(axis.ticks.map((t) => t.label)).toEqual(labels);
    expect(axis.maxGrams).toBe(axis.ticks.at(-1)!.grams);
  });

  it.each([
    { grams: 490, text: "490 g" },
    { grams: 2.46, text: "2.5 g" },
    { grams: 999.4, text: "999 g" },
    { grams: 999.6, text: "1 kg", why: "would round to 1000 g" },
    { grams: 1600, text: "1.6 kg" },
    { grams: 0, text: "0 g" },
  ])("$grams g → $text", ({ grams, text }) => {
    expect(mass(grams)).toBe(text);
  });
});
