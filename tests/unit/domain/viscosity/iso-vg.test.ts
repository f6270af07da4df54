import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ISO_VG_GRADES, isoViscosityGrade, viscosityMatchesIsoVg } from "@/lib/domain/viscosity";

// Retyped from reference/domain.md §4 (ISO 3448 via mitrovichlubrificanti.it, scribd "Viscosity classification for
// lubricant oil", lubesolut.com; 20 grades ±10 % per ASTM D2422 §4). VG 2200 and 3200: from memory.
const TABLE: { isoVg: number; min: number; mid: number; max: number; source: string }[] = [
  { isoVg: 2, min: 1.98, mid: 2.2, max: 2.42, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 3, min: 2.88, mid: 3.2, max: 3.52, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 5, min: 4.14, mid: 4.6, max: 5.06, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 7, min: 6.12, mid: 6.8, max: 7.48, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 10, min: 9.0, mid: 10, max: 11.0, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 15, min: 13.5, mid: 15, max: 16.5, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 22, min: 19.8, mid: 22, max: 24.2, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 32, min: 28.8, mid: 32, max: 35.2, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 46, min: 41.4, mid: 46, max: 50.6, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 68, min: 61.2, mid: 68, max: 74.8, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 100, min: 90, mid: 100, max: 110, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 150, min: 135, mid: 150, max: 165, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 220, min: 198, mid: 220, max: 242, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 320, min: 288, mid: 320, max: 352, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 460, min: 414, mid: 460, max: 506, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 680, min: 612, mid: 680, max: 748, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 1000, min: 900, mid: 1000, max: 1100, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 1500, min: 1350, mid: 1500, max: 1650, source: "ISO 3448 table (domain.md §4)" },
  { isoVg: 2200, min: 1980, mid: 2200, max: 2420, source: "from memory (±10 % rule, D2422 '20 grades')" },
  { isoVg: 3200, min: 2880, mid: 3200, max: 3520, source: "from memory (±10 % rule, D2422 '20 grades')" },
];

describe("ISO_VG_GRADES", () => {
  it("has the 20 grades of ASTM D2422 §4, in order", () => {
    expect(ISO_VG_GRADES.map((g) => g.isoVg)).toEqual(TABLE.map((r) => r.isoVg));
  });

  it.each(TABLE)("VG $isoVg: limits are midpoint ±10 % ($source; D2422 §4)", ({ isoVg, mid }) => {
    const band = ISO_VG_GRADES.find((g) => g.isoVg === isoVg)!;
    expect(band.viscosity40Midpoint).toBe(mid);
    expect(band.viscosity40Min).toBeCloseTo(mid * 0.9, 9);
    expect(band.viscosity40Max).toBeCloseTo(mid * 1.1, 9);
  });

  it.each([
    [2200, "from_memory"],
    [3200, "from_memory"],
    [1500, "transcribed"],
  ])("VG %s is tagged %s (domain.md §4: VG 2200 and 3200 not seen in a source)", (isoVg, provenance) => {
    expect(ISO_VG_GRADES.find((g) => g.isoVg === isoVg)!.provenance).toBe(provenance);
  });
});

describe("isoViscosityGrade", () => {
  it.each(TABLE)(
    "VG $isoVg: $min and $max (inclusive) and the midpoint are in the grade ($source)",
    ({ isoVg, min, mid, max }) => {
      expect(isoViscosityGrade(min)).toBe(isoVg);
      expect(isoViscosityGrade(mid)).toBe(isoVg);
      expect(isoViscosityGrade(max)).toBe(isoVg);
    },
  );

  it.each(TABLE)(
    "VG $isoVg: 1 % below $min and 1 % above $max fall in a gap → null ($source)",
    ({ min, max }) => {
      expect(isoViscosityGrade(min * 0.99)).toBeNull();
      expect(isoViscosityGrade(max * 1.01)).toBeNull();
    },
  );

  it.each([
    { v: 55, why: "between VG 46 (≤ 50.6) and VG 68 (≥ 61.2), domain.md §4 example" },
    { v: 50.61, why: "just above VG 46" },
    { v: 61.19, why: "just below VG 68" },
    { v: 12, why: "between VG 10 and VG 15" },
    { v: 1.97, why: "below VG 2" },
    { v: 3520.01, why: "above VG 3200" },
    { v: 0, why: "not a viscosity" },
    { v: -46, why: "not a viscosity" },
    { v: Number.NaN, why: "not a number" },
    { v: Number.POSITIVE_INFINITY, why: "not finite" },
  ])("$v mm²/s → null ($why)", ({ v }) => {
    expect(isoViscosityGrade(v)).toBeNull();
  });

  it("any viscosity it classifies matches that grade, and no other (property, ISO 3448 bands do not overlap)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 4000, noNaN: true }), (v) => {
        const grade = isoViscosityGrade(v);
        const matching = ISO_VG_GRADES.filter((g) => viscosityMatchesIsoVg(g.isoVg, v)).map((g) => g.isoVg);
        expect(matching).toEqual(grade === null ? [] : [grade]);
      }),
    );
  });
});

describe("viscosityMatchesIsoVg", () => {
  it.each([
    { grade: 46, v: 46, expected: true, why: "midpoint" },
    { grade: 46, v: 41.4, expected: true, why: "lower limit, inclusive" },
    { grade: 46, v: 50.6, expected: true, why: "upper limit, inclusive" },
    { grade: 46, v: 41.3, expected: false, why: "below VG 46" },
    { grade: 46, v: 68, expected: false, why: "a VG 68 oil" },
    { grade: 220, v: 150, expected: false, why: "a VG 150 oil declared VG 220" },
    { grade: 47, v: 46, expected: false, why: "47 is not an ISO VG number" },
    { grade: 46, v: Number.NaN, expected: false, why: "not a number" },
  ])("VG $grade with $v mm²/s → $expected ($why; ISO 3448 via domain.md §4)", ({ grade, v, expected }) => {
    expect(viscosityMatchesIsoVg(grade, v)).toBe(expected);
  });
});
