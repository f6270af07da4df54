import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { ValidationError } from "@/lib/server/errors";
import { createEvidence, listEvidence } from "@/lib/server/queries/compatibility";
import { discardStoredFile, readUploadForm, storePdf } from "@/lib/server/uploads";
import { evidenceSchema } from "@/lib/validation/compatibility";
import { zodFieldErrors } from "@/lib/validation/field-errors";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ action: "catalogue.read" }, async () => jsonResponse({ items: await listEvidence() }));

/**
 * Records evidence about a pair: multipart form with `payload` (JSON, see evidenceSchema) and an optional
 * `file` (the report or letter, PDF checked by content). Nothing is stored unless everything is valid.
 */
export const POST = apiRoute({ action: "compatibility.rules.manage" }, async ({ request, user }) => {
  const form = await readUploadForm(request, "payload");
  let raw: unknown;
  try {
    raw = JSON.parse(String(form.get("payload") ?? ""));
  } catch {
    throw new ValidationError({ payload: ["payload must be JSON."] });
  }
  const parsed = evidenceSchema.safeParse(raw);
  if (!parsed.success) throw new ValidationError(zodFieldErrors(parsed.error));
  const file = form.get("file");
  const documentId = file instanceof File && file.size > 0 ? await storePdf(file, "file", user.id) : null;
  try {
    return jsonResponse(await createEvidence(parsed.data, user.id, documentId), { status: 201 });
  } catch (error) {
    if (documentId) await discardStoredFile(documentId);
    throw error;
  }
});
