import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { createGrease, listGreases } from "@/lib/server/queries/greases";
import { greaseSchema } from "@/lib/validation/grease";

export const dynamic = "force-dynamic";

export const GET = apiRoute({ action: "catalogue.read" }, async () => jsonResponse({ items: await listGreases() }));

export const POST = apiRoute({ action: "catalogue.write", body: greaseSchema }, async ({ body, user }) =>
  jsonResponse(await createGrease(body, user.id), { status: 201 }),
);
