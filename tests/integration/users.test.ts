import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Client, createUser, rootQuery, uniqueEmail } from "./helpers";

type Users = typeof import("@/lib/server/queries/users");
let users: Users;

beforeAll(async () => {
  users = await import("@/lib/server/queries/users");
});

afterAll(async () => {
  const { getSequelize } = await import("@/lib/server/db");
  const { getMysqlPool } = await import("@/lib/server/mysql-pool");
  await getSequelize().close();
  await getMysqlPool().end();
});

async function adminId() {
  const [row] = await rootQuery<{ id: string }>("SELECT id FROM app_user WHERE email = 'admin@example.com'");
  return row!.id;
}

describe("user management ends sessions at once", () => {
  it("role change ends sessions: a role change ends every session of that user", async () => {
    const user = await createUser({ email: uniqueEmail("promoted"), role: "technician" });
    const phone = new Client();
    const desk = new Client();
    await phone.signIn(user.email, user.password);
    await desk.signIn(user.email, user.password);
    expect((await phone.request("GET", "/api/v1/me")).body.user.role).toBe("technician");

    await users.changeRole(user.id, "lead", { id: await adminId() });

    expect((await phone.request("GET", "/api/v1/me")).status).toBe(401);
    expect((await desk.request("GET", "/api/v1/me")).status).toBe(401);
    const again = new Client();
    await again.signIn(user.email, user.password);
    expect((await again.request("GET", "/api/v1/me")).body.user.role).toBe("lead");
  });

  it("disabling ends sessions: the session ends, and the disabled person cannot sign in with the right password", async () => {
    const user = await createUser({ email: uniqueEmail("leaver"), role: "clerk" });
    const client = new Client();
    await client.signIn(user.email, user.password);
    await users.setUserDisabled(user.id, true, { id: await adminId() });
    expect((await client.request("GET", "/api/v1/me")).status).toBe(401);
    const retry = await new Client().signIn(user.email, user.password);
    expect(retry.status).toBe(401);
    expect(retry.body.error.code).toBe("invalid_credentials");
    await rootQuery("DELETE FROM sign_in_throttle");
  });

  it("an admin cannot disable or demote their own account", async () => {
    const id = await adminId();
    await expect(users.setUserDisabled(id, true, { id })).rejects.toThrow(/your own account/);
    await expect(users.changeRole(id, "clerk", { id })).rejects.toThrow(/your own role/);
  });
});

describe("invitations", () => {
  it("writes user, site access, invitation and mail in one go; the link works once and only before it expires", async () => {
    const email = uniqueEmail("invitee");
    const [site] = await rootQuery<{ id: number }>("SELECT id FROM site ORDER BY id LIMIT 1");
    const { userId } = await users.inviteUser({ email, name: "Ines Calloway", role: "auditor", siteIds: [Number(site!.id)] }, { id: await adminId(), name: "Ada" });
    const [mail] = await rootQuery<{ text_body: string; to_addresses: string }>(
      "SELECT text_body, to_addresses FROM mail_outbox WHERE to_addresses = ? ORDER BY id DESC LIMIT 1",
      [email],
    );
    expect(mail!.text_body).toContain("/invite/");
    const token = mail!.text_body.match(/\/invite\/([A-Za-z0-9_-]+)/)![1]!;
    expect(await rootQuery("SELECT * FROM user_site_access WHERE user_id = ?", [userId])).toHaveLength(1);
    // Only the token's hash is stored.
    expect(await rootQuery("SELECT * FROM user_invitation WHERE token_hash = ?", [token])).toHaveLength(0);

    expect((await users.getInvitation(token)).state).toBe("valid");
    const later = new Date(Date.now() + (users.INVITATION_VALID_HOURS + 1) * 3_600_000);
    expect((await users.getInvitation(token, later)).state).toBe("expired");
    await expect(users.acceptInvitation(token, "long enough password", later)).rejects.toThrow(/expired/);

    await users.acceptInvitation(token, "long enough password");
    expect((await users.getInvitation(token)).state).toBe("used");
    await expect(users.acceptInvitation(token, "another long password")).rejects.toThrow(/already been used/);
    const signIn = await new Client().signIn(email, "long enough password");
    expect(signIn.status).toBe(200);
    expect(signIn.body.user.role).toBe("auditor");
  });

  it("refuses a second user with the same e-mail, naming the field, and writes nothing", async () => {
    // The app's own relay may queue the weekly expiry mail at any moment; it is not this test's business.
    const before = await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM mail_outbox WHERE subject NOT LIKE 'Stock near expiry%'");
    await expect(
      users.inviteUser({ email: "lead@example.com", name: "Copy", role: "lead", siteIds: [] }, { id: await adminId(), name: "Ada" }),
    ).rejects.toMatchObject({ fields: { email: ["A user with this e-mail address already exists."] } });
    const after = await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM mail_outbox WHERE subject NOT LIKE 'Stock near expiry%'");
    expect(Number(after[0]!.n)).toBe(Number(before[0]!.n));
  });

  it("refuses an unknown site", async () => {
    await expect(
      users.inviteUser({ email: uniqueEmail("nosite"), name: "X", role: "clerk", siteIds: [999999] }, { id: await adminId(), name: "Ada" }),
    ).rejects.toMatchObject({ fields: { siteIds: ["A chosen site does not exist."] } });
  });
});
