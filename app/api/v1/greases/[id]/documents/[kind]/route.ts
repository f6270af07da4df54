import { apiRoute } from "@/lib/server/api";
import { NotFoundError } from "@/lib/server/errors";
import { parseId } from "@/lib/server/params";
import { listGreaseDocuments } from "@/lib/server/queries/greases";
import { documentDownload } from "@/lib/server/uploads";

export const dynamic = "force-dynamic";

/** Downloads a grease's data sheet (kind sds or tds); always as an attachment, never rendered in the page. */
export const GET = apiRoute<{ id: string; kind: string }>({ action: "catalogue.read" }, async ({ params }) => {
  const documents = await listGreaseDocuments(parseId(params.id));
  const entry = documents.find((d) => d.kind === params.kind);
  if (!entry) throw new NotFoundError("This grease has no such data sheet yet.");
  return documentDownload(entry.documentId);
});
