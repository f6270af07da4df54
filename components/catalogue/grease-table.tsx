"use client";

import { useQuery } from "@tanstack/react-query";
import { createColumnHelper, type ColumnDef } from "@tanstack/react-table";
import Link from "next/link";
import { useMemo, useState } from "react";
import { DataTable } from "@/components/ui/data-table";
import { EmptyState } from "@/components/ui/empty-state";
import { inputClasses } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { apiFetch } from "@/lib/api-client";
import {
  BASE_OIL_LABELS,
  BASE_OIL_TYPES,
  FOOD_GRADES,
  FOOD_GRADE_LABELS,
  NLGI_GRADES,
  THICKENERS,
  THICKENER_LABELS,
  type BaseOilType,
  type FoodGrade,
  type NlgiGrade,
  type Thickener,
} from "@/lib/domain/catalogue";
import { FoodGradeBadge } from "./labels";

export interface GreaseRow {
  id: number;
  code: string;
  name: string;
  supplier: string;
  thickener: Thickener;
  baseOilType: BaseOilType;
  viscosity40: number;
  nlgiGrade: NlgiGrade;
  foodGrade: FoodGrade;
  maxTemperatureC?: number;
  packs: { kind: string; netMassGrams: number }[];
}

const helper = createColumnHelper<GreaseRow>();

const columns = [
  helper.accessor("code", { header: "Code", cell: (c) => <span className="font-mono text-2xs">{c.getValue()}</span> }),
  helper.accessor("name", {
    header: "Product",
    cell: (c) => (
      <Link href={`/catalogue/${c.row.original.id}`} className="font-bold">
        {c.getValue()}
      </Link>
    ),
  }),
  helper.accessor("supplier", { header: "Supplier" }),
  helper.accessor("thickener", { header: "Thickener", filterFn: "equals", cell: (c) => THICKENER_LABELS[c.getValue()] }),
  helper.accessor("baseOilType", { header: "Base oil", filterFn: "equals", cell: (c) => BASE_OIL_LABELS[c.getValue()] }),
  helper.accessor("viscosity40", {
    header: "ν 40 °C (mm²/s)",
    cell: (c) => <span className="tabular-nums">{c.getValue()}</span>,
  }),
  helper.accessor("nlgiGrade", {
    header: "NLGI",
    filterFn: "equals",
    sortingFn: (a, b) => NLGI_GRADES.indexOf(a.original.nlgiGrade) - NLGI_GRADES.indexOf(b.original.nlgiGrade),
  }),
  helper.accessor("foodGrade", { header: "Food grade", filterFn: "equals", cell: (c) => <FoodGradeBadge grade={c.getValue()} /> }),
  helper.accessor((g) => g.packs.map((p) => p.kind).join(", "), { id: "packs", header: "Packs", enableSorting: false }),
] as ColumnDef<GreaseRow, unknown>[];

/** The catalogue table, live from `GET /api/v1/greases`; sorts by any column, filters by facets and viscosity. */
export function GreaseTable({ initial, canWrite }: { initial: GreaseRow[]; canWrite: boolean }) {
  const query = useQuery({
    queryKey: ["greases"],
    queryFn: async () => (await apiFetch<{ items: GreaseRow[] }>("/api/v1/greases")).items,
    initialData: initial,
  });
  const [minVisc, setMinVisc] = useState("");
  const [maxVisc, setMaxVisc] = useState("");
  const rows = useMemo(() => {
    const lo = minVisc === "" ? -Infinity : Number(minVisc);
    const hi = maxVisc === "" ? Infinity : Number(maxVisc);
    return (query.data ?? []).filter((g) => g.viscosity40 >= lo && g.viscosity40 <= hi);
  }, [query.data, minVisc, maxVisc]);

  if (query.data.length === 0) {
    return (
      <EmptyState title="The catalogue is empty" action={canWrite ? <Link href="/catalogue/new">Add the first grease</Link> : undefined}>
        <p>
          {canWrite
            ? "Add each grease product the plant uses, or import them from a spreadsheet (CSV)."
            : "The lubrication lead adds the plant's greases here."}
        </p>
      </EmptyState>
    );
  }

  return (
    <div className="space-y-3">
      {query.isError ? <Notice tone="danger">The list could not be refreshed: {query.error.message}</Notice> : null}
      <div className="flex flex-wrap items-end gap-3">
        <label className="flex w-36 flex-col gap-1 text-sm font-bold">
          ν 40 °C from
          <input type="number" min={0} inputMode="decimal" className={inputClasses} value={minVisc} onChange={(e) => setMinVisc(e.target.value)} />
        </label>
        <label className="flex w-36 flex-col gap-1 text-sm font-bold">
          ν 40 °C to
          <input type="number" min={0} inputMode="decimal" className={inputClasses} value={maxVisc} onChange={(e) => setMaxVisc(e.target.value)} />
        </label>
        {query.isFetching ? <span className="pb-2 text-2xs text-ink-faint">refreshing…</span> : null}
      </div>
      <DataTable
        data={rows}
        columns={columns}
        caption="Grease catalogue"
        filterLabel="Find a grease (code, name, supplier)"
        facets={[
          { columnId: "thickener", label: "Thickener", options: THICKENERS.map((t) => ({ value: t, label: THICKENER_LABELS[t] })) },
          { columnId: "baseOilType", label: "Base oil", options: BASE_OIL_TYPES.map((b) => ({ value: b, label: BASE_OIL_LABELS[b] })) },
          { columnId: "nlgiGrade", label: "NLGI", options: NLGI_GRADES.map((g) => ({ value: g, label: g })) },
          { columnId: "foodGrade", label: "Food grade", options: FOOD_GRADES.map((f) => ({ value: f, label: FOOD_GRADE_LABELS[f] })) },
        ]}
        rowTestId={(g) => `grease-row-${g.code}`}
        empty={
          <EmptyState title="No grease matches these filters">
            <p>Clear a filter or widen the viscosity range.</p>
          </EmptyState>
        }
      />
    </div>
  );
}
