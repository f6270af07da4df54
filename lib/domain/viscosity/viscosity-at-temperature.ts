import { formatNumber } from "../units/format-number";
import type { CalcStep, ViscosityAtTemperatureInput, ViscosityResult } from "./types";

/** The published name of the method viscosityAtTemperature applies. */
export const VISCOSITY_TEMPERATURE_METHOD = "ASTM D341 viscosity–temperature relation (Walther equation)";

/** Kelvin offset. domain.md §7.3: 273 vs 273.15 moves results only in the 3rd–4th significant digit; 273.15 used. */
const KELVIN_OFFSET = 273.15;

/** Outside this range a warning says the line is extrapolated far from its 40 and 100 °C points. Our choice. */
const EXTRAPOLATION_RANGE_C = { min: -20, max: 150 } as const;

/** Below this viscosity D341-20 adds correction terms to ν + 0.7 (domain.md §7.3); they are omitted here. */
const LOW_VISCOSITY_LIMIT = 2;

function isPositiveFinite(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x) && x > 0;
}

const loglog = (v: number) => Math.log10(Math.log10(v + 0.7));

/**
 * Decides the kinematic viscosity of an oil (or a grease's base oil) at a temperature, from its viscosities at 40
 * and 100 °C.
 *
 * ASTM D341 (Walther): log10(log10(ν + 0.7)) = A − B·log10(T), T in kelvin (°C + 273.15), fitted through the two
 * points: B = [Z(ν40) − Z(ν100)] / [log10(373.15) − log10(313.15)], A = Z(ν40) + B·log10(313.15), then
 * ν(T) = 10^(10^(A − B·log10 T)) − 0.7 (domain.md §7.3; scribd "Viscosity vs Temperature Calculator",
 * technicaltoolboxes D341 wiki, olezol.com). D341-20's extra terms for viscosities below about 2 mm²/s are
 * omitted; the simple form is the one used for lubricants. The relation holds only where the oil is a
 * homogeneous liquid (between cloud point and initial boiling point), which is not checked.
 *
 * @returns `viscosity` in mm²/s (not rounded), or null with a warning when a viscosity is not a number above
 *   0.3 mm²/s (where the double logarithm is defined), when ν100 ≥ ν40 (an oil thins when heated), or when the
 *   temperature is not a number above −273.15 °C. Warns when extrapolating below −20 °C or above 150 °C and when
 *   an input or the result is below 2 mm²/s.
 */
export function viscosityAtTemperature(input: ViscosityAtTemperatureInput): ViscosityResult {
  const steps: CalcStep[] = [];
  const warnings: string[] = [];
  const done = (viscosity: number | null): ViscosityResult => ({
    viscosity,
    method: VISCOSITY_TEMPERATURE_METHOD,
    steps,
    warnings,
  });
  const { viscosity40: v40, viscosity100: v100, temperatureC } = input;

  if (!isPositiveFinite(v40) || !isPositiveFinite(v100) || v40 <= 0.3 || v100 <= 0.3) {
    warnings.push(
      `Both viscosities must be numbers above 0.3 mm²/s (got ${String(v40)} at 40 °C and ${String(v100)} at ` +
        "100 °C): outside the method's range.",
    );
    return done(null);
  }
  if (v100 >= v40) {
    warnings.push(
      `The viscosity at 100 °C (${formatNumber(v100, 2)} mm²/s) must be lower than at 40 °C ` +
        `(${formatNumber(v40, 2)} mm²/s): check the data sheet.`,
    );
    return done(null);
  }
  if (typeof temperatureC !== "number" || !Number.isFinite(temperatureC) || temperatureC <= -KELVIN_OFFSET) {
    warnings.push(`The temperature must be a number above −273.15 °C (got ${String(temperatureC)}).`);
    return done(null);
  }

  const t1 = 40 + KELVIN_OFFSET;
  const t2 = 100 + KELVIN_OFFSET;
  const t = temperatureC + KELVIN_OFFSET;
  const z1 = loglog(v40);
  const z2 = loglog(v100);
  const b = (z1 - z2) / (Math.log10(t2) - Math.log10(t1));
  const a = z1 + b * Math.log10(t1);
  const exponent = a - b * Math.log10(t);
  const viscosity = 10 ** (10 ** exponent) - 0.7;

  steps.push({
    label: "Z = log10(log10(ν + 0.7)) at 40 and 100 °C",
    value: `Z40 = log10(log10(${formatNumber(v40, 4)} + 0.7)) = ${formatNumber(z1, 6)}; Z100 = log10(log10(${formatNumber(v100, 4)} + 0.7)) = ${formatNumber(z2, 6)}`,
  });
  steps.push({
    label: "B = (Z40 − Z100) / (log10 373.15 K − log10 313.15 K)",
    value: `(${formatNumber(z1, 6)} − ${formatNumber(z2, 6)}) / (${formatNumber(Math.log10(t2), 6)} − ${formatNumber(Math.log10(t1), 6)}) = ${formatNumber(b, 6)}`,
  });
  steps.push({
    label: "A = Z40 + B·log10 313.15 K",
    value: `${formatNumber(z1, 6)} + ${formatNumber(b, 6)} × ${formatNumber(Math.log10(t1), 6)} = ${formatNumber(a, 6)}`,
  });
  steps.push({
    label: `ν at ${formatNumber(temperatureC, 2)} °C (${formatNumber(t, 2)} K) = 10^(10^(A − B·log10 T)) − 0.7`,
    value: `A − B·log10 T = ${formatNumber(a, 6)} − ${formatNumber(b, 6)} × ${formatNumber(Math.log10(t), 6)} = ${formatNumber(exponent, 6)}; 10^(10^${formatNumber(exponent, 6)}) − 0.7 = ${formatNumber(viscosity, 3)} mm²/s`,
  });

  if (temperatureC < EXTRAPOLATION_RANGE_C.min || temperatureC > EXTRAPOLATION_RANGE_C.max) {
    warnings.push(
      `${formatNumber(temperatureC, 1)} °C is far outside the 40–100 °C data points: the value is extrapolated and ` +
        "less reliable; near the oil's pour or cloud point the relation no longer holds.",
    );
  }
  if (v100 < LOW_VISCOSITY_LIMIT || !(viscosity >= LOW_VISCOSITY_LIMIT)) {
    warnings.push(
      "A viscosity below 2 mm²/s is involved: the standard's correction terms for very thin fluids are omitted, so " +
        "the value is approximate.",
    );
  }
  if (!Number.isFinite(viscosity) || viscosity <= 0) {
    warnings.push("The relation gives no usable viscosity at this temperature: outside the method's range.");
    return done(null);
  }
  return done(viscosity);
}
