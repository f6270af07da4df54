"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useRef, useState } from "react";
import { ReasonList } from "@/components/compatibility/reason-list";
import { VerdictBadge } from "@/components/compatibility/verdict-badge";
import { Button } from "@/components/ui/button";
import { inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { ApiError, apiFetch } from "@/lib/api-client";
import type { Reason, Verdict } from "@/lib/domain/compatibility";
import { DueBadge, type Due } from "./due-badge";

interface LivePoint {
  tag: string;
  due: Due;
  nextDueAt: string | null;
  lastServicedAt: string | null;
  currentGrease: { id: number; name: string } | null;
  assignedGrease: { id: number; name: string } | null;
  quantityGrams: number | null;
  sealedForLife: boolean;
}

interface Refusal {
  verdict: Verdict;
  incidentId: number;
  reasons: Reason[];
  error: { message: string };
}

export interface ServicePanelProps {
  tag: string;
  initial: LivePoint;
  greases: { id: number; code: string; name: string }[];
  guns: { id: number; label: string; gramsPerStroke: number }[];
}

/**
 * The technician's job at the point: confirm the grease in hand, then record grams or strokes and what was
 * seen. The server refuses a grease that must not go in; a retry reuses the same Idempotency-Key.
 */
export function ServicePanel({ tag, initial, greases, guns }: ServicePanelProps) {
  const queryClient = useQueryClient();
  const point = useQuery({ queryKey: ["point", tag], queryFn: () => apiFetch<LivePoint>(`/api/v1/points/${tag}`), initialData: initial });
  const [greaseId, setGreaseId] = useState("");
  const [mode, setMode] = useState<"grams" | "strokes">(guns.length ? "strokes" : "grams");
  const [amount, setAmount] = useState("");
  const [gunId, setGunId] = useState(guns[0] ? String(guns[0].id) : "");
  const [obs, setObs] = useState({ backPressure: false, purgeSeen: false, noise: false });
  const [housing, setHousing] = useState("");
  const [notes, setNotes] = useState("");
  const keyRef = useRef<string | null>(null);

  const record = useMutation({
    mutationFn: async () => {
      keyRef.current ??= crypto.randomUUID();
      const body = {
        greaseId: Number(greaseId),
        ...(mode === "grams" ? { grams: amount } : { strokes: amount, gunId: Number(gunId) }),
        ...obs,
        ...(housing ? { housingTemperatureC: housing } : {}),
        ...(notes ? { notes } : {}),
      };
      return apiFetch<{ service: { grams: number; nextDueAt: string | null; quantityFlag: string | null }; warnings: string[] }>(`/api/v1/points/${tag}/services`, {
        method: "POST",
        json: body,
        headers: { "Idempotency-Key": keyRef.current },
      });
    },
    // Network failures are retried with the same key; a definitive answer (2xx or 4xx) ends the key's life.
    retry: (count, error) => !(error instanceof ApiError) && count < 3,
    onSettled: (_data, error) => {
      if (!error || error instanceof ApiError) keyRef.current = null;
      void queryClient.invalidateQueries({ queryKey: ["point", tag] });
    },
  });

  const refusal = record.error instanceof ApiError && record.error.status === 409 && (record.error.body as unknown as Refusal | null)?.incidentId ? (record.error.body as unknown as Refusal) : null;
  const fields = record.error instanceof ApiError ? record.error.body?.error.fields : undefined;
  const live = point.data;

  if (live.sealedForLife) {
    return (
      <Notice tone="caution" title="Do not grease this bearing">
        It is sealed for life. Adding grease would damage the seals. Report noise or heat to the lead instead.
      </Notice>
    );
  }

  return (
    <section aria-label="Service" className="space-y-4">
      <div className="flex flex-wrap items-center gap-2 text-sm">
        <DueBadge due={live.due} />
        <span>Next due: {live.nextDueAt ? live.nextDueAt.slice(0, 16).replace("T", " ") : "now (never serviced)"}</span>
        <span className="text-ink-soft">· In the point: {live.currentGrease?.name ?? "nothing recorded"}</span>
      </div>
      <Notice tone="caution" title="Before you grease">
        Lock out where the job needs it. Wipe the nipple clean. Open the relief plug, pump slowly and stop on
        unusual back pressure — seals give way long before a gun does. Grease injected through skin is a medical
        emergency. Mind hot surfaces.
      </Notice>

      {record.isSuccess ? (
        <Notice tone="success" title="Service recorded">
          {record.data.service.grams} g recorded. Next due {record.data.service.nextDueAt?.slice(0, 10) ?? "—"}.
          {record.data.warnings.map((w) => (
            <span key={w} className="mt-1 block font-bold text-caution">
              ⚠ {w}
            </span>
          ))}
        </Notice>
      ) : null}

      {refusal ? (
        <div role="alert" className="space-y-3 rounded-card border-2 border-bad bg-bad-light p-4" data-testid="service-refused">
          <div className="flex flex-wrap items-center gap-2">
            <VerdictBadge verdict={refusal.verdict} size="lg" />
            <p className="text-lg font-bold text-bad">Stop: do not put this grease in.</p>
          </div>
          <p className="text-sm">
            The service was not recorded. Mixing incident #{refusal.incidentId} was opened and the lubrication lead has
            been told. Take the right grease (
            {live.assignedGrease?.name ?? live.currentGrease?.name ?? "ask the lead"}) or ask the lead to plan a changeover.
          </p>
          <ReasonList reasons={refusal.reasons} />
        </div>
      ) : record.isError ? (
        <Notice tone="danger" title="Not recorded">
          {record.error.message}
          {fields ? <span className="block">{Object.entries(fields).map(([k, v]) => `${k}: ${v.join(" ")}`).join(" ")}</span> : null}
        </Notice>
      ) : null}

      <form
        className="space-y-4"
        aria-label="Record a service"
        onSubmit={(e) => {
          e.preventDefault();
          record.mutate();
        }}
      >
        <div className="flex flex-col gap-1">
          <label htmlFor="grease-in-hand" className="text-base font-bold">
            Grease in your hand
          </label>
          <select id="grease-in-hand" className={`${inputClasses} min-h-touch text-lg`} value={greaseId} onChange={(e) => setGreaseId(e.target.value)} required>
            <option value="">Choose the cartridge you hold…</option>
            {greases.map((g) => (
              <option key={g.id} value={g.id}>
                {g.name} ({g.code})
              </option>
            ))}
          </select>
          {live.assignedGrease ? <p className="text-sm text-ink-soft">Assigned to this point: {live.assignedGrease.name}</p> : null}
        </div>
        <fieldset className="space-y-2">
          <legend className="text-base font-bold">Amount{live.quantityGrams ? ` (planned ${live.quantityGrams} g)` : ""}</legend>
          <div className="flex gap-4">
            {guns.length ? (
              <label className="flex min-h-touch items-center gap-2">
                <input type="radio" name="mode" checked={mode === "strokes"} onChange={() => setMode("strokes")} className="h-6 w-6" /> Gun strokes
              </label>
            ) : null}
            <label className="flex min-h-touch items-center gap-2">
              <input type="radio" name="mode" checked={mode === "grams"} onChange={() => setMode("grams")} className="h-6 w-6" /> Grams
            </label>
          </div>
          {mode === "strokes" ? (
            <div className="flex flex-col gap-1">
              <label htmlFor="gun" className="text-sm font-bold">
                Grease gun
              </label>
              <select id="gun" className={`${inputClasses} min-h-touch`} value={gunId} onChange={(e) => setGunId(e.target.value)}>
                {guns.map((g) => (
                  <option key={g.id} value={g.id}>
                    {g.label} ({g.gramsPerStroke} g per stroke)
                  </option>
                ))}
              </select>
            </div>
          ) : null}
          <label htmlFor="amount" className="text-sm font-bold">
            {mode === "strokes" ? "Strokes given" : "Grams applied"}
          </label>
          <input id="amount" inputMode="decimal" className={`${inputClasses} min-h-touch text-lg`} value={amount} onChange={(e) => setAmount(e.target.value)} />
        </fieldset>
        <fieldset className="grid gap-2 sm:grid-cols-3">
          <legend className="text-base font-bold">What you saw</legend>
          {(
            [
              ["backPressure", "Back pressure"],
              ["purgeSeen", "Old grease purged out"],
              ["noise", "Bearing noise"],
            ] as const
          ).map(([k, label]) => (
            <label key={k} className="flex min-h-touch items-center gap-2">
              <input type="checkbox" className="h-6 w-6" checked={obs[k]} onChange={(e) => setObs({ ...obs, [k]: e.target.checked })} />
              {label}
            </label>
          ))}
        </fieldset>
        <div className="grid gap-3 sm:grid-cols-2">
          <div className="flex flex-col gap-1">
            <label htmlFor="housing" className="text-sm font-bold">
              Housing temperature (°C, optional)
            </label>
            <input id="housing" inputMode="decimal" className={inputClasses} value={housing} onChange={(e) => setHousing(e.target.value)} />
          </div>
          <div className="flex flex-col gap-1">
            <label htmlFor="notes" className="text-sm font-bold">
              Notes (optional)
            </label>
            <input id="notes" className={inputClasses} value={notes} onChange={(e) => setNotes(e.target.value)} />
          </div>
        </div>
        <Button type="submit" size="lg" className="w-full sm:w-auto" disabled={!greaseId || !amount || record.isPending}>
          {record.isPending ? "Checking and recording…" : "Check the grease and record"}
        </Button>
      </form>
    </section>
  );
}
