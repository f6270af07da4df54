import type { Role } from "../permissions";

export interface SessionTimeouts {
  idleMinutes: number;
  absoluteHours: number;
}

export type SessionState = "active" | "idle_expired" | "absolute_expired";

export interface ThrottleRule {
  /** Failures allowed inside the window before any delay applies. */
  freeFailures: number;
  /** Length of the counting window. */
  windowSeconds: number;
  /** Longest single delay. */
  maxDelaySeconds: number;
  /** At this many failures inside the window the key is locked until the window ends. */
  hardCapFailures: number;
}

export interface ThrottleState {
  failures: number;
  windowStartedAt: Date;
  lockedUntil: Date | null;
}

export type ThrottleDecision = { allowed: true } | { allowed: false; retryAfterSeconds: number };

export type { Role };
