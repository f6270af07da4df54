import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { openApiDocument } from "@/lib/server/openapi";

export const dynamic = "force-dynamic";

let document: Record<string, unknown> | undefined;

/** The OpenAPI 3.1 description of this API, generated from the schemas the route handlers validate with. */
export const GET = apiRoute({ public: true }, async () => jsonResponse((document ??= openApiDocument())));
