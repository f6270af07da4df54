import { SOURCE_SKF_TABLE_1 } from "./sources";
import type { BearingType } from "./types";

/** A bearing type's recommended n·dm limit for grease, mm/min, or null when no limit is known to us. */
export interface SpeedLimit {
  ndmLimit: number | null;
  /** The row of the published table the value is taken from. */
  row: string;
  provenance: "transcribed" | "from_memory" | "not_in_table";
  source: string;
}

/**
 * Recommended n·dm limits for grease lubrication by bearing type, column C/P ≥ 15 (light load; the load ratio is
 * not an input, so the highest column is used and heavier loads need lower limits).
 *
 * Source: SKF Rolling bearings catalogue, Table 1 (domain.md §6.4). Ball and cylindrical-roller rows transcribed;
 * for cylindrical roller bearings the non-locating row is used (a locating bearing's limit is 300 000). The
 * spherical and tapered rows are from memory in the digest and unverified: spherical uses series 213/222/238/239
 * (other series are lower). Needle roller bearings are not among the rows digested, so they have no limit here.
 */
export const SPEED_FACTOR_LIMITS: Readonly<Record<BearingType, SpeedLimit>> = {
  ball: {
    ndmLimit: 500_000,
    row: "deep groove ball bearings",
    provenance: "transcribed",
    source: SOURCE_SKF_TABLE_1,
  },
  cylindrical_roller: {
    ndmLimit: 450_000,
    row: "cylindrical roller bearings, non-locating",
    provenance: "transcribed",
    source: SOURCE_SKF_TABLE_1,
  },
  needle_roller: {
    ndmLimit: null,
    row: "needle roller bearings (no row in the table as digested)",
    provenance: "not_in_table",
    source: SOURCE_SKF_TABLE_1,
  },
  spherical_roller: {
    ndmLimit: 350_000,
    row: "spherical roller bearings, Fa/Fr ≤ e, dm ≤ 800 mm, series 213/222/238/239",
    provenance: "from_memory",
    source: `${SOURCE_SKF_TABLE_1} (row from memory, unverified)`,
  },
  tapered_roller: {
    ndmLimit: 100_000,
    row: "tapered roller bearings",
    provenance: "from_memory",
    source: `${SOURCE_SKF_TABLE_1} (row from memory, unverified)`,
  },
};

/**
 * Share of the limit above which SKF advises checking the operating temperature and the lubrication method
 * (skf.com "Relubrication intervals", domain.md §6.4).
 */
export const SPEED_FACTOR_CHECK_SHARE = 0.7;
