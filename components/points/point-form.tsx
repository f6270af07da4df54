"use client";

import { useActionState } from "react";
import { Field, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { formValues, type ActionState } from "@/lib/validation/action-state";

type Values = Record<string, string | number | boolean | null | undefined>;

export interface PointFormProps {
  assets: { id: number; label: string }[];
  greases: { id: number; label: string }[];
  initial?: Values;
  save: (prev: ActionState, form: FormData) => Promise<ActionState>;
  submitLabel: string;
}

const LEVELS = [
  ["low", "low"],
  ["moderate", "moderate"],
  ["high", "high"],
  ["very_high", "very high"],
] as const;

/** The lead's form for a lube point: bearing, duty, environment, grease, maker's values and overrides. */
export function PointForm({ assets, greases, initial = {}, save, submitLabel }: PointFormProps) {
  const [state, action] = useActionState(save, { status: "idle" });
  const errors = state.status === "invalid" ? state.fieldErrors : {};
  // React resets a form after its action; an invalid answer carries the sent values so nothing typed is lost.
  const values = formValues(state, initial);
  const sent = state.status === "invalid" && state.values !== undefined;
  const v = (k: string) => (values[k] === null || values[k] === undefined ? "" : String(values[k]));
  const input = (name: string, label: string, hint?: string, inputMode: "decimal" | "text" = "decimal") => (
    <Field id={`pt-${name}`} label={label} hint={hint} errors={errors[name]}>
      <input id={`pt-${name}`} name={name} defaultValue={v(name)} inputMode={inputMode} className={inputClasses} aria-invalid={Boolean(errors[name])} />
    </Field>
  );
  const select = (name: string, label: string, options: readonly (readonly [string, string])[], fallback = "") => (
    <Field id={`pt-${name}`} label={label} errors={errors[name]}>
      <select id={`pt-${name}`} name={name} defaultValue={v(name) || fallback} className={inputClasses}>
        {options.map(([value, text]) => (
          <option key={value} value={value}>
            {text}
          </option>
        ))}
      </select>
    </Field>
  );
  const check = (name: string, label: string) => (
    <label className="flex min-h-10 items-center gap-2">
      <input type="checkbox" name={name} defaultChecked={sent ? values[name] === "on" : Boolean(values[name])} className="h-5 w-5" /> {label}
    </label>
  );
  return (
    <form action={action} className="space-y-6" aria-label="Lube point" key={sent ? JSON.stringify(values) : "initial"}>
      {state.status === "error" ? <Notice tone="danger">{state.message}</Notice> : null}
      {state.status === "invalid" ? <Notice tone="danger">{state.message ?? "Some fields need attention."}</Notice> : null}
      <fieldset className="grid gap-4 md:grid-cols-2">
        <legend className="mb-2 text-lg font-bold">Where</legend>
        {select("assetId", "Asset", [["", "Choose…"], ...assets.map((a) => [String(a.id), a.label] as const)])}
        {input("name", "Point name", "e.g. drive end, fan side", "text")}
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-4">
        <legend className="mb-2 text-lg font-bold">Bearing and duty</legend>
        {select("bearingType", "Bearing type", [["ball", "ball"], ["cylindrical_roller", "cylindrical roller"], ["needle_roller", "needle roller"], ["spherical_roller", "spherical roller"], ["tapered_roller", "tapered roller"]])}
        {input("bearingDesignation", "Designation", "optional, e.g. 6310", "text")}
        {input("boreMm", "Bore d (mm)")}
        {input("outsideDiameterMm", "Outside diameter D (mm)")}
        {input("widthMm", "Width B (mm)")}
        {input("speedRpm", "Speed (r/min)")}
        {input("operatingTemperatureC", "Operating temperature (°C)", "bearing housing, optional")}
        {input("runningHoursPerDay", "Running hours per day", "1–24")}
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-4">
        <legend className="mb-2 text-lg font-bold">Environment</legend>
        {select("contamination", "Contamination", LEVELS, "low")}
        {select("moisture", "Moisture", LEVELS, "low")}
        {select("vibration", "Vibration", LEVELS, "low")}
        {select("replenishment", "Relubrication from", [["side", "the side"], ["centre", "the centre (through the ring)"]], "side")}
        <div className="md:col-span-4 flex flex-wrap gap-6">
          {check("verticalShaft", "Vertical shaft")}
          {check("foodGradeRequired", "Food-grade area (H1 only)")}
          {check("sealedForLife", "Sealed for life (never greased)")}
        </div>
      </fieldset>
      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lg font-bold">Grease and plan</legend>
        {select("assignedGreaseId", "Assigned grease", [["", "Choose…"], ...greases.map((g) => [String(g.id), g.label] as const)])}
        {input("makerIntervalHours", "Maker's interval (h)", "from the lubrication plate or manual; wins over the calculator")}
        {input("makerQuantityGrams", "Maker's quantity (g)")}
        {input("makerNote", "Maker's note", "optional", "text")}
        {input("intervalHoursOverride", "Override interval (h)", "optional; needs a reason")}
        {input("quantityGramsOverride", "Override quantity (g)", "optional; needs a reason")}
        <div className="md:col-span-3">{input("overrideReason", "Reason for the override", undefined, "text")}</div>
      </fieldset>
      <SubmitButton size="lg" pendingLabel="Saving…">
        {submitLabel}
      </SubmitButton>
    </form>
  );
}
