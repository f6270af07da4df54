/**
 * Rolling-bearing types the relubrication engine knows, with the names the interval formula's bearing-type
 * table uses (The Tribology Handbook §A20, Table 20.4). "ball" means radial (deep-groove type) ball bearings.
 * Full-complement and thrust bearings are not modelled.
 */
export const BEARING_TYPES = [
  "ball",
  "cylindrical_roller",
  "needle_roller",
  "spherical_roller",
  "tapered_roller",
] as const;
export type BearingType = (typeof BEARING_TYPES)[number];

/** An environment severity chosen by the user (contamination, moisture, vibration), mildest first. */
export type Level = "low" | "moderate" | "high" | "very_high";
export const LEVELS: readonly Level[] = ["low", "moderate", "high", "very_high"];

/** One line of a calculation, written so that a person can redo the arithmetic by hand, units included. */
export interface CalcStep {
  label: string;
  value: string;
}

/** A multiplier applied to an interval, with the table it comes from. */
export interface IntervalFactor {
  name: string;
  value: number;
  source: string;
}

/** What relubricationInterval needs to know about a lube point. Lengths in mm, speed in r/min, temperatures in °C. */
export interface RelubricationInput {
  bearingType: BearingType;
  /** Bore diameter d, mm. */
  boreMm: number;
  /** Outside diameter D, mm. Optional; when given, the speed factor n·dm is checked against the type's limit. */
  outsideDiameterMm?: number | null;
  /** Width B, mm. Not used by the interval (see replenishmentQuantity). */
  widthMm?: number | null;
  speedRpm: number;
  /** Bearing operating temperature, °C. Missing: the method's 70 °C base is assumed. */
  operatingTemperatureC?: number | null;
  verticalShaft?: boolean;
  /** Missing: "low" (the method's base condition). */
  contamination?: Level;
  /** Missing: "low". */
  moisture?: Level;
  /** Missing: "low". */
  vibration?: Level;
  /** The grease's upper temperature limit, °C: the temperature rule holds only up to it. */
  greaseMaxTemperatureC?: number | null;
}

export interface RelubricationOptions {
  /** Longest interval returned, hours. Default DEFAULT_INTERVAL_CAP_HOURS (30 000 h). */
  capHours?: number;
}

/** A relubrication interval in operating hours, or null when the method does not apply, with its working. */
export interface IntervalResult {
  /** Operating hours between relubrications, not rounded (round for display); null when the method does not apply. */
  intervalHours: number | null;
  method: string;
  steps: CalcStep[];
  warnings: string[];
  factors: IntervalFactor[];
}

/** A grease quantity per relubrication in grams, or null for unusable dimensions, with its working. */
export interface QuantityResult {
  quantityGrams: number | null;
  method: string;
  steps: CalcStep[];
  warnings: string[];
}

/** A grease quantity per relubrication in avoirdupois ounces, or null for unusable dimensions. */
export interface ImperialQuantityResult {
  quantityOunces: number | null;
  method: string;
  steps: CalcStep[];
  warnings: string[];
}

/** Where new grease enters the bearing: from the side, or through an annular groove and holes in a ring. */
export type ReplenishmentSide = "side" | "centre";

export interface QuantityInput {
  /** Outside diameter D, mm. */
  outsideDiameterMm: number;
  /** Width B, mm (for thrust bearings the total height H). */
  widthMm: number;
  /** Missing: "side". */
  replenishment?: ReplenishmentSide;
}

export interface ImperialQuantityInput {
  /** Outside diameter D, inches. */
  outsideDiameterIn: number;
  /** Width B, inches (for thrust bearings the total height H). */
  widthIn: number;
  /** Missing: "side". */
  replenishment?: ReplenishmentSide;
}

export interface GunStrokesResult {
  /** Whole strokes, at least 1; null for unusable inputs. */
  strokes: number | null;
  steps: CalcStep[];
  warnings: string[];
}

export interface SpeedFactorInput {
  bearingType: BearingType;
  boreMm: number;
  outsideDiameterMm: number;
  speedRpm: number;
  /** The grease maker's n·dm limit, mm/min, when the data sheet gives one. */
  greaseSpeedLimitNdm?: number | null;
}

export interface SpeedFactorResult {
  /** n·dm in mm/min (r/min × mm); null for unusable inputs. */
  ndm: number | null;
  /** The limit compared against: the lower of the bearing type's and the grease's, mm/min; null when neither is known. */
  limit: number | null;
  /** ndm ≤ limit; null when ndm or limit is null. */
  withinLimit: boolean | null;
  steps: CalcStep[];
  warnings: string[];
}

/** Whether a lube point needs grease: not yet, within the due window, or past its due time. */
export type DueState = "ok" | "due" | "overdue";
export const DUE_STATES: readonly DueState[] = ["ok", "due", "overdue"];

export interface NextDueInput {
  lastServicedAt: Date;
  /** Operating hours between relubrications. */
  intervalHours: number;
  /** Hours a day the machine runs, in (0, 24]. */
  runningHoursPerDay: number;
}

export interface DueStateInput {
  /** null: never serviced. */
  nextDueAt: Date | null;
  now: Date;
  /** How long before the due time a point shows as due, hours. Default 168 (7 days). */
  dueWindowHours?: number;
}
