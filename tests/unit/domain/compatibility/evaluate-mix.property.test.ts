import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  BASE_OIL_TYPES,
  FOOD_GRADES,
  NLGI_GRADES,
  SOLID_ADDITIVES,
  THICKENERS,
} from "@/lib/domain/catalogue";
import {
  CHARTS,
  VERDICT_STRICTNESS,
  evaluateMix,
  thickenerVerdict,
  type CompatibilitySettings,
  type GreaseProfile,
  type MixResult,
  type PairEvidence,
} from "@/lib/domain/compatibility";

// Properties the lead engineer's rule 9 asks for; no published source — they follow from the rules themselves.

const CHART_IDS = CHARTS.map((c) => c.id);

const profile: fc.Arbitrary<GreaseProfile> = fc.record({
  productId: fc.constantFrom(null, 1, 2, 3, "3"),
  thickener: fc.constantFrom(...THICKENERS),
  baseOilType: fc.constantFrom(...BASE_OIL_TYPES),
  viscosity40: fc.option(fc.constantFrom(10, 32, 46, 68, 100, 150, 220, 460, 1000), { nil: null }),
  nlgiGrade: fc.option(fc.constantFrom(...NLGI_GRADES), { nil: null }),
  foodGrade: fc.option(fc.constantFrom(...FOOD_GRADES), { nil: null }),
  solidAdditives: fc.subarray([...SOLID_ADDITIVES]),
});

const evidenceList: fc.Arbitrary<PairEvidence[]> = fc.array(
  fc.record({
    id: fc.nat(),
    productA: fc.constantFrom(1, 2, 3),
    productB: fc.constantFrom(1, 2, 3),
    kind: fc.constantFrom("lab_mixture_test" as const, "supplier_statement" as const),
    verdict: fc.constantFrom("compatible" as const, "borderline" as const, "incompatible" as const),
    title: fc.constant("Evidence"),
  }),
  { maxLength: 3 },
);

const settings: fc.Arbitrary<CompatibilitySettings> = fc.record({
  enabledCharts: fc.subarray(CHART_IDS),
  viscosityRatioLimit: fc.constantFrom(1.5, 2, 3),
  nlgiStepLimit: fc.constantFrom(0.5, 1, 2),
});

function signature(r: MixResult) {
  return {
    verdict: r.verdict,
    mixingAllowed: r.mixingAllowed,
    reasons: r.reasons.map((x) => `${x.kind}:${x.verdict}:${x.overridden === true}`).sort(),
    charts: r.charts,
  };
}

describe("evaluateMix properties", () => {
  it("is symmetric: swapping the two greases gives the same verdict, reasons and charts (food-grade gate off)", () => {
    fc.assert(
      fc.property(profile, profile, evidenceList, settings, (a, b, evidence, s) => {
        expect(signature(evaluateMix(b, a, { evidence }, s))).toEqual(
          signature(evaluateMix(a, b, { evidence }, s)),
        );
      }),
      { numRuns: 500 },
    );
  });

  it("is deterministic and leaves its inputs alone", () => {
    fc.assert(
      fc.property(profile, profile, evidenceList, settings, fc.boolean(), (a, b, evidence, s, food) => {
        const before = JSON.stringify([a, b, evidence, s]);
        const first = evaluateMix(a, b, { evidence, foodGradeRequired: food }, s);
        expect(evaluateMix(a, b, { evidence, foodGradeRequired: food }, s)).toEqual(first);
        expect(JSON.stringify([a, b, evidence, s])).toBe(before);
      }),
    );
  });

  it("allows mixing exactly when the verdict is compatible", () => {
    fc.assert(
      fc.property(profile, profile, evidenceList, settings, fc.boolean(), (a, b, evidence, s, food) => {
        const r = evaluateMix(a, b, { evidence, foodGradeRequired: food }, s);
        expect(r.mixingAllowed).toBe(r.verdict === "compatible");
      }),
    );
  });

  it("never allows a non-H1 candidate into a food-grade point, whatever the evidence", () => {
    fc.assert(
      fc.property(profile, profile, evidenceList, settings, (a, b, evidence, s) => {
        fc.pre(b.foodGrade !== "H1");
        expect(evaluateMix(a, b, { evidence, foodGradeRequired: true }, s).verdict).toBe("incompatible");
      }),
    );
  });

  it("adding an enabled chart never relaxes a verdict that was already incompatible", () => {
    fc.assert(
      fc.property(
        profile,
        profile,
        evidenceList,
        settings,
        fc.constantFrom(...CHART_IDS),
        (a, b, evidence, s, extra) => {
          const before = evaluateMix(a, b, { evidence }, s);
          fc.pre(before.verdict === "incompatible");
          const after = evaluateMix(a, b, { evidence }, { ...s, enabledCharts: [...s.enabledCharts, extra] });
          expect(after.verdict).toBe("incompatible");
        },
      ),
    );
  });

  it("adding an enabled chart never makes a verdict less strict once some chart covers the pair", () => {
    // "Not covered" (unknown) is where information is missing; a new chart may resolve it. Among covered pairs the
    // verdict can only stay or get stricter.
    fc.assert(
      fc.property(
        profile,
        profile,
        evidenceList,
        settings,
        fc.constantFrom(...CHART_IDS),
        (a, b, evidence, s, extra) => {
          fc.pre(
            thickenerVerdict(a.thickener, b.thickener, s.enabledCharts).charts.some(
              (c) => c.verdict !== null,
            ),
          );
          const before = evaluateMix(a, b, { evidence }, s);
          const after = evaluateMix(a, b, { evidence }, { ...s, enabledCharts: [...s.enabledCharts, extra] });
          expect(VERDICT_STRICTNESS[after.verdict]).toBeGreaterThanOrEqual(
            VERDICT_STRICTNESS[before.verdict],
          );
        },
      ),
      { numRuns: 500 },
    );
  });
});

describe("thickenerVerdict properties", () => {
  const thickener = fc.constantFrom(...THICKENERS);
  it("is order independent in the pair and in the enabled charts", () => {
    fc.assert(
      fc.property(thickener, thickener, fc.subarray(CHART_IDS), (a, b, ids) => {
        expect(thickenerVerdict(b, a, [...ids].reverse())).toEqual(thickenerVerdict(a, b, ids));
      }),
    );
  });

  it("a covered pair never gets less strict when a chart is added; an uncovered one is unknown", () => {
    fc.assert(
      fc.property(
        thickener,
        thickener,
        fc.subarray(CHART_IDS),
        fc.constantFrom(...CHART_IDS),
        (a, b, ids, extra) => {
          const before = thickenerVerdict(a, b, ids);
          const after = thickenerVerdict(a, b, [...ids, extra]);
          if (before.charts.every((c) => c.verdict === null)) expect(before.verdict).toBe("unknown");
          else
            expect(VERDICT_STRICTNESS[after.verdict]).toBeGreaterThanOrEqual(
              VERDICT_STRICTNESS[before.verdict],
            );
        },
      ),
    );
  });
});
