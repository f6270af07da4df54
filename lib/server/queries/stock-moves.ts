import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import type { CountInput, ReturnInput, ScrapInput, TransferInput } from "@/lib/validation/stock";
import { appendAudit } from "../audit";
import { getSequelize } from "../db";
import { ConflictError, NotFoundError, ValidationError } from "../errors";
import { idempotent, type StoredAnswer } from "../idempotency";
import { log } from "../log";
import { checkLowStock, lotRowsOfLabel, resolveLocation } from "./stock";
import { userSiteIds } from "./users";

/** The rows of a label on the caller's sites, locked in id order; a label nobody can see is a field error. */
async function labelRows(labelCode: string, userId: string, transaction: Transaction) {
  const rows = await lotRowsOfLabel(labelCode, await userSiteIds(userId, transaction), transaction, true);
  if (!rows.length)
    throw new ValidationError({ labelCode: [`No container with label ${labelCode} on your sites.`] });
  return rows;
}

/** Puts containers of a label's lot at a location: into its row there, or into a new row copied from another. */
async function addToLocation(
  sourceLotId: number,
  locationId: number,
  quantity: number,
  now: Date,
  transaction: Transaction,
): Promise<number> {
  const sequelize = getSequelize();
  const [source] = await sequelize.query<Record<string, unknown>>(
    `SELECT site_id, grease_id, pack_id, lot_number, label_code, manufactured_on, expires_on, expiry_source, received_on, delivery_document_id, purchase_request_id
     FROM stock_lot WHERE id = ?`,
    { replacements: [sourceLotId], type: QueryTypes.SELECT, transaction },
  );
  const s = source!;
  await sequelize.query(
    `INSERT INTO stock_lot (site_id, grease_id, pack_id, location_id, lot_number, label_code, manufactured_on, expires_on, expiry_source, received_on,
       delivery_document_id, purchase_request_id, on_hand, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)
     ON DUPLICATE KEY UPDATE on_hand = on_hand + VALUES(on_hand), updated_at = VALUES(updated_at)`,
    {
      replacements: [
        s.site_id,
        s.grease_id,
        s.pack_id,
        locationId,
        s.lot_number,
        s.label_code,
        s.manufactured_on,
        s.expires_on,
        s.expiry_source,
        s.received_on,
        s.delivery_document_id,
        s.purchase_request_id,
        quantity,
        now,
        now,
      ],
      transaction,
    },
  );
  const [row] = await sequelize.query<{ id: number }>(
    "SELECT id FROM stock_lot WHERE label_code = ? AND location_id = ?",
    {
      replacements: [s.label_code, locationId],
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return Number(row!.id);
}

async function ledger(
  row: { siteId: number; lotId: number },
  kind: "return" | "transfer_in" | "transfer_out" | "count_adjustment" | "scrap",
  quantity: number,
  extra: { userId: string; key: string | null; reason?: string | null; otherLocationId?: number | null },
  now: Date,
  transaction: Transaction,
) {
  await getSequelize().query(
    `INSERT INTO stock_movement (site_id, lot_id, kind, quantity, reason, other_location_id, user_id, idempotency_key, created_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    {
      replacements: [
        row.siteId,
        row.lotId,
        kind,
        quantity,
        extra.reason ?? null,
        extra.otherLocationId ?? null,
        extra.userId,
        extra.key,
        now,
      ],
      transaction,
    },
  );
}

async function decrement(
  lot: { id: number; on_hand: number; lot_number: string; location: string },
  quantity: number,
  now: Date,
  transaction: Transaction,
) {
  const [, affected] = await getSequelize().query(
    "UPDATE stock_lot SET on_hand = on_hand - ?, updated_at = ? WHERE id = ? AND on_hand >= ?",
    {
      replacements: [quantity, now, lot.id, quantity],
      type: QueryTypes.UPDATE,
      transaction,
    },
  );
  if (!affected)
    throw new ConflictError(
      "insufficient_stock",
      `Only ${Number(lot.on_hand)} container(s) of lot ${lot.lot_number} are at ${lot.location}.`,
    );
}

/**
 * Unused containers come back to the store. At most what was issued of the lot and not yet returned can come
 * back, so a return cannot make stock out of nothing.
 */
export async function returnStock(
  input: ReturnInput,
  userId: string,
  key: string | null,
  now = new Date(),
): Promise<StoredAnswer> {
  return idempotent({ userId, key, scope: "stock:return", body: input }, async (transaction) => {
    const rows = await labelRows(input.labelCode, userId, transaction);
    const first = rows[0]!;
    const location = await resolveLocation(userId, input.location, transaction, Number(first.site_id));
    const [out] = await getSequelize().query<{ issued: string | null }>(
      "SELECT -SUM(m.quantity) AS issued FROM stock_movement m JOIN stock_lot l ON l.id = m.lot_id WHERE l.label_code = ? AND m.kind IN ('issue','return')",
      { replacements: [input.labelCode], type: QueryTypes.SELECT, transaction },
    );
    const returnable = Math.max(0, Number(out?.issued ?? 0));
    if (input.quantity > returnable) {
      throw new ValidationError({
        quantity: [
          returnable
            ? `At most ${returnable} container(s) of lot ${first.lot_number} are out to be returned.`
            : `No container of lot ${first.lot_number} has been issued, so none can be returned.`,
        ],
      });
    }
    const lotId = await addToLocation(Number(first.id), location.id, input.quantity, now, transaction);
    await ledger(
      { siteId: location.siteId, lotId },
      "return",
      input.quantity,
      { userId, key, reason: input.reason ?? null },
      now,
      transaction,
    );
    await checkLowStock(
      location.siteId,
      Number(first.grease_id),
      Number(first.pack_id),
      userId,
      now,
      transaction,
    );
    log("info", "stock_returned", { lotId, quantity: input.quantity, by: userId });
    await appendAudit({ event: "stock.returned", actorId: userId, siteId: location.siteId, subjectType: "lot", subjectId: input.labelCode, payload: { quantity: input.quantity, location: location.code, reason: input.reason ?? null } }, transaction, now);
    return {
      status: 201,
      body: { lotId, labelCode: input.labelCode, quantity: input.quantity, location: location.code },
    };
  });
}

/** Moves containers of one lot between two locations of its site: two ledger rows, stock unchanged in total. */
export async function transferStock(
  input: TransferInput,
  userId: string,
  key: string | null,
  now = new Date(),
): Promise<StoredAnswer> {
  return idempotent({ userId, key, scope: "stock:transfer", body: input }, async (transaction) => {
    const rows = await labelRows(input.labelCode, userId, transaction);
    const siteId = Number(rows[0]!.site_id);
    const from = await resolveLocation(userId, input.fromLocation, transaction, siteId, "fromLocation");
    const to = await resolveLocation(userId, input.toLocation, transaction, siteId, "toLocation");
    if (from.id === to.id)
      throw new ValidationError({
        toLocation: ["Choose another location than the one the containers are in."],
      });
    const source = rows.find((r) => Number(r.location_id) === from.id);
    if (!source)
      throw new ValidationError({
        fromLocation: [`Lot ${rows[0]!.lot_number} has no containers at ${from.code}.`],
      });
    await decrement(source, input.quantity, now, transaction);
    await ledger(
      { siteId, lotId: Number(source.id) },
      "transfer_out",
      -input.quantity,
      { userId, key, otherLocationId: to.id },
      now,
      transaction,
    );
    const target = await addToLocation(Number(source.id), to.id, input.quantity, now, transaction);
    await ledger(
      { siteId, lotId: target },
      "transfer_in",
      input.quantity,
      { userId, key, otherLocationId: from.id },
      now,
      transaction,
    );
    log("info", "stock_transferred", { from: source.id, to: target, quantity: input.quantity, by: userId });
    await appendAudit({ event: "stock.transferred", actorId: userId, siteId, subjectType: "lot", subjectId: input.labelCode, payload: { quantity: input.quantity, from: from.code, to: to.code } }, transaction, now);
    return {
      status: 201,
      body: { labelCode: input.labelCode, quantity: input.quantity, from: from.code, to: to.code },
    };
  });
}

/** Scraps containers (expired, damaged, contaminated) with the reason; the reorder check runs as after an issue. */
export async function scrapStock(
  input: ScrapInput,
  userId: string,
  key: string | null,
  now = new Date(),
): Promise<StoredAnswer> {
  return idempotent({ userId, key, scope: "stock:scrap", body: input }, async (transaction) => {
    const rows = await labelRows(input.labelCode, userId, transaction);
    const siteId = Number(rows[0]!.site_id);
    const location = await resolveLocation(userId, input.location, transaction, siteId);
    const row = rows.find((r) => Number(r.location_id) === location.id);
    if (!row)
      throw new ValidationError({
        location: [`Lot ${rows[0]!.lot_number} has no containers at ${location.code}.`],
      });
    if (input.quantity > Number(row.on_hand))
      throw new ValidationError({
        quantity: [
          `Only ${Number(row.on_hand)} container(s) of lot ${row.lot_number} are at ${location.code}.`,
        ],
      });
    await decrement(row, input.quantity, now, transaction);
    await ledger(
      { siteId, lotId: Number(row.id) },
      "scrap",
      -input.quantity,
      { userId, key, reason: input.reason },
      now,
      transaction,
    );
    await checkLowStock(siteId, Number(row.grease_id), Number(row.pack_id), userId, now, transaction);
    log("info", "stock_scrapped", { lotId: row.id, quantity: input.quantity, by: userId });
    await appendAudit({ event: "stock.scrapped", actorId: userId, siteId, subjectType: "lot", subjectId: input.labelCode, payload: { quantity: input.quantity, location: location.code, reason: input.reason } }, transaction, now);
    return {
      status: 201,
      body: { labelCode: input.labelCode, quantity: input.quantity, location: location.code },
    };
  });
}

/**
 * Posts a cycle count. Each line carries what the sheet showed; a lot that moved since (the stock is no longer
 * what was expected) is refused as a whole, so a count never overwrites a movement it did not see. A variance
 * needs a reason and becomes one count-adjustment row per lot.
 */
export async function postCount(
  input: CountInput,
  userId: string,
  key: string | null,
  now = new Date(),
): Promise<StoredAnswer> {
  return idempotent({ userId, key, scope: "stock:count", body: input }, async (transaction) => {
    const sequelize = getSequelize();
    const location = await resolveLocation(userId, input.location, transaction);
    const variances = input.lines.filter((l) => l.counted !== l.expected);
    if (variances.length && !input.reason)
      throw new ValidationError({
        reason: [
          "Give the reason for the difference (e.g. found on the wrong shelf, damaged, not booked out).",
        ],
      });
    const ids = [...new Set(input.lines.map((l) => l.lotId))].sort((a, b) => a - b);
    const rows = await sequelize.query<{
      id: number;
      on_hand: number;
      lot_number: string;
      grease_id: number;
      pack_id: number;
      location_id: number;
    }>(
      "SELECT id, on_hand, lot_number, grease_id, pack_id, location_id FROM stock_lot WHERE id IN (:ids) ORDER BY id FOR UPDATE",
      { replacements: { ids }, type: QueryTypes.SELECT, transaction },
    );
    const byId = new Map(rows.map((r) => [Number(r.id), r]));
    const fields: Record<string, string[]> = {};
    input.lines.forEach((line, i) => {
      const row = byId.get(line.lotId);
      if (!row || Number(row.location_id) !== location.id)
        fields[`lines.${i}.lotId`] = ["This lot is not at the location counted."];
      else if (Number(row.on_hand) !== line.expected)
        fields[`lines.${i}.counted`] = [
          `Lot ${row.lot_number} changed while you counted: the books now say ${Number(row.on_hand)}, not ${line.expected}. Count it again.`,
        ];
    });
    if (Object.keys(fields).length) {
      if (Object.keys(fields).some((k) => k.endsWith(".counted")))
        throw new ConflictError("stale_count", Object.values(fields).flat().join(" "));
      throw new ValidationError(fields);
    }
    const touched = new Map<string, { greaseId: number; packId: number }>();
    for (const line of variances) {
      const row = byId.get(line.lotId)!;
      const [, affected] = await sequelize.query(
        "UPDATE stock_lot SET on_hand = ?, updated_at = ? WHERE id = ? AND on_hand = ?",
        {
          replacements: [line.counted, now, line.lotId, line.expected],
          type: QueryTypes.UPDATE,
          transaction,
        },
      );
      if (!affected)
        throw new ConflictError(
          "stale_count",
          `Lot ${row.lot_number} changed while you counted. Count it again.`,
        );
      await ledger(
        { siteId: location.siteId, lotId: line.lotId },
        "count_adjustment",
        line.counted - line.expected,
        { userId, key, reason: input.reason ?? null },
        now,
        transaction,
      );
      touched.set(`${row.grease_id}:${row.pack_id}`, {
        greaseId: Number(row.grease_id),
        packId: Number(row.pack_id),
      });
    }
    for (const t of touched.values())
      await checkLowStock(location.siteId, t.greaseId, t.packId, userId, now, transaction);
    log("info", "stock_counted", {
      location: location.id,
      lines: input.lines.length,
      adjusted: variances.length,
      by: userId,
    });
    await appendAudit(
      {
        event: "stock.counted",
        actorId: userId,
        siteId: location.siteId,
        subjectType: "location",
        subjectId: location.code,
        payload: { lines: input.lines.length, adjustments: variances.map((l) => ({ lotId: l.lotId, from: l.expected, to: l.counted })), reason: input.reason ?? null },
      },
      transaction,
      now,
    );
    return {
      status: 201,
      body: {
        location: location.code,
        counted: input.lines.length,
        adjusted: variances.length,
        variance: variances.reduce((n, l) => n + l.counted - l.expected, 0),
      },
    };
  });
}

/** The lead moves a purchase request on: requested → ordered (with the order reference), or cancels it. */
export async function updatePurchaseRequest(
  input: { id: number; state: "ordered" | "cancelled"; reference?: string },
  userId: string,
  now = new Date(),
): Promise<void> {
  const sequelize = getSequelize();
  await sequelize.transaction(async (transaction) => {
    const sites = await userSiteIds(userId, transaction);
    const [row] = await sequelize.query<{ state: string; site_id: number }>(
      "SELECT state, site_id FROM purchase_request WHERE id = :id AND site_id IN (:sites) FOR UPDATE",
      { replacements: { id: input.id, sites: sites.length ? sites : [0] }, type: QueryTypes.SELECT, transaction },
    );
    if (!row) throw new NotFoundError("No such purchase request on your sites.");
    const from = input.state === "ordered" ? ["requested"] : ["requested", "ordered"];
    if (!from.includes(row.state)) throw new ConflictError("stale_state", `This request is already ${row.state}; reload the page.`);
    await sequelize.query(
      `UPDATE purchase_request SET state = :state, ordered_at = IF(:state = 'ordered', :now, ordered_at), cancelled_at = IF(:state = 'cancelled', :now, cancelled_at),
         reference = COALESCE(:reference, reference) WHERE id = :id`,
      { replacements: { state: input.state, now, reference: input.reference ?? null, id: input.id }, transaction },
    );
    log("info", "purchase_request_updated", { id: input.id, state: input.state, by: userId });
    await appendAudit(
      { event: `purchase_request.${input.state}`, actorId: userId, siteId: Number(row.site_id), subjectType: "purchase_request", subjectId: input.id, payload: { from: row.state, reference: input.reference ?? null } },
      transaction,
      now,
    );
  });
}

/** The lead's fixed reorder point or safety stock for one grease at one site (blank: back to the schedule). */
export async function setStockPolicy(
  input: { siteId: number; greaseId: number; reorderPointKg?: number; safetyStockWeeks?: number },
  userId: string,
  now = new Date(),
): Promise<void> {
  const sequelize = getSequelize();
  await sequelize.transaction(async (transaction) => {
    if (!(await userSiteIds(userId, transaction)).includes(input.siteId)) throw new ValidationError({ siteId: ["You have no access to this site."] });
    await sequelize.query(
      `INSERT INTO stock_policy (site_id, grease_id, reorder_point_grams, safety_stock_weeks, updated_at) VALUES (?, ?, ?, ?, ?)
       ON DUPLICATE KEY UPDATE reorder_point_grams = VALUES(reorder_point_grams), safety_stock_weeks = VALUES(safety_stock_weeks), updated_at = VALUES(updated_at)`,
      {
        replacements: [input.siteId, input.greaseId, input.reorderPointKg === undefined ? null : input.reorderPointKg * 1000, input.safetyStockWeeks ?? null, now],
        transaction,
      },
    );
    log("info", "stock_policy_set", { ...input, by: userId });
    await appendAudit(
      { event: "stock.reorder_settings_set", actorId: userId, siteId: input.siteId, subjectType: "grease", subjectId: input.greaseId, payload: { reorderPointKg: input.reorderPointKg ?? null, safetyStockWeeks: input.safetyStockWeeks ?? null } },
      transaction,
      now,
    );
  });
}
