import "server-only";
import path from "node:path";
import { stringify } from "csv-stringify/sync";
import PDFDocument from "pdfkit";
import { neutraliseCell } from "@/lib/csv";
import type { IncidentFilter } from "@/lib/validation/incidents";
import { appendAudit } from "./audit";
import { getSequelize } from "./db";
import { countIncidents, forEachIncidentPage, type Incident } from "./queries/incidents";

export interface ChainHead {
  seq: number;
  hash: string;
}

/**
 * Starts an export: counts what it will hold and records it in the audit trail first, so the chain head returned
 * (printed in the PDF, sent as headers) covers the export itself.
 */
export async function beginIncidentExport(
  userId: string,
  format: "csv" | "pdf",
  filter: IncidentFilter,
  now: Date,
) {
  const counts = await countIncidents(userId, filter);
  const head: ChainHead = await getSequelize().transaction((t) =>
    appendAudit(
      {
        event: "incident.exported",
        actorId: userId,
        subjectType: "incident_log",
        payload: { format, filter, rows: counts.total },
      },
      t,
      now,
    ),
  );
  return { counts, head };
}

const KIND: Record<string, string> = {
  refused_mix: "refused at the point",
  changeover_exception: "changeover exception",
  found_after_fact: "found after the fact",
};

const COLUMNS = [
  "id",
  "opened_at",
  "site",
  "area",
  "asset",
  "point_tag",
  "point",
  "kind",
  "state",
  "verdict",
  "grease_in_point",
  "grease_offered_or_found",
  "reasons",
  "description",
  "root_cause",
  "corrective_action",
  "opened_by",
  "closed_by",
  "closed_at",
] as const;

function csvRow(i: Incident): string[] {
  const cells = [
    String(i.id),
    i.openedAt,
    i.site,
    i.area ?? "",
    i.asset ?? "",
    i.point?.tag ?? "",
    i.point?.name ?? "",
    i.kind,
    i.state,
    i.verdict,
    i.greaseInPoint ? `${i.greaseInPoint.name} (${i.greaseInPoint.code})` : "",
    i.greaseOffered ? `${i.greaseOffered.name} (${i.greaseOffered.code})` : "",
    i.reasons.map((r) => r.message).join(" | "),
    i.description ?? "",
    i.rootCause ?? "",
    i.correctiveAction ?? "",
    i.openedBy ?? "",
    i.closedBy ?? "",
    i.closedAt ?? "",
  ];
  // Text that a spreadsheet would run as a formula gets a leading apostrophe (OWASP CSV injection guidance).
  return cells.map((c) => neutraliseCell(c));
}

/** CSV per RFC 4180 (CRLF, quoted where needed, UTF-8 with a byte-order mark for spreadsheets), a page at a time. */
export function incidentCsvStream(userId: string, filter: IncidentFilter): ReadableStream<Uint8Array> {
  const encoder = new TextEncoder();
  return new ReadableStream<Uint8Array>({
    async start(controller) {
      try {
        controller.enqueue(
          encoder.encode(`\uFEFF${stringify([[...COLUMNS]], { record_delimiter: "windows" })}`),
        );
        await forEachIncidentPage(userId, filter, async (page) => {
          controller.enqueue(encoder.encode(stringify(page.map(csvRow), { record_delimiter: "windows" })));
        });
        controller.close();
      } catch (error) {
        controller.error(error);
      }
    },
  });
}

export interface PdfReportInput {
  userId: string;
  filter: IncidentFilter;
  sites: string[];
  counts: { total: number; byKind: Record<string, number>; byState: Record<string, number> };
  head: ChainHead;
  generatedBy: string;
  now: Date;
}

const FONT_DIR = path.join(process.cwd(), "app", "fonts");

/**
 * The auditor's PDF report: site, period, counts by kind and state, the incident table, and the audit chain's head
 * (entry number and SHA-256) with the row count, so an edit made after the report was printed can be shown.
 * Written to the stream page by page as the incidents are read.
 */
export function incidentPdfStream(input: PdfReportInput): ReadableStream<Uint8Array> {
  const doc = new PDFDocument({
    size: "A4",
    margin: 40,
    info: { Title: "Mixing-incident report", Creator: "Greaseledger" },
  });
  // WOFF, not WOFF2: the glyphs pdfkit subsets from WOFF2 files come out blank in some PDF viewers.
  doc.registerFont("body", path.join(FONT_DIR, "atkinson-hyperlegible-latin-400-normal.woff"));
  doc.registerFont("bold", path.join(FONT_DIR, "atkinson-hyperlegible-latin-700-normal.woff"));
  const period = `${input.filter.from ?? "the first incident"} to ${input.filter.to ?? input.now.toISOString().slice(0, 10)}`;

  const stream = new ReadableStream<Uint8Array>({
    start(controller) {
      doc.on("data", (chunk: Buffer) => controller.enqueue(new Uint8Array(chunk)));
      doc.on("end", () => controller.close());
      doc.on("error", (error: unknown) => controller.error(error));
    },
  });

  void (async () => {
    try {
      doc.font("bold").fontSize(18).text("Mixing-incident report");
      doc.moveDown(0.3).font("body").fontSize(10);
      doc.text(`Site(s): ${input.filter.site ? input.filter.site : input.sites.join(", ")}`);
      doc.text(`Period (opened): ${period}`);
      const narrowed = [
        input.filter.area ? `area ${input.filter.area}` : null,
        input.filter.kind ? `kind ${KIND[input.filter.kind]}` : null,
        input.filter.state ? `state ${input.filter.state}` : null,
      ].filter(Boolean);
      if (narrowed.length) doc.text(`Filtered to: ${narrowed.join(", ")}`);
      doc.text(
        `Generated ${input.now.toISOString().slice(0, 16).replace("T", " ")} UTC by ${input.generatedBy}`,
      );
      doc.moveDown(0.6).font("bold").fontSize(12).text("Counts");
      doc.font("body").fontSize(10);
      doc.text(`Incidents: ${input.counts.total}`);
      doc.text(
        `By kind: refused at the point ${input.counts.byKind.refused_mix ?? 0}; changeover exceptions ${input.counts.byKind.changeover_exception ?? 0}; found after the fact ${input.counts.byKind.found_after_fact ?? 0}`,
      );
      doc.text(
        `By state: open ${input.counts.byState.open ?? 0}; investigating ${input.counts.byState.investigating ?? 0}; closed ${input.counts.byState.closed ?? 0}`,
      );
      doc.moveDown(0.6).font("bold").fontSize(12).text("Incidents");
      doc.moveDown(0.2);
      let rows = 0;
      await forEachIncidentPage(input.userId, input.filter, async (page) => {
        for (const i of page) {
          rows += 1;
          if (doc.y > doc.page.height - 110) doc.addPage();
          doc
            .font("bold")
            .fontSize(9)
            .text(
              `#${i.id} · ${i.openedAt.slice(0, 16).replace("T", " ")} · ${i.site} · ${KIND[i.kind]} · ${i.state} · ${i.verdict}`,
            );
          doc.font("body").fontSize(8.5);
          doc.text(
            `${i.point ? `${i.point.name} (${i.point.tag})` : "no point"}${i.asset ? `, ${i.asset}` : ""}${i.area ? `, ${i.area}` : ""}`,
          );
          doc.text(
            `In the point: ${i.greaseInPoint?.name ?? "—"}; offered or found: ${i.greaseOffered?.name ?? "—"}`,
          );
          if (i.rootCause) doc.text(`Root cause: ${i.rootCause}`);
          if (i.correctiveAction) doc.text(`Corrective action: ${i.correctiveAction}`);
          doc.moveDown(0.35);
        }
      });
      if (rows === 0) doc.font("body").fontSize(10).text("No incident in this period.");
      if (doc.y > doc.page.height - 150) doc.addPage();
      doc.moveDown(0.8).font("bold").fontSize(12).text("Tamper evidence");
      doc.font("body").fontSize(9);
      doc.text(`Incidents in this report: ${rows}`);
      doc.text(`Audit chain head: entry ${input.head.seq}`);
      doc.text(`Head hash (SHA-256): ${input.head.hash}`);
      doc.moveDown(0.3);
      doc.text(
        "Every change to an incident is an entry in Greaseledger's append-only audit trail, and each entry carries the hash of the one before. Keep this report: if any entry up to the one above is later changed or removed, the chain no longer verifies (on the Audit trail page: Verify the chain) and no longer ends in this hash at this entry.",
      );
      doc.end();
    } catch (error) {
      doc.emit("error", error);
    }
  })();
  return stream;
}
