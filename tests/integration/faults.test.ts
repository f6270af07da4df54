import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Client } from "./helpers";
import {
  createTestGrease,
  finalOutcome,
  pool,
  receiveTestLot,
  startPrivateStack,
  writeUntilAnswered,
  type AppProcess,
  type KeyedWrite,
  type PrivateStack,
} from "./private-stack";

// Fault injection (reliability.md §E.1 F1–F4) on a stack of this file's own: its MariaDB is killed and frozen, its
// mail fake stopped and its app process killed, so nothing here may touch the shared test server.

let stack: PrivateStack;
let app: AppProcess;
let tech: Client;
let clerk: Client;
let greaseId = 0;
let packId = 0;
const LOT_SIZE = 150;
const lots: string[] = [];
let points: { tag: string; greaseId: number }[] = [];

const countBy = (values: unknown[]) =>
  values.reduce<Record<string, number>>((counts, v) => ({ ...counts, [String(v)]: (counts[String(v)] ?? 0) + 1 }), {});
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

const newGrease = (lead: Client, name: string) =>
  createTestGrease(lead, {
    code: `FLT-${randomUUID().slice(0, 8)}`,
    name,
    supplier: "Fault Test Oils",
    thickener: "lithium_complex",
    baseOilType: "mineral",
    viscosity40: 150,
  });

const receive = (grease: { greaseId: number; packId: number }, quantity: number) =>
  receiveTestLot(clerk, grease, { quantity, lotNumber: `F-${randomUUID().slice(0, 8)}`, expiresOn: "2030-06-30", location: "STORE" });

beforeAll(async () => {
  stack = await startPrivateStack("faults");
  app = await stack.startApp();
  const lead = new Client(app.url);
  tech = new Client(app.url);
  clerk = new Client(app.url);
  for (const [client, email] of [
    [lead, "lead@example.com"],
    [tech, "tech@example.com"],
    [clerk, "clerk@example.com"],
  ] as const)
    expect((await client.signIn(email)).status).toBe(200);
  ({ greaseId, packId } = await newGrease(lead, "Fault burst grease"));
  lots.push(await receive({ greaseId, packId }, LOT_SIZE), await receive({ greaseId, packId }, LOT_SIZE));
  // Lube points at the technician's site whose grease may go in again (no changeover under way).
  points = (
    await stack.root<{ tag_code: string; grease_id: number }>(
      `SELECT p.tag_code, COALESCE(p.current_grease_id, p.assigned_grease_id) AS grease_id
       FROM lube_point p JOIN site s ON s.id = p.site_id
       WHERE s.code = 'KBC' AND p.sealed_for_life = 0 AND COALESCE(p.current_grease_id, p.assigned_grease_id) IS NOT NULL
         AND NOT EXISTS (SELECT 1 FROM changeover c WHERE c.point_id = p.id AND c.state IN ('planned', 'in_progress'))
       ORDER BY p.id LIMIT 4`,
    )
  ).map((p) => ({ tag: p.tag_code, greaseId: Number(p.grease_id) }));
  expect(points.length).toBeGreaterThan(0);
}, 180_000);

afterAll(async () => {
  await stack?.stop();
}, 60_000);

/** A burst of keyed stock issues and services, as phones would send them. */
function burst(issues: number, services: number): KeyedWrite[] {
  const writes: KeyedWrite[] = [];
  for (let i = 0; i < issues + services; i++) {
    const key = randomUUID();
    if (i % Math.ceil((issues + services) / services) === 0 && writes.filter((w) => w.path.includes("points")).length < services) {
      const point = points[i % points.length]!;
      writes.push({
        key,
        path: `/api/v1/points/${encodeURIComponent(point.tag)}/services`,
        json: { greaseId: point.greaseId, grams: 6, notes: `burst ${key}` },
        attempts: [],
      });
    } else {
      writes.push({ key, path: "/api/v1/stock/issues", json: { greaseId, packId, quantity: 1 + (i % 2), location: "STORE" }, attempts: [] });
    }
  }
  return writes;
}

/** Runs the writes 8 at a time; `fault` is started once `after` writes have been answered. */
async function runBurst(writes: KeyedWrite[], target: () => string, after: number, fault: () => Promise<void>) {
  let answered = 0;
  let faultRun: Promise<void> | null = null;
  const deadline = Date.now() + 60_000;
  await pool(writes, 8, async (write) => {
    await writeUntilAnswered(target, tech.cookies, write, deadline);
    answered += 1;
    if (answered === after) faultRun = fault();
  });
  await faultRun;
}

/** The checks over the history: every write answered once, nothing doubled, the ledger and the lots agree. */
async function checkHistory(writes: KeyedWrite[]) {
  const unanswered = writes.filter((w) => finalOutcome(w)?.kind !== "ok");
  expect(unanswered.map((w) => [w.path, w.attempts.at(-1)])).toEqual([]);
  // The fault was felt: some requests got no answer or an error and were retried.
  const unknown = writes.flatMap((w) => w.attempts.filter((a) => a.kind === "unknown"));
  expect(unknown.length).toBeGreaterThan(0);
  // A server that is up but cannot reach its database says so: 503 with Retry-After, never a 500.
  const statuses = unknown.map((a) => a.status ?? a.error);
  expect(unknown.filter((a) => a.status !== undefined && a.status !== 503 && a.error !== "idempotency_in_flight").map((a) => `${a.status} ${a.error}`)).toEqual([]);
  console.log(`history: ${writes.length} writes, ${writes.reduce((n, w) => n + w.attempts.length, 0)} attempts; unknown outcomes: ${JSON.stringify(countBy(statuses))}`);

  for (const write of writes) {
    const [stored] = await stack.root<{ status_code: number; response_json: string }>(
      "SELECT k.status_code, k.response_json FROM idempotency_key k JOIN app_user u ON u.id = k.user_id WHERE u.email = 'tech@example.com' AND k.idem_key = ?",
      [write.key],
    );
    expect(Number(stored?.status_code)).toBe(201);
    // Every answer the client was given is the stored one (a retry after a lost answer is a replay).
    expect(finalOutcome(write)!.kind === "ok" && finalOutcome(write)!).toMatchObject({ body: JSON.parse(stored!.response_json) });
    if (write.path.includes("/services")) {
      const rows = await stack.root<{ n: bigint }>("SELECT COUNT(*) AS n FROM service_record WHERE notes = ?", [`burst ${write.key}`]);
      expect(Number(rows[0]!.n), `service ${write.key}`).toBe(1);
    } else {
      const [moved] = await stack.root<{ n: bigint; q: string | null }>(
        "SELECT COUNT(*) AS n, SUM(quantity) AS q FROM stock_movement WHERE kind = 'issue' AND idempotency_key = ?",
        [write.key],
      );
      expect(Number(moved!.q), `issue ${write.key}`).toBe(-Number(write.json.quantity));
      expect(Number(moved!.n)).toBe((finalOutcome(write) as { body: { issued: unknown[] } }).body.issued.length);
    }
  }

  const issued = writes.filter((w) => w.path.endsWith("/issues")).reduce((n, w) => n + Number(w.json.quantity), 0);
  const lotRows = await stack.root<{ label_code: string; on_hand: number; ledger: string }>(
    `SELECT l.label_code, l.on_hand, (SELECT SUM(m.quantity) FROM stock_movement m WHERE m.lot_id = l.id) AS ledger
     FROM stock_lot l WHERE l.grease_id = ?`,
    [greaseId],
  );
  for (const lot of lotRows) expect(Number(lot.ledger), lot.label_code).toBe(lot.on_hand);
  return { issued, onHand: lotRows.reduce((n, l) => n + l.on_hand, 0) };
}

async function auditChainVerifies(base: string) {
  const auditor = new Client(base);
  expect((await auditor.signIn("auditor@example.com")).status).toBe(200);
  const verify = await auditor.request("GET", "/api/v1/audit/verify");
  expect(verify.status).toBe(200);
  expect(verify.body).toMatchObject({ ok: true });
}

async function onHandTotal() {
  const [row] = await stack.root<{ n: string | null }>("SELECT SUM(on_hand) AS n FROM stock_lot WHERE grease_id = ?", [greaseId]);
  return Number(row!.n ?? 0);
}

describe("faults (reliability.md §E.1)", () => {
  it("F1: MariaDB killed (-9) during a burst of keyed issues and services, restarted: nothing acknowledged lost, nothing doubled", async () => {
    const before = await onHandTotal();
    const writes = burst(60, 20);
    await runBurst(writes, () => app.url, 16, async () => {
      await stack.killDb();
      await sleep(1500);
      await stack.restartDb();
    });
    const { issued, onHand } = await checkHistory(writes);
    expect(onHand).toBe(before - issued);
    const negative = await stack.root<{ n: bigint }>("SELECT COUNT(*) AS n FROM stock_lot WHERE on_hand < 0");
    expect(Number(negative[0]!.n)).toBe(0);
    // The same app process served it all: its pools reconnected by themselves.
    expect(app.child.exitCode).toBeNull();
    await auditChainVerifies(app.url);
  });

  it("F2: with the database down the API answers 503 within 5 s, logs the outage once, and recovers without a restart", async () => {
    const before = await onHandTotal();
    let issued = 0;
    for (const [how, down, up] of [
      ["killed", () => stack.killDb(), () => stack.restartDb()],
      ["frozen (SIGSTOP: connections open, nothing answers)", async () => stack.freezeDb(), async () => stack.thawDb()],
    ] as const) {
      const linesBefore = app.lines.length;
      await down();
      try {
        // Eight requests at once, as a shift's phones would send them: each is refused within the bound.
        const answers = await Promise.all(
          Array.from({ length: 8 }, async (_, i) => {
            const [method, path, json] = (
              [
                ["POST", "/api/v1/stock/issues", { greaseId, packId, quantity: 1, location: "STORE" }],
                ["GET", "/api/v1/stock", undefined],
                ["GET", "/api/v1/points", undefined],
              ] as const
            )[i % 3]!;
            const started = Date.now();
            const answer = await tech.request(method, path, { json, headers: { "idempotency-key": randomUUID() } });
            return { what: `${how}: ${method} ${path}`, answer, took: Date.now() - started };
          }),
        );
        // A sign-in needs the database before there is any session.
        const started = Date.now();
        const signIn = await new Client(app.url).signIn("clerk@example.com");
        answers.push({ what: `${how}: POST /api/v1/session`, answer: signIn, took: Date.now() - started });
        for (const { what, answer, took } of answers) {
          expect(answer.status, `${what} ${answer.text.slice(0, 200)}`).toBe(503);
          expect(answer.body.error.code).toBe("service_unavailable");
          expect(answer.body.error.message).toMatch(/database/i);
          expect(answer.headers.get("retry-after")).toBeTruthy();
          expect(took, `${what} took ${took} ms`).toBeLessThanOrEqual(5000);
        }
      } finally {
        await up();
      }
      // The outage is logged when it starts, then at most once per 10 s: not one line per refused request.
      const lines = app.lines.slice(linesBefore).filter((l) => l.includes("database_unavailable"));
      expect(lines.length, lines.join("\n")).toBeGreaterThanOrEqual(1);
      expect(lines.length, lines.join("\n")).toBeLessThanOrEqual(2);

      const deadline = Date.now() + 30_000;
      let status = 0;
      while (Date.now() < deadline) {
        status = (await tech.request("GET", "/api/v1/stock")).status;
        if (status === 200) break;
        await sleep(250);
      }
      expect(status, `${how}: the API came back`).toBe(200);
      // The lube point list reads through the bulk-read pool: that pool reconnected too.
      expect((await tech.request("GET", "/api/v1/points")).status).toBe(200);
      const key = randomUUID();
      const issue = await tech.request("POST", "/api/v1/stock/issues", {
        json: { greaseId, packId, quantity: 1, location: "STORE" },
        headers: { "idempotency-key": key },
      });
      expect(issue.status, JSON.stringify(issue.body)).toBe(201);
      issued += 1;
    }
    expect(app.child.exitCode).toBeNull();
    // Nothing refused during the outage was written.
    expect(await onHandTotal()).toBe(before - issued);
  });

  it("F3: with SMTP down, then answering 451, the reorder mail waits in the outbox and is delivered exactly once", async () => {
    const lead = new Client(app.url);
    expect((await lead.signIn("lead@example.com")).status).toBe(200);
    const name = `Reorder fault grease ${randomUUID().slice(0, 6)}`;
    const grease = await newGrease(lead, name);
    const site = await stack.root<{ id: number }>("SELECT id FROM site WHERE code = 'KBC'");
    await stack.root("INSERT INTO stock_policy (site_id, grease_id, reorder_point_grams, updated_at) VALUES (?, ?, 2000, NOW(3))", [
      site[0]!.id,
      grease.greaseId,
    ]);
    await receive(grease, 6);
    await stack.stopMail();
    const issue = await tech.request("POST", "/api/v1/stock/issues", {
      json: { ...grease, quantity: 2, location: "STORE" }, // 1.6 kg left, below 2 kg
      headers: { "idempotency-key": randomUUID() },
    });
    expect(issue.status, JSON.stringify(issue.body)).toBe(201);

    type Row = { id: number; status: string; attempts: number; last_error: string | null; due: number };
    const outboxRow = async () =>
      (
        await stack.root<Row>(
          "SELECT id, status, attempts, last_error, next_attempt_at > NOW(3) AS due FROM mail_outbox WHERE subject LIKE ?",
          [`Reorder ${name}:%`],
        )
      );
    const waitFor = async (what: string, check: (rows: Row[]) => boolean) => {
      const deadline = Date.now() + 20_000;
      let rows: Row[] = [];
      while (Date.now() < deadline) {
        rows = await outboxRow();
        if (check(rows)) return rows;
        await sleep(200);
      }
      throw new Error(`${what}: ${JSON.stringify(rows)}`);
    };
    // The relay tried, failed, and set a later retry.
    let [row] = await waitFor("a failed first attempt", (r) => r.length === 1 && r[0]!.attempts >= 1);
    expect(row).toMatchObject({ status: "pending", attempts: 1 });
    expect(row!.last_error).toMatch(/ECONNREFUSED|connect/i);
    expect(Number(row!.due)).toBe(1);

    // SMTP is back but refuses the next mail with a temporary 451; the retry time is brought forward each time
    // (the backoff's first steps are 30 s and 60 s).
    await stack.startMail();
    await fetch(`${stack.inboxUrl}/control/temporary-failures?count=1`, { method: "POST" });
    await stack.root("UPDATE mail_outbox SET next_attempt_at = NOW(3) - INTERVAL 1 SECOND WHERE id = ?", [row!.id]);
    [row] = await waitFor("a refused second attempt", (r) => r[0]!.attempts >= 2);
    expect(row).toMatchObject({ status: "pending", attempts: 2 });
    expect(row!.last_error).toMatch(/451/);
    await stack.root("UPDATE mail_outbox SET next_attempt_at = NOW(3) - INTERVAL 1 SECOND WHERE id = ?", [row!.id]);
    [row] = await waitFor("delivery", (r) => r[0]!.status === "sent");
    expect(row).toMatchObject({ status: "sent", attempts: 3 });

    await sleep(1500); // several more relay rounds
    const mails = (await stack.inbox()).filter((m) => m.subject.startsWith(`Reorder ${name}:`));
    expect(mails).toHaveLength(1);
    expect(mails[0]!.messageId).toBe(`<outbox-${row!.id}@greaseledger.invalid>`);
  });

  it("F4: the app process killed (-9) during a burst of keyed issues; a new process and the clients' retries double nothing", async () => {
    const before = await onHandTotal();
    const writes = burst(40, 8);
    let target = app.url;
    await runBurst(writes, () => target, 12, async () => {
      app.child.kill("SIGKILL");
      app = await stack.startApp();
      target = app.url; // the session lives in the database: the same cookie works on the new process
    });
    const { issued, onHand } = await checkHistory(writes);
    expect(onHand).toBe(before - issued);
    await auditChainVerifies(app.url);
  });
});
