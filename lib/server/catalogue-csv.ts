import "server-only";
import { parse } from "csv-parse/sync";
import { stringify } from "csv-stringify/sync";
import { neutraliseCell, restoreCell } from "@/lib/csv";
import { greaseSchema, type GreaseInput } from "@/lib/validation/grease";
import type { GreaseDto } from "./queries/greases";

/** The catalogue's CSV columns, in order; `packs` is `kind:grams` joined by `;`, `solid_additives` by `;`. */
export const GREASE_CSV_COLUMNS = [
  ["code", "code"],
  ["name", "name"],
  ["supplier", "supplier"],
  ["thickener", "thickener"],
  ["base_oil_type", "baseOilType"],
  ["viscosity_40_mm2s", "viscosity40"],
  ["viscosity_100_mm2s", "viscosity100"],
  ["nlgi_grade", "nlgiGrade"],
  ["worked_penetration", "workedPenetration"],
  ["iso_vg", "isoVg"],
  ["dropping_point_c", "droppingPointC"],
  ["min_temperature_c", "minTemperatureC"],
  ["max_temperature_c", "maxTemperatureC"],
  ["food_grade", "foodGrade"],
  ["solid_additives", "solidAdditives"],
  ["shelf_life_months", "shelfLifeMonths"],
  ["packs", "packs"],
  ["notes", "notes"],
] as const;

const FIELD_TO_COLUMN = new Map<string, string>(GREASE_CSV_COLUMNS.map(([column, field]) => [field, column]));
const REQUIRED = ["code", "name", "supplier", "thickener", "base_oil_type", "viscosity_40_mm2s", "nlgi_grade"];
export const MAX_IMPORT_ROWS = 2000;

export function greasesToCsv(greases: GreaseDto[]): string {
  const rows = greases.map((g) =>
    GREASE_CSV_COLUMNS.map(([, field]) => {
      if (field === "packs") return g.packs.map((p) => `${p.kind}:${p.netMassGrams}`).join(";");
      if (field === "solidAdditives") return g.solidAdditives.join(";");
      const value = g[field as keyof GreaseDto] as string | number | undefined;
      return neutraliseCell(value ?? "");
    }),
  );
  // RFC 4180: CRLF line ends, fields with comma, quote or line break quoted, quotes doubled.
  return stringify([GREASE_CSV_COLUMNS.map(([c]) => c), ...rows], { record_delimiter: "\r\n", quoted_match: /[",\r\n]/ });
}

export interface ImportRow {
  /** Line number in the file (the header is line 1). */
  line: number;
  cells: Record<string, string>;
  errors: Record<string, string>;
  input?: GreaseInput;
}

export interface ImportPreview {
  problems: string[];
  rows: ImportRow[];
}

function parsePacks(raw: string): unknown {
  if (!raw.trim()) return [];
  return raw.split(";").map((part) => {
    const [kind, grams, ...label] = part.split(":").map((s) => s.trim());
    return { kind, netMassGrams: grams, ...(label.length ? { label: label.join(":") } : {}) };
  });
}

/**
 * Reads a catalogue CSV and validates every row with the same schema as the form, without writing
 * anything. Each error is keyed by the CSV column it belongs to.
 */
export function parseGreaseCsv(text: string): ImportPreview {
  let records: string[][];
  try {
    records = parse(text, { bom: true, skip_empty_lines: true, relax_column_count: true, trim: true });
  } catch (error) {
    return { problems: [`The file is not readable as CSV: ${(error as Error).message}`], rows: [] };
  }
  const [header, ...body] = records;
  if (!header) return { problems: ["The file is empty."], rows: [] };
  const columns = header.map((h) => h.trim().toLowerCase());
  const missing = REQUIRED.filter((c) => !columns.includes(c));
  if (missing.length) return { problems: [`Missing column(s): ${missing.join(", ")}.`], rows: [] };
  if (body.length > MAX_IMPORT_ROWS) return { problems: [`At most ${MAX_IMPORT_ROWS} rows per file; this one has ${body.length}.`], rows: [] };

  const seen = new Map<string, number>();
  const rows = body.map((record, index): ImportRow => {
    const cells: Record<string, string> = {};
    columns.forEach((column, i) => (cells[column] = restoreCell(record[i] ?? "")));
    const raw: Record<string, unknown> = {};
    for (const [column, field] of GREASE_CSV_COLUMNS) {
      const cell = cells[column] ?? "";
      if (field === "packs") raw.packs = parsePacks(cell);
      else if (field === "solidAdditives") raw.solidAdditives = cell ? cell.split(";").map((s) => s.trim()).filter(Boolean) : [];
      else if (field === "foodGrade") raw.foodGrade = cell || undefined;
      else raw[field] = cell;
    }
    const parsed = greaseSchema.safeParse(raw);
    const errors: Record<string, string> = {};
    if (!parsed.success) {
      for (const issue of parsed.error.issues) {
        const column = FIELD_TO_COLUMN.get(String(issue.path[0])) ?? "row";
        errors[column] ??= issue.path.length > 1 ? `${issue.message} (item ${Number(issue.path[1]) + 1})` : issue.message;
      }
    }
    const code = (cells.code ?? "").toLowerCase();
    if (code && seen.has(code)) errors.code ??= `The same code is on line ${seen.get(code)} too.`;
    if (code && !seen.has(code)) seen.set(code, index + 2);
    return { line: index + 2, cells, errors, input: parsed.success && !Object.keys(errors).length ? parsed.data : undefined };
  });
  return { problems: [], rows };
}
