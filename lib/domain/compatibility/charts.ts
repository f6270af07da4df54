import { CHART_FIST_2_4 } from "./chart-fist-2-4";
import { CHART_TEN_TYPE } from "./chart-ten-type";
import { CHART_TWELVE_TYPE } from "./chart-twelve-type";
import type { ChartId, CompatibilityChart } from "./types";

/** Every thickener chart the engine knows, in the order they are reported. */
export const CHARTS: readonly CompatibilityChart[] = [CHART_FIST_2_4, CHART_TEN_TYPE, CHART_TWELVE_TYPE];

/**
 * Only fully transcribed charts are on by default (charts-verified.md §7.1): Chart A. Charts B and C can be
 * enabled by a lead who accepts their unverified cells.
 */
export const DEFAULT_ENABLED_CHARTS: readonly ChartId[] = CHARTS.filter(
  (c) => c.provenance === "transcribed",
).map((c) => c.id);
