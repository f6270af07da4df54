import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { parseId } from "@/lib/server/params";
import { requireGrease, updateGrease } from "@/lib/server/queries/greases";
import { greasePatchSchema } from "@/lib/validation/grease";

export const dynamic = "force-dynamic";

type Params = { id: string };

export const GET = apiRoute<Params>({ action: "catalogue.read" }, async ({ params }) => jsonResponse(await requireGrease(parseId(params.id))));

export const PATCH = apiRoute<Params, typeof greasePatchSchema>(
  { action: "catalogue.write", body: greasePatchSchema },
  async ({ params, body, user }) => jsonResponse(await updateGrease(parseId(params.id), body, user.id)),
);
