"use client";

import { useActionState } from "react";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import type { ActionState } from "@/lib/validation/action-state";

export function UnitsForm({ current, save }: { current: "metric" | "imperial"; save: (prev: ActionState, form: FormData) => Promise<ActionState> }) {
  const [state, action] = useActionState(save, { status: "idle" });
  return (
    <form action={action} className="space-y-3" aria-label="Units">
      {state.status === "success" ? <Notice tone="success">{state.message}</Notice> : null}
      {state.status === "error" || state.status === "invalid" ? <Notice tone="danger">{state.status === "error" ? state.message : "Choose metric or imperial."}</Notice> : null}
      <fieldset className="space-y-1">
        <legend className="font-bold">Units for lengths, masses and temperatures</legend>
        <label className="flex min-h-10 items-center gap-2">
          <input type="radio" name="unitSystem" value="metric" defaultChecked={current === "metric"} className="h-5 w-5" /> Metric (mm, g, °C)
        </label>
        <label className="flex min-h-10 items-center gap-2">
          <input type="radio" name="unitSystem" value="imperial" defaultChecked={current === "imperial"} className="h-5 w-5" /> Imperial (in, oz, °F)
        </label>
      </fieldset>
      <SubmitButton pendingLabel="Saving…">Save</SubmitButton>
    </form>
  );
}
