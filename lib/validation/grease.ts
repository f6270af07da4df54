import { z } from "zod";
import {
  BASE_OIL_TYPES,
  FOOD_GRADES,
  NLGI_GRADES,
  PACK_KINDS,
  SOLID_ADDITIVES,
  THICKENERS,
} from "@/lib/domain/catalogue";
import { isObjectPayload, optionalNumber, optionalText, requiredNumber } from "./fields";

export const packInputSchema = z.object({
  /** Present when an existing pack is kept or changed; absent for a new pack. */
  id: z.number().int().positive().optional(),
  kind: z.enum(PACK_KINDS, { error: "Choose cartridge, tube, pail, keg or drum." }),
  netMassGrams: requiredNumber("Net mass (g)", 0, 1_000_000, { int: true, exclusiveMin: true }),
  label: optionalText(80),
});

/**
 * The fields of a grease, without defaults and without the rules that compare two fields (those are in
 * `greaseSchema`), so that `.partial()` gives a PATCH schema that leaves absent fields alone.
 */
export const greaseFieldsSchema = z.object({
  code: z
    .string({ error: "Enter a code." })
    .trim()
    .min(1, "Enter a code.")
    .max(32, "A code has at most 32 characters.")
    .regex(/^[A-Za-z0-9][A-Za-z0-9._-]*$/, "Use letters, digits, dot, dash and underscore only."),
  name: z.string({ error: "Enter the product name." }).trim().min(1, "Enter the product name.").max(120, "At most 120 characters."),
  supplier: z.string({ error: "Enter the supplier." }).trim().min(1, "Enter the supplier.").max(120, "At most 120 characters."),
  thickener: z.enum(THICKENERS, { error: "Choose the thickener type." }),
  baseOilType: z.enum(BASE_OIL_TYPES, { error: "Choose the base-oil type." }),
  viscosity40: requiredNumber("Viscosity at 40 °C (mm²/s)", 0, 100_000, { exclusiveMin: true }),
  viscosity100: optionalNumber("Viscosity at 100 °C (mm²/s)", 0.5, 100_000),
  nlgiGrade: z.enum(NLGI_GRADES, { error: "Choose the NLGI grade." }),
  workedPenetration: optionalNumber("Worked penetration (0.1 mm)", 0, 500, { int: true }),
  isoVg: optionalNumber("ISO VG", 2, 3200, { int: true }),
  droppingPointC: optionalNumber("Dropping point (°C)", -50, 400, { int: true }),
  minTemperatureC: optionalNumber("Lowest operating temperature (°C)", -100, 300, { int: true }),
  maxTemperatureC: optionalNumber("Highest operating temperature (°C)", -50, 400, { int: true }),
  foodGrade: z.enum(FOOD_GRADES, { error: "Choose H1, H2, H3 or not food grade." }),
  solidAdditives: z.array(z.enum(SOLID_ADDITIVES, { error: "Unknown solid additive." })).max(SOLID_ADDITIVES.length),
  shelfLifeMonths: optionalNumber("Shelf life (months)", 1, 240, { int: true }),
  notes: optionalText(2000),
  packs: z.array(packInputSchema).max(20, "At most 20 pack sizes."),
});

type Fields = z.output<typeof greaseFieldsSchema>;

const isNum = (v: unknown): v is number => typeof v === "number" && Number.isFinite(v);

/** Rules across fields; each issue names the field a person should change. Runs even when other fields are bad. */
export function checkGreaseFields(value: Partial<Fields>, ctx: z.RefinementCtx) {
  const { viscosity40, viscosity100, minTemperatureC, maxTemperatureC, droppingPointC, solidAdditives } = value;
  if (isNum(viscosity100) && isNum(viscosity40) && viscosity100 >= viscosity40) {
    ctx.addIssue({ code: "custom", path: ["viscosity100"], message: "Viscosity at 100 °C must be lower than at 40 °C." });
  }
  if (isNum(minTemperatureC) && isNum(maxTemperatureC) && minTemperatureC >= maxTemperatureC) {
    ctx.addIssue({ code: "custom", path: ["maxTemperatureC"], message: "The highest temperature must be above the lowest." });
  } else if (isNum(droppingPointC) && isNum(maxTemperatureC) && maxTemperatureC >= droppingPointC) {
    ctx.addIssue({ code: "custom", path: ["maxTemperatureC"], message: "The highest operating temperature must be below the dropping point." });
  }
  if (Array.isArray(solidAdditives) && new Set(solidAdditives).size !== solidAdditives.length) {
    ctx.addIssue({ code: "custom", path: ["solidAdditives"], message: "Each solid additive once." });
  }
}

/** A whole grease, as created through the form, the API or a CSV row. */
export const greaseSchema = greaseFieldsSchema
  .extend({
    foodGrade: greaseFieldsSchema.shape.foodGrade.default("none"),
    solidAdditives: greaseFieldsSchema.shape.solidAdditives.default([]),
    packs: greaseFieldsSchema.shape.packs.default([]),
  })
  // `when`: check across fields even when another field is already wrong, so every problem shows at once; but only
  // when the body is an object at all (`null` or a list is answered by the object check alone).
  .superRefine(checkGreaseFields, { when: isObjectPayload });
export type GreaseInput = z.output<typeof greaseSchema>;
export type GreaseFormValues = z.input<typeof greaseSchema>;

/** PATCH: any subset of the fields, plus the version the editor started from (optional). */
export const greasePatchSchema = greaseFieldsSchema
  .partial()
  .extend({ version: z.number().int().positive().optional() })
  .strict();
export type GreasePatch = z.output<typeof greasePatchSchema>;
