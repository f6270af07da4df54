"use client";

import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useRef, useState } from "react";
import { ReasonList } from "@/components/compatibility/reason-list";
import { VerdictBadge } from "@/components/compatibility/verdict-badge";
import { Button } from "@/components/ui/button";
import { inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { QrReader } from "@/components/ui/qr-reader";
import { ApiError, apiFetch } from "@/lib/api-client";
import type { Reason, Verdict } from "@/lib/domain/compatibility";
import { containerCodeFromScan, scannedKind } from "@/lib/domain/service";
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

/** The container label as GET /api/v1/stock/labels/{code} gives it (the fields this panel uses). */
interface ScannedContainer {
  labelCode: string;
  lotNumber: string;
  grease: { id: number; code: string; name: string };
  pack: { kind: string; netMassGrams: number };
  expiresOn: string | null;
  expired: boolean;
  onHand: number;
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
  const point = useQuery({
    queryKey: ["point", tag],
    queryFn: () => apiFetch<LivePoint>(`/api/v1/points/${tag}`),
    initialData: initial,
  });
  const [greaseId, setGreaseId] = useState("");
  const [mode, setMode] = useState<"grams" | "strokes">(guns.length ? "strokes" : "grams");
  const [amount, setAmount] = useState("");
  const [gunId, setGunId] = useState(guns[0] ? String(guns[0].id) : "");
  const [obs, setObs] = useState({ backPressure: false, purgeSeen: false, noise: false });
  const [housing, setHousing] = useState("");
  const [notes, setNotes] = useState("");
  const [container, setContainer] = useState<ScannedContainer | null>(null);
  const [takeContainer, setTakeContainer] = useState(false);
  const [labelProblem, setLabelProblem] = useState<string | null>(null);
  const keyRef = useRef<string | null>(null);

  async function readLabel(code: string) {
    setLabelProblem(null);
    try {
      const label = await apiFetch<ScannedContainer>(`/api/v1/stock/labels/${code}`);
      setContainer(label);
      setGreaseId(String(label.grease.id));
      setTakeContainer(!label.expired && label.onHand > 0);
    } catch (error) {
      setContainer(null);
      setLabelProblem(
        error instanceof ApiError && error.status === 404
          ? `No container with label ${code} at your sites.`
          : "The label could not be looked up; check the connection and try again.",
      );
    }
  }

  const record = useMutation({
    mutationFn: async () => {
      keyRef.current ??= crypto.randomUUID();
      const body = {
        greaseId: Number(greaseId),
        ...(mode === "grams" ? { grams: amount } : { strokes: amount, gunId: Number(gunId) }),
        ...obs,
        ...(housing ? { housingTemperatureC: housing } : {}),
        ...(notes ? { notes } : {}),
        ...(container ? { containerLabel: container.labelCode, takeContainer } : {}),
      };
      return apiFetch<{
        service: {
          grams: number;
          nextDueAt: string | null;
          quantityFlag: string | null;
          lot: { lotNumber: string; bookedOut: boolean } | null;
        };
        warnings: string[];
      }>(`/api/v1/points/${tag}/services`, {
        method: "POST",
        json: body,
        headers: { "Idempotency-Key": keyRef.current },
      });
    },
    // Network failures are retried with the same key; a definitive answer (2xx or 4xx) ends the key's life.
    retry: (count, error) => !(error instanceof ApiError) && count < 3,
    // The container now in hand serves the next points too: do not book another one out by default.
    onSuccess: () => setTakeContainer(false),
    onSettled: (_data, error) => {
      if (!error || error instanceof ApiError) keyRef.current = null;
      void queryClient.invalidateQueries({ queryKey: ["point", tag] });
    },
  });

  const refusal =
    record.error instanceof ApiError &&
    record.error.status === 409 &&
    (record.error.body as unknown as Refusal | null)?.incidentId
      ? (record.error.body as unknown as Refusal)
      : null;
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
        <span>
          Next due: {live.nextDueAt ? live.nextDueAt.slice(0, 16).replace("T", " ") : "now (never serviced)"}
        </span>
        <span className="text-ink-soft">
          · In the point: {live.currentGrease?.name ?? "nothing recorded"}
        </span>
      </div>
      <Notice tone="caution" title="Before you grease">
        Lock out where the job needs it. Wipe the nipple clean. Open the relief plug, pump slowly and stop on
        unusual back pressure — seals give way long before a gun does. Grease injected through skin is a
        medical emergency. Mind hot surfaces.
      </Notice>

      {record.isSuccess ? (
        <Notice tone="success" title="Service recorded">
          {record.data.service.grams} g recorded. Next due{" "}
          {record.data.service.nextDueAt?.slice(0, 10) ?? "—"}.
          {record.data.service.lot
            ? ` Lot ${record.data.service.lot.lotNumber}${record.data.service.lot.bookedOut ? ": one container booked out of the store." : "."}`
            : ""}
          {record.data.warnings.map((w) => (
            <span key={w} className="mt-1 block font-bold text-caution">
              ⚠ {w}
            </span>
          ))}
        </Notice>
      ) : null}

      {refusal ? (
        <div
          role="alert"
          className="space-y-3 rounded-card border-2 border-bad bg-bad-light p-4"
          data-testid="service-refused"
        >
          <div className="flex flex-wrap items-center gap-2">
            <VerdictBadge verdict={refusal.verdict} size="lg" />
            <p className="text-lg font-bold text-bad">Stop: do not put this grease in.</p>
          </div>
          <p className="text-sm">
            The service was not recorded. Mixing incident #{refusal.incidentId} was opened and the lubrication
            lead has been told. Take the right grease (
            {live.assignedGrease?.name ?? live.currentGrease?.name ?? "ask the lead"}) or ask the lead to plan
            a changeover.
          </p>
          <ReasonList reasons={refusal.reasons} />
        </div>
      ) : record.isError ? (
        <Notice tone="danger" title="Not recorded">
          {record.error.message}
          {fields ? (
            <span className="block">
              {Object.entries(fields)
                .map(([k, v]) => `${k}: ${v.join(" ")}`)
                .join(" ")}
            </span>
          ) : null}
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
        <details className="rounded-card border border-line p-3" open={container !== null || undefined}>
          <summary className="min-h-touch cursor-pointer content-center text-base font-bold">
            Scan the container label (optional)
          </summary>
          <div className="mt-3 space-y-3">
            <p className="text-sm text-ink-soft">
              The label on the cartridge or pail names the grease and its lot; the lot is kept with this
              service.
            </p>
            <QrReader
              idPrefix="container"
              cameraLabel="Scan the label with the camera"
              photoLabel="Or scan a photo of the container label"
              typeLabel="Or type the label code"
              typeButton="Look up"
              noCodeMessage="No code was found in this photo. Hold the phone square to the label and try again."
              onText={(text) => {
                if (scannedKind(text) === "point")
                  return "That is a lube-point tag. Scan the label on the grease container.";
                const code = containerCodeFromScan(text);
                if (!code)
                  return "This is not a Greaseledger container label. Type the 8-character code printed under its QR code.";
                void readLabel(code);
                return null;
              }}
            />
            {labelProblem ? <Notice tone="caution">{labelProblem}</Notice> : null}
            {container ? (
              <div className="space-y-2 rounded-md bg-paper-sunk p-3 text-sm" data-testid="scanned-container">
                <p>
                  <span className="font-bold">{container.grease.name}</span> ({container.grease.code}) · lot{" "}
                  {container.lotNumber} · label <span className="font-mono">{container.labelCode}</span>
                  {container.expiresOn ? ` · use by ${container.expiresOn}` : ""}
                </p>
                {container.expired ? (
                  <p className="font-bold text-bad">
                    ⚠ This lot has expired. Do not use it: take it back to the store.
                  </p>
                ) : (
                  <label className="flex min-h-touch items-center gap-2">
                    <input
                      type="checkbox"
                      className="h-6 w-6"
                      checked={takeContainer}
                      disabled={container.onHand < 1}
                      onChange={(e) => setTakeContainer(e.target.checked)}
                    />
                    Book a new container out of the store ({container.onHand} {container.pack.kind}
                    {container.onHand === 1 ? "" : "s"} of this lot left)
                  </label>
                )}
              </div>
            ) : null}
          </div>
        </details>
        <div className="flex flex-col gap-1">
          <label htmlFor="grease-in-hand" className="text-base font-bold">
            Grease in your hand
          </label>
          <select
            id="grease-in-hand"
            className={`${inputClasses} min-h-touch text-lg`}
            value={greaseId}
            onChange={(e) => {
              setGreaseId(e.target.value);
              if (container && String(container.grease.id) !== e.target.value) setContainer(null);
            }}
            required
          >
            <option value="">Choose the cartridge you hold…</option>
            {greases.map((g) => (
              <option key={g.id} value={g.id}>
                {g.name} ({g.code})
              </option>
            ))}
          </select>
          {live.assignedGrease ? (
            <p className="text-sm text-ink-soft">Assigned to this point: {live.assignedGrease.name}</p>
          ) : null}
        </div>
        <fieldset className="space-y-2">
          <legend className="text-base font-bold">
            Amount{live.quantityGrams ? ` (planned ${live.quantityGrams} g)` : ""}
          </legend>
          <div className="flex gap-4">
            {guns.length ? (
              <label className="flex min-h-touch items-center gap-2">
                <input
                  type="radio"
                  name="mode"
                  checked={mode === "strokes"}
                  onChange={() => setMode("strokes")}
                  className="h-6 w-6"
                />{" "}
                Gun strokes
              </label>
            ) : null}
            <label className="flex min-h-touch items-center gap-2">
              <input
                type="radio"
                name="mode"
                checked={mode === "grams"}
                onChange={() => setMode("grams")}
                className="h-6 w-6"
              />{" "}
              Grams
            </label>
          </div>
          {mode === "strokes" ? (
            <div className="flex flex-col gap-1">
              <label htmlFor="gun" className="text-sm font-bold">
                Grease gun
              </label>
              <select
                id="gun"
                className={`${inputClasses} min-h-touch`}
                value={gunId}
                onChange={(e) => setGunId(e.target.value)}
              >
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
          <input
            id="amount"
            inputMode="decimal"
            className={`${inputClasses} min-h-touch text-lg`}
            value={amount}
            onChange={(e) => setAmount(e.target.value)}
          />
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
              <input
                type="checkbox"
                className="h-6 w-6"
                checked={obs[k]}
                onChange={(e) => setObs({ ...obs, [k]: e.target.checked })}
              />
              {label}
            </label>
          ))}
        </fieldset>
        <div className="grid gap-3 sm:grid-cols-2">
          <div className="flex flex-col gap-1">
            <label htmlFor="housing" className="text-sm font-bold">
              Housing temperature (°C, optional)
            </label>
            <input
              id="housing"
              inputMode="decimal"
              className={inputClasses}
              value={housing}
              onChange={(e) => setHousing(e.target.value)}
            />
          </div>
          <div className="flex flex-col gap-1">
            <label htmlFor="notes" className="text-sm font-bold">
              Notes (optional)
            </label>
            <input
              id="notes"
              className={inputClasses}
              value={notes}
              onChange={(e) => setNotes(e.target.value)}
            />
          </div>
        </div>
        <Button
          type="submit"
          size="lg"
          className="w-full sm:w-auto"
          disabled={!greaseId || !amount || record.isPending}
        >
          {record.isPending ? "Checking and recording…" : "Check the grease and record"}
        </Button>
      </form>
    </section>
  );
}
