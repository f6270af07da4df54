"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/notice";

type Progress = { format: "csv" | "pdf"; bytes: number; rows: number; total: number } | null;

/**
 * Downloads the filtered incident log as CSV or PDF. The file is read as it streams in, so a long period shows how
 * far it has got (rows for CSV, kilobytes for PDF) instead of a page that seems to hang.
 */
export function ExportButtons({ query }: { query: string }) {
  const [progress, setProgress] = useState<Progress>(null);
  const [done, setDone] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);

  async function download(format: "csv" | "pdf") {
    setError(null);
    setDone(null);
    try {
      const response = await fetch(`/api/v1/incidents/export?${query ? `${query}&` : ""}format=${format}`, {
        credentials: "same-origin",
      });
      if (!response.ok || !response.body) {
        const body = (await response.json().catch(() => null)) as { error?: { message?: string } } | null;
        throw new Error(body?.error?.message ?? `The server answered ${response.status}.`);
      }
      const total = Number(response.headers.get("X-Total-Rows") ?? 0);
      const reader = response.body.getReader();
      const parts: Uint8Array[] = [];
      let bytes = 0;
      let lines = 0;
      for (;;) {
        const { value, done: finished } = await reader.read();
        if (finished) break;
        parts.push(value);
        bytes += value.byteLength;
        if (format === "csv") for (const b of value) if (b === 10) lines += 1;
        setProgress({ format, bytes, rows: Math.max(0, lines - 1), total });
      }
      const name =
        /filename="([^"]+)"/.exec(response.headers.get("Content-Disposition") ?? "")?.[1] ??
        `incidents.${format}`;
      const url = URL.createObjectURL(
        new Blob(parts as BlobPart[], { type: format === "csv" ? "text/csv" : "application/pdf" }),
      );
      const a = document.createElement("a");
      a.href = url;
      a.download = name;
      document.body.append(a);
      a.click();
      a.remove();
      setTimeout(() => URL.revokeObjectURL(url), 10_000);
      setDone(
        `${name} saved: ${total} incident(s). Audit chain head at export: entry ${response.headers.get("X-Audit-Head-Seq")}.`,
      );
    } catch (e) {
      setError(e instanceof Error ? e.message : String(e));
    } finally {
      setProgress(null);
    }
  }

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={() => void download("csv")} disabled={progress !== null}>
          Download CSV
        </Button>
        <Button variant="secondary" onClick={() => void download("pdf")} disabled={progress !== null}>
          Download PDF report
        </Button>
      </div>
      {progress ? (
        <div aria-live="polite" className="text-sm">
          {progress.format === "csv"
            ? `${progress.rows} of ${progress.total} rows`
            : `${Math.round(progress.bytes / 1024)} kB of the report`}{" "}
          received…
          {progress.format === "csv" && progress.total ? (
            <progress className="ml-2 align-middle" max={progress.total} value={progress.rows} />
          ) : null}
        </div>
      ) : null}
      {done ? <Notice tone="success">{done}</Notice> : null}
      {error ? <Notice tone="danger">The export failed: {error}</Notice> : null}
    </div>
  );
}
