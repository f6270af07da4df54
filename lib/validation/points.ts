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

export const changeoverSchema = z.object({
  tag: z.string().min(8).max(10),
  toGreaseId: z.coerce.number({ error: "Choose the new grease." }).int().positive("Choose the new grease."),
  method: z.enum(["purge", "clean_out"], { error: "Choose purge or clean-out." }),
  shortenedIntervalHours: optionalNumber("Shortened interval (h)", 1, 100_000),
  servicesPlanned: z.coerce.number({ error: "Give the number of services." }).int().min(1, "At least one service.").max(20, "At most 20 services."),
  notes: optionalText(500),
});
