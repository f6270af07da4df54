import { describe, expect, it } from "vitest";
import { ACCOUNT_THROTTLE, recordFailure, throttleDecision, type ThrottleState } from "@/lib/domain/auth";

const t0 = new Date("2026-03-01T08:00:00Z");
const at = (seconds: number) => new Date(t0.getTime() + seconds * 1000);

function failMany(n: number, spacingSeconds = 0): ThrottleState | null {
  let state: ThrottleState | null = null;
  for (let i = 0; i < n; i++) state = recordFailure(state, at(i * spacingSeconds), ACCOUNT_THROTTLE);
  return state;
}

describe("sign-in throttle (rules are ours; doubling delay as in the Lucia throttling guide)", () => {
  it("allows a first attempt", () => {
    expect(throttleDecision(null, t0)).toEqual({ allowed: true });
  });

  it.each([1, 2, 3, 4])("does not delay after %i failure(s)", (n) => {
    const state = failMany(n);
    expect(state?.lockedUntil).toBeNull();
    expect(throttleDecision(state, t0).allowed).toBe(true);
  });

  it.each([
    [5, 1],
    [6, 2],
    [7, 4],
    [8, 8],
    [9, 16],
  ])("after %i failures waits %i s", (n, seconds) => {
    const state = failMany(n)!;
    expect(state.lockedUntil!.getTime() - t0.getTime()).toBe(seconds * 1000);
    expect(throttleDecision(state, t0)).toEqual({ allowed: false, retryAfterSeconds: seconds });
    expect(throttleDecision(state, at(seconds)).allowed).toBe(true);
  });

  it("locks until the window ends at the hard cap", () => {
    const state = failMany(ACCOUNT_THROTTLE.hardCapFailures)!;
    expect(state.lockedUntil).toEqual(at(ACCOUNT_THROTTLE.windowSeconds));
    expect(throttleDecision(state, at(60))).toEqual({ allowed: false, retryAfterSeconds: ACCOUNT_THROTTLE.windowSeconds - 60 });
  });

  it("never delays longer than the maximum delay below the hard cap", () => {
    const rule = { ...ACCOUNT_THROTTLE, hardCapFailures: 1000 };
    let state: ThrottleState | null = null;
    for (let i = 0; i < 40; i++) state = recordFailure(state, t0, rule);
    expect(state!.lockedUntil!.getTime() - t0.getTime()).toBe(rule.maxDelaySeconds * 1000);
  });

  it("starts counting again once the window has passed", () => {
    const state = failMany(9);
    const later = recordFailure(state, at(ACCOUNT_THROTTLE.windowSeconds + 1), ACCOUNT_THROTTLE);
    expect(later.failures).toBe(1);
    expect(later.lockedUntil).toBeNull();
  });

  it("rounds a part second up so Retry-After is never 0", () => {
    const state: ThrottleState = { failures: 5, windowStartedAt: t0, lockedUntil: new Date(t0.getTime() + 200) };
    expect(throttleDecision(state, t0)).toEqual({ allowed: false, retryAfterSeconds: 1 });
  });
});
