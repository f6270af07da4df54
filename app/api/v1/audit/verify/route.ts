import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { verifyAuditChain } from "@/lib/server/audit";

export const dynamic = "force-dynamic";

/** Rechecks the whole audit chain: `{ok, checked, firstBrokenSeq?}` (plus the head, so a copy can be compared). */
export const GET = apiRoute({ action: "audit.verify" }, async () => {
  const result = await verifyAuditChain();
  return jsonResponse(result, { headers: { "Cache-Control": "no-store" } });
});
