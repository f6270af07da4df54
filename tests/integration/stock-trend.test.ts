import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { kg } from "@/components/stock/chart-scale";
import { stockChartData } from "@/lib/server/queries/stock-trend";
import { Client, rootQuery } from "./helpers";

const DAY_MS = 86_400_000;
const WEEK_MS = 7 * DAY_MS;
const lead = new Client();
const clerk = new Client();
let leadId = "";

// Worked out here without the app's code: step back day by day to a Monday, and bucket in SQL by whole weeks
// of seconds since the first Monday (the app groups by WEEKDAY()).
function mondayUtc(at: Date): Date {
  const d = new Date(Date.UTC(at.getUTCFullYear(), at.getUTCMonth(), at.getUTCDate()));
  while (d.getUTCDay() !== 1) d.setUTCDate(d.getUTCDate() - 1);
  return d;
}
const sqlTime = (d: Date) => d.toISOString().slice(0, 23).replace("T", " ");

async function expectedWeekly(
  table: "applied" | "issued",
  first: Date,
  end: Date,
): Promise<Map<string, number[]>> {
  const sql =
    table === "applied"
      ? `SELECT s.code, FLOOR(TIMESTAMPDIFF(SECOND, ?, r.performed_at) / 604800) AS w, SUM(r.grams) AS grams
         FROM service_record r JOIN site s ON s.id = r.site_id WHERE r.performed_at >= ? AND r.performed_at < ? GROUP BY s.code, w`
      : `SELECT s.code, FLOOR(TIMESTAMPDIFF(SECOND, ?, m.created_at) / 604800) AS w, SUM(ABS(m.quantity) * p.net_mass_grams) AS grams
         FROM stock_movement m JOIN site s ON s.id = m.site_id JOIN stock_lot l ON l.id = m.lot_id JOIN grease_pack p ON p.id = l.pack_id
         WHERE m.kind = 'issue' AND m.created_at >= ? AND m.created_at < ? GROUP BY s.code, w`;
  const rows = await rootQuery<{ code: string; w: bigint | number; grams: string }>(sql, [
    sqlTime(first),
    sqlTime(first),
    sqlTime(end),
  ]);
  const bySite = new Map<string, number[]>();
  for (const r of rows) {
    const weeks = bySite.get(r.code) ?? Array.from({ length: 13 }, () => 0);
    weeks[Number(r.w)] = Number(r.grams);
    bySite.set(r.code, weeks);
  }
  return bySite;
}

beforeAll(async () => {
  expect((await lead.signIn("lead@example.com")).status).toBe(200);
  expect((await clerk.signIn("clerk@example.com")).status).toBe(200);
  leadId = (await rootQuery<{ id: string }>("SELECT id FROM app_user WHERE email = 'lead@example.com'"))[0]!
    .id;
});

afterAll(async () => {
  const { getSequelize } = await import("@/lib/server/db");
  await getSequelize().close();
});

describe("stock page charts", () => {
  it("the page draws the on-hand chart under its accessible name, with the demo greases and their stock in its table", async () => {
    const page = await lead.request("GET", "/stock");
    expect(page.status).toBe(200);
    const name = "On hand against reorder point at Kestrel Bay Cement Works";
    expect(page.text).toContain(`<title id="stock-level-KBC-title">${name}</title>`);
    expect(page.text).toMatch(/<svg[^>]*role="img"[^>]*aria-labelledby="stock-level-KBC-title"/);
    const table = page.text.match(
      new RegExp(`<div class="sr-only"><table><caption>${name}</caption>([\\s\\S]*?)</table>`),
    )?.[1];
    expect(table).toBeDefined();
    const [row] = await rootQuery<{ grams: string }>(
      `SELECT SUM(l.on_hand * p.net_mass_grams) AS grams FROM stock_lot l JOIN grease_pack p ON p.id = l.pack_id
       JOIN grease g ON g.id = l.grease_id JOIN site s ON s.id = l.site_id WHERE g.code = 'GL-EM2' AND s.code = 'KBC'`,
    );
    expect(Number(row!.grams)).toBeGreaterThan(0);
    expect(table).toContain(
      `<th scope="row">Brackenridge Aurum EM2 (GL-EM2)</th><td>${kg(Number(row!.grams))}</td>`,
    );
    expect(page.text).toContain("Grease applied per week at Kestrel Bay Cement Works");
  });

  it("weekly grease applied per site equals the service records summed by the database, whatever day it is", async () => {
    const base = Date.now();
    // Today, half a week ago and 40 days ago: the week boundaries fall between different records each time.
    for (const now of [new Date(base), new Date(base - 3.5 * DAY_MS), new Date(base - 40 * DAY_MS)]) {
      const sites = await stockChartData(leadId, now);
      expect(sites.map((s) => s.code).sort()).toEqual(["KBC", "MFW"]);
      const first = new Date(mondayUtc(now).getTime() - 12 * WEEK_MS);
      const end = new Date(mondayUtc(now).getTime() + WEEK_MS);
      const mondays = Array.from({ length: 13 }, (_, i) =>
        new Date(first.getTime() + i * WEEK_MS).toISOString().slice(0, 10),
      );
      const expected = await expectedWeekly("applied", first, end);
      for (const site of sites) {
        expect(site.weekly.map((w) => w.weekStart)).toEqual(mondays);
        const want = expected.get(site.code) ?? Array.from({ length: 13 }, () => 0);
        expect(
          want.reduce((a, b) => a + b, 0),
          `${site.code} has services in the demo`,
        ).toBeGreaterThan(0);
        site.weekly.forEach((w, i) =>
          expect(w.appliedGrams, `${site.code} week of ${w.weekStart}`).toBeCloseTo(want[i]!, 6),
        );
        // The greases' own series add up to at most the site's (a grease without stock or reorder point is left out).
        const perGrease = site.greases.reduce(
          (total, g) => total + g.weekly.reduce((t, w) => t + w.appliedGrams, 0),
          0,
        );
        expect(perGrease).toBeLessThanOrEqual(want.reduce((a, b) => a + b, 0) + 1e-6);
      }
    }
  });

  it("containers issued this week count at their pack's mass, for the grease and for the site", async () => {
    const created = await lead.request("POST", "/api/v1/greases", {
      json: {
        code: `TRD-${Date.now().toString(36)}`,
        name: "Trend test grease",
        supplier: "Integration Oils",
        thickener: "lithium_complex",
        baseOilType: "mineral",
        viscosity40: 100,
        nlgiGrade: "2",
        packs: [{ kind: "cartridge", netMassGrams: 400 }],
      },
    });
    expect(created.status).toBe(201);
    const greaseId: number = created.body.id;
    const packId: number = created.body.packs[0].id;
    expect(
      (
        await clerk.request("POST", "/api/v1/stock/receipts", {
          json: { greaseId, packId, quantity: 5, lotNumber: "TRD-1", expiresOn: "2029-01-31" },
        })
      ).status,
    ).toBe(201);
    expect(
      (await clerk.request("POST", "/api/v1/stock/issues", { json: { greaseId, packId, quantity: 2 } }))
        .status,
    ).toBe(201);

    const now = new Date();
    const kbc = (await stockChartData(leadId, now)).find((s) => s.code === "KBC")!;
    const grease = kbc.greases.find((g) => g.greaseId === greaseId);
    expect(grease).toMatchObject({
      onHandGrams: 1200,
      reorderPointGrams: 0,
      belowReorderPoint: false,
      forecastGramsPerWeek: 0,
    });
    expect(grease!.weekly.at(-1)).toMatchObject({ issuedGrams: 800, appliedGrams: 0 });
    expect(grease!.weekly.slice(0, -1).every((w) => w.issuedGrams === 0)).toBe(true);

    const first = new Date(mondayUtc(now).getTime() - 12 * WEEK_MS);
    const expected = (await expectedWeekly("issued", first, new Date(first.getTime() + 13 * WEEK_MS))).get(
      "KBC",
    )!;
    expect(expected.at(-1)).toBeGreaterThanOrEqual(800);
    kbc.weekly.forEach((w, i) =>
      expect(w.issuedGrams, `KBC week of ${w.weekStart}`).toBeCloseTo(expected[i]!, 6),
    );
  });
});
