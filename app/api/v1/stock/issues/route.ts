import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { parseIdempotencyKey } from "@/lib/server/idempotency";
import { issueStock } from "@/lib/server/queries/stock";
import { issueLiveSchema } from "@/lib/validation/stock";

export const dynamic = "force-dynamic";

/** Issue containers, earliest expiry first (or from a scanned lot label); 409 insufficient_stock when there is not enough. */
export const POST = apiRoute(
  { action: "stock.issue", body: issueLiveSchema },
  async ({ request, body, user }) => {
    const answer = await issueStock(
      body,
      user.id,
      parseIdempotencyKey(request.headers.get("idempotency-key")),
    );
    return jsonResponse(answer.body, { status: answer.status });
  },
);
