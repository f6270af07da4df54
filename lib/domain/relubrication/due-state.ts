import type { DueState, DueStateInput } from "./types";

const MS_PER_HOUR = 3_600_000;

/** How long before its due time a point shows as due: 168 h (7 days). Common practice, no source. */
export const DEFAULT_DUE_WINDOW_HOURS = 168;

/**
 * Decides whether a lube point is ok, due or overdue at `now`.
 *
 * - never serviced (`nextDueAt` null) or an invalid due date → "due";
 * - now after nextDueAt → "overdue" (exactly at nextDueAt is still "due");
 * - now at or after nextDueAt − dueWindowHours → "due" (the window's first instant is "due");
 * - otherwise "ok".
 * A dueWindowHours that is negative or not a number is taken as the default 168 h.
 */
export function dueState(input: DueStateInput): DueState {
  const { nextDueAt, now } = input;
  if (nextDueAt === null) return "due";
  const due = nextDueAt.getTime();
  if (!Number.isFinite(due)) return "due";
  const w = input.dueWindowHours;
  const windowHours = w !== undefined && Number.isFinite(w) && w >= 0 ? w : DEFAULT_DUE_WINDOW_HOURS;
  const t = now.getTime();
  if (t > due) return "overdue";
  if (t >= due - windowHours * MS_PER_HOUR) return "due";
  return "ok";
}
