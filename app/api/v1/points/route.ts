import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { ValidationError } from "@/lib/server/errors";
import { listPoints } from "@/lib/server/queries/points";
import { assertOwnSite } from "@/lib/server/queries/users";
import { zodFieldErrors } from "@/lib/validation/field-errors";
import { pointsQuerySchema } from "@/lib/validation/points";

export const dynamic = "force-dynamic";

/** Lube points of the caller's sites: `?site=` one site, `?due=ok|due|overdue`. */
export const GET = apiRoute({ action: "points.read" }, async ({ request, user }) => {
  const parsed = pointsQuerySchema.safeParse(Object.fromEntries(request.nextUrl.searchParams));
  if (!parsed.success) throw new ValidationError(zodFieldErrors(parsed.error));
  await assertOwnSite(user.id, parsed.data.site);
  const items = await listPoints(user.id, { siteId: parsed.data.site, due: parsed.data.due });
  return jsonResponse({ items: items.map(({ tag, name, asset, site, due, nextDueAt }) => ({ tag, name, asset, site, due, nextDueAt })) });
});
