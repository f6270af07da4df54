import { jsonResponse } from "@/lib/server/json-response";
import { gunStrokes, relubricationInterval, replenishmentQuantity } from "@/lib/domain/relubrication";
import { apiRoute } from "@/lib/server/api";
import { relubricationSchema } from "@/lib/validation/calculations";

export const dynamic = "force-dynamic";

/** Interval, quantity and (with a gun) strokes for a bearing, with every step and warning. Nothing is stored. */
export const POST = apiRoute({ action: "calculations.use", body: relubricationSchema }, async ({ body }) => {
  const interval = relubricationInterval(body);
  const quantity = replenishmentQuantity({ outsideDiameterMm: body.outsideDiameterMm, widthMm: body.widthMm, replenishment: body.replenishment });
  const strokes = body.gunGramsPerStroke && quantity.quantityGrams !== null ? gunStrokes(quantity.quantityGrams, body.gunGramsPerStroke) : null;
  return jsonResponse({
    intervalHours: interval.intervalHours === null ? null : Math.round(interval.intervalHours),
    quantityGrams: quantity.quantityGrams === null ? null : Math.round(quantity.quantityGrams * 100) / 100,
    ...(strokes ? { strokes: strokes.strokes } : {}),
    method: `${interval.method}; ${quantity.method}`,
    steps: [...interval.steps, ...quantity.steps, ...(strokes?.steps ?? [])],
    warnings: [...interval.warnings, ...quantity.warnings, ...(strokes?.warnings ?? [])],
  });
});
