import { apiRoute } from "@/lib/server/api";
import { getPointByTag } from "@/lib/server/queries/points";
import { parseTagParam, tagQrSvg } from "@/lib/server/tags";

export const dynamic = "force-dynamic";

export const GET = apiRoute<{ tag: string }>({ action: "points.read" }, async ({ params, user }) => {
  const point = await getPointByTag(parseTagParam(params.tag), user.id);
  return new Response(await tagQrSvg(point.tag), { headers: { "Content-Type": "image/svg+xml", "Cache-Control": "private, max-age=3600" } });
});
