import { randomUUID } from "node:crypto";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createScratchDatabase, rootConnection } from "./helpers";

// A database of its own, so the app's relay does not queue or deliver these mails first.
const DB = "gl_expiry_test";
process.env.DATABASE_NAME = DB;

// A Tuesday in ISO week 2026-W11; the digest is called with explicit instants around it.
const NOW = new Date("2026-03-10T09:00:00Z");
const day = (n: number) => new Date(NOW.getTime() + n * 86_400_000).toISOString().slice(0, 10);
const DAY_MS = 86_400_000;

let expiry: typeof import("@/lib/server/queries/stock-expiry");

beforeAll(async () => {
  await createScratchDatabase(DB);
  const conn = await rootConnection(DB);
  const now = new Date();
  const user = async (email: string, role: string, siteId: number, status = "active") => {
    const id = randomUUID();
    await conn.query(
      "INSERT INTO app_user (id, email, name, role, status, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?)",
      [id, email, email.split("@")[0], role, status, now, now],
    );
    await conn.query("INSERT INTO user_site_access (user_id, site_id, created_at) VALUES (?, ?, ?)", [
      id,
      siteId,
      now,
    ]);
  };
  const lot = async (
    siteId: number,
    greaseId: number,
    lotNumber: string,
    label: string,
    expiresOn: string | null,
    onHand: number,
  ) => {
    await conn.query(
      `INSERT INTO stock_lot (site_id, grease_id, pack_id, location_id, lot_number, label_code, expires_on, expiry_source, received_on, on_hand, created_at, updated_at)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      [
        siteId,
        greaseId,
        greaseId,
        siteId,
        lotNumber,
        label,
        expiresOn,
        expiresOn ? "label" : "unknown",
        day(-400),
        onHand,
        now,
        now,
      ],
    );
  };
  try {
    for (const [id, code, name] of [
      [1, "HM", "Harbour Mill"],
      [2, "UW", "Upland Works"],
      [3, "FP", "Fenward Plant"],
    ] as const) {
      await conn.query(
        "INSERT INTO site (id, code, name, timezone, created_at, updated_at) VALUES (?, ?, ?, 'UTC', ?, ?)",
        [id, code, name, now, now],
      );
      await conn.query(
        "INSERT INTO storage_location (id, site_id, code, name, created_at) VALUES (?, ?, ?, ?, ?)",
        [id, id, `STORE-${code}`, `Main store ${name}`, now],
      );
    }
    await user("lead.hm@example.test", "lead", 1);
    await user("clerk.hm@example.test", "clerk", 1);
    await user("tech.hm@example.test", "technician", 1);
    await user("gone.hm@example.test", "clerk", 1, "disabled");
    await user("lead.uw@example.test", "lead", 2);
    await user("clerk.fp@example.test", "clerk", 3);
    await conn.query(
      "INSERT INTO supplier (id, name, contact_email, lead_time_days, created_at, updated_at) VALUES (1, 'Supplier E', 'orders@supplier-e.example', 10, ?, ?)",
      [now, now],
    );
    for (const [id, code, name] of [
      [1, "GA-2", "Grease Alpha"],
      [2, "GB-1", "Grease Beta"],
    ] as const) {
      await conn.query(
        "INSERT INTO grease (id, code, name, supplier_id, thickener, base_oil_type, viscosity_40, nlgi_grade, created_at, updated_at) VALUES (?, ?, ?, 1, 'lithium_complex', 'mineral', 100, '2', ?, ?)",
        [id, code, name, now, now],
      );
      await conn.query(
        "INSERT INTO grease_pack (id, grease_id, kind, net_mass_grams, created_at) VALUES (?, ?, 'cartridge', 400, ?)",
        [id, id, now],
      );
    }

    // Harbour Mill: one lot due in 20 days, one expired 5 days ago, an empty one, one years away, one undated.
    await lot(1, 1, "HM-SOON", "HMSOON01", day(20), 3);
    await lot(1, 2, "HM-OLD", "HMOLD001", day(-5), 2);
    await lot(1, 1, "HM-EMPTY", "HMEMPTY1", day(10), 0);
    await lot(1, 1, "HM-FAR", "HMFAR001", day(1100), 5);
    await lot(1, 2, "HM-NODATE", "HMNODAT1", null, 4);
    // Upland Works: only lots that expire in about three years.
    await lot(2, 1, "UW-FAR", "UWFAR001", day(1100), 6);
    // Fenward Plant: one point takes 50 g a day of Grease Alpha (350 g a week). The 2-cartridge lot due in 100 days
    // is used up in about 2.3 weeks; the 20-cartridge lot due in 150 days then gets about 19.1 weeks × 350 g
    // ≈ 6.7 kg of its 8 kg before it expires, leaving about 1.3 kg.
    await lot(3, 1, "FP-USED", "FPUSED01", day(100), 2);
    await lot(3, 1, "FP-BIG", "FPBIG001", day(150), 20);
    await conn.query(
      "INSERT INTO area (id, site_id, code, name, created_at, updated_at) VALUES (1, 3, 'A1', 'Line 1', ?, ?)",
      [now, now],
    );
    await conn.query(
      "INSERT INTO asset (id, site_id, area_id, tag, name, created_at, updated_at) VALUES (1, 3, 1, 'P-101', 'Pump 101', ?, ?)",
      [now, now],
    );
    await conn.query(
      `INSERT INTO lube_point (site_id, asset_id, tag_code, name, bearing_type, bore_mm, outside_diameter_mm, width_mm, speed_rpm,
         running_hours_per_day, assigned_grease_id, interval_hours, quantity_grams, created_at, updated_at)
       VALUES (3, 1, 'FPPT0001', 'Pump 101 drive end', 'ball', 50, 90, 20, 1500, 24, 1, 24, 50, ?, ?)`,
      [now, now],
    );
  } finally {
    await conn.end();
  }
  expiry = await import("@/lib/server/queries/stock-expiry");
});

afterAll(async () => {
  const { getSequelize } = await import("@/lib/server/db");
  await getSequelize().close();
});

const mailsFor = async (siteName: string) => {
  const { getSequelize } = await import("@/lib/server/db");
  const rows = await getSequelize().query<{ subject: string; to_addresses: string; text_body: string }>(
    "SELECT subject, to_addresses, text_body FROM mail_outbox ORDER BY id",
    { type: QueryTypes.SELECT },
  );
  return rows.filter((r) => r.subject.includes(siteName));
};
const recipients = (row: { to_addresses: string }) =>
  row.to_addresses
    .split(",")
    .map((a) => a.trim())
    .sort();

describe("weekly near-expiry mail", () => {
  it("queues one mail per site with lots near or past expiry, to its leads and clerks, naming each lot", async () => {
    expect(await expiry.queueExpiryDigests(NOW)).toEqual({ queued: 2 });

    const harbour = await mailsFor("Harbour Mill");
    expect(harbour).toHaveLength(1);
    const mail = harbour[0]!;
    expect(recipients(mail)).toEqual(["clerk.hm@example.test", "lead.hm@example.test"]);
    expect(mail.subject).toContain("2 lots");
    expect(mail.subject).toContain("2026-W11");
    const text = mail.text_body;
    expect(text).toContain("Grease Alpha (GA-2), lot HM-SOON: expires in 20 days (2026-03-30)");
    expect(text).toContain(
      "Label HMSOON01, location STORE-HM (Main store Harbour Mill), 3 cartridges of 400 g on hand.",
    );
    expect(text).toContain("Grease Beta (GB-1), lot HM-OLD: expired 5 days ago (2026-03-05)");
    expect(text).toContain(
      "Label HMOLD001, location STORE-HM (Main store Harbour Mill), 2 cartridges of 400 g on hand.",
    );
    // The expired lot is listed first (first expiring first).
    expect(text.indexOf("HM-OLD")).toBeLessThan(text.indexOf("HM-SOON"));
    expect(text).toMatch(/sample/);
    expect(text).toMatch(/scrap/);
    for (const absent of ["HM-EMPTY", "HM-FAR", "HM-NODATE"]) expect(text).not.toContain(absent);
  });

  it("sends nothing for a site whose lots all expire years from now", async () => {
    await expiry.queueExpiryDigests(NOW);
    expect(await mailsFor("Upland Works")).toHaveLength(0);
  });

  it("lists a lot that the planned use will not empty before its date, with the grease expected to be left", async () => {
    await expiry.queueExpiryDigests(NOW);
    const [mail] = await mailsFor("Fenward Plant");
    expect(mail).toBeDefined();
    expect(recipients(mail!)).toEqual(["clerk.fp@example.test"]);
    expect(mail!.text_body).toContain(
      "Grease Alpha (GA-2), lot FP-BIG: expires in 150 days (2026-08-07); about 1.3 kg will be left at expiry at the planned use of 350 g a week",
    );
    expect(mail!.text_body).not.toContain("FP-USED");
  });

  it("queues nothing more in the same week, and a new mail the next week", async () => {
    await expiry.queueExpiryDigests(NOW);
    const later = new Date(NOW.getTime() + 4 * DAY_MS); // Saturday of the same ISO week
    expect(await expiry.queueExpiryDigests(later)).toEqual({ queued: 0 });
    expect(await mailsFor("Harbour Mill")).toHaveLength(1);

    const nextWeek = new Date(NOW.getTime() + 7 * DAY_MS);
    expect(await expiry.queueExpiryDigests(nextWeek)).toEqual({ queued: 2 });
    const harbour = await mailsFor("Harbour Mill");
    expect(harbour).toHaveLength(2);
    expect(harbour[1]!.subject).toContain("2026-W12");
    expect(harbour[1]!.text_body).toContain("lot HM-SOON: expires in 13 days (2026-03-30)");
    expect(harbour[1]!.text_body).toContain("lot HM-OLD: expired 12 days ago (2026-03-05)");
    expect(await mailsFor("Upland Works")).toHaveLength(0);
  });
});
