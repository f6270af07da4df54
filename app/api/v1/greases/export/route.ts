import { apiRoute } from "@/lib/server/api";
import { greasesToCsv } from "@/lib/server/catalogue-csv";
import { listGreases } from "@/lib/server/queries/greases";

export const dynamic = "force-dynamic";

/** The catalogue as CSV (RFC 4180, formulas neutralised), as a download. */
export const GET = apiRoute({ action: "catalogue.read" }, async () => {
  const csv = greasesToCsv(await listGreases());
  const day = new Date().toISOString().slice(0, 10);
  return new Response(`\uFEFF${csv}`, {
    headers: {
      "Content-Type": "text/csv; charset=utf-8",
      "Content-Disposition": `attachment; filename="greaseledger-catalogue-${day}.csv"`,
      "Cache-Control": "private, no-store",
    },
  });
});
