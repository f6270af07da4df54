import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { getLotLabel } from "@/lib/server/queries/stock-lots";
import { parseLabelParam } from "@/lib/server/tags";

export const dynamic = "force-dynamic";

/** What a container label stands for: grease, pack, lot, dates, where its containers are, a lot to take first. */
export const GET = apiRoute<{ code: string }>({ action: "stock.read" }, async ({ params, user }) => {
  return jsonResponse(await getLotLabel(parseLabelParam(params.code), user.id));
});
