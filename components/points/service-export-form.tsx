"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Field, describedBy, inputClasses } from "@/components/ui/field";
import { DownloadStatus, useStreamedDownload } from "@/components/ui/streamed-download";

export interface ServiceExportFormProps {
  /** The form's first values (UTC days): today and 365 days before, worked out on the server. */
  defaultFrom: string;
  defaultTo: string;
  /** The caller's sites; a choice is offered only when there is more than one. */
  sites: { id: number; name: string }[];
}

/**
 * The service-history export: a period (UTC days, both included) and, for people with several sites, one site or
 * all; downloads the CSV with the rows counted as they arrive. The server checks the period and names a bad field.
 */
export function ServiceExportForm({ defaultFrom, defaultTo, sites }: ServiceExportFormProps) {
  const { download, progress, result, failure, busy } = useStreamedDownload();
  const [from, setFrom] = useState(defaultFrom);
  const [to, setTo] = useState(defaultTo);
  const [site, setSite] = useState("");
  const fields = failure?.fields ?? {};

  function submit(event: React.FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const query = new URLSearchParams({ format: "csv", from, to });
    if (site) query.set("site", site);
    void download(`/api/v1/services/export?${query}`, {
      countRows: true,
      fallbackName: "services.csv",
      type: "text/csv",
    });
  }

  return (
    <form onSubmit={submit} noValidate aria-label="Export the service history" className="space-y-3">
      <div className="flex flex-wrap items-start gap-3">
        <Field id="export-from" label="From" errors={fields.from} className="w-44">
          <input
            id="export-from"
            name="from"
            type="date"
            value={from}
            onChange={(e) => setFrom(e.target.value)}
            aria-invalid={fields.from ? true : undefined}
            aria-describedby={describedBy("export-from")}
            className={inputClasses}
          />
        </Field>
        <Field id="export-to" label="To" errors={fields.to} className="w-44">
          <input
            id="export-to"
            name="to"
            type="date"
            value={to}
            onChange={(e) => setTo(e.target.value)}
            aria-invalid={fields.to ? true : undefined}
            aria-describedby={describedBy("export-to")}
            className={inputClasses}
          />
        </Field>
        {sites.length > 1 ? (
          <Field id="export-site" label="Site" errors={fields.site} className="w-56">
            <select
              id="export-site"
              name="site"
              value={site}
              onChange={(e) => setSite(e.target.value)}
              aria-describedby={describedBy("export-site")}
              className={inputClasses}
            >
              <option value="">All my sites</option>
              {sites.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name}
                </option>
              ))}
            </select>
          </Field>
        ) : null}
        <div className="flex flex-col gap-1">
          {/* Keeps the button level with the inputs under their labels. */}
          <span aria-hidden="true" className="text-sm">
            &nbsp;
          </span>
          <Button type="submit" variant="secondary" disabled={busy}>
            Download service history (CSV)
          </Button>
        </div>
      </div>
      <DownloadStatus progress={progress} result={result} failure={failure} noun="services" />
    </form>
  );
}
