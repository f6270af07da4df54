import type { LowStockEpisode } from "./types";

/**
 * Decides what one low-stock check means for alerts, from the previous check's state and this one's, so that a
 * grease that stays low raises one alert per episode, not one per check. Common practice, no source.
 *
 * not low → low: "starts" (send the alert); low → low: "continues"; low → not low: "ends"; not low → not low:
 * "none". Only "starts" sends an alert.
 */
export function lowStockEpisode(input: { wasLow: boolean; isLow: boolean }): LowStockEpisode {
  if (input.isLow) return input.wasLow ? "continues" : "starts";
  return input.wasLow ? "ends" : "none";
}
