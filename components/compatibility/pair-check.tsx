"use client";

import { useMutation } from "@tanstack/react-query";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ApiError, apiFetch } from "@/lib/api-client";
import {
  BASE_OIL_LABELS,
  BASE_OIL_TYPES,
  FOOD_GRADES,
  NLGI_GRADES,
  THICKENERS,
  THICKENER_LABELS,
  type BaseOilType,
  type FoodGrade,
  type NlgiGrade,
  type Thickener,
} from "@/lib/domain/catalogue";
import type { MixResult } from "@/lib/domain/compatibility";
import { ReasonList } from "./reason-list";
import { VerdictBadge } from "./verdict-badge";

export interface PairCheckProps {
  greases: { id: number; code: string; name: string }[];
  initialA?: number;
  initialB?: number;
}

type Side = { mode: "product"; greaseId: string } | { mode: "profile"; thickener: Thickener; baseOilType: BaseOilType; viscosity40: string; nlgiGrade: NlgiGrade | ""; foodGrade: FoodGrade };

function ref(side: Side) {
  if (side.mode === "product") return { greaseId: Number(side.greaseId) };
  return {
    profile: {
      thickener: side.thickener,
      baseOilType: side.baseOilType,
      ...(side.viscosity40 ? { viscosity40: Number(side.viscosity40) } : {}),
      ...(side.nlgiGrade ? { nlgiGrade: side.nlgiGrade } : {}),
      foodGrade: side.foodGrade,
    },
  };
}

function SidePicker({ label, side, onChange, greases }: { label: string; side: Side; onChange: (s: Side) => void; greases: PairCheckProps["greases"] }) {
  const id = label.replace(/\W+/g, "-").toLowerCase();
  return (
    <fieldset className="space-y-3 rounded-card border border-line p-4">
      <legend className="px-1 text-lg font-bold">{label}</legend>
      <div className="flex gap-4 text-sm" role="radiogroup" aria-label={`${label}: how to describe it`}>
        <label className="flex min-h-10 items-center gap-2">
          <input type="radio" name={`${id}-mode`} checked={side.mode === "product"} onChange={() => onChange({ mode: "product", greaseId: "" })} />
          A product from the catalogue
        </label>
        <label className="flex min-h-10 items-center gap-2">
          <input
            type="radio"
            name={`${id}-mode`}
            checked={side.mode === "profile"}
            onChange={() => onChange({ mode: "profile", thickener: "lithium_complex", baseOilType: "mineral", viscosity40: "", nlgiGrade: "", foodGrade: "none" })}
          />
          Properties typed in
        </label>
      </div>
      {side.mode === "product" ? (
        <div className="flex flex-col gap-1">
          <label htmlFor={`${id}-product`} className="text-sm font-bold">
            Product
          </label>
          <select id={`${id}-product`} className={inputClasses} value={side.greaseId} onChange={(e) => onChange({ ...side, greaseId: e.target.value })}>
            <option value="">Choose a grease…</option>
            {greases.map((g) => (
              <option key={g.id} value={g.id}>
                {g.name} ({g.code})
              </option>
            ))}
          </select>
        </div>
      ) : (
        <div className="grid gap-3 sm:grid-cols-2">
          <label className="flex flex-col gap-1 text-sm font-bold">
            Thickener
            <select className={inputClasses} value={side.thickener} onChange={(e) => onChange({ ...side, thickener: e.target.value as Thickener })}>
              {THICKENERS.map((t) => (
                <option key={t} value={t}>
                  {THICKENER_LABELS[t]}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            Base oil
            <select className={inputClasses} value={side.baseOilType} onChange={(e) => onChange({ ...side, baseOilType: e.target.value as BaseOilType })}>
              {BASE_OIL_TYPES.map((b) => (
                <option key={b} value={b}>
                  {BASE_OIL_LABELS[b]}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            Viscosity at 40 °C (mm²/s, optional)
            <input className={inputClasses} inputMode="decimal" value={side.viscosity40} onChange={(e) => onChange({ ...side, viscosity40: e.target.value })} />
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            NLGI grade (optional)
            <select className={inputClasses} value={side.nlgiGrade} onChange={(e) => onChange({ ...side, nlgiGrade: e.target.value as NlgiGrade | "" })}>
              <option value="">not given</option>
              {NLGI_GRADES.map((g) => (
                <option key={g} value={g}>
                  {g}
                </option>
              ))}
            </select>
          </label>
          <label className="flex flex-col gap-1 text-sm font-bold">
            Food grade
            <select className={inputClasses} value={side.foodGrade} onChange={(e) => onChange({ ...side, foodGrade: e.target.value as FoodGrade })}>
              {FOOD_GRADES.map((f) => (
                <option key={f} value={f}>
                  {f}
                </option>
              ))}
            </select>
          </label>
        </div>
      )}
    </fieldset>
  );
}

/** The pair check: two products or two typed-in profiles, through `POST /api/v1/compatibility/evaluate`. */
export function PairCheck({ greases, initialA, initialB }: PairCheckProps) {
  const [a, setA] = useState<Side>({ mode: "product", greaseId: initialA ? String(initialA) : "" });
  const [b, setB] = useState<Side>({ mode: "product", greaseId: initialB ? String(initialB) : "" });
  const [foodGradeRequired, setFoodGradeRequired] = useState(false);
  const check = useMutation({
    mutationFn: () => apiFetch<MixResult>("/api/v1/compatibility/evaluate", { method: "POST", json: { a: ref(a), b: ref(b), point: { foodGradeRequired } } }),
  });
  const incomplete = (a.mode === "product" && !a.greaseId) || (b.mode === "product" && !b.greaseId);
  const fieldErrors = check.error instanceof ApiError ? check.error.body?.error.fields : undefined;

  return (
    <div className="space-y-6">
      <div className="grid gap-4 lg:grid-cols-2">
        <SidePicker label="Grease in the bearing" side={a} onChange={setA} greases={greases} />
        <SidePicker label="Grease to add" side={b} onChange={setB} greases={greases} />
      </div>
      <label className="flex min-h-10 items-center gap-2 text-sm">
        <input type="checkbox" className="h-5 w-5" checked={foodGradeRequired} onChange={(e) => setFoodGradeRequired(e.target.checked)} />
        The lube point is in a food-grade area (H1 required)
      </label>
      <Button size="lg" disabled={incomplete || check.isPending} onClick={() => check.mutate()}>
        {check.isPending ? "Checking…" : "Check this pair"}
      </Button>
      {check.isError ? (
        <Notice tone="danger" title="The check could not run">
          {check.error.message}
          {fieldErrors ? (
            <ul className="mt-1 list-disc pl-5">
              {Object.entries(fieldErrors).map(([k, v]) => (
                <li key={k}>
                  {k}: {v.join(" ")}
                </li>
              ))}
            </ul>
          ) : null}
        </Notice>
      ) : null}
      {check.data ? (
        <section aria-live="polite" aria-label="Result" className="space-y-4 rounded-card border border-line bg-paper-raised p-gutter">
          <div className="flex flex-wrap items-center gap-3">
            <VerdictBadge verdict={check.data.verdict} size="lg" />
            <p className="text-lg font-bold" data-testid="mixing-decision">
              {check.data.mixingAllowed ? "Mixing is allowed." : "Do not mix these greases."}
            </p>
          </div>
          {!check.data.mixingAllowed ? (
            <p className="text-sm text-ink-soft">
              To change this point to the new grease, plan a changeover: purge the old grease, or clean the housing, and
              shorten the relubrication interval until the old grease is gone. Follow the machine maker&apos;s instructions.
            </p>
          ) : null}
          <ReasonList reasons={check.data.reasons} />
        </section>
      ) : null}
    </div>
  );
}
