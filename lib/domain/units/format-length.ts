import { mmToInch } from "./convert";
import { formatFixed, formatNumber } from "./format-number";
import type { UnitSystem } from "./types";

/**
 * Writes a length given in millimetres for display in the chosen unit system.
 *
 * Rounding (our choice, common practice, no source): metric to 0.1 mm with a trailing ".0" dropped
 * ("25.4 mm", "50 mm"), enough for catalogue bearing dimensions, which are whole or half millimetres; imperial
 * always to two decimals of an inch ("1.00 in", "1.97 in"), i.e. ±0.005 in ≈ ±0.13 mm.
 *
 * @param mm length in millimetres.
 * @returns e.g. "25.4 mm" or "1.00 in"; "—" (em dash) for a value that is not a finite number.
 */
export function formatLength(mm: number, system: UnitSystem): string {
  if (!Number.isFinite(mm)) return "—";
  if (system === "imperial") return `${formatFixed(mmToInch(mm), 2)} in`;
  return `${formatNumber(mm, 1)} mm`;
}
