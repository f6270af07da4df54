import "server-only";
import { QueryTypes } from "sequelize";
import { trendWeeks } from "@/lib/domain/consumption";
import { isBelowReorderPoint } from "@/lib/domain/inventory";
import { getSequelize } from "../db";
import { reorderPointGrams } from "./stock";
import { userSiteIds } from "./users";

/** Lead time used when a supplier has none recorded, as in the stock list and the reorder check. */
const DEFAULT_LEAD_TIME_DAYS = 14;

export interface WeekUse {
  /** Monday of the week, UTC, "YYYY-MM-DD". */
  weekStart: string;
  /** Grease put into lube points that week (service records). */
  appliedGrams: number;
  /** Grease issued from the store that week (issue movements × pack mass). */
  issuedGrams: number;
}

export interface GreaseStockChart {
  greaseId: number;
  code: string;
  name: string;
  onHandGrams: number;
  reorderPointGrams: number;
  belowReorderPoint: boolean;
  /** The lubrication schedule's forecast use. */
  forecastGramsPerWeek: number;
  weekly: WeekUse[];
}

export interface SiteStockChart {
  siteId: number;
  code: string;
  name: string;
  /** Greases with stock on hand or a reorder point above zero, by name. */
  greases: GreaseStockChart[];
  /** All greases of the site together, including those not listed in `greases`. */
  weekly: WeekUse[];
  /** The schedule's forecast for every grease assigned to a point at the site. */
  forecastGramsPerWeek: number;
}

type Key = `${number}:${number}`;
const key = (siteId: number, greaseId: number): Key => `${siteId}:${greaseId}`;

/**
 * On hand against reorder point per grease, and grease applied and issued per week (the last 12 whole weeks
 * and the current one), for each site the user may see. One transaction, so the grouped queries and the
 * reorder points read the same snapshot.
 */
export async function stockChartData(userId: string, now = new Date()): Promise<SiteStockChart[]> {
  const sites = await userSiteIds(userId);
  const weeks = trendWeeks(now);
  if (!sites.length || !weeks) return [];
  const sequelize = getSequelize();
  const range = { sites, from: weeks.from, to: weeks.to };

  return sequelize.transaction(async (transaction) => {
    const select = <T extends object>(sql: string) =>
      sequelize.query<T>(sql, { replacements: range, type: QueryTypes.SELECT, transaction });

    const siteRows = await select<{ id: number; code: string; name: string }>(
      "SELECT id, code, name FROM site WHERE id IN (:sites) ORDER BY name",
    );
    const onHandRows = await select<{ site_id: number; grease_id: number; grams: string | null }>(
      `SELECT l.site_id, l.grease_id, SUM(l.on_hand * p.net_mass_grams) AS grams
       FROM stock_lot l JOIN grease_pack p ON p.id = l.pack_id WHERE l.site_id IN (:sites) GROUP BY l.site_id, l.grease_id`,
    );
    // Greases that may have a reorder point without stock: assigned to a point, or given a fixed one by the lead.
    const plannedRows = await select<{ site_id: number; grease_id: number }>(
      `SELECT site_id, assigned_grease_id AS grease_id FROM lube_point WHERE site_id IN (:sites) AND assigned_grease_id IS NOT NULL
       UNION SELECT site_id, grease_id FROM stock_policy WHERE site_id IN (:sites) AND reorder_point_grams > 0`,
    );
    // WEEKDAY() is 0 on Monday; the columns hold UTC (the connection's time zone is +00:00).
    const appliedRows = await select<{
      site_id: number;
      grease_id: number;
      week_start: string;
      grams: string;
    }>(
      `SELECT site_id, grease_id, DATE_FORMAT(DATE(performed_at) - INTERVAL WEEKDAY(performed_at) DAY, '%Y-%m-%d') AS week_start, SUM(grams) AS grams
       FROM service_record WHERE site_id IN (:sites) AND performed_at >= :from AND performed_at < :to
       GROUP BY site_id, grease_id, week_start`,
    );
    // Issue movements carry a negative quantity of containers; the pack mass is unsigned, so cast it before multiplying.
    const issuedRows = await select<{
      site_id: number;
      grease_id: number;
      week_start: string;
      grams: string;
    }>(
      `SELECT m.site_id, l.grease_id, DATE_FORMAT(DATE(m.created_at) - INTERVAL WEEKDAY(m.created_at) DAY, '%Y-%m-%d') AS week_start,
              -SUM(m.quantity * CAST(p.net_mass_grams AS SIGNED)) AS grams
       FROM stock_movement m JOIN stock_lot l ON l.id = m.lot_id JOIN grease_pack p ON p.id = l.pack_id
       WHERE m.site_id IN (:sites) AND m.kind = 'issue' AND m.created_at >= :from AND m.created_at < :to
       GROUP BY m.site_id, l.grease_id, week_start`,
    );

    const onHand = new Map<Key, number>(
      onHandRows.map((r) => [key(Number(r.site_id), Number(r.grease_id)), Number(r.grams ?? 0)]),
    );
    const candidates = new Set<Key>([
      ...onHand.keys(),
      ...plannedRows.map((r) => key(Number(r.site_id), Number(r.grease_id))),
    ]);
    const greaseIds = [...new Set([...candidates].map((k) => Number(k.split(":")[1])))];
    const greaseRows = greaseIds.length
      ? await sequelize.query<{ id: number; code: string; name: string; lead: number | null }>(
          "SELECT g.id, g.code, g.name, s.lead_time_days AS lead FROM grease g JOIN supplier s ON s.id = g.supplier_id WHERE g.id IN (:ids)",
          { replacements: { ids: greaseIds }, type: QueryTypes.SELECT, transaction },
        )
      : [];
    const greases = new Map(
      greaseRows.map((g) => [
        Number(g.id),
        {
          code: g.code,
          name: g.name,
          leadTimeDays: g.lead === null ? DEFAULT_LEAD_TIME_DAYS : Number(g.lead),
        },
      ]),
    );

    const weekIndex = new Map(weeks.weekStarts.map((w, i) => [w, i]));
    const emptyWeeks = (): WeekUse[] =>
      weeks.weekStarts.map((weekStart) => ({ weekStart, appliedGrams: 0, issuedGrams: 0 }));
    const perGrease = new Map<Key, WeekUse[]>();
    const perSite = new Map<number, WeekUse[]>(sites.map((s) => [s, emptyWeeks()]));
    const add = (
      rows: { site_id: number; grease_id: number; week_start: string; grams: string }[],
      field: "appliedGrams" | "issuedGrams",
    ) => {
      for (const r of rows) {
        const i = weekIndex.get(r.week_start);
        if (i === undefined) continue;
        const k = key(Number(r.site_id), Number(r.grease_id));
        if (!perGrease.has(k)) perGrease.set(k, emptyWeeks());
        perGrease.get(k)![i]![field] += Number(r.grams);
        const site = perSite.get(Number(r.site_id));
        if (site) site[i]![field] += Number(r.grams);
      }
    };
    add(appliedRows, "appliedGrams");
    add(issuedRows, "issuedGrams");

    const bySite = new Map<number, GreaseStockChart[]>(sites.map((s) => [s, []]));
    const siteForecast = new Map<number, number>();
    // reorderPointGrams reads one grease at a time (policy and points); kept so the chart agrees with the table and the mail.
    for (const k of candidates) {
      const [siteId, greaseId] = k.split(":").map(Number) as [number, number];
      const grease = greases.get(greaseId);
      if (!grease) continue;
      const rp = await reorderPointGrams(siteId, greaseId, grease.leadTimeDays, now, transaction);
      const grams = onHand.get(k) ?? 0;
      siteForecast.set(siteId, (siteForecast.get(siteId) ?? 0) + rp.gramsPerWeek);
      if (grams <= 0 && rp.grams <= 0) continue;
      bySite.get(siteId)?.push({
        greaseId,
        code: grease.code,
        name: grease.name,
        onHandGrams: grams,
        reorderPointGrams: rp.grams,
        belowReorderPoint: isBelowReorderPoint(grams, rp.grams),
        forecastGramsPerWeek: rp.gramsPerWeek,
        weekly: perGrease.get(k) ?? emptyWeeks(),
      });
    }

    return siteRows.map((s) => {
      const list = (bySite.get(Number(s.id)) ?? []).sort((a, b) => a.name.localeCompare(b.name));
      return {
        siteId: Number(s.id),
        code: s.code,
        name: s.name,
        greases: list,
        weekly: perSite.get(Number(s.id)) ?? emptyWeeks(),
        forecastGramsPerWeek: siteForecast.get(Number(s.id)) ?? 0,
      };
    });
  });
}
