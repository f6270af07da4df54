import { apiRoute } from "@/lib/server/api";
import { ValidationError } from "@/lib/server/errors";
import { beginServiceExport, serviceCsvStream } from "@/lib/server/service-export";
import { zodFieldErrors } from "@/lib/validation/field-errors";
import { serviceExportSchema } from "@/lib/validation/service-export";

export const dynamic = "force-dynamic";

/**
 * The service history of the caller's sites as a CSV download (`?format=csv&from=&to=&site=`), streamed a page at a
 * time, oldest first. The export is written to the audit trail before the first byte, and the chain head after that
 * entry is sent as headers.
 */
export const GET = apiRoute({ action: "services.export" }, async ({ request, user }) => {
  const now = new Date();
  const parsed = serviceExportSchema(now).safeParse(Object.fromEntries(request.nextUrl.searchParams));
  if (!parsed.success) throw new ValidationError(zodFieldErrors(parsed.error));
  const { scope, total, head } = await beginServiceExport(user.id, parsed.data, now);
  return new Response(serviceCsvStream(scope), {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="greaseledger-services-${now.toISOString().slice(0, 10)}.csv"`,
      // no-transform: the server's gzip would spend about as much CPU as the export itself on a year of rows.
      "Cache-Control": "private, no-store, no-transform",
      "X-Total-Rows": String(total),
      "X-Audit-Head-Seq": String(head.seq),
      "X-Audit-Head-Hash": head.hash,
    },
  });
});
