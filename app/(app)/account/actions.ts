"use server";

import { z } from "zod";
import { runAction } from "@/lib/server/action";
import { setUnitSystem } from "@/lib/server/queries/users";
import type { ActionState } from "@/lib/validation/action-state";

export async function setUnitsAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(
    { action: "account.self", schema: z.object({ unitSystem: z.enum(["metric", "imperial"], { error: "Choose metric or imperial." }) }), revalidate: ["/", "/account"], success: "Units saved." },
    { unitSystem: form.get("unitSystem") },
    (data, user) => setUnitSystem(user.id, data.unitSystem),
  );
}
