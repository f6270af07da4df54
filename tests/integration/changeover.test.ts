import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Client, rootQuery } from "./helpers";

const tech = new Client();
let leadId: string;
let ids: Record<string, number> = {};
let tag: string;

beforeAll(async () => {
  await tech.signIn("tech@example.com");
  leadId = (await rootQuery<{ id: string }>("SELECT id FROM app_user WHERE email = 'lead@example.com'"))[0]!.id;
  ids = Object.fromEntries((await rootQuery<{ id: number; code: string }>("SELECT id, code FROM grease")).map((r) => [r.code, Number(r.id)]));
  const [point] = await rootQuery<{ tag_code: string }>(
    `SELECT p.tag_code FROM lube_point p JOIN site s ON s.id = p.site_id WHERE s.code = 'KBC' AND p.current_grease_id = ? AND p.sealed_for_life = 0
       AND p.food_grade_required = 0 AND NOT EXISTS (SELECT 1 FROM changeover c WHERE c.point_id = p.id) ORDER BY p.id DESC LIMIT 1`,
    [ids["GL-EM2"]],
  );
  tag = point!.tag_code;
});

afterAll(async () => {
  const { getSequelize } = await import("@/lib/server/db");
  await getSequelize().close();
  const { getMysqlPool } = await import("@/lib/server/mysql-pool");
  await getMysqlPool().end();
});

const service = (greaseId: number) => tech.request("POST", `/api/v1/points/${tag}/services`, { json: { greaseId, grams: 10 } });

describe("a changeover from polyurea to shear-stable polyurea", () => {
  it("allows only the new grease while it runs, and makes it the point's grease when done", async () => {
    const { planChangeover } = await import("@/lib/server/queries/points");
    await planChangeover({ tag, toGreaseId: ids["GL-SS2"]!, method: "purge", shortenedIntervalHours: 300, servicesPlanned: 2 }, leadId);
    await expect(planChangeover({ tag, toGreaseId: ids["GL-SS2"]!, method: "purge", servicesPlanned: 2 }, leadId)).rejects.toThrow(/already planned/);

    const old = await service(ids["GL-EM2"]!);
    expect(old.status).toBe(409);
    const [incident] = await rootQuery<{ kind: string }>("SELECT kind FROM mixing_incident WHERE id = ?", [old.body.incidentId]);
    expect(incident!.kind).toBe("changeover_exception");

    const first = await service(ids["GL-SS2"]!);
    expect(first.status).toBe(201);
    const [running] = await rootQuery<{ state: string; services_done: number }>(
      "SELECT c.state, c.services_done FROM changeover c JOIN lube_point p ON p.id = c.point_id WHERE p.tag_code = ?",
      [tag],
    );
    expect(running).toMatchObject({ state: "in_progress", services_done: 1 });
    // The shortened interval applies while the old grease is being purged: next due 300 running hours on.
    const hoursToDue = (new Date(first.body.service.nextDueAt).getTime() - new Date(first.body.service.performedAt).getTime()) / 3_600_000;
    const [{ running_hours_per_day }] = (await rootQuery<{ running_hours_per_day: string }>("SELECT running_hours_per_day FROM lube_point WHERE tag_code = ?", [tag])) as [{ running_hours_per_day: string }];
    expect(hoursToDue).toBeCloseTo((300 / Number(running_hours_per_day)) * 24, 0);

    expect((await service(ids["GL-SS2"]!)).status).toBe(201);
    const [point] = await rootQuery<{ current_grease_id: number; assigned_grease_id: number }>("SELECT current_grease_id, assigned_grease_id FROM lube_point WHERE tag_code = ?", [tag]);
    expect(point).toMatchObject({ current_grease_id: ids["GL-SS2"], assigned_grease_id: ids["GL-SS2"] });
    const [done] = await rootQuery<{ state: string }>("SELECT c.state FROM changeover c JOIN lube_point p ON p.id = c.point_id WHERE p.tag_code = ?", [tag]);
    expect(done!.state).toBe("completed");
  });
});
