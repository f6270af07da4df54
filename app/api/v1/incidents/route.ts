import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { ValidationError } from "@/lib/server/errors";
import { assertOwnSiteCode, listIncidents } from "@/lib/server/queries/incidents";
import { zodFieldErrors } from "@/lib/validation/field-errors";
import { incidentFilterSchema } from "@/lib/validation/incidents";

export const dynamic = "force-dynamic";

/** Mixing incidents of the caller's sites, newest first: `?from=&to=` (days, inclusive), `site`, `area`, `kind`, `state`. */
export const GET = apiRoute({ action: "incidents.read" }, async ({ request, user }) => {
  const parsed = incidentFilterSchema.safeParse(Object.fromEntries(request.nextUrl.searchParams));
  if (!parsed.success) throw new ValidationError(zodFieldErrors(parsed.error));
  await assertOwnSiteCode(user.id, parsed.data.site);
  return jsonResponse({ items: await listIncidents(user.id, parsed.data) });
});
