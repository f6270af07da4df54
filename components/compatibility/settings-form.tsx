"use client";

import { useActionState } from "react";
import { Field, describedBy, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { formValues, type ActionState } from "@/lib/validation/action-state";

export interface SettingsFormProps {
  site: { id: number; name: string };
  charts: { id: string; title: string; provenance: "transcribed" | "partly_transcribed" | "from_memory"; note: string }[];
  values: {
    enabledCharts: readonly string[];
    viscosityRatioLimit: number;
    nlgiStepLimit: number;
    droppingPointAllowanceC: number;
    workedPenetrationAllowance: number;
    storagePenetrationChangeAllowance: number;
    version: number;
  };
  save: (prev: ActionState, form: FormData) => Promise<ActionState>;
}

/** A site's compatibility settings: which charts count, and the thresholds; saved with a version check. */
export function SettingsForm({ site, charts, values, save }: SettingsFormProps) {
  const [state, action] = useActionState(save, { status: "idle" });
  const errors = state.status === "invalid" ? state.fieldErrors : {};
  const prefix = `site-${site.id}`;
  const sent = formValues(state, {} as Record<string, unknown>);
  const shown = (name: string, fallback: number) => (name in sent ? String(sent[name] ?? "") : fallback);
  const number = (name: string, label: string, value: number, hint: string) => (
    <Field id={`${prefix}-${name}`} label={label} hint={hint} errors={errors[name]}>
      <input
        id={`${prefix}-${name}`}
        name={name}
        defaultValue={shown(name, value)}
        inputMode="decimal"
        className={inputClasses}
        aria-describedby={describedBy(`${prefix}-${name}`, true)}
      />
    </Field>
  );
  return (
    <form action={action} className="space-y-5" aria-label={`Settings for ${site.name}`} key={state.status === "invalid" ? JSON.stringify(sent) : "initial"}>
      <input type="hidden" name="siteId" value={site.id} />
      <input type="hidden" name="version" value={values.version} />
      {state.status === "success" ? <Notice tone="success">{state.message}</Notice> : null}
      {state.status === "error" ? <Notice tone="danger">{state.message}</Notice> : null}
      {state.status === "invalid" && state.message ? <Notice tone="danger">{state.message}</Notice> : null}
      <fieldset className="space-y-2">
        <legend className="font-bold">Thickener charts the pair check uses (the strictest verdict wins)</legend>
        {charts.map((chart) => (
          <label key={chart.id} className="flex gap-3 rounded-md border border-line p-3">
            <input type="checkbox" name="enabledCharts" value={chart.id} defaultChecked={values.enabledCharts.includes(chart.id)} className="mt-1 h-5 w-5" />
            <span>
              <span className="font-bold">{chart.title}</span>
              {chart.provenance !== "transcribed" ? (
                <span className="mt-1 block text-sm text-caution">
                  ⚠ {chart.provenance === "from_memory" ? "Not checked against the published table: its cells are recalled from memory." : "Only part of this chart was checked against its source; the rest is recalled from memory."}{" "}
                  Enabling it can only make verdicts stricter or turn an unknown pair into a known one — check its cells before you rely on it.
                </span>
              ) : (
                <span className="mt-1 block text-sm text-good">✔ Every cell transcribed from the published table.</span>
              )}
              <span className="mt-1 block text-2xs text-ink-faint">{chart.note}</span>
            </span>
          </label>
        ))}
        {errors.enabledCharts ? <p className="text-sm text-bad">{errors.enabledCharts.join(" ")}</p> : null}
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-2">
        <legend className="mb-2 font-bold">Dilution thresholds (our settings, common practice, no published source)</legend>
        {number("viscosityRatioLimit", "Largest base-oil viscosity ratio at 40 °C", values.viscosityRatioLimit, "Above this ratio of the higher to the lower viscosity a mix is borderline.")}
        {number("nlgiStepLimit", "Largest NLGI grade difference", values.nlgiStepLimit, "More grade steps apart than this is borderline.")}
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 font-bold">Mixture test allowances (the standard&apos;s precision criteria are not public: set them from your lab)</legend>
        {number("droppingPointAllowanceC", "Dropping point allowance (°C)", values.droppingPointAllowanceC, "How far a mixture may fall below the lower neat grease.")}
        {number("workedPenetrationAllowance", "Worked penetration allowance (0.1 mm)", values.workedPenetrationAllowance, "After prolonged working.")}
        {number("storageChangeAllowance", "Storage change allowance (0.1 mm)", values.storagePenetrationChangeAllowance, "Penetration change after storage.")}
      </fieldset>
      <SubmitButton pendingLabel="Saving…">Save settings for {site.name}</SubmitButton>
    </form>
  );
}
