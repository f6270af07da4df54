"use server";

import { redirect } from "next/navigation";
import { formToObject, runAction } from "@/lib/server/action";
import { createArea, createAsset, savePoint } from "@/lib/server/queries/plant";
import type { ActionState } from "@/lib/validation/action-state";
import { areaSchema, assetSchema, pointSchema } from "@/lib/validation/points";

export async function createAreaAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction({ action: "points.write", schema: areaSchema, revalidate: ["/points/plant"], success: "Area added." }, formToObject(form), async (data, user) => {
    await createArea(data, user.id);
  });
}

export async function createAssetAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction({ action: "points.write", schema: assetSchema, revalidate: ["/points/plant"], success: "Asset added." }, formToObject(form), async (data, user) => {
    await createAsset(data, user.id);
  });
}

export async function savePointAction(tag: string | null, _prev: ActionState, form: FormData): Promise<ActionState> {
  let saved: string | null = null;
  const state = await runAction({ action: "points.write", schema: pointSchema, revalidate: ["/points", "/points/plant"], success: "Lube point saved." }, formToObject(form), async (data, user) => {
    saved = await savePoint(data, user.id, tag ?? undefined);
  });
  if (saved) redirect(`/points/${saved}`);
  return state;
}
