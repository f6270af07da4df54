"use client";

import { useActionState } from "react";
import { Field, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { formValues, type ActionState } from "@/lib/validation/action-state";

type FormAction = (prev: ActionState, form: FormData) => Promise<ActionState>;

function Result({ state }: { state: ActionState }) {
  if (state.status === "success") return <Notice tone="success">{state.message}</Notice>;
  if (state.status === "error") return <Notice tone="danger">{state.message}</Notice>;
  return null;
}

export function AreaForm({ sites, save }: { sites: { id: number; name: string }[]; save: FormAction }) {
  const [state, action] = useActionState(save, { status: "idle" });
  const errors = state.status === "invalid" ? state.fieldErrors : {};
  const sent = formValues(state, {} as Record<string, unknown>);
  const dv = (k: string) => (sent[k] === undefined ? undefined : String(sent[k]));
  return (
    <form action={action} className="space-y-3" aria-label="Add an area" key={state.status === "invalid" ? JSON.stringify(state.values) : "initial"}>
      <Result state={state} />
      <Field id="area-site" label="Site" errors={errors.siteId}>
        <select id="area-site" name="siteId" className={inputClasses}>
          {sites.map((s) => (
            <option key={s.id} value={s.id}>
              {s.name}
            </option>
          ))}
        </select>
      </Field>
      <Field id="area-code" label="Code" errors={errors.code}>
        <input id="area-code" name="code" defaultValue={dv("code")} className={inputClasses} />
      </Field>
      <Field id="area-name" label="Name" errors={errors.name}>
        <input id="area-name" name="name" defaultValue={dv("name")} className={inputClasses} />
      </Field>
      <SubmitButton variant="secondary">Add the area</SubmitButton>
    </form>
  );
}

export function AssetForm({ areas, save }: { areas: { id: number; label: string }[]; save: FormAction }) {
  const [state, action] = useActionState(save, { status: "idle" });
  const errors = state.status === "invalid" ? state.fieldErrors : {};
  const sent = formValues(state, {} as Record<string, unknown>);
  const dv = (k: string) => (sent[k] === undefined ? undefined : String(sent[k]));
  return (
    <form action={action} className="space-y-3" aria-label="Add an asset" key={state.status === "invalid" ? JSON.stringify(state.values) : "initial"}>
      <Result state={state} />
      <Field id="asset-area" label="Area" errors={errors.areaId}>
        <select id="asset-area" name="areaId" className={inputClasses}>
          {areas.map((a) => (
            <option key={a.id} value={a.id}>
              {a.label}
            </option>
          ))}
        </select>
      </Field>
      <Field id="asset-tag" label="Asset tag" errors={errors.tag}>
        <input id="asset-tag" name="tag" defaultValue={dv("tag")} className={inputClasses} />
      </Field>
      <Field id="asset-name" label="Name" errors={errors.name}>
        <input id="asset-name" name="name" defaultValue={dv("name")} className={inputClasses} />
      </Field>
      <Field id="asset-kind" label="Kind" errors={errors.kind}>
        <select id="asset-kind" name="kind" className={inputClasses} defaultValue="motor">
          {["motor", "pump", "fan", "conveyor", "gearbox", "crusher", "mill", "other"].map((k) => (
            <option key={k} value={k}>
              {k}
            </option>
          ))}
        </select>
      </Field>
      <Field id="asset-frame" label="Frame size (optional)" errors={errors.frameSize}>
        <input id="asset-frame" name="frameSize" defaultValue={dv("frameSize")} className={inputClasses} />
      </Field>
      <SubmitButton variant="secondary">Add the asset</SubmitButton>
    </form>
  );
}
