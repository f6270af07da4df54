import { apiRoute } from "@/lib/server/api";
import { getLotLabel } from "@/lib/server/queries/stock-lots";
import { containerQrSvg, parseLabelParam } from "@/lib/server/tags";

export const dynamic = "force-dynamic";

export const GET = apiRoute<{ code: string }>({ action: "stock.read" }, async ({ params, user }) => {
  const label = await getLotLabel(parseLabelParam(params.code), user.id);
  return new Response(await containerQrSvg(label.labelCode), {
    headers: { "Content-Type": "image/svg+xml", "Cache-Control": "private, max-age=3600" },
  });
});
