"use client";

import { useActionState, useState } from "react";
import { Field, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";
import type { ActionState } from "@/lib/validation/action-state";

export interface CountSheetProps {
  location: string;
  lines: {
    lotId: number;
    labelCode: string;
    lotNumber: string;
    grease: string;
    greaseCode: string;
    pack: string;
    expiresOn: string | null;
    onHand: number;
  }[];
  action: (prev: ActionState, form: FormData) => Promise<ActionState>;
}

/** A cycle count: type what is on the shelf; the variance shows as you go and is posted with one reason. */
export function CountSheet({ location, lines, action }: CountSheetProps) {
  const [state, formAction] = useActionState(action, { status: "idle" });
  const [counted, setCounted] = useState<Record<number, string>>({});
  const [key] = useState(() => crypto.randomUUID());
  const errors = state.status === "invalid" ? state.fieldErrors : {};
  const variance = (l: CountSheetProps["lines"][number]) => {
    const raw = counted[l.lotId];
    if (raw === undefined || raw.trim() === "" || !/^\d+$/.test(raw.trim())) return null;
    return Number(raw) - l.onHand;
  };
  const differences = lines.filter((l) => (variance(l) ?? 0) !== 0).length;
  const missing = lines.filter((l) => variance(l) === null).length;

  if (state.status === "success")
    return (
      <Notice tone="success" title="Count posted">
        {state.message}
      </Notice>
    );
  return (
    <form action={formAction} className="space-y-4" aria-label={`Count of ${location}`}>
      <input type="hidden" name="location" value={location} />
      <input type="hidden" name="idempotencyKey" value={key} />
      {state.status === "error" ? <Notice tone="danger">{state.message}</Notice> : null}
      {state.status === "invalid" && Object.keys(errors).some((k) => k.startsWith("lines")) ? (
        <Notice tone="danger">
          {Object.entries(errors)
            .filter(([k]) => k.startsWith("lines"))
            .flatMap(([, v]) => v)
            .join(" ")}
        </Notice>
      ) : null}
      <div className="overflow-x-auto">
        <table className="w-full text-sm" data-testid="count-sheet">
          <caption className="sr-only">Count sheet</caption>
          <thead>
            <tr className="border-b-2 border-line-strong text-left">
              <th className="p-1">Grease</th>
              <th className="p-1">Lot · label</th>
              <th className="p-1">Use by</th>
              <th className="p-1 text-right">Books</th>
              <th className="p-1">Counted</th>
              <th className="p-1 text-right">Variance</th>
            </tr>
          </thead>
          <tbody>
            {lines.map((l) => {
              const v = variance(l);
              return (
                <tr key={l.lotId} className="border-b border-line">
                  <td className="p-1">
                    <span className="font-bold">{l.grease}</span>{" "}
                    <span className="text-ink-faint">({l.pack})</span>
                  </td>
                  <td className="p-1">
                    {l.lotNumber} · <span className="font-mono">{l.labelCode}</span>
                  </td>
                  <td className="p-1">{l.expiresOn ?? "—"}</td>
                  <td className="p-1 text-right tabular-nums">{l.onHand}</td>
                  <td className="p-1">
                    <input type="hidden" name="lotId" value={l.lotId} />
                    <input type="hidden" name="expected" value={l.onHand} />
                    <input
                      name="counted"
                      inputMode="numeric"
                      aria-label={`Counted, lot ${l.lotNumber}`}
                      className={`${inputClasses} w-24`}
                      value={counted[l.lotId] ?? ""}
                      onChange={(e) => setCounted({ ...counted, [l.lotId]: e.target.value })}
                    />
                  </td>
                  <td className="p-1 text-right font-bold tabular-nums">
                    {v === null ? "—" : v === 0 ? "✔ 0" : v > 0 ? `▲ +${v}` : `▼ ${v}`}
                  </td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      <p className="text-sm" aria-live="polite">
        {missing ? `${missing} lot(s) still to count. ` : "Every lot counted. "}
        {differences ? `${differences} lot(s) differ from the books.` : "No difference so far."}
      </p>
      <Field
        id="count-reason"
        label={differences ? "Reason for the differences" : "Note (optional)"}
        errors={errors.reason}
      >
        <input id="count-reason" name="reason" className={inputClasses} />
      </Field>
      <SubmitButton pendingLabel="Posting…" disabled={missing > 0}>
        {differences ? `Post the count and ${differences} adjustment(s)` : "Post the count"}
      </SubmitButton>
    </form>
  );
}
