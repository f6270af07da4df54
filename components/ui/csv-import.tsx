"use client";

import Link from "next/link";
import { useState, useTransition } from "react";
import { Button } from "./button";
import { Field, inputClasses } from "./field";
import { Notice } from "./notice";
import { cn } from "@/lib/cn";

interface PreviewRow {
  line: number;
  cells: Record<string, string>;
  errors: Record<string, string>;
}
export interface ImportState {
  status: "preview" | "imported" | "error";
  message?: string;
  problems: string[];
  rows: PreviewRow[];
  importable: number;
  imported?: number;
}

export interface CsvImportProps {
  columns: string[];
  preview: (text: unknown) => Promise<ImportState>;
  commit: (text: unknown) => Promise<ImportState>;
  /** What a row becomes, plural, e.g. "greases". */
  noun: string;
  hint: string;
  doneHref: string;
}

/** CSV import: choose a file, see every bad row and cell, then import the good rows in one go. */
export function CsvImport({ columns, preview, commit, noun, hint, doneHref }: CsvImportProps) {
  const [text, setText] = useState<string | null>(null);
  const [fileName, setFileName] = useState("");
  const [state, setState] = useState<ImportState | null>(null);
  const [pending, startTransition] = useTransition();
  const [stage, setStage] = useState<"idle" | "checking" | "importing">("idle");

  async function onFile(event: React.ChangeEvent<HTMLInputElement>) {
    const file = event.target.files?.[0];
    if (!file) return;
    const content = await file.text();
    setText(content);
    setFileName(file.name);
    setStage("checking");
    startTransition(async () => {
      setState(await preview(content));
      setStage("idle");
    });
  }

  function onImport() {
    if (!text) return;
    setStage("importing");
    startTransition(async () => {
      setState(await commit(text));
      setStage("idle");
    });
  }

  const bad = state?.rows.filter((r) => Object.keys(r.errors).length) ?? [];

  return (
    <div className="space-y-4">
      <Field id="csv-file" label="CSV file" hint={`Columns: ${columns.join(", ")}. ${hint}`}>
        <input id="csv-file" type="file" accept=".csv,text/csv" className={inputClasses} onChange={onFile} aria-describedby="csv-file-hint" />
      </Field>
      {pending ? (
        <div role="status" aria-live="polite" className="space-y-1">
          <p className="text-sm font-bold">{stage === "importing" ? "Importing…" : `Checking ${fileName}…`}</p>
          <div className="h-2 w-full overflow-hidden rounded bg-paper-sunk">
            <div className="h-2 w-1/3 animate-pulse rounded bg-steel" />
          </div>
        </div>
      ) : null}
      {state?.status === "error" ? <Notice tone="danger">{state.message}</Notice> : null}
      {state?.problems.map((p) => (
        <Notice key={p} tone="danger">
          {p}
        </Notice>
      ))}
      {state?.status === "imported" ? (
        <Notice tone="success" title="Imported">
          {state.imported} {noun} were added{bad.length ? `; ${bad.length} row(s) were skipped` : ""}. <Link href={doneHref}>Open them</Link>.
        </Notice>
      ) : null}
      {state && state.rows.length > 0 && state.status === "preview" ? (
        <>
          <Notice tone={bad.length ? "caution" : "success"} title={bad.length ? "Some rows need attention" : "Every row is fine"}>
            {state.rows.length} row(s) read; {state.importable} can be imported
            {bad.length ? `; ${bad.length} have problems (marked below) and will be skipped. Fix them in the file and choose it again, or import the good rows now.` : "."}
          </Notice>
          <Button onClick={onImport} disabled={pending || state.importable === 0}>
            Import {state.importable} row(s)
          </Button>
        </>
      ) : null}
      {state && state.rows.length > 0 ? (
        <div className="overflow-x-auto">
          <table className="w-full text-2xs">
            <caption className="sr-only">Rows of the file, bad cells marked</caption>
            <thead>
              <tr className="border-b-2 border-line-strong text-left">
                <th className="px-1 py-1">Line</th>
                <th className="px-1 py-1">State</th>
                {columns.map((c) => (
                  <th key={c} className="px-1 py-1">
                    {c}
                  </th>
                ))}
              </tr>
            </thead>
            <tbody>
              {state.rows.map((row) => {
                const problems = Object.keys(row.errors).length;
                return (
                  <tr key={row.line} className={cn("border-b border-line align-top", problems && "bg-bad-light/50")} data-testid={`import-line-${row.line}`}>
                    <td className="px-1 py-1">{row.line}</td>
                    <td className="px-1 py-1 font-bold">{problems ? <span className="text-bad">✖ skipped</span> : <span className="text-good">✔ ok</span>}</td>
                    {columns.map((c) => (
                      <td key={c} className={cn("px-1 py-1", row.errors[c] && "outline outline-2 outline-bad")}>
                        <span>{row.cells[c]}</span>
                        {row.errors[c] ? <span className="block font-bold text-bad">✖ {row.errors[c]}</span> : null}
                      </td>
                    ))}
                  </tr>
                );
              })}
            </tbody>
          </table>
        </div>
      ) : null}
    </div>
  );
}
