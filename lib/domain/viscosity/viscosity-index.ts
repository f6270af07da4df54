import { formatNumber } from "../units/format-number";
import type { CalcStep, ViscosityIndexInput, ViscosityIndexResult } from "./types";

/** The published name of the method viscosityIndex applies. */
export const VISCOSITY_INDEX_METHOD =
  "ASTM D2270 viscosity index from kinematic viscosities at 40 and 100 °C";

/**
 * L and H for ν100 = Y ≥ 70 mm²/s, mm²/s at 40 °C (domain.md §7.4, from the D2270 procedure as implemented in the
 * MIT-licensed chemicals library and tribology-abc.com): L = 0.8353·Y² + 14.67·Y − 216, H = 0.1684·Y² + 11.85·Y − 97.
 * Below 70 mm²/s D2270 takes L and H from its table, which is not carried here (ASTM content).
 */
export const D2270_HIGH_VISCOSITY_FORMULAS = {
  fromViscosity100: 70,
  l: [0.8353, 14.67, -216],
  h: [0.1684, 11.85, -97],
} as const;

/** D2270: VI is not defined for ν100 below 2 mm²/s. */
const MIN_VISCOSITY100 = 2;

/** Rounds to the nearest whole number, exact halves to the even neighbour (as D2270 rounds). */
function roundHalfEven(x: number): number {
  const floor = Math.floor(x);
  const diff = x - floor;
  if (Math.abs(diff - 0.5) < 1e-9) return floor % 2 === 0 ? floor : floor + 1;
  return Math.round(x);
}

const quadratic = ([a, b, c]: readonly [number, number, number], y: number) => a * y * y + b * y + c;

/**
 * Decides the viscosity index (VI) of an oil from its kinematic viscosities at 40 °C (U) and 100 °C (Y), per ASTM
 * D2270 (domain.md §7.4):
 * - L and H are the 40 °C viscosities of the VI 0 and VI 100 reference oils with the same Y: from
 *   D2270_HIGH_VISCOSITY_FORMULAS for Y ≥ 70 mm²/s; for 2 ≤ Y < 70 from the D2270 table, which this module does
 *   not carry — pass `referenceLH` read from a licensed copy, otherwise the result is null with the warning
 *   "needs the D2270 table";
 * - U ≥ H (VI ≤ 100): VI = 100·(L − U)/(L − H);
 * - U < H (VI > 100): N = (log10 H − log10 U)/log10 Y, VI = (10^N − 1)/0.00715 + 100.
 *
 * @returns `viscosityIndex` rounded to a whole number, halves to even (as D2270 reports it; the unrounded value is
 *   in the steps); null with a warning when a viscosity is not a positive number, Y ≥ U, Y < 2 mm²/s (VI not
 *   defined), the table values are needed and not given, or the given L and H are not numbers with L > H > 0.
 */
export function viscosityIndex(input: ViscosityIndexInput): ViscosityIndexResult {
  const steps: CalcStep[] = [];
  const warnings: string[] = [];
  const done = (vi: number | null): ViscosityIndexResult => ({
    viscosityIndex: vi,
    method: VISCOSITY_INDEX_METHOD,
    steps,
    warnings,
  });
  const { viscosity40: u, viscosity100: y } = input;
  const valid = (x: unknown): x is number => typeof x === "number" && Number.isFinite(x) && x > 0;
  if (!valid(u) || !valid(y)) {
    warnings.push(
      `Both viscosities must be positive numbers of mm²/s (got ${String(u)} at 40 °C, ${String(y)} at 100 °C).`,
    );
    return done(null);
  }
  if (y >= u) {
    warnings.push(
      `The viscosity at 100 °C (${formatNumber(y, 2)} mm²/s) must be lower than at 40 °C (${formatNumber(u, 2)} mm²/s): ` +
        "check the data sheet.",
    );
    return done(null);
  }
  if (y < MIN_VISCOSITY100) {
    warnings.push(`The viscosity index is not defined for a viscosity at 100 °C below 2 mm²/s (ASTM D2270).`);
    return done(null);
  }

  let l: number;
  let h: number;
  if (y >= D2270_HIGH_VISCOSITY_FORMULAS.fromViscosity100) {
    l = quadratic(D2270_HIGH_VISCOSITY_FORMULAS.l, y);
    h = quadratic(D2270_HIGH_VISCOSITY_FORMULAS.h, y);
    steps.push({
      label: "L = 0.8353·Y² + 14.67·Y − 216 (Y ≥ 70 mm²/s)",
      value: `0.8353 × ${formatNumber(y, 3)}² + 14.67 × ${formatNumber(y, 3)} − 216 = ${formatNumber(l, 3)} mm²/s`,
    });
    steps.push({
      label: "H = 0.1684·Y² + 11.85·Y − 97 (Y ≥ 70 mm²/s)",
      value: `0.1684 × ${formatNumber(y, 3)}² + 11.85 × ${formatNumber(y, 3)} − 97 = ${formatNumber(h, 3)} mm²/s`,
    });
    if (input.referenceLH) {
      warnings.push(
        "The L and H given were not used: from 70 mm²/s at 100 °C D2270 computes them by formula.",
      );
    }
  } else {
    const given = input.referenceLH;
    if (!given) {
      warnings.push(
        `For a viscosity at 100 °C below 70 mm²/s (here ${formatNumber(y, 2)} mm²/s) the viscosity index needs the ` +
          "D2270 table, which is not available here: no value computed.",
      );
      return done(null);
    }
    if (!valid(given.l) || !valid(given.h) || !(given.l > given.h)) {
      warnings.push(
        `The L and H given must be positive numbers with L > H (got L = ${String(given.l)}, H = ${String(given.h)}).`,
      );
      return done(null);
    }
    l = given.l;
    h = given.h;
    steps.push({
      label: "L and H from the D2270 table (given)",
      value: `L = ${formatNumber(l, 3)} mm²/s, H = ${formatNumber(h, 3)} mm²/s`,
    });
  }

  let vi: number;
  if (u >= h) {
    vi = (100 * (l - u)) / (l - h);
    steps.push({
      label: "U ≥ H, so VI = 100·(L − U)/(L − H)",
      value: `100 × (${formatNumber(l, 3)} − ${formatNumber(u, 3)}) / (${formatNumber(l, 3)} − ${formatNumber(h, 3)}) = ${formatNumber(vi, 3)}`,
    });
  } else {
    const n = (Math.log10(h) - Math.log10(u)) / Math.log10(y);
    vi = (10 ** n - 1) / 0.00715 + 100;
    steps.push({
      label: "U < H, so N = (log10 H − log10 U)/log10 Y",
      value: `(${formatNumber(Math.log10(h), 6)} − ${formatNumber(Math.log10(u), 6)}) / ${formatNumber(Math.log10(y), 6)} = ${formatNumber(n, 6)}`,
    });
    steps.push({
      label: "VI = (10^N − 1)/0.00715 + 100",
      value: `(${formatNumber(10 ** n, 6)} − 1) / 0.00715 + 100 = ${formatNumber(vi, 3)}`,
    });
  }
  const rounded = roundHalfEven(vi);
  steps.push({ label: "Rounded (nearest whole number, halves to even)", value: String(rounded) });
  return done(rounded);
}
