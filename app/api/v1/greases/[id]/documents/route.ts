import { jsonResponse } from "@/lib/server/json-response";
import { z } from "zod";
import { apiRoute } from "@/lib/server/api";
import { PayloadTooLargeError, UnsupportedMediaTypeError, ValidationError } from "@/lib/server/errors";
import { parseId } from "@/lib/server/params";
import { requireGrease, setGreaseDocument } from "@/lib/server/queries/greases";
import { PDF_LIMIT_BYTES, discardStoredFile, storePdf } from "@/lib/server/uploads";

export const dynamic = "force-dynamic";

const kindSchema = z.enum(["sds", "tds"], { error: "Choose sds (safety data sheet) or tds (technical data sheet)." });

/** Upload a data sheet: multipart form with `kind` (sds | tds) and `file` (PDF, checked by content). */
export const POST = apiRoute<{ id: string }>({ action: "catalogue.write" }, async ({ request, params, user }) => {
  const greaseId = parseId(params.id);
  await requireGrease(greaseId);
  if (!/^multipart\/form-data/i.test(request.headers.get("content-type") ?? "")) {
    throw new UnsupportedMediaTypeError("Send the file as multipart/form-data.");
  }
  const declared = Number(request.headers.get("content-length") ?? "0");
  // Checked before reading: the whole request may not exceed the file limit (the form's own overhead is small).
  if (declared > PDF_LIMIT_BYTES) throw new PayloadTooLargeError(PDF_LIMIT_BYTES);
  const form = await request.formData().catch(() => {
    throw new ValidationError({ file: ["The upload could not be read."] });
  });
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
