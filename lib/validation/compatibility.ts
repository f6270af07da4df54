import { z } from "zod";
import { BASE_OIL_TYPES, FOOD_GRADES, NLGI_GRADES, SOLID_ADDITIVES, THICKENERS } from "@/lib/domain/catalogue";
import { optionalNumber, optionalText, requiredNumber } from "./fields";

export const profileSchema = z.object({
  thickener: z.enum(THICKENERS, { error: "Choose the thickener type." }),
  baseOilType: z.enum(BASE_OIL_TYPES, { error: "Choose the base-oil type." }),
  viscosity40: optionalNumber("Viscosity at 40 °C (mm²/s)", 0.1, 100_000),
  nlgiGrade: z.enum(NLGI_GRADES, { error: "Choose an NLGI grade." }).optional(),
  foodGrade: z.enum(FOOD_GRADES, { error: "Choose H1, H2, H3 or none." }).optional(),
  solidAdditives: z.array(z.enum(SOLID_ADDITIVES, { error: "Unknown solid additive." })).max(4).optional(),
});

/** A grease named by its catalogue id, or described by its properties. */
export const greaseRefSchema = z.union(
  [z.object({ greaseId: z.number({ error: "greaseId must be a number." }).int().positive() }).strict(), z.object({ profile: profileSchema }).strict()],
  { error: "Give either {greaseId} or {profile: {thickener, baseOilType, …}}." },
);
export type GreaseRef = z.infer<typeof greaseRefSchema>;

export const evaluateSchema = z.object({
  a: greaseRefSchema,
  b: greaseRefSchema,
  point: z.object({ foodGradeRequired: z.boolean({ error: "foodGradeRequired is true or false." }).optional() }).optional(),
  /** Whose settings (enabled charts, thresholds) apply; defaults to the caller's first site. */
  siteId: z.number().int().positive().optional(),
});
export type EvaluateInput = z.infer<typeof evaluateSchema>;

export const consistencySchema = z.object({
  workedPenetration: z
    .number({ error: "workedPenetration must be a number (0.1 mm)." })
    .min(0, "workedPenetration cannot be negative.")
    .max(1000, "workedPenetration must be at most 1000 (0.1 mm)."),
});

export const settingsSchema = z.object({
  siteId: requiredNumber("Site", 1, 4_294_967_295, { int: true }),
  enabledCharts: z.array(z.string().min(1).max(60)).max(20),
  viscosityRatioLimit: requiredNumber("Viscosity ratio limit", 1, 100),
  nlgiStepLimit: requiredNumber("NLGI step limit", 0, 9),
  droppingPointAllowanceC: requiredNumber("Dropping point allowance (°C)", 0, 100),
  workedPenetrationAllowance: requiredNumber("Worked penetration allowance (0.1 mm)", 0, 200),
  storageChangeAllowance: requiredNumber("Storage change allowance (0.1 mm)", 0, 200),
  version: requiredNumber("Version", 0, 1_000_000_000, { int: true }),
});

const testResultSchema = z.object({
  droppingPointC: optionalNumber("Dropping point (°C)", -50, 500),
  workedPenetrationProlonged: optionalNumber("Worked penetration after prolonged working (0.1 mm)", 0, 600),
  storagePenetrationChange: optionalNumber("Penetration change after storage (0.1 mm)", -300, 300),
});

export const evidenceSchema = z
  .object({
    greaseAId: requiredNumber("Grease A", 1, 4_294_967_295, { int: true }),
    greaseBId: requiredNumber("Grease B", 1, 4_294_967_295, { int: true }),
    kind: z.enum(["lab_mixture_test", "supplier_statement"], { error: "Choose a lab mixture test or a supplier statement." }),
    verdict: z.enum(["compatible", "borderline", "incompatible"], { error: "Choose the verdict the statement gives." }).optional(),
    title: z.string().trim().min(3, "Give the evidence a title (report number, letter date).").max(200, "At most 200 characters."),
    summary: optionalText(4000),
    neatA: testResultSchema.optional(),
    neatB: testResultSchema.optional(),
    mixtures: z
      .array(z.object({ ratioA: requiredNumber("Share of A (%)", 1, 99, { int: true }), result: testResultSchema }))
      .max(9)
      .optional(),
  })
  .superRefine((v, ctx) => {
    if (v.greaseAId === v.greaseBId) ctx.addIssue({ code: "custom", path: ["greaseBId"], message: "Choose two different greases." });
    if (v.kind === "supplier_statement" && !v.verdict) ctx.addIssue({ code: "custom", path: ["verdict"], message: "Choose the verdict the statement gives." });
    if (v.kind === "lab_mixture_test" && !(v.mixtures && v.mixtures.length)) {
      ctx.addIssue({ code: "custom", path: ["mixtures"], message: "Enter the results of at least one mixture." });
    }
  });
export type EvidenceInput = z.infer<typeof evidenceSchema>;
