import { beforeAll, describe, expect, it } from "vitest";
import { Client, rootQuery } from "./helpers";

// The incident log: the lead reports and works incidents, everyone allowed reads them, each step is kept.
const lead = new Client();
const auditor = new Client();
const tech = new Client();
let leadId = "";
let incidents: typeof import("@/lib/server/queries/incidents");

beforeAll(async () => {
  await Promise.all([
    lead.signIn("lead@example.com"),
    auditor.signIn("auditor@example.com"),
    tech.signIn("tech@example.com"),
  ]);
  leadId = (await rootQuery<{ id: string }>("SELECT id FROM app_user WHERE email = 'lead@example.com'"))[0]!
    .id;
  incidents = await import("@/lib/server/queries/incidents");
});

describe("GET /api/v1/incidents", () => {
  it("gives the demo's incidents to the auditor, filters by state and period, and names a bad filter", async () => {
    const all = await auditor.request("GET", "/api/v1/incidents");
    expect(all.status).toBe(200);
    expect(all.body.items.length).toBeGreaterThanOrEqual(3);
    const states = new Set(all.body.items.map((i: { state: string }) => i.state));
    expect(states).toEqual(new Set(["open", "investigating", "closed"]));
    for (const field of [
      "id",
      "site",
      "kind",
      "state",
      "verdict",
      "greaseInPoint",
      "greaseOffered",
      "reasons",
      "openedAt",
    ])
      expect(all.body.items[0]).toHaveProperty(field);

    const closed = await auditor.request("GET", "/api/v1/incidents?state=closed");
    expect(closed.body.items.length).toBeGreaterThanOrEqual(1);
    expect(
      closed.body.items.every(
        (i: { state: string; rootCause: string | null }) => i.state === "closed" && i.rootCause,
      ),
    ).toBe(true);

    const today = new Date().toISOString().slice(0, 10);
    const recent = await auditor.request("GET", `/api/v1/incidents?from=${today}&to=${today}`);
    expect(recent.body.items.every((i: { openedAt: string }) => i.openedAt.slice(0, 10) === today)).toBe(
      true,
    );

    const backwards = await auditor.request("GET", "/api/v1/incidents?from=2026-05-01&to=2026-04-01");
    expect(backwards.status).toBe(400);
    expect(backwards.body.error.fields.to).toBeDefined();
    const badKind = await auditor.request("GET", "/api/v1/incidents?kind=spill");
    expect(badKind.status).toBe(400);
    expect(badKind.body.error.fields.kind).toBeDefined();
  });

  it("is refused to the technician and the clerk (403)", async () => {
    expect((await tech.request("GET", "/api/v1/incidents")).status).toBe(403);
    const clerk = new Client();
    await clerk.signIn("clerk@example.com");
    expect((await clerk.request("GET", "/api/v1/incidents")).status).toBe(403);
  });
});

describe("working an incident", () => {
  it("a reported mix is judged by the engine, then investigated, refused closure without a cause, closed once, and every step is kept", async () => {
    const list = (await tech.request("GET", "/api/v1/points")).body.items as { tag: string }[];
    const point = (await tech.request("GET", `/api/v1/points/${list[3]!.tag}`)).body as {
      tag: string;
      currentGrease: { id: number } | null;
    };
    const greases = (await lead.request("GET", "/api/v1/greases")).body.items as {
      id: number;
      code: string;
    }[];
    const found = greases.find((g) => g.code === "GL-PF2")!; // a PFPE grease mixes with nothing else
    const { id } = await incidents.reportFoundMix(
      { pointTag: point.tag, greaseFoundId: found.id, description: "White paste at the purge port." },
      leadId,
    );
    let detail = await incidents.getIncident(id, leadId);
    expect(detail.incident).toMatchObject({
      kind: "found_after_fact",
      state: "open",
      greaseOffered: { id: found.id },
    });
    expect(detail.incident.verdict).not.toBe("compatible");
    expect(detail.incident.reasons.length).toBeGreaterThan(0);

    await incidents.moveIncident(
      { id, version: detail.incident.version, to: "investigating", note: "Lab sample taken" },
      leadId,
    );
    detail = await incidents.getIncident(id, leadId);
    await expect(
      incidents.moveIncident({ id, version: detail.incident.version, to: "closed" }, leadId),
    ).rejects.toMatchObject({
      status: 400,
      fields: { rootCause: expect.any(Array), correctiveAction: expect.any(Array) },
    });
    const close = {
      id,
      version: detail.incident.version,
      to: "closed" as const,
      rootCause: "A contractor's gun held PFPE grease.",
      correctiveAction: "Housing cleaned out and repacked; contractor guns now issued from our store.",
    };
    const both = await Promise.allSettled([
      incidents.moveIncident(close, leadId),
      incidents.moveIncident(close, leadId),
    ]);
    expect(both.filter((r) => r.status === "fulfilled")).toHaveLength(1);
    expect(both.find((r) => r.status === "rejected")).toMatchObject({ reason: { status: 409 } });

    detail = await incidents.getIncident(id, leadId);
    expect(detail.incident).toMatchObject({
      state: "closed",
      rootCause: close.rootCause,
      correctiveAction: close.correctiveAction,
    });
    expect(detail.steps.map((s) => s.kind)).toEqual(["opened", "investigating", "closed"]);
    const audit = await rootQuery<{ event: string }>(
      "SELECT event FROM audit_log WHERE subject_type = 'incident' AND subject_id = ? ORDER BY seq",
      [String(id)],
    );
    expect(audit.map((a) => a.event)).toEqual([
      "incident.reported",
      "incident.investigating",
      "incident.closed",
    ]);
  });

  it("a lube-point refusal opens its incident with the first step of the timeline", async () => {
    const [row] = await rootQuery<{ n: number }>(
      "SELECT COUNT(*) AS n FROM mixing_incident i LEFT JOIN incident_event e ON e.incident_id = i.id AND e.kind = 'opened' WHERE e.id IS NULL",
    );
    expect(Number(row!.n)).toBe(0);
  });
});
