import { apiRoute } from "@/lib/server/api";
import { NotFoundError } from "@/lib/server/errors";
import { parseId } from "@/lib/server/params";
import { listEvidence } from "@/lib/server/queries/compatibility";
import { documentDownload } from "@/lib/server/uploads";

export const dynamic = "force-dynamic";

/** The report or letter behind one evidence record, as an attachment. */
export const GET = apiRoute<{ id: string }>({ action: "catalogue.read" }, async ({ params }) => {
  const [evidence] = await listEvidence({ id: parseId(params.id) });
  if (!evidence?.documentId) throw new NotFoundError("This evidence has no document.");
  return documentDownload(evidence.documentId);
});
