import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { parseIdempotencyKey } from "@/lib/server/idempotency";
import { recordService } from "@/lib/server/queries/points";
import { parseTagParam } from "@/lib/server/tags";
import { serviceSchema } from "@/lib/validation/points";

export const dynamic = "force-dynamic";

/** Record a service; refused with 409 mixing_blocked (and an incident) when the grease must not go in. */
export const POST = apiRoute<{ tag: string }, typeof serviceSchema>({ action: "service.record", body: serviceSchema }, async ({ request, params, body, user }) => {
  const key = parseIdempotencyKey(request.headers.get("idempotency-key"));
  const answer = await recordService(parseTagParam(params.tag), user.id, body, key);
  return jsonResponse(answer.body, { status: answer.status });
});
