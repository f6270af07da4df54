import "server-only";
import { createHash } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import { appendAudit, type AuditEvent } from "./audit";
import { getSequelize } from "./db";
import { AppError, ConflictError, ValidationError } from "./errors";

export interface StoredAnswer {
  status: number;
  body: unknown;
}

/** What the work of an idempotent request answers; its audit entry, if any, is appended after the answer is stored. */
export interface WorkAnswer extends StoredAnswer {
  audit?: { event: AuditEvent; at: Date };
}

const canonical = (value: unknown): string =>
  JSON.stringify(value, (_k, v) => (v && typeof v === "object" && !Array.isArray(v) ? Object.fromEntries(Object.entries(v).sort(([a], [b]) => a.localeCompare(b))) : v));

export function requestHash(scope: string, body: unknown): string {
  return createHash("sha256").update(`${scope}\n${canonical(body)}`).digest("hex");
}

/** A key is 1–255 visible ASCII characters (the IETF Idempotency-Key draft allows any; we keep it printable). */
export function parseIdempotencyKey(raw: string | null): string | null {
  if (raw === null) return null;
  if (!/^[\x21-\x7e]{1,255}$/.test(raw)) throw new ValidationError({ "Idempotency-Key": ["Use 1–255 printable characters, e.g. a UUID."] });
  return raw;
}

const isDuplicate = (error: unknown) =>
  (error as { name?: string }).name === "SequelizeUniqueConstraintError" ||
  (error as { original?: { errno?: number } }).original?.errno === 1062 ||
  (error as { parent?: { errno?: number } }).parent?.errno === 1062;

const RETRYABLE = new Set([1213, 1205, 1020]);
const errno = (error: unknown) => (error as { original?: { errno?: number } }).original?.errno ?? (error as { parent?: { errno?: number } }).parent?.errno;

/**
 * Runs `work` in one transaction and remembers its answer under (user, key): the key row is inserted first
 * in the same transaction, so a concurrent duplicate waits on it and then replays the committed answer; a
 * reused key with another body gives 422. Without a key the work simply runs. Deadlocks and lock timeouts
 * are retried a few times. An AppError thrown by `work` (e.g. validation) stores nothing.
 */
export async function idempotent(
  options: { userId: string; key: string | null; scope: string; body: unknown },
  work: (transaction: Transaction) => Promise<WorkAnswer>,
): Promise<StoredAnswer> {
  const sequelize = getSequelize();
  const hash = requestHash(options.scope, options.body);
  for (let attempt = 1; ; attempt++) {
    try {
      return await sequelize.transaction(async (transaction) => {
        if (options.key) {
          await sequelize.query(
            "INSERT INTO idempotency_key (user_id, idem_key, request_hash, status_code, response_json, created_at) VALUES (?, ?, ?, 0, '', ?)",
            { replacements: [options.userId, options.key, hash, new Date()], transaction },
          );
        }
        const answer = await work(transaction);
        if (options.key) {
          await sequelize.query("UPDATE idempotency_key SET status_code = ?, response_json = ? WHERE user_id = ? AND idem_key = ?", {
            replacements: [answer.status, JSON.stringify(answer.body), options.userId, options.key],
            transaction,
          });
        }
        // Last, so the audit chain head (one lock for every audited write) is held only until the commit.
        if (answer.audit) await appendAudit(answer.audit.event, transaction, answer.audit.at);
        return { status: answer.status, body: answer.body };
      });
    } catch (error) {
      if (options.key && isDuplicate(error)) {
        const [row] = await sequelize.query<{ request_hash: string; status_code: number; response_json: string }>(
          "SELECT request_hash, status_code, response_json FROM idempotency_key WHERE user_id = ? AND idem_key = ?",
          { replacements: [options.userId, options.key], type: QueryTypes.SELECT },
        );
        if (!row || Number(row.status_code) === 0) throw new ConflictError("idempotency_in_flight", "The same request is still being processed. Try again in a moment.");
        if (row.request_hash !== hash) {
          throw new AppError(422, "idempotency_key_reused", "This Idempotency-Key was already used for a different request.");
        }
        return { status: Number(row.status_code), body: JSON.parse(row.response_json) as unknown };
      }
      if (attempt < 4 && RETRYABLE.has(errno(error) ?? 0)) {
        await new Promise((r) => setTimeout(r, 20 * attempt + Math.random() * 30));
        continue;
      }
      throw error;
    }
  }
}
