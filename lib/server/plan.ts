import "server-only";
import {
  gunStrokes,
  relubricationInterval,
  replenishmentQuantity,
  speedFactor,
  type BearingType,
  type IntervalResult,
  type Level,
  type QuantityResult,
  type SpeedFactorResult,
} from "@/lib/domain/relubrication";
import { effectiveValue, type EffectiveValue } from "@/lib/domain/service";
import { ratedViscosity, viscosityAtTemperature, viscosityRatio } from "@/lib/domain/viscosity";
import type { GreaseDto } from "./queries/greases";

export interface PointPlanInput {
  bearingType: BearingType;
  boreMm: number;
  outsideDiameterMm: number;
  widthMm: number;
  speedRpm: number;
  operatingTemperatureC: number | null;
  verticalShaft: boolean;
  contamination: Level;
  moisture: Level;
  vibration: Level;
  replenishment: "side" | "centre";
  intervalHoursOverride?: number | null;
  quantityGramsOverride?: number | null;
  makerIntervalHours?: number | null;
  makerQuantityGrams?: number | null;
}

export interface PointPlan {
  interval: IntervalResult;
  quantity: QuantityResult;
  speed: SpeedFactorResult;
  effectiveInterval: EffectiveValue;
  effectiveQuantity: EffectiveValue;
  /** Strokes of each calibrated gun of the site for the quantity that applies. */
  strokes: { gun: string; calibratedOn: string; strokes: number | null; steps: { label: string; value: string }[] }[];
  viscosity?: { atTemperature: number | null; rated: number | null; kappa: number | null; steps: { label: string; value: string }[]; warnings: string[] };
  warnings: string[];
}

/**
 * Everything the point page shows about a point's plan: the calculated interval and quantity with their steps,
 * the values that apply (override, maker, calculated), the speed factor and, with a grease, κ at the operating
 * temperature and the grease's suitability.
 */
export function planPoint(
  p: PointPlanInput,
  grease: GreaseDto | null,
  foodGradeRequired = false,
  guns: readonly { label: string; gramsPerStroke: number; calibratedOn: string }[] = [],
): PointPlan {
  const interval = relubricationInterval({
    bearingType: p.bearingType,
    boreMm: p.boreMm,
    outsideDiameterMm: p.outsideDiameterMm,
    widthMm: p.widthMm,
    speedRpm: p.speedRpm,
    operatingTemperatureC: p.operatingTemperatureC,
    verticalShaft: p.verticalShaft,
    contamination: p.contamination,
    moisture: p.moisture,
    vibration: p.vibration,
    greaseMaxTemperatureC: grease?.maxTemperatureC ?? null,
  });
  const quantity = replenishmentQuantity({ outsideDiameterMm: p.outsideDiameterMm, widthMm: p.widthMm, replenishment: p.replenishment });
  const speed = speedFactor({ bearingType: p.bearingType, boreMm: p.boreMm, outsideDiameterMm: p.outsideDiameterMm, speedRpm: p.speedRpm });
  const warnings: string[] = [];
  let viscosity: PointPlan["viscosity"];
  if (grease) {
    if (foodGradeRequired && grease.foodGrade !== "H1") warnings.push(`${grease.name} is not H1, but this point is in a food-grade area.`);
    const t = p.operatingTemperatureC;
    if (t !== null && grease.maxTemperatureC !== undefined && t > grease.maxTemperatureC) warnings.push(`${t} °C is above ${grease.name}'s upper limit of ${grease.maxTemperatureC} °C.`);
    if (t !== null && grease.minTemperatureC !== undefined && t < grease.minTemperatureC) warnings.push(`${t} °C is below ${grease.name}'s lower limit of ${grease.minTemperatureC} °C.`);
    if (t !== null && grease.viscosity100) {
      const at = viscosityAtTemperature({ viscosity40: grease.viscosity40, viscosity100: grease.viscosity100, temperatureC: t });
      const rated = ratedViscosity({ meanDiameterMm: (p.boreMm + p.outsideDiameterMm) / 2, speedRpm: p.speedRpm });
      const kappa = at.viscosity !== null && rated.viscosity !== null ? viscosityRatio({ viscosity: at.viscosity, ratedViscosity: rated.viscosity }) : null;
      viscosity = {
        atTemperature: at.viscosity,
        rated: rated.viscosity,
        kappa: kappa?.kappa ?? null,
        steps: [...at.steps, ...rated.steps, ...(kappa?.steps ?? [])],
        warnings: [...at.warnings, ...rated.warnings, ...(kappa?.warnings ?? [])],
      };
      warnings.push(...viscosity.warnings);
    }
  }
  const effectiveQuantity = effectiveValue({ override: p.quantityGramsOverride, maker: p.makerQuantityGrams, calculated: quantity.quantityGrams });
  const strokes =
    effectiveQuantity.value === null
      ? []
      : guns.map((g) => {
          const result = gunStrokes(effectiveQuantity.value!, g.gramsPerStroke);
          return { gun: g.label, calibratedOn: g.calibratedOn, strokes: result.strokes, steps: result.steps.map((s) => ({ label: `${g.label}: ${s.label}`, value: s.value })) };
        });
  return {
    interval,
    quantity,
    speed,
    strokes,
    effectiveInterval: effectiveValue({ override: p.intervalHoursOverride, maker: p.makerIntervalHours, calculated: interval.intervalHours }),
    effectiveQuantity,
    viscosity,
    warnings: [...warnings, ...interval.warnings, ...quantity.warnings, ...speed.warnings],
  };
}

