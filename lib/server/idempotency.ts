import "server-only";
import { createHash } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import { auditAppendStatement, type AuditEvent } from "./audit";
import { BatchCheckFailed, transactionCommittedByBatch, type BatchStatement } from "./batch";
import { getSequelize } from "./db";
import { AppError, ConflictError, ValidationError } from "./errors";

export interface StoredAnswer {
  status: number;
  body: unknown;
}

/**
 * What the work of an idempotent request answers. Its last writes (`writes`), the stored answer and its audit entry
 * are sent to the database together, as one compound statement, after the work returns.
 */
export interface WorkAnswer extends StoredAnswer {
  audit?: { event: AuditEvent; at: Date };
  /** Writes that need nothing read back; a statement's row-count check failing becomes `onCheckFailed(its index)`. */
  writes?: BatchStatement[];
  onCheckFailed?: (index: number) => Error;
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
 *
 * With `pipelined`, the key row's INSERT is not waited for: it goes out in one compound statement with the START
 * TRANSACTION and the caller's `opening` statements (their SELECTs' rows arrive as `opened`), and the work may send
 * reads behind it. The work then MUST `await claimed` before it writes anything (a failed claim may have rolled the
 * transaction back, and a write after it would commit on its own); its final `writes` are only sent once the claim
 * has held.
 */
export async function idempotent(
  options: { userId: string; key: string | null; scope: string; body: unknown; pipelined?: boolean; opening?: BatchStatement[] },
  work: (transaction: Transaction, claimed: Promise<void>, opened: Promise<unknown[][]>) => Promise<WorkAnswer>,
): Promise<StoredAnswer> {
  const sequelize = getSequelize();
  const hash = requestHash(options.scope, options.body);
  const claim: BatchStatement[] = options.key
    ? [
        {
          sql: "INSERT INTO idempotency_key (user_id, idem_key, request_hash, status_code, response_json, created_at) VALUES (?, ?, ?, 0, '', ?)",
          params: [options.userId, options.key, hash, new Date()],
        },
      ]
    : [];
  for (let attempt = 1; ; attempt++) {
    try {
      return await transactionCommittedByBatch([...claim, ...(options.opening ?? [])], async (transaction, commitWith, opened) => {
        const claimed: Promise<void> = opened.then(() => undefined);
        // Handled below; never an unhandled rejection while the work's reads are still out.
        claimed.catch(() => {});
        if (!options.pipelined) await claimed;
        let answer: WorkAnswer;
        try {
          answer = await work(transaction, claimed, opened);
        } catch (error) {
          // A replayed or in-flight key answers before whatever the work ran into after it.
          await claimed;
          throw error;
        }
        await claimed;
        const finals: BatchStatement[] = [...(answer.writes ?? [])];
        if (options.key)
          finals.push({
            sql: "UPDATE idempotency_key SET status_code = ?, response_json = ? WHERE user_id = ? AND idem_key = ?",
            params: [answer.status, JSON.stringify(answer.body), options.userId, options.key],
          });
        // Last, so the audit chain head (one lock for every audited write) is held only until the commit.
        if (answer.audit) finals.push(auditAppendStatement(answer.audit.event, answer.audit.at));
        try {
          // The last writes, the stored answer, the audit entry and the COMMIT: one round trip.
          await commitWith(finals);
        } catch (error) {
          if (error instanceof BatchCheckFailed && answer.onCheckFailed) throw answer.onCheckFailed(error.index);
          throw error;
        }
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
