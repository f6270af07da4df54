"use client";

import { useActionState, useState } from "react";
import { Field, describedBy, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { formValues, type ActionState } from "@/lib/validation/action-state";

export type MoveField =
  | {
      kind: "select";
      name: string;
      label: string;
      options: { value: string; label: string }[];
      initial?: string;
      hint?: string;
    }
  | { kind: "text"; name: string; label: string; numeric?: boolean; initial?: string; hint?: string };

export interface MoveFormProps {
  /** Prefix for element ids, unique on the page. */
  id: string;
  title: string;
  labelCode: string;
  fields: MoveField[];
  submit: string;
  pending: string;
  tone?: "primary" | "danger";
  action: (prev: ActionState, form: FormData) => Promise<ActionState>;
}

/** One small storeroom form on a lot's page (transfer, return, scrap): fields, errors under each, one button. */
export function MoveForm({
  id,
  title,
  labelCode,
  fields,
  submit,
  pending,
  tone = "primary",
  action,
}: MoveFormProps) {
  const [state, formAction] = useActionState(action, { status: "idle" });
  // A fresh key after each success: the next move is a new request, a retry of this one is not.
  const [key, setKey] = useState(() => crypto.randomUUID());
  const [seen, setSeen] = useState<ActionState>(state);
  if (seen !== state) {
    setSeen(state);
    if (state.status === "success") setKey(crypto.randomUUID());
  }
  const errors = state.status === "invalid" ? state.fieldErrors : {};
  const sent = formValues(state, {});
  return (
    <form
      action={formAction}
      className="space-y-3"
      aria-label={title}
      key={state.status === "invalid" ? JSON.stringify(sent) : key}
    >
      <h3 className="font-bold">{title}</h3>
      <input type="hidden" name="labelCode" value={labelCode} />
      <input type="hidden" name="idempotencyKey" value={key} />
      {state.status === "success" ? <Notice tone="success">{state.message}</Notice> : null}
      {state.status === "error" ? <Notice tone="danger">{state.message}</Notice> : null}
      {fields.map((f) => {
        const fid = `${id}-${f.name}`;
        const value = sent[f.name] === undefined ? f.initial : String(sent[f.name]);
        return (
          <Field key={f.name} id={fid} label={f.label} hint={f.hint} errors={errors[f.name]}>
            {f.kind === "select" ? (
              <select
                id={fid}
                name={f.name}
                defaultValue={value}
                className={inputClasses}
                aria-invalid={Boolean(errors[f.name])}
                aria-describedby={describedBy(fid, Boolean(f.hint))}
              >
                {f.options.map((o) => (
                  <option key={o.value} value={o.value}>
                    {o.label}
                  </option>
                ))}
              </select>
            ) : (
              <input
                id={fid}
                name={f.name}
                defaultValue={value}
                inputMode={f.numeric ? "numeric" : undefined}
                className={inputClasses}
                aria-invalid={Boolean(errors[f.name])}
                aria-describedby={describedBy(fid, Boolean(f.hint))}
              />
            )}
          </Field>
        );
      })}
      <SubmitButton variant={tone === "danger" ? "danger" : "primary"} pendingLabel={pending}>
        {submit}
      </SubmitButton>
    </form>
  );
}
