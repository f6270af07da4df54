"use server";

import { redirect } from "next/navigation";
import { formToObject, runAction } from "@/lib/server/action";
import {
  postCount,
  returnStock,
  scrapStock,
  setStockPolicy,
  transferStock,
  updatePurchaseRequest,
} from "@/lib/server/queries/stock-moves";
import { receiveStock } from "@/lib/server/queries/stock";
import type { ActionState } from "@/lib/validation/action-state";
import {
  countSchema,
  purchaseRequestUpdateSchema,
  receiptFormSchema,
  returnSchema,
  scrapSchema,
  stockPolicySchema,
  transferSchema,
} from "@/lib/validation/stock";

const key = (value: unknown) => (typeof value === "string" && value ? value : null);

/** Receives a delivery; on success opens the new lot, ready to print its labels. */
export async function receiveAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const values = formToObject(form);
  const note = form.get("deliveryNote");
  let labelCode: string | null = null;
  let quantity = 0;
  const state = await runAction(
    { action: "stock.receive", schema: receiptFormSchema, revalidate: ["/stock"], success: "Received." },
    values,
    async (data, user) => {
      const { idempotencyKey, ...input } = data;
      const answer = await receiveStock(input, user.id, key(idempotencyKey), new Date(), {
        deliveryNote: note instanceof File && note.size > 0 ? note : null,
      });
      const lot = (answer.body as { lot: { labelCode: string; quantity: number } }).lot;
      labelCode = lot.labelCode;
      quantity = lot.quantity;
    },
  );
  if (state.status === "success" && labelCode) redirect(`/stock/lots/${labelCode}?received=${quantity}`);
  return state;
}

export async function returnAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const values = formToObject(form);
  return runAction(
    {
      action: "stock.move",
      schema: returnSchema,
      revalidate: ["/stock", `/stock/lots/${String(values.labelCode)}`],
      success: "Returned to the store.",
    },
    values,
    async ({ idempotencyKey, ...input }, user) =>
      void (await returnStock(input, user.id, key(idempotencyKey))),
  );
}

export async function transferAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const values = formToObject(form);
  return runAction(
    {
      action: "stock.move",
      schema: transferSchema,
      revalidate: ["/stock", `/stock/lots/${String(values.labelCode)}`],
      success: "Moved.",
    },
    values,
    async ({ idempotencyKey, ...input }, user) =>
      void (await transferStock(input, user.id, key(idempotencyKey))),
  );
}

export async function scrapAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const values = formToObject(form);
  return runAction(
    {
      action: "stock.move",
      schema: scrapSchema,
      revalidate: ["/stock", `/stock/lots/${String(values.labelCode)}`],
      success: "Scrapped and written off.",
    },
    values,
    async ({ idempotencyKey, ...input }, user) =>
      void (await scrapStock(input, user.id, key(idempotencyKey))),
  );
}

/** The count sheet posts lotId/expected/counted per line (parallel fields) and one reason. */
export async function countAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  const values = formToObject(form, ["lotId", "expected", "counted"]);
  const ids = values.lotId as string[];
  const input = {
    location: values.location,
    reason: values.reason,
    idempotencyKey: values.idempotencyKey,
    lines: ids.map((lotId, i) => ({
      lotId,
      expected: (values.expected as string[])[i],
      counted: (values.counted as string[])[i],
    })),
  };
  let adjusted = 0;
  const state = await runAction(
    {
      action: "stock.count",
      schema: countSchema,
      revalidate: ["/stock", "/stock/count"],
      success: "Count posted.",
    },
    input,
    async ({ idempotencyKey, ...data }, user) => {
      const answer = await postCount(data, user.id, key(idempotencyKey));
      adjusted = (answer.body as { adjusted: number }).adjusted;
    },
  );
  if (state.status === "success")
    return {
      status: "success",
      message: adjusted
        ? `Count posted: ${adjusted} lot(s) adjusted.`
        : "Count posted: every lot matched the books.",
    };
  if (state.status === "invalid") return { ...state, values: { ...values } };
  return state;
}

export async function purchaseRequestAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(
    {
      action: "stock.reorder.manage",
      schema: purchaseRequestUpdateSchema,
      revalidate: ["/stock"],
      success: "Purchase request updated.",
    },
    formToObject(form),
    (data, user) => updatePurchaseRequest(data, user.id),
  );
}

export async function stockPolicyAction(_prev: ActionState, form: FormData): Promise<ActionState> {
  return runAction(
    {
      action: "stock.reorder.manage",
      schema: stockPolicySchema,
      revalidate: ["/stock"],
      success: "Reorder settings saved.",
    },
    formToObject(form),
    (data, user) => setStockPolicy(data, user.id),
  );
}
