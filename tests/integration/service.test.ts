import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { Client, rootQuery } from "./helpers";

const tech = new Client();
let ids: Record<string, number> = {};

type PointRow = { tag_code: string; id: number; current_grease_id: number; site_code: string };
let kbcPoint: PointRow;
let kbcPoint2: PointRow;
let mfwPoint: PointRow;

beforeAll(async () => {
  await tech.signIn("tech@example.com");
  ids = Object.fromEntries((await rootQuery<{ id: number; code: string }>("SELECT id, code FROM grease")).map((r) => [r.code, Number(r.id)]));
  const points = await rootQuery<PointRow>(
    `SELECT p.tag_code, p.id, p.current_grease_id, s.code AS site_code FROM lube_point p JOIN site s ON s.id = p.site_id
     WHERE p.sealed_for_life = 0 AND p.current_grease_id = ? AND p.food_grade_required = 0
       AND NOT EXISTS (SELECT 1 FROM changeover c WHERE c.point_id = p.id AND c.state IN ('planned','in_progress')) ORDER BY p.id`,
    [ids["GL-EM2"]],
  );
  [kbcPoint, kbcPoint2] = points.filter((p) => p.site_code === "KBC") as [PointRow, PointRow];
  mfwPoint = points.find((p) => p.site_code === "MFW")!;
  expect(kbcPoint && kbcPoint2 && mfwPoint).toBeTruthy();
});

const service = (tag: string, body: unknown, key?: string) =>
  tech.request("POST", `/api/v1/points/${tag}/services`, { json: body, headers: key ? { "idempotency-key": key } : {} });
const count = async (sql: string, params: unknown[]) => Number((await rootQuery<{ n: number }>(sql, params))[0]!.n);

describe("the guarded service at a lube point", () => {
  it("a refused service creates exactly one incident and one outbox mail, and records no service", async () => {
    const before = {
      incidents: await count("SELECT COUNT(*) AS n FROM mixing_incident WHERE point_id = ?", [kbcPoint.id]),
      services: await count("SELECT COUNT(*) AS n FROM service_record WHERE point_id = ?", [kbcPoint.id]),
      mails: await count("SELECT COUNT(*) AS n FROM mail_outbox WHERE subject LIKE 'Mix refused at %'", []),
    };
    const key = randomUUID();
    const refused = await service(kbcPoint.tag_code, { greaseId: ids["GL-LX2"], grams: 10 }, key);
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe("mixing_blocked");
    expect(refused.body.verdict).toBe("incompatible");
    expect(refused.body.incidentId).toBeGreaterThan(0);
    const again = await service(kbcPoint.tag_code, { greaseId: ids["GL-LX2"], grams: 10 }, key);
    expect(again.status).toBe(409);
    expect(again.body.incidentId).toBe(refused.body.incidentId);

    expect(await count("SELECT COUNT(*) AS n FROM mixing_incident WHERE point_id = ?", [kbcPoint.id])).toBe(before.incidents + 1);
    expect(await count("SELECT COUNT(*) AS n FROM service_record WHERE point_id = ?", [kbcPoint.id])).toBe(before.services);
    expect(await count("SELECT COUNT(*) AS n FROM mail_outbox WHERE subject LIKE 'Mix refused at %'", [])).toBe(before.mails + 1);
    const [incident] = await rootQuery<{ verdict: string; reasons_json: string; grease_offered_id: number; grease_in_point_id: number }>(
      "SELECT verdict, reasons_json, grease_offered_id, grease_in_point_id FROM mixing_incident WHERE id = ?",
      [refused.body.incidentId],
    );
    expect(incident).toMatchObject({ verdict: "incompatible", grease_offered_id: ids["GL-LX2"], grease_in_point_id: ids["GL-EM2"] });
    expect(JSON.parse(incident!.reasons_json).some((r: { kind: string }) => r.kind === "thickener")).toBe(true);
  });

  it("the same Idempotency-Key twice records one service and answers the same", async () => {
    const before = await count("SELECT COUNT(*) AS n FROM service_record WHERE point_id = ?", [kbcPoint2.id]);
    const key = randomUUID();
    const body = { greaseId: ids["GL-EM2"], grams: 12, purgeSeen: true };
    const first = await service(kbcPoint2.tag_code, body, key);
    const second = await service(kbcPoint2.tag_code, body, key);
    expect(first.status).toBe(201);
    expect(second.status).toBe(201);
    expect(second.body).toEqual(first.body);
    expect(await count("SELECT COUNT(*) AS n FROM service_record WHERE point_id = ?", [kbcPoint2.id])).toBe(before + 1);
    const [point] = await rootQuery<{ last_serviced_at: Date; next_due_at: Date }>("SELECT last_serviced_at, next_due_at FROM lube_point WHERE id = ?", [kbcPoint2.id]);
    expect(new Date(point!.next_due_at).getTime()).toBeGreaterThan(new Date(point!.last_serviced_at).getTime());
  });

  it("the same key with another body is refused with 422 and changes nothing", async () => {
    const key = randomUUID();
    expect((await service(kbcPoint2.tag_code, { greaseId: ids["GL-EM2"], grams: 12 }, key)).status).toBe(201);
    const before = await count("SELECT COUNT(*) AS n FROM service_record WHERE point_id = ?", [kbcPoint2.id]);
    const reused = await service(kbcPoint2.tag_code, { greaseId: ids["GL-EM2"], grams: 40 }, key);
    expect(reused.status).toBe(422);
    expect(await count("SELECT COUNT(*) AS n FROM service_record WHERE point_id = ?", [kbcPoint2.id])).toBe(before);
  });

  it("concurrent retries with one key record once", async () => {
    const before = await count("SELECT COUNT(*) AS n FROM service_record WHERE point_id = ?", [kbcPoint2.id]);
    const key = randomUUID();
    const answers = await Promise.all(Array.from({ length: 8 }, () => service(kbcPoint2.tag_code, { greaseId: ids["GL-EM2"], grams: 11 }, key)));
    expect(answers.every((a) => a.status === 201 || a.status === 409)).toBe(true);
    expect(await count("SELECT COUNT(*) AS n FROM service_record WHERE point_id = ?", [kbcPoint2.id])).toBe(before + 1);
  });

  it("a technician of one site cannot read or service a point of the other site (404), and nothing is written", async () => {
    expect((await tech.request("GET", `/api/v1/points/${mfwPoint.tag_code}`)).status).toBe(404);
    expect((await tech.request("GET", `/api/v1/points/${mfwPoint.tag_code}/qr.svg`)).status).toBe(404);
    const before = await count("SELECT COUNT(*) AS n FROM service_record WHERE point_id = ?", [mfwPoint.id]);
    expect((await service(mfwPoint.tag_code, { greaseId: ids["GL-EM2"], grams: 10 })).status).toBe(404);
    expect(await count("SELECT COUNT(*) AS n FROM service_record WHERE point_id = ?", [mfwPoint.id])).toBe(before);
    const list = await tech.request("GET", "/api/v1/points");
    expect(list.body.items.some((p: { tag: string }) => p.tag === mfwPoint.tag_code)).toBe(false);
    expect(list.body.items.length).toBeGreaterThan(100);
  });

  it("answers the point, its QR code and the due filter as the API describes", async () => {
    const point = await tech.request("GET", `/api/v1/points/${kbcPoint.tag_code}`);
    expect(point.status).toBe(200);
    for (const field of ["tag", "name", "asset", "site", "assignedGrease", "currentGrease", "intervalHours", "quantityGrams", "lastServicedAt", "nextDueAt", "due"]) {
      expect(point.body).toHaveProperty(field);
    }
    const svg = await tech.request("GET", `/api/v1/points/${kbcPoint.tag_code}/qr.svg`);
    expect(svg.headers.get("content-type")).toBe("image/svg+xml");
    expect(svg.text).toMatch(/^<svg/);
    const overdue = await tech.request("GET", "/api/v1/points?due=overdue");
    expect(overdue.body.items.every((p: { due: string }) => p.due === "overdue")).toBe(true);
    expect((await tech.request("GET", "/api/v1/points?due=soon")).status).toBe(400);
  });

  it("names the field when the amount is missing, and refuses an auditor (403)", async () => {
    const missing = await service(kbcPoint2.tag_code, { greaseId: ids["GL-EM2"] });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields.grams).toBeDefined();
    const auditor = new Client();
    await auditor.signIn("auditor@example.com");
    expect((await auditor.request("POST", `/api/v1/points/${kbcPoint2.tag_code}/services`, { json: { greaseId: ids["GL-EM2"], grams: 5 } })).status).toBe(403);
  });
});
