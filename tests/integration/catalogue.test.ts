import { readdirSync } from "node:fs";
import { beforeAll, describe, expect, it } from "vitest";
import { Client, rootQuery } from "./helpers";

const lead = new Client();
const tech = new Client();
const auditor = new Client();

beforeAll(async () => {
  expect((await lead.signIn("lead@example.com")).status).toBe(200);
  expect((await tech.signIn("tech@example.com")).status).toBe(200);
  expect((await auditor.signIn("auditor@example.com")).status).toBe(200);
});

const newGrease = (code: string) => ({
  code,
  name: `Test grease ${code}`,
  supplier: "Integration Oils",
  thickener: "lithium_complex",
  baseOilType: "pao",
  viscosity40: 150,
  viscosity100: 18,
  nlgiGrade: "2",
  foodGrade: "none",
  solidAdditives: [],
  packs: [{ kind: "cartridge", netMassGrams: 400 }],
});
const code = () => `IT-${Date.now().toString(36)}-${Math.floor(Math.random() * 1000)}`;

describe("catalogue API", () => {
  it("everyone reads the catalogue; the demo has at least twelve greases with every API field", async () => {
    for (const client of [tech, auditor, lead]) {
      const response = await client.request("GET", "/api/v1/greases");
      expect(response.status).toBe(200);
      expect(response.body.items.length).toBeGreaterThanOrEqual(12);
    }
    const grease = (await auditor.request("GET", "/api/v1/greases")).body.items[0];
    for (const field of ["id", "code", "name", "supplier", "thickener", "baseOilType", "viscosity40", "nlgiGrade", "foodGrade", "solidAdditives", "packs"]) {
      expect(grease).toHaveProperty(field);
    }
  });

  it("a technician and an auditor cannot create a grease (403); nothing is written", async () => {
    const c = code();
    expect((await tech.request("POST", "/api/v1/greases", { json: newGrease(c) })).status).toBe(403);
    expect((await auditor.request("POST", "/api/v1/greases", { json: newGrease(c) })).status).toBe(403);
    expect(await rootQuery("SELECT id FROM grease WHERE code = ?", [c])).toHaveLength(0);
  });

  it("the lead creates, reads and changes a grease; a stale version gives 409", async () => {
    const c = code();
    const created = await lead.request("POST", "/api/v1/greases", { json: newGrease(c) });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ code: c, thickener: "lithium_complex", viscosity40: 150, packs: [{ kind: "cartridge", netMassGrams: 400 }] });
    const id = created.body.id;
    expect((await tech.request("GET", `/api/v1/greases/${id}`)).body.code).toBe(c);

    const patched = await lead.request("PATCH", `/api/v1/greases/${id}`, { json: { nlgiGrade: "3", version: 1 } });
    expect(patched.status).toBe(200);
    expect(patched.body).toMatchObject({ nlgiGrade: "3", version: 2, viscosity40: 150 });
    const stale = await lead.request("PATCH", `/api/v1/greases/${id}`, { json: { nlgiGrade: "1", version: 1 } });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe("stale_version");
    expect((await tech.request("PATCH", `/api/v1/greases/${id}`, { json: { nlgiGrade: "1" } })).status).toBe(403);
  });

  it("a PATCH that breaks a rule across fields names the field and changes nothing", async () => {
    const created = await lead.request("POST", "/api/v1/greases", { json: newGrease(code()) });
    const response = await lead.request("PATCH", `/api/v1/greases/${created.body.id}`, { json: { viscosity100: 500 } });
    expect(response.status).toBe(400);
    expect(response.body.error.fields.viscosity100).toBeDefined();
    expect((await lead.request("GET", `/api/v1/greases/${created.body.id}`)).body.viscosity100).toBe(18);
  });

  it.each([
    ["bad enum and number", { ...newGrease("X-1"), thickener: "unobtainium", viscosity40: -3 }, ["thickener", "viscosity40"]],
    ["missing fields", { code: "X-2" }, ["name", "supplier", "thickener", "baseOilType", "viscosity40", "nlgiGrade"]],
    ["bad pack", { ...newGrease("X-3"), packs: [{ kind: "barrel", netMassGrams: 0 }] }, ["packs.0.kind", "packs.0.netMassGrams"]],
    ["temperatures reversed", { ...newGrease("X-4"), minTemperatureC: 100, maxTemperatureC: 50 }, ["maxTemperatureC"]],
  ])("an invalid body (%s) gives 400 naming each field", async (_label, body, fields) => {
    const response = await lead.request("POST", "/api/v1/greases", { json: body });
    expect(response.status).toBe(400);
    for (const field of fields) expect(response.body.error.fields).toHaveProperty([field]);
  });

  it("a duplicate code is refused on the code field", async () => {
    const c = code();
    await lead.request("POST", "/api/v1/greases", { json: newGrease(c) });
    const again = await lead.request("POST", "/api/v1/greases", { json: newGrease(c) });
    expect(again.status).toBe(400);
    expect(again.body.error.fields.code[0]).toMatch(/already has this code/);
  });

  it.each(["abc", "0", "99999999", "1e3", "-1"])("GET /api/v1/greases/%s is a 404, never a 500", async (id) => {
    expect((await lead.request("GET", `/api/v1/greases/${id}`)).status).toBe(404);
  });

  it("exports the catalogue as CSV with formulas neutralised", async () => {
    await lead.request("POST", "/api/v1/greases", { json: { ...newGrease(code()), supplier: "=HYPERLINK(\"http://x\")" } });
    const response = await auditor.request("GET", "/api/v1/greases/export");
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toMatch(/text\/csv/);
    expect(response.headers.get("content-disposition")).toMatch(/attachment/);
    expect(response.text).toContain("code,name,supplier,thickener");
    expect(response.text).toContain(`"'=HYPERLINK(""http://x"")"`);
  });
});

describe("data sheet uploads", () => {
  const pdf = Buffer.from("%PDF-1.4\n1 0 obj<</Type/Catalog>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n");
  const png = Buffer.from("89504e470d0a1a0a0000000d4948445200000001000000010806000000", "hex");
  const uploadCount = () => {
    try {
      return readdirSync(process.env.UPLOAD_DIR!).length;
    } catch {
      return 0;
    }
  };

  async function upload(client: Client, greaseId: number, file: Buffer, name: string, kind = "sds", type = "application/pdf") {
    const form = new FormData();
    form.set("kind", kind);
    form.set("file", new Blob([new Uint8Array(file)], { type }), name);
    const response = await fetch(new URL(`/api/v1/greases/${greaseId}/documents`, client.base), {
      method: "POST",
      body: form,
      headers: { origin: new URL(client.base).origin, cookie: [...client.cookies].map(([k, v]) => `${k}=${v}`).join("; ") },
    });
    return { status: response.status, body: (await response.json()) as any };
  }

  it("refuses a renamed non-PDF with 415 and stores nothing", async () => {
    const grease = (await lead.request("POST", "/api/v1/greases", { json: newGrease(code()) })).body;
    const rowsBefore = await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM stored_document");
    const filesBefore = uploadCount();
    const response = await upload(lead, grease.id, png, "safety-sheet.pdf");
    expect(response.status).toBe(415);
    expect(response.body.error.fields.file[0]).toMatch(/not a PDF/);
    expect((await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM stored_document"))[0]!.n).toBe(rowsBefore[0]!.n);
    expect(uploadCount()).toBe(filesBefore);
  });

  it("refuses an oversize file with 413, a technician with 403, a bad kind with 400", async () => {
    const grease = (await lead.request("POST", "/api/v1/greases", { json: newGrease(code()) })).body;
    const big = Buffer.concat([pdf, Buffer.alloc(10 * 1024 * 1024 + 10, 32)]);
    expect((await upload(lead, grease.id, big, "big.pdf")).status).toBe(413);
    expect((await upload(tech, grease.id, pdf, "x.pdf")).status).toBe(403);
    const badKind = await upload(lead, grease.id, pdf, "x.pdf", "photo");
    expect(badKind.status).toBe(400);
    expect(badKind.body.error.fields.kind).toBeDefined();
  });

  it("stores a real PDF under a generated name and serves it as an attachment", async () => {
    const grease = (await lead.request("POST", "/api/v1/greases", { json: newGrease(code()) })).body;
    const response = await upload(lead, grease.id, pdf, "Sicherheitsdatenblatt ü.pdf");
    expect(response.status).toBe(201);
    const [row] = await rootQuery<{ stored_name: string; original_name: string }>("SELECT stored_name, original_name FROM stored_document WHERE id = ?", [response.body.documentId]);
    expect(row!.stored_name).toMatch(/^[0-9a-f-]{36}$/);
    expect(row!.original_name).toBe("Sicherheitsdatenblatt ü.pdf");
    const download = await fetch(new URL(`/api/v1/greases/${grease.id}/documents/sds`, tech.base), {
      headers: { cookie: [...tech.cookies].map(([k, v]) => `${k}=${v}`).join("; ") },
    });
    expect(download.status).toBe(200);
    expect(download.headers.get("content-type")).toBe("application/pdf");
    expect(download.headers.get("content-disposition")).toMatch(/^attachment;/);
    expect(download.headers.get("x-content-type-options")).toBe("nosniff");
    expect(Buffer.from(await download.arrayBuffer()).equals(pdf)).toBe(true);
  });
});
