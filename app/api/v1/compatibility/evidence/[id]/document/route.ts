import { apiRoute } from "@/lib/server/api";
import { NotFoundError } from "@/lib/server/errors";
import { parseId } from "@/lib/server/params";
import { listEvidence } from "@/lib/server/queries/compatibility";
import { attachmentHeader, readStoredDocument } from "@/lib/server/uploads";

export const dynamic = "force-dynamic";

/** The report or letter behind one evidence record, as an attachment. */
export const GET = apiRoute<{ id: string }>({ action: "catalogue.read" }, async ({ params }) => {
  const id = parseId(params.id);
  const evidence = (await listEvidence()).find((e) => e.id === id);
  if (!evidence?.documentId) throw new NotFoundError("This evidence has no document.");
  const doc = await readStoredDocument(evidence.documentId);
  return new Response(new Uint8Array(doc.body), {
    headers: {
      "Content-Type": doc.contentType,
      "Content-Disposition": attachmentHeader(doc.name),
      "X-Content-Type-Options": "nosniff",
      "Cache-Control": "private, no-store",
    },
  });
});
