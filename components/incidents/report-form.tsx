"use client";

import { useActionState } from "react";
import { Field, TextField, describedBy, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { formValues, type ActionState } from "@/lib/validation/action-state";

export interface ReportFormProps {
  greases: { id: number; code: string; name: string }[];
  initialTag?: string;
  action: (prev: ActionState, form: FormData) => Promise<ActionState>;
}

/** The lead reports a mix found after the fact: which point, which grease was found in it, what was seen. */
export function ReportForm({ greases, initialTag, action }: ReportFormProps) {
  const [state, formAction] = useActionState(action, { status: "idle" });
  const errors = state.status === "invalid" ? state.fieldErrors : {};
  const sent = formValues(state, { pointTag: initialTag ?? "" });
  const dv = (k: string) => (sent[k] === undefined ? undefined : String(sent[k]));
  return (
    <form
      action={formAction}
      aria-label="Report a mix found after the fact"
      className="space-y-4"
      key={state.status === "invalid" ? JSON.stringify(sent) : "form"}
    >
      {state.status === "error" ? <Notice tone="danger">{state.message}</Notice> : null}
      <TextField
        id="pointTag"
        name="pointTag"
        label="Lube point tag"
        autoComplete="off"
        inputClassName="font-mono uppercase"
        errors={errors.pointTag}
        defaultValue={dv("pointTag")}
        hint="The 8-character code under the point's QR tag."
      />
      <Field id="greaseFoundId" label="Grease found in the point" errors={errors.greaseFoundId}>
        <select
          id="greaseFoundId"
          name="greaseFoundId"
          className={inputClasses}
          defaultValue={dv("greaseFoundId") ?? ""}
          aria-invalid={Boolean(errors.greaseFoundId)}
          aria-describedby={describedBy("greaseFoundId")}
        >
          <option value="">Choose…</option>
          {greases.map((g) => (
            <option key={g.id} value={g.id}>
              {g.name} ({g.code})
            </option>
          ))}
        </select>
      </Field>
      <TextField
        id="description"
        name="description"
        label="What was found"
        rows={4}
        errors={errors.description}
        defaultValue={dv("description")}
      />
      <SubmitButton pendingLabel="Reporting…">Report the incident</SubmitButton>
    </form>
  );
}
