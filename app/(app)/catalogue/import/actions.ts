"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import { requireActionUser } from "@/lib/server/auth";
import { parseGreaseCsv, type ImportRow } from "@/lib/server/catalogue-csv";
import { AppError, toAppError } from "@/lib/server/errors";
import { existingGreaseCodes, importGreases } from "@/lib/server/queries/greases";

const textSchema = z.string().max(2_000_000, "The file is larger than 2 MB.");

export interface ImportPreviewState {
  status: "preview" | "imported" | "error";
  message?: string;
  problems: string[];
  rows: Omit<ImportRow, "input">[];
  importable: number;
  imported?: number;
}

async function check(text: unknown): Promise<{ rows: ImportRow[]; problems: string[] }> {
  const parsed = textSchema.safeParse(text);
  if (!parsed.success) return { rows: [], problems: [parsed.error.issues[0]!.message] };
  const preview = parseGreaseCsv(parsed.data);
  const existing = await existingGreaseCodes(preview.rows.map((r) => r.cells.code ?? "").filter(Boolean));
  for (const row of preview.rows) {
    if (row.cells.code && existing.has(row.cells.code.toLowerCase())) {
      row.errors.code ??= "The catalogue already has a grease with this code; it is skipped.";
      row.input = undefined;
    }
  }
  return preview;
}

const strip = (rows: ImportRow[]) => rows.map(({ line, cells, errors }) => ({ line, cells, errors }));

/** Checks a CSV file and reports every bad row and cell; writes nothing. */
export async function previewGreaseImportAction(text: unknown): Promise<ImportPreviewState> {
  try {
    await requireActionUser("catalogue.write");
    const { rows, problems } = await check(text);
    return { status: "preview", problems, rows: strip(rows), importable: rows.filter((r) => r.input).length };
  } catch (error) {
    const e = error instanceof AppError ? error : toAppError(error);
    return { status: "error", message: e.message, problems: [], rows: [], importable: 0 };
  }
}

/** Checks the file again and writes its good rows in one transaction (all of them or none). */
export async function commitGreaseImportAction(text: unknown): Promise<ImportPreviewState> {
  try {
    const user = await requireActionUser("catalogue.write");
    const { rows, problems } = await check(text);
    const good = rows.flatMap((r) => (r.input ? [r.input] : []));
    if (problems.length || good.length === 0) {
      return { status: "preview", problems: problems.length ? problems : ["No row can be imported."], rows: strip(rows), importable: 0 };
    }
    const imported = await importGreases(good, user.id);
    revalidatePath("/catalogue");
    return { status: "imported", problems: [], rows: strip(rows), importable: good.length, imported };
  } catch (error) {
    const e = error instanceof AppError ? error : toAppError(error);
    return { status: "error", message: e.message, problems: [], rows: [], importable: 0 };
  }
}
