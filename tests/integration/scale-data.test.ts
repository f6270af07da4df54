import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createScratchDatabase, rootConnection } from "./helpers";

// The plant-scale data set (issue: speed at plant scale), at a small size: counts, invariants, determinism.
const DB = "gl_scale_test";
process.env.DATABASE_NAME = DB;
const NOW = new Date("2026-12-01T06:00:00Z");

async function fresh() {
  await createScratchDatabase(DB);
  const { getSequelize } = await import("@/lib/server/db");
  const holder = globalThis as { __greaseledgerSequelize?: { close(): Promise<void> } };
  await holder.__greaseledgerSequelize?.close();
  holder.__greaseledgerSequelize = undefined;
  return getSequelize();
}

async function q<T>(sql: string): Promise<T[]> {
  const conn = await rootConnection(DB);
  try {
    return [...((await conn.query(sql)) as T[])];
  } finally {
    await conn.end();
  }
}

let counts: Awaited<ReturnType<typeof import("@/seed/scale").seedScale>>;
let firstTags = "";

beforeAll(async () => {
  const { seedScale } = await import("@/seed/scale");
  counts = await seedScale(await fresh(), { size: 0.002, now: NOW });
  firstTags = (
    await q<{ h: string }>(
      "SELECT SHA2(GROUP_CONCAT(tag_code ORDER BY id SEPARATOR ','), 256) AS h FROM lube_point",
    )
  )[0]!.h;
});

afterAll(async () => {
  const { getSequelize } = await import("@/lib/server/db");
  await getSequelize().close();
});

describe("seedScale", () => {
  it("writes the scaled counts (0.2 % of 20,000 points, 1,000,000 services, 300,000 movements, 20,000 incidents)", async () => {
    expect(counts).toMatchObject({
      sites: 2,
      points: 40,
      greases: 12,
      services: 2000,
      movements: 600,
      incidents: 40,
    });
    const n = async (table: string) =>
      Number((await q<{ n: bigint }>(`SELECT COUNT(*) AS n FROM ${table}`))[0]!.n);
    expect(await n("lube_point")).toBe(40);
    expect(await n("service_record")).toBe(2000);
    expect(await n("stock_movement")).toBe(600);
    expect(await n("mixing_incident")).toBe(40);
    expect(await n("incident_event")).toBe(40);
  });

  it("keeps the stock ledger equal to the stock of every lot, and no lot below zero", async () => {
    const off = await q(
      "SELECT l.id FROM stock_lot l JOIN (SELECT lot_id, SUM(quantity) AS s FROM stock_movement GROUP BY lot_id) m ON m.lot_id = l.id WHERE m.s <> l.on_hand OR l.on_hand < 0",
    );
    expect(off).toEqual([]);
  });

  it("spreads services over three years and points over both sites", async () => {
    const [span] = await q<{ days: number }>(
      "SELECT DATEDIFF(MAX(performed_at), MIN(performed_at)) AS days FROM service_record",
    );
    expect(Number(span!.days)).toBeGreaterThan(900);
    expect(Number(span!.days)).toBeLessThanOrEqual(3 * 366);
    expect((await q("SELECT DISTINCT site_id FROM lube_point")).length).toBe(2);
  });

  it("is deterministic, and refuses a database that already has data", async () => {
    const { seedScale } = await import("@/seed/scale");
    const { getSequelize } = await import("@/lib/server/db");
    await expect(seedScale(getSequelize(), { size: 0.002, now: NOW })).rejects.toThrow(/empty/);
    await seedScale(await fresh(), { size: 0.002, now: NOW });
    const again = (
      await q<{ h: string }>(
        "SELECT SHA2(GROUP_CONCAT(tag_code ORDER BY id SEPARATOR ','), 256) AS h FROM lube_point",
      )
    )[0]!.h;
    expect(again).toBe(firstTags);
  });
});
