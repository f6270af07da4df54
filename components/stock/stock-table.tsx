"use client";

import { createColumnHelper, type ColumnDef } from "@tanstack/react-table";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";

export interface StockRow {
  greaseId: number;
  grease: string;
  pack: string;
  site: string;
  location: string;
  onHand: number;
  reorderPoint: number;
  reorderPointGrams: number;
  /** Of the grease at the site, at the schedule's demand; null when nothing uses it. */
  weeksOfCover: number | null;
  /** "low" when the grease as a whole is below its reorder point at the site. */
  state: "low" | "enough";
}

const helper = createColumnHelper<StockRow>();

const columns = [
  helper.accessor("grease", { header: "Grease", cell: (c) => <span className="font-bold">{c.getValue()}</span> }),
  helper.accessor("pack", { header: "Pack" }),
  helper.accessor("site", { header: "Site", filterFn: "equals" }),
  helper.accessor("location", { header: "Location", filterFn: "equals" }),
  helper.accessor("onHand", { header: "On hand", cell: (c) => <span className="tabular-nums">{c.getValue()}</span> }),
  helper.accessor("reorderPoint", {
    header: "Reorder point",
    cell: (c) => (
      <span className="tabular-nums">
        {c.getValue()} <span className="text-2xs text-ink-faint">({(c.row.original.reorderPointGrams / 1000).toFixed(1)} kg)</span>
      </span>
    ),
  }),
  helper.accessor("weeksOfCover", {
    header: "Cover",
    sortUndefined: "last",
    cell: (c) => <span className="tabular-nums">{c.getValue() === null ? "no use planned" : `${(c.getValue() as number) >= 100 ? "100+" : (c.getValue() as number).toFixed(1)} weeks`}</span>,
  }),
  helper.accessor("state", {
    header: "State",
    filterFn: "equals",
    cell: (c) => (c.getValue() === "low" ? <span className="font-bold text-bad">▼ below reorder point</span> : <span className="text-good">✔ enough</span>),
  }),
] as ColumnDef<StockRow, unknown>[];

/** Containers per grease, pack and location: sorts by any column, filters by text, site, location and state. */
export function StockTable({ rows }: { rows: StockRow[] }) {
  if (rows.length === 0) {
    return (
      <EmptyState title="No stock has been received yet">
        <p>The storeroom clerk receives containers with their lot number and expiry date (Receive, above); they appear here.</p>
      </EmptyState>
    );
  }
  const options = (key: "site" | "location") => [...new Set(rows.map((r) => r[key]))].sort().map((v) => ({ value: v, label: v }));
  const facets = [
    { columnId: "state", label: "State", options: [{ value: "low", label: "Below reorder point" }, { value: "enough", label: "Enough" }] },
    ...(options("site").length > 1 ? [{ columnId: "site", label: "Site", options: options("site") }] : []),
    { columnId: "location", label: "Location", options: options("location") },
  ];
  return (
    <DataTable
      data={rows}
      columns={columns}
      caption="Stock on hand"
      filterLabel="Find a grease"
      facets={facets}
      empty={
        <EmptyState title="Nothing matches">
          <p>Clear a filter.</p>
        </EmptyState>
      }
    />
  );
}
