import { describe, expect, it } from "vitest";
import type { BaseOilType, FoodGrade, NlgiGrade } from "@/lib/domain/catalogue";
import {
  CHARTS,
  DEFAULT_COMPATIBILITY_SETTINGS,
  evaluateMix,
  type CompatibilitySettings,
  type GreaseProfile,
  type MixResult,
  type PairEvidence,
  type Verdict,
} from "@/lib/domain/compatibility";

const ALL_CHARTS: CompatibilitySettings = {
  ...DEFAULT_COMPATIBILITY_SETTINGS,
  enabledCharts: CHARTS.map((c) => c.id),
};

/** A plain lithium-complex / mineral grease; every test overrides what it is about. */
function grease(overrides: Partial<GreaseProfile> = {}): GreaseProfile {
  return { thickener: "lithium_complex", baseOilType: "mineral", ...overrides };
}

function kinds(r: MixResult) {
  return r.reasons.map((x) => `${x.kind}:${x.verdict}${x.overridden ? ":overridden" : ""}`);
}

function evidence(overrides: Partial<PairEvidence>): PairEvidence {
  return {
    id: 1,
    productA: 1,
    productB: 2,
    kind: "lab_mixture_test",
    verdict: "compatible",
    title: "Mixture test report",
    ...overrides,
  };
}

describe("evaluateMix: the thickener pair", () => {
  it("words the chart verdict for a technician (FIST 2-4 Table 2: LiCx–PU = I)", () => {
    const r = evaluateMix(grease(), grease({ thickener: "polyurea" }));
    expect(r.verdict).toBe("incompatible");
    expect(r.mixingAllowed).toBe(false);
    expect(r.reasons[0]).toMatchObject({
      kind: "thickener",
      verdict: "incompatible",
      message: "Lithium complex and polyurea thickeners are incompatible according to FIST 2-4 Table 2.",
      source: expect.stringContaining("Table 2"),
    });
    expect(r.charts).toEqual([
      { chartId: "fist-2-4-table-2", source: expect.stringContaining("FIST"), verdict: "incompatible" },
    ]);
  });

  it("names each chart's verdict when they disagree (Li–AlCx: FIST B, farmoyl.com row I; charts-verified.md §6.2)", () => {
    const r = evaluateMix(
      grease({ thickener: "lithium" }),
      grease({ thickener: "aluminium_complex" }),
      {},
      ALL_CHARTS,
    );
    expect(r.verdict).toBe("incompatible");
    const m = r.reasons[0]!.message;
    expect(m).toMatch(/FIST 2-4 Table 2 says borderline/);
    expect(m).toMatch(/farmoyl\.com says incompatible/);
    expect(m).toMatch(/twelve-type chart \(cell from memory, unverified\) says incompatible/);
    expect(r.reasons[0]!.source).toMatch(/FIST.*farmoyl.*memory/);
    expect(r.charts.map((c) => c.verdict)).toEqual(["borderline", "incompatible", "incompatible"]);
  });

  it("blocks a pair no enabled chart covers and asks for evidence (calcium sulfonate not in FIST 2-4; domain.md §1.4)", () => {
    const r = evaluateMix(grease({ thickener: "calcium_sulfonate" }), grease());
    expect(r.verdict).toBe("unknown");
    expect(r.mixingAllowed).toBe(false);
    expect(r.reasons[0]!.message).toMatch(
      /no enabled chart covers this pair.*evidence for these two products/,
    );
  });

  it("adds the PTFE rule for PTFE-thickened greases (charts-verified.md §5, SKF sentence seen in part)", () => {
    const r = evaluateMix(grease({ thickener: "ptfe" }), grease(), {}, ALL_CHARTS);
    expect(r.verdict).toBe("unknown");
    expect(r.reasons[0]!.message).toMatch(/PTFE-thickened greases need a rule of their own/);
    expect(r.reasons[0]!.source).toMatch(/SKF.*seen only in part/);
  });

  it("uses Chart A only by default (charts-verified.md §7.1): Li–AlCx is borderline, not incompatible", () => {
    const r = evaluateMix(grease({ thickener: "lithium" }), grease({ thickener: "aluminium_complex" }));
    expect(r.verdict).toBe("borderline");
    expect(r.mixingAllowed).toBe(false);
  });

  it("two unnamed clay greases are borderline, as FIST 2-4 Table 2 prints Clay–Clay", () => {
    const r = evaluateMix(grease({ thickener: "clay" }), grease({ thickener: "clay" }));
    expect(kinds(r)).toEqual(["thickener:borderline", "base_oil:compatible"]);
    expect(r.reasons[0]!.message).toMatch(
      /^Two clay-thickened greases are borderline.*occasionally incompatible/,
    );
  });
});

describe("evaluateMix: the same product (lead engineer's rule 1)", () => {
  it.each([
    [7, 7],
    ["7", 7],
    ["G-12", "G-12"],
  ])("product %j in the bearing and %j added: always compatible, other checks skipped", (idA, idB) => {
    // Clay–Clay is borderline in FIST 2-4 and "other" base oil is unknown: both would block a different product.
    const r = evaluateMix(
      grease({ productId: idA, thickener: "clay", baseOilType: "other", nlgiGrade: "000" }),
      grease({ productId: idB, thickener: "clay", baseOilType: "other", nlgiGrade: "3" }),
    );
    expect(r).toMatchObject({ verdict: "compatible", mixingAllowed: true, charts: [] });
    expect(kinds(r)).toEqual(["same_product:compatible"]);
  });

  it("still applies the food-grade gate to the same product", () => {
    const g = grease({ productId: 3, foodGrade: "H2" });
    const r = evaluateMix(g, g, { foodGradeRequired: true });
    expect(r.verdict).toBe("incompatible");
    expect(kinds(r)).toEqual(["same_product:compatible", "food_grade:incompatible", "food_grade:borderline"]);
  });

  it("ignores evidence about a product with itself", () => {
    const g = grease({ productId: 3 });
    const r = evaluateMix(g, g, {
      evidence: [evidence({ productA: 3, productB: 3, verdict: "incompatible" })],
    });
    expect(r.verdict).toBe("compatible");
  });

  it.each([
    [null, null],
    [undefined, 1],
    [1, 2],
  ])("ids %j and %j are not the same product", (idA, idB) => {
    const r = evaluateMix(
      grease({ productId: idA, thickener: "clay" }),
      grease({ productId: idB, thickener: "clay" }),
    );
    expect(r.reasons.some((x) => x.kind === "same_product")).toBe(false);
    expect(r.verdict).toBe("borderline");
  });
});

describe("evaluateMix: base oil", () => {
  it.each([
    ["mineral", "pao", "compatible", "inner.su Table 1; ML #28867"],
    ["mineral", "pag", "incompatible", "inner.su Table 1; ML #28867"],
    ["ester", "pag", "borderline", "inner.su conditional; charts-verified.md §7.4"],
    ["silicone", "ester", "incompatible", "inner.su Table 1"],
    ["other", "mineral", "unknown", "not in any table"],
  ] as [BaseOilType, BaseOilType, Verdict, string][])(
    "LiCx greases on %s and %s base oil → %s (%s)",
    (...[a, b, expected]) => {
      const r = evaluateMix(grease({ baseOilType: a }), grease({ baseOilType: b }));
      expect(r.verdict).toBe(expected);
      expect(r.reasons.find((x) => x.kind === "base_oil")!.verdict).toBe(expected);
    },
  );
});

describe("evaluateMix: dilution thresholds (our settings, common practice, no source)", () => {
  it.each([
    [100, 200, "compatible", "ratio exactly 2.0 passes"],
    [100, 200.1, "borderline", "ratio just above 2.0"],
    [46, 220, "borderline", "VG 46 into VG 220, ratio 4.78"],
    [220, 46, "borderline", "either way round"],
    [150, 220, "compatible", "ratio 1.47, one ISO VG step"],
  ])("viscosity40 %s and %s mm²/s → %s (%s)", (a, b, expected) => {
    const r = evaluateMix(grease({ viscosity40: a }), grease({ viscosity40: b }));
    const reason = r.reasons.find((x) => x.kind === "viscosity")!;
    expect(reason.verdict).toBe(expected);
    expect(r.verdict).toBe(expected);
    expect(reason.message).toContain(`${a} and ${b} mm²/s`);
  });

  it("gives both values and the ratio in the message", () => {
    const r = evaluateMix(grease({ viscosity40: 220 }), grease({ viscosity40: 46 }));
    expect(r.reasons.find((x) => x.kind === "viscosity")!.message).toMatch(
      /220 and 46 mm²\/s at 40 °C, a ratio of 4\.78 \(limit 2\)/,
    );
  });

  it("follows a site's own viscosity limit", () => {
    const r = evaluateMix(
      grease({ viscosity40: 46 }),
      grease({ viscosity40: 220 }),
      {},
      { ...DEFAULT_COMPATIBILITY_SETTINGS, viscosityRatioLimit: 5 },
    );
    expect(r.verdict).toBe("compatible");
  });

  it.each([
    [null, 220],
    [undefined, 220],
    [0, 220],
  ])("no viscosity reason when one value is missing or invalid (%j, %j)", (a, b) => {
    const r = evaluateMix(grease({ viscosity40: a }), grease({ viscosity40: b }));
    expect(r.reasons.some((x) => x.kind === "viscosity")).toBe(false);
  });

  it.each([
    ["2", "3", "compatible", "1 step"],
    ["1", "3", "borderline", "2 steps"],
    ["2", "2.5", "compatible", "half a step"],
    ["1.5", "3", "borderline", "1.5 steps"],
    ["00", "0", "compatible", "1 step"],
    ["000", "0", "borderline", "2 steps"],
    ["0", "1", "compatible", "1 step across zero"],
  ] as [NlgiGrade, NlgiGrade, Verdict, string][])("NLGI %s and %s → %s (%s)", (a, b, expected) => {
    const r = evaluateMix(grease({ nlgiGrade: a }), grease({ nlgiGrade: b }));
    expect(r.reasons.find((x) => x.kind === "consistency")!.verdict).toBe(expected);
    expect(r.verdict).toBe(expected);
  });

  it("follows a site's own NLGI step limit", () => {
    const r = evaluateMix(
      grease({ nlgiGrade: "1" }),
      grease({ nlgiGrade: "3" }),
      {},
      { ...DEFAULT_COMPATIBILITY_SETTINGS, nlgiStepLimit: 2 },
    );
    expect(r.verdict).toBe("compatible");
  });

  it("gives no consistency reason when a grade is missing", () => {
    expect(
      evaluateMix(grease({ nlgiGrade: "2" }), grease()).reasons.some((x) => x.kind === "consistency"),
    ).toBe(false);
  });
});

describe("evaluateMix: food grade (charts-verified.md §5: a regulatory gate on top of the checks)", () => {
  it.each([
    [true, "H1", "H1", [], "compatible"],
    [true, "H1", "H2", ["food_grade:incompatible"], "incompatible"],
    [true, "H1", "none", ["food_grade:incompatible"], "incompatible"],
    [true, "H1", null, ["food_grade:incompatible"], "incompatible"],
    [true, "H2", "H1", ["food_grade:borderline"], "borderline"],
    [true, "none", "H3", ["food_grade:incompatible", "food_grade:borderline"], "incompatible"],
    [false, "none", "H2", [], "compatible"],
  ] as [boolean, FoodGrade | null, FoodGrade | null, string[], Verdict][])(
    "required=%s, in bearing %s, added %s → %j, %s",
    (required, inBearing, candidate, expectedReasons, verdict) => {
      const r = evaluateMix(grease({ foodGrade: inBearing }), grease({ foodGrade: candidate }), {
        foodGradeRequired: required,
      });
      expect(kinds(r).filter((k) => k.startsWith("food_grade"))).toEqual(expectedReasons);
      expect(r.verdict).toBe(verdict);
    },
  );

  it("says the point requires H1, and that a non-H1 grease in the point must be flushed", () => {
    const r = evaluateMix(
      grease({ name: "Old EP2", foodGrade: "none" }),
      grease({ name: "Mill grease", foodGrade: "H2" }),
      { foodGradeRequired: true },
    );
    const messages = r.reasons.filter((x) => x.kind === "food_grade").map((x) => x.message);
    expect(messages[0]).toMatch(/requires an H1.*Mill grease is rated H2, not H1/);
    expect(messages[1]).toMatch(/holds Old EP2.*flush/);
  });
});

describe("evaluateMix: solid additives (charts-verified.md §5: solids never upgrade a verdict; our rule)", () => {
  it.each([
    [["molybdenum_disulfide"], [], "borderline"],
    [["graphite"], ["molybdenum_disulfide"], "borderline"],
    [["graphite", "molybdenum_disulfide"], ["molybdenum_disulfide", "graphite", "graphite"], "compatible"],
  ])("%j and %j → %s", (a, b, expected) => {
    const r = evaluateMix(grease({ solidAdditives: a }), grease({ solidAdditives: b }));
    expect(r.reasons.find((x) => x.kind === "additives")!.verdict).toBe(expected);
    expect(r.verdict).toBe(expected);
  });

  it("names the solids", () => {
    const r = evaluateMix(
      grease({ solidAdditives: ["molybdenum_disulfide"] }),
      grease({ solidAdditives: ["graphite"] }),
    );
    expect(r.reasons.find((x) => x.kind === "additives")!.message).toMatch(
      /molybdenum disulphide \(MoS₂\).*graphite/,
    );
  });

  it("gives no additives reason when neither grease has solids", () => {
    expect(
      evaluateMix(grease(), grease({ solidAdditives: [] })).reasons.some((x) => x.kind === "additives"),
    ).toBe(false);
  });

  it("the same solids do not lift an incompatible thickener pair (FIST 2-4: LiCx–PU = I)", () => {
    const r = evaluateMix(
      grease({ solidAdditives: ["graphite"] }),
      grease({ thickener: "polyurea", solidAdditives: ["graphite"] }),
    );
    expect(r.verdict).toBe("incompatible");
  });
});

describe("evaluateMix: product-pair evidence overrides the chart both ways (domain.md §1.4 design consequence)", () => {
  it("a lab test saying compatible upgrades a chart's incompatible (LiCx–PU, FIST 2-4)", () => {
    const r = evaluateMix(
      grease({ productId: 1 }),
      grease({ productId: 2, thickener: "polyurea", viscosity40: 460 }),
      {
        evidence: [evidence({ documentName: "report-2291.pdf", title: "D6185 report 2291" })],
      },
    );
    expect(r.verdict).toBe("compatible");
    expect(r.mixingAllowed).toBe(true);
    expect(kinds(r)).toEqual([
      "thickener:incompatible:overridden",
      "base_oil:compatible:overridden",
      "evidence:compatible",
    ]);
    const e = r.reasons.at(-1)!;
    expect(e.message).toMatch(
      /A laboratory mixture test for these two products, "D6185 report 2291", rates them compatible/,
    );
    expect(e.source).toBe("D6185 report 2291 (report-2291.pdf)");
  });

  it("a supplier statement saying incompatible downgrades a chart's compatible (Li–LiCx, FIST 2-4)", () => {
    const r = evaluateMix(grease({ productId: "b", thickener: "lithium" }), grease({ productId: "a" }), {
      evidence: [
        evidence({
          productA: "a",
          productB: "b",
          kind: "supplier_statement",
          verdict: "incompatible",
          title: "Letter from supplier",
        }),
      ],
    });
    expect(r.verdict).toBe("incompatible");
    expect(r.reasons.at(-1)!.message).toMatch(/^A supplier statement/);
  });

  it("overrides base oil, dilution, consistency and additives too", () => {
    const r = evaluateMix(
      grease({
        productId: 1,
        baseOilType: "pag",
        viscosity40: 32,
        nlgiGrade: "000",
        solidAdditives: ["graphite"],
      }),
      grease({ productId: 2, viscosity40: 680, nlgiGrade: "3" }),
      { evidence: [evidence({})] },
    );
    expect(r.verdict).toBe("compatible");
    expect(r.reasons.filter((x) => x.kind !== "evidence").every((x) => x.overridden)).toBe(true);
  });

  it("takes the strictest of several records", () => {
    const r = evaluateMix(grease({ productId: 1 }), grease({ productId: 2 }), {
      evidence: [evidence({ id: 1 }), evidence({ id: 2, productA: 2, productB: 1, verdict: "borderline" })],
    });
    expect(r.verdict).toBe("borderline");
    expect(kinds(r).filter((k) => k.startsWith("evidence"))).toEqual([
      "evidence:compatible",
      "evidence:borderline",
    ]);
  });

  it("never overrides the food-grade gate", () => {
    const r = evaluateMix(
      grease({ productId: 1, foodGrade: "H1" }),
      grease({ productId: 2, foodGrade: "H2" }),
      {
        foodGradeRequired: true,
        evidence: [evidence({})],
      },
    );
    expect(r.verdict).toBe("incompatible");
    expect(r.reasons.find((x) => x.kind === "food_grade")!.overridden).toBeUndefined();
  });

  it.each([
    [1, 3, "evidence about another pair"],
    [null, 2, "no product id for the grease in the bearing"],
  ] as [number | null, number, string][])(
    "ignores evidence when the ids are %j and %j (%s)",
    (...[idA, idB]) => {
      const r = evaluateMix(grease({ productId: idA }), grease({ productId: idB, thickener: "polyurea" }), {
        evidence: [evidence({})],
      });
      expect(r.verdict).toBe("incompatible");
      expect(r.reasons.some((x) => x.overridden)).toBe(false);
    },
  );
});
