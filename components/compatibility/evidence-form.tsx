"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { Field, inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { SubmitButton } from "@/components/ui/submit-button";

type Result = { droppingPointC: string; workedPenetrationProlonged: string; storagePenetrationChange: string };
const EMPTY: Result = { droppingPointC: "", workedPenetrationProlonged: "", storagePenetrationChange: "" };
const num = (v: string) => (v.trim() === "" ? undefined : Number(v.replace(",", ".")));
const toResult = (r: Result) => ({ droppingPointC: num(r.droppingPointC), workedPenetrationProlonged: num(r.workedPenetrationProlonged), storagePenetrationChange: num(r.storagePenetrationChange) });

/** Records product-pair evidence: a supplier's statement, or lab mixture results the engine judges. */
export function EvidenceForm({ greases }: { greases: { id: number; name: string; code: string }[] }) {
  const router = useRouter();
  const [kind, setKind] = useState<"lab_mixture_test" | "supplier_statement">("lab_mixture_test");
  const [neatA, setNeatA] = useState<Result>(EMPTY);
  const [neatB, setNeatB] = useState<Result>(EMPTY);
  const [mixtures, setMixtures] = useState([
    { ratioA: "10", result: EMPTY },
    { ratioA: "50", result: EMPTY },
    { ratioA: "90", result: EMPTY },
  ]);
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<{ tone: "success" | "danger"; text: string } | null>(null);
  const [pending, setPending] = useState(false);

  async function onSubmit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const formElement = event.currentTarget;
    const data = new FormData(formElement);
    const payload = {
      greaseAId: Number(data.get("greaseAId")) || undefined,
      greaseBId: Number(data.get("greaseBId")) || undefined,
      kind,
      verdict: kind === "supplier_statement" ? data.get("verdict") || undefined : undefined,
      title: String(data.get("title") ?? ""),
      summary: String(data.get("summary") ?? ""),
      ...(kind === "lab_mixture_test"
        ? { neatA: toResult(neatA), neatB: toResult(neatB), mixtures: mixtures.map((m) => ({ ratioA: Number(m.ratioA), result: toResult(m.result) })) }
        : {}),
    };
    const body = new FormData();
    body.set("payload", JSON.stringify(payload));
    const file = data.get("file");
    if (file instanceof File && file.size > 0) body.set("file", file);
    setPending(true);
    setMessage(null);
    try {
      const response = await fetch("/api/v1/compatibility/evidence", { method: "POST", body });
      const json = (await response.json().catch(() => null)) as { verdict?: string; error?: { message: string; fields?: Record<string, string[]> } } | null;
      if (!response.ok) {
        setErrors(json?.error?.fields ?? {});
        setMessage({ tone: "danger", text: json?.error?.message ?? "Not saved." });
      } else {
        setErrors({});
        setMessage({ tone: "success", text: `Evidence recorded: ${json?.verdict}. It now overrides the charts for this pair.` });
        formElement.reset();
        router.refresh();
      }
    } catch {
      setMessage({ tone: "danger", text: "The server could not be reached." });
    } finally {
      setPending(false);
    }
  }

  const err = (name: string) => errors[name];
  const resultRow = (label: string, value: Result, set: (r: Result) => void, prefix: string) => (
    <tr>
      <th scope="row" className="pr-2 text-left text-sm">
        {label}
      </th>
      {(["droppingPointC", "workedPenetrationProlonged", "storagePenetrationChange"] as const).map((k) => (
        <td key={k} className="p-1">
          <input
            aria-label={`${label}: ${k === "droppingPointC" ? "dropping point °C" : k === "workedPenetrationProlonged" ? "worked penetration after prolonged working" : "penetration change after storage"}`}
            className={`${inputClasses} w-28`}
            inputMode="decimal"
            value={value[k]}
            onChange={(e) => set({ ...value, [k]: e.target.value })}
          />
          {err(`${prefix}.${k}`) ? <span className="block text-2xs text-bad">{err(`${prefix}.${k}`)![0]}</span> : null}
        </td>
      ))}
    </tr>
  );

  return (
    <form onSubmit={onSubmit} className="space-y-4" aria-label="Record evidence" noValidate>
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      <div className="grid gap-4 md:grid-cols-2">
        {(["greaseAId", "greaseBId"] as const).map((name, i) => (
          <Field key={name} id={name} label={i === 0 ? "Grease A" : "Grease B"} errors={err(name)}>
            <select id={name} name={name} className={inputClasses} defaultValue="">
              <option value="">Choose…</option>
              {greases.map((g) => (
                <option key={g.id} value={g.id}>
                  {g.name} ({g.code})
                </option>
              ))}
            </select>
          </Field>
        ))}
      </div>
      <fieldset className="flex flex-wrap gap-4 text-sm">
        <legend className="mb-1 font-bold">Kind of evidence</legend>
        <label className="flex min-h-10 items-center gap-2">
          <input type="radio" name="kind" checked={kind === "lab_mixture_test"} onChange={() => setKind("lab_mixture_test")} /> Lab mixture test
        </label>
        <label className="flex min-h-10 items-center gap-2">
          <input type="radio" name="kind" checked={kind === "supplier_statement"} onChange={() => setKind("supplier_statement")} /> Supplier&apos;s written statement
        </label>
      </fieldset>
      <Field id="title" label="Title (report number, letter date)" errors={err("title")}>
        <input id="title" name="title" className={inputClasses} />
      </Field>
      <Field id="summary" label="Summary (optional)" errors={err("summary")}>
        <textarea id="summary" name="summary" rows={2} className={inputClasses} />
      </Field>
      {kind === "supplier_statement" ? (
        <Field id="verdict" label="What the statement says" errors={err("verdict")}>
          <select id="verdict" name="verdict" className={inputClasses} defaultValue="">
            <option value="">Choose…</option>
            <option value="compatible">Compatible</option>
            <option value="borderline">Borderline</option>
            <option value="incompatible">Incompatible</option>
          </select>
        </Field>
      ) : (
        <div className="overflow-x-auto">
          <p className="mb-2 text-sm text-ink-soft">
            Results for the neat greases and each mixture. The engine judges each mixture against the neat greases: a value
            between them is dilution; worse than both beyond the allowance is a failure.
          </p>
          <table className="text-sm">
            <thead>
              <tr className="text-left text-2xs">
                <th />
                <th className="p-1">Dropping point (°C)</th>
                <th className="p-1">Worked penetration, prolonged (0.1 mm)</th>
                <th className="p-1">Change after storage (0.1 mm)</th>
              </tr>
            </thead>
            <tbody>
              {resultRow("Neat A", neatA, setNeatA, "neatA")}
              {resultRow("Neat B", neatB, setNeatB, "neatB")}
              {mixtures.map((m, i) =>
                resultRow(`Mixture ${m.ratioA}/${100 - Number(m.ratioA || 0)} (A/B)`, m.result, (r) => setMixtures(mixtures.map((x, j) => (j === i ? { ...x, result: r } : x))), `mixtures.${i}.result`),
              )}
            </tbody>
          </table>
          {err("mixtures") ? <p className="text-sm text-bad">{err("mixtures")![0]}</p> : null}
        </div>
      )}
      <Field id="file" label="Report or letter (PDF, optional)" errors={err("file")}>
        <input id="file" name="file" type="file" accept="application/pdf,.pdf" className={inputClasses} />
      </Field>
      <SubmitButton pending={pending} pendingLabel="Saving…">
        Record evidence
      </SubmitButton>
    </form>
  );
}
