import mariadb from "mariadb";
import { describe, expect, it } from "vitest";
import { Client, rootQuery } from "./helpers";

// The audit trail of the running app (reliability.md §B.4): verification over the API, and the database refusing
// changes to the trail — by grants for the app's own account, by triggers for everyone.
const appConnection = () =>
  mariadb.createConnection({
    host: process.env.DATABASE_HOST,
    port: Number(process.env.DATABASE_PORT),
    user: process.env.DATABASE_USER,
    password: process.env.DATABASE_PASSWORD,
    database: process.env.DATABASE_NAME,
  });

describe("the audit trail of the running app", () => {
  it("records sign-ins and stock work, and an auditor's check finds the chain intact; a lead may not run it", async () => {
    const lead = new Client();
    await lead.signIn("lead@example.com");
    const [row] = await rootQuery<{ event: string; payload_json: string }>(
      "SELECT event, payload_json FROM audit_log ORDER BY seq DESC LIMIT 1",
    );
    expect(row!.event).toBe("session.signed_in");
    expect(row!.payload_json).not.toMatch(/password/i);

    const auditor = new Client();
    await auditor.signIn("auditor@example.com");
    const answer = await auditor.request("GET", "/api/v1/audit/verify");
    expect(answer.status).toBe(200);
    expect(answer.body).toMatchObject({ ok: true });
    const [count] = await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM audit_log");
    expect(answer.body.checked).toBeGreaterThanOrEqual(Number(count!.n) - 5); // others may be signing in meanwhile
    expect(answer.body.firstBrokenSeq).toBeUndefined();
    expect((await lead.request("GET", "/api/v1/audit/verify")).status).toBe(403);
  });

  it("the app's database account can read and append, but cannot change or delete entries, nor change the schema", async () => {
    const conn = await appConnection();
    try {
      const [first] = (await conn.query("SELECT seq FROM audit_log ORDER BY seq LIMIT 1")) as {
        seq: bigint;
      }[];
      expect(first).toBeDefined();
      await expect(
        conn.query("UPDATE audit_log SET event = 'x' WHERE seq = ?", [first!.seq]),
      ).rejects.toMatchObject({ errno: 1142 });
      await expect(conn.query("DELETE FROM audit_log WHERE seq = ?", [first!.seq])).rejects.toMatchObject({
        errno: 1142,
      });
      await expect(conn.query("DROP TRIGGER audit_log_no_update")).rejects.toMatchObject({
        errno: expect.any(Number),
      });
      // The chain head moves only by appending (trigger audit_log_follows_head): no direct change by the app.
      await expect(conn.query("UPDATE audit_head SET seq = seq + 1 WHERE id = 1")).rejects.toMatchObject({
        errno: 1142,
      });
      await expect(conn.query("ALTER TABLE stock_lot ADD COLUMN x INT")).rejects.toMatchObject({
        errno: 1142,
      });
      // Everything else the app does still works through this account.
      expect(
        ((await conn.query("SELECT COUNT(*) AS n FROM stock_lot")) as { n: bigint }[])[0]!.n,
      ).toBeGreaterThan(0n);
    } finally {
      await conn.end();
    }
  });

  it("an entry that does not follow the chain head is refused, even from a privileged account", async () => {
    const [head] = await rootQuery<{ seq: number; hash: string }>("SELECT seq, hash FROM audit_head WHERE id = 1");
    const insert = (seq: number, prev: string) =>
      rootQuery(
        "INSERT INTO audit_log (seq, at, actor_id, site_id, event, subject_type, subject_id, payload_json, prev_hash, hash) VALUES (?, NOW(3), NULL, NULL, 'test.forged', NULL, NULL, '{}', ?, ?)",
        [seq, prev, "f".repeat(64)],
      );
    await expect(insert(Number(head!.seq) + 2, head!.hash)).rejects.toMatchObject({ errno: 1644 });
    await expect(insert(Number(head!.seq) + 1, "0".repeat(64))).rejects.toMatchObject({ errno: 1644 });
    const [forged] = await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM audit_log WHERE event = 'test.forged'");
    expect(Number(forged!.n)).toBe(0);
  });

  it("even a privileged account meets the triggers: entries are not updated or deleted in place", async () => {
    await expect(rootQuery("UPDATE audit_log SET event = 'x' ORDER BY seq LIMIT 1")).rejects.toMatchObject({
      errno: 1644,
    });
    await expect(rootQuery("DELETE FROM audit_log ORDER BY seq LIMIT 1")).rejects.toMatchObject({
      errno: 1644,
    });
  });
});
