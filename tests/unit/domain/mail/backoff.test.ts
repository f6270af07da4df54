import { describe, expect, it } from "vitest";
import { nextAttemptDelaySeconds } from "@/lib/domain/mail";

// Common practice for mail relays, no source: exponential backoff from 30 s, capped at one hour.
describe("nextAttemptDelaySeconds", () => {
  it.each([
    [0, 30],
    [1, 30],
    [2, 60],
    [3, 120],
    [7, 1920],
    [8, 3600],
    [20, 3600],
  ])("after %i attempt(s) waits %i s", (attempts, seconds) => {
    expect(nextAttemptDelaySeconds(attempts)).toBe(seconds);
  });
});
