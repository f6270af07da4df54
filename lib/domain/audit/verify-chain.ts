import { GENESIS_HASH, auditHashInput } from "./audit-hash";
import type { AuditEntry, ChainCheck } from "./types";

/**
 * Checks a hash chain one entry at a time, in seq order, so a caller can stream millions of rows through it. Each
 * entry must follow the one before (seq + 1), point at its hash, and carry the hash of its own content.
 * `hashOf` is the hash function (hex SHA-256 on the server). `add` returns false from the first broken entry on; `result()` says how far it got and where it broke.
 */
export function chainVerifier(
  hashOf: (text: string) => string,
  start: { seq: number; hash: string } = { seq: 0, hash: GENESIS_HASH },
) {
  let lastSeq = start.seq;
  let lastHash = start.hash;
  let checked = 0;
  let broken: Pick<ChainCheck, "firstBrokenSeq" | "problem"> | null = null;
  return {
    add(entry: AuditEntry, storedHash: string): boolean {
      if (broken) return false;
      checked += 1;
      if (entry.seq !== lastSeq + 1) broken = { firstBrokenSeq: lastSeq + 1, problem: "gap" };
      else if (entry.prevHash !== lastHash) broken = { firstBrokenSeq: entry.seq, problem: "link" };
      else if (hashOf(auditHashInput(entry)) !== storedHash)
        broken = { firstBrokenSeq: entry.seq, problem: "hash" };
      lastSeq = entry.seq;
      lastHash = storedHash;
      return broken === null;
    },
    result(): ChainCheck {
      return broken ? { ok: false, checked, ...broken } : { ok: true, checked };
    },
  };
}
