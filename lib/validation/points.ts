import { z } from "zod";
import { labelCodeSchema } from "./stock";
import { isObjectPayload, optionalNumber, optionalText } from "./fields";

export const serviceSchema = z.object({
  greaseId: z.number({ error: "Choose the grease in your hand (greaseId)." }).int().positive(),
  grams: optionalNumber("Grams applied", 0.01, 100_000),
  strokes: optionalNumber("Gun strokes", 1, 10_000, { int: true }),
  gunId: z.number().int().positive().optional(),
  notes: optionalText(1000),
  backPressure: z.boolean().optional(),
  purgeSeen: z.boolean().optional(),
  noise: z.boolean().optional(),
  housingTemperatureC: optionalNumber("Housing temperature (°C)", -60, 400),
  /** The container label scanned at the point: the lot is recorded with the service. */
  containerLabel: labelCodeSchema.optional(),
  /** Book one container of that lot out of the store against this point. */
  takeContainer: z.boolean().optional(),
});
export type ServiceBody = z.infer<typeof serviceSchema>;

export const pointsQuerySchema = z.object({
  site: z.coerce.number().int().positive().optional(),
  due: z.enum(["ok", "due", "overdue"], { error: "due is ok, due or overdue." }).optional(),
});

export const changeoverSchema = z.object({
  tag: z.string().min(8).max(10),
  toGreaseId: z.coerce.number({ error: "Choose the new grease." }).int().positive("Choose the new grease."),
  method: z.enum(["purge", "clean_out"], { error: "Choose purge or clean-out." }),
  shortenedIntervalHours: optionalNumber("Shortened interval (h)", 1, 100_000),
  servicesPlanned: z.coerce.number({ error: "Give the number of services." }).int().min(1, "At least one service.").max(20, "At most 20 services."),
  notes: optionalText(500),
});

const LEVELS = ["low", "moderate", "high", "very_high"] as const;
const flag = z.preprocess((v) => v === true || v === "on" || v === "true" || v === "1", z.boolean());
const need = (label: string, min: number, max: number) =>
  z.preprocess((v) => (v === "" || v === null || v === undefined ? undefined : typeof v === "string" ? Number(v.replace(",", ".")) : v), z.number({ error: `Enter ${label}.` }).min(min, `${label} must be at least ${min}.`).max(max, `${label} must be at most ${max}.`));

export const areaSchema = z.object({
  siteId: z.coerce.number().int().positive("Choose a site."),
  code: z.string().trim().min(1, "Enter a short code.").max(16, "At most 16 characters.").regex(/^[A-Za-z0-9-]+$/, "Letters, digits and dashes only."),
  name: z.string().trim().min(1, "Enter the area's name.").max(120, "At most 120 characters."),
});

export const ASSET_KINDS = ["motor", "pump", "fan", "conveyor", "gearbox", "crusher", "mill", "other"] as const;
export const assetSchema = z.object({
  areaId: z.coerce.number().int().positive("Choose an area."),
  tag: z.string().trim().min(1, "Enter the asset tag.").max(32, "At most 32 characters."),
  name: z.string().trim().min(1, "Enter the asset's name.").max(120, "At most 120 characters."),
  kind: z.enum(ASSET_KINDS, { error: "Choose the kind of machine." }),
  frameSize: optionalText(32),
});

/** A lube point as the lead enters it; the cross-field rules name the field to change. */
export const pointSchema = z
  .object({
    assetId: z.coerce.number({ error: "Choose the asset." }).int().positive("Choose the asset."),
    name: z.string().trim().min(1, "Enter the point's name (e.g. drive end).").max(120, "At most 120 characters."),
    bearingType: z.enum(["ball", "cylindrical_roller", "needle_roller", "spherical_roller", "tapered_roller"], { error: "Choose the bearing type." }),
    bearingDesignation: optionalText(40),
    boreMm: need("the bore d (mm)", 1, 2000),
    outsideDiameterMm: need("the outside diameter D (mm)", 2, 3000),
    widthMm: need("the width B (mm)", 1, 1000),
    speedRpm: need("the speed (r/min)", 0, 100_000),
    operatingTemperatureC: optionalNumber("Operating temperature (°C)", -60, 300),
    runningHoursPerDay: need("the running hours per day", 0.1, 24),
    verticalShaft: flag,
    contamination: z.enum(LEVELS, { error: "Choose a level." }),
    moisture: z.enum(LEVELS, { error: "Choose a level." }),
    vibration: z.enum(LEVELS, { error: "Choose a level." }),
    foodGradeRequired: flag,
    replenishment: z.enum(["side", "centre"], { error: "Choose side or centre." }),
    sealedForLife: flag,
    assignedGreaseId: z.preprocess((v) => (v === "" || v === null ? undefined : v), z.coerce.number().int().positive().optional()),
    makerIntervalHours: optionalNumber("Maker's interval (h)", 1, 200_000),
    makerQuantityGrams: optionalNumber("Maker's quantity (g)", 0.1, 100_000),
    makerNote: optionalText(300),
    intervalHoursOverride: optionalNumber("Interval override (h)", 1, 200_000),
    quantityGramsOverride: optionalNumber("Quantity override (g)", 0.1, 100_000),
    overrideReason: optionalText(300),
  })
  .superRefine((v, ctx) => {
    if (typeof v.boreMm === "number" && typeof v.outsideDiameterMm === "number" && v.outsideDiameterMm <= v.boreMm) {
      ctx.addIssue({ code: "custom", path: ["outsideDiameterMm"], message: "The outside diameter D must be larger than the bore d." });
    }
    if ((v.intervalHoursOverride !== undefined || v.quantityGramsOverride !== undefined) && !v.overrideReason) {
      ctx.addIssue({ code: "custom", path: ["overrideReason"], message: "Say why you override the calculated value." });
    }
    if (!v.sealedForLife && v.assignedGreaseId === undefined) {
      ctx.addIssue({ code: "custom", path: ["assignedGreaseId"], message: "Choose the grease for this point (or mark it sealed for life)." });
    }
  }, { when: isObjectPayload });
export type PointInput = z.infer<typeof pointSchema>;
