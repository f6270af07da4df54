import { QueryTypes, type Sequelize, type Transaction } from "sequelize";
import type { BearingType, Level } from "@/lib/domain/relubrication";
import { nextDueAt } from "@/lib/domain/relubrication";
import { tagCodeFrom } from "@/lib/domain/service";
import { planPoint } from "@/lib/server/plan";
import { getGrease, type GreaseDto } from "@/lib/server/queries/greases";

/** A small deterministic random generator (mulberry32), so the demo is the same on every machine. */
export function seeded(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

type AssetKind = "motor" | "pump" | "fan" | "conveyor" | "gearbox" | "crusher" | "mill";

/** Bearing sizes typical of each machine (invented but realistic: d, D, B in mm; designation as commonly printed). */
const BEARINGS: Record<AssetKind, { type: BearingType; d: number; D: number; B: number; designation: string; rpm: number }[]> = {
  motor: [
    { type: "ball", d: 40, D: 90, B: 23, designation: "6308", rpm: 1480 },
    { type: "ball", d: 50, D: 110, B: 27, designation: "6310", rpm: 1480 },
    { type: "cylindrical_roller", d: 65, D: 140, B: 33, designation: "NU313", rpm: 1490 },
  ],
  pump: [
    { type: "ball", d: 45, D: 100, B: 25, designation: "6309", rpm: 2950 },
    { type: "ball", d: 35, D: 80, B: 21, designation: "6307", rpm: 2950 },
  ],
  fan: [
    { type: "spherical_roller", d: 60, D: 110, B: 28, designation: "22212", rpm: 990 },
    { type: "spherical_roller", d: 80, D: 140, B: 33, designation: "22216", rpm: 740 },
  ],
  conveyor: [
    { type: "spherical_roller", d: 100, D: 180, B: 46, designation: "22220", rpm: 95 },
    { type: "spherical_roller", d: 90, D: 160, B: 40, designation: "22218", rpm: 120 },
  ],
  gearbox: [{ type: "tapered_roller", d: 70, D: 150, B: 38, designation: "31314", rpm: 300 }],
  crusher: [{ type: "spherical_roller", d: 140, D: 250, B: 68, designation: "22228", rpm: 400 }],
  mill: [{ type: "spherical_roller", d: 220, D: 400, B: 108, designation: "22244", rpm: 16 }],
};

const SITE_PLAN = {
  KBC: {
    areas: [
      ["RAW", "Quarry and raw mill"],
      ["KLN", "Kiln and cooler"],
      ["CEM", "Cement mills"],
      ["PCK", "Packing and dispatch"],
    ],
    assets: 72,
  },
  MFW: {
    areas: [
      ["INT", "Intake and screens"],
      ["AER", "Aeration basins"],
      ["SLG", "Sludge handling"],
    ],
    assets: 36,
  },
} as const;

const KIND_BY_AREA: Record<string, AssetKind[]> = {
  RAW: ["crusher", "conveyor", "motor", "mill"],
  KLN: ["fan", "motor", "gearbox", "conveyor"],
  CEM: ["mill", "motor", "fan", "gearbox"],
  PCK: ["conveyor", "motor", "fan"],
  INT: ["pump", "motor", "conveyor"],
  AER: ["fan", "motor", "pump"],
  SLG: ["pump", "motor", "conveyor"],
};

const GREASE_FOR: Record<AssetKind, string> = {
  motor: "GL-EM2",
  pump: "GL-LX2",
  fan: "GL-LX220",
  conveyor: "GL-MP2",
  gearbox: "GL-LX220",
  crusher: "GL-CS2",
  mill: "GL-CX2",
};

const NAMES: Record<AssetKind, string> = {
  motor: "Drive motor",
  pump: "Pump",
  fan: "Fan",
  conveyor: "Belt conveyor",
  gearbox: "Gear unit",
  crusher: "Crusher",
  mill: "Ball mill",
};

/**
 * A few dozen assets and a few hundred lube points on the two sites, three months of services, some points
 * overdue, a changeover under way and one refused service with its incident.
 */
export async function seedPoints(sequelize: Sequelize, t: Transaction, now: Date, users: { techId: string; leadId: string }): Promise<void> {
  const rand = seeded(20261201);
  const pick = <T>(list: readonly T[]) => list[Math.floor(rand() * list.length)]!;
  const q = (sql: string, replacements: unknown[]) => sequelize.query(sql, { replacements, transaction: t, type: QueryTypes.INSERT });
  const greaseIds = new Map<string, number>(
    (await sequelize.query<{ id: number; code: string }>("SELECT id, code FROM grease", { type: QueryTypes.SELECT, transaction: t })).map((g) => [g.code, Number(g.id)]),
  );
  const greases = new Map<number, GreaseDto>();
  for (const id of greaseIds.values()) greases.set(id, (await getGrease(id, t))!);
  const sites = await sequelize.query<{ id: number; code: keyof typeof SITE_PLAN }>("SELECT id, code FROM site", { type: QueryTypes.SELECT, transaction: t });

  const DAY = 86_400_000;
  for (const site of sites) {
    const plan = SITE_PLAN[site.code];
    if (!plan) continue;
    for (const gun of [
      ["Gun A (blue grip)", 1.2],
      ["Gun B (red grip)", 0.9],
    ] as const) {
      await q("INSERT INTO grease_gun (site_id, label, grams_per_stroke, calibrated_on, created_at) VALUES (?, ?, ?, ?, ?)", [site.id, gun[0], gun[1], new Date(now.getTime() - 40 * DAY).toISOString().slice(0, 10), now]);
    }
    const areaIds: { id: number; code: string }[] = [];
    for (const [i, [code, name]] of plan.areas.entries()) {
      const [id] = await q("INSERT INTO area (site_id, code, name, sort_order, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?)", [site.id, code, name, i, now, now]);
      areaIds.push({ id: Number(id), code });
    }
    for (let a = 0; a < plan.assets; a++) {
      const area = areaIds[a % areaIds.length]!;
      const kind = pick(KIND_BY_AREA[area.code]!);
      const tag = `${site.code}-${area.code}-${String(a + 1).padStart(3, "0")}`;
      const [assetId] = await q("INSERT INTO asset (site_id, area_id, tag, name, kind, frame_size, created_at, updated_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)", [
        site.id, area.id, tag, `${NAMES[kind]} ${a + 1}`, kind, kind === "motor" ? pick(["280M", "315S", "225M"]) : null, now, now,
      ]);
      const bearings = BEARINGS[kind];
      const positions = kind === "motor" ? ["drive end", "non-drive end"] : kind === "conveyor" ? ["head pulley DE", "head pulley NDE", "tail pulley DE", "tail pulley NDE"] : ["drive side", "free side", "bearing 3", "bearing 4"].slice(0, kind === "mill" ? 2 : kind === "fan" ? 2 : 3);
      for (const [pi, position] of positions.entries()) {
        const b = bearings[pi % bearings.length]!;
        const foodGrade = area.code === "PCK" && pi === 0 && a % 3 === 0;
        const greaseCode = foodGrade ? "GL-FG2" : GREASE_FOR[kind];
        const greaseId = greaseIds.get(greaseCode)!;
        const temperature = kind === "fan" && area.code === "KLN" ? 85 : kind === "mill" ? 70 : 40 + Math.round(rand() * 25);
        const sealed = kind === "pump" && pi === 1 && a % 4 === 0;
        const input = {
          bearingType: b.type,
          boreMm: b.d,
          outsideDiameterMm: b.D,
          widthMm: b.B,
          speedRpm: b.rpm,
          operatingTemperatureC: temperature,
          verticalShaft: kind === "pump" && a % 5 === 0,
          contamination: (area.code === "RAW" || area.code === "CEM" ? pick(["moderate", "high"]) : "low") as Level,
          moisture: (area.code === "AER" || area.code === "INT" ? "moderate" : "low") as Level,
          vibration: (kind === "crusher" ? "high" : "low") as Level,
          replenishment: b.type === "spherical_roller" && b.d >= 100 ? ("centre" as const) : ("side" as const),
        };
        // Site practice: slow bearings whose calculated interval exceeds a year are greased at least twice a year.
        const calculated = planPoint(input, greases.get(greaseId) ?? null, foodGrade);
        const longOverride = calculated.interval.intervalHours !== null && calculated.interval.intervalHours > 8760 ? 4380 : null;
        const computed = longOverride ? planPoint({ ...input, intervalHoursOverride: longOverride }, greases.get(greaseId) ?? null, foodGrade) : calculated;
        const interval = computed.effectiveInterval.value;
        const quantity = computed.effectiveQuantity.value;
        const hoursPerDay = kind === "conveyor" ? 16 : 24;
        // Service history: the last few services at the planned interval, the newest within the last three months.
        let last: Date | null = null;
        const services: { at: Date; grams: number }[] = [];
        if (!sealed && interval) {
          const gapMs = (interval / hoursPerDay) * DAY;
          const overdue = rand() < 0.1;
          let at = new Date(now.getTime() - (overdue ? gapMs * (1.05 + rand() * 0.4) : gapMs * rand() * 0.95));
          for (let k = 0; k < 6 && (k === 0 || now.getTime() - at.getTime() < 95 * DAY); k++) {
            services.unshift({ at, grams: Math.max(1, Math.round((quantity ?? 10) * (0.85 + rand() * 0.3))) });
            at = new Date(at.getTime() - gapMs);
          }
          last = services.at(-1)?.at ?? null;
        }
        const due = last && interval ? nextDueAt({ lastServicedAt: last, intervalHours: interval, runningHoursPerDay: hoursPerDay }) : null;
        const [pointId] = await q(
          `INSERT INTO lube_point (site_id, asset_id, tag_code, name, bearing_type, bearing_designation, bore_mm, outside_diameter_mm, width_mm, speed_rpm,
             operating_temperature_c, running_hours_per_day, vertical_shaft, contamination, moisture, vibration, food_grade_required, replenishment,
             sealed_for_life, assigned_grease_id, current_grease_id, interval_hours_override, override_reason, interval_hours, quantity_grams,
             last_serviced_at, next_due_at, route_order, created_at, updated_at)
           VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)`,
          [
            site.id, assetId, tagCodeFrom(randomBytesFrom(rand)), `${NAMES[kind]} ${a + 1} — ${position}`, b.type, b.designation, b.d, b.D, b.B, b.rpm,
            temperature, hoursPerDay, input.verticalShaft, input.contamination, input.moisture, input.vibration, foodGrade, input.replenishment,
            sealed, sealed ? null : greaseId, sealed ? null : greaseId, longOverride, longOverride ? "Site practice: at least twice a year" : null, sealed ? null : interval, sealed ? null : quantity,
            last, sealed ? null : due, pi, now, now,
          ],
        );
        for (const s of services) {
          await q(
            `INSERT INTO service_record (site_id, point_id, grease_id, grams, strokes, gun_id, planned_grams, quantity_flag, performed_by, performed_at)
             VALUES (?, ?, ?, ?, NULL, NULL, ?, 'ok', ?, ?)`,
            [site.id, pointId, greaseId, s.grams, quantity, users.techId, s.at],
          );
        }
      }
    }
  }

  // A motor whose maker's plate gives its own values (they win over the calculator).
  await sequelize.query(
    `UPDATE lube_point SET maker_interval_hours = 4000, maker_quantity_grams = 20, maker_note = 'Lubrication plate: 20 g every 4000 h, polyurea grease',
       interval_hours = 4000, quantity_grams = 20 WHERE name = 'Drive motor 3 — drive end' LIMIT 1`,
    { transaction: t },
  );

  // A changeover under way: a kiln fan bearing moving from lithium complex to calcium sulfonate by purging.
  const [fan] = await sequelize.query<{ id: number; site_id: number; assigned_grease_id: number }>(
    "SELECT id, site_id, assigned_grease_id FROM lube_point WHERE name LIKE 'Fan%' AND assigned_grease_id IS NOT NULL ORDER BY id LIMIT 1",
    { type: QueryTypes.SELECT, transaction: t },
  );
  if (fan) {
    await q(
      `INSERT INTO changeover (site_id, point_id, from_grease_id, to_grease_id, method, shortened_interval_hours, services_planned, services_done, state, notes, planned_by, created_at)
       VALUES (?, ?, ?, ?, 'purge', 500, 3, 1, 'in_progress', 'Hot bearing: move to calcium sulfonate. Purge through the drain plug.', ?, ?)`,
      [fan.site_id, fan.id, fan.assigned_grease_id, greaseIds.get("GL-CS2"), users.leadId, new Date(now.getTime() - 10 * DAY)],
    );
  }

  // One refused service with its incident: a technician offered a polyurea grease to a lithium-complex pump.
  const [pump] = await sequelize.query<{ id: number; site_id: number; current_grease_id: number }>(
    "SELECT id, site_id, current_grease_id FROM lube_point WHERE name LIKE 'Pump%' AND current_grease_id IS NOT NULL ORDER BY id LIMIT 1",
    { type: QueryTypes.SELECT, transaction: t },
  );
  if (pump) {
    const reasons = [
      { kind: "thickener", verdict: "incompatible", message: "Lithium complex and polyurea thickeners are incompatible according to FIST 2-4 Table 2." },
    ];
    await q(
      `INSERT INTO mixing_incident (site_id, point_id, kind, grease_in_point_id, grease_offered_id, verdict, reasons_json, state, opened_by, opened_at)
       VALUES (?, ?, 'refused_mix', ?, ?, 'incompatible', ?, 'open', ?, ?)`,
      [pump.site_id, pump.id, pump.current_grease_id, greaseIds.get("GL-EM2"), JSON.stringify(reasons), users.techId, new Date(now.getTime() - 2 * DAY)],
    );
  }
}

function randomBytesFrom(rand: () => number): Uint8Array {
  // Deterministic tag codes for the demo; production points get crypto-random codes.
  const bytes = new Uint8Array(8);
  for (let i = 0; i < 8; i++) bytes[i] = Math.floor(rand() * 256);
  return bytes;
}

