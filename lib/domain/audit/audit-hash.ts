import { canonicalJson } from "./canonical-json";
import type { AuditEntry } from "./types";

/** The hash before the first entry: 64 zeros. */
export const GENESIS_HASH = "0".repeat(64);

/**
 * The text an audit entry's hash is taken over: the canonical JSON of the entry, its previous hash included, so
 * changing any field of any entry, or taking one out, breaks every hash after it. (The hash function itself,
 * SHA-256, lives on the server side: this folder does no I/O and imports no platform module.)
 */
export function auditHashInput(entry: AuditEntry): string {
  return canonicalJson(entry);
}

/** The hash input of an entry whose place in the chain (sequence number, previous hash) is not known yet. */
export interface AuditHashTemplate {
  /** Everything before the previous hash's hex digits. */
  before: string;
  /** Everything after the sequence number's digits. */
  after: string;
}

const PLACE_MARK = ',"prevHash":"","seq":0';

/**
 * Splits an entry's hash input around its place in the chain, so whoever holds the chain head can finish it:
 * `before + prevHash + '","seq":' + seq + after` is exactly `auditHashInput` of the whole entry. Keys are sorted,
 * so `prevHash` and `seq` sit side by side after `payload`; the last mark is the top-level one, because a mark
 * inside the payload comes earlier and one inside a later string value would have its quotes escaped.
 */
export function auditHashTemplate(entry: Omit<AuditEntry, "seq" | "prevHash">): AuditHashTemplate {
  const text = canonicalJson({ ...entry, prevHash: "", seq: 0 });
  const at = text.lastIndexOf(PLACE_MARK);
  return { before: `${text.slice(0, at)},"prevHash":"`, after: text.slice(at + PLACE_MARK.length) };
}

/** Fills a template in: the same text `auditHashInput` gives for the whole entry. */
export function fillAuditHashTemplate(template: AuditHashTemplate, prevHash: string, seq: number): string {
  return `${template.before}${prevHash}","seq":${seq}${template.after}`;
}
