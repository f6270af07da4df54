import "server-only";
import { randomBytes } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import { expiryDate, isBelowReorderPoint, orderQuantity, pickLots, reorderPoint, weeklyDemand } from "@/lib/domain/inventory";
import { tagCodeFrom } from "@/lib/domain/service";
import type { IssueInput, ReceiptInput } from "@/lib/validation/stock";
import { getSequelize } from "../db";
import { ConflictError, ValidationError } from "../errors";
import { idempotent, type StoredAnswer } from "../idempotency";
import { log } from "../log";
import { enqueueMail } from "../mail/outbox";
import { siteLeadEmails, userSiteIds } from "./users";

const dateOnly = (d: Date) => d.toISOString().slice(0, 10);
const toDate = (v: string | Date | null | undefined) => (v ? new Date(typeof v === "string" ? `${v.slice(0, 10)}T00:00:00Z` : v) : null);

async function resolveLocation(userId: string, code: string | undefined, transaction: Transaction): Promise<{ id: number; siteId: number; code: string }> {
  const sites = await userSiteIds(userId, transaction);
  if (!sites.length) throw new ValidationError({ location: ["You have no site; ask an administrator for access."] });
  const rows = await getSequelize().query<{ id: number; site_id: number; code: string }>(
    `SELECT id, site_id, code FROM storage_location WHERE site_id IN (:sites) ${code ? "AND code = :code" : ""} ORDER BY site_id, id LIMIT 1`,
    { replacements: { sites, code: code ?? null }, type: QueryTypes.SELECT, transaction },
  );
  const row = rows[0];
  if (!row) throw new ValidationError({ location: [code ? "No such storage location on your sites." : "Your sites have no storage location yet."] });
  return { id: Number(row.id), siteId: Number(row.site_id), code: row.code };
}

async function packOf(greaseId: number, packId: number, transaction: Transaction) {
  const [row] = await getSequelize().query<{ net_mass_grams: number; kind: string; name: string; code: string; shelf_life_months: number | null; supplier_email: string | null; lead_time_days: number | null }>(
    `SELECT p.net_mass_grams, p.kind, g.name, g.code, g.shelf_life_months, s.contact_email AS supplier_email, s.lead_time_days
     FROM grease_pack p JOIN grease g ON g.id = p.grease_id JOIN supplier s ON s.id = g.supplier_id WHERE p.id = ? AND p.grease_id = ?`,
    { replacements: [packId, greaseId], type: QueryTypes.SELECT, transaction },
  );
  if (!row) throw new ValidationError({ packId: ["This pack does not belong to this grease."] });
  return { grams: Number(row.net_mass_grams), kind: row.kind, name: row.name, code: row.code, shelfLifeMonths: row.shelf_life_months === null ? null : Number(row.shelf_life_months), supplierEmail: row.supplier_email, leadTimeDays: row.lead_time_days === null ? 14 : Number(row.lead_time_days) };
}

/** Grams on hand of a grease at a site, over all packs and locations. */
async function onHandGrams(siteId: number, greaseId: number, transaction: Transaction): Promise<number> {
  const [row] = await getSequelize().query<{ grams: string | null }>(
    "SELECT SUM(l.on_hand * p.net_mass_grams) AS grams FROM stock_lot l JOIN grease_pack p ON p.id = l.pack_id WHERE l.site_id = ? AND l.grease_id = ?",
    { replacements: [siteId, greaseId], type: QueryTypes.SELECT, transaction },
  );
  return Number(row?.grams ?? 0);
}

/**
 * A grease's reorder point at a site: the lead's fixed value when set, else demand during the supplier's lead
 * time plus safety stock, with the demand forecast from the lube points that use the grease.
 */
export async function reorderPointGrams(siteId: number, greaseId: number, leadTimeDays: number, now: Date, transaction?: Transaction): Promise<{ grams: number; gramsPerWeek: number }> {
  const sequelize = getSequelize();
  const [policy] = await sequelize.query<{ reorder_point_grams: string | null; safety_stock_weeks: string | null }>(
    "SELECT reorder_point_grams, safety_stock_weeks FROM stock_policy WHERE site_id = ? AND grease_id = ?",
    { replacements: [siteId, greaseId], type: QueryTypes.SELECT, transaction },
  );
  const points = await sequelize.query<{ quantity_grams: string | null; interval_hours: string | null; running_hours_per_day: string; sealed_for_life: number }>(
    "SELECT quantity_grams, interval_hours, running_hours_per_day, sealed_for_life FROM lube_point WHERE site_id = ? AND assigned_grease_id = ?",
    { replacements: [siteId, greaseId], type: QueryTypes.SELECT, transaction },
  );
  const demand = weeklyDemand(
    points.map((p) => ({ greaseId, quantityGrams: Number(p.quantity_grams ?? 0), intervalHours: Number(p.interval_hours ?? 0), runningHoursPerDay: Number(p.running_hours_per_day), sealedForLife: Boolean(p.sealed_for_life) })),
    [],
    { from: now },
  ).get(greaseId);
  const gramsPerWeek = demand?.gramsPerWeek ?? 0;
  if (policy?.reorder_point_grams !== null && policy?.reorder_point_grams !== undefined) return { grams: Number(policy.reorder_point_grams), gramsPerWeek };
  const rp = reorderPoint({ gramsPerWeek, leadTimeDays, safetyStockWeeks: policy?.safety_stock_weeks ? Number(policy.safety_stock_weeks) : undefined });
  return { grams: rp.reorderPointGrams, gramsPerWeek };
}


/**
 * After a movement: when the grease has fallen below its reorder point and no low-stock episode is open,
 * open one, create a purchase request and put one mail in the outbox, all in the caller's transaction; when it
 * is back above, close the episode. One alert per episode, however often stock bounces below.
 */
async function checkLowStock(siteId: number, greaseId: number, packId: number, userId: string, now: Date, transaction: Transaction): Promise<void> {
  const sequelize = getSequelize();
  const pack = await packOf(greaseId, packId, transaction);
  const { grams: rpGrams, gramsPerWeek } = await reorderPointGrams(siteId, greaseId, pack.leadTimeDays, now, transaction);
  const grams = await onHandGrams(siteId, greaseId, transaction);
  const openKey = `${siteId}:${greaseId}`;
  const low = isBelowReorderPoint(grams, rpGrams);
  if (!low) {
    await sequelize.query("UPDATE low_stock_episode SET ended_at = ?, open_key = NULL WHERE open_key = ?", { replacements: [now, openKey], transaction });
    return;
  }
  const [open] = await sequelize.query<{ id: number }>("SELECT id FROM low_stock_episode WHERE open_key = ? FOR UPDATE", { replacements: [openKey], type: QueryTypes.SELECT, transaction });
  if (open) return;
  const [episodeId] = await sequelize.query("INSERT INTO low_stock_episode (site_id, grease_id, started_at, open_key) VALUES (?, ?, ?, ?)", {
    replacements: [siteId, greaseId, now, openKey],
    type: QueryTypes.INSERT,
    transaction,
  });
  const [onOrder] = await sequelize.query<{ grams: string | null }>(
    "SELECT SUM(r.packs * p.net_mass_grams) AS grams FROM purchase_request r JOIN grease_pack p ON p.id = r.pack_id WHERE r.site_id = ? AND r.grease_id = ? AND r.state IN ('requested','ordered')",
    { replacements: [siteId, greaseId], type: QueryTypes.SELECT, transaction },
  );
  const order = orderQuantity({ onHandGrams: grams, onOrderGrams: Number(onOrder?.grams ?? 0), reorderPointGrams: rpGrams, gramsPerWeek, packGrams: pack.grams });
  const packs = Math.max(1, order.packs);
  const [requestId] = await sequelize.query(
    "INSERT INTO purchase_request (site_id, grease_id, pack_id, packs, state, episode_id, note, created_by, created_at) VALUES (?, ?, ?, ?, 'requested', ?, ?, ?, ?)",
    { replacements: [siteId, greaseId, packId, packs, episodeId, "Raised by the reorder check", userId, now], type: QueryTypes.INSERT, transaction },
  );
  const to = [...(await siteLeadEmails(siteId, transaction)), ...(pack.supplierEmail ? [pack.supplierEmail] : [])];
  if (to.length) {
    await enqueueMail(
      {
        to,
        subject: `Reorder ${pack.name}: stock below its reorder point`,
        text: [
          `${pack.name} (${pack.code}) is down to ${Math.round(grams / 10) / 100} kg, below its reorder point of ${Math.round(rpGrams / 10) / 100} kg.`,
          `Forecast use from the lubrication schedule: ${Math.round(gramsPerWeek)} g a week. Supplier lead time: ${pack.leadTimeDays} days.`,
          `Suggested order: ${packs} × ${pack.kind} of ${pack.grams} g (purchase request ${requestId}).`,
        ].join("\n"),
        dedupeKey: `low-stock:${episodeId}`,
      },
      transaction,
      now,
    );
  }
  log("info", "low_stock_alert", { siteId, greaseId, episodeId, requestId });
}

/** Receives containers into a lot (FEFO dates set from the label or the shelf life) and records the movement. */
export async function receiveStock(input: ReceiptInput, userId: string, key: string | null, now = new Date()): Promise<StoredAnswer> {
  return idempotent({ userId, key, scope: "stock:receipt", body: input }, async (transaction) => {
    const sequelize = getSequelize();
    const location = await resolveLocation(userId, input.location, transaction);
    const pack = await packOf(input.greaseId, input.packId, transaction);
    const expiry = expiryDate({ manufacturedOn: toDate(input.manufacturedOn), labelExpiresOn: toDate(input.expiresOn), shelfLifeMonths: pack.shelfLifeMonths, receivedOn: now });
    const [lotId] = await sequelize.query(
      `INSERT INTO stock_lot (site_id, grease_id, pack_id, location_id, lot_number, label_code, manufactured_on, expires_on, expiry_source, received_on, on_hand, created_at, updated_at)
       VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      {
        replacements: [location.siteId, input.greaseId, input.packId, location.id, input.lotNumber, tagCodeFrom(randomBytes(8)), input.manufacturedOn ?? null, expiry.expiresOn ? dateOnly(expiry.expiresOn) : null, expiry.source, dateOnly(now), input.quantity, now, now],
        type: QueryTypes.INSERT,
        transaction,
      },
    );
    await sequelize.query("INSERT INTO stock_movement (site_id, lot_id, kind, quantity, user_id, idempotency_key, created_at) VALUES (?, ?, 'receipt', ?, ?, ?, ?)", {
      replacements: [location.siteId, lotId, input.quantity, userId, key, now],
      transaction,
    });
    if (input.purchaseRequestId) {
      await sequelize.query("UPDATE purchase_request SET state = 'received', received_at = ? WHERE id = ? AND site_id = ? AND state IN ('requested','ordered')", {
        replacements: [now, input.purchaseRequestId, location.siteId],
        transaction,
      });
    } else {
      await sequelize.query(
        "UPDATE purchase_request SET state = 'received', received_at = ? WHERE site_id = ? AND grease_id = ? AND pack_id = ? AND state IN ('requested','ordered') ORDER BY id LIMIT 1",
        { replacements: [now, location.siteId, input.greaseId, input.packId], transaction },
      );
    }
    await checkLowStock(location.siteId, input.greaseId, input.packId, userId, now, transaction);
    const [lot] = await sequelize.query<{ label_code: string }>("SELECT label_code FROM stock_lot WHERE id = ?", { replacements: [lotId], type: QueryTypes.SELECT, transaction });
    log("info", "stock_received", { lotId, quantity: input.quantity, by: userId });
    return {
      status: 201,
      body: { lot: { id: Number(lotId), labelCode: lot!.label_code, lotNumber: input.lotNumber, quantity: input.quantity, location: location.code, expiresOn: expiry.expiresOn ? dateOnly(expiry.expiresOn) : null, expirySource: expiry.source } },
    };
  });
}

/**
 * Issues containers, earliest expiry first. The lots are locked in a fixed order (the picking order) and each is
 * decremented with a conditional UPDATE; not enough stock → 409 insufficient_stock and nothing changes.
 */
export async function issueStock(input: IssueInput, userId: string, key: string | null, now = new Date()): Promise<StoredAnswer> {
  return idempotent({ userId, key, scope: "stock:issue", body: input }, async (transaction) => {
    const sequelize = getSequelize();
    const location = input.location ? await resolveLocation(userId, input.location, transaction) : null;
    const sites = location ? [location.siteId] : await userSiteIds(userId, transaction);
    if (!sites.length) throw new ValidationError({ location: ["You have no site; ask an administrator for access."] });
    const lots = await sequelize.query<{ id: number; site_id: number; on_hand: number; expires_on: string | Date | null; received_on: string | Date }>(
      `SELECT id, site_id, on_hand, expires_on, received_on FROM stock_lot
       WHERE site_id IN (:sites) AND grease_id = :grease AND pack_id = :pack ${location ? "AND location_id = :location" : ""} AND on_hand > 0
       ORDER BY expires_on IS NULL, expires_on, received_on, id FOR UPDATE`,
      { replacements: { sites, grease: input.greaseId, pack: input.packId, location: location?.id ?? null }, type: QueryTypes.SELECT, transaction },
    );
    const siteId = location?.siteId ?? (lots[0] ? Number(lots[0].site_id) : sites[0]!);
    const candidates = lots.filter((l) => Number(l.site_id) === siteId);
    // pickLots is unit-agnostic: here it counts containers of one pack, not grams.
    const picked = pickLots(
      candidates.map((l) => ({ lotId: Number(l.id), onHandGrams: Number(l.on_hand), expiresOn: toDate(l.expires_on), receivedOn: toDate(l.received_on)! })),
      input.quantity,
      now,
    );
    if (picked.shortGrams > 0) throw new ConflictError("insufficient_stock", `Only ${input.quantity - picked.shortGrams} usable container(s) of this grease and pack are in stock.`);
    let pointId: number | null = null;
    if (input.pointTag) {
      const [point] = await sequelize.query<{ id: number }>("SELECT id FROM lube_point WHERE tag_code = ? AND site_id = ?", { replacements: [input.pointTag, siteId], type: QueryTypes.SELECT, transaction });
      pointId = point ? Number(point.id) : null;
    }
    for (const pick of picked.picks) {
      const [, affected] = await sequelize.query("UPDATE stock_lot SET on_hand = on_hand - ?, updated_at = ? WHERE id = ? AND on_hand >= ?", {
        replacements: [pick.grams, now, pick.lotId, pick.grams],
        type: QueryTypes.UPDATE,
        transaction,
      });
      if (!affected) throw new ConflictError("insufficient_stock", "The stock changed while issuing; try again.");
      await sequelize.query("INSERT INTO stock_movement (site_id, lot_id, kind, quantity, point_id, user_id, idempotency_key, created_at) VALUES (?, ?, 'issue', ?, ?, ?, ?, ?)", {
        replacements: [siteId, pick.lotId, -pick.grams, pointId, userId, key, now],
        transaction,
      });
    }
    await checkLowStock(siteId, input.greaseId, input.packId, userId, now, transaction);
    log("info", "stock_issued", { greaseId: input.greaseId, quantity: input.quantity, lots: picked.picks.map((p) => p.lotId), by: userId });
    return { status: 201, body: { issued: picked.picks.map((p) => ({ lotId: p.lotId, quantity: p.grams })), quantity: input.quantity } };
  });
}

export interface StockItem {
  greaseId: number;
  grease: string;
  packId: number;
  pack: string;
  location: string;
  onHand: number;
  onHandGrams: number;
  reorderPoint: number;
  reorderPointGrams: number;
  low: boolean;
}

/** Containers on hand per grease, pack and location on the caller's sites, with each grease's reorder point. */
export async function listStock(userId: string, now = new Date()): Promise<StockItem[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const sequelize = getSequelize();
  const rows = await sequelize.query<{ site_id: number; grease_id: number; grease: string; pack_id: number; kind: string; grams: number; location: string; on_hand: string; lead: number | null }>(
    `SELECT l.site_id, l.grease_id, g.name AS grease, l.pack_id, p.kind, p.net_mass_grams AS grams, sl.code AS location, SUM(l.on_hand) AS on_hand, s.lead_time_days AS lead
     FROM stock_lot l JOIN grease g ON g.id = l.grease_id JOIN grease_pack p ON p.id = l.pack_id JOIN storage_location sl ON sl.id = l.location_id
     JOIN supplier s ON s.id = g.supplier_id WHERE l.site_id IN (:sites)
     GROUP BY l.site_id, l.grease_id, g.name, l.pack_id, p.kind, p.net_mass_grams, sl.code, s.lead_time_days ORDER BY g.name, sl.code`,
    { replacements: { sites }, type: QueryTypes.SELECT },
  );
  const cache = new Map<string, Promise<{ rp: number; total: number }>>();
  const gather = (siteId: number, greaseId: number, lead: number) => {
    const k = `${siteId}:${greaseId}`;
    if (!cache.has(k)) {
      cache.set(
        k,
        sequelize.transaction(async (t) => ({ rp: (await reorderPointGrams(siteId, greaseId, lead, now, t)).grams, total: await onHandGrams(siteId, greaseId, t) })),
      );
    }
    return cache.get(k)!;
  };
  const out: StockItem[] = [];
  for (const r of rows) {
    const { rp, total } = await gather(Number(r.site_id), Number(r.grease_id), r.lead === null ? 14 : Number(r.lead));
    out.push({
      greaseId: Number(r.grease_id),
      grease: r.grease,
      packId: Number(r.pack_id),
      pack: `${r.kind} ${r.grams} g`,
      location: r.location,
      onHand: Number(r.on_hand),
      onHandGrams: Number(r.on_hand) * Number(r.grams),
      reorderPoint: Math.ceil(rp / Number(r.grams)),
      reorderPointGrams: Math.round(rp),
      low: isBelowReorderPoint(total, rp),
    });
  }
  return out;
}

export interface PurchaseRequestItem {
  id: number;
  grease: string;
  pack: string;
  packs: number;
  state: string;
  createdAt: string;
  site: string;
}

export async function listPurchaseRequests(userId: string): Promise<PurchaseRequestItem[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const rows = await getSequelize().query<{ id: number; grease: string; kind: string; grams: number; packs: number; state: string; created_at: Date; site: string }>(
    `SELECT r.id, g.name AS grease, p.kind, p.net_mass_grams AS grams, r.packs, r.state, r.created_at, s.name AS site FROM purchase_request r
     JOIN grease g ON g.id = r.grease_id JOIN grease_pack p ON p.id = r.pack_id JOIN site s ON s.id = r.site_id
     WHERE r.site_id IN (:sites) ORDER BY FIELD(r.state, 'requested', 'ordered', 'received', 'cancelled'), r.created_at DESC LIMIT 100`,
    { replacements: { sites }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ id: Number(r.id), grease: r.grease, pack: `${r.kind} ${r.grams} g`, packs: Number(r.packs), state: r.state, createdAt: new Date(r.created_at).toISOString(), site: r.site }));
}
