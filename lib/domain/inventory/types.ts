import type { CalcStep } from "../relubrication/types";

export type { CalcStep };

/** One lube point as the demand forecast sees it: how much of which grease it takes, and how often. */
export interface DemandPoint {
  greaseId: number;
  /** Grease given at each relubrication, g. */
  quantityGrams: number;
  /** Operating hours between relubrications. */
  intervalHours: number;
  /** Hours a day the machine runs, in (0, 24]. */
  runningHoursPerDay: number;
  /** A sealed-for-life bearing takes no grease from the store. */
  sealedForLife?: boolean;
}

/** Grease that a planned changeover will purge through a point, on a given day. */
export interface PlannedPurge {
  greaseId: number;
  grams: number;
  on: Date;
}

export interface WeeklyDemandOptions {
  /** First instant of the forecast horizon; planned purges are counted only with it. */
  from: Date;
  /** Length of the horizon, weeks. Default DEFAULT_FORECAST_WEEKS (13). */
  weeks?: number;
}

/** The forecast consumption of one grease, g per week, with its working. */
export interface GreaseDemand {
  /** ≥ 0, never NaN, not rounded. */
  gramsPerWeek: number;
  steps: CalcStep[];
  /** Data that was skipped or replaced by an assumption. */
  warnings: string[];
}

export interface ReorderPointInput {
  gramsPerWeek: number;
  /** Days from placing an order to having the grease on the shelf. */
  leadTimeDays: number;
  /** Default DEFAULT_SAFETY_STOCK_WEEKS (2). */
  safetyStockWeeks?: number;
}

export interface ReorderPointResult {
  /** ≥ 0, never NaN, rounded to 0.001 g. */
  reorderPointGrams: number;
  steps: CalcStep[];
  warnings: string[];
}

export interface OrderQuantityInput {
  onHandGrams: number;
  /** Ordered and not yet received, g. Default 0. */
  onOrderGrams?: number;
  reorderPointGrams: number;
  gramsPerWeek: number;
  /** Weeks of demand to hold above the reorder point once the order is in. Default DEFAULT_COVER_WEEKS (8). */
  coverWeeks?: number;
  /** Nominal net content of one pack of this grease, g (e.g. 400 for a cartridge). */
  packGrams: number;
}

export interface OrderQuantityResult {
  /** Whole packs, ≥ 0. */
  packs: number;
  /** packs × packGrams. */
  grams: number;
  steps: CalcStep[];
  warnings: string[];
}

/** One received batch of one grease in the store. */
export interface Lot {
  lotId: number;
  onHandGrams: number;
  /** null: expiry unknown. */
  expiresOn: Date | null;
  receivedOn: Date;
}

export interface LotPick {
  lotId: number;
  grams: number;
}

export interface PickLotsResult {
  /** In the order the grease should be taken. Each pick > 0 g and at most the lot's stock. */
  picks: LotPick[];
  /** Grams the usable lots could not supply, ≥ 0. */
  shortGrams: number;
  /** Lots with stock that had expired at `now`, in first-expiring order. */
  skippedExpired: number[];
}

export interface LotAtRisk {
  lotId: number;
  /** Grams expected to be still in the lot on its expiry date, > 0. */
  gramsAtRisk: number;
  expiresOn: Date;
}

export interface ExpiryDateInput {
  manufacturedOn: Date | null;
  /** The expiry or best-before date printed on the pack. */
  labelExpiresOn: Date | null;
  /** The product's shelf life, whole months. */
  shelfLifeMonths: number | null;
  receivedOn: Date;
}

/** Where a lot's expiry date came from, most trustworthy first. */
export const EXPIRY_SOURCES = [
  "label",
  "shelf_life_from_manufacture",
  "shelf_life_from_receipt",
  "unknown",
] as const;
export type ExpirySource = (typeof EXPIRY_SOURCES)[number];

export interface ExpiryDateResult {
  /** null when source is "unknown". */
  expiresOn: Date | null;
  source: ExpirySource;
  steps: CalcStep[];
  warnings: string[];
}

/** How one low-stock check relates to the previous one. An alert goes out only on "starts". */
export type LowStockEpisode = "starts" | "continues" | "ends" | "none";
export const LOW_STOCK_EPISODES: readonly LowStockEpisode[] = ["starts", "continues", "ends", "none"];
