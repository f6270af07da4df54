import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { DEFAULT_DUE_WINDOW_HOURS, dueState, nextDueAt } from "@/lib/domain/relubrication";

const H = 3_600_000;
const LAST = new Date("2025-01-01T00:00:00Z");

describe("nextDueAt (calendar days = intervalHours / runningHoursPerDay)", () => {
  it.each([
    // 2000 h / 8 h a day = 250 days; 1 Jan + 250 days = 8 Sep
    { interval: 2000, perDay: 8, due: "2025-09-08T00:00:00.000Z", source: "derived: 2000 / 8 = 250 days" },
    // 2000 h / 24 h a day = 83 days 8 h; 1 Jan + 83 days = 25 Mar
    {
      interval: 2000,
      perDay: 24,
      due: "2025-03-25T08:00:00.000Z",
      source: "derived: 2000 / 24 = 83.33 days",
    },
    { interval: 12, perDay: 8, due: "2025-01-02T12:00:00.000Z", source: "derived: 12 / 8 = 1.5 days" },
    {
      interval: 2000,
      perDay: 30,
      due: "2025-03-25T08:00:00.000Z",
      source: "more than 24 h a day is taken as 24 (guard)",
    },
    {
      interval: 2000,
      perDay: 0,
      due: "2025-03-25T08:00:00.000Z",
      source: "0 h a day is taken as 24 (guard: due sooner, not never)",
    },
    {
      interval: 2000,
      perDay: Number.NaN,
      due: "2025-03-25T08:00:00.000Z",
      source: "unknown running time is taken as 24 (guard)",
    },
    {
      interval: 0,
      perDay: 8,
      due: "2025-01-01T00:00:00.000Z",
      source: "no positive interval: due at once (guard)",
    },
    {
      interval: Number.NaN,
      perDay: 8,
      due: "2025-01-01T00:00:00.000Z",
      source: "no interval: due at once (guard)",
    },
  ])("$interval h at $perDay h/day → $due ($source)", ({ interval, perDay, due }) => {
    expect(
      nextDueAt({ lastServicedAt: LAST, intervalHours: interval, runningHoursPerDay: perDay }).toISOString(),
    ).toBe(due);
  });

  it("does not change the date it was given", () => {
    const last = new Date(LAST.getTime());
    nextDueAt({ lastServicedAt: last, intervalHours: 100, runningHoursPerDay: 8 });
    expect(last.toISOString()).toBe("2025-01-01T00:00:00.000Z");
  });

  it("never earlier than the last service, and more running hours a day never make it later (property)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 50000, noNaN: true }),
        fc.double({ min: 0.5, max: 24, noNaN: true }),
        fc.double({ min: 0, max: 24, noNaN: true }),
        (interval, perDay, extra) => {
          const a = nextDueAt({
            lastServicedAt: LAST,
            intervalHours: interval,
            runningHoursPerDay: perDay,
          }).getTime();
          const b = nextDueAt({
            lastServicedAt: LAST,
            intervalHours: interval,
            runningHoursPerDay: perDay + extra,
          }).getTime();
          expect(a).toBeGreaterThanOrEqual(LAST.getTime());
          expect(b).toBeLessThanOrEqual(a);
        },
      ),
    );
  });
});

describe("dueState (window 168 h by default, common practice, no source)", () => {
  const due = new Date("2025-03-25T08:00:00Z");
  const at = (offsetHours: number, ms = 0) => new Date(due.getTime() + offsetHours * H + ms);

  it("the default window is 7 days", () => {
    expect(DEFAULT_DUE_WINDOW_HOURS).toBe(168);
  });

  it.each([
    { now: at(0), window: undefined, state: "due", why: "exactly at the due time" },
    { now: at(-1), window: undefined, state: "due", why: "one hour before" },
    { now: at(1), window: undefined, state: "overdue", why: "one hour after" },
    { now: at(0, 1), window: undefined, state: "overdue", why: "one millisecond after" },
    { now: at(-168), window: undefined, state: "due", why: "exactly at the window's edge" },
    { now: at(-168, -1), window: undefined, state: "ok", why: "one millisecond before the window" },
    { now: at(-169), window: undefined, state: "ok", why: "one hour before the window" },
    { now: at(-1), window: 0, state: "ok", why: "no window: one hour before is ok" },
    { now: at(0), window: 0, state: "due", why: "no window: exactly at the due time is due" },
    { now: at(-24), window: 24, state: "due", why: "a 24 h window, at its edge" },
    { now: at(-25), window: 24, state: "ok", why: "a 24 h window, an hour before it" },
    { now: at(-100), window: -5, state: "due", why: "a negative window is taken as 168 h" },
  ])("$why → $state", ({ now, window, state }) => {
    expect(dueState({ nextDueAt: due, now, dueWindowHours: window })).toBe(state);
  });

  it("never serviced (no due date) → due", () => {
    expect(dueState({ nextDueAt: null, now: due })).toBe("due");
  });

  it("moves only forward, ok → due → overdue, as time passes (property)", () => {
    const rank = { ok: 0, due: 1, overdue: 2 } as const;
    fc.assert(
      fc.property(
        fc.integer({ min: -1000, max: 1000 }),
        fc.integer({ min: 0, max: 1000 }),
        fc.integer({ min: 0, max: 500 }),
        (t, dt, window) => {
          const a = dueState({ nextDueAt: due, now: at(t), dueWindowHours: window });
          const b = dueState({ nextDueAt: due, now: at(t + dt), dueWindowHours: window });
          expect(rank[b]).toBeGreaterThanOrEqual(rank[a]);
        },
      ),
    );
  });
});
