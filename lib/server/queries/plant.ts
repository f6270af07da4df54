import "server-only";
import { randomBytes } from "node:crypto";
import { QueryTypes, type Transaction } from "sequelize";
import { nextDueAt, type BearingType, type Level } from "@/lib/domain/relubrication";
import { tagCodeFrom } from "@/lib/domain/service";
import type { PointInput } from "@/lib/validation/points";
import { appendAudit } from "../audit";
import { getSequelize } from "../db";
import { ConflictError, ForbiddenError, NotFoundError, ValidationError } from "../errors";
import { log } from "../log";
import { planPoint } from "../plan";
import { getGrease } from "./greases";
import { userSiteIds } from "./users";

const isDuplicate = (e: unknown) =>
  (e as { name?: string }).name === "SequelizeUniqueConstraintError" ||
  (e as { original?: { errno?: number } }).original?.errno === 1062;

async function assertSite(userId: string, siteId: number, transaction?: Transaction) {
  if (!(await userSiteIds(userId, transaction)).includes(siteId))
    throw new ForbiddenError("You have no access to this site.");
}

export async function createArea(
  input: { siteId: number; code: string; name: string },
  userId: string,
): Promise<number> {
  await assertSite(userId, input.siteId);
  const now = new Date();
  try {
    const id = await getSequelize().transaction(async (transaction) => {
      const [inserted] = await getSequelize().query(
        "INSERT INTO area (site_id, code, name, sort_order, created_at, updated_at) VALUES (?, ?, ?, (SELECT COALESCE(MAX(a.sort_order), 0) + 1 FROM area a WHERE a.site_id = ?), ?, ?)",
        {
          replacements: [input.siteId, input.code.toUpperCase(), input.name, input.siteId, now, now],
          type: QueryTypes.INSERT,
          transaction,
        },
      );
      await appendAudit(
        {
          event: "points.area_created",
          actorId: userId,
          siteId: input.siteId,
          subjectType: "area",
          subjectId: Number(inserted),
          payload: { code: input.code.toUpperCase(), name: input.name },
        },
        transaction,
        now,
      );
      return inserted;
    });
    log("info", "area_created", { areaId: id, by: userId });
    return Number(id);
  } catch (error) {
    if (isDuplicate(error))
      throw new ValidationError({ code: ["This site already has an area with this code."] });
    throw error;
  }
}

/**
 * The site of an area the user may add to. An area of another site answers exactly as an unknown one does, so the
 * answer does not tell which area ids exist elsewhere.
 */
async function areaSiteOf(userId: string, areaId: number, transaction?: Transaction): Promise<number> {
  const [row] = await getSequelize().query<{ site_id: number }>("SELECT site_id FROM area WHERE id = ?", {
    replacements: [areaId],
    type: QueryTypes.SELECT,
    transaction,
  });
  if (!row || !(await userSiteIds(userId, transaction)).includes(Number(row.site_id)))
    throw new ValidationError({ areaId: ["No such area on your sites."] });
  return Number(row.site_id);
}

export async function createAsset(
  input: { areaId: number; tag: string; name: string; kind: string; frameSize?: string },
  userId: string,
  transaction?: Transaction,
): Promise<number> {
  const siteId = await areaSiteOf(userId, input.areaId, transaction);
  const now = new Date();
  try {
    const insert = async (t: Transaction) => {
      const [inserted] = await getSequelize().query(
        "INSERT INTO asset (site_id, area_id, tag, name, kind, frame_size, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)",
        {
          replacements: [
            siteId,
            input.areaId,
            input.tag,
            input.name,
            input.kind,
            input.frameSize ?? null,
            now,
            now,
          ],
          type: QueryTypes.INSERT,
          transaction: t,
        },
      );
      await appendAudit(
        {
          event: "points.asset_created",
          actorId: userId,
          siteId,
          subjectType: "asset",
          subjectId: Number(inserted),
          payload: { ...input },
        },
        t,
        now,
      );
      return Number(inserted);
    };
    return await (transaction ? insert(transaction) : getSequelize().transaction(insert));
  } catch (error) {
    if (isDuplicate(error))
      throw new ValidationError({ tag: ["This site already has an asset with this tag."] });
    throw error;
  }
}

async function assetSite(assetId: number, transaction?: Transaction): Promise<number> {
  const [row] = await getSequelize().query<{ site_id: number }>("SELECT site_id FROM asset WHERE id = ?", {
    replacements: [assetId],
    type: QueryTypes.SELECT,
    transaction,
  });
  if (!row) throw new ValidationError({ assetId: ["No such asset."] });
  return Number(row.site_id);
}

/**
 * Creates a point (tag code drawn at random) or changes one. The interval and quantity are worked out again
 * from the bearing, the duty and the grease (override, then maker, then calculator), and the next due date
 * follows from the last service.
 */
export async function savePoint(
  input: PointInput,
  userId: string,
  tag?: string,
  transaction?: Transaction,
): Promise<string> {
  if (transaction) return savePointIn(input, userId, tag, transaction);
  return getSequelize().transaction((t) => savePointIn(input, userId, tag, t));
}

async function savePointIn(
  input: PointInput,
  userId: string,
  tag: string | undefined,
  transaction: Transaction,
): Promise<string> {
  const sequelize = getSequelize();
  const siteId = await assetSite(input.assetId, transaction);
  await assertSite(userId, siteId, transaction);
  const grease = input.assignedGreaseId ? await getGrease(input.assignedGreaseId, transaction) : null;
  if (input.assignedGreaseId && !grease)
    throw new ValidationError({ assignedGreaseId: ["No grease with this id."] });
  if (grease && input.foodGradeRequired && grease.foodGrade !== "H1")
    throw new ValidationError({
      assignedGreaseId: ["This point is in a food-grade area: choose an H1 grease."],
    });
  const plan = planPoint(
    {
      ...input,
      bearingType: input.bearingType as BearingType,
      contamination: input.contamination as Level,
      moisture: input.moisture as Level,
      vibration: input.vibration as Level,
      operatingTemperatureC: input.operatingTemperatureC ?? null,
    },
    grease,
    input.foodGradeRequired,
  );
  const interval = input.sealedForLife ? null : plan.effectiveInterval.value;
  const quantity = input.sealedForLife ? null : plan.effectiveQuantity.value;
  const now = new Date();
  const values = [
    siteId,
    input.assetId,
    input.name,
    input.bearingType,
    input.bearingDesignation ?? null,
    input.boreMm,
    input.outsideDiameterMm,
    input.widthMm,
    input.speedRpm,
    input.operatingTemperatureC ?? null,
    input.runningHoursPerDay,
    input.verticalShaft,
    input.contamination,
    input.moisture,
    input.vibration,
    input.foodGradeRequired,
    input.replenishment,
    input.sealedForLife,
    input.sealedForLife ? null : (input.assignedGreaseId ?? null),
    input.intervalHoursOverride ?? null,
    input.quantityGramsOverride ?? null,
    input.overrideReason ?? null,
    input.makerIntervalHours ?? null,
    input.makerQuantityGrams ?? null,
    input.makerNote ?? null,
    interval === null ? null : Math.round(interval * 10) / 10,
    quantity === null ? null : Math.round(quantity * 100) / 100,
  ];
  const cols = `site_id, asset_id, name, bearing_type, bearing_designation, bore_mm, outside_diameter_mm, width_mm, speed_rpm, operating_temperature_c,
    running_hours_per_day, vertical_shaft, contamination, moisture, vibration, food_grade_required, replenishment, sealed_for_life, assigned_grease_id,
    interval_hours_override, quantity_grams_override, override_reason, maker_interval_hours, maker_quantity_grams, maker_note, interval_hours, quantity_grams`;
  if (!tag) {
    for (let attempt = 0; attempt < 5; attempt++) {
      const code = tagCodeFrom(randomBytes(8));
      try {
        await sequelize.query(
          `INSERT INTO lube_point (${cols}, tag_code, route_order, created_at, updated_at) VALUES (${values.map(() => "?").join(", ")}, ?, 999, ?, ?)`,
          {
            replacements: [...values, code, now, now],
            transaction,
          },
        );
        log("info", "point_created", { tag: code, by: userId });
        await appendAudit(
          {
            event: "points.point_created",
            actorId: userId,
            siteId,
            subjectType: "point",
            subjectId: code,
            payload: { ...input },
          },
          transaction,
          now,
        );
        return code;
      } catch (error) {
        if (!isDuplicate(error)) throw error;
      }
    }
    throw new ConflictError("tag_collision", "Could not draw a free tag code; try again.");
  }
  const [current] = await sequelize.query<{ id: number; site_id: number; last_serviced_at: Date | null }>(
    "SELECT id, site_id, last_serviced_at FROM lube_point WHERE tag_code = ?",
    { replacements: [tag], type: QueryTypes.SELECT, transaction },
  );
  if (!current || !(await userSiteIds(userId, transaction)).includes(Number(current.site_id)))
    throw new NotFoundError("No lube point with this tag on your sites.");
  const due =
    current.last_serviced_at && interval
      ? nextDueAt({
          lastServicedAt: new Date(current.last_serviced_at),
          intervalHours: interval,
          runningHoursPerDay: input.runningHoursPerDay,
        })
      : null;
  const sets = cols
    .split(",")
    .map((c) => `${c.trim()} = ?`)
    .join(", ");
  await sequelize.query(
    `UPDATE lube_point SET ${sets}, next_due_at = ?, version = version + 1, updated_at = ? WHERE id = ?`,
    {
      replacements: [...values, input.sealedForLife ? null : due, now, current.id],
      transaction,
    },
  );
  log("info", "point_updated", { tag, by: userId });
  await appendAudit(
    {
      event: "points.point_updated",
      actorId: userId,
      siteId,
      subjectType: "point",
      subjectId: tag,
      payload: { ...input },
    },
    transaction,
    now,
  );
  return tag;
}

export interface PlantTree {
  sites: {
    id: number;
    name: string;
    areas: {
      id: number;
      code: string;
      name: string;
      assets: {
        id: number;
        tag: string;
        name: string;
        kind: string;
        points: { tag: string; name: string; nextDueAt: string | null; sealed: boolean }[];
      }[];
    }[];
  }[];
}

/** Sites → areas → assets → points of the caller's sites, in three statements. */
export async function plantTree(userId: string): Promise<PlantTree> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return { sites: [] };
  const sequelize = getSequelize();
  const areas = await sequelize.query<{
    id: number;
    site_id: number;
    site_name: string;
    code: string;
    name: string;
  }>(
    "SELECT a.id, a.site_id, s.name AS site_name, a.code, a.name FROM area a JOIN site s ON s.id = a.site_id WHERE a.site_id IN (:sites) ORDER BY s.name, a.sort_order, a.name",
    { replacements: { sites }, type: QueryTypes.SELECT },
  );
  const assets = await sequelize.query<{
    id: number;
    area_id: number;
    tag: string;
    name: string;
    kind: string;
  }>("SELECT id, area_id, tag, name, kind FROM asset WHERE site_id IN (:sites) ORDER BY tag", {
    replacements: { sites },
    type: QueryTypes.SELECT,
  });
  const points = await sequelize.query<{
    asset_id: number;
    tag_code: string;
    name: string;
    next_due_at: Date | null;
    sealed_for_life: number;
  }>(
    "SELECT asset_id, tag_code, name, next_due_at, sealed_for_life FROM lube_point WHERE site_id IN (:sites) ORDER BY route_order, id",
    { replacements: { sites }, type: QueryTypes.SELECT },
  );
  const bySite = new Map<number, PlantTree["sites"][number]>();
  for (const a of areas) {
    const site = bySite.get(Number(a.site_id)) ?? { id: Number(a.site_id), name: a.site_name, areas: [] };
    site.areas.push({ id: Number(a.id), code: a.code, name: a.name, assets: [] });
    bySite.set(site.id, site);
  }
  const areaIndex = new Map([...bySite.values()].flatMap((s) => s.areas.map((a) => [a.id, a] as const)));
  const assetIndex = new Map<number, PlantTree["sites"][number]["areas"][number]["assets"][number]>();
  for (const a of assets) {
    const entry = { id: Number(a.id), tag: a.tag, name: a.name, kind: a.kind, points: [] };
    areaIndex.get(Number(a.area_id))?.assets.push(entry);
    assetIndex.set(entry.id, entry);
  }
  for (const p of points)
    assetIndex
      .get(Number(p.asset_id))
      ?.points.push({
        tag: p.tag_code,
        name: p.name,
        nextDueAt: p.next_due_at ? new Date(p.next_due_at).toISOString() : null,
        sealed: Boolean(p.sealed_for_life),
      });
  return { sites: [...bySite.values()] };
}

/** Assets of the caller's sites as choices for a form. */
export async function assetChoices(userId: string): Promise<{ id: number; label: string }[]> {
  const sites = await userSiteIds(userId);
  if (!sites.length) return [];
  const rows = await getSequelize().query<{
    id: number;
    tag: string;
    name: string;
    area: string;
    site: string;
  }>(
    `SELECT a.id, a.tag, a.name, ar.name AS area, s.code AS site FROM asset a JOIN area ar ON ar.id = a.area_id JOIN site s ON s.id = a.site_id
     WHERE a.site_id IN (:sites) ORDER BY s.code, ar.sort_order, a.tag`,
    { replacements: { sites }, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ id: Number(r.id), label: `${r.site} · ${r.tag} ${r.name} (${r.area})` }));
}
