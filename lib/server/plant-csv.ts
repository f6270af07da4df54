import "server-only";
import { parse } from "csv-parse/sync";
import { QueryTypes } from "sequelize";
import { restoreCell } from "@/lib/csv";
import { assetSchema, pointSchema, type PointInput } from "@/lib/validation/points";
import { getSequelize } from "./db";
import { log } from "./log";
import { createAsset, savePoint } from "./queries/plant";
import { userSiteIds } from "./queries/users";

/** The columns of a lube-point CSV: one row per point; its area and asset are created when new. */
export const PLANT_CSV_COLUMNS = [
  "site_code", "area_code", "area_name", "asset_tag", "asset_name", "asset_kind", "point_name", "bearing_type", "bearing_designation",
  "bore_mm", "outside_diameter_mm", "width_mm", "speed_rpm", "operating_temperature_c", "running_hours_per_day", "vertical_shaft",
  "contamination", "moisture", "vibration", "food_grade_required", "replenishment", "sealed_for_life", "grease_code",
  "maker_interval_hours", "maker_quantity_grams",
] as const;

const REQUIRED = ["site_code", "area_code", "asset_tag", "point_name", "bearing_type", "bore_mm", "outside_diameter_mm", "width_mm", "speed_rpm"];
const FIELD_COLUMN: Record<string, string> = {
  name: "point_name", bearingType: "bearing_type", bearingDesignation: "bearing_designation", boreMm: "bore_mm", outsideDiameterMm: "outside_diameter_mm",
  widthMm: "width_mm", speedRpm: "speed_rpm", operatingTemperatureC: "operating_temperature_c", runningHoursPerDay: "running_hours_per_day",
  verticalShaft: "vertical_shaft", contamination: "contamination", moisture: "moisture", vibration: "vibration", foodGradeRequired: "food_grade_required",
  replenishment: "replenishment", sealedForLife: "sealed_for_life", assignedGreaseId: "grease_code", makerIntervalHours: "maker_interval_hours",
  makerQuantityGrams: "maker_quantity_grams", tag: "asset_tag", kind: "asset_kind",
};
export const MAX_PLANT_ROWS = 5000;

export interface PlantRow {
  line: number;
  cells: Record<string, string>;
  errors: Record<string, string>;
  plan?: { siteId: number; areaCode: string; areaName: string; assetTag: string; assetName: string; assetKind: string; point: PointInput };
}

const yes = (v: string) => /^(1|y|yes|true|x)$/i.test(v.trim());

/** Reads and checks a lube-point CSV against the caller's sites and the catalogue; writes nothing. */
export async function previewPlantCsv(text: string, userId: string): Promise<{ problems: string[]; rows: PlantRow[] }> {
  let records: string[][];
  try {
    records = parse(text, { bom: true, skip_empty_lines: true, relax_column_count: true, trim: true });
  } catch (error) {
    return { problems: [`The file is not readable as CSV: ${(error as Error).message}`], rows: [] };
  }
  const [header, ...body] = records;
  if (!header) return { problems: ["The file is empty."], rows: [] };
  const columns = header.map((h) => h.trim().toLowerCase());
  const missing = REQUIRED.filter((c) => !columns.includes(c));
  if (missing.length) return { problems: [`Missing column(s): ${missing.join(", ")}.`], rows: [] };
  if (body.length > MAX_PLANT_ROWS) return { problems: [`At most ${MAX_PLANT_ROWS} rows per file.`], rows: [] };

  const allowed = new Set(await userSiteIds(userId));
  const sequelize = getSequelize();
  const sites = new Map((await sequelize.query<{ id: number; code: string }>("SELECT id, code FROM site", { type: QueryTypes.SELECT })).map((s) => [s.code.toUpperCase(), Number(s.id)]));
  const greases = new Map((await sequelize.query<{ id: number; code: string }>("SELECT id, code FROM grease", { type: QueryTypes.SELECT })).map((g) => [g.code.toLowerCase(), Number(g.id)]));

  const rows = body.map((record, index): PlantRow => {
    const cells: Record<string, string> = {};
    columns.forEach((c, i) => (cells[c] = restoreCell(record[i] ?? "")));
    const errors: Record<string, string> = {};
    const siteId = sites.get((cells.site_code ?? "").toUpperCase());
    if (!siteId || !allowed.has(siteId)) errors.site_code = "Unknown site code, or not one of your sites.";
    const greaseCode = (cells.grease_code ?? "").toLowerCase();
    const greaseId = greaseCode ? greases.get(greaseCode) : undefined;
    if (greaseCode && !greaseId) errors.grease_code = "No grease with this code in the catalogue.";
    const asset = assetSchema.safeParse({ areaId: 1, tag: cells.asset_tag, name: cells.asset_name || cells.asset_tag, kind: cells.asset_kind || "other" });
    if (!asset.success) for (const issue of asset.error.issues) errors[FIELD_COLUMN[String(issue.path[0])] ?? "asset_tag"] ??= issue.message;
    if (!(cells.area_code ?? "").match(/^[A-Za-z0-9-]{1,16}$/)) errors.area_code = "Letters, digits and dashes, at most 16.";
    const point = pointSchema.safeParse({
      assetId: 1,
      name: cells.point_name,
      bearingType: cells.bearing_type,
      bearingDesignation: cells.bearing_designation,
      boreMm: cells.bore_mm,
      outsideDiameterMm: cells.outside_diameter_mm,
      widthMm: cells.width_mm,
      speedRpm: cells.speed_rpm,
      operatingTemperatureC: cells.operating_temperature_c,
      runningHoursPerDay: cells.running_hours_per_day || "24",
      verticalShaft: yes(cells.vertical_shaft ?? ""),
      contamination: cells.contamination || "low",
      moisture: cells.moisture || "low",
      vibration: cells.vibration || "low",
      foodGradeRequired: yes(cells.food_grade_required ?? ""),
      replenishment: cells.replenishment || "side",
      sealedForLife: yes(cells.sealed_for_life ?? ""),
      assignedGreaseId: greaseId,
      makerIntervalHours: cells.maker_interval_hours,
      makerQuantityGrams: cells.maker_quantity_grams,
    });
    if (!point.success) for (const issue of point.error.issues) errors[FIELD_COLUMN[String(issue.path[0])] ?? "point_name"] ??= issue.message;
    const ok = Object.keys(errors).length === 0 && point.success && siteId;
    return {
      line: index + 2,
      cells,
      errors,
      plan: ok
        ? {
            siteId: siteId!,
            areaCode: cells.area_code!.toUpperCase(),
            areaName: cells.area_name || cells.area_code!,
            assetTag: cells.asset_tag!,
            assetName: cells.asset_name || cells.asset_tag!,
            assetKind: asset.success ? asset.data.kind : "other",
            point: point.data, // assetId is a placeholder until the asset exists; set at commit
          }
        : undefined,
    };
  });
  return { problems: [], rows };
}

/** Writes the good rows in one transaction: new areas and assets first, then the points. All or nothing. */
export async function commitPlantRows(rows: PlantRow[], userId: string): Promise<{ points: number; assets: number; areas: number }> {
  const sequelize = getSequelize();
  const counts = { points: 0, assets: 0, areas: 0 };
  await sequelize.transaction(async (transaction) => {
    const areaIds = new Map<string, number>();
    const assetIds = new Map<string, number>();
    const now = new Date();
    for (const row of rows) {
      const plan = row.plan!;
      const areaKey = `${plan.siteId}:${plan.areaCode}`;
      let areaId = areaIds.get(areaKey);
      if (!areaId) {
        const [existing] = await sequelize.query<{ id: number }>("SELECT id FROM area WHERE site_id = ? AND code = ?", { replacements: [plan.siteId, plan.areaCode], type: QueryTypes.SELECT, transaction });
        if (existing) areaId = Number(existing.id);
        else {
          const [id] = await sequelize.query("INSERT INTO area (site_id, code, name, sort_order, created_at, updated_at) VALUES (?, ?, ?, 100, ?, ?)", {
            replacements: [plan.siteId, plan.areaCode, plan.areaName, now, now],
            type: QueryTypes.INSERT,
            transaction,
          });
          areaId = Number(id);
          counts.areas++;
        }
        areaIds.set(areaKey, areaId);
      }
      const assetKey = `${plan.siteId}:${plan.assetTag.toLowerCase()}`;
      let assetId = assetIds.get(assetKey);
      if (!assetId) {
        const [existing] = await sequelize.query<{ id: number }>("SELECT id FROM asset WHERE site_id = ? AND tag = ?", { replacements: [plan.siteId, plan.assetTag], type: QueryTypes.SELECT, transaction });
        assetId = existing ? Number(existing.id) : await createAsset({ areaId, tag: plan.assetTag, name: plan.assetName, kind: plan.assetKind }, userId, transaction);
        if (!existing) counts.assets++;
        assetIds.set(assetKey, assetId);
      }
      await savePoint({ ...plan.point, assetId }, userId, undefined, transaction);
      counts.points++;
    }
  });
  log("info", "plant_imported", { ...counts, by: userId });
  return counts;
}
