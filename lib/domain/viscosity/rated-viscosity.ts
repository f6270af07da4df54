import { formatNumber } from "../units/format-number";
import type { CalcStep, RatedViscosityInput, ViscosityResult } from "./types";

/** The published name of the method ratedViscosity applies. */
export const RATED_VISCOSITY_METHOD = "Rated viscosity ν1 per ISO 281:2007 (closed-form approximation)";

/**
 * The two speed branches of the ν1 approximation, n in r/min, dm in mm, ν1 in mm²/s (domain.md §7.1):
 * ν1 = 45 000·n^−0.83·dm^−0.5 for n < 1000 r/min and ν1 = 4 500·n^−0.5·dm^−0.5 for n ≥ 1000 r/min.
 * Attribution to ISO 281:2007 is from memory; the same coefficients appear in public code implementing
 * "ISO 281/SKF ν1" (not an authoritative source). The bearing maker's catalogue gives ν1 only as a diagram.
 * The branches do not meet: at 1000 r/min the lower branch is 10^0.01 ≈ 1.023 times the upper, whatever dm.
 */
export const RATED_VISCOSITY_BRANCHES = {
  branchSpeedRpm: 1000,
  low: { coefficient: 45_000, speedExponent: -0.83, diameterExponent: -0.5 },
  high: { coefficient: 4_500, speedExponent: -0.5, diameterExponent: -0.5 },
} as const;

/** Within this share of 1000 r/min a warning mentions the jump between the branches. Our choice. */
const NEAR_BRANCH_SHARE = 0.1;

/**
 * Decides the rated viscosity ν1, the lubricant viscosity a rolling bearing needs at its operating temperature for
 * an adequate film, from its mean diameter and speed (RATED_VISCOSITY_BRANCHES). For grease, compare ν1 with the
 * base oil's viscosity at the operating temperature (viscosityAtTemperature, then viscosityRatio).
 *
 * @returns `viscosity` = ν1 in mm²/s (not rounded), or null with a warning when dm or n is not a positive number.
 *   Between 900 and 1100 r/min a warning says the two branches differ by about 2 % there (the branch is chosen by
 *   n < 1000 vs n ≥ 1000).
 */
export function ratedViscosity(input: RatedViscosityInput): ViscosityResult {
  const steps: CalcStep[] = [];
  const warnings: string[] = [];
  const { meanDiameterMm: dm, speedRpm: n } = input;
  const valid = (x: number) => typeof x === "number" && Number.isFinite(x) && x > 0;
  if (!valid(dm) || !valid(n)) {
    warnings.push(
      `The mean diameter and the speed must be positive numbers (got dm = ${String(dm)} mm, n = ${String(n)} r/min): ` +
        "outside the method's range.",
    );
    return { viscosity: null, method: RATED_VISCOSITY_METHOD, steps, warnings };
  }
  const { branchSpeedRpm, low, high } = RATED_VISCOSITY_BRANCHES;
  const branch = n < branchSpeedRpm ? low : high;
  const viscosity = branch.coefficient * n ** branch.speedExponent * dm ** branch.diameterExponent;
  steps.push({
    label:
      n < branchSpeedRpm
        ? "Branch n < 1000 r/min: ν1 = 45000·n^−0.83·dm^−0.5"
        : "Branch n ≥ 1000 r/min: ν1 = 4500·n^−0.5·dm^−0.5",
    value:
      `${branch.coefficient} × ${formatNumber(n, 2)}^${branch.speedExponent} × ${formatNumber(dm, 2)}^−0.5 = ` +
      `${branch.coefficient} × ${formatNumber(n ** branch.speedExponent, 6)} × ${formatNumber(dm ** -0.5, 6)} = ` +
      `${formatNumber(viscosity, 3)} mm²/s`,
  });
  if (Math.abs(n - branchSpeedRpm) <= NEAR_BRANCH_SHARE * branchSpeedRpm) {
    warnings.push(
      "Near 1000 r/min the two branches of the ν1 approximation do not meet: at 1000 r/min the lower-speed formula " +
        "gives about 2.3 % more than the one used from 1000 r/min on.",
    );
  }
  return { viscosity, method: RATED_VISCOSITY_METHOD, steps, warnings };
}
