import type { Sequelize } from "sequelize";
import { tagCodeFrom } from "@/lib/domain/service";
import { seeded } from "./points";

/** The plant at full scale (issue: speed at plant scale): `size` 1 gives these counts, 0.01 a hundredth. */
export const FULL_SCALE = {
  sites: 2,
  points: 20_000,
  greases: 400,
  services: 1_000_000,
  movements: 300_000,
  incidents: 20_000,
} as const;

export interface ScaleCounts {
  sites: number;
  areas: number;
  assets: number;
  points: number;
  greases: number;
  lots: number;
  services: number;
  movements: number;
  incidents: number;
}

const THICKENERS = [
  "lithium_complex",
  "polyurea",
  "calcium_sulfonate",
  "lithium",
  "lithium_12_hydroxy",
  "aluminium_complex",
  "calcium_complex",
  "clay",
] as const;
const BASE_OILS = ["mineral", "mineral", "mineral", "pao", "ester", "pag"] as const;
const NLGI = ["1", "1.5", "2", "2", "2", "3"] as const;
const BEARINGS = [
  ["ball", 40, 90, 23, 1480],
  ["ball", 50, 110, 27, 1480],
  ["cylindrical_roller", 65, 140, 33, 1490],
  ["spherical_roller", 60, 110, 28, 990],
  ["spherical_roller", 100, 180, 46, 95],
  ["tapered_roller", 70, 150, 38, 300],
] as const;
const KINDS = ["motor", "pump", "fan", "conveyor", "gearbox", "crusher", "mill"] as const;
const DAY = 86_400_000;
const BATCH = 1000;

/**
 * Fills an empty, migrated database with a plant at scale, deterministically (the same `seed` gives the same rows):
 * sites, areas, assets and lube points, greases with packs, stock lots whose movement ledger sums to their stock,
 * three years of services and incidents with their first timeline step. Rows go in with multi-row INSERTs of a
 * thousand, each batch committed on its own, so a full run does not hold one huge transaction.
 */
export async function seedScale(
  sequelize: Sequelize,
  options: { size?: number; seed?: number; now?: Date } = {},
): Promise<ScaleCounts> {
  const size = options.size ?? 1;
  const now = options.now ?? new Date();
  const rand = seeded(options.seed ?? 20_261_202);
  const pick = <T>(list: readonly T[]) => list[Math.floor(rand() * list.length)]!;
  const scaled = (n: number, min: number) => Math.max(min, Math.round(n * size));
  const target = {
    points: scaled(FULL_SCALE.points, 40),
    greases: scaled(FULL_SCALE.greases, 12),
    services: scaled(FULL_SCALE.services, 200),
    movements: scaled(FULL_SCALE.movements, 100),
    incidents: scaled(FULL_SCALE.incidents, 20),
  };
  const ago = (days: number) => new Date(now.getTime() - days * DAY);
  const insert = async (table: string, columns: string[], rows: unknown[][]) => {
    for (let i = 0; i < rows.length; i += BATCH) {
      const chunk = rows.slice(i, i + BATCH);
      const row = `(${columns.map(() => "?").join(",")})`;
      await sequelize.query(
        `INSERT INTO ${table} (${columns.join(",")}) VALUES ${chunk.map(() => row).join(",")}`,
        { replacements: chunk.flat() },
      );
    }
  };
  const [existing] = (await sequelize.query("SELECT COUNT(*) AS n FROM site")) as [{ n: number }[], unknown];
  if (Number(existing[0]?.n ?? 0) > 0)
    throw new Error("The scale data goes into an empty, migrated database only.");
  // Ids are taken as consecutive from here: multi-row INSERTs into an empty table, with nothing else writing.
  const firstId = async (table: string) =>
    Number(
      (
        (await sequelize.query(`SELECT COALESCE(MAX(id), 0) + 1 AS n FROM ${table}`, { plain: true })) as {
          n: number;
        }
      ).n,
    );

  // Sites and the people who may see them.
  const siteBase = await firstId("site");
  await insert(
    "site",
    ["code", "name", "timezone", "created_at", "updated_at"],
    Array.from({ length: FULL_SCALE.sites }, (_, i) => [
      `SC${i + 1}`,
      `Scale Works ${i + 1}`,
      "UTC",
      now,
      now,
    ]),
  );
  const siteIds = Array.from({ length: FULL_SCALE.sites }, (_, i) => siteBase + i);
  const users = ["lead", "technician", "clerk", "auditor"].map((role, i) => ({
    id: `00000000-0000-4000-8000-${String(i + 1).padStart(12, "0")}`,
    role,
  }));
  await insert(
    "app_user",
    ["id", "email", "name", "role", "status", "unit_system", "created_at", "updated_at"],
    users.map((u) => [
      u.id,
      `scale-${u.role}@example.test`,
      `Scale ${u.role}`,
      u.role,
      "active",
      "metric",
      now,
      now,
    ]),
  );
  await insert(
    "user_site_access",
    ["user_id", "site_id", "created_at"],
    users.flatMap((u) => siteIds.map((s) => [u.id, s, now])),
  );
  const tech = users[1]!.id;
  const clerk = users[2]!.id;

  // Catalogue: suppliers, greases, a cartridge and a pail each.
  const supplierBase = await firstId("supplier");
  await insert(
    "supplier",
    ["name", "contact_email", "lead_time_days", "created_at", "updated_at"],
    Array.from({ length: 8 }, (_, i) => [
      `Scale Supplier ${i + 1}`,
      `orders${i + 1}@supplier.example.test`,
      7 + i * 3,
      now,
      now,
    ]),
  );
  const greaseBase = await firstId("grease");
  await insert(
    "grease",
    [
      "code",
      "name",
      "supplier_id",
      "thickener",
      "base_oil_type",
      "viscosity_40",
      "nlgi_grade",
      "food_grade",
      "shelf_life_months",
      "created_at",
      "updated_at",
    ],
    Array.from({ length: target.greases }, (_, i) => [
      `SC-${String(i + 1).padStart(4, "0")}`,
      `Scale Grease ${i + 1}`,
      supplierBase + (i % 8),
      pick(THICKENERS),
      pick(BASE_OILS),
      pick([68, 100, 150, 220, 320, 460]),
      pick(NLGI),
      i % 20 === 0 ? "H1" : "none",
      pick([24, 36, 48, 60]),
      now,
      now,
    ]),
  );
  const greaseIds = Array.from({ length: target.greases }, (_, i) => greaseBase + i);
  const packBase = await firstId("grease_pack");
  await insert(
    "grease_pack",
    ["grease_id", "kind", "net_mass_grams", "created_at"],
    greaseIds.flatMap((g) => [
      [g, "cartridge", 400, now],
      [g, "pail", 18_000, now],
    ]),
  );
  const cartridgeOf = (greaseIndex: number) => packBase + greaseIndex * 2;

  // Plant: ten areas a site, an asset for every four points.
  const areaBase = await firstId("area");
  // Interleaved by site, so assets taken in turn spread over every site.
  const areas = Array.from({ length: 10 }, (_, i) =>
    siteIds.map((s) => ({ site: s, code: `A${i + 1}` })),
  ).flat();
  await insert(
    "area",
    ["site_id", "code", "name", "sort_order", "created_at", "updated_at"],
    areas.map((a, i) => [a.site, a.code, `Area ${a.code}`, i, now, now]),
  );
  const assetCount = Math.ceil(target.points / 4);
  const assetBase = await firstId("asset");
  const assets = Array.from({ length: assetCount }, (_, i) => ({
    area: i % areas.length,
    kind: pick(KINDS),
  }));
  await insert(
    "asset",
    ["site_id", "area_id", "tag", "name", "kind", "created_at", "updated_at"],
    assets.map((a, i) => [
      areas[a.area]!.site,
      areaBase + a.area,
      `SA-${i + 1}`,
      `${a.kind} ${i + 1}`,
      a.kind,
      now,
      now,
    ]),
  );
  const pointBase = await firstId("lube_point");
  const tags = new Set<string>();
  const points = Array.from({ length: target.points }, (_, i) => {
    const asset = Math.floor(i / 4);
    const [type, d, D, B, rpm] = pick(BEARINGS);
    let tag = tagCodeFrom(Uint8Array.from({ length: 8 }, () => Math.floor(rand() * 256)));
    while (tags.has(tag)) tag = tagCodeFrom(Uint8Array.from({ length: 8 }, () => Math.floor(rand() * 256)));
    tags.add(tag);
    const grease = Math.floor(rand() * target.greases);
    const interval = pick([500, 1000, 2000, 4000, 8000]);
    const last = ago(rand() * 120);
    return {
      site: areas[assets[asset]!.area]!.site,
      asset,
      tag,
      type,
      d,
      D,
      B,
      rpm,
      grease,
      interval,
      quantity: Math.round(0.005 * D * B * 10) / 10,
      last,
    };
  });
  await insert(
    "lube_point",
    [
      "site_id",
      "asset_id",
      "tag_code",
      "name",
      "bearing_type",
      "bore_mm",
      "outside_diameter_mm",
      "width_mm",
      "speed_rpm",
      "running_hours_per_day",
      "assigned_grease_id",
      "current_grease_id",
      "interval_hours",
      "quantity_grams",
      "last_serviced_at",
      "next_due_at",
      "route_order",
      "created_at",
      "updated_at",
    ],
    points.map((p, i) => [
      p.site,
      assetBase + p.asset,
      p.tag,
      `Point ${i + 1}`,
      p.type,
      p.d,
      p.D,
      p.B,
      p.rpm,
      24,
      greaseIds[p.grease],
      greaseIds[p.grease],
      p.interval,
      p.quantity,
      p.last,
      new Date(p.last.getTime() + (p.interval / 24) * DAY),
      i % 500,
      now,
      now,
    ]),
  );

  // Stock: two storage locations a site; lots whose receipts and issues make up the movement ledger.
  const locationBase = await firstId("storage_location");
  await insert(
    "storage_location",
    ["site_id", "code", "name", "created_at"],
    siteIds.flatMap((s) => [
      [s, "STORE", "Main store", now],
      [s, "CAB", "Area cabinet", now],
    ]),
  );
  const lotsNeeded = Math.max(4, Math.round(target.movements / 25));
  const lotBase = await firstId("stock_lot");
  const lots = Array.from({ length: lotsNeeded }, (_, i) => {
    const site = i % siteIds.length;
    const grease = Math.floor(rand() * target.greases);
    const received = ago(30 + rand() * 1000);
    return {
      site: siteIds[site]!,
      location: locationBase + site * 2 + (i % 2),
      grease,
      received,
      received_qty: 0,
      on_hand: 0,
      label: tagCodeFrom(Uint8Array.from({ length: 8 }, () => Math.floor(rand() * 256))),
    };
  });
  const movements: unknown[][] = [];
  const perLot = Math.floor(target.movements / lots.length);
  lots.forEach((lot, i) => {
    const issues = Math.max(
      0,
      (i === lots.length - 1 ? target.movements - perLot * (lots.length - 1) : perLot) - 1,
    );
    lot.received_qty = issues + 1 + Math.floor(rand() * 20);
    lot.on_hand = lot.received_qty - issues;
    movements.push([lot.site, lotBase + i, "receipt", lot.received_qty, clerk, null, lot.received]);
    for (let k = 0; k < issues; k++)
      movements.push([
        lot.site,
        lotBase + i,
        "issue",
        -1,
        tech,
        null,
        new Date(lot.received.getTime() + rand() * (now.getTime() - lot.received.getTime())),
      ]);
  });
  await insert(
    "stock_lot",
    [
      "site_id",
      "grease_id",
      "pack_id",
      "location_id",
      "lot_number",
      "label_code",
      "expires_on",
      "expiry_source",
      "received_on",
      "on_hand",
      "created_at",
      "updated_at",
    ],
    lots.map((l, i) => [
      l.site,
      greaseIds[l.grease],
      cartridgeOf(l.grease),
      l.location,
      `SL${i + 1}`,
      l.label,
      new Date(l.received.getTime() + 3 * 365 * DAY).toISOString().slice(0, 10),
      "shelf_life_from_receipt",
      l.received.toISOString().slice(0, 10),
      l.on_hand,
      now,
      now,
    ]),
  );
  await insert(
    "stock_movement",
    ["site_id", "lot_id", "kind", "quantity", "user_id", "reason", "created_at"],
    movements,
  );

  // Three years of services, and the incidents among them.
  const services: unknown[][] = [];
  for (let i = 0; i < target.services; i++) {
    const p = Math.floor(rand() * points.length);
    const point = points[p]!;
    services.push([
      point.site,
      pointBase + p,
      greaseIds[point.grease],
      point.quantity,
      point.quantity,
      "ok",
      tech,
      ago(rand() * 3 * 365),
    ]);
    if (services.length === BATCH * 10) {
      await insert(
        "service_record",
        [
          "site_id",
          "point_id",
          "grease_id",
          "grams",
          "planned_grams",
          "quantity_flag",
          "performed_by",
          "performed_at",
        ],
        services.splice(0),
      );
    }
  }
  await insert(
    "service_record",
    [
      "site_id",
      "point_id",
      "grease_id",
      "grams",
      "planned_grams",
      "quantity_flag",
      "performed_by",
      "performed_at",
    ],
    services,
  );
  const incidentBase = await firstId("mixing_incident");
  const incidents = Array.from({ length: target.incidents }, () => {
    const p = Math.floor(rand() * points.length);
    const state = pick(["open", "investigating", "closed", "closed", "closed"] as const);
    return {
      point: p,
      site: points[p]!.site,
      state,
      at: ago(rand() * 3 * 365),
      offered: greaseIds[Math.floor(rand() * target.greases)]!,
    };
  });
  await insert(
    "mixing_incident",
    [
      "site_id",
      "point_id",
      "kind",
      "grease_in_point_id",
      "grease_offered_id",
      "verdict",
      "reasons_json",
      "state",
      "root_cause",
      "corrective_action",
      "opened_by",
      "opened_at",
      "closed_by",
      "closed_at",
    ],
    incidents.map((x) => [
      x.site,
      pointBase + x.point,
      pick(["refused_mix", "refused_mix", "changeover_exception", "found_after_fact"]),
      greaseIds[points[x.point]!.grease],
      x.offered,
      pick(["incompatible", "unknown", "borderline"]),
      "[]",
      x.state,
      x.state === "closed" ? "Wrong cartridge taken from the cabinet." : null,
      x.state === "closed" ? "Cabinet relabelled; point purged with the assigned grease." : null,
      tech,
      x.at,
      x.state === "closed" ? users[0]!.id : null,
      x.state === "closed" ? new Date(x.at.getTime() + 2 * DAY) : null,
    ]),
  );
  await insert(
    "incident_event",
    ["incident_id", "at", "actor_id", "kind", "note"],
    incidents.map((x, i) => [incidentBase + i, x.at, tech, "opened", null]),
  );

  return {
    sites: siteIds.length,
    areas: areas.length,
    assets: assetCount,
    points: points.length,
    greases: target.greases,
    lots: lots.length,
    services: target.services,
    movements: movements.length,
    incidents: incidents.length,
  };
}
