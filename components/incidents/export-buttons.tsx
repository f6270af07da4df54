"use client";

import { Button } from "@/components/ui/button";
import { DownloadStatus, useStreamedDownload } from "@/components/ui/streamed-download";

/** Downloads the filtered incident log as CSV or PDF, showing rows (CSV) or kilobytes (PDF) as they arrive. */
export function ExportButtons({ query }: { query: string }) {
  const { download, progress, result, failure, busy } = useStreamedDownload();

  function start(chosen: "csv" | "pdf") {
    void download(`/api/v1/incidents/export?${query ? `${query}&` : ""}format=${chosen}`, {
      countRows: chosen === "csv",
      fallbackName: `incidents.${chosen}`,
      type: chosen === "csv" ? "text/csv" : "application/pdf",
    });
  }

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={() => start("csv")} disabled={busy}>
          Download CSV
        </Button>
        <Button variant="secondary" onClick={() => start("pdf")} disabled={busy}>
          Download PDF report
        </Button>
      </div>
      <DownloadStatus progress={progress} result={result} failure={failure} noun="incident(s)" />
    </div>
  );
}
