import { jsonResponse } from "@/lib/server/json-response";
import { z } from "zod";
import { apiRoute } from "@/lib/server/api";
import { ValidationError } from "@/lib/server/errors";
import { parseId } from "@/lib/server/params";
import { requireGrease, setGreaseDocument } from "@/lib/server/queries/greases";
import { discardStoredFile, readUploadForm, storePdf } from "@/lib/server/uploads";

export const dynamic = "force-dynamic";

const kindSchema = z.enum(["sds", "tds"], { error: "Choose sds (safety data sheet) or tds (technical data sheet)." });

/** Upload a data sheet: multipart form with `kind` (sds | tds) and `file` (PDF, checked by content). */
export const POST = apiRoute<{ id: string }>({ action: "catalogue.write" }, async ({ request, params, user }) => {
  const greaseId = parseId(params.id);
  await requireGrease(greaseId);
  const form = await readUploadForm(request, "file");
  const kind = kindSchema.safeParse(form.get("kind"));
  if (!kind.success) throw new ValidationError({ kind: [kind.error.issues[0]!.message] });
  const documentId = await storePdf(form.get("file"), "file", user.id);
  try {
    await setGreaseDocument(greaseId, kind.data, documentId, user.id);
  } catch (error) {
    await discardStoredFile(documentId);
    throw error;
  }
  return jsonResponse({ documentId, kind: kind.data }, { status: 201 });
});
