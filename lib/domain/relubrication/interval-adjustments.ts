import { SOURCE_NORIA_FACTORS, SOURCE_SKF_TABLE_2, SOURCE_SKF_TABLE_2_CONTAMINATION } from "./sources";
import type { Level } from "./types";

/** One row of an adjustment table: the multiplier for a level (null: no published value), and what it means. */
export interface LevelAdjustment {
  factor: number | null;
  condition: string;
  source: string;
}

/** A row of an adjustment table that has a multiplier for every level. */
export interface LevelFactor extends LevelAdjustment {
  factor: number;
}

/**
 * Interval multipliers for solid or liquid contamination, by our level scale.
 *
 * Source: SKF Rolling bearings catalogue Table 2, contamination levels 1–4 (charts-verified.md §4.3). Our
 * "low" = level 1 (little or no ingress), "moderate" = level 2, "high" = level 3, "very_high" = level 4.
 * Level 4's adjustment was cut off in the excerpt that was seen (the table says relubrication then serves mainly to
 * flush the bearing; domain.md §6.3 reads it as continuous relubrication), so it has no factor here and the
 * interval method does not apply. We did not take the 0.1 sometimes recalled for it: not seen in a source.
 */
export const CONTAMINATION_FACTORS: Readonly<Record<Level, LevelAdjustment>> = {
  low: {
    factor: 1,
    condition: "little or no ingress of contaminants",
    source: SOURCE_SKF_TABLE_2_CONTAMINATION,
  },
  moderate: {
    factor: 0.5,
    condition: "some contaminants may enter; extra relubrication needed",
    source: SOURCE_SKF_TABLE_2_CONTAMINATION,
  },
  high: {
    factor: 0.2,
    condition: "clear risk of ingress; relubricate to purge aged grease and dirt",
    source: SOURCE_SKF_TABLE_2_CONTAMINATION,
  },
  very_high: {
    factor: null,
    condition: "relubrication mainly flushes the bearing; adjustment not seen in the source",
    source: SOURCE_SKF_TABLE_2_CONTAMINATION,
  },
};

/**
 * Interval multipliers for moisture (Noria-style factor Fm), mapped onto our level scale one band per level:
 * "low" = relative humidity mostly below 80 %, "moderate" = 80–90 %, "high" = occasional condensation,
 * "very_high" = occasional water on the housing.
 *
 * Source: Machinery Lubrication ML #31524 factor set as in domain.md §6.2(a) (values from memory in the digest),
 * corroborated by one secondary copy (charts-verified.md §4.1). For water on the housing that copy prints 0.1 in
 * its lookup array and 0.2 in its description; we use 0.1, the more conservative, as charts-verified §4.1 and §7
 * advise.
 */
export const MOISTURE_FACTORS: Readonly<Record<Level, LevelFactor>> = {
  low: { factor: 1, condition: "relative humidity mostly below 80 %", source: SOURCE_NORIA_FACTORS },
  moderate: { factor: 0.7, condition: "relative humidity 80–90 %", source: SOURCE_NORIA_FACTORS },
  high: { factor: 0.4, condition: "occasional condensation", source: SOURCE_NORIA_FACTORS },
  very_high: {
    factor: 0.1,
    condition: "occasional water on the housing (one secondary copy prints 0.2; the lower value is used)",
    source: SOURCE_NORIA_FACTORS,
  },
};

/**
 * Interval multipliers for vibration (Noria-style factor Fv; peak velocity), mapped onto our level scale:
 * "low" = below 0.2 in/s (≈ 5 mm/s), "moderate" = 0.2–0.4 in/s, "high" = above 0.4 in/s (≈ 10 mm/s).
 * The table has three bands; "very_high" (heavy vibration or shock, e.g. vibrating screens) takes the top band's
 * 0.3 and relubricationInterval warns, because SKF Table 2 says such machines need a machine-specific, shorter
 * interval.
 *
 * Source: as MOISTURE_FACTORS (domain.md §6.2a, charts-verified.md §4.1).
 */
export const VIBRATION_FACTORS: Readonly<Record<Level, LevelFactor>> = {
  low: {
    factor: 1,
    condition: "peak vibration velocity below 0.2 in/s (5 mm/s)",
    source: SOURCE_NORIA_FACTORS,
  },
  moderate: {
    factor: 0.6,
    condition: "peak vibration velocity 0.2–0.4 in/s (5–10 mm/s)",
    source: SOURCE_NORIA_FACTORS,
  },
  high: {
    factor: 0.3,
    condition: "peak vibration velocity above 0.4 in/s (10 mm/s)",
    source: SOURCE_NORIA_FACTORS,
  },
  very_high: {
    factor: 0.3,
    condition: "heavy vibration or shock (beyond the top band; its factor used)",
    source: `${SOURCE_NORIA_FACTORS}; SKF Table 2 (reduce for high vibration, machine-specific)`,
  },
};

/**
 * The SKF Table 2 rules other than contamination (domain.md §6.3, SKF Rolling bearings catalogue Table 2):
 * base temperature 70 °C; halve per 15 °C above it; double at most once for 15 °C below it; halve for a vertical
 * shaft; start at half for a bore above 300 mm.
 */
export const SKF_TABLE_2_RULES = {
  baseTemperatureC: 70,
  halvingStepC: 15,
  verticalShaftFactor: 0.5,
  largeBoreMm: 300,
  largeBoreFactor: 0.5,
  source: SOURCE_SKF_TABLE_2,
} as const;

/**
 * Longest interval returned by default, hours. Source: SKF Rolling bearings catalogue Table 2 ("do not use
 * intervals above 30 000 h"), the table whose adjustments relubricationInterval applies. Other published caps:
 * 32 000 h in a plant standard using the same formula, 20 000 h in a bearing-unit maker's manual
 * (charts-verified.md §4.4); pass `capHours` to use one of them.
 */
export const DEFAULT_INTERVAL_CAP_HOURS = 30_000;
