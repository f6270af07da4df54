"use server";

import { z } from "zod";
import { formToObject, runAction } from "@/lib/server/action";
import { cancelChangeover, planChangeover } from "@/lib/server/queries/points";
import type { ActionState } from "@/lib/validation/action-state";
import { changeoverSchema } from "@/lib/validation/points";

export async function planChangeoverAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const values = formToObject(form);
  return runAction(
    { action: "points.write", schema: changeoverSchema, revalidate: [`/points/${String(values.tag)}`], success: "Changeover planned. The technician's next services follow it." },
    values,
    (data, user) => planChangeover(data, user.id),
  );
}

export async function cancelChangeoverAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const values = formToObject(form);
  return runAction(
    { action: "points.write", schema: z.object({ tag: z.string().min(8).max(10) }), revalidate: [`/points/${String(values.tag)}`], success: "Changeover cancelled." },
    values,
    (data, user) => cancelChangeover(data.tag, user.id),
  );
}
