import { celsiusToFahrenheit } from "./convert";
import { formatNumber } from "./format-number";
import type { UnitSystem } from "./types";

/**
 * Writes a temperature given in degrees Celsius for display in the chosen unit system, rounded to whole degrees
 * (half away from zero at exact halves; our choice, common practice, no source — bearing and grease temperatures
 * are not known better than a degree). "-0" is written "0".
 *
 * @param celsius temperature in °C.
 * @returns e.g. "70 °C" or "158 °F"; "—" (em dash) for a value that is not a finite number.
 */
export function formatTemperature(celsius: number, system: UnitSystem): string {
  if (!Number.isFinite(celsius)) return "—";
  if (system === "imperial") return `${formatNumber(celsiusToFahrenheit(celsius), 0)} °F`;
  return `${formatNumber(celsius, 0)} °C`;
}
