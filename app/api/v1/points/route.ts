import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { ForbiddenError, ValidationError } from "@/lib/server/errors";
import { listPoints } from "@/lib/server/queries/points";
import { userSiteIds } from "@/lib/server/queries/users";
import { zodFieldErrors } from "@/lib/validation/field-errors";
import { pointsQuerySchema } from "@/lib/validation/points";

export const dynamic = "force-dynamic";

/** Lube points of the caller's sites: `?site=` one site, `?due=ok|due|overdue`. */
export const GET = apiRoute({ action: "points.read" }, async ({ request, user }) => {
  const parsed = pointsQuerySchema.safeParse(Object.fromEntries(request.nextUrl.searchParams));
  if (!parsed.success) throw new ValidationError(zodFieldErrors(parsed.error));
  // Another site is a 403 naming it (API.md), not an empty list that looks like "no points there".
  if (parsed.data.site !== undefined && !(await userSiteIds(user.id)).includes(parsed.data.site))
    throw new ForbiddenError(`You have no access to site ${parsed.data.site}.`, "site_forbidden");
  const items = await listPoints(user.id, { siteId: parsed.data.site, due: parsed.data.due });
  return jsonResponse({ items: items.map(({ tag, name, asset, site, due, nextDueAt }) => ({ tag, name, asset, site, due, nextDueAt })) });
});
