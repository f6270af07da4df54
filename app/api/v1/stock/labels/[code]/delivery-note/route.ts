import { apiRoute } from "@/lib/server/api";
import { NotFoundError } from "@/lib/server/errors";
import { getLotLabel } from "@/lib/server/queries/stock-lots";
import { parseLabelParam } from "@/lib/server/tags";
import { documentDownload } from "@/lib/server/uploads";

export const dynamic = "force-dynamic";

/** The delivery note kept with a lot's receipt, as a download. */
export const GET = apiRoute<{ code: string }>({ action: "stock.read" }, async ({ params, user }) => {
  const label = await getLotLabel(parseLabelParam(params.code), user.id);
  if (label.deliveryDocumentId === null) throw new NotFoundError("No delivery note was kept with this lot.");
  return documentDownload(label.deliveryDocumentId);
});
