import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Client } from "./helpers";
import { createTestGrease, receiveTestLot, startPrivateStack, type AppProcess, type PrivateStack } from "./private-stack";

// Two `next start` processes of one build against one database, configured alike as they would be behind a
// balancer (reliability.md §D): nothing that matters may live in one process's memory.

const PUBLIC_URL = "http://greaseledger.balancer.test";

/** A browser-like client of the public address whose requests land on one instance or the other. */
class BalancedClient extends Client {
  override request(method: string, pathname: string, options: Parameters<Client["request"]>[2] = {}) {
    return super.request(method, pathname, { ...options, headers: { origin: PUBLIC_URL, ...options.headers } });
  }
  on(app: AppProcess) {
    this.base = app.url;
    return this;
  }
}

let stack: PrivateStack;
let a: AppProcess;
let b: AppProcess;
const both = () => [a, b] as const;

beforeAll(async () => {
  stack = await startPrivateStack("two");
  // Same settings on both, each with its own outbox relay.
  [a, b] = await Promise.all([stack.startApp({ APP_URL: PUBLIC_URL }), stack.startApp({ APP_URL: PUBLIC_URL })]);
}, 180_000);

afterAll(async () => {
  await stack?.stop();
}, 60_000);

async function grease(lead: BalancedClient, onHand: number) {
  const ids = await createTestGrease(lead, {
    code: `TWO-${randomUUID().slice(0, 8)}`,
    name: `Two-instance grease ${randomUUID().slice(0, 6)}`,
    supplier: "Balancer Oils",
    thickener: "polyurea",
    baseOilType: "pao",
    viscosity40: 100,
  });
  const label = await receiveTestLot(lead, ids, { quantity: onHand, lotNumber: `T-${randomUUID().slice(0, 8)}`, expiresOn: "2030-01-31", location: "KBC/STORE" });
  return { ...ids, label };
}

describe("two app instances on one database (reliability.md §D)", () => {
  it("a session made on one instance works on the other, and signing out on the other ends it on both", async () => {
    const onA = new BalancedClient(a.url);
    expect((await onA.signIn("tech@example.com")).status).toBe(200);
    const onB = new BalancedClient(b.url);
    onB.cookies = new Map(onA.cookies);
    const me = await onB.request("GET", "/api/v1/me");
    expect(me.status).toBe(200);
    expect(me.body.user.email).toBe("tech@example.com");
    expect((await onB.request("DELETE", "/api/v1/session")).status).toBe(204);
    expect((await onA.request("GET", "/api/v1/me")).status).toBe(401);
  });

  it("failed sign-ins split across the instances add up to one throttle; concurrent failures on both never error", async () => {
    const email = `split-${randomUUID().slice(0, 8)}@example.test`;
    const statuses: number[] = [];
    // Ten failures, alternating: each instance sees five, below the account's hard cap of ten.
    for (let i = 0; i < 10; i++) statuses.push((await new BalancedClient(both()[i % 2]!.url).signIn(email, `wrong-${i}`)).status);
    expect(statuses.slice(0, 4)).toEqual([401, 401, 401, 401]);
    expect(statuses.filter((s) => s !== 401 && s !== 429)).toEqual([]);
    // Together they reach it: both instances refuse until the window ends (15 minutes), not just for a short delay.
    for (const app of both()) {
      const locked = await new BalancedClient(app.url).signIn(email, "wrong-again");
      expect(locked.status).toBe(429);
      expect(locked.body.error.code).toBe("too_many_attempts");
      expect(Number(locked.headers.get("retry-after"))).toBeGreaterThan(60);
    }

    // Bursts of failures for new accounts, half on each instance at once: all counted, never a 500 (two first
    // failures of one account race to create its row).
    // The client address is counted too (30 free failures); it is cleared so later sign-ins in this file go through.
    const clearAddress = () => stack.root("DELETE FROM sign_in_throttle WHERE throttle_key LIKE 'address:%'");
    for (let round = 0; round < 3; round++) {
      await clearAddress();
      const burst = `burst-${randomUUID().slice(0, 8)}@example.test`;
      const answers = await Promise.all(
        Array.from({ length: 12 }, (_, i) => new BalancedClient(both()[i % 2]!.url).signIn(burst, `wrong-${i}`)),
      );
      expect(answers.filter((r) => r.status !== 401 && r.status !== 429).map((r) => `${r.status} ${r.text.slice(0, 120)}`)).toEqual([]);
      const [row] = await stack.root<{ failures: number }>("SELECT failures FROM sign_in_throttle WHERE throttle_key = ?", [`account:${burst}`]);
      expect(Number(row!.failures)).toBe(12);
    }
    await clearAddress();
  });

  it("one Idempotency-Key sent to both instances at once issues once; every answer is the same", async () => {
    const lead = new BalancedClient(a.url);
    expect((await lead.signIn("lead@example.com")).status).toBe(200);
    const g = await grease(lead, 20);
    const key = randomUUID();
    const send = (app: AppProcess) => {
      const client = new BalancedClient(app.url);
      client.cookies = new Map(lead.cookies);
      return client.request("POST", "/api/v1/stock/issues", {
        json: { greaseId: g.greaseId, packId: g.packId, quantity: 3, location: "KBC/STORE" },
        headers: { "idempotency-key": key },
      });
    };
    const answers = await Promise.all(Array.from({ length: 10 }, (_, i) => send(both()[i % 2]!)));
    const ok = answers.filter((r) => r.status === 201);
    const inFlight = answers.filter((r) => r.status === 409 && r.body.error.code === "idempotency_in_flight");
    expect(ok.length + inFlight.length, answers.map((r) => `${r.status} ${r.text.slice(0, 80)}`).join("\n")).toBe(10);
    expect(ok.length).toBeGreaterThan(0);
    for (const r of ok) expect(r.body).toEqual(ok[0]!.body);
    // Later retries on either instance replay the same answer.
    for (const app of both()) expect((await send(app)).body).toEqual(ok[0]!.body);
    const [moved] = await stack.root<{ n: bigint; q: string }>(
      "SELECT COUNT(*) AS n, SUM(quantity) AS q FROM stock_movement WHERE kind = 'issue' AND idempotency_key = ?",
      [key],
    );
    expect([Number(moved!.n), Number(moved!.q)]).toEqual([1, -3]);
    const [lot] = await stack.root<{ on_hand: number }>("SELECT on_hand FROM stock_lot WHERE label_code = ?", [g.label]);
    expect(lot!.on_hand).toBe(17);
  });

  it("30 issues of one container from a 10-container lot, split across both instances: exactly 10 succeed", async () => {
    const lead = new BalancedClient(a.url);
    expect((await lead.signIn("lead@example.com")).status).toBe(200);
    const g = await grease(lead, 10);
    const clients = await Promise.all(
      both().map(async (app) => {
        const c = new BalancedClient(app.url);
        expect((await c.signIn("tech@example.com")).status).toBe(200);
        return c;
      }),
    );
    const answers = await Promise.all(
      Array.from({ length: 30 }, (_, i) =>
        clients[i % 2]!.request("POST", "/api/v1/stock/issues", {
          json: { greaseId: g.greaseId, packId: g.packId, quantity: 1, location: "STORE" },
          headers: { "idempotency-key": randomUUID() },
        }),
      ),
    );
    const statuses = answers.map((r) => (r.status === 409 ? `409 ${r.body.error.code}` : String(r.status)));
    expect(statuses.filter((s) => s === "201")).toHaveLength(10);
    expect(statuses.filter((s) => s === "409 insufficient_stock")).toHaveLength(20);
    const [lot] = await stack.root<{ on_hand: number; ledger: string }>(
      "SELECT l.on_hand, (SELECT SUM(quantity) FROM stock_movement m WHERE m.lot_id = l.id) AS ledger FROM stock_lot l WHERE l.label_code = ?",
      [g.label],
    );
    expect([lot!.on_hand, Number(lot!.ledger)]).toEqual([0, 0]);
  });

  it("two outbox relays, one per instance, deliver each queued mail exactly once", async () => {
    expect(a.lines.some((l) => l.includes("outbox_relay_started"))).toBe(true);
    expect(b.lines.some((l) => l.includes("outbox_relay_started"))).toBe(true);
    const batch = randomUUID().slice(0, 8);
    // 40 mails that fall due at the same moment, so both relays reach for them together.
    const values = Array.from({ length: 40 }, (_, i) => [`Two relays ${batch} #${i}`]);
    await stack.root(
      `INSERT INTO mail_outbox (to_addresses, subject, text_body, status, attempts, next_attempt_at, created_at, updated_at)
       VALUES ${values.map(() => "('lead@example.com', ?, 'Test of two relays.', 'pending', 0, NOW(3) + INTERVAL 1 SECOND, NOW(3), NOW(3))").join(", ")}`,
      values.flat(),
    );
    const deadline = Date.now() + 20_000;
    let pending = 40;
    while (Date.now() < deadline && pending > 0) {
      const [row] = await stack.root<{ n: bigint }>("SELECT COUNT(*) AS n FROM mail_outbox WHERE subject LIKE ? AND status <> 'sent'", [`Two relays ${batch} #%`]);
      pending = Number(row!.n);
      await new Promise((r) => setTimeout(r, 250));
    }
    expect(pending).toBe(0);
    await new Promise((r) => setTimeout(r, 1500)); // more relay rounds on both
    const subjects = (await stack.inbox()).map((m) => m.subject).filter((s) => s.startsWith(`Two relays ${batch} #`));
    expect(subjects).toHaveLength(40);
    expect(new Set(subjects).size).toBe(40);
    const attempts = await stack.root<{ attempts: number }>("SELECT DISTINCT attempts FROM mail_outbox WHERE subject LIKE ?", [`Two relays ${batch} #%`]);
    expect(attempts.map((r) => r.attempts)).toEqual([1]);
  });
});
