import { describe, expect, it } from "vitest";
import {
  DEFAULT_MIXTURE_TEST_SETTINGS,
  evaluateMixtureTest,
  type GreaseTestResult,
  type MixtureTestInput,
} from "@/lib/domain/compatibility";

// The rule (domain.md §2.3–2.4): each mixture property is compared with both neat greases; between them is
// dilution, not incompatibility (NLGI glossary); any failure → incompatible (D6185 scope). The numerical criteria
// are not public: the allowances are ours, so cases below name the allowance they assume.
const NEAT_A: GreaseTestResult = {
  droppingPointC: 190,
  workedPenetrationProlonged: 300,
  storagePenetrationChange: 10,
};
const NEAT_B: GreaseTestResult = {
  droppingPointC: 260,
  workedPenetrationProlonged: 340,
  storagePenetrationChange: -20,
};

function one(result: GreaseTestResult, neatA = NEAT_A, neatB = NEAT_B): MixtureTestInput {
  return { neatA, neatB, mixtures: [{ ratioA: 50, ratioB: 50, result }] };
}

describe("DEFAULT_MIXTURE_TEST_SETTINGS (our defaults, not the standard's)", () => {
  it("uses D566 repeatability for the dropping point (dgaequipment D566 §11: r = 7 °C) and D217 repeatability from memory", () => {
    expect(DEFAULT_MIXTURE_TEST_SETTINGS).toEqual({
      droppingPointAllowanceC: 7,
      workedPenetrationAllowance: 15,
      storagePenetrationChangeAllowance: 7,
    });
  });
});

describe("evaluateMixtureTest, one property at a time (default allowances 7 °C / 15 / 7)", () => {
  it.each([
    // dropping point: fail below lower neat − 7 = 183 °C; pass from higher neat − 7 = 253 °C
    [{ droppingPointC: 182.9 }, "dropping_point", "fail", "below 190 − 7 °C: worse than both neat greases"],
    [{ droppingPointC: 183 }, "dropping_point", "dilution", "exactly at the limit is not a failure"],
    [{ droppingPointC: 225 }, "dropping_point", "dilution", "between the neat values (NLGI: dilution)"],
    [{ droppingPointC: 253 }, "dropping_point", "pass", "within 7 °C of the better neat grease"],
    [{ droppingPointC: 280 }, "dropping_point", "pass", "above both"],
    // prolonged worked penetration: fail softer than 340 + 15 or harder than 300 − 15 (conservative two-sided)
    [
      { workedPenetrationProlonged: 356 },
      "worked_penetration",
      "fail",
      "softer than both neat greases beyond the allowance",
    ],
    [{ workedPenetrationProlonged: 355 }, "worked_penetration", "dilution", "at the soft limit"],
    [{ workedPenetrationProlonged: 330 }, "worked_penetration", "dilution", "between the neat values"],
    [
      { workedPenetrationProlonged: 310 },
      "worked_penetration",
      "pass",
      "within 15 of the firmer neat grease",
    ],
    [{ workedPenetrationProlonged: 285 }, "worked_penetration", "pass", "at the hard limit"],
    [
      { workedPenetrationProlonged: 284 },
      "worked_penetration",
      "fail",
      "harder than both beyond the allowance (D6185 §5.1: mixtures sometimes harden)",
    ],
    // storage: size of change; fail above max(|10|, |−20|) + 7 = 27
    [
      { storagePenetrationChange: 28 },
      "storage_stability",
      "fail",
      "changed more than both neat greases plus 7",
    ],
    [{ storagePenetrationChange: -28 }, "storage_stability", "fail", "hardening counts by its size"],
    [{ storagePenetrationChange: 27 }, "storage_stability", "dilution", "at the limit"],
    [{ storagePenetrationChange: 17 }, "storage_stability", "pass", "within 7 of the steadier neat grease"],
  ] as [GreaseTestResult, string, string, string][])("%j → %s %s (%s)", (result, property, outcome) => {
    const j = evaluateMixtureTest(one(result)).judgements.find((x) => x.property === property)!;
    expect(j.outcome).toBe(outcome);
    expect(j.ratio).toBe("50/50");
    expect(j.limit).toBeTruthy();
  });
});

describe("evaluateMixtureTest, the verdict", () => {
  it("three mixtures lying between the neat greases are dilution, not incompatibility → compatible (NLGI glossary, domain.md §2.3)", () => {
    const between = { droppingPointC: 220, workedPenetrationProlonged: 325, storagePenetrationChange: 18 };
    const r = evaluateMixtureTest({
      neatA: NEAT_A,
      neatB: NEAT_B,
      mixtures: [
        { ratioA: 10, ratioB: 90, result: between },
        { ratioA: 50, ratioB: 50, result: between },
        { ratioA: 90, ratioB: 10, result: between },
      ],
    });
    expect(r.verdict).toBe("compatible");
    expect(r.judgements).toHaveLength(9);
    expect(r.judgements.map((j) => j.ratio)).toEqual([
      "10/90",
      "10/90",
      "10/90",
      "50/50",
      "50/50",
      "50/50",
      "90/10",
      "90/10",
      "90/10",
    ]);
    expect(r.judgements.filter((j) => j.outcome === "dilution").length).toBeGreaterThan(0);
    expect(r.judgements.find((j) => j.outcome === "dilution")!.message).toMatch(
      /dilution, not incompatibility/,
    );
  });

  it("one failing property in one mixture makes the pair incompatible (D6185 decision logic, domain.md §2.1)", () => {
    const ok = { droppingPointC: 220, workedPenetrationProlonged: 325, storagePenetrationChange: 18 };
    const r = evaluateMixtureTest({
      neatA: NEAT_A,
      neatB: NEAT_B,
      mixtures: [
        { ratioA: 10, ratioB: 90, result: ok },
        { ratioA: 50, ratioB: 50, result: { ...ok, droppingPointC: 160 } },
        { ratioA: 90, ratioB: 10, result: ok },
      ],
    });
    expect(r.verdict).toBe("incompatible");
    const fail = r.judgements.find((j) => j.outcome === "fail")!;
    expect(fail).toMatchObject({ ratio: "50/50", property: "dropping_point" });
    expect(fail.message).toMatch(/160 °C is lower than both neat greases \(A 190 °C, B 260 °C\)/);
    expect(fail.limit).toMatch(/at least 183 °C/);
  });

  it("a fail counts even when other values are missing", () => {
    expect(evaluateMixtureTest(one({ droppingPointC: 150 })).verdict).toBe("incompatible");
  });

  it.each([
    [one({ droppingPointC: 220 }), "partly tested, no failure: cannot be called compatible"],
    [one({}), "nothing tested"],
    [{ neatA: NEAT_A, neatB: NEAT_B, mixtures: [] }, "no mixtures"],
    [
      one(
        { droppingPointC: 220, workedPenetrationProlonged: 325, storagePenetrationChange: 18 },
        { ...NEAT_A, droppingPointC: null },
      ),
      "neat A has no dropping point",
    ],
  ] as [MixtureTestInput, string][])("unknown when not everything was tested (%#: %s)", (input) => {
    expect(evaluateMixtureTest(input).verdict).toBe("unknown");
  });

  it("marks missing values not_tested and says which", () => {
    const j = evaluateMixtureTest(
      one({ droppingPointC: 220 }, { ...NEAT_A, storagePenetrationChange: undefined }),
    ).judgements;
    expect(j.map((x) => x.outcome)).toEqual(["dilution", "not_tested", "not_tested"]);
    expect(j[1]!.message).toMatch(/the 50\/50 mixture/);
    expect(j[2]!.message).toMatch(/neat grease A, the 50\/50 mixture/);
    expect(j[1]!.limit).toBeUndefined();
  });

  it("follows the site's allowances: a zero allowance fails a dropping point 1 °C below the lower neat grease", () => {
    const strict = {
      droppingPointAllowanceC: 0,
      workedPenetrationAllowance: 0,
      storagePenetrationChangeAllowance: 0,
    };
    expect(evaluateMixtureTest(one({ droppingPointC: 189 }), strict).verdict).toBe("incompatible");
    expect(evaluateMixtureTest(one({ droppingPointC: 189 })).judgements[0]!.outcome).toBe("dilution");
  });
});
