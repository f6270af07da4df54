import { formatNumber } from "../units/format-number";
import { MS_PER_WEEK, isPositive, isValidDate, isoDay } from "./quantities";
import { SOURCE_REORDER_DESIGN_NOTE } from "./sources";
import type { CalcStep, DemandPoint, GreaseDemand, PlannedPurge, WeeklyDemandOptions } from "./types";

/** Forecast horizon over which planned purges are spread: 13 weeks (a quarter). Common practice, no source. */
export const DEFAULT_FORECAST_WEEKS = 13;

/** Groups of identical points written out one step each; the rest are summed in one step. Our choice. */
const MAX_LISTED_GROUPS = 10;

interface PointGroup {
  count: number;
  quantityGrams: number;
  intervalHours: number;
  hoursPerDay: number;
}

interface Tally {
  groups: Map<string, PointGroup>;
  sealed: number;
  noInterval: number;
  noQuantity: number;
  hoursAssumed: number;
  purges: PlannedPurge[];
}

function emptyTally(): Tally {
  return { groups: new Map(), sealed: 0, noInterval: 0, noQuantity: 0, hoursAssumed: 0, purges: [] };
}

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

/** count × quantity × running hours per week ÷ interval; multiplying first keeps 10 × 20 × 168 ÷ 2000 = 16.8 exact. */
function groupGramsPerWeek(g: PointGroup): number {
  return (g.count * g.quantityGrams * g.hoursPerDay * 7) / g.intervalHours;
}

/**
 * Decides how many grams of each grease a plant will use per week: planned relubrication plus planned purges.
 *
 * Relubrication (domain.md §10.3 design note): for each grease, Σ over its points of
 * quantityGrams ÷ intervalHours × running hours per week, with running hours per week = runningHoursPerDay × 7.
 * Planned changeover purges whose date lies in [from, from + weeks × 7 days) are added, spread evenly over the
 * horizon (Σ purge grams ÷ weeks).
 *
 * Skipped, never producing NaN or a negative figure:
 * - sealed-for-life points (a step counts them);
 * - points whose interval or quantity is not a positive number (a warning counts them), and points whose
 *   quantity ÷ interval overflows to ∞ (e.g. an interval of 1e-320 h; warning);
 * - purges whose grams are not a positive number or whose date is invalid or outside the horizon;
 * - all purges when `options.from` is missing or invalid (a warning says so: there is no horizon to place them in).
 * A runningHoursPerDay above 24 is taken as 24; zero, negative or not a number is also taken as 24 (warning), as
 * nextDueAt does: the point is serviced on that assumption, so the store must hold its grease. A `weeks` that is
 * not a positive number is taken as DEFAULT_FORECAST_WEEKS (warning).
 *
 * @returns one entry per grease named by any point or purge (in order of first mention), with `gramsPerWeek`
 *   ≥ 0 (0 when everything was skipped), not rounded, and the working in `steps`.
 */
export function weeklyDemand(
  points: readonly DemandPoint[],
  purges: readonly PlannedPurge[] = [],
  options?: WeeklyDemandOptions,
): Map<number, GreaseDemand> {
  const tallies = new Map<number, Tally>();
  const tallyOf = (greaseId: number): Tally => {
    let t = tallies.get(greaseId);
    if (!t) {
      t = emptyTally();
      tallies.set(greaseId, t);
    }
    return t;
  };

  for (const p of points) {
    const t = tallyOf(p.greaseId);
    if (p.sealedForLife === true) {
      t.sealed += 1;
      continue;
    }
    if (!isPositive(p.intervalHours)) {
      t.noInterval += 1;
      continue;
    }
    if (!isPositive(p.quantityGrams)) {
      t.noQuantity += 1;
      continue;
    }
    let hoursPerDay = p.runningHoursPerDay;
    if (!isPositive(hoursPerDay) || hoursPerDay > 24) {
      t.hoursAssumed += 1;
      hoursPerDay = 24;
    }
    const key = `${p.quantityGrams}|${p.intervalHours}|${hoursPerDay}`;
    const g = t.groups.get(key);
    if (g) g.count += 1;
    else t.groups.set(key, { count: 1, quantityGrams: p.quantityGrams, intervalHours: p.intervalHours, hoursPerDay });
  }
  for (const purge of purges) tallyOf(purge.greaseId).purges.push(purge);

  const from = options?.from;
  const hasHorizon = isValidDate(from);
  const weeksGiven = options?.weeks;
  const weeksValid = weeksGiven === undefined || isPositive(weeksGiven);
  const weeks = weeksGiven !== undefined && isPositive(weeksGiven) ? weeksGiven : DEFAULT_FORECAST_WEEKS;

  const result = new Map<number, GreaseDemand>();
  for (const [greaseId, t] of tallies) {
    const steps: CalcStep[] = [];
    const warnings: string[] = [];

    let relubGramsPerWeek = 0;
    let listed = 0;
    let otherPoints = 0;
    let otherGroups = 0;
    let otherGramsPerWeek = 0;
    let overflowPoints = 0;
    for (const g of t.groups.values()) {
      const gramsPerWeek = groupGramsPerWeek(g);
      // An interval of a denormal number of hours, or a sum of absurd quantities, overflows to ∞: not counted.
      if (!Number.isFinite(gramsPerWeek) || !Number.isFinite(relubGramsPerWeek + gramsPerWeek)) {
        overflowPoints += g.count;
        continue;
      }
      relubGramsPerWeek += gramsPerWeek;
      if (listed < MAX_LISTED_GROUPS) {
        listed += 1;
        steps.push({
          label:
            `${plural(g.count, "point")}: ${formatNumber(g.quantityGrams, 3)} g every ` +
            `${formatNumber(g.intervalHours, 2)} h, running ${formatNumber(g.hoursPerDay, 2)} h/day`,
          value:
            `${g.count} × ${formatNumber(g.quantityGrams, 3)} g ÷ ${formatNumber(g.intervalHours, 2)} h × ` +
            `${formatNumber(g.hoursPerDay * 7, 2)} h/week = ${formatNumber(gramsPerWeek, 3)} g/week`,
        });
      } else {
        otherPoints += g.count;
        otherGroups += 1;
        otherGramsPerWeek += gramsPerWeek;
      }
    }
    if (otherGroups > 0) {
      steps.push({
        label: `${plural(otherPoints, "other point")} (${plural(otherGroups, "other quantity and interval", "other quantities and intervals")})`,
        value: `Σ quantity ÷ interval × running hours per week = ${formatNumber(otherGramsPerWeek, 3)} g/week`,
      });
    }
    if (t.groups.size > 1) {
      steps.push({
        label: "Relubrication demand (Σ quantity ÷ interval × running hours per week)",
        value: `${formatNumber(relubGramsPerWeek, 3)} g/week (${SOURCE_REORDER_DESIGN_NOTE})`,
      });
    }
    if (t.sealed > 0) {
      steps.push({ label: "Sealed for life, not counted", value: plural(t.sealed, "point") });
    }
    if (t.noInterval > 0) {
      warnings.push(`${plural(t.noInterval, "point")} without a positive relubrication interval not counted.`);
    }
    if (t.noQuantity > 0) {
      warnings.push(`${plural(t.noQuantity, "point")} without a positive quantity of grease not counted.`);
    }
    if (overflowPoints > 0) {
      warnings.push(
        `${plural(overflowPoints, "point")} not counted: quantity ÷ interval is too large to be a real demand ` +
          "(check the interval's unit).",
      );
    }
    if (t.hoursAssumed > 0) {
      warnings.push(
        `${plural(t.hoursAssumed, "point")} with running hours per day missing, not positive or above 24: ` +
          "taken as 24 h/day.",
      );
    }

    let purgeGramsPerWeek = 0;
    if (t.purges.length > 0) {
      if (!hasHorizon) {
        warnings.push(
          `${plural(t.purges.length, "planned purge")} not counted: no forecast start date was given to place them in.`,
        );
      } else {
        if (!weeksValid) {
          warnings.push(
            `Forecast horizon ${String(weeksGiven)} weeks is not a positive number: taken as ${DEFAULT_FORECAST_WEEKS} weeks.`,
          );
        }
        const start = from.getTime();
        const end = start + weeks * MS_PER_WEEK;
        let counted = 0;
        let grams = 0;
        let outside = 0;
        let unusable = 0;
        for (const p of t.purges) {
          if (!isPositive(p.grams) || !isValidDate(p.on)) {
            unusable += 1;
            continue;
          }
          const at = p.on.getTime();
          if (at < start || at >= end) {
            outside += 1;
            continue;
          }
          if (!Number.isFinite(grams + p.grams)) {
            unusable += 1;
            continue;
          }
          counted += 1;
          grams += p.grams;
        }
        purgeGramsPerWeek = grams / weeks;
        const endDay = isoDay(new Date(end));
        steps.push({
          label: `Planned purges from ${isoDay(from)} to before ${endDay}: ${plural(counted, "purge")}`,
          value:
            `${formatNumber(grams, 3)} g ÷ ${formatNumber(weeks, 2)} weeks = ` +
            `${formatNumber(purgeGramsPerWeek, 3)} g/week`,
        });
        if (outside > 0) {
          steps.push({ label: "Planned purges outside the horizon, not counted", value: plural(outside, "purge") });
        }
        if (unusable > 0) {
          warnings.push(`${plural(unusable, "planned purge")} without positive grams or a valid date not counted.`);
        }
      }
    }

    if (!Number.isFinite(relubGramsPerWeek + purgeGramsPerWeek)) {
      warnings.push("Planned purges not counted: with the relubrication demand they are too large to add up.");
      purgeGramsPerWeek = 0;
    }
    const gramsPerWeek = relubGramsPerWeek + purgeGramsPerWeek;
    steps.push({
      label: "Demand",
      value:
        `${formatNumber(relubGramsPerWeek, 3)} g/week relubrication + ${formatNumber(purgeGramsPerWeek, 3)} g/week ` +
        `purges = ${formatNumber(gramsPerWeek, 3)} g/week`,
    });
    result.set(greaseId, { gramsPerWeek, steps, warnings });
  }
  return result;
}
