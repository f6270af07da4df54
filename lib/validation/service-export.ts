import { z } from "zod";

const DAY_MS = 86_400_000;
/** The longest period one export may cover, in calendar years. */
export const SERVICE_EXPORT_MAX_YEARS = 3;
/** The period when only `to` (or nothing) is given: this many days before `to`. */
export const SERVICE_EXPORT_DEFAULT_DAYS = 365;

const blank = (v: unknown) => (v === "" || v === null ? undefined : v);

/** A UTC day as YYYY-MM-DD that names a real date (2026-02-30 is refused, not rolled over into March). */
const day = (label: string) =>
  z.preprocess(
    blank,
    z
      .string({ error: `${label} must be a date (YYYY-MM-DD).` })
      .regex(/^\d{4}-\d{2}-\d{2}$/, `${label} must be a date (YYYY-MM-DD).`)
      .refine((s) => isRealDay(s), `${label} is not a real date.`)
      .optional(),
  );

function isRealDay(s: string): boolean {
  const t = Date.parse(`${s}T00:00:00Z`);
  return !Number.isNaN(t) && new Date(t).toISOString().slice(0, 10) === s;
}

const isoDay = (ms: number) => new Date(ms).toISOString().slice(0, 10);

/** `day` plus whole calendar years, in UTC (29 February plus one year is 1 March). */
function addYears(dayText: string, years: number): string {
  const [y, m, d] = dayText.split("-").map(Number) as [number, number, number];
  return isoDay(Date.UTC(y + years, m - 1, d));
}

/**
 * The service-history export's query string: `format` (csv, the default), `from` and `to` (UTC days, both
 * included; `to` defaults to today, `from` to 365 days before `to`) and an optional `site` id. A period that
 * runs backwards or spans more than three years is refused on `from`. Built per request because the defaults
 * depend on today.
 */
export function serviceExportSchema(now: Date) {
  const today = isoDay(now.getTime());
  return z
    .object({
      format: z.preprocess(
        blank,
        z.enum(["csv"], { error: "format is csv (the only format of this export)." }).default("csv"),
      ),
      from: day("from"),
      to: day("to"),
      site: z.preprocess(
        blank,
        z.coerce
          .number({ error: "site must be a site id (a whole number)." })
          .int("site must be a site id (a whole number).")
          .positive("site must be a site id (a whole number).")
          .optional(),
      ),
    })
    .transform((q) => {
      const to = q.to ?? today;
      const from = q.from ?? isoDay(Date.parse(`${to}T00:00:00Z`) - SERVICE_EXPORT_DEFAULT_DAYS * DAY_MS);
      return { format: q.format, from, to, siteId: q.site };
    })
    .superRefine((q, ctx) => {
      if (q.from > q.to) {
        ctx.addIssue({
          code: "custom",
          path: ["from"],
          message: `from (${q.from}) must not be after to (${q.to}).`,
        });
      } else if (addYears(q.from, SERVICE_EXPORT_MAX_YEARS) <= q.to) {
        ctx.addIssue({
          code: "custom",
          path: ["from"],
          message: `The period may span at most ${SERVICE_EXPORT_MAX_YEARS} years: from must be after ${addYears(q.to, -SERVICE_EXPORT_MAX_YEARS)} when to is ${q.to}.`,
        });
      }
    });
}

export type ServiceExportQuery = z.output<ReturnType<typeof serviceExportSchema>>;
