import { describe, expect, it } from "vitest";
import { SPEED_FACTOR_LIMITS, speedFactor, type SpeedFactorInput } from "@/lib/domain/relubrication";

// Limits: SKF Rolling bearings catalogue Table 1, column C/P ≥ 15 (domain.md §6.4). Ball 500 000 and cylindrical
// non-locating 450 000 transcribed there; spherical 350 000 and tapered 100 000 from memory in the digest.
// n·dm values are derived by hand: dm = (d + D)/2, n·dm = n × dm.

describe("SPEED_FACTOR_LIMITS", () => {
  it.each([
    {
      type: "ball",
      limit: 500000,
      provenance: "transcribed",
      source: "SKF Table 1 deep groove ball, domain.md §6.4 [SRC]",
    },
    {
      type: "cylindrical_roller",
      limit: 450000,
      provenance: "transcribed",
      source: "SKF Table 1 non-locating, [SRC]",
    },
    {
      type: "spherical_roller",
      limit: 350000,
      provenance: "from_memory",
      source: "SKF Table 1 series 213/222/238/239, [MEM]",
    },
    {
      type: "tapered_roller",
      limit: 100000,
      provenance: "from_memory",
      source: "SKF Table 1 tapered, [MEM]",
    },
    { type: "needle_roller", limit: null, provenance: "not_in_table", source: "no row digested" },
  ] as const)("$type: $limit mm/min, $provenance ($source)", ({ type, limit, provenance }) => {
    expect(SPEED_FACTOR_LIMITS[type]).toMatchObject({ ndmLimit: limit, provenance });
  });
});

describe("speedFactor", () => {
  it.each([
    // dm = (50 + 90)/2 = 70 mm; 3000 × 70 = 210 000 ≤ 500 000, below 70 % (350 000)
    {
      input: { bearingType: "ball", boreMm: 50, outsideDiameterMm: 90, speedRpm: 3000 },
      ndm: 210000,
      limit: 500000,
      within: true,
      warnings: 0,
    },
    // 6000 × 70 = 420 000 ≤ 500 000 but above 70 % of it (350 000) → check warning
    {
      input: { bearingType: "ball", boreMm: 50, outsideDiameterMm: 90, speedRpm: 6000 },
      ndm: 420000,
      limit: 500000,
      within: true,
      warnings: 1,
    },
    // 7500 × 70 = 525 000 > 500 000
    {
      input: { bearingType: "ball", boreMm: 50, outsideDiameterMm: 90, speedRpm: 7500 },
      ndm: 525000,
      limit: 500000,
      within: false,
      warnings: 1,
    },
    // exactly at the limit: 500 000 ≤ 500 000 (within), but above 70 %
    {
      input: { bearingType: "ball", boreMm: 40, outsideDiameterMm: 60, speedRpm: 10000 },
      ndm: 500000,
      limit: 500000,
      within: true,
      warnings: 1,
    },
    // cylindrical: 6000 × 70 = 420 000 ≤ 450 000, above 315 000
    {
      input: { bearingType: "cylindrical_roller", boreMm: 50, outsideDiameterMm: 90, speedRpm: 6000 },
      ndm: 420000,
      limit: 450000,
      within: true,
      warnings: 1,
    },
    // tapered: 1500 × 70 = 105 000 > 100 000 (from memory)
    {
      input: { bearingType: "tapered_roller", boreMm: 50, outsideDiameterMm: 90, speedRpm: 1500 },
      ndm: 105000,
      limit: 100000,
      within: false,
      warnings: 1,
    },
    // spherical 22220: dm = (100 + 180)/2 = 140; 1000 × 140 = 140 000 ≤ 350 000
    {
      input: { bearingType: "spherical_roller", boreMm: 100, outsideDiameterMm: 180, speedRpm: 1000 },
      ndm: 140000,
      limit: 350000,
      within: true,
      warnings: 0,
    },
    // a stationary bearing: 0
    {
      input: { bearingType: "ball", boreMm: 50, outsideDiameterMm: 90, speedRpm: 0 },
      ndm: 0,
      limit: 500000,
      within: true,
      warnings: 0,
    },
  ] as { input: SpeedFactorInput; ndm: number; limit: number; within: boolean; warnings: number }[])(
    "$input.bearingType d=$input.boreMm D=$input.outsideDiameterMm n=$input.speedRpm → n·dm $ndm, limit $limit (derived; SKF Table 1)",
    ({ input, ndm, limit, within, warnings }) => {
      const r = speedFactor(input);
      expect(r.ndm).toBeCloseTo(ndm, 6);
      expect(r.limit).toBe(limit);
      expect(r.withinLimit).toBe(within);
      expect(r.warnings).toHaveLength(warnings);
    },
  );

  it("the 70 % warning repeats SKF's advice (skf.com 'Relubrication intervals', domain.md §6.4)", () => {
    const r = speedFactor({ bearingType: "ball", boreMm: 50, outsideDiameterMm: 90, speedRpm: 6000 });
    expect(r.warnings[0]).toMatch(
      /above 70 % of the limit \(350000 mm\/min\): check the operating temperature/,
    );
  });

  it("the grease's own lower limit binds: 420 000 > 400 000", () => {
    const r = speedFactor({
      bearingType: "ball",
      boreMm: 50,
      outsideDiameterMm: 90,
      speedRpm: 6000,
      greaseSpeedLimitNdm: 400000,
    });
    expect(r).toMatchObject({ ndm: 420000, limit: 400000, withinLimit: false });
    expect(r.warnings.join(" ")).toMatch(/above the grease's own limit of 400000 mm\/min/);
  });

  it("a grease limit above the type's does not raise the type's limit", () => {
    const r = speedFactor({
      bearingType: "ball",
      boreMm: 50,
      outsideDiameterMm: 90,
      speedRpm: 7500,
      greaseSpeedLimitNdm: 1000000,
    });
    expect(r).toMatchObject({ limit: 500000, withinLimit: false });
  });

  it("needle roller bearings: no type limit known → limit and withinLimit null, with a warning", () => {
    const r = speedFactor({
      bearingType: "needle_roller",
      boreMm: 30,
      outsideDiameterMm: 42,
      speedRpm: 2000,
    });
    expect(r).toMatchObject({ ndm: 72000, limit: null, withinLimit: null }); // (30 + 42)/2 = 36; 2000 × 36
    expect(r.warnings.join(" ")).toMatch(/No recommended n·dm limit is known for needle roller bearings/);
  });

  it("needle roller bearings with a grease limit: compared with it", () => {
    const r = speedFactor({
      bearingType: "needle_roller",
      boreMm: 30,
      outsideDiameterMm: 42,
      speedRpm: 2000,
      greaseSpeedLimitNdm: 300000,
    });
    expect(r).toMatchObject({ ndm: 72000, limit: 300000, withinLimit: true });
  });

  it.each([
    { boreMm: 50, outsideDiameterMm: 50, speedRpm: 1000, why: "D = d" },
    { boreMm: 50, outsideDiameterMm: 40, speedRpm: 1000, why: "D < d" },
    { boreMm: 0, outsideDiameterMm: 40, speedRpm: 1000, why: "zero bore" },
    { boreMm: 50, outsideDiameterMm: 90, speedRpm: -1, why: "negative speed" },
    { boreMm: 50, outsideDiameterMm: 90, speedRpm: Number.NaN, why: "NaN speed" },
  ])("$why → ndm null with a warning", (dims) => {
    const r = speedFactor({ bearingType: "ball", ...dims });
    expect(r).toMatchObject({ ndm: null, limit: null, withinLimit: null });
    expect(r.warnings).toHaveLength(1);
  });
});
