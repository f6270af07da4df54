import type { ThrottleDecision, ThrottleRule, ThrottleState } from "./types";

/**
 * Sign-in throttling rules. Delays double after the free failures (1, 2, 4 … s, at most
 * `maxDelaySeconds`); at `hardCapFailures` inside the window the key waits for the window to end.
 * Source: OWASP ASVS 5.0 V6.1.1/6.3.1 (documented anti-automation); the doubling delay follows the
 * Lucia "Throttling" guide. The numbers are ours.
 */
export const ACCOUNT_THROTTLE: ThrottleRule = {
  freeFailures: 4,
  windowSeconds: 15 * 60,
  maxDelaySeconds: 300,
  hardCapFailures: 10,
};

/** Per client address: far looser, so one shared gateway address does not lock a whole plant out. */
export const ADDRESS_THROTTLE: ThrottleRule = {
  freeFailures: 30,
  windowSeconds: 15 * 60,
  maxDelaySeconds: 300,
  hardCapFailures: 100,
};

/** Decides whether a sign-in attempt may be checked now. */
export function throttleDecision(state: ThrottleState | null, now: Date): ThrottleDecision {
  if (!state?.lockedUntil) return { allowed: true };
  const waitMs = state.lockedUntil.getTime() - now.getTime();
  if (waitMs <= 0) return { allowed: true };
  return { allowed: false, retryAfterSeconds: Math.max(1, Math.ceil(waitMs / 1000)) };
}

/** The state after one more failed attempt at `now`. A window that has run out starts again. */
export function recordFailure(state: ThrottleState | null, now: Date, rule: ThrottleRule): ThrottleState {
  const windowOpen =
    state !== null && now.getTime() - state.windowStartedAt.getTime() < rule.windowSeconds * 1000;
  const failures = windowOpen ? state.failures + 1 : 1;
  const windowStartedAt = windowOpen ? state.windowStartedAt : now;

  let lockedUntil: Date | null = null;
  if (failures >= rule.hardCapFailures) {
    lockedUntil = new Date(windowStartedAt.getTime() + rule.windowSeconds * 1000);
  } else if (failures > rule.freeFailures) {
    const delaySeconds = Math.min(2 ** (failures - rule.freeFailures - 1), rule.maxDelaySeconds);
    lockedUntil = new Date(now.getTime() + delaySeconds * 1000);
  }
  if (lockedUntil && lockedUntil.getTime() <= now.getTime()) lockedUntil = null;
  return { failures, windowStartedAt, lockedUntil };
}
