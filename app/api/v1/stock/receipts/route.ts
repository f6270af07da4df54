import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { parseIdempotencyKey } from "@/lib/server/idempotency";
import { receiveStock } from "@/lib/server/queries/stock";
import { receiptSchema } from "@/lib/validation/stock";

export const dynamic = "force-dynamic";

export const POST = apiRoute(
  { action: "stock.receive", body: receiptSchema },
  async ({ request, body, user }) => {
    const answer = await receiveStock(
      body,
      user.id,
      parseIdempotencyKey(request.headers.get("idempotency-key")),
    );
    return jsonResponse(answer.body, { status: answer.status });
  },
);
