import { formatNumber } from "../units/format-number";
import { SKF_TABLE_2_RULES } from "./interval-adjustments";
import type { CalcStep } from "./types";

/**
 * Decides the interval multiplier for a bearing's operating temperature under the SKF Table 2 rule (domain.md
 * §6.3): halve for every 15 °C above 70 °C; double for 15 °C below 70 °C, at most once.
 *
 * How the rule is read (the catalogue does not say; domain.md §6.3 asks for a stated choice):
 * - Above 70 °C, continuously: factor = 0.5^((T − 70)/15). It equals the stepwise reading at 85, 100, 115 °C…
 *   (0.5, 0.25, 0.125) and avoids a two-fold jump for a one-degree change of a temperature reading. Between the
 *   steps it lies between the two stepwise readings (per full 15 °C reached, which would not shorten at all up
 *   to 84.9 °C, and per 15 °C started, which would halve at 70.1 °C).
 * - Below 70 °C, stepwise: factor 2 only at T ≤ 55 °C (a full 15 °C below), 1 between 55 and 70 °C, never more
 *   than 2 however cold. Lengthening an interval is the risky direction, so it is granted only when the
 *   condition is fully met.
 *
 * The catalogue forbids the doubling for full-complement and thrust roller bearings; those are not among our
 * bearing types, so the doubling always applies here.
 *
 * @param temperatureC operating temperature of the bearing, °C (finite).
 * @returns the factor (always > 0 for a finite temperature) and one step showing the arithmetic.
 */
export function temperatureFactor(temperatureC: number): { factor: number; step: CalcStep } {
  const { baseTemperatureC: base, halvingStepC: span } = SKF_TABLE_2_RULES;
  const t = formatNumber(temperatureC, 1);
  if (temperatureC > base) {
    const exponent = (temperatureC - base) / span;
    const factor = 0.5 ** exponent;
    return {
      factor,
      step: {
        label: `Temperature factor at ${t} °C (halve per 15 °C above 70 °C, continuous)`,
        value: `0.5^((${t} − 70) / 15) = 0.5^${formatNumber(exponent, 4)} = ${formatNumber(factor, 4)}`,
      },
    };
  }
  if (temperatureC <= base - span) {
    return {
      factor: 2,
      step: {
        label: `Temperature factor at ${t} °C (double once at 15 °C or more below 70 °C)`,
        value: `${t} °C ≤ 55 °C → 2`,
      },
    };
  }
  return {
    factor: 1,
    step: {
      label: `Temperature factor at ${t} °C (no change from 55 to 70 °C)`,
      value: `55 °C < ${t} °C ≤ 70 °C → 1`,
    },
  };
}
