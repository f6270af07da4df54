import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";
import { Client, rootQuery } from "./helpers";

// The storeroom's daily work against the demo database: labels, issue by label, returns, transfers, scrap,
// cycle counts, purchase requests, and a container scanned at a lube point.
const lead = new Client();
const clerk = new Client();
const tech = new Client();
let clerkId = "";
let leadId = "";
let moves: typeof import("@/lib/server/queries/stock-moves");
let greaseId = 0;
let packId = 0;

type Grease = { id: number; code: string; packs: { id: number; netMassGrams: number }[] };
const greases: Grease[] = [];

const userId = async (email: string) =>
  (await rootQuery<{ id: string }>("SELECT id FROM app_user WHERE email = ?", [email]))[0]!.id;
const labelOnHand = async (code: string) =>
  Number(
    (
      await rootQuery<{ n: string | null }>("SELECT SUM(on_hand) AS n FROM stock_lot WHERE label_code = ?", [
        code,
      ])
    )[0]!.n ?? 0,
  );
const labelLedger = async (code: string) =>
  Number(
    (
      await rootQuery<{ n: string | null }>(
        "SELECT SUM(m.quantity) AS n FROM stock_movement m JOIN stock_lot l ON l.id = m.lot_id WHERE l.label_code = ?",
        [code],
      )
    )[0]!.n ?? 0,
  );

async function receive(extra: Record<string, unknown> = {}, client = clerk) {
  const answer = await client.request("POST", "/api/v1/stock/receipts", {
    json: {
      greaseId,
      packId,
      quantity: 6,
      lotNumber: `W-${randomUUID().slice(0, 8)}`,
      expiresOn: "2029-05-31",
      location: "STORE",
      ...extra,
    },
  });
  expect(answer.status, JSON.stringify(answer.body)).toBe(201);
  return answer.body.lot as { id: number; labelCode: string; lotNumber: string };
}

beforeAll(async () => {
  await Promise.all([
    lead.signIn("lead@example.com"),
    clerk.signIn("clerk@example.com"),
    tech.signIn("tech@example.com"),
  ]);
  clerkId = await userId("clerk@example.com");
  leadId = await userId("lead@example.com");
  greases.push(...((await lead.request("GET", "/api/v1/greases")).body.items as Grease[]));
  // A grease of our own, so the demo's stock and reorder points do not move under these tests.
  const created = await lead.request("POST", "/api/v1/greases", {
    json: {
      code: `WRK-${Date.now().toString(36)}`,
      name: "Storeroom work grease",
      supplier: "Integration Oils",
      thickener: "calcium_sulfonate",
      baseOilType: "mineral",
      viscosity40: 220,
      nlgiGrade: "2",
      packs: [{ kind: "cartridge", netMassGrams: 400 }],
    },
  });
  greaseId = created.body.id;
  packId = created.body.packs[0].id;
  moves = await import("@/lib/server/queries/stock-moves");
});

describe("container labels", () => {
  it("a label answers with its grease, lot and locations; its QR code is an image; other sites and bad codes are 404", async () => {
    const lot = await receive();
    const label = await tech.request("GET", `/api/v1/stock/labels/${lot.labelCode}`);
    expect(label.status).toBe(200);
    expect(label.body).toMatchObject({
      labelCode: lot.labelCode,
      lotNumber: lot.lotNumber,
      grease: { id: greaseId },
      onHand: 6,
      expired: false,
    });
    expect(label.body.locations).toEqual([expect.objectContaining({ code: "STORE", onHand: 6 })]);
    const png = await tech.request("GET", `/api/v1/stock/labels/${lot.labelCode}/qr.png`);
    expect(png.status).toBe(200);
    expect(png.headers.get("content-type")).toBe("image/png");
    expect((await tech.request("GET", "/api/v1/stock/labels/not-a-code")).status).toBe(404);
    // The lead sees both sites; a Marlow Fen lot is invisible to the Kestrel Bay technician.
    const other = await receive({ location: "MFW/STORE" }, lead);
    expect((await lead.request("GET", `/api/v1/stock/labels/${other.labelCode}`)).status).toBe(200);
    expect((await tech.request("GET", `/api/v1/stock/labels/${other.labelCode}`)).status).toBe(404);
  });

  it("a bare location code that exists at two of the caller's sites is refused by name, not guessed", async () => {
    const answer = await lead.request("POST", "/api/v1/stock/receipts", {
      json: { greaseId, packId, quantity: 1, lotNumber: "AMB", location: "STORE" },
    });
    expect(answer.status).toBe(400);
    expect(answer.body.error.fields.location[0]).toMatch(
      /several of your sites.*KBC\/STORE|several of your sites.*\/STORE/,
    );
  });
});

describe("issuing", () => {
  it("issues from a scanned lot, warns when another lot expires sooner, and lists lots first-expiring first", async () => {
    const later = await receive({ expiresOn: "2030-12-31" });
    const sooner = await receive({ expiresOn: "2028-01-31" });
    const lots = await clerk.request("GET", `/api/v1/stock/lots?greaseId=${greaseId}&packId=${packId}`);
    expect(lots.status).toBe(200);
    const order = (lots.body.items as { labelCode: string; suggested: boolean; expiresOn: string }[]).map(
      (l) => l.expiresOn,
    );
    expect(order).toEqual([...order].sort());
    expect(lots.body.items.find((l: { suggested: boolean }) => l.suggested).labelCode).toBe(sooner.labelCode);

    const tech1 = await userId("tech@example.com");
    const answer = await clerk.request("POST", "/api/v1/stock/issues", {
      json: { greaseId, packId, quantity: 2, lotLabel: later.labelCode, issuedToUserId: tech1 },
    });
    expect(answer.status, JSON.stringify(answer.body)).toBe(201);
    expect(answer.body.issued).toEqual([
      expect.objectContaining({ labelCode: later.labelCode, quantity: 2 }),
    ]);
    expect(answer.body.warnings.join(" ")).toContain(sooner.lotNumber);
    expect(await labelOnHand(later.labelCode)).toBe(4);
    const [row] = await rootQuery<{ issued_to_user_id: string }>(
      "SELECT m.issued_to_user_id FROM stock_movement m JOIN stock_lot l ON l.id = m.lot_id WHERE l.label_code = ? AND m.kind = 'issue'",
      [later.labelCode],
    );
    expect(row!.issued_to_user_id).toBe(tech1);
  });

  it("never issues an expired lot, and names the field", async () => {
    const old = await receive({ expiresOn: "2025-01-31" });
    const answer = await clerk.request("POST", "/api/v1/stock/issues", {
      json: { greaseId, packId, quantity: 1, lotLabel: old.labelCode },
    });
    expect(answer.status).toBe(400);
    expect(answer.body.error.fields.lotLabel[0]).toMatch(/expired/);
    expect(await labelOnHand(old.labelCode)).toBe(6);
  });

  it("an issue naming its store reads store, lots and stock in one go, yet refuses a wrong store or pack by field and keeps nothing", async () => {
    const lot = await receive({ location: "KBC/STORE" });
    const key = randomUUID();
    const issue = (client: Client, json: Record<string, unknown>) =>
      client.request("POST", "/api/v1/stock/issues", {
        json: { greaseId, packId, quantity: 1, ...json },
        headers: { "idempotency-key": key },
      });
    const unknown = await issue(clerk, { location: "KBC/NOWHERE" });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields.location[0]).toMatch(/No storage location KBC\/NOWHERE/);
    // The lead has both sites, and both have a STORE: the bare code is refused, not guessed.
    const ambiguous = await issue(lead, { location: "STORE" });
    expect(ambiguous.status).toBe(400);
    expect(ambiguous.body.error.fields.location[0]).toMatch(/several of your sites/);
    const otherGrease = greases.find((g) => g.id !== greaseId && g.packs.length)!;
    const wrongPack = await issue(clerk, { packId: otherGrease.packs[0]!.id, location: "KBC/STORE" });
    expect(wrongPack.status).toBe(400);
    expect(wrongPack.body.error.fields.packId).toBeDefined();
    expect(await labelOnHand(lot.labelCode)).toBe(6);
    // Nothing was kept under the key: the same key then issues, once.
    const done = await issue(clerk, { location: "KBC/STORE" });
    expect(done.status, JSON.stringify(done.body)).toBe(201);
    expect(done.body.issued).toEqual([expect.objectContaining({ quantity: 1, location: "STORE" })]);
    expect((await issue(clerk, { location: "KBC/STORE" })).status).toBe(201);
    const total = await rootQuery<{ n: string }>(
      "SELECT COALESCE(SUM(m.quantity), 0) AS n FROM stock_movement m JOIN stock_lot l ON l.id = m.lot_id WHERE l.grease_id = ? AND m.kind = 'issue' AND m.idempotency_key = ?",
      [greaseId, key],
    );
    expect(Number(total[0]!.n)).toBe(-1);
  });
});

describe("returns, transfers, scrap and counts keep the ledger equal to the stock", () => {
  it("a transfer moves containers between locations, once per key, and the lot's total stays the same", async () => {
    const lot = await receive();
    const input = { labelCode: lot.labelCode, fromLocation: "STORE", toLocation: "KILN", quantity: 4 };
    const key = randomUUID();
    const answers = await Promise.allSettled(
      Array.from({ length: 5 }, () => moves.transferStock(input, clerkId, key)),
    );
    expect(answers.filter((a) => a.status === "fulfilled").length).toBeGreaterThanOrEqual(1);
    const rows = await rootQuery<{ code: string; on_hand: number }>(
      "SELECT sl.code, l.on_hand FROM stock_lot l JOIN storage_location sl ON sl.id = l.location_id WHERE l.label_code = ? ORDER BY sl.code",
      [lot.labelCode],
    );
    expect(rows.map((r) => [r.code, Number(r.on_hand)])).toEqual([
      ["KILN", 4],
      ["STORE", 2],
    ]);
    expect(await labelOnHand(lot.labelCode)).toBe(6);
    expect(await labelLedger(lot.labelCode)).toBe(6);
    await expect(moves.transferStock({ ...input, quantity: 3 }, clerkId, null)).rejects.toMatchObject({
      status: 409,
      code: "insufficient_stock",
    });
    await expect(
      moves.transferStock({ ...input, toLocation: "NOWHERE" }, clerkId, null),
    ).rejects.toMatchObject({ status: 400, fields: { toLocation: [expect.stringContaining("NOWHERE")] } });
  });

  it("a return cannot bring back more than went out", async () => {
    const lot = await receive();
    await expect(
      moves.returnStock({ labelCode: lot.labelCode, location: "STORE", quantity: 1 }, clerkId, null),
    ).rejects.toMatchObject({
      status: 400,
      fields: { quantity: [expect.stringMatching(/none can be returned/)] },
    });
    expect(
      (
        await clerk.request("POST", "/api/v1/stock/issues", {
          json: { greaseId, packId, quantity: 2, lotLabel: lot.labelCode },
        })
      ).status,
    ).toBe(201);
    await expect(
      moves.returnStock({ labelCode: lot.labelCode, location: "STORE", quantity: 3 }, clerkId, null),
    ).rejects.toMatchObject({ fields: { quantity: [expect.stringMatching(/At most 2/)] } });
    await moves.returnStock(
      { labelCode: lot.labelCode, location: "STORE", quantity: 1, reason: "Unopened" },
      clerkId,
      null,
    );
    expect(await labelOnHand(lot.labelCode)).toBe(5);
    expect(await labelLedger(lot.labelCode)).toBe(5);
  });

  it("scrap takes containers off with the reason; more than is there is refused", async () => {
    const lot = await receive();
    await expect(
      moves.scrapStock(
        { labelCode: lot.labelCode, location: "STORE", quantity: 7, reason: "Expired" },
        clerkId,
        null,
      ),
    ).rejects.toMatchObject({ status: 400, fields: { quantity: expect.any(Array) } });
    await moves.scrapStock(
      { labelCode: lot.labelCode, location: "STORE", quantity: 2, reason: "Crushed in transport" },
      clerkId,
      null,
    );
    expect(await labelOnHand(lot.labelCode)).toBe(4);
    const [row] = await rootQuery<{ reason: string; quantity: number }>(
      "SELECT m.reason, m.quantity FROM stock_movement m JOIN stock_lot l ON l.id = m.lot_id WHERE l.label_code = ? AND m.kind = 'scrap'",
      [lot.labelCode],
    );
    expect(row).toMatchObject({ reason: "Crushed in transport", quantity: -2 });
  });

  it("a count posts the variance with its reason; a lot that moved meanwhile refuses the whole count", async () => {
    const a = await receive();
    const b = await receive();
    const [rowA] = await rootQuery<{ id: number }>("SELECT id FROM stock_lot WHERE label_code = ?", [
      a.labelCode,
    ]);
    const [rowB] = await rootQuery<{ id: number }>("SELECT id FROM stock_lot WHERE label_code = ?", [
      b.labelCode,
    ]);
    const lines = [
      { lotId: Number(rowA!.id), expected: 6, counted: 5 },
      { lotId: Number(rowB!.id), expected: 6, counted: 6 },
    ];
    await expect(moves.postCount({ location: "STORE", lines }, clerkId, null)).rejects.toMatchObject({
      status: 400,
      fields: { reason: expect.any(Array) },
    });
    // Someone issues from lot b while the sheet is out: the count must not overwrite that.
    expect(
      (
        await clerk.request("POST", "/api/v1/stock/issues", {
          json: { greaseId, packId, quantity: 1, lotLabel: b.labelCode },
        })
      ).status,
    ).toBe(201);
    await expect(
      moves.postCount({ location: "STORE", lines, reason: "Found one short" }, clerkId, null),
    ).rejects.toMatchObject({ status: 409, code: "stale_count" });
    expect(await labelOnHand(a.labelCode)).toBe(6);
    const answer = await moves.postCount(
      {
        location: "STORE",
        lines: [lines[0]!, { ...lines[1]!, expected: 5, counted: 5 }],
        reason: "Found one short",
      },
      clerkId,
      null,
    );
    expect(answer.body).toMatchObject({ adjusted: 1, variance: -1 });
    expect(await labelOnHand(a.labelCode)).toBe(5);
    expect(await labelLedger(a.labelCode)).toBe(5);
  });

  it("after all of this no lot is negative and every lot row's ledger equals its stock (reliability.md §B.1, I3)", async () => {
    expect(
      Number((await rootQuery<{ n: number }>("SELECT COUNT(*) AS n FROM stock_lot WHERE on_hand < 0"))[0]!.n),
    ).toBe(0);
    const off = await rootQuery(
      "SELECT l.id, l.label_code, l.on_hand, m.s FROM stock_lot l LEFT JOIN (SELECT lot_id, SUM(quantity) AS s FROM stock_movement GROUP BY lot_id) m ON m.lot_id = l.id WHERE COALESCE(m.s, 0) <> l.on_hand",
    );
    expect([...off]).toEqual([]);
  });
});

describe("purchase requests", () => {
  it("requested → ordered → received by the receipt that names it; a second move of the same step is a conflict", async () => {
    const [kbc] = await rootQuery<{ id: number }>("SELECT id FROM site WHERE code = 'KBC'");
    const now = new Date();
    await rootQuery(
      "INSERT INTO purchase_request (site_id, grease_id, pack_id, packs, state, created_by, created_at) VALUES (?, ?, ?, 10, 'requested', ?, ?)",
      [kbc!.id, greaseId, packId, leadId, now],
    );
    const [request] = await rootQuery<{ id: number }>(
      "SELECT id FROM purchase_request WHERE grease_id = ? ORDER BY id DESC LIMIT 1",
      [greaseId],
    );
    const id = Number(request!.id);
    await moves.updatePurchaseRequest({ id, state: "ordered", reference: "PO-77120" }, leadId);
    await expect(moves.updatePurchaseRequest({ id, state: "ordered" }, leadId)).rejects.toMatchObject({
      status: 409,
    });
    const wrong = await clerk.request("POST", "/api/v1/stock/receipts", {
      json: {
        greaseId: greases[0]!.id,
        packId: greases[0]!.packs[0]!.id,
        quantity: 1,
        lotNumber: "X",
        location: "STORE",
        purchaseRequestId: id,
      },
    });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.purchaseRequestId).toBeDefined();
    const lot = await receive({ purchaseRequestId: id, quantity: 10 });
    expect(lot).toMatchObject({ purchaseRequestId: id });
    const [after] = await rootQuery<{ state: string; reference: string }>(
      "SELECT state, reference FROM purchase_request WHERE id = ?",
      [id],
    );
    expect(after).toMatchObject({ state: "received", reference: "PO-77120" });
    await expect(moves.updatePurchaseRequest({ id, state: "cancelled" }, leadId)).rejects.toMatchObject({
      status: 409,
    });
  });
});

describe("a container scanned at a lube point", () => {
  type Point = {
    tag: string;
    sealedForLife: boolean;
    foodGradeRequired: boolean;
    changeover: unknown;
    currentGrease: { id: number; code: string } | null;
  };
  async function pointHolding(code: string): Promise<Point> {
    const list = (await tech.request("GET", "/api/v1/points")).body.items as { tag: string }[];
    for (const item of list) {
      const point = (await tech.request("GET", `/api/v1/points/${item.tag}`)).body as Point;
      if (
        point.currentGrease?.code === code &&
        !point.sealedForLife &&
        !point.foodGradeRequired &&
        !point.changeover
      )
        return point;
    }
    throw new Error(`no point holding ${code}`);
  }

  it("books one container of the lot out with the service; a refused mix books nothing", async () => {
    const point = await pointHolding("GL-EM2");
    const right = greases.find((g) => g.code === "GL-EM2")!;
    const wrong = greases.find((g) => g.code === "GL-LX2")!;
    const rightLot = (
      await clerk.request("POST", "/api/v1/stock/receipts", {
        json: {
          greaseId: right.id,
          packId: right.packs[0]!.id,
          quantity: 3,
          lotNumber: "SVC-1",
          location: "STORE",
        },
      })
    ).body.lot;
    const wrongLot = (
      await clerk.request("POST", "/api/v1/stock/receipts", {
        json: {
          greaseId: wrong.id,
          packId: wrong.packs[0]!.id,
          quantity: 3,
          lotNumber: "SVC-2",
          location: "STORE",
        },
      })
    ).body.lot;

    const refused = await tech.request("POST", `/api/v1/points/${point.tag}/services`, {
      json: { greaseId: wrong.id, grams: 8, containerLabel: wrongLot.labelCode, takeContainer: true },
      headers: { "idempotency-key": randomUUID() },
    });
    expect(refused.status).toBe(409);
    expect(await labelOnHand(wrongLot.labelCode)).toBe(3);

    const mismatch = await tech.request("POST", `/api/v1/points/${point.tag}/services`, {
      json: { greaseId: right.id, grams: 8, containerLabel: wrongLot.labelCode },
    });
    expect(mismatch.status).toBe(400);
    expect(mismatch.body.error.fields.containerLabel).toBeDefined();

    const key = randomUUID();
    const body = { greaseId: right.id, grams: 8, containerLabel: rightLot.labelCode, takeContainer: true };
    const done = await tech.request("POST", `/api/v1/points/${point.tag}/services`, {
      json: body,
      headers: { "idempotency-key": key },
    });
    expect(done.status, JSON.stringify(done.body)).toBe(201);
    expect(done.body.service.lot).toMatchObject({ lotNumber: "SVC-1", bookedOut: true });
    const again = await tech.request("POST", `/api/v1/points/${point.tag}/services`, {
      json: body,
      headers: { "idempotency-key": key },
    });
    expect(again.status).toBe(201);
    expect(await labelOnHand(rightLot.labelCode)).toBe(2);
    const [service] = await rootQuery<{ lot_id: number | null }>(
      "SELECT lot_id FROM service_record WHERE id = ?",
      [done.body.service.id],
    );
    expect(service!.lot_id).not.toBeNull();
    const [movement] = await rootQuery<{ point_id: number | null; kind: string }>(
      "SELECT m.point_id, m.kind FROM stock_movement m JOIN stock_lot l ON l.id = m.lot_id WHERE l.label_code = ? AND m.kind = 'issue'",
      [rightLot.labelCode],
    );
    expect(movement!.point_id).not.toBeNull();
  });
});
