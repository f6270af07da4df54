import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { gunStrokes, replenishmentQuantity, replenishmentQuantityImperial } from "@/lib/domain/relubrication";
import { gramsToOunces, mmToInch } from "@/lib/domain/units";

const SIDE = "G = 0.005·D·B, SKF Rolling bearings p. 115 and Tribology Handbook §A20 (domain.md §6.5)";
const CENTRE = "G = 0.002·D·B, SKF Rolling bearings p. 115 (domain.md §6.5)";
const IMPERIAL = "G = 0.114·D·B oz, Machinery Lubrication ML #31524 (domain.md §6.5)";

describe("replenishmentQuantity", () => {
  it.each([
    // 0.005 × 52 × 15 = 3.9 g (a 6205-size ball bearing: D = 52 mm, B = 15 mm)
    { D: 52, B: 15, replenishment: "side", grams: 3.9, source: `derived from ${SIDE}` },
    // 0.005 × 90 × 20 = 9 g
    { D: 90, B: 20, replenishment: "side", grams: 9, source: `derived from ${SIDE}` },
    // 0.002 × 90 × 20 = 3.6 g
    { D: 90, B: 20, replenishment: "centre", grams: 3.6, source: `derived from ${CENTRE}` },
    // 0.005 × 215 × 58 = 62.35 g (a 22220-size spherical roller bearing)
    { D: 215, B: 58, replenishment: "side", grams: 62.35, source: `derived from ${SIDE}` },
    // 0.002 × 215 × 58 = 24.94 g
    { D: 215, B: 58, replenishment: "centre", grams: 24.94, source: `derived from ${CENTRE}` },
  ] as const)("D=$D B=$B $replenishment → $grams g ($source)", ({ D, B, replenishment, grams }) => {
    const r = replenishmentQuantity({ outsideDiameterMm: D, widthMm: B, replenishment });
    expect(r.quantityGrams).toBeCloseTo(grams, 6);
    expect(r.warnings).toEqual([]);
    expect(r.method).toContain(replenishment === "side" ? "0.005·D·B" : "0.002·D·B");
  });

  it("defaults to side replenishment and shows the arithmetic", () => {
    const r = replenishmentQuantity({ outsideDiameterMm: 52, widthMm: 15 });
    expect(r.quantityGrams).toBeCloseTo(3.9, 9);
    expect(r.steps[0]!.value).toBe("0.005 g/mm² × 52 mm × 15 mm = 3.9 g");
  });

  it("is not the misprinted 0.0005·D·B (ten times too small, domain.md §6.5)", () => {
    expect(replenishmentQuantity({ outsideDiameterMm: 100, widthMm: 25 }).quantityGrams).toBeCloseTo(12.5, 9);
  });

  it.each([
    { D: 0, B: 15 },
    { D: 52, B: -15 },
    { D: Number.NaN, B: 15 },
    { D: 52, B: Number.POSITIVE_INFINITY },
  ])("D=$D B=$B → null with a warning", ({ D, B }) => {
    const r = replenishmentQuantity({ outsideDiameterMm: D, widthMm: B });
    expect(r.quantityGrams).toBeNull();
    expect(r.warnings.join(" ")).toMatch(/outside the method's range/);
  });

  it("grows with D and with B (property; G ∝ D·B)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 2000, noNaN: true }),
        fc.double({ min: 1, max: 500, noNaN: true }),
        fc.double({ min: 1.001, max: 5, noNaN: true }),
        fc.constantFrom("side" as const, "centre" as const),
        (D, B, k, replenishment) => {
          const g = replenishmentQuantity({ outsideDiameterMm: D, widthMm: B, replenishment }).quantityGrams!;
          expect(
            replenishmentQuantity({ outsideDiameterMm: D * k, widthMm: B, replenishment }).quantityGrams!,
          ).toBeGreaterThan(g);
          expect(
            replenishmentQuantity({ outsideDiameterMm: D, widthMm: B * k, replenishment }).quantityGrams!,
          ).toBeGreaterThan(g);
        },
      ),
    );
  });
});

describe("replenishmentQuantityImperial", () => {
  it.each([
    // 0.114 × 4 × 1 = 0.456 oz
    { D: 4, B: 1, replenishment: "side", ounces: 0.456, source: `derived from ${IMPERIAL}` },
    // 0.114 × 2.047 × 0.591 = 0.13791 oz
    { D: 2.047, B: 0.591, replenishment: "side", ounces: 0.13791, source: `derived from ${IMPERIAL}` },
    // 0.002 × 25.4² / 28.349523125 = 0.045515 oz/in²; × 4 × 1 = 0.18206 oz
    {
      D: 4,
      B: 1,
      replenishment: "centre",
      ounces: 0.18206,
      source: `derived from ${CENTRE} converted (no imperial form published)`,
    },
  ] as const)("D=$D in B=$B in $replenishment → $ounces oz ($source)", ({ D, B, replenishment, ounces }) => {
    const r = replenishmentQuantityImperial({ outsideDiameterIn: D, widthIn: B, replenishment });
    expect(r.quantityOunces).toBeCloseTo(ounces, 4);
    expect(r.warnings).toEqual([]);
  });

  it.each([
    { D: 52, B: 15, replenishment: "side" },
    { D: 90, B: 20, replenishment: "side" },
    { D: 215, B: 58, replenishment: "side" },
    { D: 90, B: 20, replenishment: "centre" },
    { D: 400, B: 100, replenishment: "centre" },
  ] as const)(
    "D=$D mm B=$B mm $replenishment: the imperial form agrees with the metric within 0.2 % (0.114 vs 0.11379 oz/in², domain.md §6.5 [DERIVED])",
    ({ D, B, replenishment }) => {
      const grams = replenishmentQuantity({ outsideDiameterMm: D, widthMm: B, replenishment }).quantityGrams!;
      const ounces = replenishmentQuantityImperial({
        outsideDiameterIn: mmToInch(D),
        widthIn: mmToInch(B),
        replenishment,
      }).quantityOunces!;
      const relative = Math.abs(ounces - gramsToOunces(grams)) / gramsToOunces(grams);
      expect(relative).toBeLessThan(0.002);
      if (replenishment === "centre") expect(relative).toBeLessThan(1e-12); // derived exactly from the metric factor
    },
  );

  it("refuses unusable dimensions", () => {
    const r = replenishmentQuantityImperial({ outsideDiameterIn: -1, widthIn: 1 });
    expect(r.quantityOunces).toBeNull();
    expect(r.warnings).toHaveLength(1);
  });
});

describe("gunStrokes (nearest whole stroke, at least 1; common practice per domain.md §8)", () => {
  it.each([
    { grams: 3.9, perStroke: 1.5, strokes: 3, why: "3.9 / 1.5 = 2.6 → 3" },
    { grams: 9, perStroke: 2, strokes: 5, why: "9 / 2 = 4.5 → 5 (halves up)" },
    { grams: 8.9, perStroke: 2, strokes: 4, why: "8.9 / 2 = 4.45 → 4" },
    { grams: 3, perStroke: 1, strokes: 3, why: "exact" },
    {
      grams: 4.4,
      perStroke: 2.7,
      strokes: 2,
      why: "domain.md §8 example: 4.4 g with a 2.7 cc gun, 1.63 → 2",
    },
    { grams: 0.5, perStroke: 1.5, strokes: 1, why: "0.33 → 0, raised to the minimum of 1" },
  ])("$grams g at $perStroke g/stroke → $strokes ($why)", ({ grams, perStroke, strokes }) => {
    expect(gunStrokes(grams, perStroke).strokes).toBe(strokes);
  });

  it("shows the division and what the whole strokes deliver", () => {
    const r = gunStrokes(3.9, 1.5);
    expect(r.steps.map((s) => s.value)).toEqual([
      "3.9 g ÷ 1.5 g per stroke = 2.6",
      "3 strokes × 1.5 g = 4.5 g",
    ]);
    expect(r.warnings).toEqual([]); // +15 %, inside the 25 % tolerance (common practice, no source)
  });

  it("warns of over-greasing when one stroke is far more than needed", () => {
    const r = gunStrokes(0.5, 1.5);
    expect(r.warnings.join(" ")).toMatch(
      /1 stroke deliver 1.5 g for 0.5 g needed \(\+200 %\): risk of over-greasing/,
    );
  });

  it.each([
    { perStroke: 0.3, warned: true, why: "below 0.5 g: likely a calibration slip" },
    { perStroke: 0.5, warned: false, why: "lower bound, inclusive" },
    { perStroke: 3, warned: false, why: "ML #206: 1–3 g per stroke" },
    { perStroke: 5, warned: false, why: "upper bound, inclusive" },
    { perStroke: 28, warned: true, why: "an ounce typed as grams" },
  ])(
    "$perStroke g/stroke → plausibility warning $warned ($why; bounds common practice, no source, from domain.md §8 figures)",
    ({ perStroke, warned }) => {
      const r = gunStrokes(perStroke * 4, perStroke);
      expect(r.strokes).toBe(4);
      expect(r.warnings.some((w) => /usual 0.5–5 g/.test(w))).toBe(warned);
    },
  );

  it.each([
    [0, 1.5],
    [-3, 1.5],
    [3.9, 0],
    [3.9, Number.NaN],
    [Number.POSITIVE_INFINITY, 1.5],
  ])("%s g at %s g/stroke → null with a warning", (grams, perStroke) => {
    const r = gunStrokes(grams, perStroke);
    expect(r.strokes).toBeNull();
    expect(r.warnings).toHaveLength(1);
  });

  it("always at least 1 stroke, and never more than half a stroke away from the exact count (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 1000, noNaN: true }),
        fc.double({ min: 0.1, max: 10, noNaN: true }),
        (g, s) => {
          const strokes = gunStrokes(g, s).strokes!;
          expect(Number.isInteger(strokes)).toBe(true);
          expect(strokes).toBeGreaterThanOrEqual(1);
          if (g / s >= 0.5) expect(Math.abs(strokes - g / s)).toBeLessThanOrEqual(0.5 + 1e-9);
        },
      ),
    );
  });
});
