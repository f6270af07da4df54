import { apiRoute } from "@/lib/server/api";
import { getLotLabel } from "@/lib/server/queries/stock-lots";
import { containerQrPng, parseLabelParam } from "@/lib/server/tags";

export const dynamic = "force-dynamic";

export const GET = apiRoute<{ code: string }>({ action: "stock.read" }, async ({ params, user }) => {
  const label = await getLotLabel(parseLabelParam(params.code), user.id);
  return new Response(new Uint8Array(await containerQrPng(label.labelCode)), {
    headers: {
      "Content-Type": "image/png",
      "Content-Disposition": `inline; filename="label-${label.labelCode}.png"`,
      "Cache-Control": "private, max-age=3600",
    },
  });
});
