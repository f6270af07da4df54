import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { NLGI_GRADES, type NlgiGrade } from "@/lib/domain/catalogue";
import {
  NLGI_PENETRATION_RANGES,
  nlgiGradeFromPenetration,
  nlgiGradeIndex,
  penetrationMatchesGrade,
} from "@/lib/domain/consistency";

// Retyped from reference/domain.md §3: ASTM D217 scope Note 1 (realservices.com), thelubricantstore.com,
// engineersedge.com. Worked penetration, 60 double strokes, 25 °C, 0.1 mm. Softest first.
const SOURCE = "ASTM D217 Note 1 via domain.md §3";
const BANDS: { grade: NlgiGrade; min: number; max: number }[] = [
  { grade: "000", min: 445, max: 475 },
  { grade: "00", min: 400, max: 430 },
  { grade: "0", min: 355, max: 385 },
  { grade: "1", min: 310, max: 340 },
  { grade: "2", min: 265, max: 295 },
  { grade: "3", min: 220, max: 250 },
  { grade: "4", min: 175, max: 205 },
  { grade: "5", min: 130, max: 160 },
  { grade: "6", min: 85, max: 115 },
];

// The 14-unit gaps between neighbouring bands (softer grade first), e.g. 296–309 between 1 and 2.
const GAPS = BANDS.slice(0, -1).map((softer, i) => {
  const harder = BANDS[i + 1]!;
  return { softer: softer.grade, harder: harder.grade, first: harder.max + 1, last: softer.min - 1 };
});

describe("NLGI_PENETRATION_RANGES", () => {
  it(`holds the nine D217 bands 000–6 (${SOURCE}; no grade 7)`, () => {
    expect(
      NLGI_PENETRATION_RANGES.map((r) => ({
        grade: r.nlgiGrade,
        min: r.workedPenetrationMin,
        max: r.workedPenetrationMax,
      })),
    ).toEqual(BANDS);
  });
});

describe("nlgiGradeFromPenetration", () => {
  it.each(BANDS)(
    `grade $grade: $min and $max (inclusive) are in the grade (${SOURCE})`,
    ({ grade, min, max }) => {
      expect(nlgiGradeFromPenetration(min)).toEqual({ nlgiGrade: grade });
      expect(nlgiGradeFromPenetration(max)).toEqual({ nlgiGrade: grade });
      expect(nlgiGradeFromPenetration((min + max) / 2)).toEqual({ nlgiGrade: grade });
    },
  );

  it.each(GAPS)(
    `$first–$last is between $softer and $harder, not forced into either (${SOURCE}; domain.md §3 note)`,
    ({ softer, harder, first, last }) => {
      for (const p of [first, (first + last) / 2, last]) {
        expect(nlgiGradeFromPenetration(p)).toEqual({ nlgiGrade: null, between: [softer, harder] });
      }
    },
  );

  it.each([
    [300, { nlgiGrade: null, between: ["1", "2"] }, "domain.md §3 example: 300 belongs to no grade"],
    [296, { nlgiGrade: null, between: ["1", "2"] }, "first value after grade 2"],
    [295.5, { nlgiGrade: null, between: ["1", "2"] }, "real numbers are not rounded into a band (our rule)"],
    [84, { nlgiGrade: null }, "below D217's 85–475 range"],
    [476, { nlgiGrade: null }, "above D217's 85–475 range"],
    [0, { nlgiGrade: null }, "below range"],
    [Number.NaN, { nlgiGrade: null }, "not a number"],
  ] as [number, object, string][])("%s → %j (%s)", (...[p, expected]) => {
    expect(nlgiGradeFromPenetration(p)).toEqual(expected);
  });

  it("never returns the half grades 1.5 and 2.5, which have no D217 band (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 600, noNaN: true }), (p) => {
        const r = nlgiGradeFromPenetration(p);
        expect(["1.5", "2.5"]).not.toContain(r.nlgiGrade);
        if (r.nlgiGrade !== null) expect(r.between).toBeUndefined();
        if (p < 85 || p > 475) expect(r).toEqual({ nlgiGrade: null });
      }),
    );
  });
});

describe("nlgiGradeIndex", () => {
  it.each([
    ["000", -2],
    ["00", -1],
    ["0", 0],
    ["1", 1],
    ["1.5", 1.5],
    ["2", 2],
    ["2.5", 2.5],
    ["3", 3],
    ["4", 4],
    ["5", 5],
    ["6", 6],
  ] as [NlgiGrade, number][])(
    "%s → %s (one step per grade; half grades halfway — our rule)",
    (grade, index) => {
      expect(nlgiGradeIndex(grade)).toBe(index);
    },
  );

  it.each(BANDS)(
    `grade $grade: the index is one step per 45 units of band midpoint (${SOURCE}, derived)`,
    ({ grade, min, max }) => {
      expect(nlgiGradeIndex(grade)).toBe((370 - (min + max) / 2) / 45);
    },
  );

  it("rises strictly along NLGI_GRADES, softest to hardest (catalogue vocabulary order)", () => {
    const indices = NLGI_GRADES.map(nlgiGradeIndex);
    for (let i = 1; i < indices.length; i++) expect(indices[i]!).toBeGreaterThan(indices[i - 1]!);
  });
});

describe("penetrationMatchesGrade", () => {
  it.each([
    ["2", 265, true, SOURCE],
    ["2", 295, true, SOURCE],
    ["2", 264, false, `${SOURCE}: gap`],
    ["2", 296, false, `${SOURCE}: gap`],
    ["2", 320, false, `${SOURCE}: grade 1`],
    ["000", 475, true, SOURCE],
    ["6", 85, true, SOURCE],
    ["6", 84, false, `${SOURCE}: outside D217`],
    ["1.5", 300, true, "half grade spans 265–340 (our rule, common practice, no source)"],
    ["1.5", 265, true, "half grade spans 265–340 (our rule)"],
    ["1.5", 340, true, "half grade spans 265–340 (our rule)"],
    ["1.5", 264, false, "half grade spans 265–340 (our rule)"],
    ["1.5", 341, false, "half grade spans 265–340 (our rule)"],
    ["2.5", 258, true, "half grade spans 220–295 (our rule)"],
    ["2.5", 219, false, "half grade spans 220–295 (our rule)"],
    ["2.5", 296, false, "half grade spans 220–295 (our rule)"],
    ["2", Number.NaN, false, "not a number"],
  ] as [NlgiGrade, number, boolean, string][])("grade %s with %s → %s (%s)", (...[grade, p, expected]) => {
    expect(penetrationMatchesGrade(grade, p)).toBe(expected);
  });

  it(`agrees with nlgiGradeFromPenetration for every whole penetration 0–600 (${SOURCE})`, () => {
    const fullGrades = BANDS.map((b) => b.grade);
    for (let p = 0; p <= 600; p++) {
      const { nlgiGrade } = nlgiGradeFromPenetration(p);
      expect(fullGrades.filter((g) => penetrationMatchesGrade(g, p))).toEqual(
        nlgiGrade === null ? [] : [nlgiGrade],
      );
    }
  });
});
