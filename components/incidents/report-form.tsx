"use client";

import { useActionState } from "react";
import { Field, describedBy, inputClasses } from "@/components/ui/field";
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
      <Field
        id="pointTag"
        label="Lube point tag"
        errors={errors.pointTag}
        hint="The 8-character code under the point's QR tag."
      >
        <input
          id="pointTag"
          name="pointTag"
          autoComplete="off"
          className={`${inputClasses} font-mono uppercase`}
          defaultValue={dv("pointTag")}
          aria-invalid={Boolean(errors.pointTag)}
          aria-describedby={describedBy("pointTag", true)}
        />
      </Field>
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
      <Field id="description" label="What was found" errors={errors.description}>
        <textarea
          id="description"
          name="description"
          rows={4}
          className={inputClasses}
          defaultValue={dv("description")}
          aria-invalid={Boolean(errors.description)}
          aria-describedby={describedBy("description")}
        />
      </Field>
      <SubmitButton pendingLabel="Reporting…">Report the incident</SubmitButton>
    </form>
  );
}
