import "server-only";
import { createHash, randomUUID } from "node:crypto";
import { mkdir, readFile, rm, writeFile } from "node:fs/promises";
import path from "node:path";
import { fileTypeFromBuffer } from "file-type";
import type { Transaction } from "sequelize";
import { getEnv } from "@/lib/env";
import { StoredDocument } from "@/models";
import { boundModels } from "./db";
import { NotFoundError, PayloadTooLargeError, UnsupportedMediaTypeError, ValidationError } from "./errors";

/** Data sheets and delivery notes: PDF only, at most 10 MB. */
export const PDF_LIMIT_BYTES = 10 * 1024 * 1024;
/** A multipart request may carry a file at the limit plus the form around it (boundaries, headers, a few fields). */
export const UPLOAD_REQUEST_LIMIT_BYTES = PDF_LIMIT_BYTES + 64 * 1024;

function uploadDir() {
  return path.resolve(getEnv().UPLOAD_DIR);
}

/** Keeps a readable, harmless version of the name a person gave the file (never used as a path). */
export function safeDisplayName(name: string): string {
  const base = name.split(/[\\/]/).pop() ?? "document.pdf";
  const cleaned = base.replace(/[\u0000-\u001f\u007f"<>|:*?]/g, "_").replace(/^\.+/, "").trim();
  return (cleaned || "document.pdf").slice(0, 200);
}

/**
 * Reads a multipart form, refusing with 413 a request larger than the upload limit — by its Content-Length before
 * reading, and by counting while reading when the body comes without one (chunked) — so an oversize upload is never
 * held in memory whole (413 names `file`, the form's one large part). 415 for another content type, 400 on
 * `unreadableField` for a form that does not parse.
 */
export async function readUploadForm(request: Request, unreadableField: string): Promise<FormData> {
  const type = request.headers.get("content-type") ?? "";
  if (!/^multipart\/form-data/i.test(type)) throw new UnsupportedMediaTypeError("Send the form as multipart/form-data.");
  if (Number(request.headers.get("content-length") ?? "0") > UPLOAD_REQUEST_LIMIT_BYTES) throw new PayloadTooLargeError(PDF_LIMIT_BYTES, "file");
  const chunks: Uint8Array[] = [];
  let total = 0;
  if (request.body) {
    const reader = request.body.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      total += value.byteLength;
      if (total > UPLOAD_REQUEST_LIMIT_BYTES) {
        await reader.cancel().catch(() => {});
        throw new PayloadTooLargeError(PDF_LIMIT_BYTES, "file");
      }
      chunks.push(value);
    }
  }
  try {
    return await new Response(Buffer.concat(chunks), { headers: { "content-type": type } }).formData();
  } catch {
    throw new ValidationError({ [unreadableField]: ["The upload could not be read as a form."] });
  }
}

/**
 * What is wrong with the name an upload came with, or null. A browser sends the file's own name only, so a folder
 * path, a control character or an over-long name means a hand-made request; it is refused rather than cleaned up.
 */
export function uploadNameProblem(name: string): string | null {
  if (name.length > 255) return "The file name is longer than 255 characters.";
  if (/[\u0000-\u001f\u007f]/.test(name)) return "The file name contains control characters.";
  if (/[\\/]/.test(name)) return "The file name contains a folder path (/ or \\); send the file under its own name.";
  if (/^\.+$/.test(name.trim())) return "The file name is not a name.";
  return null;
}

/** A name ending in another type's extension (`sheet.exe`, `photo.png`), though the content is a PDF. */
function misleadingExtension(name: string): string | null {
  const ext = /\.([A-Za-z]{2,4})$/.exec(name)?.[1];
  return ext && ext.toLowerCase() !== "pdf" ? ext : null;
}

/**
 * Checks an uploaded file by its content (the name and the declared type are not trusted), stores it
 * under a generated name outside public/, and records it. Throws 413 / 415 / 400 before anything is written.
 */
export async function storePdf(file: unknown, field: string, userId: string | null, transaction?: Transaction): Promise<number> {
  return (await storePdfFile(file, field, userId, transaction)).id;
}

/**
 * As storePdf, also giving the file's path, so a caller whose transaction later rolls back can remove the file
 * with `removeStoredFile` (the row goes with the transaction).
 */
export async function storePdfFile(file: unknown, field: string, userId: string | null, transaction?: Transaction): Promise<{ id: number; path: string }> {
  const { StoredDocument } = boundModels();
  if (!(file instanceof File) || file.size === 0) throw new ValidationError({ [field]: ["Choose a PDF file."] });
  const nameProblem = uploadNameProblem(file.name);
  if (nameProblem) throw new ValidationError({ [field]: [nameProblem] }, nameProblem);
  if (file.size > PDF_LIMIT_BYTES) throw new PayloadTooLargeError(PDF_LIMIT_BYTES, field);
  const buffer = Buffer.from(await file.arrayBuffer());
  const type = await fileTypeFromBuffer(buffer);
  if (type?.mime !== "application/pdf") {
    throw new UnsupportedMediaTypeError("Only PDF files are accepted; this file's content is not a PDF.", {
      [field]: ["The file's content is not a PDF."],
    });
  }
  const extension = misleadingExtension(file.name);
  if (extension) {
    const message = `The file is named .${extension}, but only PDF files (.pdf) are accepted; rename it if it is a PDF.`;
    throw new UnsupportedMediaTypeError(message, { [field]: [message] });
  }
  const storedName = randomUUID();
  await mkdir(uploadDir(), { recursive: true });
  const target = path.join(uploadDir(), storedName);
  await writeFile(target, buffer, { flag: "wx" });
  try {
    const doc = await StoredDocument.create(
      {
        storedName,
        originalName: safeDisplayName(file.name),
        contentType: "application/pdf",
        sizeBytes: buffer.length,
        sha256: createHash("sha256").update(buffer).digest("hex"),
        uploadedBy: userId,
        uploadedAt: new Date(),
      },
      { transaction },
    );
    return { id: doc.id, path: target };
  } catch (error) {
    await rm(target, { force: true });
    throw error;
  }
}

export async function removeStoredFile(path: string): Promise<void> {
  await rm(path, { force: true });
}

/** Removes a stored file whose database row was rolled back. */
export async function discardStoredFile(documentId: number) {
  const { StoredDocument } = boundModels();
  const doc = await StoredDocument.findByPk(documentId);
  if (doc) await rm(path.join(uploadDir(), doc.storedName), { force: true });
}

/** The bytes and the display name of a stored document. */
export async function readStoredDocument(id: number): Promise<{ name: string; contentType: string; body: Buffer }> {
  const doc = await StoredDocument.findByPk(id);
  if (!doc || !/^[0-9a-f-]{36}$/.test(doc.storedName)) throw new NotFoundError("No such document.");
  const body = await readFile(path.join(uploadDir(), doc.storedName)).catch(() => {
    throw new NotFoundError("The document's file is missing.");
  });
  return { name: doc.originalName, contentType: doc.contentType, body };
}

/** A Content-Disposition header that downloads the file under its display name (RFC 6266 / 5987). */
export function attachmentHeader(name: string): string {
  const ascii = name.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(name)}`;
}

/** A stored document as a download: always an attachment, never rendered, never cached by shared caches. */
export async function documentDownload(documentId: number): Promise<Response> {
  const doc = await readStoredDocument(documentId);
  return new Response(new Uint8Array(doc.body), {
    headers: {
      "Content-Type": doc.contentType,
      "Content-Disposition": attachmentHeader(doc.name),
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, no-store",
    },
  });
}
