"use server";

import { runAction } from "@/lib/server/action";
import { createGrease, updateGrease } from "@/lib/server/queries/greases";
import type { ActionState } from "@/lib/validation/action-state";
import { greasePatchSchema, greaseSchema } from "@/lib/validation/grease";

export async function createGreaseAction(values: unknown): Promise<ActionState & { id?: number }> {
  let id: number | undefined;
  const state = await runAction(
    { action: "catalogue.write", schema: greaseSchema, revalidate: ["/catalogue"], success: "Grease added." },
    values,
    async (data, user) => {
      id = (await createGrease(data, user.id)).id;
    },
  );
  return { ...state, id };
}

export async function updateGreaseAction(greaseId: number, values: unknown): Promise<ActionState & { id?: number }> {
  const state = await runAction(
    { action: "catalogue.write", schema: greasePatchSchema, revalidate: ["/catalogue", `/catalogue/${greaseId}`], success: "Grease saved." },
    values,
    async (data, user) => {
      await updateGrease(greaseId, data, user.id);
    },
  );
  return { ...state, id: greaseId };
}
