"use client";

import { createColumnHelper, type ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { DueBadge, type Due } from "./due-badge";

export interface PointRow {
  tag: string;
  name: string;
  asset: string;
  area: string;
  site: string;
  due: Due;
  nextDueAt: string | null;
  sealedForLife: boolean;
}

const helper = createColumnHelper<PointRow>();
const DUE_ORDER: Record<Due, number> = { overdue: 0, due: 1, ok: 2 };

const columns = [
  helper.accessor("due", {
    header: "State",
    filterFn: "equals",
    sortingFn: (a, b) => DUE_ORDER[a.original.due] - DUE_ORDER[b.original.due],
    cell: (c) => <DueBadge due={c.getValue()} sealed={c.row.original.sealedForLife} />,
  }),
  helper.accessor("name", { header: "Lube point", cell: (c) => <Link href={`/points/${c.row.original.tag}`} className="font-bold">{c.getValue()}</Link> }),
  helper.accessor("asset", { header: "Asset" }),
  helper.accessor("area", { header: "Area", filterFn: "equals" }),
  helper.accessor("site", { header: "Site", filterFn: "equals" }),
  helper.accessor("nextDueAt", { header: "Next due", cell: (c) => (c.getValue() ? c.getValue()!.slice(0, 16).replace("T", " ") : "—") }),
  helper.accessor("tag", { header: "Tag", cell: (c) => <span className="font-mono text-2xs">{c.getValue()}</span> }),
] as ColumnDef<PointRow, unknown>[];

/** All lube points of the user's sites, sortable and filterable by state, site and area. */
export function PointTable({ rows }: { rows: PointRow[] }) {
  if (rows.length === 0) {
    return (
      <EmptyState title="No lube points on your sites yet">
        <p>The lubrication lead adds assets and their lube points; each gets a printed QR tag.</p>
      </EmptyState>
    );
  }
  const options = (key: "area" | "site") => [...new Set(rows.map((r) => r[key]))].sort().map((v) => ({ value: v, label: v }));
  return (
    <div className="space-y-2">
      <DataTable
        data={rows}
        columns={columns}
        caption="Lube points"
        filterLabel="Find a point, asset or tag"
        facets={[
          { columnId: "due", label: "State", options: [{ value: "overdue", label: "Overdue" }, { value: "due", label: "Due" }, { value: "ok", label: "Not due" }] },
          { columnId: "site", label: "Site", options: options("site") },
          { columnId: "area", label: "Area", options: options("area") },
        ]}
        rowTestId={(p) => `point-row-${p.tag}`}
        empty={
          <EmptyState title="No point matches">
            <p>Clear a filter.</p>
          </EmptyState>
        }
      />
    </div>
  );
}
