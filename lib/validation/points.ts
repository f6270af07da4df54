import { z } from "zod";
import { optionalNumber, optionalText } from "./fields";

export const serviceSchema = z.object({
  greaseId: z.number({ error: "Choose the grease in your hand (greaseId)." }).int().positive(),
  grams: optionalNumber("Grams applied", 0.01, 100_000),
  strokes: optionalNumber("Gun strokes", 1, 10_000, { int: true }),
  gunId: z.number().int().positive().optional(),
  notes: optionalText(1000),
  backPressure: z.boolean().optional(),
  purgeSeen: z.boolean().optional(),
  noise: z.boolean().optional(),
  housingTemperatureC: optionalNumber("Housing temperature (°C)", -60, 400),
});
export type ServiceBody = z.infer<typeof serviceSchema>;

export const pointsQuerySchema = z.object({
  site: z.coerce.number().int().positive().optional(),
  due: z.enum(["ok", "due", "overdue"], { error: "due is ok, due or overdue." }).optional(),
});
