import { THICKENERS, type Thickener } from "../catalogue";
import type { ChartId, CompatibilityChart, Provenance, Verdict } from "./types";

/** A cell as printed: C compatible, B borderline, I incompatible, "-" not covered (a diagonal printed "n/a"). */
export type ChartCode = "C" | "B" | "I" | "-";

const CODE_VERDICT: Readonly<Record<ChartCode, Verdict | null>> = {
  C: "compatible",
  B: "borderline",
  I: "incompatible",
  "-": null,
};

export interface ChartDefinition<L extends string> {
  id: ChartId;
  title: string;
  shortName: string;
  source: string;
  provenance: Provenance;
  provenanceNote: string;
  /** Printed labels in printed order; `cells` rows and columns follow this order. */
  labels: readonly L[];
  /** Which printed label each of our thickeners is read under. A thickener left out is not covered. */
  thickenerLabels: Readonly<Partial<Record<Thickener, L>>>;
  cells: readonly (readonly ChartCode[])[];
  /** For a partly transcribed chart: whether the pair's cell was read in the source. */
  transcribedPair?: (a: L, b: L) => boolean;
}

/** Builds a chart's lookup functions from its printed matrix and its label mapping. */
export function defineChart<L extends string>(def: ChartDefinition<L>): CompatibilityChart {
  const labelFor = (t: Thickener): L | null => def.thickenerLabels[t] ?? null;
  const code = (a: Thickener, b: Thickener): ChartCode | null => {
    const la = labelFor(a);
    const lb = labelFor(b);
    if (la === null || lb === null) return null;
    return def.cells[def.labels.indexOf(la)]?.[def.labels.indexOf(lb)] ?? null;
  };
  return {
    id: def.id,
    title: def.title,
    shortName: def.shortName,
    source: def.source,
    provenance: def.provenance,
    provenanceNote: def.provenanceNote,
    labels: def.labels,
    thickeners: THICKENERS.filter((t) => def.thickenerLabels[t] !== undefined),
    labelFor,
    cell(a, b) {
      const c = code(a, b);
      return c === null ? null : CODE_VERDICT[c];
    },
    cellProvenance(a, b) {
      const c = code(a, b);
      if (c === null || c === "-") return null;
      if (def.provenance !== "partly_transcribed") return def.provenance;
      const la = labelFor(a)!;
      const lb = labelFor(b)!;
      return def.transcribedPair?.(la, lb) ? "transcribed" : "from_memory";
    },
  };
}
