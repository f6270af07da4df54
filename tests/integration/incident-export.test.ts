import { parse } from "csv-parse/sync";
import { PDFParse } from "pdf-parse";
import { beforeAll, describe, expect, it } from "vitest";
import { restoreCell } from "@/lib/csv";
import { APP_URL, Client, rootQuery } from "./helpers";

// The auditor's exports (issue: incident log exports): CSV per RFC 4180 with formulas neutralised, and a PDF that
// carries the counts and the audit chain head.
const auditor = new Client();
const lead = new Client();
let leadId = "";
let awkwardId = 0;
const AWKWARD =
  '=HYPERLINK("http://example.invalid","open"), a "quoted" word; a comma, and\r\na new line — Öl, «Fett», 5 € ✓';

async function download(client: Client, query: string) {
  const headers: Record<string, string> = {
    origin: new URL(APP_URL).origin,
    cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join("; "),
  };
  const response = await fetch(new URL(`/api/v1/incidents/export?${query}`, APP_URL), { headers });
  return { response, body: Buffer.from(await response.arrayBuffer()) };
}

beforeAll(async () => {
  await Promise.all([auditor.signIn("auditor@example.com"), lead.signIn("lead@example.com")]);
  leadId = (await rootQuery<{ id: string }>("SELECT id FROM app_user WHERE email = 'lead@example.com'"))[0]!
    .id;
  const incidents = await import("@/lib/server/queries/incidents");
  const point = (await lead.request("GET", "/api/v1/points")).body.items[5] as { tag: string };
  const grease = (
    (await lead.request("GET", "/api/v1/greases")).body.items as { id: number; code: string }[]
  ).find((g) => g.code === "GL-SI2")!;
  awkwardId = (
    await incidents.reportFoundMix(
      { pointTag: point.tag, greaseFoundId: grease.id, description: AWKWARD },
      leadId,
    )
  ).id;
});

describe("CSV export", () => {
  it("round-trips awkward text (quotes, commas, new lines, a leading =, Unicode) with the formula neutralised", async () => {
    const { response, body } = await download(auditor, "format=csv");
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(response.headers.get("content-disposition")).toMatch(
      /^attachment; filename="greaseledger-incidents-\d{4}-\d{2}-\d{2}\.csv"$/,
    );
    const text = body.toString("utf8");
    expect(text.startsWith("\uFEFF")).toBe(true);
    expect(text.split("\r\n")[0]).toBe(
      "\uFEFFid,opened_at,site,area,asset,point_tag,point,kind,state,verdict,grease_in_point,grease_offered_or_found,reasons,description,root_cause,corrective_action,opened_by,closed_by,closed_at",
    );
    const records = parse(text, { bom: true, columns: true }) as Record<string, string>[];
    expect(records).toHaveLength(Number(response.headers.get("x-total-rows")));
    const row = records.find((r) => r.id === String(awkwardId))!;
    expect(row.description).toBe(`'${AWKWARD}`);
    expect(restoreCell(row.description!)).toBe(AWKWARD);
    expect(records.every((r) => !/^[=+@]/.test(r.description ?? "") && !/^[=+@]/.test(r.reasons ?? ""))).toBe(
      true,
    );
  });

  it("names a bad format or period, and is refused to a technician", async () => {
    const bad = await auditor.request("GET", "/api/v1/incidents/export?format=xlsx");
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.format).toBeDefined();
    expect(
      (await auditor.request("GET", "/api/v1/incidents/export?format=csv&from=2026-13-01")).body.error.fields
        .from,
    ).toBeDefined();
    const tech = new Client();
    await tech.signIn("tech@example.com");
    expect((await tech.request("GET", "/api/v1/incidents/export?format=csv")).status).toBe(403);
  });
});

describe("PDF report", () => {
  it("holds the counts by kind and state, the row count and the audit chain head, which the trail confirms", async () => {
    const { response, body } = await download(auditor, "format=pdf");
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toBe("application/pdf");
    const headSeq = Number(response.headers.get("x-audit-head-seq"));
    const headHash = response.headers.get("x-audit-head-hash")!;
    const text = (await new PDFParse({ data: new Uint8Array(body) }).getText()).text.replace(/\s+/g, " ");
    const counts = await rootQuery<{ state: string; n: number }>(
      "SELECT state, COUNT(*) AS n FROM mixing_incident GROUP BY state",
    );
    const n = (s: string) => Number(counts.find((c) => c.state === s)?.n ?? 0);
    const total = n("open") + n("investigating") + n("closed");
    expect(text).toContain(`Incidents: ${total}`);
    expect(text).toContain(
      `By state: open ${n("open")}; investigating ${n("investigating")}; closed ${n("closed")}`,
    );
    expect(text).toContain(`Incidents in this report: ${total}`);
    expect(text).toContain(`Audit chain head: entry ${headSeq}`);
    expect(text).toContain(headHash);
    expect(text).toContain("Kestrel Bay Cement Works");
    const [entry] = await rootQuery<{ hash: string; event: string }>(
      "SELECT hash, event FROM audit_log WHERE seq = ?",
      [headSeq],
    );
    expect(entry).toEqual({ hash: headHash, event: "incident.exported" });
    expect((await auditor.request("GET", "/api/v1/audit/verify")).body.ok).toBe(true);
  });
});

describe("the auditor reads and never writes", () => {
  it.each([
    ["POST", "/api/v1/greases", { code: "X-1" }],
    ["PATCH", "/api/v1/greases/1", { name: "Renamed" }],
    ["POST", "/api/v1/stock/receipts", { greaseId: 1, packId: 1, quantity: 1, lotNumber: "A" }],
    ["POST", "/api/v1/stock/issues", { greaseId: 1, packId: 1, quantity: 1 }],
    ["POST", "/api/v1/points/AAAAAAAA/services", { greaseId: 1, grams: 1 }],
  ])("%s %s → 403", async (method, path, json) => {
    expect((await auditor.request(method, path, { json })).status).toBe(403);
  });
});
