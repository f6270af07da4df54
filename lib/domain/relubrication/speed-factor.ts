import { formatNumber } from "../units/format-number";
import { SPEED_FACTOR_CHECK_SHARE, SPEED_FACTOR_LIMITS } from "./speed-limits";
import { BEARING_TYPES, type CalcStep, type SpeedFactorInput, type SpeedFactorResult } from "./types";

function isPositiveFinite(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x) && x > 0;
}

/**
 * Decides whether a grease-lubricated bearing runs within the recommended speed factor n·dm.
 *
 * dm = (d + D)/2 in mm, n in r/min, so n·dm is in mm/min. It is compared with the bearing type's limit
 * (SPEED_FACTOR_LIMITS: SKF Rolling bearings catalogue Table 1, column C/P ≥ 15; spherical and tapered rows from
 * memory) and with the grease's own limit when given; `limit` is the lower of the two. Above 70 % of the limit a
 * warning repeats SKF's advice to check the operating temperature and the lubrication method (skf.com,
 * "Relubrication intervals"). For outer-ring rotation SKF uses n·D instead; not modelled here.
 *
 * @returns `ndm` (0 for a stationary bearing), the binding `limit` and `withinLimit` (ndm ≤ limit). `ndm` is null
 *   with a warning when the bore is not a positive number, D is not larger than d, or the speed is negative or not
 *   a number. `limit` and `withinLimit` are null when neither limit is known (needle roller bearings without a
 *   grease limit). Warnings name the source of the limit that was exceeded.
 */
export function speedFactor(input: SpeedFactorInput): SpeedFactorResult {
  const steps: CalcStep[] = [];
  const warnings: string[] = [];
  const { boreMm: d, outsideDiameterMm: D, speedRpm: n } = input;
  const none = (): SpeedFactorResult => ({ ndm: null, limit: null, withinLimit: null, steps, warnings });

  if (!(BEARING_TYPES as readonly string[]).includes(input.bearingType)) {
    warnings.push(`Unknown bearing type "${String(input.bearingType)}": the speed factor was not checked.`);
    return none();
  }
  if (!isPositiveFinite(d) || !isPositiveFinite(D) || D <= d) {
    warnings.push(
      `The outside diameter (${String(D)} mm) must be a number larger than the bore (${String(d)} mm): ` +
        "the speed factor n·dm was not checked.",
    );
    return none();
  }
  if (typeof n !== "number" || !Number.isFinite(n) || n < 0) {
    warnings.push(`The speed must be a number of r/min, 0 or more (got ${String(n)}): n·dm was not checked.`);
    return none();
  }

  const dm = (d + D) / 2;
  const ndm = n * dm;
  steps.push({
    label: "Mean diameter dm = (d + D)/2",
    value: `(${formatNumber(d, 2)} + ${formatNumber(D, 2)}) / 2 = ${formatNumber(dm, 2)} mm`,
  });
  steps.push({
    label: "Speed factor n·dm",
    value: `${formatNumber(n, 2)} r/min × ${formatNumber(dm, 2)} mm = ${formatNumber(ndm, 0)} mm/min`,
  });

  const typeLimit = SPEED_FACTOR_LIMITS[input.bearingType];
  if (typeLimit.ndmLimit === null) {
    steps.push({ label: "Bearing-type limit", value: `none known for ${typeLimit.row}` });
  } else {
    steps.push({
      label: `Bearing-type limit (${typeLimit.row}${typeLimit.provenance === "from_memory" ? ", from memory" : ""})`,
      value: `${formatNumber(typeLimit.ndmLimit, 0)} mm/min`,
    });
  }

  let greaseLimit: number | null = null;
  const g = input.greaseSpeedLimitNdm;
  if (g !== null && g !== undefined) {
    if (isPositiveFinite(g)) {
      greaseLimit = g;
      steps.push({ label: "Grease speed limit (data sheet)", value: `${formatNumber(g, 0)} mm/min` });
    } else {
      warnings.push(
        `The grease's speed limit must be a positive number of mm/min (got ${String(g)}); it was ignored.`,
      );
    }
  }

  const candidates = [typeLimit.ndmLimit, greaseLimit].filter((x): x is number => x !== null);
  if (candidates.length === 0) {
    warnings.push(
      `No recommended n·dm limit is known for ${typeLimit.row}; ` +
        "compare n·dm with the grease's data sheet.",
    );
    return { ndm, limit: null, withinLimit: null, steps, warnings };
  }
  const limit = Math.min(...candidates);
  const withinLimit = ndm <= limit;
  steps.push({
    label: "n·dm against the lower limit",
    value: `${formatNumber(ndm, 0)} ${withinLimit ? "≤" : ">"} ${formatNumber(limit, 0)} mm/min`,
  });

  if (typeLimit.ndmLimit !== null && ndm > typeLimit.ndmLimit) {
    warnings.push(
      `n·dm = ${formatNumber(ndm, 0)} mm/min is above the ${formatNumber(typeLimit.ndmLimit, 0)} mm/min ` +
        `recommended for grease in ${typeLimit.row} (${typeLimit.source}). Consider a grease made for high speeds ` +
        "or oil lubrication.",
    );
  }
  if (greaseLimit !== null && ndm > greaseLimit) {
    warnings.push(
      `n·dm = ${formatNumber(ndm, 0)} mm/min is above the grease's own limit of ${formatNumber(greaseLimit, 0)} ` +
        "mm/min: choose a grease rated for this speed.",
    );
  }
  if (withinLimit && ndm > SPEED_FACTOR_CHECK_SHARE * limit) {
    warnings.push(
      `n·dm is above 70 % of the limit (${formatNumber(SPEED_FACTOR_CHECK_SHARE * limit, 0)} mm/min): check the ` +
        "operating temperature and the lubrication method.",
    );
  }
  return { ndm, limit, withinLimit, steps, warnings };
}
