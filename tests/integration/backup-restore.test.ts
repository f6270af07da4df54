import { spawn } from "node:child_process";
import { copyFileSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import type { Sequelize } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Client, ROOT, rootConnection } from "./helpers";

// The restore drill (reliability.md §B.5 R1, R2): the real `db:backup` / `db:restore` script against the test
// server. The seeded test database is backed up while the app serves from it and restored under another name, so
// the other test files and the app keep their database; the restore that replaces a database in place is run on a
// scratch database of this file's own.
const LIVE = process.env.DATABASE_NAME!;
const COPY = "gl_restore_copy";
const LOAD = "gl_restore_load";
const DIR = path.join(process.env.GL_TEST_TMP ?? path.join(ROOT, ".test-artifacts"), "backups");

interface Run {
  code: number | null;
  out: string;
}

/** Runs `node scripts/backup.mjs …` as `npm run db:backup` / `db:restore` would, against the test server. */
function script(args: string[], database: string): Promise<Run> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, [path.join(ROOT, "scripts", "backup.mjs"), ...args], {
      cwd: ROOT,
      env: { ...process.env, DATABASE_NAME: database, BACKUP_DIR: DIR },
      stdio: ["ignore", "pipe", "pipe"],
    });
    let out = "";
    child.stdout.on("data", (d) => (out += d));
    child.stderr.on("data", (d) => (out += d));
    child.on("error", reject);
    child.on("close", (code) => resolve({ code, out }));
  });
}

async function ok(args: string[], database: string): Promise<string> {
  const run = await script(args, database);
  if (run.code !== 0) throw new Error(`backup.mjs ${args.join(" ")} exited with ${run.code}:\n${run.out}`);
  return run.out;
}

async function root<T = Record<string, unknown>>(sql: string, params: unknown[] = []): Promise<T[]> {
  const conn = await rootConnection(null);
  try {
    return (await conn.query(sql, params)) as T[];
  } finally {
    await conn.end();
  }
}

async function databases(): Promise<string[]> {
  return (await root<{ Database: string }>("SHOW DATABASES")).map((r) => r.Database);
}

/** Every base table's CHECKSUM TABLE value and row count, read here (not by the code under test). */
async function checksums(database: string): Promise<Record<string, string>> {
  const tables = (
    await root<{ name: string }>(
      "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = ? AND table_type = 'BASE TABLE' ORDER BY table_name",
      [database],
    )
  ).map((r) => r.name);
  const result: Record<string, string> = {};
  if (!tables.length) return result;
  const rows = await root<{ Table: string; Checksum: bigint | number | null }>(
    `CHECKSUM TABLE ${tables.map((t) => `\`${database}\`.\`${t}\``).join(", ")} EXTENDED`,
  );
  const counts = await root<{ t: string; n: bigint }>(
    tables.map((t) => `SELECT '${t}' AS t, COUNT(*) AS n FROM \`${database}\`.\`${t}\``).join(" UNION ALL "),
  );
  const countOf = new Map(counts.map((c) => [c.t, String(c.n)]));
  for (const row of rows) {
    const table = row.Table.slice(database.length + 1);
    result[table] = `${row.Checksum} / ${countOf.get(table)} rows`;
  }
  return result;
}

/** Waits until the server has let go of every connection to `database` (a closed client's thread ends a moment later). */
async function released(database: string) {
  for (let i = 0; i < 100; i++) {
    const [row] = await root<{ n: bigint }>(
      "SELECT COUNT(*) AS n FROM information_schema.processlist WHERE db = ? AND id <> CONNECTION_ID()",
      [database],
    );
    if (Number(row!.n) === 0) return;
    await new Promise((r) => setTimeout(r, 50));
  }
  throw new Error(`connections to ${database} stayed open`);
}

type Holder = { __greaseledgerSequelize?: Sequelize };

/** Runs `fn` with the app's own code (as the app's account) pointed at `database`. */
async function onDatabase<T>(database: string, fn: () => Promise<T>): Promise<T> {
  const { parseEnv } = await import("@/lib/env");
  const { createSequelize } = await import("@/lib/server/db");
  const holder = globalThis as Holder;
  const sequelize = createSequelize(parseEnv({ ...process.env, DATABASE_NAME: database }), { poolMax: 4 });
  holder.__greaseledgerSequelize = sequelize;
  try {
    return await fn();
  } finally {
    holder.__greaseledgerSequelize = undefined;
    await sequelize.close();
  }
}

const newestManifest = (out: string) => {
  const match = /backup written: (\S+\.sql\.gz)/.exec(out);
  if (!match) throw new Error(`no file in:\n${out}`);
  const file = path.resolve(ROOT, match[1]!);
  return { file, manifest: JSON.parse(readFileSync(file.replace(/\.sql\.gz$/, ".json"), "utf8")) };
};

beforeAll(async () => {
  mkdirSync(DIR, { recursive: true });
  for (const db of [COPY, `${COPY}_pre_restore`, LOAD, `${LOAD}_pre_restore`])
    await root(`DROP DATABASE IF EXISTS \`${db}\``);
});

afterAll(async () => {
  for (const db of [COPY, `${COPY}_pre_restore`, LOAD, `${LOAD}_pre_restore`])
    await root(`DROP DATABASE IF EXISTS \`${db}\``);
});

describe("backup and restore", () => {
  let backupFile = "";

  it("backs up the seeded database while the app runs and restores every table exactly, chain and grants included", async () => {
    // A sign-in through the app: the trail has at least one entry whichever tests ran before this one.
    expect((await new Client().signIn("auditor@example.com")).status).toBe(200);
    // The app (and its mail relay) may write while we look: a snapshot taken between two equal readings equals both.
    let before: Record<string, string> = {};
    let out = "";
    for (let attempt = 1; ; attempt++) {
      before = await checksums(LIVE);
      out = await ok(["backup"], LIVE);
      const after = await checksums(LIVE);
      if (JSON.stringify(after) === JSON.stringify(before)) break;
      if (attempt === 3) throw new Error("the test database kept changing during three backups");
    }
    expect(Object.keys(before).length).toBeGreaterThan(20);
    const { file, manifest } = newestManifest(out);
    backupFile = file;
    expect(manifest).toMatchObject({ database: LIVE, format: 1 });
    expect(Object.keys(manifest.tables).sort()).toEqual(Object.keys(before).sort());
    for (const [table, reading] of Object.entries(before))
      expect(`${manifest.tables[table].checksum} / ${manifest.tables[table].rows} rows`, table).toBe(reading);

    const restored = await ok(["restore", file], COPY);
    expect(restored).toContain(`into ${COPY}`);
    expect(restored).not.toContain("warning");
    expect(await checksums(COPY)).toEqual(before);
    expect(await databases()).not.toContain(`${COPY}_restoring`);

    // The chain verifies in the copy, as the app's account, with the app's own verifier, and ends at the head; and
    // it goes on: an entry appended through the app's code follows the restored head (trigger and rights in place).
    const { recordAudit, verifyAuditChain } = await import("@/lib/server/audit");
    const chain = await onDatabase(COPY, async () => {
      const restoredChain = await verifyAuditChain();
      await recordAudit({ event: "test.after_restore", actorId: null });
      return { restoredChain, next: await verifyAuditChain() };
    });
    expect(chain.restoredChain).toMatchObject({ ok: true, headSeq: manifest.auditHead.seq });
    expect(chain.restoredChain.checked).toBe(chain.restoredChain.headSeq);
    expect(chain.restoredChain.headSeq).toBeGreaterThan(0);
    expect(chain.next).toMatchObject({ ok: true, headSeq: manifest.auditHead.seq + 1 });

    // The copy's triggers came along, and the app's account has its usual rights there: append-only audit trail.
    const triggers = await root<{ name: string }>(
      "SELECT trigger_name AS name FROM information_schema.triggers WHERE trigger_schema = ? ORDER BY trigger_name",
      [COPY],
    );
    const liveTriggers = await root<{ name: string }>(
      "SELECT trigger_name AS name FROM information_schema.triggers WHERE trigger_schema = ? ORDER BY trigger_name",
      [LIVE],
    );
    expect(triggers.map((t) => t.name)).toEqual(liveTriggers.map((t) => t.name));
    expect(triggers.map((t) => t.name)).toContain("audit_log_follows_head");
    const rights = await root<{ table_name: string; rights: string | string[] }>(
      "SELECT table_name, table_priv AS rights FROM mysql.tables_priv WHERE db = ? AND user = 'app' AND host = '127.0.0.1'",
      [COPY],
    );
    // The driver reads the SET column as a list.
    const rightsOf = new Map(rights.map((r) => [r.table_name, [r.rights].flat().join(",")]));
    expect(rightsOf.size).toBe(Object.keys(before).length);
    expect(rightsOf.get("audit_log")).toBe("Select,Insert");
    expect(rightsOf.get("audit_head")).toBe("Select");
    expect(rightsOf.get("stock_lot")).toBe("Select,Insert,Update,Delete");

    // The app's own database kept its rights: the app still signs people in.
    expect((await new Client().signIn("lead@example.com")).status).toBe(200);
  });

  it("refuses a damaged backup and leaves the database as it was", async () => {
    const damaged = path.join(DIR, "damaged.sql.gz");
    copyFileSync(backupFile, damaged);
    copyFileSync(backupFile.replace(/\.sql\.gz$/, ".json"), path.join(DIR, "damaged.json"));
    const bytes = readFileSync(damaged);
    const at = Math.floor(bytes.length / 2);
    bytes[at] = bytes[at]! ^ 0xff;
    writeFileSync(damaged, bytes);

    const before = await checksums(COPY);
    const run = await script(["restore", damaged], COPY);
    expect(run.code).toBe(1);
    expect(run.out).toContain(`${damaged} is damaged: its SHA-256 is`);
    expect(run.out).toContain("Nothing was changed");
    expect(await checksums(COPY)).toEqual(before);
    expect(await databases()).not.toContain(`${COPY}_restoring`);
  });

  it("a dump taken during writes holds one moment; a restore in place keeps the old tables aside", async () => {
    // A database of this file's own with the seeded content: the copy restored above, under another name.
    await ok(["restore", backupFile], LOAD);
    const { appendAudit, recordAudit, verifyAuditChain } = await import("@/lib/server/audit");
    const { getSequelize } = await import("@/lib/server/db");
    let seqBefore = 0;
    let seqAfter = 0;
    let out = "";
    await onDatabase(LOAD, async () => {
      seqBefore = (await verifyAuditChain()).headSeq;
      // Three writers run for as long as the backup does. Each transaction writes a row to a table the dump reads
      // late (sign_in_throttle) and an audit entry (audit_head and audit_log are read early): a dump that read the
      // tables at different moments would hold more rows of one than of the other.
      let running = true;
      const writers = Array.from({ length: 3 }, async (_, w) => {
        for (let i = 0; running; i++)
          await getSequelize().transaction(async (transaction) => {
            await getSequelize().query(
              "INSERT INTO sign_in_throttle (throttle_key, failures, window_started_at, updated_at) VALUES (?, 0, NOW(3), NOW(3))",
              { replacements: [`backup-drill:${w}:${i}`], transaction },
            );
            await appendAudit({ event: "test.during_backup", actorId: null, payload: { w, i } }, transaction);
          });
      });
      try {
        out = await ok(["backup"], LOAD);
      } finally {
        running = false;
        await Promise.allSettled(writers);
      }
      await Promise.all(writers);
      seqAfter = (await verifyAuditChain()).headSeq;
    });
    const { file, manifest } = newestManifest(out);
    expect(seqAfter).toBeGreaterThan(seqBefore);
    expect(manifest.auditHead.seq).toBeGreaterThanOrEqual(seqBefore);
    expect(manifest.auditHead.seq).toBeLessThanOrEqual(seqAfter);
    const live = await checksums(LOAD);
    await released(LOAD);

    // A connection to the database (the app's pool would hold some) stops the restore before it starts.
    const { default: mariadb } = await import("mariadb");
    const appConn = await mariadb.createConnection({
      host: process.env.DATABASE_HOST,
      port: Number(process.env.DATABASE_PORT),
      user: process.env.DATABASE_USER,
      password: process.env.DATABASE_PASSWORD,
      database: LOAD,
    });
    try {
      const refused = await script(["restore"], LOAD);
      expect(refused.code).toBe(1);
      expect(refused.out).toMatch(
        new RegExp(`The database ${LOAD} is in use \\(connections: \\d+ of app\\)`),
      );
    } finally {
      await appConn.end();
    }
    await released(LOAD);
    expect(await checksums(LOAD)).toEqual(live);

    // A backup whose manifest disagrees with what the file holds is refused after loading, before the swap.
    const manifestFile = file.replace(/\.sql\.gz$/, ".json");
    const original = readFileSync(manifestFile, "utf8");
    const wrong = JSON.parse(original);
    wrong.tables.audit_log.rows += 1;
    writeFileSync(manifestFile, JSON.stringify(wrong));
    const mismatch = await script(["restore"], LOAD);
    writeFileSync(manifestFile, original);
    expect(mismatch.code).toBe(1);
    expect(mismatch.out).toContain(`audit_log has ${manifest.tables.audit_log.rows} rows, the manifest says`);
    expect(await checksums(LOAD)).toEqual(live);

    // Without a file name the newest backup of the database is restored, in place.
    await released(LOAD);
    const restored = await ok(["restore"], LOAD);
    expect(restored).toContain(path.basename(file));
    expect(restored).toContain(`kept in ${LOAD}_pre_restore`);
    expect(restored).not.toContain("warning");
    expect(await checksums(`${LOAD}_pre_restore`)).toEqual(live);
    const check = await onDatabase(LOAD, async () => {
      const result = await verifyAuditChain();
      // The restored chain goes on: the app appends after the restored head, through the restored trigger.
      await recordAudit({ event: "test.after_restore", actorId: null });
      return { result, next: await verifyAuditChain() };
    });
    // One moment: the head is the last entry, and every writer transaction in the dump is there whole.
    expect(check.result).toMatchObject({
      ok: true,
      headSeq: manifest.auditHead.seq,
      checked: manifest.auditHead.seq,
    });
    const [whole] = await root<{ entries: bigint; throttle_rows: bigint }>(
      `SELECT (SELECT COUNT(*) FROM \`${LOAD}\`.audit_log WHERE event = 'test.during_backup') AS entries,
              (SELECT COUNT(*) FROM \`${LOAD}\`.sign_in_throttle WHERE throttle_key LIKE 'backup-drill:%') AS throttle_rows`,
    );
    expect(Number(whole!.throttle_rows)).toBe(Number(whole!.entries));
    expect(Number(whole!.entries)).toBe(manifest.auditHead.seq - seqBefore);
    expect(check.next).toMatchObject({ ok: true, headSeq: manifest.auditHead.seq + 1 });

    // The app's account has its usual rights on the restored tables: the audit trail is append-only for it.
    const conn = await mariadb.createConnection({
      host: process.env.DATABASE_HOST,
      port: Number(process.env.DATABASE_PORT),
      user: process.env.DATABASE_USER,
      password: process.env.DATABASE_PASSWORD,
      database: LOAD,
    });
    try {
      await expect(conn.query("DELETE FROM audit_log WHERE seq = 1")).rejects.toThrow(/command denied/);
      await expect(conn.query("UPDATE audit_head SET seq = 0")).rejects.toThrow(/command denied/);
    } finally {
      await conn.end();
    }
  });
});
