"use client";

import { useActionState } from "react";
import { Field, TextField, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { formValues, type ActionState } from "@/lib/validation/action-state";

export interface ReorderSettingsFormProps {
  sites: { id: number; name: string }[];
  greases: { id: number; code: string; name: string }[];
  action: (prev: ActionState, form: FormData) => Promise<ActionState>;
}

/** The lead fixes a grease's reorder point at a site, or sets its safety stock; blank goes back to the schedule. */
export function ReorderSettingsForm({ sites, greases, action }: ReorderSettingsFormProps) {
  const [state, formAction] = useActionState(action, { status: "idle" });
  const errors = state.status === "invalid" ? state.fieldErrors : {};
  const sent = formValues(state, {});
  const dv = (k: string) => (sent[k] === undefined ? undefined : String(sent[k]));
  return (
    <form
      action={formAction}
      aria-label="Reorder settings"
      className="space-y-3"
      key={state.status === "invalid" ? JSON.stringify(sent) : "form"}
    >
      {state.status === "success" ? <Notice tone="success">{state.message}</Notice> : null}
      {state.status === "error" ? <Notice tone="danger">{state.message}</Notice> : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id="rp-site" label="Site" errors={errors.siteId}>
          <select
            id="rp-site"
            name="siteId"
            className={inputClasses}
            defaultValue={dv("siteId") ?? String(sites[0]?.id ?? "")}
          >
            {sites.map((s) => (
              <option key={s.id} value={s.id}>
                {s.name}
              </option>
            ))}
          </select>
        </Field>
        <Field id="rp-grease" label="Grease" errors={errors.greaseId}>
          <select id="rp-grease" name="greaseId" className={inputClasses} defaultValue={dv("greaseId") ?? ""}>
            <option value="">Choose…</option>
            {greases.map((g) => (
              <option key={g.id} value={g.id}>
                {g.name} ({g.code})
              </option>
            ))}
          </select>
        </Field>
        <TextField
          id="rp-kg"
          name="reorderPointKg"
          label="Fixed reorder point (kg)"
          inputMode="decimal"
          errors={errors.reorderPointKg}
          defaultValue={dv("reorderPointKg")}
          hint="Blank: worked out from the schedule, the lead time and the safety stock."
        />
        <TextField
          id="rp-weeks"
          name="safetyStockWeeks"
          label="Safety stock (weeks)"
          inputMode="decimal"
          errors={errors.safetyStockWeeks}
          defaultValue={dv("safetyStockWeeks")}
          hint="Blank: 2 weeks of forecast use."
        />
      </div>
      <SubmitButton variant="secondary" pendingLabel="Saving…">
        Save the reorder settings
      </SubmitButton>
    </form>
  );
}
