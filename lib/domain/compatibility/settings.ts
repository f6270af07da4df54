import { DEFAULT_ENABLED_CHARTS } from "./charts";
import type { CompatibilitySettings } from "./types";

/**
 * Site defaults. Only the fully transcribed chart is enabled. The dilution limits are our settings, common
 * practice, no source: a base-oil viscosity ratio above 2.0 (e.g. ISO VG 100 into VG 220) and more than one NLGI
 * grade step are flagged as borderline.
 */
export const DEFAULT_COMPATIBILITY_SETTINGS: CompatibilitySettings = {
  enabledCharts: DEFAULT_ENABLED_CHARTS,
  viscosityRatioLimit: 2.0,
  nlgiStepLimit: 1,
};
