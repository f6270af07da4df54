import "server-only";
import { createHash, randomBytes } from "node:crypto";
import { Mysql2Adapter } from "@lucia-auth/adapter-mysql";
import { Lucia, TimeSpan } from "lucia";
import type { RowDataPacket } from "mysql2";
import { cookiesAreSecure, getEnv } from "@/lib/env";
import { SESSION_TIMEOUTS, evaluateSession, sessionNeedsTouch } from "@/lib/domain/auth";
import { isRole, type Role } from "@/lib/domain/permissions";
import type { BatchStatement } from "./batch";
import { getMysqlPool, sessionStatement } from "./mysql-pool";
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
  /** The sites the user may see, read with the session. */
  siteIds: number[];
}

type DbUser = { email: string; name: string; role: string; status: string; unit_system: string };
type DbSession = { created_at: Date; last_seen_at: Date; user_agent: string | null };

/** The longest absolute lifetime of any role; the per-role idle and absolute limits are checked on every request. */
const SESSION_LIFETIME_MS = Math.max(...Object.values(SESSION_TIMEOUTS).map((t) => t.absoluteHours)) * 3_600_000;

function createLucia() {
  const adapter = new Mysql2Adapter(getMysqlPool(), { user: "app_user", session: "user_session" });
  return new Lucia(adapter, {
    // The longest absolute lifetime of any role; the per-role idle and absolute limits are checked below.
    sessionExpiresIn: new TimeSpan(SESSION_LIFETIME_MS / 3_600_000, "h"),
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

/**
 * A new session for a user: the cookie token and the INSERT of its row, which the caller sends with the sign-in's
 * audit entry so that both commit together (`batchAtomically`). Only the token's hash is stored.
 */
export function newSession(
  userId: string,
  meta: { userAgent?: string | null; now?: Date } = {},
): { token: string; statement: BatchStatement } {
  const token = randomBytes(20).toString("base64url");
  const now = meta.now ?? new Date();
  return {
    token,
    statement: {
      sql: "INSERT INTO user_session (id, user_id, expires_at, created_at, last_seen_at, user_agent) VALUES (?, ?, ?, ?, ?, ?)",
      params: [hashToken(token), userId, new Date(now.getTime() + SESSION_LIFETIME_MS), now, now, meta.userAgent?.slice(0, 255) ?? null],
    },
  };
}

type SessionRow = {
  created_at: Date;
  last_seen_at: Date;
  expires_at: Date;
  user_id: string;
  email: string;
  name: string;
  role: string;
  status: string;
  unit_system: string;
  site_ids: string | null;
};

/**
 * Checks a cookie token: the session must exist, belong to an active user, and be inside its role's
 * idle and absolute limits. An expired or orphaned session is deleted. Returns null when not valid.
 * One statement reads the session, its user and the user's sites (the sites serve the rest of the request).
 */
export async function validateSessionToken(token: string | undefined | null, now = new Date()): Promise<ValidSession | null> {
  if (!token || token.length > 200) return null;
  const sessionId = hashToken(token);
  const rows = await sessionStatement<(SessionRow & RowDataPacket)[]>(
    `SELECT s.created_at, s.last_seen_at, s.expires_at, u.id AS user_id, u.email, u.name, u.role, u.status, u.unit_system,
            (SELECT GROUP_CONCAT(a.site_id) FROM user_site_access a WHERE a.user_id = u.id) AS site_ids
     FROM user_session s JOIN app_user u ON u.id = s.user_id WHERE s.id = ?`,
    [sessionId],
  );
  const row = rows[0];
  if (!row) return null;

  const role = row.role;
  if (row.status !== "active" || !isRole(role) || new Date(row.expires_at).getTime() <= now.getTime()) {
    await lucia().invalidateSession(sessionId);
    return null;
  }
  const createdAt = new Date(row.created_at);
  const lastSeenAt = new Date(row.last_seen_at);
  const state = evaluateSession({ createdAt, lastSeenAt, now, timeouts: SESSION_TIMEOUTS[role] });
  if (state !== "active") {
    await lucia().invalidateSession(sessionId);
    log("info", "session_expired", { userId: row.user_id, reason: state });
    return null;
  }
  if (sessionNeedsTouch(lastSeenAt, now)) {
    await sessionStatement("UPDATE user_session SET last_seen_at = ? WHERE id = ?", [now, sessionId]);
  }
  return {
    sessionId,
    createdAt,
    siteIds: row.site_ids ? row.site_ids.split(",").map(Number) : [],
    user: {
      id: row.user_id,
      email: row.email,
      name: row.name,
      role,
      unitSystem: row.unit_system === "imperial" ? "imperial" : "metric",
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
