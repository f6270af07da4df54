import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { ValidationError } from "@/lib/server/errors";
import { listIssueLots } from "@/lib/server/queries/stock-lots";
import { zodFieldErrors } from "@/lib/validation/field-errors";
import { lotsQuerySchema } from "@/lib/validation/stock";

export const dynamic = "force-dynamic";

/** The lots of a grease in the order they should leave the store (`?greaseId=&packId=&location=`). */
export const GET = apiRoute({ action: "stock.read" }, async ({ request, user }) => {
  const parsed = lotsQuerySchema.safeParse(Object.fromEntries(request.nextUrl.searchParams));
  if (!parsed.success) throw new ValidationError(zodFieldErrors(parsed.error));
  return jsonResponse({ items: await listIssueLots(user.id, parsed.data) });
});
