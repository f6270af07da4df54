import { fefoOrder, isExpired } from "./fefo-order";
import { GRAMS_EPSILON, MS_PER_WEEK, isPositive } from "./quantities";
import type { Lot, LotAtRisk } from "./types";

/**
 * Decides which lots will still hold grease on their expiry date if the store keeps issuing at the forecast demand.
 *
 * Consumption is simulated from `now` at a steady gramsPerWeek, taking lots first expiring, first out (fefoOrder).
 * A lot is drawn from the moment the lots before it are used up until its own expiry; whatever is left then is at
 * risk and consumption moves on to the next lot. Lots already expired at `now` are wholly at risk and supply
 * nothing. Lots without an expiry date are never at risk (they come last and never expire).
 *
 * A gramsPerWeek that is zero, negative or not a number means no consumption: every dated lot is wholly at risk.
 *
 * @returns the lots with more than 1 µg at risk, in first-expiring order, each with the grams expected to be left
 *   at its expiry (> 0, at most the lot's stock).
 */
export function lotsAtRisk(lots: readonly Lot[], gramsPerWeek: number, now: Date): LotAtRisk[] {
  const rate = isPositive(gramsPerWeek) ? gramsPerWeek : 0;
  const atRisk: LotAtRisk[] = [];
  // Weeks from `now` at which the lots taken so far are used up.
  let weeksUsed = 0;
  for (const lot of fefoOrder(lots)) {
    // A lot holding 1 µg or less is empty for this purpose.
    if (!(lot.onHandGrams > GRAMS_EPSILON) || !Number.isFinite(lot.onHandGrams) || lot.expiresOn === null) continue;
    const expiresOn = lot.expiresOn;
    const expiryMs = expiresOn.getTime();
    if (!Number.isFinite(expiryMs)) continue;
    if (isExpired(lot, now)) {
      atRisk.push({ lotId: lot.lotId, gramsAtRisk: lot.onHandGrams, expiresOn });
      continue;
    }
    const weeksToExpiry = (expiryMs - now.getTime()) / MS_PER_WEEK;
    const drawWeeks = Math.max(0, weeksToExpiry - weeksUsed);
    const used = Math.min(lot.onHandGrams, rate * drawWeeks);
    const left = lot.onHandGrams - used;
    if (rate > 0) weeksUsed += used / rate;
    if (left > GRAMS_EPSILON) atRisk.push({ lotId: lot.lotId, gramsAtRisk: left, expiresOn });
  }
  return atRisk;
}
