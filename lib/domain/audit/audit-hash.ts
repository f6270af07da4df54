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
