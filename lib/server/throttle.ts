import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import {
  ACCOUNT_THROTTLE,
  ADDRESS_THROTTLE,
  recordFailure,
  throttleDecision,
  type ThrottleDecision,
  type ThrottleRule,
  type ThrottleState,
} from "@/lib/domain/auth";
import type { RowDataPacket } from "mysql2";
import { getSequelize } from "./db";
import { sessionStatement } from "./mysql-pool";

export interface ThrottleKey {
  key: string;
  rule: ThrottleRule;
}

export function signInThrottleKeys(email: string, address: string): ThrottleKey[] {
  return [
    { key: `account:${email.trim().toLowerCase()}`.slice(0, 191), rule: ACCOUNT_THROTTLE },
    { key: `address:${address}`.slice(0, 191), rule: ADDRESS_THROTTLE },
  ];
}

type Row = { throttle_key: string; failures: number; window_started_at: Date; locked_until: Date | null };

function toState(row: Row | undefined): ThrottleState | null {
  if (!row) return null;
  return {
    failures: Number(row.failures),
    windowStartedAt: new Date(row.window_started_at),
    lockedUntil: row.locked_until ? new Date(row.locked_until) : null,
  };
}

/**
 * The strictest decision over all keys. The first statement of a sign-in, so it goes through the session pool's
 * bounded statement: a database that stopped answering gives a 503 within seconds, not a sign-in that hangs.
 */
export async function checkThrottle(
  keys: ThrottleKey[],
  now: Date,
): Promise<ThrottleDecision & { counted: string[] }> {
  const rows = await sessionStatement<(Row & RowDataPacket)[]>(
    "SELECT throttle_key, failures, window_started_at, locked_until FROM sign_in_throttle WHERE throttle_key IN (?)",
    [keys.map((k) => k.key)],
  );
  let worst: ThrottleDecision = { allowed: true };
  for (const row of rows) {
    const decision = throttleDecision(toState(row), now);
    if (!decision.allowed && (worst.allowed || decision.retryAfterSeconds > worst.retryAfterSeconds)) worst = decision;
  }
  // Which keys have failures on record: a success need not clear a key that has none.
  return { ...worst, counted: rows.map((r) => r.throttle_key) };
}

/**
 * Two first failures of one key can deadlock: both lock the gap where its row would be, then both insert. A deadlock
 * or lock wait timeout runs the count again (a few times), so a burst of failures is counted and never answers 500.
 */
const RETRYABLE_ERRNOS = new Set([1213, 1205]);
const errnoOf = (error: unknown) =>
  (error as { original?: { errno?: number } }).original?.errno ?? (error as { parent?: { errno?: number } }).parent?.errno;

/** Counts one failed attempt against every key, locking the rows in a fixed order. */
export async function recordThrottleFailure(keys: ThrottleKey[], now: Date): Promise<void> {
  const sorted = [...keys].sort((a, b) => a.key.localeCompare(b.key));
  for (let attempt = 1; ; attempt++) {
    try {
      await getSequelize().transaction(async (transaction: Transaction) => {
        for (const { key, rule } of sorted) {
          const [row] = await getSequelize().query<Row>(
            "SELECT throttle_key, failures, window_started_at, locked_until FROM sign_in_throttle WHERE throttle_key = ? FOR UPDATE",
            { replacements: [key], type: QueryTypes.SELECT, transaction },
          );
          const next = recordFailure(toState(row), now, rule);
          await getSequelize().query(
            `INSERT INTO sign_in_throttle (throttle_key, failures, window_started_at, locked_until, updated_at)
             VALUES (?, ?, ?, ?, ?)
             ON DUPLICATE KEY UPDATE failures = VALUES(failures), window_started_at = VALUES(window_started_at),
               locked_until = VALUES(locked_until), updated_at = VALUES(updated_at)`,
            { replacements: [key, next.failures, next.windowStartedAt, next.lockedUntil, now], transaction },
          );
        }
      });
      return;
    } catch (error) {
      if (attempt >= 4 || !RETRYABLE_ERRNOS.has(errnoOf(error) ?? 0)) throw error;
      await new Promise((r) => setTimeout(r, 10 * attempt + Math.random() * 20));
    }
  }
}

export async function clearThrottle(key: string): Promise<void> {
  await getSequelize().query("DELETE FROM sign_in_throttle WHERE throttle_key = ?", { replacements: [key] });
}
