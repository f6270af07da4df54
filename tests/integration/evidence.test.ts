import { beforeAll, describe, expect, it } from "vitest";
import { Client, rootQuery } from "./helpers";

const lead = new Client();
const auditor = new Client();
let ids: Record<string, number> = {};

beforeAll(async () => {
  await lead.signIn("lead@example.com");
  await auditor.signIn("auditor@example.com");
  const rows = await rootQuery<{ id: number; code: string }>("SELECT id, code FROM grease");
  ids = Object.fromEntries(rows.map((r) => [r.code, Number(r.id)]));
});

async function postEvidence(client: Client, payload: unknown, file?: { body: Buffer; name: string }) {
  const form = new FormData();
  form.set("payload", JSON.stringify(payload));
  if (file) form.set("file", new Blob([new Uint8Array(file.body)]), file.name);
  const response = await fetch(new URL("/api/v1/compatibility/evidence", client.base), {
    method: "POST",
    body: form,
    headers: { origin: new URL(client.base).origin, cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join("; ") },
  });
  return { status: response.status, body: (await response.json()) as any };
}

const evaluate = (a: number, b: number) => lead.request("POST", "/api/v1/compatibility/evaluate", { json: { a: { greaseId: a }, b: { greaseId: b } } });

describe("product-pair evidence", () => {
  it("a supplier statement turns an incompatible chart verdict into compatible for that pair only", async () => {
    const [a, b] = [ids["GL-EM2"]!, ids["GL-SS2"]!]; // polyurea + shear-stable polyurea: not in the default chart
    expect((await evaluate(a, b)).body.verdict).not.toBe("compatible");
    const saved = await postEvidence(lead, { greaseAId: a, greaseBId: b, kind: "supplier_statement", verdict: "compatible", title: "Letter from Brackenridge, 2026-11-02" });
    expect(saved.status).toBe(201);
    const after = await evaluate(b, a);
    expect(after.body.verdict).toBe("compatible");
    expect(after.body.reasons.find((r: { kind: string }) => r.kind === "evidence").message).toMatch(/Letter from Brackenridge/);
  });

  it("evidence can make a chart-compatible pair incompatible", async () => {
    const [a, b] = [ids["GL-LX2"]!, ids["GL-LX220"]!]; // lithium complex + lithium complex, mineral: compatible by chart… but 100 vs 220 mm²/s
    const saved = await postEvidence(lead, { greaseAId: a, greaseBId: b, kind: "supplier_statement", verdict: "incompatible", title: "Supplier bulletin 7/2026" });
    expect(saved.status).toBe(201);
    expect((await evaluate(a, b)).body.verdict).toBe("incompatible");
  });

  it("a lab mixture test is judged by the engine: a mixture softer than both neat greases fails", async () => {
    const [a, b] = [ids["GL-MP2"]!, ids["GL-BX2"]!];
    const neat = { droppingPointC: 190, workedPenetrationProlonged: 300, storagePenetrationChange: 5 };
    const saved = await postEvidence(lead, {
      greaseAId: a,
      greaseBId: b,
      kind: "lab_mixture_test",
      title: "Lab report 2026-201",
      neatA: neat,
      neatB: { droppingPointC: 220, workedPenetrationProlonged: 290, storagePenetrationChange: 6 },
      mixtures: [{ ratioA: 50, result: { droppingPointC: 150, workedPenetrationProlonged: 360, storagePenetrationChange: 30 } }],
    });
    expect(saved.status).toBe(201);
    expect(saved.body.verdict).toBe("incompatible");
  });

  it("an incomplete lab test names the mixtures field and stores nothing", async () => {
    const before = await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM grease_pair_evidence");
    const response = await postEvidence(lead, { greaseAId: ids["GL-MP2"], greaseBId: ids["GL-L3"], kind: "lab_mixture_test", title: "Empty test" });
    expect(response.status).toBe(400);
    expect(response.body.error.fields.mixtures).toBeDefined();
    expect((await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM grease_pair_evidence"))[0]!.n).toBe(before[0]!.n);
  });

  it("refuses the same grease twice, a renamed non-PDF (415), and the auditor (403)", async () => {
    const same = await postEvidence(lead, { greaseAId: ids["GL-L3"], greaseBId: ids["GL-L3"], kind: "supplier_statement", verdict: "compatible", title: "Same" });
    expect(same.status).toBe(400);
    expect(same.body.error.fields.greaseBId).toBeDefined();
    const docsBefore = await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM stored_document");
    const fake = await postEvidence(
      lead,
      { greaseAId: ids["GL-L3"], greaseBId: ids["GL-MP2"], kind: "supplier_statement", verdict: "compatible", title: "Fake PDF" },
      { body: Buffer.from("MZ\x90\x00 this is an exe"), name: "letter.pdf" },
    );
    expect(fake.status).toBe(415);
    expect((await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM stored_document"))[0]!.n).toBe(docsBefore[0]!.n);
    expect((await rootQuery("SELECT id FROM grease_pair_evidence WHERE title = 'Fake PDF'")).length).toBe(0);
    const denied = await postEvidence(auditor, { greaseAId: ids["GL-L3"], greaseBId: ids["GL-MP2"], kind: "supplier_statement", verdict: "compatible", title: "Auditor" });
    expect(denied.status).toBe(403);
  });

  it("everyone may read the evidence list", async () => {
    const response = await auditor.request("GET", "/api/v1/compatibility/evidence");
    expect(response.status).toBe(200);
    expect(response.body.items.some((e: { kind: string }) => e.kind === "lab_mixture_test")).toBe(true);
  });
});
