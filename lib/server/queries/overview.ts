import "server-only";
import { QueryTypes } from "sequelize";
import { getSequelize } from "../db";

export interface AdminOverview {
  users: { active: number; invited: number; disabled: number };
  sites: number;
  outbox: { pending: number; dead: number; sent: number };
}

/** Counts for the administrator's overview, in two statements. */
export async function getAdminOverview(): Promise<AdminOverview> {
  const sequelize = getSequelize();
  const [users] = await sequelize.query<{ active: number; invited: number; disabled: number; sites: number }>(
    `SELECT SUM(status = 'active') AS active, SUM(status = 'invited') AS invited, SUM(status = 'disabled') AS disabled,
            (SELECT COUNT(*) FROM site) AS sites
     FROM app_user`,
    { type: QueryTypes.SELECT },
  );
  const [outbox] = await sequelize.query<{ pending: number; dead: number; sent: number }>(
    `SELECT SUM(status IN ('pending','sending')) AS pending, SUM(status = 'dead') AS dead, SUM(status = 'sent') AS sent
     FROM mail_outbox`,
    { type: QueryTypes.SELECT },
  );
  return {
    users: { active: Number(users?.active ?? 0), invited: Number(users?.invited ?? 0), disabled: Number(users?.disabled ?? 0) },
    sites: Number(users?.sites ?? 0),
    outbox: { pending: Number(outbox?.pending ?? 0), dead: Number(outbox?.dead ?? 0), sent: Number(outbox?.sent ?? 0) },
  };
}

/** The sites a user may see, by name. */
export async function getUserSites(userId: string): Promise<{ id: number; code: string; name: string }[]> {
  const rows = await getSequelize().query<{ id: number; code: string; name: string }>(
    "SELECT s.id, s.code, s.name FROM user_site_access a JOIN site s ON s.id = a.site_id WHERE a.user_id = ? ORDER BY s.name",
    { replacements: [userId], type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ id: Number(r.id), code: r.code, name: r.name }));
}
