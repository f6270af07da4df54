import { isValidDate } from "./quantities";
import type { Lot } from "./types";

/** Expiry as a number for sorting: an unknown or invalid expiry sorts after every dated lot. */
function expiryKey(lot: Lot): number {
  return lot.expiresOn !== null && isValidDate(lot.expiresOn)
    ? lot.expiresOn.getTime()
    : Number.POSITIVE_INFINITY;
}

function receivedKey(lot: Lot): number {
  return isValidDate(lot.receivedOn) ? lot.receivedOn.getTime() : Number.POSITIVE_INFINITY;
}

/**
 * The lots in the order stock should be taken: earliest expiry first, lots without a (valid) expiry after every
 * dated lot; ties by receipt date (first in, first out), then by lotId, then by input position. FIFO is the
 * storage guidance (SOURCE_FIFO); ordering by expiry first is common practice, no source. Returns a new array.
 */
export function fefoOrder(lots: readonly Lot[]): Lot[] {
  return lots
    .map((lot, index) => ({ lot, index }))
    .sort(
      (a, b) =>
        compare(expiryKey(a.lot), expiryKey(b.lot)) ||
        compare(receivedKey(a.lot), receivedKey(b.lot)) ||
        compare(a.lot.lotId, b.lot.lotId) ||
        a.index - b.index,
    )
    .map((x) => x.lot);
}

function compare(a: number, b: number): number {
  if (a === b) return 0;
  return a < b ? -1 : 1;
}

/** True when the lot has a valid expiry date before `now` (expiring exactly at `now` is not yet expired). */
export function isExpired(lot: Lot, now: Date): boolean {
  return isExpiredOn(lot.expiresOn, now);
}

/** The same rule for a bare expiry date (null: no date, never expired). */
export function isExpiredOn(expiresOn: Date | null, now: Date): boolean {
  return expiresOn !== null && isValidDate(expiresOn) && expiresOn.getTime() < now.getTime();
}
