import type { CalcStep } from "../relubrication/types";

export type { CalcStep };

/** A kinematic viscosity in mm²/s (cSt), or null when the method does not apply, with its working. */
export interface ViscosityResult {
  viscosity: number | null;
  method: string;
  steps: CalcStep[];
  warnings: string[];
}

export interface ViscosityAtTemperatureInput {
  /** Kinematic viscosity at 40 °C, mm²/s. */
  viscosity40: number;
  /** Kinematic viscosity at 100 °C, mm²/s. */
  viscosity100: number;
  temperatureC: number;
}

export interface RatedViscosityInput {
  /** Bearing mean diameter dm = (d + D)/2, mm. */
  meanDiameterMm: number;
  speedRpm: number;
}

export interface ViscosityRatioInput {
  /** Actual operating viscosity ν (for grease: of the base oil, at the operating temperature), mm²/s. */
  viscosity: number;
  /** Rated viscosity ν1, mm²/s. */
  ratedViscosity: number;
}

/** κ = ν/ν1, or null for unusable inputs, with its working and guidance. */
export interface ViscosityRatioResult {
  kappa: number | null;
  steps: CalcStep[];
  warnings: string[];
}

export interface ViscosityIndexInput {
  /** Kinematic viscosity at 40 °C, mm²/s (D2270's U). */
  viscosity40: number;
  /** Kinematic viscosity at 100 °C, mm²/s (D2270's Y). */
  viscosity100: number;
  /**
   * L and H, mm²/s at 40 °C, read from the ASTM D2270 table at this ν100 (needed when 2 ≤ ν100 < 70 mm²/s), for a
   * caller that holds a licensed copy of the table. This module carries no table values.
   */
  referenceLH?: { l: number; h: number } | null;
}

/** Viscosity index rounded as D2270 rounds, or null when it cannot be computed here, with its working. */
export interface ViscosityIndexResult {
  viscosityIndex: number | null;
  method: string;
  steps: CalcStep[];
  warnings: string[];
}
