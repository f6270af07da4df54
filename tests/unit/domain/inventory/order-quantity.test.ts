import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEFAULT_COVER_WEEKS, orderQuantity } from "@/lib/domain/inventory";

// The worked reorder point: 16.8 g/week, 21 days lead time, 2 weeks safety stock → 84 g (stock-levels.test.ts).
// Target with the default 8 weeks of cover: 84 + 8 × 16.8 = 84 + 134.4 = 218.4 g.
const WORKED = { reorderPointGrams: 84, gramsPerWeek: 16.8, packGrams: 400 };

describe("orderQuantity (whole packs up to reorder point + cover)", () => {
  it.each([
    {
      name: "shortfall of 1 g → 1 cartridge",
      // hand-worked: 218.4 − 217.4 = 1 g; ⌈1 ÷ 400⌉ = 1 pack = 400 g
      input: { ...WORKED, onHandGrams: 217.4 },
      packs: 1,
      grams: 400,
      warnings: 0,
    },
    {
      name: "empty shelf → 1 cartridge covers 218.4 g",
      // hand-worked: ⌈218.4 ÷ 400⌉ = 1
      input: { ...WORKED, onHandGrams: 0 },
      packs: 1,
      grams: 400,
      warnings: 0,
    },
    {
      name: "exactly at the target → nothing",
      input: { ...WORKED, onHandGrams: 218.4 },
      packs: 0,
      grams: 0,
      warnings: 0,
    },
    {
      name: "above the target → nothing",
      input: { ...WORKED, onHandGrams: 5000 },
      packs: 0,
      grams: 0,
      warnings: 0,
    },
    {
      name: "on order counts towards the target",
      // hand-worked: 0 + 200 = 200 g; 218.4 − 200 = 18.4 g → 1 pack
      input: { ...WORKED, onHandGrams: 0, onOrderGrams: 200 },
      packs: 1,
      grams: 400,
      warnings: 0,
    },
    {
      name: "on order already covers the target → nothing",
      input: { ...WORKED, onHandGrams: 18.4, onOrderGrams: 200 },
      packs: 0,
      grams: 0,
      warnings: 0,
    },
    {
      name: "a shortfall of exactly 2 packs → 2 packs, not 3",
      // hand-worked: target 100 + 8 × 50 = 500 g; 500 − 100 = 400 g; 400 ÷ 200 = 2
      input: { reorderPointGrams: 100, gramsPerWeek: 50, onHandGrams: 100, packGrams: 200 },
      packs: 2,
      grams: 400,
      warnings: 0,
    },
    {
      name: "1 g more than 1 pack → 2 packs",
      // hand-worked: 500 − 99 = 401 g; ⌈401 ÷ 400⌉ = 2
      input: { reorderPointGrams: 100, gramsPerWeek: 50, onHandGrams: 99, packGrams: 400 },
      packs: 2,
      grams: 800,
      warnings: 0,
    },
    {
      name: "drums for a big consumer",
      // hand-worked: target 2000 + 8 × 1000 = 10 000 g; 10 000 − 500 = 9500 g; ⌈9500 ÷ 180 000⌉ = 1 drum (180 kg, domain.md §10.3 ELGI)
      input: { reorderPointGrams: 2000, gramsPerWeek: 1000, onHandGrams: 500, packGrams: 180_000 },
      packs: 1,
      grams: 180_000,
      warnings: 0,
    },
    {
      name: "cover 0 weeks → order up to the reorder point only",
      // hand-worked: target 84 + 0 × 16.8 = 84 g; ⌈84 ÷ 50⌉ = 2 packs = 100 g
      input: { ...WORKED, onHandGrams: 0, coverWeeks: 0, packGrams: 50 },
      packs: 2,
      grams: 100,
      warnings: 0,
    },
    {
      name: "floating-point noise does not add a pack",
      // hand-worked: target 0 + 3 × 16.8 = 50.4 g (50.400000000000006 in binary); one 50.4 g pack is enough
      input: { reorderPointGrams: 0, gramsPerWeek: 16.8, coverWeeks: 3, onHandGrams: 0, packGrams: 50.4 },
      packs: 1,
      grams: 50.4,
      warnings: 0,
    },
    {
      name: "pack size 0 → no order, with a warning",
      input: { ...WORKED, onHandGrams: 0, packGrams: 0 },
      packs: 0,
      grams: 0,
      warnings: 1,
    },
    {
      name: "negative pack size → no order, with a warning",
      input: { ...WORKED, onHandGrams: 0, packGrams: -400 },
      packs: 0,
      grams: 0,
      warnings: 1,
    },
    {
      name: "unknown pack size → no order, with a warning",
      input: { ...WORKED, onHandGrams: 0, packGrams: Number.NaN },
      packs: 0,
      grams: 0,
      warnings: 1,
    },
    {
      name: "negative stock is taken as none, with a warning",
      // hand-worked: as the empty shelf, 1 pack
      input: { ...WORKED, onHandGrams: -50 },
      packs: 1,
      grams: 400,
      warnings: 1,
    },
    {
      name: "negative cover is taken as the default 8 weeks, with a warning",
      input: { ...WORKED, onHandGrams: 217.4, coverWeeks: -1 },
      packs: 1,
      grams: 400,
      warnings: 1,
    },
  ])("$name (hand-worked)", ({ input, packs, grams, warnings }) => {
    const result = orderQuantity(input);
    expect(result.packs).toBe(packs);
    expect(result.grams).toBeCloseTo(grams, 9);
    expect(result.warnings).toHaveLength(warnings);
  });

  it("never NaN, negative or fractional, whatever it is given (property)", () => {
    const any = fc.oneof(fc.double(), fc.constantFrom(Number.NaN, Number.MAX_VALUE, 5e-324, 0, -1));
    fc.assert(
      fc.property(any, any, any, any, any, any, (onHandGrams, onOrderGrams, reorderPointGrams, gramsPerWeek, coverWeeks, packGrams) => {
        const r = orderQuantity({ onHandGrams, onOrderGrams, reorderPointGrams, gramsPerWeek, coverWeeks, packGrams });
        expect(Number.isInteger(r.packs)).toBe(true);
        expect(r.packs).toBeGreaterThanOrEqual(0);
        expect(r.grams).toBeGreaterThanOrEqual(0);
        expect(Number.isFinite(r.grams)).toBe(true);
      }),
    );
  });

  it("explains a missing pack size in the steps", () => {
    const { steps } = orderQuantity({ ...WORKED, onHandGrams: 0, packGrams: 0 });
    expect(steps.at(-1)?.value).toMatch(/not a positive mass/);
  });

  it("shows the arithmetic of the worked example", () => {
    const { steps } = orderQuantity({ ...WORKED, onHandGrams: 217.4 });
    expect(steps.map((s) => s.value)).toEqual([
      "84 g + 8 weeks × 16.8 g/week = 218.4 g",
      "217.4 g + 0 g = 217.4 g",
      "218.4 g − 217.4 g = 1 g",
      "⌈1 g ÷ 400 g⌉ = 1 pack = 400 g",
    ]);
  });

  it("the default cover is 8 weeks (common practice, no source)", () => {
    expect(DEFAULT_COVER_WEEKS).toBe(8);
  });

  it("orders whole packs, at least the shortfall, and never a pack too many (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1e6, noNaN: true }),
        fc.double({ min: 0, max: 1e5, noNaN: true }),
        fc.double({ min: 0, max: 1e5, noNaN: true }),
        fc.double({ min: 0, max: 1e4, noNaN: true }),
        fc.double({ min: 0, max: 52, noNaN: true }),
        fc.constantFrom(396.9, 400, 500, 1000, 15_900, 18_000, 54_400, 180_000),
        (onHandGrams, onOrderGrams, reorderPointGrams, gramsPerWeek, coverWeeks, packGrams) => {
          const r = orderQuantity({ onHandGrams, onOrderGrams, reorderPointGrams, gramsPerWeek, coverWeeks, packGrams });
          const shortfall = reorderPointGrams + coverWeeks * gramsPerWeek - (onHandGrams + onOrderGrams);
          expect(Number.isInteger(r.packs)).toBe(true);
          expect(r.packs).toBeGreaterThanOrEqual(0);
          expect(r.grams).toBe(r.packs * packGrams);
          if (shortfall <= 0) expect(r.packs).toBe(0);
          else {
            expect(r.grams).toBeGreaterThanOrEqual(shortfall - 1e-6);
            expect((r.packs - 1) * packGrams).toBeLessThan(shortfall);
          }
        },
      ),
    );
  });
});
