import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { Client, rootQuery } from "./helpers";

const lead = new Client();
const clerk = new Client();
let greaseId: number;
let packId: number;

beforeAll(async () => {
  await lead.signIn("lead@example.com");
  await clerk.signIn("clerk@example.com");
  const created = await lead.request("POST", "/api/v1/greases", {
    json: { code: `STK-${Date.now().toString(36)}`, name: "Stock race grease", supplier: "Integration Oils", thickener: "lithium_complex", baseOilType: "mineral", viscosity40: 100, nlgiGrade: "2", packs: [{ kind: "cartridge", netMassGrams: 400 }] },
  });
  greaseId = created.body.id;
  packId = created.body.packs[0].id;
});

const receive = (quantity: number, extra: Record<string, unknown> = {}) =>
  clerk.request("POST", "/api/v1/stock/receipts", { json: { greaseId, packId, quantity, lotNumber: `L-${quantity}-${Math.random()}`, expiresOn: "2028-06-30", ...extra } });
const issue = (quantity: number, key?: string) =>
  clerk.request("POST", "/api/v1/stock/issues", { json: { greaseId, packId, quantity }, headers: key ? { "idempotency-key": key } : {} });
const onHand = async () => Number((await rootQuery<{ n: string | null }>("SELECT SUM(on_hand) AS n FROM stock_lot WHERE grease_id = ?", [greaseId]))[0]!.n ?? 0);
const ledger = async () => Number((await rootQuery<{ n: string | null }>("SELECT SUM(m.quantity) AS n FROM stock_movement m JOIN stock_lot l ON l.id = m.lot_id WHERE l.grease_id = ?", [greaseId]))[0]!.n ?? 0);

describe("stock receipts and issues (reliability.md §B.1, I1)", () => {
  it("50 concurrent issues of 1 against 10 on hand: exactly 10 succeed, 40 get 409, stock 0, ledger = stock", async () => {
    expect((await receive(10)).status).toBe(201);
    const answers = await Promise.all(Array.from({ length: 50 }, () => issue(1)));
    const ok = answers.filter((a) => a.status === 201).length;
    expect(answers.map((a) => a.status).filter((s) => s !== 201 && s !== 409)).toEqual([]);
    const refused = answers.filter((a) => a.status === 409);
    expect(ok).toBe(10);
    expect(refused).toHaveLength(40);
    expect(refused.every((a) => a.body.error.code === "insufficient_stock")).toBe(true);
    expect(await onHand()).toBe(0);
    expect(await ledger()).toBe(await onHand());
    expect(Number((await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM stock_lot WHERE on_hand < 0"))[0]!.n)).toBe(0);
  });

  it("the same Idempotency-Key sent 20 times at once makes one movement", async () => {
    expect((await receive(5)).status).toBe(201);
    const before = await onHand();
    const key = randomUUID();
    const answers = await Promise.all(Array.from({ length: 20 }, () => issue(2, key)));
    expect(answers.every((a) => a.status === 201 || (a.status === 409 && a.body.error.code === "idempotency_in_flight"))).toBe(true);
    expect(await onHand()).toBe(before - 2);
    expect(Number((await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM stock_movement WHERE idempotency_key = ?", [key]))[0]!.n)).toBe(1);
    const again = await issue(2, key);
    expect(again.status).toBe(201);
    expect(await onHand()).toBe(before - 2);
    expect((await clerk.request("POST", "/api/v1/stock/issues", { json: { greaseId, packId, quantity: 3 }, headers: { "idempotency-key": key } })).status).toBe(422);
  });

  it("issues the lot that expires first", async () => {
    const late = await receive(1, { expiresOn: "2030-01-01", lotNumber: "LATE" });
    const early = await receive(1, { expiresOn: "2027-03-01", lotNumber: "EARLY" });
    const answer = await issue(1);
    expect(answer.status).toBe(201);
    const issuedLot = answer.body.issued[0].lotId;
    expect(issuedLot).toBe(early.body.lot.id);
    expect(issuedLot).not.toBe(late.body.lot.id);
  });

  it("sets the expiry from the shelf life when the label gives none, and names bad fields", async () => {
    const lacking = await receive(1, { expiresOn: undefined, manufacturedOn: "2026-01-31" });
    expect(lacking.status).toBe(201);
    expect(lacking.body.lot.expirySource).toBe("unknown"); // this test grease has no shelf life
    const bad = await clerk.request("POST", "/api/v1/stock/receipts", { json: { greaseId, packId: 999999, quantity: 0, lotNumber: "", expiresOn: "31/12/2027" } });
    expect(bad.status).toBe(400);
    for (const f of ["quantity", "lotNumber", "expiresOn"]) expect(bad.body.error.fields).toHaveProperty([f]);
    const wrongPack = await clerk.request("POST", "/api/v1/stock/receipts", { json: { greaseId, packId: 999999, quantity: 1, lotNumber: "X" } });
    expect(wrongPack.status).toBe(400);
    expect(wrongPack.body.error.fields.packId).toBeDefined();
  });

  it("an auditor cannot receive or issue (403); everyone reads the stock list", async () => {
    const auditor = new Client();
    await auditor.signIn("auditor@example.com");
    expect((await auditor.request("POST", "/api/v1/stock/issues", { json: { greaseId, packId, quantity: 1 } })).status).toBe(403);
    const list = await auditor.request("GET", "/api/v1/stock");
    expect(list.status).toBe(200);
    for (const field of ["greaseId", "packId", "location", "onHand", "reorderPoint", "low"]) expect(list.body.items[0]).toHaveProperty(field);
  });
});
