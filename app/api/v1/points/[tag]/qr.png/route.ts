import { apiRoute } from "@/lib/server/api";
import { getPointByTag } from "@/lib/server/queries/points";
import { parseTagParam, tagQrPng } from "@/lib/server/tags";

export const dynamic = "force-dynamic";

export const GET = apiRoute<{ tag: string }>({ action: "points.read" }, async ({ params, user }) => {
  const point = await getPointByTag(parseTagParam(params.tag), user.id);
  return new Response(new Uint8Array(await tagQrPng(point.tag)), {
    headers: { "Content-Type": "image/png", "Content-Disposition": `inline; filename="tag-${point.tag}.png"`, "Cache-Control": "private, max-age=3600" },
  });
});
