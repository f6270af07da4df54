import "server-only";
import { auditAppendStatement, recordAudit } from "./audit";
import { batchAtomically, queryBlock } from "./batch";
import { getSequelize } from "./db";
import { log } from "./log";
import { hashPassword, needsRehash, verifyDummy, verifyPassword } from "./passwords";
import { newSession } from "./session";
import { checkThrottle, clearThrottle, recordThrottleFailure, signInThrottleKeys } from "./throttle";
import type { Role } from "@/lib/domain/permissions";

export type SignInResult =
  | { ok: true; token: string; user: { id: string; email: string; name: string; role: Role } }
  | { ok: false; reason: "invalid_credentials" }
  | { ok: false; reason: "too_many_attempts"; retryAfterSeconds: number };

type UserRow = { id: string; email: string; name: string; role: Role; status: string; password_hash: string | null };

/**
 * Checks an e-mail and password. Unknown e-mail, wrong password, disabled or not yet activated
 * account all give the same answer after the same amount of work. Failures count against the
 * account and the client address in the database; while either is locked nothing is checked.
 */
export async function signIn(input: {
  email: string;
  password: string;
  address: string;
  userAgent?: string | null;
  now?: Date;
}): Promise<SignInResult> {
  const now = input.now ?? new Date();
  const email = input.email.trim().toLowerCase();
  const keys = signInThrottleKeys(email, input.address);

  // The throttle and the account are read side by side; nothing is checked against the account while locked.
  const [decision, [users]] = await Promise.all([
    checkThrottle(keys, now),
    queryBlock([{ sql: "SELECT id, email, name, role, status, password_hash FROM app_user WHERE email = ? LIMIT 1", params: [email] }]),
  ]);
  const user = (users as UserRow[] | undefined)?.[0];
  if (!decision.allowed) {
    await recordThrottleFailure(keys, now);
    log("warn", "sign_in_throttled", { email, address: input.address, retryAfter: decision.retryAfterSeconds });
    return { ok: false, reason: "too_many_attempts", retryAfterSeconds: decision.retryAfterSeconds };
  }

  let valid = false;
  if (user?.password_hash && user.status === "active") {
    valid = await verifyPassword(user.password_hash, input.password);
  } else {
    await verifyDummy(input.password);
  }

  if (!user || !valid) {
    await recordThrottleFailure(keys, now);
    log("warn", "sign_in_failed", { email, address: input.address, knownUser: Boolean(user) });
    await recordAudit({ event: "session.sign_in_failed", actorId: user?.id ?? null, payload: { email, address: input.address } }, now);
    return { ok: false, reason: "invalid_credentials" };
  }

  if (decision.counted.includes(keys[0]!.key)) await clearThrottle(keys[0]!.key);
  if (user.password_hash && needsRehash(user.password_hash)) {
    await getSequelize().query("UPDATE app_user SET password_hash = ?, updated_at = ? WHERE id = ?", {
      replacements: [await hashPassword(input.password), now, user.id],
    });
  }
  // The session row and its audit entry commit together, begun and committed in one compound statement.
  const { token, statement } = newSession(user.id, { userAgent: input.userAgent, now });
  await batchAtomically([
    statement,
    auditAppendStatement({ event: "session.signed_in", actorId: user.id, subjectType: "user", subjectId: user.id, payload: { address: input.address } }, now),
  ]);
  log("info", "sign_in_ok", { userId: user.id, address: input.address });
  return { ok: true, token, user: { id: user.id, email: user.email, name: user.name, role: user.role } };
}
