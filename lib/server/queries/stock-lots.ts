import "server-only";
import { QueryTypes } from "sequelize";
import { isExpiredOn } from "@/lib/domain/inventory";
import { getSequelize } from "../db";
import { NotFoundError, ValidationError } from "../errors";
import { splitLocation } from "./stock";
import { userSiteIds } from "./users";

const day = (v: string | Date | null | undefined) =>
  v ? (typeof v === "string" ? v.slice(0, 10) : v.toISOString().slice(0, 10)) : null;
const expiredOn = (expiresOn: string | null, now: Date) =>
  isExpiredOn(expiresOn === null ? null : new Date(`${expiresOn}T00:00:00Z`), now);
const daysUntil = (expiresOn: string | null, now: Date) =>
  expiresOn === null
    ? null
    : Math.floor((new Date(`${expiresOn}T00:00:00Z`).getTime() - now.getTime()) / 86_400_000);

export interface LocationItem {
  id: number;
  code: string;
  /** "KBC/STORE": unambiguous when the caller has several sites. */
  qualifiedCode: string;
  name: string;
  siteId: number;
  site: string;
  lots: number;
  containers: number;
}

/** The storage locations of the caller's sites, with what stands in each. */
export async function listLocations(userId: string): Promise<LocationItem[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const rows = await getSequelize().query<{
    id: number;
    code: string;
    name: string;
    site_id: number;
    site_code: string;
    site: string;
    lots: number;
    containers: string | null;
  }>(
    `SELECT l.id, l.code, l.name, l.site_id, s.code AS site_code, s.name AS site, COUNT(k.id) AS lots, SUM(k.on_hand) AS containers
     FROM storage_location l JOIN site s ON s.id = l.site_id LEFT JOIN stock_lot k ON k.location_id = l.id AND k.on_hand > 0
     WHERE l.site_id IN (:sites) GROUP BY l.id, l.code, l.name, l.site_id, s.code, s.name ORDER BY s.name, l.code`,
    { replacements: { sites }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: Number(r.id),
    code: r.code,
    qualifiedCode: `${r.site_code}/${r.code}`,
    name: r.name,
    siteId: Number(r.site_id),
    site: r.site,
    lots: Number(r.lots),
    containers: Number(r.containers ?? 0),
  }));
}

export interface LotLabel {
  labelCode: string;
  lotNumber: string;
  grease: {
    id: number;
    code: string;
    name: string;
    foodGrade: string;
    thickener: string;
    baseOilType: string;
    nlgiGrade: string;
  };
  pack: { id: number; kind: string; netMassGrams: number };
  site: { id: number; code: string; name: string };
  manufacturedOn: string | null;
  expiresOn: string | null;
  expirySource: string;
  receivedOn: string;
  expired: boolean;
  daysToExpiry: number | null;
  onHand: number;
  locations: { code: string; qualifiedCode: string; name: string; onHand: number }[];
  deliveryDocumentId: number | null;
  purchaseRequestId: number | null;
  /** A lot of the same grease and pack that expires sooner and is in stock: the one to take first. */
  expiresSooner: { labelCode: string; lotNumber: string; expiresOn: string; location: string } | null;
}

/** What a container label stands for, on the caller's sites (404 otherwise). */
export async function getLotLabel(labelCode: string, userId: string, now = new Date()): Promise<LotLabel> {
  const sites = await userSiteIds(userId);
  if (!sites.length) throw new NotFoundError("No container with this label on your sites.");
  const sequelize = getSequelize();
  const rows = await sequelize.query<{
    site_id: number;
    site_code: string;
    site: string;
    grease_id: number;
    code: string;
    name: string;
    food_grade: string;
    thickener: string;
    base_oil_type: string;
    nlgi_grade: string;
    pack_id: number;
    kind: string;
    grams: number;
    lot_number: string;
    manufactured_on: string | Date | null;
    expires_on: string | Date | null;
    expiry_source: string;
    received_on: string | Date;
    on_hand: number;
    location: string;
    location_name: string;
    delivery_document_id: number | null;
    purchase_request_id: number | null;
  }>(
    `SELECT l.site_id, s.code AS site_code, s.name AS site, g.id AS grease_id, g.code, g.name, g.food_grade, g.thickener, g.base_oil_type, g.nlgi_grade,
       p.id AS pack_id, p.kind, p.net_mass_grams AS grams, l.lot_number, l.manufactured_on, l.expires_on, l.expiry_source, l.received_on, l.on_hand,
       sl.code AS location, sl.name AS location_name, l.delivery_document_id, l.purchase_request_id
     FROM stock_lot l JOIN site s ON s.id = l.site_id JOIN grease g ON g.id = l.grease_id JOIN grease_pack p ON p.id = l.pack_id
     JOIN storage_location sl ON sl.id = l.location_id WHERE l.label_code = :code AND l.site_id IN (:sites) ORDER BY sl.code`,
    { replacements: { code: labelCode, sites }, type: QueryTypes.SELECT },
  );
  const first = rows[0];
  if (!first) throw new NotFoundError("No container with this label on your sites.");
  const expiresOn = day(first.expires_on);
  const [sooner] = await sequelize.query<{
    label_code: string;
    lot_number: string;
    expires_on: string | Date;
    location: string;
  }>(
    `SELECT l.label_code, l.lot_number, l.expires_on, sl.code AS location FROM stock_lot l JOIN storage_location sl ON sl.id = l.location_id
     WHERE l.site_id = ? AND l.grease_id = ? AND l.pack_id = ? AND l.on_hand > 0 AND l.label_code <> ? AND l.expires_on IS NOT NULL AND l.expires_on > ?
       AND (? IS NULL OR l.expires_on < ?) ORDER BY l.expires_on, l.id LIMIT 1`,
    {
      replacements: [
        first.site_id,
        first.grease_id,
        first.pack_id,
        labelCode,
        day(now),
        expiresOn,
        expiresOn,
      ],
      type: QueryTypes.SELECT,
    },
  );
  return {
    labelCode,
    lotNumber: first.lot_number,
    grease: {
      id: Number(first.grease_id),
      code: first.code,
      name: first.name,
      foodGrade: first.food_grade,
      thickener: first.thickener,
      baseOilType: first.base_oil_type,
      nlgiGrade: first.nlgi_grade,
    },
    pack: { id: Number(first.pack_id), kind: first.kind, netMassGrams: Number(first.grams) },
    site: { id: Number(first.site_id), code: first.site_code, name: first.site },
    manufacturedOn: day(first.manufactured_on),
    expiresOn,
    expirySource: first.expiry_source,
    receivedOn: day(first.received_on)!,
    expired: expiredOn(expiresOn, now),
    daysToExpiry: daysUntil(expiresOn, now),
    onHand: rows.reduce((n, r) => n + Number(r.on_hand), 0),
    locations: rows.map((r) => ({
      code: r.location,
      qualifiedCode: `${r.site_code}/${r.location}`,
      name: r.location_name,
      onHand: Number(r.on_hand),
    })),
    deliveryDocumentId: first.delivery_document_id === null ? null : Number(first.delivery_document_id),
    purchaseRequestId: first.purchase_request_id === null ? null : Number(first.purchase_request_id),
    expiresSooner: sooner
      ? {
          labelCode: sooner.label_code,
          lotNumber: sooner.lot_number,
          expiresOn: day(sooner.expires_on)!,
          location: sooner.location,
        }
      : null,
  };
}

export interface LotMovement {
  id: number;
  at: string;
  kind: string;
  quantity: number;
  location: string;
  otherLocation: string | null;
  by: string;
  issuedTo: string | null;
  point: string | null;
  reason: string | null;
}

/** The ledger of one label, newest first. */
export async function labelMovements(labelCode: string, userId: string, limit = 200): Promise<LotMovement[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const rows = await getSequelize().query<{
    id: number;
    created_at: Date;
    kind: string;
    quantity: number;
    location: string;
    other: string | null;
    by_name: string | null;
    to_name: string | null;
    point: string | null;
    tag: string | null;
    reason: string | null;
  }>(
    `SELECT m.id, m.created_at, m.kind, m.quantity, sl.code AS location, ol.code AS other, u.name AS by_name, t.name AS to_name, p.name AS point, p.tag_code AS tag, m.reason
     FROM stock_movement m JOIN stock_lot l ON l.id = m.lot_id JOIN storage_location sl ON sl.id = l.location_id
     LEFT JOIN storage_location ol ON ol.id = m.other_location_id LEFT JOIN app_user u ON u.id = m.user_id
     LEFT JOIN app_user t ON t.id = m.issued_to_user_id LEFT JOIN lube_point p ON p.id = m.point_id
     WHERE l.label_code = :code AND l.site_id IN (:sites) ORDER BY m.created_at DESC, m.id DESC LIMIT :limit`,
    { replacements: { code: labelCode, sites, limit }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: Number(r.id),
    at: new Date(r.created_at).toISOString(),
    kind: r.kind,
    quantity: Number(r.quantity),
    location: r.location,
    otherLocation: r.other,
    by: r.by_name ?? "—",
    issuedTo: r.to_name,
    point: r.point ? `${r.point} (${r.tag})` : null,
    reason: r.reason,
  }));
}

export interface IssueLot {
  labelCode: string;
  lotNumber: string;
  location: string;
  qualifiedCode: string;
  onHand: number;
  expiresOn: string | null;
  expired: boolean;
  daysToExpiry: number | null;
  /** The lot to take: the first usable one in first-expiring-first-out order. */
  suggested: boolean;
}

/** The lots of a grease (and pack) on the caller's sites in the order they should leave the store. */
export async function listIssueLots(
  userId: string,
  query: { greaseId: number; packId?: number; location?: string },
  now = new Date(),
): Promise<IssueLot[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const [siteCode, located] = splitLocation(query.location);
  const code = located ?? null;
  const rows = await getSequelize().query<{
    label_code: string;
    lot_number: string;
    location: string;
    site_code: string;
    on_hand: number;
    expires_on: string | Date | null;
  }>(
    `SELECT l.label_code, l.lot_number, sl.code AS location, s.code AS site_code, l.on_hand, l.expires_on FROM stock_lot l
     JOIN storage_location sl ON sl.id = l.location_id JOIN site s ON s.id = l.site_id
     WHERE l.site_id IN (:sites) AND l.grease_id = :grease ${query.packId ? "AND l.pack_id = :pack" : ""} ${code ? "AND sl.code = :code" : ""} ${siteCode ? "AND s.code = :siteCode" : ""}
       AND l.on_hand > 0 ORDER BY l.expires_on IS NULL, l.expires_on, l.received_on, l.id LIMIT 200`,
    {
      replacements: { sites, grease: query.greaseId, pack: query.packId ?? null, code, siteCode },
      type: QueryTypes.SELECT,
    },
  );
  let suggestedTaken = false;
  return rows.map((r) => {
    const expiresOn = day(r.expires_on);
    const expired = expiredOn(expiresOn, now);
    const suggested = !expired && !suggestedTaken;
    if (suggested) suggestedTaken = true;
    return {
      labelCode: r.label_code,
      lotNumber: r.lot_number,
      location: r.location,
      qualifiedCode: `${r.site_code}/${r.location}`,
      onHand: Number(r.on_hand),
      expiresOn,
      expired,
      daysToExpiry: daysUntil(expiresOn, now),
      suggested,
    };
  });
}

export interface CountLine {
  lotId: number;
  labelCode: string;
  lotNumber: string;
  grease: string;
  greaseCode: string;
  pack: string;
  expiresOn: string | null;
  onHand: number;
}

/** The count sheet of one location: every lot row with stock, in shelf order (grease, then expiry). */
export async function countSheet(
  userId: string,
  locationId: number,
): Promise<{ location: LocationItem; lines: CountLine[] }> {
  const location = (await listLocations(userId)).find((l) => l.id === locationId);
  if (!location) throw new ValidationError({ location: ["No such storage location on your sites."] });
  const rows = await getSequelize().query<{
    id: number;
    label_code: string;
    lot_number: string;
    grease: string;
    code: string;
    kind: string;
    grams: number;
    expires_on: string | Date | null;
    on_hand: number;
  }>(
    `SELECT l.id, l.label_code, l.lot_number, g.name AS grease, g.code, p.kind, p.net_mass_grams AS grams, l.expires_on, l.on_hand
     FROM stock_lot l JOIN grease g ON g.id = l.grease_id JOIN grease_pack p ON p.id = l.pack_id
     WHERE l.location_id = ? AND l.on_hand > 0 ORDER BY g.name, l.expires_on IS NULL, l.expires_on, l.id`,
    { replacements: [locationId], type: QueryTypes.SELECT },
  );
  return {
    location,
    lines: rows.map((r) => ({
      lotId: Number(r.id),
      labelCode: r.label_code,
      lotNumber: r.lot_number,
      grease: r.grease,
      greaseCode: r.code,
      pack: `${r.kind} ${Number(r.grams)} g`,
      expiresOn: day(r.expires_on),
      onHand: Number(r.on_hand),
    })),
  };
}

export interface ExpiringLot {
  labelCode: string;
  lotNumber: string;
  grease: string;
  location: string;
  onHand: number;
  expiresOn: string;
  expired: boolean;
  daysToExpiry: number;
}

/** Lots with stock that have expired or expire within `days`, soonest first. */
export async function listExpiringLots(userId: string, days = 60, now = new Date()): Promise<ExpiringLot[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const limit = new Date(now.getTime() + days * 86_400_000).toISOString().slice(0, 10);
  const rows = await getSequelize().query<{
    label_code: string;
    lot_number: string;
    grease: string;
    location: string;
    site_code: string;
    on_hand: number;
    expires_on: string | Date;
  }>(
    `SELECT l.label_code, l.lot_number, g.name AS grease, sl.code AS location, s.code AS site_code, l.on_hand, l.expires_on FROM stock_lot l
     JOIN grease g ON g.id = l.grease_id JOIN storage_location sl ON sl.id = l.location_id JOIN site s ON s.id = l.site_id
     WHERE l.site_id IN (:sites) AND l.on_hand > 0 AND l.expires_on IS NOT NULL AND l.expires_on <= :limit ORDER BY l.expires_on, l.id LIMIT 100`,
    { replacements: { sites, limit }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => {
    const expiresOn = day(r.expires_on)!;
    return {
      labelCode: r.label_code,
      lotNumber: r.lot_number,
      grease: r.grease,
      location: `${r.site_code}/${r.location}`,
      onHand: Number(r.on_hand),
      expiresOn,
      expired: expiredOn(expiresOn, now),
      daysToExpiry: daysUntil(expiresOn, now)!,
    };
  });
}

export interface Recipient {
  id: string;
  name: string;
  role: string;
}

/** The people stock can be issued to on the caller's sites: technicians and leads. */
export async function listIssueRecipients(userId: string): Promise<Recipient[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const rows = await getSequelize().query<{ id: string; name: string; role: string }>(
    `SELECT DISTINCT u.id, u.name, u.role FROM app_user u JOIN user_site_access a ON a.user_id = u.id
     WHERE a.site_id IN (:sites) AND u.role IN ('technician','lead') AND u.status = 'active' ORDER BY u.role DESC, u.name`,
    { replacements: { sites }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ id: r.id, name: r.name, role: r.role }));
}

export interface OpenPurchaseRequest {
  id: number;
  greaseId: number;
  packId: number;
  label: string;
}

/** Requests that a receipt can answer (requested or ordered), for the receiving form. */
export async function listOpenPurchaseRequests(userId: string): Promise<OpenPurchaseRequest[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const rows = await getSequelize().query<{
    id: number;
    grease_id: number;
    pack_id: number;
    name: string;
    packs: number;
    kind: string;
    state: string;
    reference: string | null;
  }>(
    `SELECT r.id, r.grease_id, r.pack_id, g.name, r.packs, p.kind, r.state, r.reference FROM purchase_request r JOIN grease g ON g.id = r.grease_id
     JOIN grease_pack p ON p.id = r.pack_id WHERE r.site_id IN (:sites) AND r.state IN ('requested','ordered') ORDER BY r.id`,
    { replacements: { sites }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: Number(r.id),
    greaseId: Number(r.grease_id),
    packId: Number(r.pack_id),
    label: `#${r.id} · ${r.name} · ${r.packs} × ${r.kind} · ${r.state}${r.reference ? ` (${r.reference})` : ""}`,
  }));
}
