import { z } from "zod";
import { normaliseTagCode } from "@/lib/domain/service";
import { optionalText, requiredNumber } from "./fields";

const blank = (v: unknown) => (v === "" || v === null ? undefined : v);
const day = (label: string) =>
  z.preprocess(
    blank,
    z
      .string({ error: `${label} must be a date (YYYY-MM-DD).` })
      .regex(/^\d{4}-\d{2}-\d{2}$/, `${label} must be a date (YYYY-MM-DD).`)
      // A day that does not exist (30 February) is refused, not rolled into the next month.
      .refine((s) => {
        const ms = Date.parse(`${s}T00:00:00Z`);
        return !Number.isNaN(ms) && new Date(ms).toISOString().slice(0, 10) === s;
      }, `${label} is not a real date.`)
      .optional(),
  );

export const INCIDENT_KINDS = ["refused_mix", "changeover_exception", "found_after_fact"] as const;
export const INCIDENT_STATES = ["open", "investigating", "closed"] as const;

/** The incident list's and the export's filter (query string). Dates are days, both ends included. */
export const incidentFilterSchema = z
  .object({
    from: day("from"),
    to: day("to"),
    site: z.preprocess(blank, z.string().trim().max(16, "site is a site code.").optional()),
    area: z.preprocess(
      blank,
      z.coerce.number({ error: "area must be an area id." }).int().positive().optional(),
    ),
    kind: z.preprocess(
      blank,
      z
        .enum(INCIDENT_KINDS, { error: "kind is refused_mix, changeover_exception or found_after_fact." })
        .optional(),
    ),
    state: z.preprocess(
      blank,
      z.enum(INCIDENT_STATES, { error: "state is open, investigating or closed." }).optional(),
    ),
  })
  .refine((f) => !f.from || !f.to || f.from <= f.to, {
    path: ["to"],
    message: "to must not be before from.",
  });
export type IncidentFilter = z.infer<typeof incidentFilterSchema>;

export const incidentExportSchema = incidentFilterSchema.and(
  z.object({ format: z.enum(["csv", "pdf"], { error: "format is csv or pdf." }) }),
);

export const incidentReportSchema = z.object({
  pointTag: z.preprocess(
    (v) => (typeof v === "string" ? (normaliseTagCode(v) ?? v) : v),
    z
      .string({ error: "Give the lube point's tag code." })
      .regex(/^[0-9A-HJKMNP-TV-Z]{8}$/, "A tag code is 8 letters and digits, as printed under the QR code."),
  ),
  greaseFoundId: requiredNumber("Grease found", 1, 1e9, { int: true }),
  description: z
    .string({ error: "Say what was found." })
    .trim()
    .min(5, "Say what was found (at least 5 characters).")
    .max(2000, "At most 2000 characters."),
});
export type IncidentReport = z.infer<typeof incidentReportSchema>;

export const incidentMoveSchema = z.object({
  id: requiredNumber("Incident", 1, 1e9, { int: true }),
  version: requiredNumber("Version", 0, 1e9, { int: true }),
  to: z.enum(["investigating", "closed", "open"], { error: "Choose investigating, closed or open." }),
  rootCause: optionalText(2000),
  correctiveAction: optionalText(2000),
  note: optionalText(2000),
});
export type IncidentMove = z.infer<typeof incidentMoveSchema>;

export const incidentNoteSchema = z.object({
  id: requiredNumber("Incident", 1, 1e9, { int: true }),
  note: z
    .string({ error: "Write the note." })
    .trim()
    .min(2, "Write the note.")
    .max(2000, "At most 2000 characters."),
});
export type IncidentNote = z.infer<typeof incidentNoteSchema>;
