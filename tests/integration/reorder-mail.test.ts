import { randomUUID } from "node:crypto";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createScratchDatabase, freePort, rootConnection } from "./helpers";
// @ts-expect-error plain ES module without types
import { startMailFake } from "../../scripts/mail-fake.mjs";

// A database of its own, so the app's relay does not deliver the reorder mail first.
const DB = "gl_reorder_test";
process.env.DATABASE_NAME = DB;

let stock: typeof import("@/lib/server/queries/stock");
let outbox: typeof import("@/lib/server/mail/outbox");
let transport: typeof import("@/lib/server/mail/transport");
const userId = randomUUID();
let greaseId = 0;
let packId = 0;

beforeAll(async () => {
  await createScratchDatabase(DB);
  const conn = await rootConnection(DB);
  const now = new Date();
  try {
    await conn.query("INSERT INTO site (id, code, name, timezone, created_at, updated_at) VALUES (1, 'T1', 'Test site', 'UTC', ?, ?)", [now, now]);
    await conn.query("INSERT INTO app_user (id, email, name, role, status, created_at, updated_at) VALUES (?, 'lead.t@example.com', 'Lead T', 'lead', 'active', ?, ?)", [userId, now, now]);
    await conn.query("INSERT INTO user_site_access (user_id, site_id, created_at) VALUES (?, 1, ?)", [userId, now]);
    await conn.query("INSERT INTO supplier (id, name, contact_email, lead_time_days, created_at, updated_at) VALUES (1, 'Supplier T', 'orders@supplier-t.example', 10, ?, ?)", [now, now]);
    await conn.query(
      "INSERT INTO grease (id, code, name, supplier_id, thickener, base_oil_type, viscosity_40, nlgi_grade, created_at, updated_at) VALUES (1, 'T-1', 'Grease T', 1, 'lithium_complex', 'mineral', 100, '2', ?, ?)",
      [now, now],
    );
    await conn.query("INSERT INTO grease_pack (id, grease_id, kind, net_mass_grams, created_at) VALUES (1, 1, 'cartridge', 400, ?)", [now]);
    await conn.query("INSERT INTO storage_location (id, site_id, code, name, created_at) VALUES (1, 1, 'STORE', 'Store', ?)", [now]);
    // A fixed reorder point of 2 kg (5 cartridges), set by the lead.
    await conn.query("INSERT INTO stock_policy (site_id, grease_id, reorder_point_grams, updated_at) VALUES (1, 1, 2000, ?)", [now]);
  } finally {
    await conn.end();
  }
  greaseId = 1;
  packId = 1;
  stock = await import("@/lib/server/queries/stock");
  outbox = await import("@/lib/server/mail/outbox");
  transport = await import("@/lib/server/mail/transport");
});

afterAll(async () => {
  const { getSequelize } = await import("@/lib/server/db");
  await getSequelize().close();
});

const pending = async () => {
  const { getSequelize } = await import("@/lib/server/db");
  return getSequelize().query<{ id: number; status: string; subject: string; to_addresses: string }>("SELECT id, status, subject, to_addresses FROM mail_outbox ORDER BY id", {
    type: QueryTypes.SELECT,
  });
};

describe("reorder mail through the outbox (reliability.md §B.3)", () => {
  it("crossing the reorder point with SMTP down leaves one mail waiting; one arrives once SMTP is back; one alert per episode", async () => {
    await stock.receiveStock({ greaseId, packId, quantity: 8, lotNumber: "R1" }, userId, null);
    expect(await pending()).toHaveLength(0);
    await stock.issueStock({ greaseId, packId, quantity: 4 }, userId, null); // 4 × 400 g = 1.6 kg < 2 kg
    await stock.issueStock({ greaseId, packId, quantity: 1 }, userId, null); // still low: same episode
    const rows = await pending();
    expect(rows).toHaveLength(1);
    expect(rows[0]!.subject).toMatch(/Reorder Grease T/);
    expect(rows[0]!.to_addresses).toContain("orders@supplier-t.example");

    const port = await freePort();
    const smtp = transport.smtpTransport({ host: "127.0.0.1", port });
    expect(await outbox.relayOutboxOnce(smtp)).toEqual({ sent: 0, failed: 1 });
    const fake = await startMailFake({ smtpPort: port, httpPort: 0, quiet: true });
    try {
      const later = new Date(Date.now() + 3_600_000);
      await outbox.relayOutboxOnce(smtp, { now: later });
      await outbox.relayOutboxOnce(smtp, { now: later });
      expect(fake.messages).toHaveLength(1);
      expect(fake.messages[0].subject).toMatch(/Reorder Grease T/);
    } finally {
      await fake.close();
    }
    const { getSequelize } = await import("@/lib/server/db");
    const [request] = await getSequelize().query<{ state: string; packs: number }>("SELECT state, packs FROM purchase_request", { type: QueryTypes.SELECT });
    expect(request).toMatchObject({ state: "requested" });
    expect(Number(request!.packs)).toBeGreaterThan(0);

    // Back above the point: the episode ends and the receipt closes the request; a new fall starts a new episode.
    await stock.receiveStock({ greaseId, packId, quantity: 10, lotNumber: "R2" }, userId, null);
    const [closed] = await getSequelize().query<{ state: string }>("SELECT state FROM purchase_request ORDER BY id LIMIT 1", { type: QueryTypes.SELECT });
    expect(closed!.state).toBe("received");
    await stock.issueStock({ greaseId, packId, quantity: 12 }, userId, null);
    expect(await pending()).toHaveLength(2);
  });

  it("22 issues at once across the reorder point open one episode with one mail, and never close it on a stale count", async () => {
    const { getSequelize } = await import("@/lib/server/db");
    const sequelize = getSequelize();
    // Whatever the test before left: lots emptied, episodes ended, mail counted from here.
    await sequelize.query("UPDATE stock_lot SET on_hand = 0");
    await sequelize.query("UPDATE low_stock_episode SET ended_at = NOW(3), open_key = NULL WHERE open_key IS NOT NULL");
    const before = (await pending()).length;
    const [{ n: episodesBefore }] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM low_stock_episode", { type: QueryTypes.SELECT }) as [{ n: number }];
    await stock.receiveStock({ greaseId, packId, quantity: 25, lotNumber: `R-${randomUUID().slice(0, 6)}`, location: "STORE" }, userId, null);
    // 25 × 400 g = 10 kg; the point is 2 kg (5 cartridges): the last few issues fall below it.
    const answers = await Promise.allSettled(
      Array.from({ length: 22 }, () => stock.issueStock({ greaseId, packId, quantity: 1, location: "STORE" }, userId, randomUUID())),
    );
    expect(answers.filter((a) => a.status === "rejected").map((a) => String((a as PromiseRejectedResult).reason))).toEqual([]);
    const [{ n: episodes }] = await sequelize.query<{ n: number }>("SELECT COUNT(*) AS n FROM low_stock_episode", { type: QueryTypes.SELECT }) as [{ n: number }];
    const [{ open }] = await sequelize.query<{ open: number }>("SELECT COUNT(*) AS open FROM low_stock_episode WHERE open_key IS NOT NULL", { type: QueryTypes.SELECT }) as [{ open: number }];
    expect(Number(episodes) - Number(episodesBefore)).toBe(1);
    expect(Number(open)).toBe(1);
    expect((await pending()).length - before).toBe(1);
  });

  it("a rolled-back issue (not enough stock) leaves no outbox row and no movement", async () => {
    const before = (await pending()).length;
    await expect(stock.issueStock({ greaseId, packId, quantity: 500 }, userId, null)).rejects.toMatchObject({ code: "insufficient_stock" });
    expect((await pending()).length).toBe(before);
  });
});
