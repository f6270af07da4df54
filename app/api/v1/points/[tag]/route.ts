import { jsonResponse } from "@/lib/server/json-response";
import { apiRoute } from "@/lib/server/api";
import { getPointByTag, pointApiDto } from "@/lib/server/queries/points";
import { parseTagParam } from "@/lib/server/tags";

export const dynamic = "force-dynamic";

export const GET = apiRoute<{ tag: string }>({ action: "points.read" }, async ({ params, user }) =>
  jsonResponse(pointApiDto(await getPointByTag(parseTagParam(params.tag), user.id))),
);
