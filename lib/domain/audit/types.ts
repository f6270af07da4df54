/** One entry of the audit trail as it is hashed: everything but its own hash. */
export interface AuditEntry {
  /** 1, 2, 3, … without gaps. */
  seq: number;
  /** ISO 8601 UTC with milliseconds, e.g. 2026-12-02T08:15:00.000Z. */
  at: string;
  actorId: string | null;
  siteId: number | null;
  /** What happened, e.g. "stock.issued", "incident.closed". */
  event: string;
  subjectType: string | null;
  subjectId: string | null;
  payload: unknown;
  /** Hex SHA-256 of the previous entry; GENESIS_HASH for the first. */
  prevHash: string;
}

export interface ChainCheck {
  ok: boolean;
  checked: number;
  /** The first entry whose sequence, link or hash does not hold. */
  firstBrokenSeq?: number;
  /** Why that entry fails: "gap" (a missing seq), "link" (prev_hash ≠ the hash before it), "hash" (content changed). */
  problem?: "gap" | "link" | "hash";
}
