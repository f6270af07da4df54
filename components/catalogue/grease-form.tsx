"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { useFieldArray, useForm, useWatch, type FieldPath } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { Field, describedBy, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import {
  BASE_OIL_LABELS,
  BASE_OIL_TYPES,
  FOOD_GRADES,
  FOOD_GRADE_LABELS,
  NLGI_GRADES,
  PACK_KINDS,
  SOLID_ADDITIVES,
  SOLID_ADDITIVE_LABELS,
  THICKENERS,
  THICKENER_LABELS,
  type NlgiGrade,
} from "@/lib/domain/catalogue";
import { nlgiGradeFromPenetration, penetrationMatchesGrade } from "@/lib/domain/consistency";
import { isoViscosityGrade, viscosityMatchesIsoVg } from "@/lib/domain/viscosity";
import type { ActionState } from "@/lib/validation/action-state";
import { greaseSchema, type GreaseFormValues, type GreaseInput } from "@/lib/validation/grease";

export type SaveGrease = (values: unknown) => Promise<ActionState & { id?: number }>;

export interface GreaseFormProps {
  initial?: GreaseFormValues & { version?: number };
  save: SaveGrease;
  submitLabel: string;
  suppliers: string[];
}

const EMPTY: GreaseFormValues = {
  code: "",
  name: "",
  supplier: "",
  thickener: "lithium_complex",
  baseOilType: "mineral",
  viscosity40: "",
  nlgiGrade: "2",
  foodGrade: "none",
  solidAdditives: [],
  packs: [{ kind: "cartridge", netMassGrams: 400 }],
};

/** Create and edit a grease; every bad field is explained under the field, cross-checks warn beside it. */
export function GreaseForm({ initial, save, submitLabel, suppliers }: GreaseFormProps) {
  const router = useRouter();
  const [result, setResult] = useState<ActionState>({ status: "idle" });
  const [pending, startTransition] = useTransition();
  const form = useForm<GreaseFormValues, unknown, GreaseInput>({
    resolver: zodResolver(greaseSchema),
    defaultValues: initial ?? EMPTY,
    mode: "onTouched",
  });
  const { register, handleSubmit, setError, control, formState } = form;
  const { errors } = formState;
  const packs = useFieldArray({ control, name: "packs" });

  const onSubmit = handleSubmit((values) =>
    startTransition(async () => {
      const state = await save({ ...values, ...(initial?.version ? { version: initial.version } : {}) });
      setResult(state);
      if (state.status === "invalid") {
        for (const [name, messages] of Object.entries(state.fieldErrors)) {
          setError(name as FieldPath<GreaseFormValues>, { message: messages[0] });
        }
      }
      if (state.status === "success" && state.id) router.push(`/catalogue/${state.id}`);
    }),
  );

  const err = (name: string): string | undefined => {
    const parts = name.split(".");
    let node: unknown = errors;
    for (const part of parts) node = (node as Record<string, unknown> | undefined)?.[part];
    return (node as { message?: string } | undefined)?.message;
  };
  const text = (name: FieldPath<GreaseFormValues>, label: string, props: React.InputHTMLAttributes<HTMLInputElement> = {}, hint?: string) => (
    <Field id={name} label={label} errors={err(name)} hint={hint}>
      <input
        id={name}
        className={inputClasses}
        aria-invalid={Boolean(err(name))}
        aria-describedby={describedBy(name, Boolean(hint))}
        {...props}
        {...register(name)}
      />
    </Field>
  );

  const [nlgiRaw, penetrationRaw, v40Raw, isoVgRaw] = useWatch({ control, name: ["nlgiGrade", "workedPenetration", "viscosity40", "isoVg"] });
  const nlgi = nlgiRaw as NlgiGrade;
  const penetration = Number(penetrationRaw);
  const v40 = Number(v40Raw);
  const isoVg = Number(isoVgRaw);
  const warnings: string[] = [];
  if (penetrationRaw && Number.isFinite(penetration) && nlgi && !penetrationMatchesGrade(nlgi, penetration)) {
    const found = nlgiGradeFromPenetration(penetration);
    const said = found.nlgiGrade ?? (found.between ? `between ${found.between[0]} and ${found.between[1]}` : "outside the NLGI scale");
    warnings.push(`A worked penetration of ${penetration} (0.1 mm) is NLGI ${said}, not the grade ${nlgi} you chose.`);
  }
  if (isoVgRaw && v40 > 0 && isoVg > 0 && !viscosityMatchesIsoVg(isoVg, v40)) {
    const grade = isoViscosityGrade(v40);
    warnings.push(`${v40} mm²/s at 40 °C is ${grade ? `ISO VG ${grade}` : "in no ISO VG class"}, not ISO VG ${isoVg}.`);
  }

  return (
    <form onSubmit={onSubmit} noValidate className="space-y-6" aria-label="Grease">
      {result.status === "error" ? <Notice tone="danger">{result.message}</Notice> : null}
      {result.status === "invalid" && result.message ? <Notice tone="danger">{result.message}</Notice> : null}

      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lg font-bold">Product</legend>
        {text("code", "Code", { autoComplete: "off" }, "Your own short code, printed on labels.")}
        {text("name", "Product name")}
        {text("supplier", "Supplier", { list: "suppliers" })}
        <datalist id="suppliers">
          {suppliers.map((s) => (
            <option key={s} value={s} />
          ))}
        </datalist>
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lg font-bold">Composition</legend>
        <Field id="thickener" label="Thickener" errors={err("thickener")}>
          <select id="thickener" className={inputClasses} aria-describedby={describedBy("thickener")} {...register("thickener")}>
            {THICKENERS.map((t) => (
              <option key={t} value={t}>
                {THICKENER_LABELS[t]}
              </option>
            ))}
          </select>
        </Field>
        <Field id="baseOilType" label="Base oil" errors={err("baseOilType")}>
          <select id="baseOilType" className={inputClasses} aria-describedby={describedBy("baseOilType")} {...register("baseOilType")}>
            {BASE_OIL_TYPES.map((b) => (
              <option key={b} value={b}>
                {BASE_OIL_LABELS[b]}
              </option>
            ))}
          </select>
        </Field>
        <fieldset>
          <legend className="text-sm font-bold">Solid additives</legend>
          {SOLID_ADDITIVES.map((s) => (
            <label key={s} className="flex min-h-9 items-center gap-2 text-sm">
              <input type="checkbox" value={s} className="h-5 w-5" {...register("solidAdditives")} />
              {SOLID_ADDITIVE_LABELS[s]}
            </label>
          ))}
          {err("solidAdditives") ? <p className="text-sm text-bad">{err("solidAdditives")}</p> : null}
        </fieldset>
      </fieldset>

      <fieldset className="grid gap-4 md:grid-cols-4">
        <legend className="mb-2 text-lg font-bold">Properties (from the technical data sheet)</legend>
        {text("viscosity40", "Base-oil viscosity at 40 °C (mm²/s)", { inputMode: "decimal" })}
        {text("viscosity100", "Base-oil viscosity at 100 °C (mm²/s)", { inputMode: "decimal" }, "Optional; lets the app estimate viscosity at operating temperature.")}
        {text("isoVg", "ISO VG stated by the maker", { inputMode: "numeric" }, "Optional; checked against the 40 °C viscosity.")}
        <Field id="nlgiGrade" label="NLGI grade" errors={err("nlgiGrade")}>
          <select id="nlgiGrade" className={inputClasses} aria-describedby={describedBy("nlgiGrade")} {...register("nlgiGrade")}>
            {NLGI_GRADES.map((g) => (
              <option key={g} value={g}>
                {g}
              </option>
            ))}
          </select>
        </Field>
        {text("workedPenetration", "Worked penetration, 60 strokes (0.1 mm)", { inputMode: "numeric" }, "Optional; checked against the NLGI grade.")}
        {text("droppingPointC", "Dropping point (°C)", { inputMode: "numeric" })}
        {text("minTemperatureC", "Lowest operating temperature (°C)", { inputMode: "numeric" })}
        {text("maxTemperatureC", "Highest operating temperature (°C)", { inputMode: "numeric" })}
      </fieldset>
      {warnings.length ? (
        <Notice tone="caution" title="Check these values">
          <ul className="list-disc pl-5">
            {warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </Notice>
      ) : null}

      <fieldset className="grid gap-4 md:grid-cols-3">
        <legend className="mb-2 text-lg font-bold">Food grade and storage</legend>
        <Field id="foodGrade" label="Food-grade category" errors={err("foodGrade")}>
          <select id="foodGrade" className={inputClasses} aria-describedby={describedBy("foodGrade")} {...register("foodGrade")}>
            {FOOD_GRADES.map((f) => (
              <option key={f} value={f}>
                {FOOD_GRADE_LABELS[f]}
              </option>
            ))}
          </select>
        </Field>
        {text("shelfLifeMonths", "Shelf life (months)", { inputMode: "numeric" }, "Used for the expiry date when a label gives none.")}
      </fieldset>

      <fieldset className="space-y-3">
        <legend className="mb-2 text-lg font-bold">Packs</legend>
        {packs.fields.length === 0 ? <p className="text-sm text-ink-soft">No pack sizes yet. Add the containers this grease comes in.</p> : null}
        {packs.fields.map((field, index) => (
          <div key={field.id} className="grid items-end gap-3 md:grid-cols-[10rem_12rem_1fr_auto]">
            <Field id={`packs.${index}.kind`} label="Container" errors={err(`packs.${index}.kind`)}>
              <select id={`packs.${index}.kind`} className={inputClasses} {...register(`packs.${index}.kind` as const)}>
                {PACK_KINDS.map((k) => (
                  <option key={k} value={k}>
                    {k}
                  </option>
                ))}
              </select>
            </Field>
            {text(`packs.${index}.netMassGrams`, "Net mass (g)", { inputMode: "numeric" })}
            {text(`packs.${index}.label`, "Label (optional)")}
            <Button variant="quiet" onClick={() => packs.remove(index)} aria-label={`Remove pack ${index + 1}`}>
              Remove
            </Button>
          </div>
        ))}
        <Button variant="secondary" onClick={() => packs.append({ kind: "cartridge", netMassGrams: 400 })}>
          Add a pack size
        </Button>
        {err("packs") ? <p className="text-sm text-bad">{err("packs")}</p> : null}
      </fieldset>

      <Field id="notes" label="Notes" errors={err("notes")}>
        <textarea id="notes" rows={3} className={inputClasses} {...register("notes")} />
      </Field>

      <div className="flex gap-3">
        <SubmitButton size="lg" pending={pending} pendingLabel="Saving…">
          {submitLabel}
        </SubmitButton>
        <Button variant="quiet" size="lg" onClick={() => router.back()}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
