import { fefoOrder, isExpired } from "./fefo-order";
import { GRAMS_EPSILON, isPositive } from "./quantities";
import type { Lot, LotPick, PickLotsResult } from "./types";

/**
 * Decides which lots to take a quantity of grease from: first expiring, first out (see fefoOrder; the storage
 * guidance is FIFO, SOURCE_FIFO).
 *
 * - lots whose expiry is before `now` are never picked; those with stock are listed in `skippedExpired` (an
 *   expired lot is not automatically unusable — domain.md §10.2 says sample it — but it is not issued blindly);
 * - lots without an expiry date come after every dated lot; ties by receivedOn, then lotId;
 * - lots with no stock (zero, negative or not a number) are passed over;
 * - a request that is not a positive number of grams picks nothing and is not short.
 *
 * @returns `picks` in order, each > 0 g and at most the lot's stock, summing to `grams` − `shortGrams` (within 1 µg);
 *   `shortGrams` ≥ 0 is what the usable lots could not supply.
 */
export function pickLots(lots: readonly Lot[], grams: number, now: Date): PickLotsResult {
  const picks: LotPick[] = [];
  const skippedExpired: number[] = [];
  let remaining = isPositive(grams) ? grams : 0;
  for (const lot of fefoOrder(lots)) {
    if (!isPositive(lot.onHandGrams)) continue;
    if (isExpired(lot, now)) {
      skippedExpired.push(lot.lotId);
      continue;
    }
    if (remaining <= 0) continue;
    const take = Math.min(remaining, lot.onHandGrams);
    picks.push({ lotId: lot.lotId, grams: take });
    remaining -= take;
    // Floating-point leftovers (0.1 + 0.2 − 0.3) are not worth a pick from the next lot.
    if (remaining <= GRAMS_EPSILON) remaining = 0;
  }
  return { picks, shortGrams: remaining, skippedExpired };
}
