"use client";

import { useState } from "react";
import { Notice } from "@/components/ui/notice";

export interface DownloadProgress {
  /** Rows counted so far (CSV: line ends after the header) or null when the file is not counted in rows. */
  rows: number | null;
  bytes: number;
  /** The server's `X-Total-Rows`, 0 when it sent none. */
  total: number;
}

export interface DownloadResult {
  name: string;
  total: number;
  auditSeq: string | null;
}

export interface DownloadFailure {
  message: string;
  /** Field errors of a 400 answer (`{error: {fields}}`), for the form that built the query. */
  fields?: Record<string, string[]>;
}

/**
 * Downloads a file from an export route while it streams in, so a long export shows how far it has got instead of
 * a page that seems to hang, then hands it to the browser as a download under the server's file name.
 */
export function useStreamedDownload() {
  const [progress, setProgress] = useState<DownloadProgress | null>(null);
  const [result, setResult] = useState<DownloadResult | null>(null);
  const [failure, setFailure] = useState<DownloadFailure | null>(null);

  async function download(url: string, options: { countRows: boolean; fallbackName: string; type: string }) {
    setFailure(null);
    setResult(null);
    setProgress({ rows: options.countRows ? 0 : null, bytes: 0, total: 0 });
    try {
      const response = await fetch(url, { credentials: "same-origin" });
      if (!response.ok || !response.body) {
        const body = (await response.json().catch(() => null)) as {
          error?: { message?: string; fields?: Record<string, string[]> };
        } | null;
        setFailure({
          message: body?.error?.message ?? `The server answered ${response.status}.`,
          fields: body?.error?.fields,
        });
        return;
      }
      const total = Number(response.headers.get("X-Total-Rows") ?? 0);
      const reader = response.body.getReader();
      const parts: Uint8Array[] = [];
      let bytes = 0;
      let lines = 0;
      for (;;) {
        const { value, done } = await reader.read();
        if (done) break;
        parts.push(value);
        bytes += value.byteLength;
        if (options.countRows) for (const b of value) if (b === 10) lines += 1;
        // A note with a line break counts twice here, so the count is capped at the total.
        const rows = options.countRows ? Math.max(0, lines - 1) : null;
        setProgress({ rows: rows !== null && total ? Math.min(rows, total) : rows, bytes, total });
      }
      const name =
        /filename="([^"]+)"/.exec(response.headers.get("Content-Disposition") ?? "")?.[1] ??
        options.fallbackName;
      const href = URL.createObjectURL(new Blob(parts as BlobPart[], { type: options.type }));
      const a = document.createElement("a");
      a.href = href;
      a.download = name;
      document.body.append(a);
      a.click();
      a.remove();
      setTimeout(() => URL.revokeObjectURL(href), 10_000);
      setResult({ name, total, auditSeq: response.headers.get("X-Audit-Head-Seq") });
    } catch (e) {
      // A stream the server broke off (a failed page) lands here: the partial file is dropped, never saved.
      setFailure({ message: e instanceof Error ? e.message : String(e) });
    } finally {
      setProgress(null);
    }
  }

  return { download, progress, result, failure, busy: progress !== null };
}

/** The progress line, the saved message and the failure of a `useStreamedDownload`. */
export function DownloadStatus({
  progress,
  result,
  failure,
  noun,
}: {
  progress: DownloadProgress | null;
  result: DownloadResult | null;
  failure: DownloadFailure | null;
  /** What a row is, plural, for the messages: "rows", "incident(s)", "services". */
  noun: string;
}) {
  return (
    <>
      {progress ? (
        <div aria-live="polite" className="text-sm">
          {progress.rows !== null
            ? `${progress.rows} of ${progress.total} ${noun}`
            : `${Math.round(progress.bytes / 1024)} kB`}{" "}
          received…
          {progress.rows !== null && progress.total ? (
            <progress className="ml-2 align-middle" max={progress.total} value={progress.rows} />
          ) : null}
        </div>
      ) : null}
      {result ? (
        <Notice tone="success">
          {result.name} saved: {result.total} {noun}.
          {result.auditSeq ? ` Audit chain head at export: entry ${result.auditSeq}.` : ""}
        </Notice>
      ) : null}
      {failure ? <Notice tone="danger">The export failed: {failure.message}</Notice> : null}
    </>
  );
}
