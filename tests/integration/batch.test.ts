import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createScratchDatabase, rootConnection } from "./helpers";

// A database of its own: the statements below write to a table made for them.
const DB = "gl_batch_test";
process.env.DATABASE_NAME = DB;

let batch: typeof import("@/lib/server/batch");
let db: typeof import("@/lib/server/db");
let idem: typeof import("@/lib/server/idempotency");

beforeAll(async () => {
  await createScratchDatabase(DB);
  const conn = await rootConnection(DB);
  try {
    await conn.query("CREATE TABLE batch_probe (id INT PRIMARY KEY, n INT NOT NULL) ENGINE=InnoDB");
    await conn.query("INSERT INTO batch_probe VALUES (1, 5), (2, 5)");
    // The tests run as root here; the app account's grants come from the migrations and are tested elsewhere.
  } finally {
    await conn.end();
  }
  batch = await import("@/lib/server/batch");
  db = await import("@/lib/server/db");
  idem = await import("@/lib/server/idempotency");
});

afterAll(async () => {
  await db.getSequelize().close();
});

async function values(): Promise<number[]> {
  const conn = await rootConnection(DB);
  try {
    const rows = (await conn.query("SELECT n FROM batch_probe ORDER BY id")) as { n: number }[];
    return rows.map((r) => Number(r.n));
  } finally {
    await conn.end();
  }
}

const take = (id: number, n: number): import("@/lib/server/batch").BatchStatement => ({
  sql: "UPDATE batch_probe SET n = n - ? WHERE id = ? AND n >= ?",
  params: [n, id, n],
  expectChanged: 1,
});

describe("statements sent as one compound statement (lib/server/batch.ts)", () => {
  it("batchAtomically commits every statement, in one round trip", async () => {
    const before = db.statementCounter.count;
    await batch.batchAtomically([take(1, 1), take(2, 2)]);
    expect(db.statementCounter.count - before).toBe(1);
    expect(await values()).toEqual([4, 3]);
  });

  it("a failed row-count check names its statement and leaves nothing of the block", async () => {
    const error = await batch.batchAtomically([take(1, 1), take(2, 99)]).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(batch.BatchCheckFailed);
    expect((error as InstanceType<typeof batch.BatchCheckFailed>).index).toBe(1);
    expect(await values()).toEqual([4, 3]);
    // The connection is usable afterwards and not left inside a transaction.
    const [row] = await db.getSequelize().query<{ t: number }>("SELECT @@in_transaction AS t", { type: "SELECT" as never });
    expect(Number(row!.t)).toBe(0);
  });

  it("a database error inside an atomic block rolls it back and reaches the caller with its own number", async () => {
    const error = await batch
      .batchAtomically([take(1, 1), { sql: "INSERT INTO batch_probe VALUES (?, ?)", params: [2, 0] }])
      .catch((e: { original?: { errno?: number } }) => e);
    expect((error as { original?: { errno?: number } }).original?.errno).toBe(1062);
    expect(await values()).toEqual([4, 3]);
  });

  it("inside the caller's transaction, a failure stops the block and the caller's rollback undoes all of it", async () => {
    const sequelize = db.getSequelize();
    await expect(
      sequelize.transaction(async (t) => {
        await sequelize.query("UPDATE batch_probe SET n = 0 WHERE id = 2", { transaction: t });
        await batch.batchInTransaction([take(1, 1), take(1, 50)], t);
      }),
    ).rejects.toBeInstanceOf(batch.BatchCheckFailed);
    expect(await values()).toEqual([4, 3]);
    await sequelize.transaction((t) => batch.batchInTransaction([take(1, 1), take(2, 1)], t));
    expect(await values()).toEqual([3, 2]);
  });

  it("transactionCommittedByBatch: the last writes and the COMMIT go as one; a failed check rolls all back; no connection is kept", async () => {
    const sequelize = db.getSequelize();
    const before = db.statementCounter.count;
    await batch.transactionCommittedByBatch([], async (t, commitWith) => {
      await sequelize.query("SELECT n FROM batch_probe WHERE id = 1 FOR UPDATE", { transaction: t });
      await commitWith([take(1, 1), take(2, 1)]);
    });
    // START TRANSACTION (not waited for), the read, the block with its COMMIT.
    expect(db.statementCounter.count - before).toBe(3);
    expect(await values()).toEqual([2, 1]);
    await expect(
      batch.transactionCommittedByBatch([], async (t, commitWith) => {
        await sequelize.query("UPDATE batch_probe SET n = 100 WHERE id = 2", { transaction: t });
        await commitWith([take(1, 1), take(1, 50)]);
      }),
    ).rejects.toBeInstanceOf(batch.BatchCheckFailed);
    expect(await values()).toEqual([2, 1]);
    // Far more transactions than the pool has connections: each one gave its connection back.
    for (let i = 0; i < 40; i++)
      await batch.transactionCommittedByBatch([], async (_t, commitWith) => {
        await commitWith(i % 2 ? [] : [{ sql: "UPDATE batch_probe SET n = n WHERE id = ?", params: [1] }]);
      });
    await batch.transactionCommittedByBatch([], async (t, commitWith) => {
      await sequelize.query("UPDATE batch_probe SET n = n + 1 WHERE id = 1", { transaction: t });
      await commitWith([{ sql: "UPDATE batch_probe SET n = n + 1 WHERE id = 2", params: [] }]);
    });
    expect(await values()).toEqual([3, 2]);
  });

  it("text values with quotes, backslashes, semicolons and 'END' go through as values", async () => {
    const conn = await rootConnection(DB);
    await conn.query("CREATE TABLE IF NOT EXISTS batch_text (id INT PRIMARY KEY, t TEXT)");
    await conn.end();
    const nasty = "a'b\\c\"; END; DROP TABLE batch_probe; -- ? ?? \u00e9\u{1F600}";
    await batch.batchAtomically([
      { sql: "INSERT INTO batch_text VALUES (?, ?)", params: [1, nasty] },
      { sql: "INSERT INTO batch_text VALUES (?, ?)", params: [2, "second"] },
    ]);
    const check = await rootConnection(DB);
    try {
      const rows = (await check.query("SELECT t FROM batch_text ORDER BY id")) as { t: string }[];
      expect(rows.map((r) => r.t)).toEqual([nasty, "second"]);
    } finally {
      await check.end();
    }
    expect(await values()).toEqual([3, 2]);
  });

  it("on the driver, values, lists, times and errors come out as they did through the ORM", async () => {
    const sequelize = db.getSequelize();
    const conn = await rootConnection(DB);
    await conn.query("CREATE TABLE IF NOT EXISTS batch_time (id INT PRIMARY KEY, at DATETIME(3) NOT NULL)");
    await conn.end();
    // A time goes in as UTC (the connection's zone), to the millisecond, as the ORM wrote it.
    const at = new Date("2026-03-29T01:30:15.250Z");
    await batch.batchAtomically([{ sql: "INSERT INTO batch_time VALUES (?, ?)", params: [1, at] }]);
    const [viaOrm] = await sequelize.query<{ at: string }>("SELECT DATE_FORMAT(at, '%Y-%m-%d %H:%i:%s.%f') AS at FROM batch_time WHERE id = 1", {
      type: "SELECT" as never,
    });
    expect(viaOrm!.at).toBe("2026-03-29 01:30:15.250000");
    // An array is a list (`IN (?)`), and the rows come back as the ORM's connection types them.
    const [rows] = await batch.queryBlock([{ sql: "SELECT id, n FROM batch_probe WHERE id IN (?) ORDER BY id", params: [[1, 2]] }]);
    expect([...rows!]).toEqual([
      { id: 1, n: 3 },
      { id: 2, n: 2 },
    ]);
    // A duplicate key is the ORM's own error class, with the driver's error number underneath.
    const duplicate = (await batch
      .batchAtomically([{ sql: "INSERT INTO batch_time VALUES (?, ?)", params: [1, at] }])
      .then(() => ({}), (e: unknown) => e)) as { name?: string; original?: { errno?: number } };
    expect(duplicate.name).toBe("SequelizeUniqueConstraintError");
    expect(duplicate.original?.errno).toBe(1062);
    // A transaction that has ended cannot be written through any more (its connection is back in the pool).
    const ended = await sequelize.transaction();
    await ended.commit();
    await expect(batch.batchInTransaction([take(1, 1)], ended)).rejects.toThrow(/ended/);
    expect(await values()).toEqual([3, 2]);
  });

  it("a statement may not bring its own semicolon, and an empty batch is refused", () => {
    expect(() => batch.compoundStatement([{ sql: "SELECT 1;", params: [] }], "inside")).toThrow(/semicolon/);
    expect(() => batch.compoundStatement([], "own")).toThrow(/empty/);
  });
});

describe("idempotent with the key row pipelined", () => {
  it("the same key sent 8 times at once runs the work once; the others replay its answer", async () => {
    const sequelize = db.getSequelize();
    const userId = "00000000-0000-4000-8000-0000000000b1";
    const conn = await rootConnection(DB);
    await conn.query(
      "INSERT IGNORE INTO app_user (id, email, name, role, status, created_at, updated_at) VALUES (?, 'batch@example.test', 'Batch Probe', 'clerk', 'active', NOW(), NOW())",
      [userId],
    );
    await conn.end();
    let ran = 0;
    const once = () =>
      idem.idempotent({ userId, key: "same-key", scope: "test:batch", body: { n: 1 }, pipelined: true }, async (t, claimed) => {
        const [row] = await sequelize.query<{ n: number }>("SELECT n FROM batch_probe WHERE id = 1 FOR UPDATE", {
          type: "SELECT" as never,
          transaction: t,
        });
        await claimed;
        ran += 1;
        return { status: 201, body: { before: Number(row!.n) }, writes: [take(1, 1)] };
      });
    const answers = await Promise.all(Array.from({ length: 8 }, once).map((p) => p.catch((e: { code?: string }) => e.code)));
    expect(ran).toBe(1);
    const replays = answers.filter((a) => typeof a === "object");
    // Every one that got an answer got the same; the rest were told the first was still in flight.
    expect(new Set(replays.map((a) => JSON.stringify(a))).size).toBe(1);
    expect(answers.filter((a) => typeof a === "string").every((c) => c === "idempotency_in_flight")).toBe(true);
    expect(await values()).toEqual([2, 2]);
  });

  it("a check failing in the final writes becomes the work's own error, and the key row goes with it", async () => {
    const userId = "00000000-0000-4000-8000-0000000000b1";
    const attempt = () =>
      idem.idempotent({ userId, key: "short-key", scope: "test:batch", body: { n: 99 }, pipelined: true }, async (_t, claimed) => {
        await claimed;
        return { status: 201, body: {}, writes: [take(1, 99)], onCheckFailed: (i) => new Error(`not enough (statement ${i})`) };
      });
    await expect(attempt()).rejects.toThrow("not enough (statement 0)");
    const conn = await rootConnection(DB);
    try {
      const rows = (await conn.query("SELECT COUNT(*) AS n FROM idempotency_key WHERE idem_key = 'short-key'")) as { n: bigint }[];
      expect(Number(rows[0]!.n)).toBe(0);
    } finally {
      await conn.end();
    }
    expect(await values()).toEqual([2, 2]);
  });
});
