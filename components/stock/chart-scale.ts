import { formatNumber } from "@/lib/domain/units/format-number";

export interface ChartScale {
  /** The axis end, ≥ the largest value, in the values' unit. */
  max: number;
  /** Evenly spaced tick values from 0 to `max`. */
  ticks: number[];
}

const STEPS = [1, 2, 2.5, 5, 10];

/**
 * An axis from 0 to a round number at or above `maxValue` (within floating-point rounding), with at most
 * `maxTicks` intervals of 1, 2, 2.5 or 5 × 10ⁿ. A value that is zero, negative or not finite gives the axis 0–1.
 */
export function niceScale(maxValue: number, maxTicks = 5): ChartScale {
  const intervals = Number.isFinite(maxTicks) && maxTicks >= 1 ? Math.floor(maxTicks) : 5;
  const top = Number.isFinite(maxValue) && maxValue > 0 ? maxValue : 1;
  const raw = top / intervals;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  // The small factor keeps 0.3 / 3 = 0.09999999999999999 from skipping the step of 0.1.
  const step = STEPS.map((s) => s * magnitude).find((s) => s >= raw * (1 - 1e-9))!;
  const count = Math.ceil(top / step - 1e-9);
  const ticks = Array.from({ length: count + 1 }, (_, i) => Number((i * step).toPrecision(12)));
  return { max: ticks.at(-1)!, ticks };
}

/**
 * How far an axis must reach: every value of `always` (reorder points: the marker must be on the chart) and
 * every value of `values` up to `outlierFactor` × the median of the positive ones. Larger values — a drum of
 * gear grease among cartridges — are left out, to be drawn cut at the axis end, so they do not squash the rest.
 * 0 when nothing is positive.
 */
export function axisReach(
  values: readonly number[],
  always: readonly number[] = [],
  outlierFactor = 4,
): number {
  const positive = values.filter((v) => Number.isFinite(v) && v > 0).sort((a, b) => a - b);
  const mid = Math.floor(positive.length / 2);
  const median =
    positive.length === 0
      ? 0
      : positive.length % 2
        ? positive[mid]!
        : (positive[mid - 1]! + positive[mid]!) / 2;
  const limit = median * outlierFactor;
  const kept = positive.filter((v) => v <= limit);
  return Math.max(0, ...kept, ...always.filter((v) => Number.isFinite(v)));
}

/** Where `value` sits on an axis from 0 to `max`, in percent, held within 0–100. */
export function percentOf(value: number, max: number): number {
  if (!(max > 0) || !Number.isFinite(value)) return 0;
  return Math.min(100, Math.max(0, (value / max) * 100));
}

/** Grams written as kilograms: two decimals below 1 kg, one below 100 kg, none above ("0.35 kg", "12.4 kg"). */
export function kg(grams: number): string {
  const value = grams / 1000;
  const abs = Math.abs(value);
  return `${formatNumber(value, abs < 1 ? 2 : abs < 100 ? 1 : 0)} kg`;
}

export interface MassAxis {
  /** The axis end, in grams. */
  maxGrams: number;
  /** The ticks in grams, each with its label in the axis unit. */
  ticks: { grams: number; label: string }[];
  unit: "g" | "kg";
}

/** A nice axis for masses up to `maxGrams`: in kilograms when it reaches 1 kg, in grams below. */
export function massAxis(maxGrams: number, maxTicks = 5): MassAxis {
  const scale = niceScale(maxGrams, maxTicks);
  const unit = scale.max >= 1000 ? "kg" : "g";
  return {
    maxGrams: scale.max,
    ticks: scale.ticks.map((grams) => ({
      grams,
      label: formatNumber(unit === "kg" ? grams / 1000 : grams, 3),
    })),
    unit,
  };
}

/** A mass for a reader: grams below 1 kg ("490 g", "2.5 g"), else kilograms as in `kg` ("1.6 kg"). */
export function mass(grams: number): string {
  if (!Number.isFinite(grams)) return kg(grams);
  const abs = Math.abs(grams);
  return abs < 999.5 ? `${formatNumber(grams, abs < 10 ? 1 : 0)} g` : kg(grams);
}

/** "3 Nov" for "2025-11-03" (UTC), short enough for an axis label. */
export function shortDay(isoDay: string): string {
  const d = new Date(`${isoDay}T00:00:00Z`);
  return Number.isFinite(d.getTime())
    ? d.toLocaleDateString("en-GB", { day: "numeric", month: "short", timeZone: "UTC" })
    : isoDay;
}
