import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import { isoWeek, lotsAtRisk, type Lot } from "@/lib/domain/inventory";
import { getSequelize } from "../db";
import { log } from "../log";
import { enqueueMail } from "../mail/outbox";
import { reorderPointGrams } from "./stock";
import { siteRoleEmails } from "./users";

/** Lots expiring within this many days are listed whatever the forecast says. Common practice, no source. */
export const EXPIRY_WARNING_DAYS = 60;

/**
 * Lots the forecast will not use up are listed only when they expire within this many days: far enough ahead to
 * move the stock or hold back an order, near enough that a 13-week forecast still means something, and it keeps a
 * grease that no point uses from appearing every week for years. Our choice, no source.
 */
export const AT_RISK_HORIZON_DAYS = 365;

const MS_PER_DAY = 86_400_000;
/** Supplier lead time when none is recorded, as the reorder check assumes. */
const DEFAULT_LEAD_TIME_DAYS = 14;

interface LotRow {
  id: number;
  grease_id: number;
  grease: string;
  grease_code: string;
  lot_number: string;
  label_code: string;
  location_code: string;
  location_name: string;
  pack_kind: string;
  net_mass_grams: number;
  on_hand: number;
  expires_on: string | null;
  received_on: string;
  lead_time_days: number | null;
}

interface DigestLot {
  row: LotRow;
  expiresOn: Date;
  /** Whole days from today (UTC) to the expiry date; ≤ 0 once the date is reached. */
  daysLeft: number;
  expired: boolean;
  /** Grams expected to be left at expiry at the forecast use, when the forecast leaves some. */
  gramsAtRisk: number | null;
  gramsPerWeek: number;
}

const utcDay = (iso: string) => new Date(`${iso.slice(0, 10)}T00:00:00Z`);
const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

function kg(grams: number): string {
  const tenths = Math.round(grams / 100);
  return tenths < 1 ? "less than 0.1 kg" : `${(tenths / 10).toFixed(1)} kg`;
}

function weekly(gramsPerWeek: number): string {
  return gramsPerWeek < 1 ? "less than 1 g a week" : `${Math.round(gramsPerWeek)} g a week`;
}

function stateText(lot: DigestLot): string {
  const date = lot.row.expires_on!;
  if (lot.expired) {
    return lot.daysLeft === 0
      ? `expired today (${date})`
      : `expired ${plural(-lot.daysLeft, "day")} ago (${date})`;
  }
  const when =
    lot.daysLeft === 0 ? `expires today (${date})` : `expires in ${plural(lot.daysLeft, "day")} (${date})`;
  if (lot.gramsAtRisk === null) return when;
  if (lot.gramsPerWeek > 0) {
    return `${when}; about ${kg(lot.gramsAtRisk)} will be left at expiry at the planned use of ${weekly(lot.gramsPerWeek)}`;
  }
  return `${when}; no lube point is planned to use this grease, so all ${kg(lot.gramsAtRisk)} will be left at expiry`;
}

function digestText(siteName: string, weekLabel: string, lots: DigestLot[]): string {
  const lines = [
    `Stock near expiry at ${siteName}, week ${weekLabel}.`,
    "",
    `Lots with grease on hand that have expired, that expire within ${EXPIRY_WARNING_DAYS} days, or that the planned use will not empty before their expiry date:`,
    "",
  ];
  lots.forEach((lot, index) => {
    const r = lot.row;
    lines.push(
      `${index + 1}. ${r.grease} (${r.grease_code}), lot ${r.lot_number}: ${stateText(lot)}`,
      `   Label ${r.label_code}, location ${r.location_code} (${r.location_name}), ${plural(Number(r.on_hand), r.pack_kind)} of ${Number(r.net_mass_grams)} g on hand.`,
    );
  });
  lines.push(
    "",
    "A lot past its date is not necessarily bad grease. Before using it, have a sample compared with fresh product of the same grease (oil separation, consistency, colour, smell); if it does not match, scrap the lot.",
  );
  if (lots.some((l) => !l.expired && l.gramsAtRisk !== null)) {
    lines.push(
      "A lot that the planned use will not empty in time can be issued first, moved to where the grease is used, or covered by a smaller next order.",
    );
  }
  return lines.join("\n");
}

/** The lots of one site to list this week, first expiring first. */
async function siteDigestLots(siteId: number, now: Date, transaction: Transaction): Promise<DigestLot[]> {
  const rows = await getSequelize().query<LotRow>(
    `SELECT l.id, l.grease_id, g.name AS grease, g.code AS grease_code, l.lot_number, l.label_code,
       sl.code AS location_code, sl.name AS location_name, p.kind AS pack_kind, p.net_mass_grams, l.on_hand,
       DATE_FORMAT(l.expires_on, '%Y-%m-%d') AS expires_on, DATE_FORMAT(l.received_on, '%Y-%m-%d') AS received_on,
       s.lead_time_days
     FROM stock_lot l JOIN grease g ON g.id = l.grease_id JOIN grease_pack p ON p.id = l.pack_id
     JOIN storage_location sl ON sl.id = l.location_id LEFT JOIN supplier s ON s.id = g.supplier_id
     WHERE l.site_id = ? AND l.on_hand > 0
     ORDER BY l.expires_on IS NULL, l.expires_on, g.name, l.lot_number, l.id`,
    { replacements: [siteId], type: QueryTypes.SELECT, transaction },
  );
  const todayMs = Math.floor(now.getTime() / MS_PER_DAY) * MS_PER_DAY;
  const horizonMs = todayMs + AT_RISK_HORIZON_DAYS * MS_PER_DAY;

  const byGrease = new Map<number, LotRow[]>();
  for (const row of rows) {
    const greaseId = Number(row.grease_id);
    byGrease.set(greaseId, [...(byGrease.get(greaseId) ?? []), row]);
  }

  const listed: DigestLot[] = [];
  for (const [greaseId, greaseRows] of byGrease) {
    // Only dated lots within the horizon can be listed; skip the forecast for a grease that has none.
    if (!greaseRows.some((r) => r.expires_on !== null && utcDay(r.expires_on).getTime() <= horizonMs))
      continue;
    const leadTimeDays =
      greaseRows[0]!.lead_time_days === null ? DEFAULT_LEAD_TIME_DAYS : Number(greaseRows[0]!.lead_time_days);
    const { gramsPerWeek } = await reorderPointGrams(siteId, greaseId, leadTimeDays, now, transaction);
    const lots: Lot[] = greaseRows.map((r) => ({
      lotId: Number(r.id),
      onHandGrams: Number(r.on_hand) * Number(r.net_mass_grams),
      expiresOn: r.expires_on === null ? null : utcDay(r.expires_on),
      receivedOn: utcDay(r.received_on),
    }));
    const atRisk = new Map(lotsAtRisk(lots, gramsPerWeek, now).map((l) => [l.lotId, l.gramsAtRisk]));
    for (const row of greaseRows) {
      if (row.expires_on === null) continue;
      const expiresOn = utcDay(row.expires_on);
      const daysLeft = Math.round((expiresOn.getTime() - todayMs) / MS_PER_DAY);
      // The same rule as issuing: a lot is expired once its date is before now, and is then no longer picked.
      const expired = expiresOn.getTime() < now.getTime();
      const gramsAtRisk = expiresOn.getTime() <= horizonMs ? (atRisk.get(Number(row.id)) ?? null) : null;
      if (expired || daysLeft <= EXPIRY_WARNING_DAYS || gramsAtRisk !== null) {
        listed.push({ row, expiresOn, daysLeft, expired, gramsAtRisk, gramsPerWeek });
      }
    }
  }
  return listed.sort(
    (a, b) =>
      a.expiresOn.getTime() - b.expiresOn.getTime() ||
      a.row.grease.localeCompare(b.row.grease) ||
      Number(a.row.id) - Number(b.row.id),
  );
}

/**
 * The weekly near-expiry mail: for each site with lots that have expired, expire within EXPIRY_WARNING_DAYS, or
 * will still hold grease on their expiry date at the forecast use (within AT_RISK_HORIZON_DAYS), puts one mail to
 * the site's leads and storeroom clerks in the outbox. The dedupe key names the site and the ISO week (UTC), so
 * calling this every hour, from every app instance, queues one mail per site per week.
 *
 * A site that fails does not stop the others; the call then throws naming the failed sites (the caller logs it).
 */
export async function queueExpiryDigests(now = new Date()): Promise<{ queued: number }> {
  const week = isoWeek(now);
  if (!week) throw new Error("queueExpiryDigests: invalid date");
  const sequelize = getSequelize();
  const sites = await sequelize.query<{ id: number; name: string }>("SELECT id, name FROM site ORDER BY id", {
    type: QueryTypes.SELECT,
  });
  let queued = 0;
  const failed: number[] = [];
  let firstError: unknown = null;
  for (const site of sites) {
    const siteId = Number(site.id);
    const dedupeKey = `expiry-digest:${siteId}:${week.label}`;
    try {
      const id = await sequelize.transaction(async (transaction) => {
        const [done] = await sequelize.query("SELECT id FROM mail_outbox WHERE dedupe_key = ?", {
          replacements: [dedupeKey],
          type: QueryTypes.SELECT,
          transaction,
        });
        if (done) return null;
        const lots = await siteDigestLots(siteId, now, transaction);
        if (!lots.length) return null;
        const to = await siteRoleEmails(siteId, ["lead", "clerk"], transaction);
        if (!to.length) return null;
        return enqueueMail(
          {
            to,
            subject: `Stock near expiry at ${site.name}: ${plural(lots.length, "lot")} (week ${week.label})`,
            text: digestText(site.name, week.label, lots),
            dedupeKey,
          },
          transaction,
          now,
        );
      });
      if (id !== null) {
        queued += 1;
        log("info", "expiry_digest_queued", { siteId, week: week.label, outboxId: id });
      }
    } catch (error) {
      failed.push(siteId);
      firstError ??= error;
    }
  }
  if (failed.length) {
    const message = firstError instanceof Error ? firstError.message : String(firstError);
    throw new Error(`Expiry digest failed for site(s) ${failed.join(", ")}: ${message}`);
  }
  return { queued };
}
