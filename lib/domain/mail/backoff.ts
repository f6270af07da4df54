/**
 * Delay before the next delivery attempt of a mail: 30 s, doubling each time, at most one hour.
 * Common practice for mail relays, no source; the numbers are ours.
 */
export const OUTBOX_MAX_ATTEMPTS = 12;

export function nextAttemptDelaySeconds(attemptsSoFar: number): number {
  const n = Math.max(1, Math.floor(attemptsSoFar));
  return Math.min(30 * 2 ** (n - 1), 3600);
}
