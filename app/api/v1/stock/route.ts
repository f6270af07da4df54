import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { listStock } from "@/lib/server/queries/stock";

export const dynamic = "force-dynamic";

/** Containers on hand per grease, pack and location, with the reorder point (containers of that pack) and low flag. */
export const GET = apiRoute({ action: "stock.read" }, async ({ user }) =>
  jsonResponse({ items: await listStock(user.id) }),
);
