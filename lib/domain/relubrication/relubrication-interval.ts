import { formatNumber } from "../units/format-number";
import { BEARING_TYPE_FACTORS } from "./bearing-type-factors";
import {
  CONTAMINATION_FACTORS,
  DEFAULT_INTERVAL_CAP_HOURS,
  MOISTURE_FACTORS,
  SKF_TABLE_2_RULES,
  VIBRATION_FACTORS,
} from "./interval-adjustments";
import { speedFactor } from "./speed-factor";
import { temperatureFactor } from "./temperature-factor";
import {
  BEARING_TYPES,
  type CalcStep,
  type IntervalFactor,
  type IntervalResult,
  type RelubricationInput,
  type RelubricationOptions,
} from "./types";

/** The published name of the method relubricationInterval applies. */
export const RELUBRICATION_INTERVAL_METHOD =
  "Empirical grease-life formula T = K·[14·10⁶/(n·√d) − 4·d] (The Tribology Handbook §A20, Table 20.4), " +
  "adjusted per SKF Rolling bearings catalogue Table 2";

/** Intervals shorter than this get a warning suggesting continuous lubrication. Common practice, no source. */
const SHORT_INTERVAL_HOURS = 24;

const OUT_OF_RANGE = "outside the method's range";

function isPositiveFinite(x: unknown): x is number {
  return typeof x === "number" && Number.isFinite(x) && x > 0;
}

/**
 * Decides how many operating hours may pass between two greasings of a rolling bearing.
 *
 * Base interval: T = K·[14 000 000/(n·√d) − 4·d] hours, n in r/min, d = bore in mm, K from BEARING_TYPE_FACTORS
 * (The Tribology Handbook §A20 Table 20.4; domain.md §6.1 — not the "1000/(d·n)" version a second copy of one
 * source prints, which is wrong). It is then multiplied by:
 * - the SKF Table 2 temperature factor (see temperatureFactor: continuous halving above 70 °C, one doubling at
 *   ≤ 55 °C); no operating temperature → the 70 °C base, factor 1;
 * - 0.5 for a vertical shaft (SKF Table 2);
 * - the SKF Table 2 contamination factor (CONTAMINATION_FACTORS);
 * - the Noria-style moisture and vibration factors Fm and Fv (MOISTURE_FACTORS, VIBRATION_FACTORS). Noria's
 *   temperature and position factors Ft and Fp are deliberately not applied: the SKF temperature and
 *   vertical-shaft rules already cover them and both would count twice. Its contamination factor Fc is replaced
 *   by SKF's;
 * - 0.5 for a bore above 300 mm (SKF Table 2: start at half, extend if grease samples are good).
 * Finally the interval is capped at `capHours` (default DEFAULT_INTERVAL_CAP_HOURS = 30 000 h, SKF Table 2).
 *
 * Not modelled: load, full-complement and thrust bearings (the doubling is not allowed for them), outer-ring
 * rotation (SKF then uses n·D for the speed factor), cage variants of cylindrical roller bearings. The width is
 * not used.
 *
 * @param input the lube point; see RelubricationInput. Missing environment levels count as "low".
 * @param options `capHours`, the longest interval returned (a positive number; otherwise the default is used
 *   with a warning).
 * @returns `intervalHours` > 0 (not rounded), or null with a warning saying why when the method does not apply:
 *   unknown bearing type, bore or speed not a positive number, 14·10⁶/(n·√d) ≤ 4·d (the formula would give zero
 *   or less), or very high contamination (no published factor; continuous relubrication is the remedy). Warnings
 *   also flag an operating temperature above the grease's limit (the interval is still computed), a capped
 *   interval, a large bore, very high vibration, and n·dm above the bearing type's or the grease's limit when
 *   the outside diameter is known. `factors` lists every multiplier applied, with its source; `steps` the
 *   arithmetic.
 */
export function relubricationInterval(
  input: RelubricationInput,
  options?: RelubricationOptions,
): IntervalResult {
  const steps: CalcStep[] = [];
  const warnings: string[] = [];
  const factors: IntervalFactor[] = [];
  const done = (intervalHours: number | null): IntervalResult => ({
    intervalHours,
    method: RELUBRICATION_INTERVAL_METHOD,
    steps,
    warnings,
    factors,
  });

  if (!(BEARING_TYPES as readonly string[]).includes(input.bearingType)) {
    warnings.push(`Unknown bearing type "${String(input.bearingType)}": ${OUT_OF_RANGE}.`);
    return done(null);
  }
  const d = input.boreMm;
  const n = input.speedRpm;
  if (!isPositiveFinite(d)) {
    warnings.push(
      `The bore diameter must be a positive number of millimetres (got ${String(d)}): ${OUT_OF_RANGE}.`,
    );
    return done(null);
  }
  if (!isPositiveFinite(n)) {
    warnings.push(
      `The speed must be a positive number of revolutions per minute (got ${String(n)}): ${OUT_OF_RANGE}. ` +
        "The formula needs a turning bearing.",
    );
    return done(null);
  }

  const type = BEARING_TYPE_FACTORS[input.bearingType];
  factors.push({ name: `Bearing-type factor K (${type.label})`, value: type.k, source: type.source });
  steps.push({ label: "Bearing-type factor K", value: `${type.k} (${type.label})` });

  const rootD = Math.sqrt(d);
  const speedTerm = 14_000_000 / (n * rootD);
  const boreTerm = 4 * d;
  steps.push({
    label: "14 000 000 / (n·√d)",
    value:
      `14000000 / (${formatNumber(n, 2)} r/min × √${formatNumber(d, 2)} mm) = 14000000 / ` +
      `(${formatNumber(n, 2)} × ${formatNumber(rootD, 4)}) = ${formatNumber(speedTerm, 2)}`,
  });
  steps.push({ label: "4·d", value: `4 × ${formatNumber(d, 2)} = ${formatNumber(boreTerm, 2)}` });
  const bracket = speedTerm - boreTerm;
  if (!(bracket > 0)) {
    warnings.push(
      `14 000 000/(n·√d) = ${formatNumber(speedTerm, 2)} is not larger than 4·d = ${formatNumber(boreTerm, 2)}: ` +
        `this speed and bore are ${OUT_OF_RANGE} (the formula would give no positive interval). ` +
        "Ask the bearing maker or consider oil lubrication.",
    );
    return done(null);
  }
  const baseHours = type.k * bracket;
  steps.push({
    label: "Base interval T = K·[14 000 000/(n·√d) − 4·d]",
    value: `${type.k} × (${formatNumber(speedTerm, 2)} − ${formatNumber(boreTerm, 2)}) = ${formatNumber(baseHours, 2)} h`,
  });

  let blocked = false;

  // Temperature (SKF Table 2).
  const t = input.operatingTemperatureC;
  if (t === null || t === undefined || !Number.isFinite(t)) {
    if (t !== null && t !== undefined)
      warnings.push("The operating temperature is not a number; 70 °C was assumed.");
    factors.push({
      name: "Temperature (not given: 70 °C base assumed)",
      value: 1,
      source: SKF_TABLE_2_RULES.source,
    });
    steps.push({ label: "Temperature factor", value: "not given: the method's 70 °C base is assumed → 1" });
  } else {
    const { factor, step } = temperatureFactor(t);
    factors.push({
      name: `Temperature ${formatNumber(t, 1)} °C`,
      value: factor,
      source: SKF_TABLE_2_RULES.source,
    });
    steps.push(step);
    const limit = input.greaseMaxTemperatureC;
    if (typeof limit === "number" && Number.isFinite(limit)) {
      if (t > limit) {
        warnings.push(
          `The operating temperature (${formatNumber(t, 1)} °C) is above the grease's upper limit ` +
            `(${formatNumber(limit, 1)} °C): the grease is outside its range and the temperature rule no longer ` +
            "holds. Choose a grease rated for this temperature; the interval shown is computed anyway.",
        );
      }
    } else if (t > SKF_TABLE_2_RULES.baseTemperatureC) {
      warnings.push(
        "The grease's upper temperature limit is not known: the halving rule holds only up to that limit, so " +
          "check the grease's data sheet.",
      );
    }
  }

  // Shaft orientation (SKF Table 2). Noria's position factor Fp is not applied as well.
  if (input.verticalShaft) {
    factors.push({
      name: "Vertical shaft",
      value: SKF_TABLE_2_RULES.verticalShaftFactor,
      source: SKF_TABLE_2_RULES.source,
    });
    steps.push({ label: "Vertical shaft factor", value: "halve → 0.5" });
  } else {
    factors.push({ name: "Horizontal shaft", value: 1, source: SKF_TABLE_2_RULES.source });
    steps.push({ label: "Shaft factor", value: "horizontal (the method's base) → 1" });
  }

  // Contamination (SKF Table 2 levels).
  const contamination = CONTAMINATION_FACTORS[input.contamination ?? "low"];
  if (contamination.factor === null) {
    blocked = true;
    warnings.push(
      "Very high contamination: the bearing maker's table says relubrication then serves mainly to flush the " +
        `bearing and gives no factor we could verify, so the interval method is ${OUT_OF_RANGE}. Consider ` +
        "continuous (automatic) relubrication and better sealing.",
    );
    steps.push({ label: "Contamination factor (very high)", value: "no published factor → no interval" });
  } else {
    factors.push({
      name: `Contamination: ${contamination.condition}`,
      value: contamination.factor,
      source: contamination.source,
    });
    steps.push({
      label: `Contamination factor (${input.contamination ?? "low"})`,
      value: formatNumber(contamination.factor, 4),
    });
  }

  // Moisture and vibration (Noria-style Fm and Fv).
  const moisture = MOISTURE_FACTORS[input.moisture ?? "low"];
  factors.push({ name: `Moisture: ${moisture.condition}`, value: moisture.factor, source: moisture.source });
  steps.push({
    label: `Moisture factor Fm (${input.moisture ?? "low"})`,
    value: formatNumber(moisture.factor, 4),
  });
  const vibration = VIBRATION_FACTORS[input.vibration ?? "low"];
  factors.push({
    name: `Vibration: ${vibration.condition}`,
    value: vibration.factor,
    source: vibration.source,
  });
  steps.push({
    label: `Vibration factor Fv (${input.vibration ?? "low"})`,
    value: formatNumber(vibration.factor, 4),
  });
  if (input.vibration === "very_high") {
    warnings.push(
      "Very high vibration or shock is beyond the vibration table's top band; its factor 0.3 was used. Machines " +
        "such as vibrating screens need a shorter, machine-specific interval: follow the machine maker's " +
        "instructions.",
    );
  }

  // Large bore (SKF Table 2).
  if (d > SKF_TABLE_2_RULES.largeBoreMm) {
    factors.push({
      name: "Bore above 300 mm: start at half",
      value: SKF_TABLE_2_RULES.largeBoreFactor,
      source: SKF_TABLE_2_RULES.source,
    });
    steps.push({ label: "Large-bore factor (d > 300 mm)", value: "start at half → 0.5" });
    warnings.push(
      `The bore (${formatNumber(d, 1)} mm) is above 300 mm: the interval starts at half the computed value. ` +
        "Extend it step by step only if grease samples taken before relubrication look good.",
    );
  }

  // Speed factor, when the outside diameter is known.
  const outside = input.outsideDiameterMm;
  if (outside !== null && outside !== undefined) {
    const speed = speedFactor({
      bearingType: input.bearingType,
      boreMm: d,
      outsideDiameterMm: outside,
      speedRpm: n,
    });
    steps.push(...speed.steps);
    warnings.push(...speed.warnings);
  }

  if (blocked) return done(null);

  const multipliers = factors.slice(1).map((f) => f.value);
  const adjusted = multipliers.reduce((product, f) => product * f, baseHours);
  steps.push({
    label: "Adjusted interval",
    value: `${formatNumber(baseHours, 2)} h × ${multipliers.map((f) => formatNumber(f, 4)).join(" × ")} = ${formatNumber(adjusted, 2)} h`,
  });

  let cap = DEFAULT_INTERVAL_CAP_HOURS;
  if (options?.capHours !== undefined) {
    if (isPositiveFinite(options.capHours)) cap = options.capHours;
    else
      warnings.push(
        `The interval cap must be a positive number of hours (got ${String(options.capHours)}); ` +
          `${DEFAULT_INTERVAL_CAP_HOURS} h was used.`,
      );
  }
  let intervalHours = adjusted;
  if (adjusted > cap) {
    intervalHours = cap;
    steps.push({
      label: "Cap",
      value: `${formatNumber(adjusted, 2)} h > ${formatNumber(cap, 2)} h → ${formatNumber(cap, 2)} h`,
    });
    warnings.push(
      `The computed interval (${formatNumber(adjusted, 0)} h) is longer than the ${formatNumber(cap, 0)} h cap; ` +
        `${formatNumber(cap, 0)} h is used.` +
        (cap === DEFAULT_INTERVAL_CAP_HOURS
          ? " The bearing maker's table advises no interval above 30 000 h."
          : ""),
    );
  }
  if (intervalHours < SHORT_INTERVAL_HOURS) {
    warnings.push(
      `The interval is shorter than a day of running (${formatNumber(intervalHours, 1)} h): consider continuous ` +
        "(automatic) lubrication.",
    );
  }
  return done(intervalHours);
}
