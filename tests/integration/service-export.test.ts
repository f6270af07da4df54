import { parse } from "csv-parse/sync";
import { beforeAll, describe, expect, it } from "vitest";
import { restoreCell } from "@/lib/csv";
import { APP_URL, Client, createUser, rootQuery, uniqueEmail } from "./helpers";

// The service-history export (CSV, streamed a page at a time). Its rows are put in a period of their own, far from
// the demo's three months of history, so every count below is known: more than two pages (5,000 rows each) at one
// site, a few at the other.
const FROM = "2019-03-01";
const TO = "2019-03-03";
const PAGE = 5000;
const KBC_ROWS = 2 * PAGE + 7;
const MFW_ROWS = 25;
const AWKWARD =
  '=HYPERLINK("http://example.invalid","open"), a "quoted" word; a comma, and\r\na new line — Öl, «Fett», 5 € ✓ 🛢';
const MFW_MARK = "only-at-marlow-fen";

const auditor = new Client();
const kbcLead = new Client();
const sites: Record<string, { id: number; name: string }> = {};
let awkwardId = 0;
let lotNumber = "";
let gunLabel = "";

async function download(client: Client, query: string) {
  const response = await fetch(new URL(`/api/v1/services/export?${query}`, APP_URL), {
    headers: { cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join("; ") },
  });
  const text = Buffer.from(await response.arrayBuffer()).toString("utf8");
  return { response, text };
}

const records = (text: string) => parse(text, { bom: true, columns: true }) as Record<string, string>[];

beforeAll(async () => {
  for (const s of await rootQuery<{ id: number; code: string; name: string }>(
    "SELECT id, code, name FROM site",
  ))
    sites[s.code] = { id: Number(s.id), name: s.name };
  const pointAt = async (code: string) =>
    (
      await rootQuery<{ id: number; grease: number }>(
        "SELECT id, COALESCE(current_grease_id, assigned_grease_id) AS grease FROM lube_point WHERE site_id = ? AND COALESCE(current_grease_id, assigned_grease_id) IS NOT NULL ORDER BY id LIMIT 1",
        [sites[code]!.id],
      )
    )[0]!;
  const [tech] = await rootQuery<{ id: string }>("SELECT id FROM app_user WHERE email = 'tech@example.com'");
  const kbc = await pointAt("KBC");
  const mfw = await pointAt("MFW");
  const [lot] = await rootQuery<{ id: number; lot_number: string }>(
    "SELECT id, lot_number FROM stock_lot WHERE site_id = ? ORDER BY id LIMIT 1",
    [sites.KBC!.id],
  );
  const [gun] = await rootQuery<{ id: number; label: string }>(
    "SELECT id, label FROM grease_gun WHERE site_id = ? ORDER BY id LIMIT 1",
    [sites.KBC!.id],
  );
  lotNumber = lot!.lot_number;
  gunLabel = gun!.label;

  // Times spread over the period out of id order, so a page boundary never falls on a sorted run by accident.
  const at = (i: number) =>
    new Date(Date.parse(`${FROM}T00:00:00Z`) + ((i * 7919) % (3 * 86_400)) * 1000 + (i % 1000)).toISOString();
  const row = (siteId: number, point: { id: number; grease: number }, i: number, notes: string | null) => [
    siteId,
    point.id,
    point.grease,
    (10 + (i % 40) / 4).toFixed(2),
    notes,
    tech!.id,
    at(i).replace("T", " ").replace("Z", ""),
  ];
  const insert = async (rows: unknown[][]) => {
    for (let i = 0; i < rows.length; i += 1000) {
      const chunk = rows.slice(i, i + 1000);
      await rootQuery(
        `INSERT INTO service_record (site_id, point_id, grease_id, grams, notes, performed_by, performed_at) VALUES ${chunk.map(() => "(?, ?, ?, ?, ?, ?, ?)").join(", ")}`,
        chunk.flat(),
      );
    }
  };
  await insert(
    Array.from({ length: KBC_ROWS - 1 }, (_, i) =>
      row(sites.KBC!.id, kbc, i, i % 500 === 0 ? `check ${i}` : null),
    ),
  );
  await insert(Array.from({ length: MFW_ROWS }, (_, i) => row(sites.MFW!.id, mfw, i, `${MFW_MARK} ${i}`)));
  // The awkward one carries the lot and the gun too, and sits on the last day, at the end of it.
  await rootQuery(
    `INSERT INTO service_record (site_id, point_id, grease_id, lot_id, gun_id, grams, strokes, planned_grams, quantity_flag, back_pressure, purge_seen, housing_temperature_c, notes, performed_by, performed_at)
     VALUES (?, ?, ?, ?, ?, 12.50, 8, 10.00, 'over', 1, 1, -4.5, ?, ?, ?)`,
    [sites.KBC!.id, kbc.id, kbc.grease, lot!.id, gun!.id, AWKWARD, tech!.id, `${TO} 23:59:59.999`],
  );
  awkwardId = Number(
    (
      await rootQuery<{ id: number }>("SELECT MAX(id) AS id FROM service_record WHERE notes = ?", [AWKWARD])
    )[0]!.id,
  );

  const lead = await createUser({ email: uniqueEmail("kbc-lead"), role: "lead" });
  await rootQuery("INSERT INTO user_site_access (user_id, site_id, created_at) VALUES (?, ?, NOW(3))", [
    lead.id,
    sites.KBC!.id,
  ]);
  await Promise.all([auditor.signIn("auditor@example.com"), kbcLead.signIn(lead.email, lead.password)]);
});

const dbIds = async (siteIds: number[]) =>
  (
    await rootQuery<{ id: number }>(
      "SELECT id FROM service_record WHERE site_id IN (?) AND performed_at >= ? AND performed_at < ? ORDER BY id",
      [siteIds, `${FROM} 00:00:00`, "2019-03-04 00:00:00"],
    )
  ).map((r) => String(r.id));

describe("service history CSV", () => {
  it("streams RFC 4180 CSV with a BOM whose awkward note round-trips with the formula neutralised", async () => {
    const { response, text } = await download(auditor, `format=csv&from=${FROM}&to=${TO}`);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(response.headers.get("content-disposition")).toMatch(
      /^attachment; filename="greaseledger-services-\d{4}-\d{2}-\d{2}\.csv"$/,
    );
    expect(response.headers.get("cache-control")).toBe("private, no-store, no-transform");
    expect(text.startsWith("\uFEFFService id,Performed at (UTC),Site,Area,Asset,Point tag,Point name,")).toBe(
      true,
    );
    expect(text.split("\r\n")[0]).toContain(",Housing temperature °C,Lot number,Performed by,Notes");
    const row = records(text).find((r) => r["Service id"] === String(awkwardId))!;
    expect(row.Notes).toBe(`'${AWKWARD}`);
    expect(restoreCell(row.Notes!)).toBe(AWKWARD);
    expect(row).toMatchObject({
      "Performed at (UTC)": `${TO}T23:59:59.999Z`,
      Site: sites.KBC!.name,
      Grams: "12.50",
      Strokes: "8",
      "Grease gun": gunLabel,
      "Planned grams": "10.00",
      "Quantity flag": "over",
      "Back pressure": "yes",
      "Purge seen": "yes",
      Noise: "no",
      "Housing temperature °C": "-4.5",
      "Lot number": lotNumber,
      "Performed by": "Jonah Vestergaard",
    });
    expect(row["Point tag"]).toMatch(/^[0-9A-Z]{8}$/);
  });

  it("holds exactly the period's rows of the caller's sites, in id order across pages, none twice", async () => {
    const { response, text } = await download(auditor, `from=${FROM}&to=${TO}`);
    const rows = records(text);
    const expected = await dbIds([sites.KBC!.id, sites.MFW!.id]);
    expect(expected.length).toBe(KBC_ROWS + MFW_ROWS);
    expect(expected.length).toBeGreaterThan(2 * PAGE);
    expect(Number(response.headers.get("x-total-rows"))).toBe(expected.length);
    const ids = rows.map((r) => r["Service id"]!);
    expect(ids).toEqual(expected);
    expect(new Set(ids).size).toBe(ids.length);
    for (let i = 1; i < ids.length; i++) expect(Number(ids[i])).toBeGreaterThan(Number(ids[i - 1]));
    for (const r of rows)
      expect(r["Performed at (UTC)"]).toMatch(/^2019-03-0[123]T\d{2}:\d{2}:\d{2}\.\d{3}Z$/);
  });

  it("never shows another site's services: a lead of one site gets that site only, and is refused the other", async () => {
    const { text } = await download(kbcLead, `from=${FROM}&to=${TO}`);
    const rows = records(text);
    expect(rows.map((r) => r["Service id"])).toEqual(await dbIds([sites.KBC!.id]));
    expect(new Set(rows.map((r) => r.Site))).toEqual(new Set([sites.KBC!.name]));
    expect(text).not.toContain(MFW_MARK);
    const refused = await kbcLead.request(
      "GET",
      `/api/v1/services/export?from=${FROM}&to=${TO}&site=${sites.MFW!.id}`,
    );
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toContain(String(sites.MFW!.id));
    // The auditor may narrow to one site.
    const mfwOnly = records((await download(auditor, `from=${FROM}&to=${TO}&site=${sites.MFW!.id}`)).text);
    expect(mfwOnly).toHaveLength(MFW_ROWS);
    expect(mfwOnly.every((r) => r.Site === sites.MFW!.name && r.Notes!.startsWith(MFW_MARK))).toBe(true);
  });

  it("is refused to a technician (403) and to no session (401)", async () => {
    const tech = new Client();
    await tech.signIn("tech@example.com");
    expect((await tech.request("GET", `/api/v1/services/export?from=${FROM}&to=${TO}`)).status).toBe(403);
    expect((await new Client().request("GET", `/api/v1/services/export?from=${FROM}&to=${TO}`)).status).toBe(
      401,
    );
  });

  it.each([
    ["a date that does not exist", "from=2019-02-30&to=2019-03-03", "from"],
    ["a date in another shape", "from=01.03.2019", "from"],
    ["from after to", "from=2019-03-04&to=2019-03-03", "from"],
    ["more than three years", "from=2016-03-03&to=2019-03-03", "from"],
    ["a bad to", "to=2019-3-3", "to"],
    ["a site that is not an id", "site=KBC", "site"],
    ["another format", "format=pdf", "format"],
  ])("answers 400 naming the field for %s", async (_label, query, field) => {
    const answer = await auditor.request("GET", `/api/v1/services/export?${query}`);
    expect(answer.status).toBe(400);
    expect(answer.body.error.code).toBe("validation_failed");
    expect(Object.keys(answer.body.error.fields)).toEqual([field]);
  });

  it("writes who exported what to the audit trail before the file, and sends that entry as the chain head", async () => {
    const { response } = await download(kbcLead, `from=${FROM}&to=${TO}`);
    const seq = Number(response.headers.get("x-audit-head-seq"));
    const [entry] = await rootQuery<{ event: string; hash: string; payload_json: string }>(
      "SELECT * FROM audit_log WHERE seq = ?",
      [seq],
    );
    expect(entry).toMatchObject({
      event: "service.exported",
      hash: response.headers.get("x-audit-head-hash"),
    });
    const payload = JSON.parse(entry!.payload_json) as Record<string, unknown>;
    expect(payload).toMatchObject({ from: FROM, to: TO, sites: [sites.KBC!.id], rows: KBC_ROWS });
    expect((await auditor.request("GET", "/api/v1/audit/verify")).body.ok).toBe(true);
  });

  it("gives the header alone for a period without services", async () => {
    const { response, text } = await download(auditor, "from=2001-01-01&to=2001-01-31");
    expect(response.status).toBe(200);
    expect(response.headers.get("x-total-rows")).toBe("0");
    expect(records(text)).toEqual([]);
    expect(text.split("\r\n")).toHaveLength(2);
  });
});
