import { describe, expect, it } from "vitest";
import { viscosityIndex } from "@/lib/domain/viscosity";

// ASTM D2270 procedure as in domain.md §7.4. The L/H rows used here are the few fixture rows the digest quotes
// ("values as in the chemicals library, which cites D2270"); the engine itself carries no table values.
const ROWS = "D2270 L/H fixture rows, domain.md §7.4";

describe("viscosityIndex with L and H from the D2270 table (given by the caller)", () => {
  it.each([
    {
      u: 73.3,
      y: 8.86,
      // interpolated between the 8.8 and 8.9 rows: L = 118.5 + 0.6 × (120.9 − 118.5) = 119.94,
      // H = 68.79 + 0.6 × (69.94 − 68.79) = 69.48; VI = 100 × (119.94 − 73.3)/(119.94 − 69.48) = 92.43 → 92
      lh: { l: 119.94, h: 69.48 },
      vi: 92,
      source: `chemicals library docstring example (domain.md §7.4): 73.3 / 8.86 → VI 92; ${ROWS}`,
    },
    {
      u: 68,
      y: 8.8,
      // U < H: N = (log 68.79 − log 68)/log 8.8 = 0.005312; VI = (10^N − 1)/0.00715 + 100 = 101.72 → 102
      lh: { l: 118.5, h: 68.79 },
      vi: 102,
      source: `olezol.com / tribology-abc.com example (domain.md §7.4): 68 / 8.8 → VI 102; ${ROWS}`,
    },
    {
      u: 100,
      y: 10,
      // 100 × (147.7 − 100)/(147.7 − 82.87) = 73.58 → 74
      lh: { l: 147.7, h: 82.87 },
      vi: 74,
      source: `derived from the D2270 formula with the Y = 10.0 row; ${ROWS}`,
    },
    {
      u: 82.87,
      y: 10,
      // U = H: VI = 100 exactly, both branches agree
      lh: { l: 147.7, h: 82.87 },
      vi: 100,
      source: `derived: U = H gives 100; ${ROWS}`,
    },
  ])("U = $u, Y = $y → VI $vi ($source)", ({ u, y, lh, vi }) => {
    const r = viscosityIndex({ viscosity40: u, viscosity100: y, referenceLH: lh });
    expect(r.viscosityIndex).toBe(vi);
    expect(r.warnings).toEqual([]);
    expect(r.method).toMatch(/D2270/);
  });

  it("rounds halves to even, as D2270 does: an exact 92.5 reports 92", () => {
    // Choose U so that 100·(L − U)/(L − H) = 92.5 with L = 200, H = 100: U = 200 − 92.5 = 107.5
    expect(
      viscosityIndex({ viscosity40: 107.5, viscosity100: 10, referenceLH: { l: 200, h: 100 } })
        .viscosityIndex,
    ).toBe(92);
    // and 93.5 reports 94
    expect(
      viscosityIndex({ viscosity40: 106.5, viscosity100: 10, referenceLH: { l: 200, h: 100 } })
        .viscosityIndex,
    ).toBe(94);
  });
});

describe("viscosityIndex for Y ≥ 70 mm²/s (formulas for L and H, domain.md §7.4)", () => {
  it.each([
    // L = 0.8353 × 4900 + 14.67 × 70 − 216 = 4903.87; H = 0.1684 × 4900 + 11.85 × 70 − 97 = 1557.66
    // U < H: N = (log 1557.66 − log 700)/log 70 = 0.18827; VI = (10^N − 1)/0.00715 + 100 = 175.90 → 176
    { u: 700, y: 70, l: 4903.87, vi: 176 },
    // L = 0.8353 × 6400 + 14.67 × 80 − 216 = 6303.52; H = 0.1684 × 6400 + 11.85 × 80 − 97 = 1928.76
    // U > H: VI = 100 × (6303.52 − 3000)/(6303.52 − 1928.76) = 75.51 → 76
    { u: 3000, y: 80, l: 6303.52, vi: 76 },
    // L = 9604, H = 2772; N = (log 2772 − log 1500)/log 100 = 0.13333; VI = 150.27 → 150
    { u: 1500, y: 100, l: 9604, vi: 150 },
  ])("U = $u, Y = $y → L = $l, VI $vi (derived from the D2270 formulas by hand)", ({ u, y, l, vi }) => {
    const r = viscosityIndex({ viscosity40: u, viscosity100: y });
    expect(r.viscosityIndex).toBe(vi);
    expect(r.steps[0]!.value).toMatch(new RegExp(`= ${l} mm²/s$`));
  });

  it("ignores L and H given for Y ≥ 70, with a warning", () => {
    const r = viscosityIndex({ viscosity40: 700, viscosity100: 70, referenceLH: { l: 1, h: 0.5 } });
    expect(r.viscosityIndex).toBe(176);
    expect(r.warnings).toHaveLength(1);
  });
});

describe("viscosityIndex: what it cannot compute → null with a warning", () => {
  it.each([
    {
      input: { viscosity40: 46, viscosity100: 6.8 },
      message: /needs the D2270 table/,
      why: "2 ≤ Y < 70 without L and H",
    },
    {
      input: { viscosity40: 460, viscosity100: 69.9 },
      message: /needs the D2270 table/,
      why: "just below 70",
    },
    {
      input: { viscosity40: 5, viscosity100: 1.8 },
      message: /not defined.*below 2 mm²\/s/,
      why: "Y < 2 (D2270)",
    },
    { input: { viscosity40: 10, viscosity100: 10 }, message: /must be lower/, why: "Y = U" },
    { input: { viscosity40: 0, viscosity100: 5 }, message: /positive numbers/, why: "zero" },
    { input: { viscosity40: 46, viscosity100: Number.NaN }, message: /positive numbers/, why: "NaN" },
    {
      input: { viscosity40: 46, viscosity100: 6.8, referenceLH: { l: 40, h: 60 } },
      message: /L > H/,
      why: "L below H",
    },
  ])("$why", ({ input, message }) => {
    const r = viscosityIndex(input);
    expect(r.viscosityIndex).toBeNull();
    expect(r.warnings).toHaveLength(1);
    expect(r.warnings[0]).toMatch(message);
  });
});
