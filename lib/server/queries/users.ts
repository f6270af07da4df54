import "server-only";
import { createHash, randomBytes, randomUUID } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import { getEnv } from "@/lib/env";
import { ROLE_LABELS, type Role } from "@/lib/domain/permissions";
import { appendAudit } from "../audit";
import { getSequelize } from "../db";
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from "../errors";
import { log } from "../log";
import { enqueueMail } from "../mail/outbox";
import { hashPassword } from "../passwords";
import { knownSiteIds } from "../request-context";
import { invalidateUserSessions } from "../session";

/** How long an invitation link can be used. */
export const INVITATION_VALID_HOURS = 72;

export interface UserListItem {
  id: string;
  email: string;
  name: string;
  role: Role;
  status: "invited" | "active" | "disabled";
  sites: { id: number; code: string; name: string }[];
  createdAt: string;
}

export interface SiteItem {
  id: number;
  code: string;
  name: string;
}

export async function listSites(): Promise<SiteItem[]> {
  const rows = await getSequelize().query<SiteItem>("SELECT id, code, name FROM site ORDER BY name", {
    type: QueryTypes.SELECT,
  });
  return rows.map((r) => ({ id: Number(r.id), code: r.code, name: r.name }));
}

export async function listUsers(): Promise<UserListItem[]> {
  const sequelize = getSequelize();
  const users = await sequelize.query<{
    id: string;
    email: string;
    name: string;
    role: Role;
    status: UserListItem["status"];
    created_at: Date;
  }>("SELECT id, email, name, role, status, created_at FROM app_user ORDER BY name", { type: QueryTypes.SELECT });
  const access = await sequelize.query<{ user_id: string; id: number; code: string; name: string }>(
    "SELECT a.user_id, s.id, s.code, s.name FROM user_site_access a JOIN site s ON s.id = a.site_id ORDER BY s.name",
    { type: QueryTypes.SELECT },
  );
  const byUser = new Map<string, SiteItem[]>();
  for (const row of access) {
    const list = byUser.get(row.user_id) ?? [];
    list.push({ id: Number(row.id), code: row.code, name: row.name });
    byUser.set(row.user_id, list);
  }
  return users.map((u) => ({
    id: u.id,
    email: u.email,
    name: u.name,
    role: u.role,
    status: u.status,
    sites: byUser.get(u.id) ?? [],
    createdAt: new Date(u.created_at).toISOString(),
  }));
}

/** The site ids a user may see. Inside a transaction pass it, so the query does not wait for a second pool connection. */
/**
 * For an API filter or export that names a site: it must be one of the caller's, else a 403 `site_forbidden` naming
 * it (API.md), rather than an empty answer that looks like "nothing there". Answers the caller's site ids.
 */
export async function assertOwnSite(userId: string, siteId: number | undefined, shownAs: string | number | undefined = siteId): Promise<number[]> {
  const own = await userSiteIds(userId);
  if (siteId !== undefined && !own.includes(siteId)) throw new ForbiddenError(`You have no access to site ${shownAs}.`, "site_forbidden");
  return own;
}

export async function userSiteIds(userId: string, transaction?: Transaction): Promise<number[]> {
  const known = knownSiteIds(userId);
  if (known) return known;
  const rows = await getSequelize().query<{ site_id: number }>(
    "SELECT site_id FROM user_site_access WHERE user_id = ?",
    { replacements: [userId], type: QueryTypes.SELECT, transaction },
  );
  return rows.map((r) => Number(r.site_id));
}

function tokenHash(token: string) {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

async function assertSitesExist(siteIds: number[]) {
  if (!siteIds.length) return;
  const rows = await getSequelize().query<{ n: number }>("SELECT COUNT(*) AS n FROM site WHERE id IN (?)", {
    replacements: [siteIds],
    type: QueryTypes.SELECT,
  });
  if (Number(rows[0]?.n) !== new Set(siteIds).size) throw new ValidationError({ siteIds: ["A chosen site does not exist."] });
}

/**
 * Creates an invited user with site access and puts the invitation mail (a one-time link to set a
 * password) in the outbox, all in one transaction.
 */
export async function inviteUser(
  input: { email: string; name: string; role: Role; siteIds: number[] },
  invitedBy: { id: string; name: string },
  now = new Date(),
): Promise<{ userId: string }> {
  const sequelize = getSequelize();
  await assertSitesExist(input.siteIds);
  const userId = randomUUID();
  const token = randomBytes(24).toString("base64url");
  const expiresAt = new Date(now.getTime() + INVITATION_VALID_HOURS * 3_600_000);
  const link = new URL(`/invite/${token}`, getEnv().APP_URL).toString();

  try {
    await sequelize.transaction(async (transaction) => {
      await sequelize.query(
        `INSERT INTO app_user (id, email, name, role, status, password_hash, unit_system, created_at, updated_at)
         VALUES (?, ?, ?, ?, 'invited', NULL, 'metric', ?, ?)`,
        { replacements: [userId, input.email, input.name, input.role, now, now], transaction },
      );
      for (const siteId of new Set(input.siteIds)) {
        await sequelize.query("INSERT INTO user_site_access (user_id, site_id, created_at) VALUES (?, ?, ?)", {
          replacements: [userId, siteId, now],
          transaction,
        });
      }
      await sequelize.query(
        "INSERT INTO user_invitation (token_hash, user_id, invited_by, expires_at, used_at, created_at) VALUES (?, ?, ?, ?, NULL, ?)",
        { replacements: [tokenHash(token), userId, invitedBy.id, expiresAt, now], transaction },
      );
      await enqueueMail(
        {
          to: [input.email],
          subject: "You are invited to Greaseledger",
          text: [
            `Hello ${input.name},`,
            "",
            `${invitedBy.name} has invited you to Greaseledger as ${ROLE_LABELS[input.role]}.`,
            `Set your password with this link (it works once, for ${INVITATION_VALID_HOURS} hours):`,
            "",
            link,
            "",
            "If you did not expect this mail, ignore it.",
          ].join("\n"),
        },
        transaction,
        now,
      );
      await appendAudit({ event: "user.invited", actorId: invitedBy.id, subjectType: "user", subjectId: userId, payload: { email: input.email, role: input.role, siteIds: [...new Set(input.siteIds)] } }, transaction, now);
    });
  } catch (error) {
    if ((error as { name?: string }).name === "SequelizeUniqueConstraintError" || (error as { original?: { errno?: number } }).original?.errno === 1062) {
      throw new ValidationError({ email: ["A user with this e-mail address already exists."] });
    }
    throw error;
  }
  log("info", "user_invited", { userId, role: input.role, by: invitedBy.id });
  return { userId };
}

export type InvitationState =
  | { state: "valid"; email: string; name: string }
  | { state: "expired" | "used" | "unknown" };

export async function getInvitation(token: string, now = new Date()): Promise<InvitationState> {
  const [row] = await getSequelize().query<{ expires_at: Date; used_at: Date | null; email: string; name: string }>(
    `SELECT i.expires_at, i.used_at, u.email, u.name FROM user_invitation i JOIN app_user u ON u.id = i.user_id
     WHERE i.token_hash = ?`,
    { replacements: [tokenHash(token)], type: QueryTypes.SELECT },
  );
  if (!row) return { state: "unknown" };
  if (row.used_at) return { state: "used" };
  if (new Date(row.expires_at).getTime() <= now.getTime()) return { state: "expired" };
  return { state: "valid", email: row.email, name: row.name };
}

/** Uses an invitation once: sets the password and activates the account. */
export async function acceptInvitation(token: string, password: string, now = new Date()): Promise<{ email: string }> {
  const sequelize = getSequelize();
  const passwordHash = await hashPassword(password);
  return sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<{ user_id: string; expires_at: Date; used_at: Date | null; email: string; status: string }>(
      `SELECT i.user_id, i.expires_at, i.used_at, u.email, u.status FROM user_invitation i
       JOIN app_user u ON u.id = i.user_id WHERE i.token_hash = ? FOR UPDATE`,
      { replacements: [tokenHash(token)], type: QueryTypes.SELECT, transaction },
    );
    if (!row) throw new NotFoundError("This invitation link is not known.");
    if (row.used_at) throw new ConflictError("invitation_used", "This invitation link has already been used.");
    if (new Date(row.expires_at).getTime() <= now.getTime())
      throw new ConflictError("invitation_expired", "This invitation link has expired. Ask an administrator for a new one.");
    if (row.status === "disabled") throw new ConflictError("user_disabled", "This account has been disabled.");
    await sequelize.query("UPDATE user_invitation SET used_at = ? WHERE token_hash = ?", {
      replacements: [now, tokenHash(token)],
      transaction,
    });
    await sequelize.query("UPDATE app_user SET password_hash = ?, status = 'active', updated_at = ? WHERE id = ?", {
      replacements: [passwordHash, now, row.user_id],
      transaction,
    });
    log("info", "invitation_accepted", { userId: row.user_id });
    await appendAudit({ event: "user.activated", actorId: row.user_id, subjectType: "user", subjectId: row.user_id, payload: {} }, transaction, now);
    return { email: row.email };
  });
}

async function requireUser(userId: string) {
  const [row] = await getSequelize().query<{ id: string; role: Role; status: string }>(
    "SELECT id, role, status FROM app_user WHERE id = ?",
    { replacements: [userId], type: QueryTypes.SELECT },
  );
  if (!row) throw new NotFoundError("No such user.");
  return row;
}

/** Changes a role; the user's sessions end at once so the new role applies from the next sign-in. */
export async function changeRole(userId: string, role: Role, by: { id: string }, now = new Date()): Promise<void> {
  const user = await requireUser(userId);
  if (user.id === by.id) throw new ConflictError("own_account", "You cannot change your own role.");
  if (user.role === role) return;
  await getSequelize().transaction(async (transaction) => {
    await getSequelize().query("UPDATE app_user SET role = ?, updated_at = ? WHERE id = ?", { replacements: [role, now, userId], transaction });
    await appendAudit({ event: "user.role_changed", actorId: by.id, subjectType: "user", subjectId: userId, payload: { from: user.role, to: role } }, transaction, now);
  });
  await invalidateUserSessions(userId);
  log("info", "role_changed", { userId, from: user.role, to: role, by: by.id });
}

export async function setSiteAccess(userId: string, siteIds: number[], by: { id: string }, now = new Date()): Promise<void> {
  await requireUser(userId);
  await assertSitesExist(siteIds);
  const sequelize = getSequelize();
  await sequelize.transaction(async (transaction) => {
    await sequelize.query("DELETE FROM user_site_access WHERE user_id = ?", { replacements: [userId], transaction });
    for (const siteId of new Set(siteIds)) {
      await sequelize.query("INSERT INTO user_site_access (user_id, site_id, created_at) VALUES (?, ?, ?)", {
        replacements: [userId, siteId, now],
        transaction,
      });
    }
    await appendAudit({ event: "user.sites_changed", actorId: by.id, subjectType: "user", subjectId: userId, payload: { siteIds: [...new Set(siteIds)] } }, transaction, now);
  });
  log("info", "site_access_changed", { userId, siteIds, by: by.id });
}

/** Disables or re-enables an account. Disabling ends every session of that user at once. */
export async function setUserDisabled(userId: string, disabled: boolean, by: { id: string }, now = new Date()): Promise<void> {
  const user = await requireUser(userId);
  if (user.id === by.id) throw new ConflictError("own_account", "You cannot disable your own account.");
  await getSequelize().transaction(async (transaction) => {
    if (disabled) {
      await getSequelize().query("UPDATE app_user SET status = 'disabled', disabled_at = ?, updated_at = ? WHERE id = ?", { replacements: [now, now, userId], transaction });
    } else {
      await getSequelize().query("UPDATE app_user SET status = IF(password_hash IS NULL, 'invited', 'active'), disabled_at = NULL, updated_at = ? WHERE id = ?", {
        replacements: [now, userId],
        transaction,
      });
    }
    await appendAudit({ event: disabled ? "user.disabled" : "user.enabled", actorId: by.id, subjectType: "user", subjectId: userId, payload: {} }, transaction, now);
  });
  if (disabled) await invalidateUserSessions(userId);
  log("info", disabled ? "user_disabled" : "user_enabled", { userId, by: by.id });
}

export async function setUnitSystem(userId: string, unitSystem: "metric" | "imperial"): Promise<void> {
  await getSequelize().query("UPDATE app_user SET unit_system = ?, updated_at = ? WHERE id = ?", {
    replacements: [unitSystem, new Date(), userId],
  });
}

/** The e-mail addresses of a site's active lubrication leads (for reorder and incident mail). */
export async function siteLeadEmails(siteId: number, transaction?: Transaction): Promise<string[]> {
  return siteRoleEmails(siteId, ["lead"], transaction);
}

/** The e-mail addresses of a site's active users with one of these roles, each once, sorted. */
export async function siteRoleEmails(siteId: number, roles: readonly Role[], transaction?: Transaction): Promise<string[]> {
  if (!roles.length) return [];
  const rows = await getSequelize().query<{ email: string }>(
    `SELECT DISTINCT u.email FROM app_user u JOIN user_site_access a ON a.user_id = u.id
     WHERE a.site_id = :siteId AND u.role IN (:roles) AND u.status = 'active' ORDER BY u.email`,
    { replacements: { siteId, roles: [...roles] }, type: QueryTypes.SELECT, transaction },
  );
  return rows.map((r) => r.email);
}
