import { z } from "zod";
import { BEARING_TYPES, LEVELS } from "@/lib/domain/relubrication";

const positive = (label: string, max: number) =>
  z.number({ error: `${label} must be a number.` }).gt(0, `${label} must be more than 0.`).max(max, `${label} must be at most ${max}.`);
const level = z.enum(LEVELS as unknown as ["low", "moderate", "high", "very_high"], { error: "Use low, moderate, high or very_high." });

export const relubricationSchema = z
  .object({
    bearingType: z.enum(BEARING_TYPES, { error: `bearingType is one of ${BEARING_TYPES.join(", ")}.` }),
    boreMm: positive("boreMm", 2000),
    outsideDiameterMm: positive("outsideDiameterMm", 3000),
    widthMm: positive("widthMm", 1000),
    speedRpm: positive("speedRpm", 100_000),
    operatingTemperatureC: z.number({ error: "operatingTemperatureC must be a number." }).min(-60).max(300).optional(),
    verticalShaft: z.boolean({ error: "verticalShaft is true or false." }).optional(),
    replenishment: z.enum(["side", "centre"], { error: "replenishment is side or centre." }).optional(),
    gunGramsPerStroke: positive("gunGramsPerStroke", 100).optional(),
    contamination: level.optional(),
    moisture: level.optional(),
    vibration: level.optional(),
    greaseMaxTemperatureC: z.number().min(-60).max(400).optional(),
  })
  .refine((v) => v.outsideDiameterMm > v.boreMm, { path: ["outsideDiameterMm"], message: "outsideDiameterMm must be larger than boreMm." });

export const viscosityCalcSchema = z.object({
  viscosity40: positive("viscosity40", 100_000),
  viscosity100: positive("viscosity100", 100_000).optional(),
  temperatureC: z.number({ error: "temperatureC must be a number." }).min(-60).max(300).optional(),
  speedRpm: positive("speedRpm", 100_000).optional(),
  meanDiameterMm: positive("meanDiameterMm", 3000).optional(),
});
