import type { Role } from "../permissions";
import type { SessionState, SessionTimeouts } from "./types";

/**
 * Idle and absolute session lifetimes per role. Shorter for the roles that change rules and users.
 * Source: OWASP Session Management Cheat Sheet (idle 15–30 min for low-risk apps, absolute 4–8 h for an
 * office day); the 12 h absolute limit for technicians covers a full shift (common practice, no source).
 */
export const SESSION_TIMEOUTS: Readonly<Record<Role, SessionTimeouts>> = {
  admin: { idleMinutes: 15, absoluteHours: 8 },
  lead: { idleMinutes: 15, absoluteHours: 8 },
  clerk: { idleMinutes: 30, absoluteHours: 10 },
  technician: { idleMinutes: 30, absoluteHours: 12 },
  auditor: { idleMinutes: 30, absoluteHours: 8 },
};

/** How often the last-seen time is written back, so every request does not write to the database. */
export const SESSION_TOUCH_INTERVAL_SECONDS = 60;

/**
 * Decides whether a session is still usable at `now`. The absolute limit counts from creation, the idle
 * limit from the last request that was seen. Exactly at a limit the session has expired.
 */
export function evaluateSession(input: {
  createdAt: Date;
  lastSeenAt: Date;
  now: Date;
  timeouts: SessionTimeouts;
}): SessionState {
  const { createdAt, lastSeenAt, now, timeouts } = input;
  if (now.getTime() - createdAt.getTime() >= timeouts.absoluteHours * 3_600_000) return "absolute_expired";
  if (now.getTime() - lastSeenAt.getTime() >= timeouts.idleMinutes * 60_000) return "idle_expired";
  return "active";
}

/** Whether the last-seen time is old enough to be written again. */
export function sessionNeedsTouch(lastSeenAt: Date, now: Date): boolean {
  return now.getTime() - lastSeenAt.getTime() >= SESSION_TOUCH_INTERVAL_SECONDS * 1000;
}

/** The moment the session ends if nothing else happens: the earlier of the idle and absolute limits. */
export function sessionExpiresAt(input: { createdAt: Date; lastSeenAt: Date; timeouts: SessionTimeouts }): Date {
  const absolute = input.createdAt.getTime() + input.timeouts.absoluteHours * 3_600_000;
  const idle = input.lastSeenAt.getTime() + input.timeouts.idleMinutes * 60_000;
  return new Date(Math.min(absolute, idle));
}
