import "server-only";

type Level = "info" | "warn" | "error";

/**
 * One structured record per line, in UTC. JSON encoding escapes CR, LF and control characters, so a
 * value cannot forge a second record. Never pass passwords or tokens; pass token hashes if anything.
 */
export function log(level: Level, event: string, fields: Record<string, unknown> = {}): void {
  const record = JSON.stringify({ at: new Date().toISOString(), level, event, ...fields });
  if (level === "error") console.error(record);
  else console.log(record);
}
