import { apiRoute } from "@/lib/server/api";
import { ValidationError } from "@/lib/server/errors";
import { beginIncidentExport, incidentCsvStream, incidentPdfStream } from "@/lib/server/incident-export";
import { assertOwnSiteCode, userSiteNames } from "@/lib/server/queries/incidents";
import { zodFieldErrors } from "@/lib/validation/field-errors";
import { incidentExportSchema } from "@/lib/validation/incidents";

export const dynamic = "force-dynamic";

/**
 * The incident log as a CSV or PDF download (`?format=csv|pdf&from=&to=` and the list's filters), streamed a page at
 * a time. The export itself is recorded in the audit trail first, and the chain head after that entry is printed in
 * the PDF and sent as headers, so the file can later be checked against the trail.
 */
export const GET = apiRoute({ action: "incidents.export" }, async ({ request, user }) => {
  const parsed = incidentExportSchema.safeParse(Object.fromEntries(request.nextUrl.searchParams));
  if (!parsed.success) throw new ValidationError(zodFieldErrors(parsed.error));
  const { format, ...filter } = parsed.data;
  await assertOwnSiteCode(user.id, filter.site);
  const now = new Date();
  const { counts, head } = await beginIncidentExport(user.id, format, filter, now);
  const day = now.toISOString().slice(0, 10);
  const headers = {
    "Content-Disposition": `attachment; filename="greaseledger-incidents-${day}.${format}"`,
    "Cache-Control": "private, no-store",
    "X-Total-Rows": String(counts.total),
    "X-Audit-Head-Seq": String(head.seq),
    "X-Audit-Head-Hash": head.hash,
  };
  if (format === "csv")
    return new Response(incidentCsvStream(user.id, filter), {
      headers: { ...headers, "Content-Type": "text/csv; charset=utf-8" },
    });
  const stream = incidentPdfStream({
    userId: user.id,
    filter,
    sites: await userSiteNames(user.id),
    counts,
    head,
    generatedBy: `${user.name} (${user.email})`,
    now,
  });
  return new Response(stream, { headers: { ...headers, "Content-Type": "application/pdf" } });
});
