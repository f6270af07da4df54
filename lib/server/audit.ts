import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import { auditHashTemplate, canonicalJson, chainVerifier, type AuditEntry, type ChainCheck } from "@/lib/domain/audit";
import { sha256Hex } from "./audit-hash";
import { batchAtomically, type BatchStatement } from "./batch";
import { getSequelize } from "./db";

export interface AuditEvent {
  /** What happened, dotted: "stock.issued", "user.role_changed", "session.signed_in". */
  event: string;
  actorId: string | null;
  siteId?: number | null;
  subjectType?: string | null;
  subjectId?: string | number | null;
  /** Plain JSON data: what changed, never a password or token. */
  payload?: Record<string, unknown>;
}

/**
 * Appends one entry to the audit trail inside the caller's transaction, so the entry exists exactly when the change
 * does. One call: the database locks the chain head, finishes the entry's hash from the template sent here and
 * inserts it (procedure `audit_append`, migration 0009). The head stays locked for the rest of the transaction:
 * appends are strictly ordered, so call this as the last statement of the transaction to keep the lock short.
 */
export async function appendAudit(
  event: AuditEvent,
  transaction: Transaction,
  now = new Date(),
): Promise<{ seq: number; hash: string }> {
  const call = auditAppendStatement(event, now);
  const result = await getSequelize().query(call.sql, { replacements: call.params, type: QueryTypes.RAW, transaction });
  const appended = firstRow(result);
  if (!appended) throw new Error("The audit append answered nothing: run the migrations.");
  return { seq: Number(appended.seq), hash: String(appended.hash) };
}

/**
 * The `CALL audit_append(…)` of one entry, for a write path that sends its statements together (`lib/server/batch.ts`);
 * like `appendAudit`, it belongs last, just before the commit.
 */
export function auditAppendStatement(event: AuditEvent, now: Date): BatchStatement {
  const entry = {
    at: now.toISOString(),
    actorId: event.actorId,
    siteId: event.siteId ?? null,
    event: event.event,
    subjectType: event.subjectType ?? null,
    subjectId: event.subjectId === undefined || event.subjectId === null ? null : String(event.subjectId),
    payload: event.payload ?? {},
  };
  const template = auditHashTemplate(entry);
  return {
    sql: "CALL audit_append(?, ?, ?, ?, ?, ?, ?, ?, ?)",
    params: [
      now,
      entry.actorId,
      entry.siteId,
      entry.event,
      entry.subjectType,
      entry.subjectId,
      canonicalJson(entry.payload),
      template.before,
      template.after,
    ],
  };
}

/** The first row of a procedure's first result set, whatever shape the driver hands it back in. */
function firstRow(result: unknown): { seq: unknown; hash: unknown } | undefined {
  let value: unknown = result;
  while (Array.isArray(value)) value = value[0];
  return value && typeof value === "object" && "seq" in value ? (value as { seq: unknown; hash: unknown }) : undefined;
}

/** Appends an entry in a transaction of its own (for events that change nothing else, such as a sign-in). */
export async function recordAudit(event: AuditEvent, now = new Date()): Promise<void> {
  // Begun, appended and committed in one compound statement: one round trip.
  await batchAtomically([auditAppendStatement(event, now)]);
}

interface AuditRow {
  seq: string | number;
  at: Date;
  actor_id: string | null;
  site_id: number | null;
  event: string;
  subject_type: string | null;
  subject_id: string | null;
  payload_json: string;
  prev_hash: string;
  hash: string;
}

const PAGE = 2000;

/**
 * Recomputes the whole chain from the first entry, a page at a time (memory stays flat), and compares its end with
 * the chain head, so rows taken off the end are found too. Names the first entry that does not hold.
 */
export async function verifyAuditChain(): Promise<ChainCheck & { headSeq: number; headHash: string }> {
  const sequelize = getSequelize();
  const verifier = chainVerifier(sha256Hex);
  let after = 0;
  let lastSeq = 0;
  for (;;) {
    const rows = await sequelize.query<AuditRow>(
      "SELECT seq, at, actor_id, site_id, event, subject_type, subject_id, payload_json, prev_hash, hash FROM audit_log WHERE seq > ? ORDER BY seq LIMIT ?",
      { replacements: [after, PAGE], type: QueryTypes.SELECT },
    );
    let intact = true;
    for (const r of rows) {
      const entry: AuditEntry = {
        seq: Number(r.seq),
        at: new Date(r.at).toISOString(),
        actorId: r.actor_id,
        siteId: r.site_id === null ? null : Number(r.site_id),
        event: r.event,
        subjectType: r.subject_type,
        subjectId: r.subject_id,
        payload: parsePayload(r.payload_json),
        prevHash: r.prev_hash,
      };
      lastSeq = entry.seq;
      if (!verifier.add(entry, r.hash)) {
        intact = false;
        break;
      }
    }
    if (!intact || rows.length < PAGE) break;
    after = lastSeq;
  }
  const [head] = await sequelize.query<{ seq: string | number; hash: string }>(
    "SELECT seq, hash FROM audit_head WHERE id = 1",
    { type: QueryTypes.SELECT },
  );
  const headSeq = Number(head?.seq ?? 0);
  const headHash = head?.hash ?? "";
  const result = verifier.result();
  if (result.ok && lastSeq < headSeq)
    return {
      ok: false,
      checked: result.checked,
      firstBrokenSeq: lastSeq + 1,
      problem: "gap",
      headSeq,
      headHash,
    };
  return { ...result, headSeq, headHash };
}

/** A payload that is not JSON any more was edited by hand: keep its text, so the hash check reports the row. */
function parsePayload(text: string): unknown {
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return text;
  }
}

export interface AuditListItem {
  seq: number;
  at: string;
  actor: string | null;
  event: string;
  subject: string | null;
  payload: string;
  hash: string;
}

/** The newest audit entries (for the audit page), optionally from a seq downwards. */
export async function listAudit(
  options: { before?: number; limit?: number; event?: string } = {},
): Promise<AuditListItem[]> {
  const rows = await getSequelize().query<{
    seq: number;
    at: Date;
    name: string | null;
    email: string | null;
    event: string;
    subject_type: string | null;
    subject_id: string | null;
    payload_json: string;
    hash: string;
  }>(
    `SELECT a.seq, a.at, u.name, u.email, a.event, a.subject_type, a.subject_id, a.payload_json, a.hash FROM audit_log a LEFT JOIN app_user u ON u.id = a.actor_id
     WHERE a.seq < :before ${options.event ? "AND a.event LIKE :event" : ""} ORDER BY a.seq DESC LIMIT :limit`,
    {
      replacements: {
        before: options.before ?? Number.MAX_SAFE_INTEGER,
        event: `${options.event ?? ""}%`,
        limit: options.limit ?? 100,
      },
      type: QueryTypes.SELECT,
    },
  );
  return rows.map((r) => ({
    seq: Number(r.seq),
    at: new Date(r.at).toISOString(),
    actor: r.name ? `${r.name} (${r.email})` : null,
    event: r.event,
    subject: r.subject_type ? `${r.subject_type} ${r.subject_id ?? ""}`.trim() : null,
    payload: r.payload_json,
    hash: r.hash,
  }));
}
