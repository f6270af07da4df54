import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { ratedViscosity, viscosityRatio } from "@/lib/domain/viscosity";

// ν1 = 45 000·n^−0.83·dm^−0.5 (n < 1000) and 4 500·n^−0.5·dm^−0.5 (n ≥ 1000): domain.md §7.1, attributed to
// ISO 281:2007 from memory, same coefficients in public code. Values below are derived from those formulas by hand.
const SRC = "derived from the ν1 formulas of domain.md §7.1 (ISO 281:2007, from memory)";

describe("ratedViscosity", () => {
  it.each([
    // 45000 × 500^−0.83 × 100^−0.5 = 45000 × 0.0057525 × 0.1 = 25.886
    { dm: 100, n: 500, nu1: 25.886 },
    // 45000 × 100^−0.83 × 200^−0.5 = 45000 × 0.021878 × 0.070711 = 69.614
    { dm: 200, n: 100, nu1: 69.614 },
    // 4500 × 3000^−0.5 × 50^−0.5 = 4500 × 0.018257 × 0.141421 = 11.619
    { dm: 50, n: 3000, nu1: 11.619 },
    // 4500 × 1500^−0.5 × 70^−0.5 = 4500 × 0.025820 × 0.119523 = 13.887
    { dm: 70, n: 1500, nu1: 13.887 },
    // 4500 × 1000^−0.5 × 100^−0.5 = 4500 × 0.031623 × 0.1 = 14.230 — n = 1000 uses the upper branch
    { dm: 100, n: 1000, nu1: 14.23 },
    // 45000 × 999.999^−0.83 × 0.1 = 14.562 — just below 1000 uses the lower branch
    { dm: 100, n: 999.999, nu1: 14.562 },
  ])(`dm = $dm mm, n = $n r/min → ν1 = $nu1 mm²/s (${SRC})`, ({ dm, n, nu1 }) => {
    expect(ratedViscosity({ meanDiameterMm: dm, speedRpm: n }).viscosity).toBeCloseTo(nu1, 2);
  });

  it("the branches jump by about 2.3 % at 1000 r/min, whatever dm (domain.md §7.1 notes 14.56 vs 14.23 at dm = 100)", () => {
    // lower / upper at n = 1000: (45000 × 1000^−0.83) / (4500 × 1000^−0.5) = 10 × 1000^−0.33 = 10^0.01 = 1.02329
    for (const dm of [20, 100, 500]) {
      const below = ratedViscosity({ meanDiameterMm: dm, speedRpm: 1000 - 1e-9 }).viscosity!;
      const at = ratedViscosity({ meanDiameterMm: dm, speedRpm: 1000 }).viscosity!;
      expect(below / at).toBeCloseTo(1.02329, 4);
    }
  });

  it.each([
    { n: 899, warned: false },
    { n: 900, warned: true },
    { n: 1000, warned: true },
    { n: 1100, warned: true },
    { n: 1101, warned: false },
  ])("n = $n r/min: branch-jump warning $warned (within 10 % of 1000 r/min, our choice)", ({ n, warned }) => {
    expect(ratedViscosity({ meanDiameterMm: 100, speedRpm: n }).warnings.length > 0).toBe(warned);
  });

  it("names the branch it used in its steps", () => {
    expect(ratedViscosity({ meanDiameterMm: 100, speedRpm: 500 }).steps[0]!.label).toMatch(/n < 1000/);
    expect(ratedViscosity({ meanDiameterMm: 100, speedRpm: 1000 }).steps[0]!.label).toMatch(/n ≥ 1000/);
  });

  it.each([
    { dm: 0, n: 1000 },
    { dm: 100, n: 0 },
    { dm: -5, n: 1000 },
    { dm: Number.NaN, n: 1000 },
  ])("dm = $dm, n = $n → null with a warning", ({ dm, n }) => {
    const r = ratedViscosity({ meanDiameterMm: dm, speedRpm: n });
    expect(r.viscosity).toBeNull();
    expect(r.warnings).toHaveLength(1);
  });

  it("a bigger or faster bearing never needs a thicker oil within a branch (property; both exponents negative)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5, max: 2000, noNaN: true }),
        fc.double({ min: 1, max: 100000, noNaN: true }),
        fc.double({ min: 1.001, max: 3, noNaN: true }),
        (dm, n, k) => {
          const base = ratedViscosity({ meanDiameterMm: dm, speedRpm: n }).viscosity!;
          expect(ratedViscosity({ meanDiameterMm: dm * k, speedRpm: n }).viscosity!).toBeLessThan(base);
          if (n >= 1000 || n * k < 1000)
            expect(ratedViscosity({ meanDiameterMm: dm, speedRpm: n * k }).viscosity!).toBeLessThan(base);
        },
      ),
    );
  });
});

describe("viscosityRatio κ = ν/ν1 (bands: skf.com κ page, domain.md §7.2)", () => {
  it.each([
    { v: 20, v1: 10, kappa: 2, warning: null, band: "1–4, usual design range" },
    { v: 10, v1: 10, kappa: 1, warning: null, band: "exactly 1: the minimum for separation" },
    { v: 40, v1: 10, kappa: 4, warning: null, band: "exactly 4" },
    { v: 50, v1: 10, kappa: 5, warning: /above 4/, band: "> 4: no further benefit" },
    { v: 8, v1: 10, kappa: 0.8, warning: /below 1.*EP\/AW/, band: "< 1: metal contact possible" },
    { v: 3, v1: 10, kappa: 0.3, warning: /below 0.4/, band: "< 0.4: EP needed for oil" },
    { v: 0.5, v1: 10, kappa: 0.05, warning: /below 0.1.*asperity/, band: "< 0.1: boundary" },
  ])("ν = $v, ν1 = $v1 → κ = $kappa ($band)", ({ v, v1, kappa, warning }) => {
    const r = viscosityRatio({ viscosity: v, ratedViscosity: v1 });
    expect(r.kappa).toBeCloseTo(kappa, 12);
    if (warning === null) expect(r.warnings).toEqual([]);
    else {
      expect(r.warnings).toHaveLength(1);
      expect(r.warnings[0]).toMatch(warning);
    }
  });

  it("chains with ν1: VG 68 base oil at 70 °C in a dm = 70 mm bearing at 1500 r/min", () => {
    // ν1 = 13.887 mm²/s (above); ν = 20 mm²/s assumed; κ = 20 / 13.887 = 1.440
    const nu1 = ratedViscosity({ meanDiameterMm: 70, speedRpm: 1500 }).viscosity!;
    expect(viscosityRatio({ viscosity: 20, ratedViscosity: nu1 }).kappa).toBeCloseTo(1.44, 2);
  });

  it.each([
    [0, 10],
    [10, 0],
    [Number.NaN, 10],
    [10, -1],
  ])("ν = %s, ν1 = %s → null with a warning", (v, v1) => {
    const r = viscosityRatio({ viscosity: v, ratedViscosity: v1 });
    expect(r.kappa).toBeNull();
    expect(r.warnings).toHaveLength(1);
  });

  it("κ × ν1 = ν (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 1e4, noNaN: true }),
        fc.double({ min: 0.01, max: 1e4, noNaN: true }),
        (v, v1) => {
          const k = viscosityRatio({ viscosity: v, ratedViscosity: v1 }).kappa!;
          expect(k * v1).toBeCloseTo(v, 6);
          expect(k > 0).toBe(true);
        },
      ),
    );
  });
});
