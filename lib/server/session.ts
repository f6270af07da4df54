import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { Mysql2Adapter } from "@lucia-auth/adapter-mysql";
import { Lucia, TimeSpan } from "lucia";
import { cookiesAreSecure, getEnv } from "@/lib/env";
import { SESSION_TIMEOUTS, evaluateSession, sessionNeedsTouch } from "@/lib/domain/auth";
import { isRole, type Role } from "@/lib/domain/permissions";
import { getMysqlPool } from "./mysql-pool";
import { log } from "./log";

/*
 * Every piece of session code lives in this file, so the session library can be replaced without
 * touching callers. The cookie carries a random token (160 bits); the database keeps only its SHA-256
 * as the session id, so a copy of the table cannot be replayed as cookies.
 */

export interface SessionUser {
  id: string;
  email: string;
  name: string;
  role: Role;
  unitSystem: "metric" | "imperial";
}

export interface ValidSession {
  user: SessionUser;
  sessionId: string;
  createdAt: Date;
}

type DbUser = { email: string; name: string; role: string; status: string; unit_system: string };
type DbSession = { created_at: Date; last_seen_at: Date; user_agent: string | null };

function createLucia() {
  const adapter = new Mysql2Adapter(getMysqlPool(), { user: "app_user", session: "user_session" });
  return new Lucia(adapter, {
    // The longest absolute lifetime of any role; the per-role idle and absolute limits are checked below.
    sessionExpiresIn: new TimeSpan(Math.max(...Object.values(SESSION_TIMEOUTS).map((t) => t.absoluteHours)), "h"),
    sessionCookie: { expires: false },
    getSessionAttributes: (attributes: DbSession) => attributes,
    getUserAttributes: (attributes: DbUser) => attributes,
  });
}

type LuciaInstance = ReturnType<typeof createLucia>;
const holder = globalThis as { __greaseledgerLucia?: LuciaInstance };
function lucia(): LuciaInstance {
  holder.__greaseledgerLucia ??= createLucia();
  return holder.__greaseledgerLucia;
}

declare module "lucia" {
  interface Register {
    Lucia: LuciaInstance;
    DatabaseUserAttributes: DbUser;
    DatabaseSessionAttributes: DbSession;
  }
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

/** Cookie name and attributes. Over https the name carries the `__Host-` prefix (no Domain, Path=/, Secure). */
export function sessionCookie() {
  const secure = cookiesAreSecure(getEnv());
  return {
    name: secure ? "__Host-gl_session" : "gl_session",
    attributes: { httpOnly: true, secure, sameSite: "lax" as const, path: "/" },
  };
}

/** Starts a new session for a user and returns the cookie token. */
export async function createSession(userId: string, meta: { userAgent?: string | null; now?: Date } = {}) {
  const token = randomBytes(20).toString("base64url");
  const now = meta.now ?? new Date();
  await lucia().createSession(
    userId,
    { created_at: now, last_seen_at: now, user_agent: meta.userAgent?.slice(0, 255) ?? null },
    { sessionId: hashToken(token) },
  );
  return token;
}

/**
 * Checks a cookie token: the session must exist, belong to an active user, and be inside its role's
 * idle and absolute limits. An expired or orphaned session is deleted. Returns null when not valid.
 */
export async function validateSessionToken(token: string | undefined | null, now = new Date()): Promise<ValidSession | null> {
  if (!token || token.length > 200) return null;
  const sessionId = hashToken(token);
  const { session, user } = await lucia().validateSession(sessionId);
  if (!session || !user) return null;

  const role = user.role;
  if (user.status !== "active" || !isRole(role)) {
    await lucia().invalidateSession(sessionId);
    return null;
  }
  const createdAt = new Date(session.created_at);
  const lastSeenAt = new Date(session.last_seen_at);
  const state = evaluateSession({ createdAt, lastSeenAt, now, timeouts: SESSION_TIMEOUTS[role] });
  if (state !== "active") {
    await lucia().invalidateSession(sessionId);
    log("info", "session_expired", { userId: user.id, reason: state });
    return null;
  }
  if (sessionNeedsTouch(lastSeenAt, now)) {
    await getMysqlPool().execute("UPDATE user_session SET last_seen_at = ? WHERE id = ?", [now, sessionId]);
  }
  return {
    sessionId,
    createdAt,
    user: {
      id: user.id,
      email: user.email,
      name: user.name,
      role,
      unitSystem: user.unit_system === "imperial" ? "imperial" : "metric",
    },
  };
}

export async function invalidateSessionToken(token: string | undefined | null): Promise<void> {
  if (!token) return;
  await lucia().invalidateSession(hashToken(token));
}

/** Ends every session of a user at once (disabling, role change, password reset). */
export async function invalidateUserSessions(userId: string): Promise<void> {
  await lucia().invalidateUserSessions(userId);
}
