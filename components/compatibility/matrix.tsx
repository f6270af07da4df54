"use client";

import { useState } from "react";
import { cn } from "@/lib/cn";
import type { Verdict } from "@/lib/domain/compatibility";
import { VERDICT_LOOK, VerdictBadge } from "./verdict-badge";

export interface MatrixView {
  id: string;
  title: string;
  caution?: string;
  note: string;
  labels: { key: string; label: string }[];
  /** cells[row][col]: verdict and the per-chart explanation shown when the cell is chosen. */
  cells: { verdict: Verdict | null; detail: { chart: string; verdict: Verdict | null; source: string }[] }[][];
}

/** Thickener matrices: each chart as printed and the strictest view. Tap a cell to see its sources. */
export function CompatibilityMatrix({ views }: { views: MatrixView[] }) {
  const [viewId, setViewId] = useState(views[0]!.id);
  const [cell, setCell] = useState<{ r: number; c: number } | null>(null);
  const view = views.find((v) => v.id === viewId) ?? views[0]!;
  const chosen = cell ? view.cells[cell.r]?.[cell.c] : undefined;

  return (
    <div className="space-y-4">
      <div role="tablist" aria-label="Matrix view" className="flex flex-wrap gap-2">
        {views.map((v) => (
          <button
            key={v.id}
            role="tab"
            type="button"
            aria-selected={v.id === view.id}
            onClick={() => {
              setViewId(v.id);
              setCell(null);
            }}
            className={cn(
              "min-h-10 rounded-md border px-3 text-sm font-bold",
              v.id === view.id ? "border-steel bg-steel text-white" : "border-line-strong bg-paper-raised text-ink hover:bg-paper-sunk",
            )}
          >
            {v.title}
          </button>
        ))}
      </div>
      <p className="text-sm text-ink-soft">{view.note}</p>
      {view.caution ? <p className="rounded-md border-l-4 border-caution bg-caution-light p-2 text-sm">⚠ {view.caution}</p> : null}
      <div className="flex flex-wrap gap-3 text-2xs" aria-label="Legend">
        {(["compatible", "borderline", "incompatible", "unknown"] as const).map((v) => (
          <VerdictBadge key={v} verdict={v} size="sm" />
        ))}
        <span className="inline-flex items-center gap-1 rounded border border-dashed border-line-strong px-1 text-ink-faint">— not in this chart</span>
      </div>
      <div className="overflow-x-auto">
        <table className="border-collapse text-2xs" data-testid={`matrix-${view.id}`}>
          <caption className="sr-only">{view.title}: thickener against thickener</caption>
          <thead>
            <tr>
              <th scope="col" className="sticky left-0 bg-paper-raised p-1" />
              {view.labels.map((l) => (
                <th key={l.key} scope="col" className="w-9 p-0 pb-1 align-bottom">
                  <span className="mx-auto block rotate-180 whitespace-nowrap text-left font-bold [writing-mode:vertical-rl]">{l.label}</span>
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {view.labels.map((row, r) => (
              <tr key={row.key}>
                <th scope="row" className="sticky left-0 whitespace-nowrap bg-paper-raised pr-2 text-right font-bold">
                  {row.label}
                </th>
                {view.labels.map((col, c) => {
                  const v = view.cells[r]![c]!.verdict;
                  const look = v ? VERDICT_LOOK[v] : null;
                  const active = cell?.r === r && cell?.c === c;
                  return (
                    <td key={col.key} className="p-0.5">
                      <button
                        type="button"
                        onClick={() => setCell({ r, c })}
                        title={`${row.label} + ${col.label}: ${look?.word ?? "not in this chart"}`}
                        aria-label={`${row.label} with ${col.label}: ${look?.word ?? "not in this chart"}`}
                        className={cn(
                          "flex h-8 w-8 items-center justify-center rounded border text-sm font-bold",
                          look ? look.classes : "border-dashed border-line-strong text-ink-faint",
                          active && "ring-2 ring-amber ring-offset-1",
                        )}
                      >
                        <span aria-hidden="true">{look?.icon ?? "—"}</span>
                      </button>
                    </td>
                  );
                })}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <div aria-live="polite" className="min-h-16 rounded-md border border-line bg-paper p-3 text-sm" data-testid="matrix-cell-detail">
        {cell && chosen ? (
          <>
            <p className="font-bold">
              {view.labels[cell.r]!.label} with {view.labels[cell.c]!.label}:{" "}
              {chosen.verdict ? <VerdictBadge verdict={chosen.verdict} size="sm" /> : "not in this chart"}
            </p>
            <ul className="mt-2 space-y-1">
              {chosen.detail.map((d) => (
                <li key={d.chart}>
                  <span className="font-bold">{d.chart}:</span> {d.verdict ? VERDICT_LOOK[d.verdict].word : "does not cover this pair"} —{" "}
                  <span className="text-ink-soft">{d.source}</span>
                </li>
              ))}
            </ul>
          </>
        ) : (
          <p className="text-ink-soft">Choose a cell to see which chart says what, and where it was read.</p>
        )}
      </div>
    </div>
  );
}
