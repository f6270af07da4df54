import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { evaluatePair } from "@/lib/server/queries/compatibility";
import { evaluateSchema } from "@/lib/validation/compatibility";

export const dynamic = "force-dynamic";

/** May grease B meet grease A? The verdict, whether mixing is allowed, every reason with its source. Nothing is stored. */
export const POST = apiRoute({ action: "compatibility.evaluate", body: evaluateSchema }, async ({ body, user }) => {
  const result = await evaluatePair(body, user.id);
  return jsonResponse({ verdict: result.verdict, mixingAllowed: result.mixingAllowed, reasons: result.reasons, charts: result.charts });
});
