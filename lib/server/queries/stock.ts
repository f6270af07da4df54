import "server-only";
import { randomBytes } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import {
  expiryDate,
  isBelowReorderPoint,
  isExpiredOn,
  orderQuantity,
  pickLots,
  reorderPoint,
  weeklyDemand,
  weeksOfCover,
} from "@/lib/domain/inventory";
import { tagCodeFrom } from "@/lib/domain/service";
import type { IssueLiveInput, ReceiptInput } from "@/lib/validation/stock";
import { appendAudit } from "../audit";
import { getSequelize } from "../db";
import { BatchCheckFailed, batchInTransaction, queryBlock, type BatchStatement } from "../batch";
import { ConflictError, ValidationError } from "../errors";
import { idempotent, type StoredAnswer } from "../idempotency";
import { log } from "../log";
import { removeStoredFile, storePdfFile } from "../uploads";
import { enqueueMail } from "../mail/outbox";
import { siteLeadEmails, userSiteIds } from "./users";

const dateOnly = (d: Date) => d.toISOString().slice(0, 10);
const toDate = (v: string | Date | null | undefined) =>
  v ? new Date(typeof v === "string" ? `${v.slice(0, 10)}T00:00:00Z` : v) : null;

/** "KBC/STORE" → ["KBC", "STORE"]; a bare "STORE" → [null, "STORE"]. */
export function splitLocation(raw: string | undefined): [string | null, string | undefined] {
  return raw?.includes("/") ? (raw.split("/", 2) as [string, string]) : [null, raw];
}

export interface ResolvedLocation {
  id: number;
  siteId: number;
  code: string;
  siteCode: string;
}

/**
 * A storage location on the caller's sites, by its code ("STORE") or its site-qualified code ("KBC/STORE");
 * without a code, the first location of the given site (or of the caller's first site). A bare code that
 * exists at several of the caller's sites is refused rather than guessed.
 */
export async function resolveLocation(
  userId: string,
  raw: string | undefined,
  transaction: Transaction,
  onlySiteId?: number,
  field = "location",
): Promise<ResolvedLocation> {
  const all = await userSiteIds(userId, transaction);
  const sites = onlySiteId === undefined ? all : all.filter((s) => s === onlySiteId);
  const [rows] = await queryBlock([locationStatement(sites, raw, field)], transaction);
  return locationFromRows(rows as LocationRow[], raw, field);
}

type LocationRow = { id: number; site_id: number; code: string; site_code: string };

/**
 * The read behind `resolveLocation`, for a caller that sends it with other statements; no sites is refused here.
 * `shared` reads it with a shared lock, which (unlike a plain read) takes no snapshot for the transaction.
 */
export function locationStatement(
  sites: number[],
  raw: string | undefined,
  field = "location",
  shared = false,
  intoVariables = false,
): BatchStatement {
  if (!sites.length)
    throw new ValidationError({ [field]: ["You have no access to this site; ask an administrator."] });
  const [siteCode, code] = splitLocation(raw);
  const columns = intoVariables
    ? `l.id, l.site_id INTO ${ISSUE_LOCATION}, ${ISSUE_SITE}`
    : "l.id, l.site_id, l.code, s.code AS site_code";
  return {
    sql: `SELECT ${columns} FROM storage_location l JOIN site s ON s.id = l.site_id
     WHERE l.site_id IN (?) ${code ? "AND l.code = ?" : ""} ${siteCode ? "AND s.code = ?" : ""} ORDER BY l.site_id, l.id ${code && !intoVariables ? "" : "LIMIT 1"} ${shared ? "LOCK IN SHARE MODE" : ""}`,
    params: [sites, ...(code ? [code] : []), ...(siteCode ? [siteCode] : [])],
  };
}

/**
 * The same read with a shared lock, its first row kept in `@issue_location` and `@issue_site` for the statements
 * that follow it in one compound statement (both are cleared first: user variables outlive the statement on a
 * pooled connection). No row leaves them NULL, which matches nothing.
 */
function locationIntoVariables(sites: number[], raw: string | undefined): BatchStatement[] {
  return [
    { sql: `SET ${ISSUE_LOCATION} = NULL, ${ISSUE_SITE} = NULL`, params: [] },
    locationStatement(sites, raw, "location", true, true),
  ];
}

/** The location `locationStatement` found, or the 400 naming the field. */
export function locationFromRows(rows: LocationRow[], raw: string | undefined, field = "location"): ResolvedLocation {
  const [, code] = splitLocation(raw);
  if (!rows.length)
    throw new ValidationError({
      [field]: [
        code
          ? `No storage location ${raw} on your sites.`
          : "Your site has no storage location yet; ask an administrator to add one.",
      ],
    });
  if (rows.length > 1)
    throw new ValidationError({
      [field]: [
        `${raw} exists at several of your sites; write it with the site, e.g. ${rows[0]!.site_code}/${rows[0]!.code}.`,
      ],
    });
  const row = rows[0]!;
  return { id: Number(row.id), siteId: Number(row.site_id), code: row.code, siteCode: row.site_code };
}

export async function packOf(greaseId: number, packId: number, transaction: Transaction) {
  const [row] = await getSequelize().query<{
    net_mass_grams: number;
    kind: string;
    name: string;
    code: string;
    shelf_life_months: number | null;
    supplier_email: string | null;
    lead_time_days: number | null;
  }>(
    `SELECT p.net_mass_grams, p.kind, g.name, g.code, g.shelf_life_months, s.contact_email AS supplier_email, s.lead_time_days
     FROM grease_pack p JOIN grease g ON g.id = p.grease_id JOIN supplier s ON s.id = g.supplier_id WHERE p.id = ? AND p.grease_id = ?`,
    { replacements: [packId, greaseId], type: QueryTypes.SELECT, transaction },
  );
  if (!row) throw new ValidationError({ packId: ["This pack does not belong to this grease."] });
  return {
    grams: Number(row.net_mass_grams),
    kind: row.kind,
    name: row.name,
    code: row.code,
    shelfLifeMonths: row.shelf_life_months === null ? null : Number(row.shelf_life_months),
    supplierEmail: row.supplier_email,
    leadTimeDays: row.lead_time_days === null ? 14 : Number(row.lead_time_days),
  };
}

/** Grams on hand of a grease at a site, over all packs and locations. */
async function onHandGrams(siteId: number, greaseId: number, transaction: Transaction): Promise<number> {
  const [row] = await getSequelize().query<{ grams: string | null }>(
    "SELECT SUM(l.on_hand * p.net_mass_grams) AS grams FROM stock_lot l JOIN grease_pack p ON p.id = l.pack_id WHERE l.site_id = ? AND l.grease_id = ?",
    { replacements: [siteId, greaseId], type: QueryTypes.SELECT, transaction },
  );
  return Number(row?.grams ?? 0);
}

type PolicyRow = { reorder_point_grams: string | null; safety_stock_weeks: string | null };
type DemandRow = {
  kind: "point" | "purge";
  quantity_grams: string | null;
  interval_hours: string | null;
  running_hours_per_day: string | null;
  sealed_for_life: number | null;
  remaining: number | null;
};

/**
 * A site in a statement: its id (sent as a value), or the user variable an earlier statement of the same compound
 * statement set (`locationIntoVariables`), so that statements which depend on a site read in the same round trip can go
 * with it.
 */
export type SiteRef = number | typeof ISSUE_SITE;
const ISSUE_SITE = "@issue_site" as const;
const ISSUE_LOCATION = "@issue_location" as const;
const siteSql = (site: SiteRef): [sql: string, params: unknown[]] => (site === ISSUE_SITE ? [ISSUE_SITE, []] : ["?", [site]]);

/**
 * What drives a grease's demand at a site, in one statement: the lube points it is assigned to, and the purges still
 * to come of changeovers to it. A changeover under way purges the new grease through its point at each remaining
 * planned service; each is counted at the point's planned quantity (common practice, no source: a purge often
 * takes more).
 */
function demandStatement(site: SiteRef, greaseId: number): BatchStatement {
  const [siteAt, siteParams] = siteSql(site);
  return {
    sql: `SELECT 'point' AS kind, quantity_grams, interval_hours, running_hours_per_day, sealed_for_life, NULL AS remaining
     FROM lube_point WHERE site_id = ${siteAt} AND assigned_grease_id = ?
     UNION ALL
     SELECT 'purge', p.quantity_grams, NULL, NULL, NULL, c.services_planned - c.services_done FROM changeover c JOIN lube_point p ON p.id = c.point_id
     WHERE p.site_id = ${siteAt} AND c.to_grease_id = ? AND c.state IN ('planned','in_progress') AND c.services_planned > c.services_done`,
    params: [...siteParams, greaseId, ...siteParams, greaseId],
  };
}

/** The reorder point from the policy row and the demand rows: the lead's fixed value, else lead-time demand plus safety stock. */
function reorderPointOf(
  greaseId: number,
  policy: PolicyRow | undefined,
  rows: DemandRow[],
  leadTimeDays: number,
  now: Date,
): { grams: number; gramsPerWeek: number } {
  const demand = weeklyDemand(
    rows
      .filter((r) => r.kind === "point")
      .map((p) => ({
        greaseId,
        quantityGrams: Number(p.quantity_grams ?? 0),
        intervalHours: Number(p.interval_hours ?? 0),
        runningHoursPerDay: Number(p.running_hours_per_day),
        sealedForLife: Boolean(p.sealed_for_life),
      })),
    rows
      .filter((r) => r.kind === "purge")
      .map((c) => ({ greaseId, grams: Number(c.remaining) * Number(c.quantity_grams ?? 0), on: now })),
    { from: now },
  ).get(greaseId);
  const gramsPerWeek = demand?.gramsPerWeek ?? 0;
  if (policy?.reorder_point_grams !== null && policy?.reorder_point_grams !== undefined)
    return { grams: Number(policy.reorder_point_grams), gramsPerWeek };
  const rp = reorderPoint({
    gramsPerWeek,
    leadTimeDays,
    safetyStockWeeks: policy?.safety_stock_weeks ? Number(policy.safety_stock_weeks) : undefined,
  });
  return { grams: rp.reorderPointGrams, gramsPerWeek };
}

/**
 * A grease's reorder point at a site: the lead's fixed value when set, else demand during the supplier's lead
 * time plus safety stock, with the demand forecast from the lube points that use the grease.
 */
export async function reorderPointGrams(
  siteId: number,
  greaseId: number,
  leadTimeDays: number,
  now: Date,
  transaction?: Transaction,
): Promise<{ grams: number; gramsPerWeek: number }> {
  const [policies, rows] = await queryBlock(
    [
      { sql: "SELECT reorder_point_grams, safety_stock_weeks FROM stock_policy WHERE site_id = ? AND grease_id = ?", params: [siteId, greaseId] },
      demandStatement(siteId, greaseId),
    ],
    transaction,
  );
  return reorderPointOf(greaseId, (policies as PolicyRow[])[0], rows as DemandRow[], leadTimeDays, now);
}

/** What the low-stock check needs about a grease at a site, read before or after a movement. */
export interface LowStockFacts {
  pack: { grams: number; kind: string; name: string; code: string; supplierEmail: string | null; leadTimeDays: number };
  reorderPointGrams: number;
  gramsPerWeek: number;
  onHandGrams: number;
  episodeOpen: boolean;
}

type FactsRow = {
  net_mass_grams: number;
  kind: string;
  name: string;
  code: string;
  supplier_email: string | null;
  lead_time_days: number | null;
  reorder_point_grams: string | null;
  safety_stock_weeks: string | null;
  on_hand_grams: string | null;
  open_episode_id: number | null;
};

/**
 * The two reads the low-stock check needs: pack, supplier, policy, grams on hand and whether an episode is open; then
 * the demand. Plain reads: inside a transaction they see its snapshot and its own changes. `lowStockFromRows` turns
 * their rows into the facts.
 */
export function lowStockStatements(site: SiteRef, greaseId: number, packId: number): BatchStatement[] {
  const [siteAt, siteParams] = siteSql(site);
  return [
    {
      sql: `SELECT p.net_mass_grams, p.kind, g.name, g.code, s.contact_email AS supplier_email, s.lead_time_days,
            sp.reorder_point_grams, sp.safety_stock_weeks,
            (SELECT SUM(l.on_hand * lp.net_mass_grams) FROM stock_lot l JOIN grease_pack lp ON lp.id = l.pack_id
             WHERE l.site_id = ${siteAt} AND l.grease_id = ?) AS on_hand_grams,
            (SELECT e.id FROM low_stock_episode e WHERE e.open_key = CONCAT(${siteAt}, ':', ?)) AS open_episode_id
     FROM grease_pack p JOIN grease g ON g.id = p.grease_id JOIN supplier s ON s.id = g.supplier_id
     LEFT JOIN stock_policy sp ON sp.site_id = ${siteAt} AND sp.grease_id = p.grease_id
     WHERE p.id = ? AND p.grease_id = ?`,
      params: [...siteParams, greaseId, ...siteParams, greaseId, ...siteParams, packId, greaseId],
    },
    demandStatement(site, greaseId),
  ];
}

export function lowStockFromRows(greaseId: number, factsRows: unknown[], demand: unknown[], now: Date): LowStockFacts {
  const facts = factsRows[0] as FactsRow | undefined;
  if (!facts) throw new ValidationError({ packId: ["This pack does not belong to this grease."] });
  const leadTimeDays = facts.lead_time_days === null ? 14 : Number(facts.lead_time_days);
  const rp = reorderPointOf(greaseId, facts, demand as DemandRow[], leadTimeDays, now);
  return {
    pack: {
      grams: Number(facts.net_mass_grams),
      kind: facts.kind,
      name: facts.name,
      code: facts.code,
      supplierEmail: facts.supplier_email,
      leadTimeDays,
    },
    reorderPointGrams: rp.grams,
    gramsPerWeek: rp.gramsPerWeek,
    onHandGrams: Number(facts.on_hand_grams ?? 0),
    episodeOpen: facts.open_episode_id !== null,
  };
}

/** Reads the low-stock facts (both statements in one round trip). */
export async function lowStockFacts(
  siteId: number,
  greaseId: number,
  packId: number,
  now: Date,
  transaction: Transaction,
): Promise<LowStockFacts> {
  const [facts, demand] = await queryBlock(lowStockStatements(siteId, greaseId, packId), transaction);
  return lowStockFromRows(greaseId, facts!, demand!, now);
}

/**
 * After a movement: when the grease has fallen below its reorder point and no low-stock episode is open,
 * open one, create a purchase request and put one mail in the outbox, all in the caller's transaction; when it
 * is back above, close the episode. One alert per episode, however often stock bounces below.
 */
export async function checkLowStock(
  siteId: number,
  greaseId: number,
  packId: number,
  userId: string,
  now: Date,
  transaction: Transaction,
): Promise<void> {
  const facts = await lowStockFacts(siteId, greaseId, packId, now, transaction);
  await settleLowStock(facts, siteId, greaseId, packId, userId, now, transaction);
}

/**
 * The writing half of the low-stock check, from facts read in the same transaction (`facts.onHandGrams` must already
 * count the movement): closes an open episode when stock is back above its reorder point, or opens one with its
 * purchase request and mail when it has fallen below.
 */
export async function settleLowStock(
  facts: LowStockFacts,
  siteId: number,
  greaseId: number,
  packId: number,
  userId: string,
  now: Date,
  transaction: Transaction,
): Promise<void> {
  const sequelize = getSequelize();
  const openKey = `${siteId}:${greaseId}`;
  const { pack, reorderPointGrams: rpGrams, gramsPerWeek, onHandGrams: grams } = facts;
  const low = isBelowReorderPoint(grams, rpGrams);
  if (!low) {
    if (facts.episodeOpen)
      await sequelize.query("UPDATE low_stock_episode SET ended_at = ?, open_key = NULL WHERE open_key = ?", {
        replacements: [now, openKey],
        transaction,
      });
    return;
  }
  const [open] = await sequelize.query<{ id: number }>(
    "SELECT id FROM low_stock_episode WHERE open_key = ? FOR UPDATE",
    { replacements: [openKey], type: QueryTypes.SELECT, transaction },
  );
  if (open) return;
  const [episodeId] = await sequelize.query(
    "INSERT INTO low_stock_episode (site_id, grease_id, started_at, open_key) VALUES (?, ?, ?, ?)",
    {
      replacements: [siteId, greaseId, now, openKey],
      type: QueryTypes.INSERT,
      transaction,
    },
  );
  const [onOrder] = await sequelize.query<{ grams: string | null }>(
    "SELECT SUM(r.packs * p.net_mass_grams) AS grams FROM purchase_request r JOIN grease_pack p ON p.id = r.pack_id WHERE r.site_id = ? AND r.grease_id = ? AND r.state IN ('requested','ordered')",
    { replacements: [siteId, greaseId], type: QueryTypes.SELECT, transaction },
  );
  const order = orderQuantity({
    onHandGrams: grams,
    onOrderGrams: Number(onOrder?.grams ?? 0),
    reorderPointGrams: rpGrams,
    gramsPerWeek,
    packGrams: pack.grams,
  });
  const packs = Math.max(1, order.packs);
  const [requestId] = await sequelize.query(
    "INSERT INTO purchase_request (site_id, grease_id, pack_id, packs, state, episode_id, note, created_by, created_at) VALUES (?, ?, ?, ?, 'requested', ?, ?, ?, ?)",
    {
      replacements: [siteId, greaseId, packId, packs, episodeId, "Raised by the reorder check", userId, now],
      type: QueryTypes.INSERT,
      transaction,
    },
  );
  const to = [
    ...(await siteLeadEmails(siteId, transaction)),
    ...(pack.supplierEmail ? [pack.supplierEmail] : []),
  ];
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

export interface ReceiptOptions {
  /** The delivery note as uploaded: checked and stored in the receipt's transaction (PDF only). */
  deliveryNote?: File | null;
}

/**
 * Receives containers into a new lot with its own label code (expiry from the label, else from the shelf life),
 * records the movement, closes the purchase request it answers, and re-checks the reorder point.
 */
export async function receiveStock(
  input: ReceiptInput,
  userId: string,
  key: string | null,
  now = new Date(),
  options: ReceiptOptions = {},
): Promise<StoredAnswer> {
  let storedPath: string | null = null;
  try {
    return await idempotent({ userId, key, scope: "stock:receipt", body: input }, async (transaction) => {
      storedPath = null;
      const document = options.deliveryNote
        ? await storePdfFile(options.deliveryNote, "deliveryNote", userId, transaction)
        : null;
      storedPath = document?.path ?? null;
      return receiveInTransaction(input, userId, key, now, document?.id ?? null, transaction);
    });
  } catch (error) {
    // The receipt rolled back: its delivery-note row went with it, so the file goes too.
    if (storedPath) await removeStoredFile(storedPath);
    throw error;
  }
}

async function receiveInTransaction(
  input: ReceiptInput,
  userId: string,
  key: string | null,
  now: Date,
  deliveryDocumentId: number | null,
  transaction: Transaction,
): Promise<StoredAnswer> {
  const sequelize = getSequelize();
  const location = await resolveLocation(userId, input.location, transaction);
  const pack = await packOf(input.greaseId, input.packId, transaction);
  let requestId: number | null = null;
  if (input.purchaseRequestId) {
    const [request] = await sequelize.query<{
      id: number;
      site_id: number;
      grease_id: number;
      pack_id: number;
      state: string;
    }>("SELECT id, site_id, grease_id, pack_id, state FROM purchase_request WHERE id = ? FOR UPDATE", {
      replacements: [input.purchaseRequestId],
      type: QueryTypes.SELECT,
      transaction,
    });
    if (!request || Number(request.site_id) !== location.siteId)
      throw new ValidationError({ purchaseRequestId: ["No such purchase request at this location's site."] });
    if (Number(request.grease_id) !== input.greaseId || Number(request.pack_id) !== input.packId) {
      throw new ValidationError({
        purchaseRequestId: ["This purchase request is for another grease or pack."],
      });
    }
    if (request.state !== "requested" && request.state !== "ordered")
      throw new ValidationError({
        purchaseRequestId: [`This purchase request is already ${request.state}.`],
      });
    requestId = Number(request.id);
  } else {
    const [open] = await sequelize.query<{ id: number }>(
      "SELECT id FROM purchase_request WHERE site_id = ? AND grease_id = ? AND pack_id = ? AND state IN ('requested','ordered') ORDER BY FIELD(state, 'ordered', 'requested'), id LIMIT 1 FOR UPDATE",
      { replacements: [location.siteId, input.greaseId, input.packId], type: QueryTypes.SELECT, transaction },
    );
    requestId = open ? Number(open.id) : null;
  }
  const expiry = expiryDate({
    manufacturedOn: toDate(input.manufacturedOn),
    labelExpiresOn: toDate(input.expiresOn),
    shelfLifeMonths: pack.shelfLifeMonths,
    receivedOn: now,
  });
  const labelCode = tagCodeFrom(randomBytes(8));
  const [lotId] = await sequelize.query(
    `INSERT INTO stock_lot (site_id, grease_id, pack_id, location_id, lot_number, label_code, manufactured_on, expires_on, expiry_source, received_on,
       delivery_document_id, purchase_request_id, on_hand, created_at, updated_at)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
    {
      replacements: [
        location.siteId,
        input.greaseId,
        input.packId,
        location.id,
        input.lotNumber,
        labelCode,
        input.manufacturedOn ?? null,
        expiry.expiresOn ? dateOnly(expiry.expiresOn) : null,
        expiry.source,
        dateOnly(now),
        deliveryDocumentId,
        requestId,
        input.quantity,
        now,
        now,
      ],
      type: QueryTypes.INSERT,
      transaction,
    },
  );
  await sequelize.query(
    "INSERT INTO stock_movement (site_id, lot_id, kind, quantity, reason, user_id, idempotency_key, created_at) VALUES (?, ?, 'receipt', ?, ?, ?, ?, ?)",
    {
      replacements: [
        location.siteId,
        lotId,
        input.quantity,
        requestId ? `Purchase request ${requestId}` : null,
        userId,
        key,
        now,
      ],
      transaction,
    },
  );
  if (requestId) {
    await sequelize.query(
      "UPDATE purchase_request SET state = 'received', received_at = ? WHERE id = ? AND state IN ('requested','ordered')",
      { replacements: [now, requestId], transaction },
    );
  }
  await checkLowStock(location.siteId, input.greaseId, input.packId, userId, now, transaction);
  log("info", "stock_received", {
    lotId,
    quantity: input.quantity,
    purchaseRequestId: requestId,
    by: userId,
  });
  await appendAudit(
    {
      event: "stock.received",
      actorId: userId,
      siteId: location.siteId,
      subjectType: "lot",
      subjectId: labelCode,
      payload: {
        lotNumber: input.lotNumber,
        greaseId: input.greaseId,
        packId: input.packId,
        quantity: input.quantity,
        location: location.code,
        purchaseRequestId: requestId,
        deliveryNote: deliveryDocumentId !== null,
      },
    },
    transaction,
    now,
  );
  return {
    status: 201,
    body: {
      lot: {
        id: Number(lotId),
        labelCode,
        lotNumber: input.lotNumber,
        quantity: input.quantity,
        location: location.code,
        expiresOn: expiry.expiresOn ? dateOnly(expiry.expiresOn) : null,
        expirySource: expiry.source,
        purchaseRequestId: requestId,
        deliveryNote: deliveryDocumentId !== null,
      },
    },
  };
}

interface LotRow {
  id: number;
  site_id: number;
  grease_id: number;
  pack_id: number;
  location_id: number;
  location: string;
  lot_number: string;
  label_code: string;
  on_hand: number;
  expires_on: string | Date | null;
  received_on: string | Date;
}

const LOT_ONLY_COLUMNS =
  "l.id, l.site_id, l.grease_id, l.pack_id, l.location_id, l.lot_number, l.label_code, l.on_hand, l.expires_on, l.received_on";

/**
 * The picking path's locking read: the lots of a grease and pack with containers on hand, at one location or
 * anywhere on the sites, in the order they are to be used. The lots alone are locked: joined to storage_location,
 * InnoDB locked the location's row too, so every issue from one store waited for the one before it, whatever the
 * grease. `ISSUE_SITE` means the store `locationIntoVariables` kept (its site and its location); sites given as values
 * mean anywhere on them.
 */
function lotsForUpdate(sites: number[] | typeof ISSUE_SITE, greaseId: number, packId: number): BatchStatement {
  const where =
    sites === ISSUE_SITE ? `l.site_id = ${ISSUE_SITE} AND l.location_id = ${ISSUE_LOCATION}` : "l.site_id IN (?)";
  return {
    sql: `SELECT ${LOT_ONLY_COLUMNS} FROM stock_lot l
         WHERE ${where} AND l.grease_id = ? AND l.pack_id = ? AND l.on_hand > 0
         ORDER BY l.expires_on IS NULL, l.expires_on, l.received_on, l.id FOR UPDATE`,
    params: [...(sites === ISSUE_SITE ? [] : [sites]), greaseId, packId],
  };
}

/**
 * The rows of one label (one row per location holding it) on the given sites, locked when asked, by id. Only the lot
 * rows are locked: the location codes come from a second, plain read in the same round trip (a locking read joined
 * to storage_location would lock the location's row too, and every issue from that store would wait on it).
 */
export async function lotRowsOfLabel(
  labelCode: string,
  sites: number[],
  transaction: Transaction,
  lock = false,
): Promise<LotRow[]> {
  if (!sites.length) return [];
  const [lots, places] = await queryBlock(
    [
      {
        sql: `SELECT ${LOT_ONLY_COLUMNS} FROM stock_lot l WHERE l.label_code = ? AND l.site_id IN (?) ORDER BY l.id ${lock ? "FOR UPDATE" : ""}`,
        params: [labelCode, sites],
      },
      {
        sql: "SELECT sl.id, sl.code FROM storage_location sl WHERE sl.id IN (SELECT l.location_id FROM stock_lot l WHERE l.label_code = ? AND l.site_id IN (?))",
        params: [labelCode, sites],
      },
    ],
    transaction,
  );
  const codes = new Map((places as { id: number; code: string }[]).map((r) => [Number(r.id), r.code]));
  return (lots as Omit<LotRow, "location">[]).map((l) => ({ ...l, location: codes.get(Number(l.location_id)) ?? "" }));
}

/** The engine's rule: a lot is expired from the start (UTC) of its expiry date. */
const lotExpired = (expiresOn: string | Date | null, now: Date) => isExpiredOn(toDate(expiresOn), now);

type TakeMovement = {
  kind: "issue" | "scrap" | "transfer_out";
  userId: string;
  key: string | null;
  pointId?: number | null;
  issuedTo?: string | null;
  otherLocationId?: number | null;
  reason?: string | null;
};

/**
 * The two writes that take `quantity` containers out of one lot row: a conditional UPDATE (which must change the row)
 * and the ledger row. Sent together (`lib/server/batch.ts`); `notEnough` is the 409 when the UPDATE changes nothing.
 */
function takeStatements(row: LotRow, quantity: number, movement: TakeMovement, now: Date): BatchStatement[] {
  return [
    {
      sql: "UPDATE stock_lot SET on_hand = on_hand - ?, updated_at = ? WHERE id = ? AND on_hand >= ?",
      params: [quantity, now, row.id, quantity],
      expectChanged: 1,
    },
    {
      sql: `INSERT INTO stock_movement (site_id, lot_id, kind, quantity, reason, point_id, issued_to_user_id, other_location_id, user_id, idempotency_key, created_at)
     VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      params: [
        row.site_id,
        row.id,
        movement.kind,
        -quantity,
        movement.reason ?? null,
        movement.pointId ?? null,
        movement.issuedTo ?? null,
        movement.otherLocationId ?? null,
        movement.userId,
        movement.key,
        now,
      ],
    },
  ];
}

const notEnough = (row: LotRow) =>
  new ConflictError(
    "insufficient_stock",
    `Only ${Number(row.on_hand)} container(s) of lot ${row.lot_number} are at ${row.location}.`,
  );

/** Takes `quantity` containers out of one lot row with a conditional UPDATE and writes the ledger row (one round trip). */
async function takeFromRow(
  row: LotRow,
  quantity: number,
  movement: TakeMovement,
  now: Date,
  transaction: Transaction,
): Promise<void> {
  try {
    await batchInTransaction(takeStatements(row, quantity, movement, now), transaction);
  } catch (error) {
    if (error instanceof BatchCheckFailed) throw notEnough(row);
    throw error;
  }
}

/** Whether a user may receive containers at a site (a technician or lead with access to it). */
async function assertRecipient(userId: string, siteId: number, transaction: Transaction): Promise<void> {
  const [row] = await getSequelize().query<{ id: string }>(
    `SELECT u.id FROM app_user u JOIN user_site_access a ON a.user_id = u.id WHERE u.id = ? AND a.site_id = ? AND u.status = 'active'`,
    { replacements: [userId, siteId], type: QueryTypes.SELECT, transaction },
  );
  if (!row)
    throw new ValidationError({ issuedToUserId: ["This person has no access to the site of this stock."] });
}

/**
 * Issues containers. By default the lots that expire first go first: they are locked in that fixed order and
 * each is decremented with a conditional UPDATE. With `lotLabel` (a scanned container label) the containers come
 * from that lot, with a warning when another lot expires sooner. Not enough stock → 409 insufficient_stock and
 * nothing changes; an expired lot is never issued.
 */
export async function issueStock(
  input: IssueLiveInput,
  userId: string,
  key: string | null,
  now = new Date(),
): Promise<StoredAnswer> {
  // Two round trips to the database when the store is named and the lots are picked (the usual issue): the START
  // TRANSACTION, the key row, the location read, the locking read of its lots and the low-stock facts as one
  // compound statement (`opening`); then the takes, the stored answer, the audit entry and the COMMIT, as one (see
  // `idempotent` and lib/server/batch.ts). A scanned label or no store named takes one round trip more.
  const ownSites = await userSiteIds(userId);
  const picksAtLocation = Boolean(input.location) && !input.lotLabel;
  // Shared-locked, so that the transaction's snapshot is taken only after the lots are locked (see below).
  const opening = input.location
    ? [
        locationStatement(ownSites, input.location, "location", true),
        // The picking path's reads, at the location the read above found (kept in user variables): the lots with
        // their lock first, so the block's first plain read (the facts) takes the snapshot after they are ours.
        ...(picksAtLocation
          ? [
              ...locationIntoVariables(ownSites, input.location),
              lotsForUpdate(ISSUE_SITE, input.greaseId, input.packId),
              ...lowStockStatements(ISSUE_SITE, input.greaseId, input.packId),
            ]
          : []),
      ]
    : [];
  return idempotent({ userId, key, scope: "stock:issue", body: input, pipelined: true, opening }, async (transaction, claimed, opened) => {
    const sequelize = getSequelize();
    const openedSets = input.location ? await opened : [];
    const location = input.location ? locationFromRows(openedSets[0] as LocationRow[], input.location) : null;
    const sites = location ? [location.siteId] : ownSites;
    if (!sites.length)
      throw new ValidationError({ location: ["You have no site; ask an administrator for access."] });
    // The low-stock facts, read after the lots are locked (see the picking path below and the read after it).
    let facts: LowStockFacts | null = null;
    let pointId: number | null = null;
    const warnings: string[] = [];
    let picks: { row: LotRow; quantity: number }[];

    if (input.lotLabel) {
      const rows = (await lotRowsOfLabel(input.lotLabel, sites, transaction, true)).filter(
        (r) => !location || Number(r.location_id) === location.id,
      );
      if (!rows.length)
        throw new ValidationError({
          lotLabel: [
            location
              ? `No container with label ${input.lotLabel} at ${location.code}.`
              : `No container with label ${input.lotLabel} on your sites.`,
          ],
        });
      const first = rows[0]!;
      if (Number(first.grease_id) !== input.greaseId || Number(first.pack_id) !== input.packId) {
        throw new ValidationError({
          lotLabel: [
            `Label ${input.lotLabel} is lot ${first.lot_number} of another grease or pack than the one chosen.`,
          ],
        });
      }
      if (lotExpired(first.expires_on, now)) {
        throw new ValidationError({
          lotLabel: [
            `Lot ${first.lot_number} expired on ${dateOnly(toDate(first.expires_on)!)}: do not issue it; have it tested or scrap it.`,
          ],
        });
      }
      const row = rows.find((r) => Number(r.on_hand) >= input.quantity);
      if (!row)
        throw new ConflictError(
          "insufficient_stock",
          `Only ${Math.max(...rows.map((r) => Number(r.on_hand)))} container(s) of lot ${first.lot_number} are in one place.`,
        );
      picks = [{ row, quantity: input.quantity }];
      const [earlier] = await sequelize.query<{
        lot_number: string;
        label_code: string;
        expires_on: string | Date;
        location: string;
      }>(
        `SELECT l.lot_number, l.label_code, l.expires_on, sl.code AS location FROM stock_lot l JOIN storage_location sl ON sl.id = l.location_id
         WHERE l.site_id = ? AND l.grease_id = ? AND l.pack_id = ? AND l.on_hand > 0 AND l.label_code <> ? AND l.expires_on IS NOT NULL
           AND l.expires_on > ? AND (? IS NULL OR l.expires_on < ?) ORDER BY l.expires_on LIMIT 1`,
        {
          replacements: [
            row.site_id,
            input.greaseId,
            input.packId,
            input.lotLabel,
            dateOnly(now),
            row.expires_on ?? null,
            row.expires_on ?? null,
          ],
          type: QueryTypes.SELECT,
          transaction,
        },
      );
      if (earlier)
        warnings.push(
          `Lot ${earlier.lot_number} (label ${earlier.label_code}, at ${earlier.location}) expires sooner, on ${dateOnly(toDate(earlier.expires_on)!)}: take that one first next time.`,
        );
    } else {
      // At a location, the lots and the facts came with the opening: the locking read went first, so the block's
      // first plain read (the facts) took the transaction's snapshot after the lots were ours, and the on-hand it
      // sums includes every issue of these lots that committed before (the location was read with a shared lock,
      // which takes no snapshot). With no store named, the lots (locked) and the store codes come here, and the
      // facts after them, below.
      const sets = location
        ? openedSets.slice(1)
        : await queryBlock(
            [
              lotsForUpdate(sites, input.greaseId, input.packId),
              { sql: "SELECT id, code FROM storage_location WHERE site_id IN (?)", params: [sites] },
            ],
            transaction,
          );
      const codes = location
        ? new Map([[location.id, location.code]])
        : new Map((sets[1] as { id: number; code: string }[]).map((r) => [Number(r.id), r.code]));
      if (location) facts = lowStockFromRows(input.greaseId, sets[1]!, sets[2]!, now);
      const lots = (sets[0] as Omit<LotRow, "location">[]).map((l) => ({ ...l, location: codes.get(Number(l.location_id)) ?? "" }));
      const siteId = location?.siteId ?? (lots[0] ? Number(lots[0].site_id) : sites[0]!);
      const candidates = lots.filter((l) => Number(l.site_id) === siteId);
      // pickLots is unit-agnostic: here it counts containers of one pack, not grams.
      const picked = pickLots(
        candidates.map((l) => ({
          lotId: Number(l.id),
          onHandGrams: Number(l.on_hand),
          expiresOn: toDate(l.expires_on),
          receivedOn: toDate(l.received_on)!,
        })),
        input.quantity,
        now,
      );
      if (picked.shortGrams > 0)
        throw new ConflictError(
          "insufficient_stock",
          `Only ${input.quantity - picked.shortGrams} usable container(s) of this grease and pack are in stock.`,
        );
      picks = picked.picks.map((p) => ({
        row: candidates.find((c) => Number(c.id) === p.lotId)!,
        quantity: p.grams,
      }));
    }

    const siteId = Number(picks[0]!.row.site_id);
    // Read after the lots are locked (a scanned label, or no location: the picking path above read them with the
    // lock when it could). The facts do not count this issue yet: its takes are sent last, with the stored answer
    // (WorkAnswer.writes), so the quantity is taken off below.
    facts ??= await lowStockFacts(siteId, input.greaseId, input.packId, now, transaction);
    // Nothing is written before the key row is known to be ours.
    await claimed;
    if (input.issuedToUserId) await assertRecipient(input.issuedToUserId, siteId, transaction);
    if (input.pointTag) {
      const [point] = await sequelize.query<{ id: number }>(
        "SELECT id FROM lube_point WHERE tag_code = ? AND site_id = ?",
        { replacements: [input.pointTag, siteId], type: QueryTypes.SELECT, transaction },
      );
      // A tag of another site (or none at all) is refused rather than dropped: the issue would lose its point.
      if (!point)
        throw new ValidationError({ pointTag: [`No lube point with tag ${input.pointTag} at the site these containers are at.`] });
      pointId = Number(point.id);
    }
    // The takes go out with the stored answer and the audit entry (WorkAnswer.writes): under the locks taken above
    // each conditional UPDATE changes its row, and if one did not the whole issue is refused with a 409.
    const writes = picks.flatMap((pick) =>
      takeStatements(pick.row, pick.quantity, { kind: "issue", userId, key, pointId, issuedTo: input.issuedToUserId ?? null }, now),
    );
    await settleLowStock(
      { ...facts, onHandGrams: facts.onHandGrams - input.quantity * facts.pack.grams },
      siteId,
      input.greaseId,
      input.packId,
      userId,
      now,
      transaction,
    );
    log("info", "stock_issued", {
      greaseId: input.greaseId,
      quantity: input.quantity,
      lots: picks.map((p) => p.row.id),
      by: userId,
      to: input.issuedToUserId ?? null,
    });
    const audit = {
      at: now,
      event: {
        event: "stock.issued",
        actorId: userId,
        siteId,
        subjectType: "grease",
        subjectId: input.greaseId,
        payload: {
          packId: input.packId,
          quantity: input.quantity,
          lots: picks.map((p) => ({ label: p.row.label_code, quantity: p.quantity })),
          issuedTo: input.issuedToUserId ?? null,
          pointId,
        },
      },
    };
    return {
      audit,
      writes,
      // `writes` holds takeStatements' two statements per pick, in pick order.
      onCheckFailed: (index) => notEnough(picks[Math.floor(index / 2)]!.row),
      status: 201,
      body: {
        issued: picks.map((p) => ({
          lotId: Number(p.row.id),
          quantity: p.quantity,
          lotNumber: p.row.lot_number,
          labelCode: p.row.label_code,
          location: p.row.location,
        })),
        quantity: input.quantity,
        warnings,
      },
    };
  });
}

/**
 * The container a technician scanned at a lube point: checks that it is of the grease being applied and not
 * expired, and when `take` is set books one container of it out of the store against the point, in the
 * service's transaction. Returns the lot row's id for the service record.
 */
export async function containerForService(
  input: { labelCode: string; siteId: number; greaseId: number; pointId: number; take: boolean },
  userId: string,
  key: string | null,
  now: Date,
  transaction: Transaction,
): Promise<{ lotId: number; lotNumber: string; took: boolean }> {
  const rows = await lotRowsOfLabel(input.labelCode, [input.siteId], transaction, input.take);
  const first = rows[0];
  if (!first)
    throw new ValidationError({
      containerLabel: [`No container with label ${input.labelCode} at this point's site.`],
    });
  if (Number(first.grease_id) !== input.greaseId)
    throw new ValidationError({
      containerLabel: [
        `Label ${input.labelCode} is lot ${first.lot_number} of another grease than the one chosen.`,
      ],
    });
  if (lotExpired(first.expires_on, now)) {
    throw new ValidationError({
      containerLabel: [
        `Lot ${first.lot_number} expired on ${dateOnly(toDate(first.expires_on)!)}: do not use it; take it back to the store.`,
      ],
    });
  }
  if (!input.take) return { lotId: Number(first.id), lotNumber: first.lot_number, took: false };
  const row = rows.find((r) => Number(r.on_hand) > 0);
  if (!row) {
    throw new ConflictError(
      "insufficient_stock",
      `No container of lot ${first.lot_number} is left in the store. If you already hold one, untick "book a new container out of the store".`,
    );
  }
  await takeFromRow(
    row,
    1,
    {
      kind: "issue",
      userId,
      key,
      pointId: input.pointId,
      issuedTo: userId,
      reason: "Taken at the lube point",
    },
    now,
    transaction,
  );
  await checkLowStock(input.siteId, input.greaseId, Number(row.pack_id), userId, now, transaction);
  return { lotId: Number(row.id), lotNumber: row.lot_number, took: true };
}

export interface StockItem {
  greaseId: number;
  grease: string;
  packId: number;
  pack: string;
  /** The site's short code, e.g. KBC. */
  site: string;
  location: string;
  onHand: number;
  onHandGrams: number;
  reorderPoint: number;
  reorderPointGrams: number;
  low: boolean;
  /** Weeks the grease's stock at the site lasts at the schedule's demand; null when nothing uses it. */
  weeksOfCover: number | null;
}

/** Containers on hand per grease, pack and location on the caller's sites, with each grease's reorder point. */
export async function listStock(userId: string, now = new Date()): Promise<StockItem[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const sequelize = getSequelize();
  const rows = await sequelize.query<{
    site_id: number;
    grease_id: number;
    grease: string;
    pack_id: number;
    kind: string;
    grams: number;
    location: string;
    site_code: string;
    on_hand: string;
    lead: number | null;
  }>(
    `SELECT l.site_id, si.code AS site_code, l.grease_id, g.name AS grease, l.pack_id, p.kind, p.net_mass_grams AS grams, sl.code AS location, SUM(l.on_hand) AS on_hand, s.lead_time_days AS lead
     FROM stock_lot l JOIN grease g ON g.id = l.grease_id JOIN grease_pack p ON p.id = l.pack_id JOIN storage_location sl ON sl.id = l.location_id
     JOIN supplier s ON s.id = g.supplier_id JOIN site si ON si.id = l.site_id WHERE l.site_id IN (:sites)
     GROUP BY l.site_id, si.code, l.grease_id, g.name, l.pack_id, p.kind, p.net_mass_grams, sl.code, s.lead_time_days ORDER BY g.name, si.code, sl.code`,
    { replacements: { sites }, type: QueryTypes.SELECT },
  );
  const cache = new Map<string, Promise<{ rp: number; total: number; perWeek: number }>>();
  const gather = (siteId: number, greaseId: number, lead: number) => {
    const k = `${siteId}:${greaseId}`;
    if (!cache.has(k)) {
      cache.set(
        k,
        sequelize.transaction(async (t) => {
          const point = await reorderPointGrams(siteId, greaseId, lead, now, t);
          return {
            rp: point.grams,
            perWeek: point.gramsPerWeek,
            total: await onHandGrams(siteId, greaseId, t),
          };
        }),
      );
    }
    return cache.get(k)!;
  };
  const out: StockItem[] = [];
  for (const r of rows) {
    const { rp, total, perWeek } = await gather(
      Number(r.site_id),
      Number(r.grease_id),
      r.lead === null ? 14 : Number(r.lead),
    );
    out.push({
      greaseId: Number(r.grease_id),
      grease: r.grease,
      packId: Number(r.pack_id),
      pack: `${r.kind} ${r.grams} g`,
      site: r.site_code,
      location: r.location,
      onHand: Number(r.on_hand),
      onHandGrams: Number(r.on_hand) * Number(r.grams),
      reorderPoint: Math.ceil(rp / Number(r.grams)),
      reorderPointGrams: Math.round(rp),
      low: isBelowReorderPoint(total, rp),
      weeksOfCover: weeksOfCover(total, perWeek),
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
  reference: string | null;
}

export async function listPurchaseRequests(userId: string): Promise<PurchaseRequestItem[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const rows = await getSequelize().query<{
    id: number;
    grease: string;
    kind: string;
    grams: number;
    packs: number;
    state: string;
    created_at: Date;
    site: string;
    reference: string | null;
  }>(
    `SELECT r.id, g.name AS grease, p.kind, p.net_mass_grams AS grams, r.packs, r.state, r.created_at, s.name AS site, r.reference FROM purchase_request r
     JOIN grease g ON g.id = r.grease_id JOIN grease_pack p ON p.id = r.pack_id JOIN site s ON s.id = r.site_id
     WHERE r.site_id IN (:sites) ORDER BY FIELD(r.state, 'requested', 'ordered', 'received', 'cancelled'), r.created_at DESC LIMIT 100`,
    { replacements: { sites }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: Number(r.id),
    grease: r.grease,
    pack: `${r.kind} ${r.grams} g`,
    packs: Number(r.packs),
    state: r.state,
    createdAt: new Date(r.created_at).toISOString(),
    site: r.site,
    reference: r.reference,
  }));
}
