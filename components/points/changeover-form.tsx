"use client";

import { useActionState } from "react";
import { Field, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { formValues, type ActionState } from "@/lib/validation/action-state";

type FormAction = (prev: ActionState, form: FormData) => Promise<ActionState>;

/** The lead plans a changeover at a point, or cancels the one under way. */
export function ChangeoverForm({ tag, running, greases, plan, cancel }: { tag: string; running: boolean; greases: { id: number; name: string; code: string }[]; plan: FormAction; cancel: FormAction }) {
  const [planState, planAction] = useActionState(plan, { status: "idle" });
  const [cancelState, cancelAction] = useActionState(cancel, { status: "idle" });
  const errors = planState.status === "invalid" ? planState.fieldErrors : {};
  const sent = formValues(planState, {} as Record<string, unknown>);
  const dv = (k: string, fallback?: string | number) => (sent[k] === undefined ? fallback : String(sent[k]));
  if (running) {
    return (
      <form action={cancelAction} className="space-y-2">
        <input type="hidden" name="tag" value={tag} />
        {cancelState.status === "success" ? <Notice tone="success">{cancelState.message}</Notice> : null}
        {cancelState.status === "error" ? <Notice tone="danger">{cancelState.message}</Notice> : null}
        <SubmitButton variant="secondary" pendingLabel="Cancelling…">
          Cancel the changeover
        </SubmitButton>
      </form>
    );
  }
  return (
    <form action={planAction} className="space-y-3" aria-label="Plan a changeover" key={planState.status === "invalid" ? JSON.stringify(sent) : "initial"}>
      <input type="hidden" name="tag" value={tag} />
      {planState.status === "success" ? <Notice tone="success">{planState.message}</Notice> : null}
      {planState.status === "error" ? <Notice tone="danger">{planState.message}</Notice> : null}
      <Field id="toGreaseId" label="New grease" errors={errors.toGreaseId}>
        <select id="toGreaseId" name="toGreaseId" className={inputClasses} defaultValue={dv("toGreaseId", "")}>
          <option value="">Choose…</option>
          {greases.map((g) => (
            <option key={g.id} value={g.id}>
              {g.name} ({g.code})
            </option>
          ))}
        </select>
      </Field>
      <Field id="method" label="How the old grease goes" errors={errors.method}>
        <select id="method" name="method" className={inputClasses} defaultValue={dv("method", "purge")}>
          <option value="purge">Purge with the new grease (drain plug open)</option>
          <option value="clean_out">Clean out the housing first</option>
        </select>
      </Field>
      <div className="grid grid-cols-2 gap-3">
        <Field id="shortenedIntervalHours" label="Shortened interval (h)" errors={errors.shortenedIntervalHours} hint="Until the old grease is gone.">
          <input id="shortenedIntervalHours" name="shortenedIntervalHours" inputMode="numeric" defaultValue={dv("shortenedIntervalHours")} className={inputClasses} />
        </Field>
        <Field id="servicesPlanned" label="Services until done" errors={errors.servicesPlanned}>
          <input id="servicesPlanned" name="servicesPlanned" inputMode="numeric" defaultValue={dv("servicesPlanned", 3)} className={inputClasses} />
        </Field>
      </div>
      <Field id="co-notes" label="Instructions (optional)" errors={errors.notes}>
        <input id="co-notes" name="notes" defaultValue={dv("notes")} className={inputClasses} />
      </Field>
      <SubmitButton pendingLabel="Planning…">Plan the changeover</SubmitButton>
    </form>
  );
}
