import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createScratchDatabase, rootConnection } from "./helpers";

// A database of its own: these tests tamper with the trail on purpose (reliability.md §B.4, T1–T5).
const DB = "gl_audit_test";
process.env.DATABASE_NAME = DB;

let audit: typeof import("@/lib/server/audit");

beforeAll(async () => {
  await createScratchDatabase(DB);
  audit = await import("@/lib/server/audit");
});

afterAll(async () => {
  const { getSequelize } = await import("@/lib/server/db");
  await getSequelize().close();
});

/** Runs SQL as root with the guard triggers lifted, as someone with full control of the server could. */
async function tamper(sql: string, params: unknown[] = []) {
  const conn = await rootConnection(DB);
  try {
    await conn.query("DROP TRIGGER IF EXISTS audit_log_no_update");
    await conn.query("DROP TRIGGER IF EXISTS audit_log_no_delete");
    return await conn.query(sql, params);
  } finally {
    await conn.query(
      `CREATE TRIGGER audit_log_no_update BEFORE UPDATE ON audit_log FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'append-only'`,
    );
    await conn.query(
      `CREATE TRIGGER audit_log_no_delete BEFORE DELETE ON audit_log FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'append-only'`,
    );
    await conn.end();
  }
}

async function rows() {
  const conn = await rootConnection(DB);
  try {
    return (await conn.query("SELECT seq, prev_hash, hash, payload_json FROM audit_log ORDER BY seq")) as {
      seq: bigint;
      prev_hash: string;
      hash: string;
      payload_json: string;
    }[];
  } finally {
    await conn.end();
  }
}

describe("the hash-chained audit trail", () => {
  it("an empty trail verifies; 50 concurrent appends form one unbroken chain (T1, T5)", async () => {
    expect(await audit.verifyAuditChain()).toMatchObject({ ok: true, checked: 0 });
    const actor = randomUUID();
    await Promise.all(
      Array.from({ length: 50 }, (_, i) =>
        audit.recordAudit({
          event: "test.appended",
          actorId: actor,
          subjectType: "test",
          subjectId: i,
          payload: { i, text: 'Fett «Ölbad» = 5 %, "quoted"\nnew line' },
        }),
      ),
    );
    const all = await rows();
    expect(all.map((r) => Number(r.seq))).toEqual(Array.from({ length: 50 }, (_, i) => i + 1));
    expect(new Set(all.map((r) => r.prev_hash)).size).toBe(50);
    for (let i = 1; i < all.length; i++) expect(all[i]!.prev_hash).toBe(all[i - 1]!.hash);
    expect(await audit.verifyAuditChain()).toMatchObject({
      ok: true,
      checked: 50,
      headSeq: 50,
      headHash: all[49]!.hash,
    });
  });

  it("one byte changed in entry 17 is reported at entry 17 (T2)", async () => {
    const [original] = (await rows()).filter((r) => Number(r.seq) === 17);
    const changed = original!.payload_json.replace("Fett", "Fatt");
    expect(changed).not.toBe(original!.payload_json);
    await tamper("UPDATE audit_log SET payload_json = ? WHERE seq = 17", [changed]);
    expect(await audit.verifyAuditChain()).toMatchObject({ ok: false, firstBrokenSeq: 17, problem: "hash" });
    await tamper("UPDATE audit_log SET payload_json = ? WHERE seq = 17", [original!.payload_json]);
    expect(await audit.verifyAuditChain()).toMatchObject({ ok: true });
  });

  it("a deleted entry is reported where it is missing, also at the end of the chain (T3)", async () => {
    await tamper("DELETE FROM audit_log WHERE seq = 30");
    expect(await audit.verifyAuditChain()).toMatchObject({ ok: false, firstBrokenSeq: 30, problem: "gap" });
    await tamper("DELETE FROM audit_log WHERE seq >= 49");
    const check = await audit.verifyAuditChain();
    expect(check).toMatchObject({ ok: false, firstBrokenSeq: 30 });
  });

  it("the end cut off alone is found against the chain head", async () => {
    await createScratchDatabase(DB);
    const { getSequelize } = await import("@/lib/server/db");
    await getSequelize().close();
    // A fresh pool on the re-created database.
    (globalThis as { __greaseledgerSequelize?: unknown }).__greaseledgerSequelize = undefined;
    for (let i = 0; i < 5; i++)
      await audit.recordAudit({ event: "test.appended", actorId: null, payload: { i } });
    await tamper("DELETE FROM audit_log WHERE seq = 5");
    expect(await audit.verifyAuditChain()).toMatchObject({
      ok: false,
      checked: 4,
      firstBrokenSeq: 5,
      problem: "gap",
    });
  });
});
