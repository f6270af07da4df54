import "server-only";
import { randomBytes } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import { OUTBOX_MAX_ATTEMPTS, nextAttemptDelaySeconds } from "@/lib/domain/mail";
import { getSequelize } from "../db";
import { log } from "../log";
import type { MailTransport } from "./transport";

export interface OutgoingMail {
  to: string[];
  subject: string;
  text: string;
  /** A mail with the same key is put in the outbox only once (one alert per episode). */
  dedupeKey?: string;
}

/**
 * Puts a mail in the outbox. Pass the transaction of the change the mail reports, so the mail exists
 * exactly when the change does. Returns the outbox id, or null when the dedupe key was already used.
 */
export async function enqueueMail(mail: OutgoingMail, transaction?: Transaction, now = new Date()): Promise<number | null> {
  const [result, affected] = await getSequelize().query(
    `INSERT IGNORE INTO mail_outbox (dedupe_key, to_addresses, subject, text_body, status, attempts, next_attempt_at, created_at, updated_at)
     VALUES (?, ?, ?, ?, 'pending', 0, ?, ?, ?)`,
    {
      replacements: [mail.dedupeKey ?? null, mail.to.join(", "), mail.subject.slice(0, 255), mail.text, now, now, now],
      transaction,
      type: QueryTypes.INSERT,
    },
  );
  return affected ? Number(result) : null;
}

/** The Message-ID a mail always carries, so a resend after a crash can be recognised as the same mail. */
export function outboxMessageId(id: number): string {
  return `<outbox-${id}@greaseledger.invalid>`;
}

type ClaimedRow = { id: number; to_addresses: string; subject: string; text_body: string; attempts: number };

const LEASE_SECONDS = 60;

/**
 * Delivers what is due, once. Rows are claimed under `FOR UPDATE SKIP LOCKED` with a lease, so several
 * relays (one per app instance) never take the same mail; a relay that dies leaves its lease to expire.
 * Delivery is at-least-once: a crash between the SMTP accept and the mark can resend with the same Message-ID.
 */
export async function relayOutboxOnce(
  transport: MailTransport,
  options: { now?: Date; batchSize?: number } = {},
): Promise<{ sent: number; failed: number }> {
  const now = options.now ?? new Date();
  const sequelize = getSequelize();
  const claimToken = randomBytes(16).toString("hex");
  const leaseUntil = new Date(now.getTime() + LEASE_SECONDS * 1000);

  const claimed = await sequelize.transaction(async (transaction) => {
    const rows = await sequelize.query<ClaimedRow>(
      `SELECT id, to_addresses, subject, text_body, attempts FROM mail_outbox
       WHERE (status = 'pending' AND next_attempt_at <= ?) OR (status = 'sending' AND claimed_until < ?)
       ORDER BY id LIMIT ? FOR UPDATE SKIP LOCKED`,
      { replacements: [now, now, options.batchSize ?? 20], type: QueryTypes.SELECT, transaction },
    );
    if (rows.length) {
      await sequelize.query(
        `UPDATE mail_outbox SET status = 'sending', claim_token = ?, claimed_until = ?, updated_at = ? WHERE id IN (?)`,
        { replacements: [claimToken, leaseUntil, now, rows.map((r) => r.id)], transaction },
      );
    }
    return rows;
  });

  let sent = 0;
  let failed = 0;
  for (const row of claimed) {
    const id = Number(row.id);
    try {
      await transport.send({
        messageId: outboxMessageId(id),
        to: row.to_addresses.split(",").map((a) => a.trim()).filter(Boolean),
        subject: row.subject,
        text: row.text_body,
      });
      await sequelize.query(
        `UPDATE mail_outbox SET status = 'sent', sent_at = ?, attempts = attempts + 1, claim_token = NULL,
           claimed_until = NULL, last_error = NULL, updated_at = ? WHERE id = ? AND claim_token = ?`,
        { replacements: [new Date(), new Date(), id, claimToken] },
      );
      sent += 1;
    } catch (error) {
      failed += 1;
      const attempts = Number(row.attempts) + 1;
      const dead = attempts >= OUTBOX_MAX_ATTEMPTS;
      const next = new Date(now.getTime() + nextAttemptDelaySeconds(attempts) * 1000);
      const message = error instanceof Error ? error.message : String(error);
      await sequelize.query(
        `UPDATE mail_outbox SET status = ?, attempts = ?, next_attempt_at = ?, last_error = ?, claim_token = NULL,
           claimed_until = NULL, updated_at = ? WHERE id = ? AND claim_token = ?`,
        { replacements: [dead ? "dead" : "pending", attempts, next, message.slice(0, 2000), new Date(), id, claimToken] },
      );
      log(dead ? "error" : "warn", "mail_delivery_failed", { outboxId: id, attempts, dead, message });
    }
  }
  return { sent, failed };
}

export interface OutboxRow {
  id: number;
  to: string;
  subject: string;
  status: string;
  attempts: number;
  nextAttemptAt: string;
  lastError: string | null;
  createdAt: string;
  sentAt: string | null;
}

/** The newest outbox rows, for the admin page. */
export async function listOutbox(limit = 200): Promise<OutboxRow[]> {
  const rows = await getSequelize().query<{
    id: number;
    to_addresses: string;
    subject: string;
    status: string;
    attempts: number;
    next_attempt_at: Date;
    last_error: string | null;
    created_at: Date;
    sent_at: Date | null;
  }>(
    `SELECT id, to_addresses, subject, status, attempts, next_attempt_at, last_error, created_at, sent_at
     FROM mail_outbox ORDER BY id DESC LIMIT ?`,
    { replacements: [limit], type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: Number(r.id),
    to: r.to_addresses,
    subject: r.subject,
    status: r.status,
    attempts: Number(r.attempts),
    nextAttemptAt: new Date(r.next_attempt_at).toISOString(),
    lastError: r.last_error,
    createdAt: new Date(r.created_at).toISOString(),
    sentAt: r.sent_at ? new Date(r.sent_at).toISOString() : null,
  }));
}
