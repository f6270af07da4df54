import { describe, expect, it } from "vitest";
import { SESSION_TIMEOUTS, evaluateSession, sessionExpiresAt, sessionNeedsTouch } from "@/lib/domain/auth";

const created = new Date("2026-03-01T06:00:00Z");
const min = (m: number) => new Date(created.getTime() + m * 60_000);

describe("session lifetimes (OWASP Session Management Cheat Sheet: idle 15–30 min, absolute 4–8 h)", () => {
  it.each([
    ["admin", 15, 8],
    ["lead", 15, 8],
    ["clerk", 30, 10],
    ["technician", 30, 12],
    ["auditor", 30, 8],
  ] as const)("%s: idle %i min, absolute %i h", (role, idle, absolute) => {
    expect(SESSION_TIMEOUTS[role]).toEqual({ idleMinutes: idle, absoluteHours: absolute });
  });

  const lead = SESSION_TIMEOUTS.lead;
  it.each([
    ["fresh", min(0), min(1), "active"],
    ["one second before idle", min(0), new Date(min(15).getTime() - 1000), "active"],
    ["exactly at idle", min(0), min(15), "idle_expired"],
    ["idle plus one second", min(0), new Date(min(15).getTime() + 1000), "idle_expired"],
  ] as const)("idle: %s", (_label, lastSeen, now, expected) => {
    expect(evaluateSession({ createdAt: created, lastSeenAt: lastSeen, now, timeouts: lead })).toBe(expected);
  });

  it("ends at the absolute limit even with constant activity", () => {
    const now = min(8 * 60);
    expect(evaluateSession({ createdAt: created, lastSeenAt: new Date(now.getTime() - 1000), now, timeouts: lead })).toBe(
      "absolute_expired",
    );
    const before = min(8 * 60 - 1);
    expect(evaluateSession({ createdAt: created, lastSeenAt: before, now: before, timeouts: lead })).toBe("active");
  });

  it("writes last-seen back at most once a minute", () => {
    expect(sessionNeedsTouch(min(0), new Date(min(0).getTime() + 59_000))).toBe(false);
    expect(sessionNeedsTouch(min(0), min(1))).toBe(true);
  });

  it("expires at the earlier of the two limits", () => {
    expect(sessionExpiresAt({ createdAt: created, lastSeenAt: min(10), timeouts: lead })).toEqual(min(25));
    expect(sessionExpiresAt({ createdAt: created, lastSeenAt: min(8 * 60 - 5), timeouts: lead })).toEqual(min(8 * 60));
  });
});
