"use server";

import { revalidatePath } from "next/cache";
import { z } from "zod";
import type { ImportState } from "@/components/ui/csv-import";
import { requireActionUser } from "@/lib/server/auth";
import { AppError, toAppError } from "@/lib/server/errors";
import { commitPlantRows, previewPlantCsv } from "@/lib/server/plant-csv";

const textSchema = z.string().max(5_000_000, "The file is larger than 5 MB.");
const strip = (rows: { line: number; cells: Record<string, string>; errors: Record<string, string> }[]) => rows.map(({ line, cells, errors }) => ({ line, cells, errors }));

function fail(error: unknown): ImportState {
  const e = error instanceof AppError ? error : toAppError(error);
  return { status: "error", message: e.fields ? `${e.message} ${Object.values(e.fields).flat().join(" ")}` : e.message, problems: [], rows: [], importable: 0 };
}

export async function previewPlantImportAction(text: unknown): Promise<ImportState> {
  try {
    const user = await requireActionUser("points.write");
    const parsed = textSchema.safeParse(text);
    if (!parsed.success) return { status: "preview", problems: [parsed.error.issues[0]!.message], rows: [], importable: 0 };
    const { rows, problems } = await previewPlantCsv(parsed.data, user.id);
    return { status: "preview", problems, rows: strip(rows), importable: rows.filter((r) => r.plan).length };
  } catch (error) {
    return fail(error);
  }
}

export async function commitPlantImportAction(text: unknown): Promise<ImportState> {
  try {
    const user = await requireActionUser("points.write");
    const parsed = textSchema.safeParse(text);
    if (!parsed.success) return { status: "preview", problems: [parsed.error.issues[0]!.message], rows: [], importable: 0 };
    const { rows, problems } = await previewPlantCsv(parsed.data, user.id);
    const good = rows.filter((r) => r.plan);
    if (problems.length || !good.length) return { status: "preview", problems: problems.length ? problems : ["No row can be imported."], rows: strip(rows), importable: 0 };
    const counts = await commitPlantRows(good, user.id);
    revalidatePath("/points");
    return { status: "imported", problems: [], rows: strip(rows), importable: good.length, imported: counts.points };
  } catch (error) {
    return fail(error);
  }
}
