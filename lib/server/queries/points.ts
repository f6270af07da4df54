import "server-only";
import { QueryTypes, type Transaction } from "sequelize";
import { evaluateMix, type MixResult } from "@/lib/domain/compatibility";
import { DEFAULT_DUE_WINDOW_HOURS, dueState, nextDueAt, type DueState } from "@/lib/domain/relubrication";
import { quantityFlag, type QuantityFlag } from "@/lib/domain/service";
import { appendAudit } from "../audit";
import { getSequelize } from "../db";
import { selectRows } from "../mariadb-pool";
import { ConflictError, NotFoundError, ValidationError } from "../errors";
import { idempotent, type StoredAnswer } from "../idempotency";
import { log } from "../log";
import { enqueueMail } from "../mail/outbox";
import { getEnv } from "@/lib/env";
import { getSiteSettings, listEvidence, profileOf } from "./compatibility";
import { getGrease } from "./greases";
import { containerForService } from "./stock";
import { siteLeadEmails, userSiteIds } from "./users";

export interface GreaseRefDto {
  id: number;
  code: string;
  name: string;
}

export interface PointListItem {
  tag: string;
  name: string;
  asset: string;
  area: string;
  site: string;
  due: DueState;
  nextDueAt: string | null;
  sealedForLife: boolean;
}

type PointRow = {
  id: number;
  site_id: number;
  tag_code: string;
  name: string;
  asset_name: string;
  asset_tag: string;
  area_name: string;
  site_name: string;
  next_due_at: Date | null;
  sealed_for_life: number;
  route_order: number;
};

const iso = (d: Date | null | undefined) => (d ? new Date(d).toISOString() : null);

/** The due state of a point; sealed-for-life bearings are never due. */
export function pointDue(next: Date | null, sealed: boolean, now: Date): DueState {
  return sealed ? "ok" : dueState({ nextDueAt: next ? new Date(next) : null, now });
}

/**
 * The SQL condition that narrows a due-state filter (the engine's `dueState` stays the judge of each row): overdue
 * is past its due time, due is inside the window before it or never serviced, ok is later or sealed for life.
 */
function dueCondition(due: DueState | undefined, now: Date): { sql: string; params: Date[] } {
  const windowEnd = new Date(now.getTime() + DEFAULT_DUE_WINDOW_HOURS * 3_600_000);
  switch (due) {
    case "overdue":
      return { sql: "AND p.sealed_for_life = 0 AND p.next_due_at < ?", params: [now] };
    case "due":
      return { sql: "AND p.sealed_for_life = 0 AND (p.next_due_at IS NULL OR p.next_due_at BETWEEN ? AND ?)", params: [now, windowEnd] };
    case "ok":
      return { sql: "AND (p.sealed_for_life = 1 OR p.next_due_at > ?)", params: [windowEnd] };
    default:
      return { sql: "", params: [] };
  }
}

/**
 * Lube points of the caller's sites (one statement), optionally one site and one due state, in route order. The due
 * time comes back as epoch milliseconds, and the rows through the bulk-read pool (`selectRows`): long lists stay close
 * to the time of their SQL.
 */
export async function listPoints(userId: string, filter: { siteId?: number; due?: DueState } = {}, now = new Date()): Promise<PointListItem[]> {
  const sites = await userSiteIds(userId);
  const chosen = filter.siteId !== undefined ? sites.filter((s) => s === filter.siteId) : sites;
  if (!chosen.length) return [];
  const due = dueCondition(filter.due, now);
  const rows = await selectRows<Omit<PointRow, "next_due_at"> & { next_due_ms: string | number | null }>(
    `SELECT p.id, p.site_id, p.tag_code, p.name, a.name AS asset_name, a.tag AS asset_tag, ar.name AS area_name, s.name AS site_name,
            ROUND(UNIX_TIMESTAMP(p.next_due_at) * 1000) AS next_due_ms, p.sealed_for_life, p.route_order
     FROM lube_point p JOIN asset a ON a.id = p.asset_id JOIN area ar ON ar.id = a.area_id JOIN site s ON s.id = p.site_id
     WHERE p.site_id IN (?) ${due.sql}
     ORDER BY s.name, ar.sort_order, ar.name, p.route_order, p.id`,
    [chosen, ...due.params],
  );
  const items = rows.map((r) => {
    const next = r.next_due_ms === null ? null : new Date(Number(r.next_due_ms));
    return {
      tag: r.tag_code,
      name: r.name,
      asset: `${r.asset_tag} ${r.asset_name}`,
      area: r.area_name,
      site: r.site_name,
      due: pointDue(next, Boolean(r.sealed_for_life), now),
      nextDueAt: next ? next.toISOString() : null,
      sealedForLife: Boolean(r.sealed_for_life),
    };
  });
  return filter.due ? items.filter((i) => i.due === filter.due) : items;
}

/** Points to grease by `until` (never-serviced ones included, sealed ones never), in walking order per area. */
export async function listPointsDueBy(userId: string, until: Date, now = new Date()): Promise<PointListItem[]> {
  return (await listPoints(userId, {}, now)).filter((p) => !p.sealedForLife && (p.nextDueAt === null || new Date(p.nextDueAt).getTime() <= until.getTime()));
}

export interface PointDetail {
  id: number;
  siteId: number;
  assetId: number;
  tag: string;
  name: string;
  asset: string;
  assetKind: string;
  area: string;
  site: string;
  bearingType: string;
  bearingDesignation: string | null;
  boreMm: number;
  outsideDiameterMm: number;
  widthMm: number;
  speedRpm: number;
  operatingTemperatureC: number | null;
  runningHoursPerDay: number;
  verticalShaft: boolean;
  contamination: string;
  moisture: string;
  vibration: string;
  foodGradeRequired: boolean;
  replenishment: "side" | "centre";
  sealedForLife: boolean;
  assignedGrease: GreaseRefDto | null;
  currentGrease: GreaseRefDto | null;
  intervalHours: number | null;
  quantityGrams: number | null;
  intervalHoursOverride: number | null;
  quantityGramsOverride: number | null;
  overrideReason: string | null;
  makerIntervalHours: number | null;
  makerQuantityGrams: number | null;
  makerNote: string | null;
  lastServicedAt: string | null;
  nextDueAt: string | null;
  due: DueState;
  changeover: { id: number; fromGrease: GreaseRefDto | null; toGrease: GreaseRefDto; method: string; servicesDone: number; servicesPlanned: number; state: string; shortenedIntervalHours: number | null } | null;
}

const n = (v: unknown) => (v === null || v === undefined ? null : Number(v));

/**
 * A point by its tag code, only when it belongs to one of the caller's sites (otherwise 404). One statement reads the
 * point with its asset, area, site, greases and open changeover. With `lock`, the point row alone is locked first
 * (a locking read over the joins would also lock the site, area and grease rows that every other service shares).
 */
export async function getPointByTag(tag: string, userId: string, now = new Date(), transaction?: Transaction, lock = false): Promise<PointDetail> {
  const sites = await userSiteIds(userId, transaction);
  if (lock) await getSequelize().query("SELECT id FROM lube_point WHERE tag_code = ? FOR UPDATE", { replacements: [tag], type: QueryTypes.SELECT, transaction });
  const [r] = await getSequelize().query<Record<string, unknown>>(
    `SELECT p.*, a.name AS asset_name, a.tag AS asset_tag, a.kind AS asset_kind, ar.name AS area_name, s.name AS site_name,
            ga.code AS ga_code, ga.name AS ga_name, gc.code AS gc_code, gc.name AS gc_name,
            c.id AS co_id, c.from_grease_id AS co_from_grease_id, c.to_grease_id AS co_to_grease_id, c.method AS co_method,
            c.services_done AS co_services_done, c.services_planned AS co_services_planned, c.state AS co_state,
            c.shortened_interval_hours AS co_shortened_interval_hours,
            gf.code AS gf_code, gf.name AS gf_name, gt.code AS gt_code, gt.name AS gt_name
     FROM lube_point p JOIN asset a ON a.id = p.asset_id JOIN area ar ON ar.id = a.area_id JOIN site s ON s.id = p.site_id
     LEFT JOIN grease ga ON ga.id = p.assigned_grease_id LEFT JOIN grease gc ON gc.id = p.current_grease_id
     LEFT JOIN changeover c ON c.id = (SELECT MAX(c2.id) FROM changeover c2 WHERE c2.point_id = p.id AND c2.state IN ('planned','in_progress'))
     LEFT JOIN grease gf ON gf.id = c.from_grease_id LEFT JOIN grease gt ON gt.id = c.to_grease_id
     WHERE p.tag_code = ?`,
    { replacements: [tag], type: QueryTypes.SELECT, transaction },
  );
  if (!r || !sites.includes(Number(r.site_id))) throw new NotFoundError("No lube point with this tag on your sites.");
  const ref = (id: unknown, code: unknown, name: unknown): GreaseRefDto | null =>
    id === null || id === undefined ? null : { id: Number(id), code: String(code), name: String(name) };
  const next = (r.next_due_at as Date | null) ?? null;
  return {
    id: Number(r.id),
    siteId: Number(r.site_id),
    assetId: Number(r.asset_id),
    tag: String(r.tag_code),
    name: String(r.name),
    asset: `${r.asset_tag} ${r.asset_name}`,
    assetKind: String(r.asset_kind),
    area: String(r.area_name),
    site: String(r.site_name),
    bearingType: String(r.bearing_type),
    bearingDesignation: (r.bearing_designation as string | null) ?? null,
    boreMm: Number(r.bore_mm),
    outsideDiameterMm: Number(r.outside_diameter_mm),
    widthMm: Number(r.width_mm),
    speedRpm: Number(r.speed_rpm),
    operatingTemperatureC: n(r.operating_temperature_c),
    runningHoursPerDay: Number(r.running_hours_per_day),
    verticalShaft: Boolean(r.vertical_shaft),
    contamination: String(r.contamination),
    moisture: String(r.moisture),
    vibration: String(r.vibration),
    foodGradeRequired: Boolean(r.food_grade_required),
    replenishment: r.replenishment === "centre" ? "centre" : "side",
    sealedForLife: Boolean(r.sealed_for_life),
    assignedGrease: ref(r.assigned_grease_id, r.ga_code, r.ga_name),
    currentGrease: ref(r.current_grease_id, r.gc_code, r.gc_name),
    intervalHours: n(r.interval_hours),
    quantityGrams: n(r.quantity_grams),
    intervalHoursOverride: n(r.interval_hours_override),
    quantityGramsOverride: n(r.quantity_grams_override),
    overrideReason: (r.override_reason as string | null) ?? null,
    makerIntervalHours: n(r.maker_interval_hours),
    makerQuantityGrams: n(r.maker_quantity_grams),
    makerNote: (r.maker_note as string | null) ?? null,
    lastServicedAt: iso(r.last_serviced_at as Date | null),
    nextDueAt: iso(next),
    due: pointDue(next, Boolean(r.sealed_for_life), now),
    changeover:
      r.co_id !== null && r.co_id !== undefined
        ? {
            id: Number(r.co_id),
            fromGrease: ref(r.co_from_grease_id, r.gf_code, r.gf_name),
            toGrease: ref(r.co_to_grease_id, r.gt_code, r.gt_name)!,
            method: String(r.co_method),
            servicesDone: Number(r.co_services_done),
            servicesPlanned: Number(r.co_services_planned),
            state: String(r.co_state),
            shortenedIntervalHours: n(r.co_shortened_interval_hours),
          }
        : null,
  };
}

/** The API's view of a point (API.md). */
export function pointApiDto(p: PointDetail) {
  return {
    tag: p.tag,
    name: p.name,
    asset: p.asset,
    site: p.site,
    assignedGrease: p.assignedGrease,
    currentGrease: p.currentGrease,
    intervalHours: p.intervalHours,
    quantityGrams: p.quantityGrams,
    lastServicedAt: p.lastServicedAt,
    nextDueAt: p.nextDueAt,
    due: p.due,
    sealedForLife: p.sealedForLife,
    foodGradeRequired: p.foodGradeRequired,
    changeover: p.changeover,
  };
}

export interface ServiceInput {
  greaseId: number;
  grams?: number;
  strokes?: number;
  gunId?: number;
  notes?: string;
  backPressure?: boolean;
  purgeSeen?: boolean;
  noise?: boolean;
  housingTemperatureC?: number;
  containerLabel?: string;
  takeContainer?: boolean;
}

/**
 * The guard at the lube point: may the grease in hand go into this point? During a changeover the new grease
 * is allowed and the old one is not; a point with no grease recorded accepts any grease that suits it.
 */
export async function checkGreaseForPoint(point: PointDetail, greaseId: number, transaction?: Transaction): Promise<MixResult & { changeoverId: number | null }> {
  const candidate = await getGrease(greaseId, transaction);
  if (!candidate) throw new ValidationError({ greaseId: ["No grease with this id."] });
  const settings = await getSiteSettings(point.siteId, transaction);
  const context = { foodGradeRequired: point.foodGradeRequired };
  if (point.changeover) {
    if (candidate.id === point.changeover.toGrease.id) {
      const result = evaluateMix(profileOf(candidate), profileOf(candidate), context, settings);
      result.reasons.unshift({
        kind: "same_product",
        verdict: result.verdict,
        message: `A changeover to ${candidate.name} is under way at this point: it is the grease to use now (${point.changeover.method === "purge" ? "purge the old grease out" : "after the clean-out"}).`,
      });
      return { ...result, changeoverId: point.changeover.id };
    }
    return {
      verdict: "incompatible",
      mixingAllowed: false,
      charts: [],
      reasons: [
        {
          kind: "same_product",
          verdict: "incompatible",
          message: `A changeover to ${point.changeover.toGrease.name} is under way at this point; ${candidate.name} may not be used here until it is completed or cancelled.`,
        },
      ],
      changeoverId: point.changeover.id,
    };
  }
  const inPoint = point.currentGrease ? await getGrease(point.currentGrease.id, transaction) : null;
  const reference = inPoint ?? candidate;
  const evidence = inPoint && inPoint.id !== candidate.id ? await listEvidence({ pair: [inPoint.id, candidate.id] }, transaction) : [];
  const result = evaluateMix(profileOf(reference), profileOf(candidate), { ...context, evidence }, settings);
  if (!inPoint) {
    result.reasons.unshift({ kind: "same_product", verdict: result.verdict, message: "No grease is recorded in this point yet; only the point's own needs were checked." });
  }
  return { ...result, changeoverId: null };
}


/**
 * Records a service at a point, or refuses it. Allowed: one service row, the point's last service, next due
 * date and grease move on, a changeover advances. Refused: no service, one mixing incident with the verdict
 * and reasons, and one mail to the site's leads, in the same transaction. With an Idempotency-Key a retry
 * replays the first answer.
 */
export async function recordService(tag: string, userId: string, input: ServiceInput, idempotencyKey: string | null, now = new Date()): Promise<StoredAnswer> {
  const sequelize = getSequelize();
  return idempotent({ userId, key: idempotencyKey, scope: `service:${tag}`, body: input }, async (transaction) => {
    const point = await getPointByTag(tag, userId, now, transaction, true);
    if (point.sealedForLife) throw new ConflictError("sealed_for_life", "This bearing is sealed for life: do not grease it.");
    let grams = input.grams;
    let gramsPerStroke: number | null = null;
    if (input.gunId !== undefined) {
      const [gun] = await sequelize.query<{ grams_per_stroke: string }>("SELECT grams_per_stroke FROM grease_gun WHERE id = ? AND site_id = ?", {
        replacements: [input.gunId, point.siteId],
        type: QueryTypes.SELECT,
        transaction,
      });
      if (!gun) throw new ValidationError({ gunId: ["No such grease gun at this site."] });
      gramsPerStroke = Number(gun.grams_per_stroke);
    }
    if (grams === undefined && input.strokes !== undefined) {
      if (gramsPerStroke === null) throw new ValidationError({ gunId: ["Choose the grease gun, so strokes can be turned into grams."] });
      grams = Math.round(input.strokes * gramsPerStroke * 100) / 100;
    }
    if (grams === undefined || !(grams > 0)) throw new ValidationError({ grams: ["Give the grams applied, or the strokes and the gun."] });

    const check = await checkGreaseForPoint(point, input.greaseId, transaction);
    if (!check.mixingAllowed) {
      const [incidentId] = await sequelize.query(
        `INSERT INTO mixing_incident (site_id, point_id, kind, grease_in_point_id, grease_offered_id, verdict, reasons_json, state, opened_by, opened_at)
         VALUES (?, ?, ?, ?, ?, ?, ?, 'open', ?, ?)`,
        {
          replacements: [point.siteId, point.id, check.changeoverId ? "changeover_exception" : "refused_mix", point.currentGrease?.id ?? null, input.greaseId, check.verdict, JSON.stringify(check.reasons), userId, now],
          type: QueryTypes.INSERT,
          transaction,
        },
      );
      await sequelize.query("INSERT INTO incident_event (incident_id, at, actor_id, kind, note) VALUES (?, ?, ?, 'opened', ?)", {
        replacements: [incidentId, now, userId, "Opened by the compatibility check at the lube point; the service was refused."],
        transaction,
      });
      const offered = await getGrease(input.greaseId, transaction);
      const leads = await siteLeadEmails(point.siteId, transaction);
      if (leads.length) {
        await enqueueMail(
          {
            to: leads,
            subject: `Mix refused at ${point.name} (${point.asset})`,
            text: [
              `A technician tried to put ${offered?.name ?? "a grease"} into ${point.name} on ${point.asset} (${point.area}, ${point.site}).`,
              `Grease in the point: ${point.currentGrease?.name ?? "none recorded"}. Verdict: ${check.verdict}. The service was refused.`,
              "",
              ...check.reasons.filter((r) => !r.overridden).map((r) => `- ${r.message}`),
              "",
              `Incident ${incidentId}: ${new URL(`/incidents`, getEnv().APP_URL).toString()}`,
            ].join("\n"),
            dedupeKey: `incident:${incidentId}`,
          },
          transaction,
          now,
        );
      }
      log("warn", "service_refused", { pointId: point.id, greaseId: input.greaseId, verdict: check.verdict, incidentId, by: userId });
      await appendAudit(
        {
          event: "service.refused",
          actorId: userId,
          siteId: point.siteId,
          subjectType: "point",
          subjectId: point.tag,
          payload: { greaseInPointId: point.currentGrease?.id ?? null, greaseOfferedId: input.greaseId, verdict: check.verdict, incidentId: Number(incidentId) },
        },
        transaction,
        now,
      );
      return {
        status: 409,
        body: {
          error: { code: "mixing_blocked", message: "This grease must not go into this point. The service was not recorded; the lead has been told." },
          verdict: check.verdict,
          incidentId: Number(incidentId),
          reasons: check.reasons,
        },
      };
    }

    const container = input.containerLabel
      ? await containerForService({ labelCode: input.containerLabel, siteId: point.siteId, greaseId: input.greaseId, pointId: point.id, take: input.takeContainer ?? false }, userId, idempotencyKey, now, transaction)
      : null;
    const flag: QuantityFlag | null = quantityFlag(grams, point.quantityGrams);
    let interval = point.intervalHours;
    if (check.changeoverId) {
      const co = point.changeover!;
      const done = co.servicesDone + 1;
      const finished = done >= co.servicesPlanned;
      await sequelize.query(
        `UPDATE changeover SET services_done = ?, state = ?, completed_at = ? WHERE id = ?`,
        { replacements: [done, finished ? "completed" : "in_progress", finished ? now : null, co.id], transaction },
      );
      if (finished) {
        await sequelize.query("UPDATE lube_point SET assigned_grease_id = ? WHERE id = ?", { replacements: [co.toGrease.id, point.id], transaction });
      } else if (co.shortenedIntervalHours) {
        interval = co.shortenedIntervalHours;
      }
    }
    const due = interval ? nextDueAt({ lastServicedAt: now, intervalHours: interval, runningHoursPerDay: point.runningHoursPerDay }) : null;
    const [serviceId] = await sequelize.query(
      `INSERT INTO service_record (site_id, point_id, grease_id, lot_id, grams, strokes, gun_id, planned_grams, quantity_flag, back_pressure, purge_seen, noise,
         housing_temperature_c, notes, changeover_id, performed_by, performed_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
      {
        replacements: [
          point.siteId, point.id, input.greaseId, container?.lotId ?? null, grams, input.strokes ?? null, input.gunId ?? null, point.quantityGrams, flag,
          input.backPressure ?? false, input.purgeSeen ?? false, input.noise ?? false, input.housingTemperatureC ?? null, input.notes ?? null,
          check.changeoverId, userId, now,
        ],
        type: QueryTypes.INSERT,
        transaction,
      },
    );
    await sequelize.query(
      "UPDATE lube_point SET last_serviced_at = ?, next_due_at = ?, current_grease_id = ?, version = version + 1, updated_at = ? WHERE id = ?",
      { replacements: [now, due, input.greaseId, now, point.id], transaction },
    );
    log("info", "service_recorded", { pointId: point.id, serviceId, grams, flag, by: userId });
    await appendAudit(
      {
        event: "service.recorded",
        actorId: userId,
        siteId: point.siteId,
        subjectType: "point",
        subjectId: point.tag,
        payload: { serviceId: Number(serviceId), greaseId: input.greaseId, grams, quantityFlag: flag, changeoverId: check.changeoverId, lot: container ? { label: input.containerLabel, bookedOut: container.took } : null },
      },
      transaction,
      now,
    );
    return {
      status: 201,
      body: {
        service: {
          id: Number(serviceId),
          tag: point.tag,
          greaseId: input.greaseId,
          grams,
          strokes: input.strokes ?? null,
          quantityFlag: flag,
          plannedGrams: point.quantityGrams,
          performedAt: now.toISOString(),
          nextDueAt: due ? due.toISOString() : null,
          lot: container ? { lotNumber: container.lotNumber, labelCode: input.containerLabel, bookedOut: container.took } : null,
        },
        warnings: [
          ...(flag === "over" ? [`${grams} g is well above the planned ${point.quantityGrams} g: over-greasing heats the bearing and can push seals out.`] : []),
          ...(flag === "under" ? [`${grams} g is well below the planned ${point.quantityGrams} g.`] : []),
          ...(point.assignedGrease && point.assignedGrease.id !== input.greaseId && !check.changeoverId ? [`This is not the grease assigned to the point (${point.assignedGrease.name}).`] : []),
        ],
      },
    };
  });
}

export interface ServiceHistoryItem {
  id: number;
  performedAt: string;
  grease: string;
  grams: number;
  strokes: number | null;
  quantityFlag: string | null;
  by: string;
  notes: string | null;
  observations: string[];
}

export async function listPointServices(pointId: number, limit = 50): Promise<ServiceHistoryItem[]> {
  const rows = await getSequelize().query<Record<string, unknown>>(
    `SELECT r.*, g.name AS grease_name, u.name AS user_name FROM service_record r JOIN grease g ON g.id = r.grease_id
     LEFT JOIN app_user u ON u.id = r.performed_by WHERE r.point_id = ? ORDER BY r.performed_at DESC, r.id DESC LIMIT ?`,
    { replacements: [pointId, limit], type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({
    id: Number(r.id),
    performedAt: new Date(r.performed_at as Date).toISOString(),
    grease: String(r.grease_name),
    grams: Number(r.grams),
    strokes: n(r.strokes),
    quantityFlag: (r.quantity_flag as string | null) ?? null,
    by: String(r.user_name ?? "—"),
    notes: (r.notes as string | null) ?? null,
    observations: [
      ...(r.back_pressure ? ["back pressure"] : []),
      ...(r.purge_seen ? ["purged grease seen"] : []),
      ...(r.noise ? ["noise"] : []),
      ...(r.housing_temperature_c !== null && r.housing_temperature_c !== undefined ? [`housing ${Number(r.housing_temperature_c)} °C`] : []),
    ],
  }));
}

export async function listSiteGuns(siteId: number): Promise<{ id: number; label: string; gramsPerStroke: number; calibratedOn: string }[]> {
  const rows = await getSequelize().query<{ id: number; label: string; grams_per_stroke: string; calibrated_on: string | Date }>(
    "SELECT id, label, grams_per_stroke, calibrated_on FROM grease_gun WHERE site_id = ? ORDER BY label",
    { replacements: [siteId], type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ id: Number(r.id), label: r.label, gramsPerStroke: Number(r.grams_per_stroke), calibratedOn: String(r.calibrated_on).slice(0, 10) }));
}

export interface AreaOption {
  id: number;
  site: string;
  name: string;
  points: number;
}

/** Areas of the caller's sites with their number of lube points, for the tag sheet. */
export async function listAreas(userId: string): Promise<AreaOption[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const rows = await getSequelize().query<{ id: number; site: string; name: string; points: number }>(
    `SELECT ar.id, s.name AS site, ar.name, COUNT(p.id) AS points FROM area ar JOIN site s ON s.id = ar.site_id
     LEFT JOIN asset a ON a.area_id = ar.id LEFT JOIN lube_point p ON p.asset_id = a.id
     WHERE ar.site_id IN (:sites) GROUP BY ar.id, s.name, ar.name ORDER BY s.name, ar.sort_order, ar.name`,
    { replacements: { sites }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ id: Number(r.id), site: r.site, name: r.name, points: Number(r.points) }));
}

/** The points of one area of the caller's sites, in route order, for printing tags. */
export async function pointsOfArea(userId: string, areaId: number): Promise<{ tag: string; name: string; asset: string }[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const rows = await getSequelize().query<{ tag_code: string; name: string; asset: string }>(
    `SELECT p.tag_code, p.name, CONCAT(a.tag, ' ', a.name) AS asset FROM lube_point p JOIN asset a ON a.id = p.asset_id
     WHERE a.area_id = :areaId AND p.site_id IN (:sites) ORDER BY p.route_order, p.id`,
    { replacements: { areaId, sites }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ tag: r.tag_code, name: r.name, asset: r.asset }));
}

/** Plans moving a point to another grease. Only one changeover runs at a point at a time. */
export async function planChangeover(
  input: { tag: string; toGreaseId: number; method: "purge" | "clean_out"; shortenedIntervalHours?: number; servicesPlanned: number; notes?: string },
  userId: string,
  now = new Date(),
): Promise<void> {
  const sequelize = getSequelize();
  await sequelize.transaction(async (transaction) => {
    const point = await getPointByTag(input.tag, userId, now, transaction, true);
    if (point.changeover) throw new ConflictError("changeover_running", "A changeover is already planned or under way at this point.");
    const to = await getGrease(input.toGreaseId, transaction);
    if (!to) throw new ValidationError({ toGreaseId: ["No grease with this id."] });
    if (point.currentGrease?.id === to.id) throw new ValidationError({ toGreaseId: ["This grease is already in the point."] });
    if (point.foodGradeRequired && to.foodGrade !== "H1") throw new ValidationError({ toGreaseId: ["This point is in a food-grade area: choose an H1 grease."] });
    await sequelize.query(
      `INSERT INTO changeover (site_id, point_id, from_grease_id, to_grease_id, method, shortened_interval_hours, services_planned, services_done, state, notes, planned_by, created_at)
       VALUES (?, ?, ?, ?, ?, ?, ?, 0, 'planned', ?, ?, ?)`,
      {
        replacements: [point.siteId, point.id, point.currentGrease?.id ?? null, to.id, input.method, input.shortenedIntervalHours ?? null, input.servicesPlanned, input.notes ?? null, userId, now],
        transaction,
      },
    );
    await appendAudit(
      { event: "changeover.planned", actorId: userId, siteId: point.siteId, subjectType: "point", subjectId: point.tag, payload: { from: point.currentGrease?.code ?? null, to: to.code, method: input.method, servicesPlanned: input.servicesPlanned } },
      transaction,
      now,
    );
  });
  log("info", "changeover_planned", { tag: input.tag, toGreaseId: input.toGreaseId, by: userId });
}

export async function cancelChangeover(tag: string, userId: string, now = new Date()): Promise<void> {
  const point = await getPointByTag(tag, userId, now);
  if (!point.changeover) throw new NotFoundError("No changeover is running at this point.");
  const changeoverId = point.changeover.id;
  await getSequelize().transaction(async (transaction) => {
    await getSequelize().query("UPDATE changeover SET state = 'cancelled', completed_at = ? WHERE id = ?", { replacements: [now, changeoverId], transaction });
    await appendAudit({ event: "changeover.cancelled", actorId: userId, siteId: point.siteId, subjectType: "point", subjectId: tag, payload: { changeoverId } }, transaction, now);
  });
  log("info", "changeover_cancelled", { tag, by: userId });
}
