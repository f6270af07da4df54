"use client";

import { useActionState, useState } from "react";
import { Field, TextField, describedBy, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import { formValues, type ActionState } from "@/lib/validation/action-state";

export interface ReceiveGrease {
  id: number;
  code: string;
  name: string;
  shelfLifeMonths: number | null;
  packs: { id: number; kind: string; netMassGrams: number; label: string | null }[];
}

export interface ReceiveFormProps {
  greases: ReceiveGrease[];
  locations: { value: string; label: string }[];
  requests: { id: number; greaseId: number; packId: number; label: string }[];
  initialRequestId?: number;
  action: (prev: ActionState, form: FormData) => Promise<ActionState>;
}

/** The clerk books a delivery in: grease, pack, containers, lot and dates from the label, location, delivery note. */
export function ReceiveForm({ greases, locations, requests, initialRequestId, action }: ReceiveFormProps) {
  const [state, formAction] = useActionState(action, { status: "idle" });
  const sent = formValues(state, {});
  const initialRequest = requests.find((r) => r.id === initialRequestId);
  const [requestId, setRequestId] = useState(String(sent.purchaseRequestId ?? initialRequest?.id ?? ""));
  const [greaseId, setGreaseId] = useState(String(sent.greaseId ?? initialRequest?.greaseId ?? ""));
  const [packId, setPackId] = useState(String(sent.packId ?? initialRequest?.packId ?? ""));
  // One key per form shown: a double submit or a retry replays the first receipt instead of booking it twice.
  const [idempotencyKey] = useState(() => crypto.randomUUID());
  const errors = state.status === "invalid" ? state.fieldErrors : {};
  const grease = greases.find((g) => String(g.id) === greaseId);
  const dv = (k: string) => (sent[k] === undefined ? undefined : String(sent[k]));

  return (
    <form
      action={formAction}
      className="space-y-4"
      aria-label="Receive a delivery"
      key={state.status === "invalid" ? JSON.stringify(sent) : "form"}
    >
      <input type="hidden" name="idempotencyKey" value={idempotencyKey} />
      {state.status === "error" ? <Notice tone="danger">{state.message}</Notice> : null}
      {state.status === "invalid" ? (
        <Notice tone="danger">{state.message ?? "Some fields need attention."}</Notice>
      ) : null}
      <Field
        id="purchaseRequestId"
        label="Against purchase request (optional)"
        errors={errors.purchaseRequestId}
        hint="Choosing one fills in the grease and pack; the receipt closes it."
      >
        <select
          id="purchaseRequestId"
          name="purchaseRequestId"
          className={inputClasses}
          value={requestId}
          aria-describedby={describedBy("purchaseRequestId", true)}
          onChange={(e) => {
            setRequestId(e.target.value);
            const r = requests.find((x) => String(x.id) === e.target.value);
            if (r) {
              setGreaseId(String(r.greaseId));
              setPackId(String(r.packId));
            }
          }}
        >
          <option value="">No purchase request</option>
          {requests.map((r) => (
            <option key={r.id} value={r.id}>
              {r.label}
            </option>
          ))}
        </select>
      </Field>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="greaseId" label="Grease" errors={errors.greaseId}>
          <select
            id="greaseId"
            name="greaseId"
            className={inputClasses}
            value={greaseId}
            aria-invalid={Boolean(errors.greaseId)}
            aria-describedby={describedBy("greaseId")}
            onChange={(e) => {
              setGreaseId(e.target.value);
              const g = greases.find((x) => String(x.id) === e.target.value);
              setPackId(g?.packs[0] ? String(g.packs[0].id) : "");
            }}
          >
            <option value="">Choose the grease…</option>
            {greases.map((g) => (
              <option key={g.id} value={g.id}>
                {g.name} ({g.code})
              </option>
            ))}
          </select>
        </Field>
        <Field id="packId" label="Pack" errors={errors.packId}>
          <select
            id="packId"
            name="packId"
            className={inputClasses}
            value={packId}
            onChange={(e) => setPackId(e.target.value)}
            aria-invalid={Boolean(errors.packId)}
            aria-describedby={describedBy("packId")}
          >
            <option value="">{grease ? "Choose the pack…" : "Choose the grease first"}</option>
            {grease?.packs.map((p) => (
              <option key={p.id} value={p.id}>
                {p.label ?? p.kind} · {p.netMassGrams} g
              </option>
            ))}
          </select>
        </Field>
        <TextField
          id="quantity"
          name="quantity"
          label="Containers received"
          inputMode="numeric"
          errors={errors.quantity}
          defaultValue={dv("quantity")}
        />
        <TextField
          id="lotNumber"
          name="lotNumber"
          label="Lot number (from the label)"
          autoComplete="off"
          errors={errors.lotNumber}
          defaultValue={dv("lotNumber")}
        />
        <TextField
          id="manufacturedOn"
          name="manufacturedOn"
          type="date"
          label="Manufactured on (optional)"
          errors={errors.manufacturedOn}
          defaultValue={dv("manufacturedOn")}
        />
        <TextField
          id="expiresOn"
          name="expiresOn"
          type="date"
          label="Expires on (optional)"
          errors={errors.expiresOn}
          defaultValue={dv("expiresOn")}
          hint={
            grease?.shelfLifeMonths
              ? `Left empty: ${grease.shelfLifeMonths} months' shelf life from manufacture, or from today.`
              : "Left empty and no shelf life known: the lot has no expiry date."
          }
        />
        <Field id="location" label="Put away at" errors={errors.location}>
          <select
            id="location"
            name="location"
            className={inputClasses}
            defaultValue={dv("location") ?? locations[0]?.value}
            aria-invalid={Boolean(errors.location)}
            aria-describedby={describedBy("location")}
          >
            {locations.map((l) => (
              <option key={l.value} value={l.value}>
                {l.label}
              </option>
            ))}
          </select>
        </Field>
        <TextField
          id="deliveryNote"
          name="deliveryNote"
          type="file"
          accept="application/pdf,.pdf"
          label="Delivery note (PDF, optional)"
          errors={errors.deliveryNote}
          hint="A scan of the supplier's delivery note, at most 10 MB."
        />
      </div>
      <SubmitButton pendingLabel="Receiving…">Receive and print labels</SubmitButton>
    </form>
  );
}
