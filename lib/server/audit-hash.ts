import "server-only";
import { createHash } from "node:crypto";
import { auditHashInput, type AuditEntry } from "@/lib/domain/audit";

/** Hex SHA-256 of a UTF-8 text (FIPS 180-4). */
export function sha256Hex(text: string): string {
  return createHash("sha256").update(text, "utf8").digest("hex");
}

/** The hash an audit entry must carry: SHA-256 over its canonical JSON (previous hash included). */
export function auditHash(entry: AuditEntry): string {
  return sha256Hex(auditHashInput(entry));
}
