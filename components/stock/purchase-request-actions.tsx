"use client";

import Link from "next/link";
import { useActionState } from "react";
import { buttonClasses } from "@/components/ui/button";
import { inputClasses } from "@/components/ui/field";
import { SubmitButton } from "@/components/ui/submit-button";
import type { ActionState } from "@/lib/validation/action-state";

export interface PurchaseRequestActionsProps {
  id: number;
  state: string;
  canManage: boolean;
  canReceive: boolean;
  action: (prev: ActionState, form: FormData) => Promise<ActionState>;
}

/** What can happen next to a purchase request: the lead orders or cancels it; the clerk receives against it. */
export function PurchaseRequestActions({
  id,
  state,
  canManage,
  canReceive,
  action,
}: PurchaseRequestActionsProps) {
  const [result, formAction] = useActionState(action, { status: "idle" });
  if (state !== "requested" && state !== "ordered") return null;
  return (
    <div className="mt-2 space-y-2">
      {result.status === "error" || result.status === "invalid" ? (
        <p className="text-sm text-bad" role="alert">
          ✖ {result.status === "error" ? result.message : Object.values(result.fieldErrors).flat().join(" ")}
        </p>
      ) : null}
      <div className="flex flex-wrap items-end gap-2">
        {canManage && state === "requested" ? (
          <form action={formAction} className="flex items-end gap-2" aria-label={`Order request ${id}`}>
            <input type="hidden" name="id" value={id} />
            <input type="hidden" name="state" value="ordered" />
            <label className="flex flex-col text-2xs font-bold">
              Order reference
              <input
                name="reference"
                className={`${inputClasses} min-h-8 w-32 py-1 text-sm`}
                placeholder="PO number"
              />
            </label>
            <SubmitButton pendingLabel="…">Mark ordered</SubmitButton>
          </form>
        ) : null}
        {canReceive ? (
          <Link href={`/stock/receive?request=${id}`} className={buttonClasses("secondary")}>
            Receive
          </Link>
        ) : null}
        {canManage ? (
          <form action={formAction} aria-label={`Cancel request ${id}`}>
            <input type="hidden" name="id" value={id} />
            <input type="hidden" name="state" value="cancelled" />
            <SubmitButton variant="quiet" pendingLabel="…">
              Cancel
            </SubmitButton>
          </form>
        ) : null}
      </div>
    </div>
  );
}
