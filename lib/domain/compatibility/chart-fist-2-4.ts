import { defineChart, type ChartCode } from "./define-chart";

/**
 * Chart A. "Grease incompatibility chart", US Bureau of Reclamation Facilities Instructions, Standards and
 * Techniques (FIST) Vol. 2-4, *Lubrication of Power Plant Equipment* (11/90), section 5.2 "Grease
 * Compatibility", Table 2, page 15, "(Courtesy of Conoco Inc.)". Read at
 * pinacia.com/resources/Lubrication-of-Power-Plant-Equipment-18.html. All 81 cells transcribed and re-checked
 * (reference/domain.md §1.1, charts-verified.md §1.1). The publisher being USBR is from memory; the page shows
 * only "FIST 2-4 11/90".
 *
 * The diagonal is kept as printed: C everywhere except Clay–Clay, which the source prints as B.
 */
const LABELS = [
  "Sodium",
  "Aluminum Complex",
  "Barium",
  "Calcium",
  "Calcium Complex",
  "Clay",
  "Lithium",
  "Lithium Complex",
  "Polyurea",
] as const;

// prettier-ignore
const CELLS: readonly (readonly ChartCode[])[] = [
  //  Na   AlCx  Ba   Ca  CaCx Clay  Li  LiCx  PU
  ["C", "I", "I", "I", "I", "I", "I", "I", "I"], // Sodium
  ["I", "C", "I", "I", "I", "I", "B", "C", "I"], // Aluminum Complex
  ["I", "I", "C", "I", "I", "I", "I", "I", "I"], // Barium
  ["I", "I", "I", "C", "I", "I", "B", "C", "I"], // Calcium
  ["I", "I", "I", "I", "C", "I", "I", "I", "I"], // Calcium Complex
  ["I", "I", "I", "I", "I", "B", "I", "I", "I"], // Clay
  ["I", "B", "I", "B", "I", "I", "C", "C", "I"], // Lithium
  ["I", "C", "I", "C", "I", "I", "C", "C", "I"], // Lithium Complex
  ["I", "I", "I", "I", "I", "I", "I", "I", "C"], // Polyurea
];

export const CHART_FIST_2_4 = defineChart({
  id: "fist-2-4-table-2",
  title: "Grease incompatibility chart (FIST 2-4, Table 2)",
  shortName: "FIST 2-4 Table 2",
  source:
    'FIST Vol. 2-4, Lubrication of Power Plant Equipment (11/90), section 5.2, Table 2 "Grease incompatibility ' +
    'chart", p. 15, courtesy of Conoco Inc. (pinacia.com/resources/Lubrication-of-Power-Plant-Equipment-18.html)',
  provenance: "transcribed",
  provenanceNote:
    "All 81 cells read in the source and re-checked. Clay–Clay is printed B (borderline), kept as printed. " +
    '"Lithium" is read as covering lithium 12-hydroxystearate as well (our interpretation).',
  labels: LABELS,
  // The chart has no 12-hydroxy classes. Interpretation (ours): most greases sold as "lithium" are lithium
  // 12-hydroxystearate (Machinery Lubrication #30818, "Determine which grease"), so the chart's "Lithium" covers
  // both `lithium` and `lithium_12_hydroxy`; the two then share the printed Lithium–Lithium cell (C).
  // "Calcium" is the hydrated (simple) soap only; "Barium" is plain barium only.
  thickenerLabels: {
    sodium: "Sodium",
    aluminium_complex: "Aluminum Complex",
    barium: "Barium",
    calcium: "Calcium",
    calcium_complex: "Calcium Complex",
    clay: "Clay",
    lithium: "Lithium",
    lithium_12_hydroxy: "Lithium",
    lithium_complex: "Lithium Complex",
    polyurea: "Polyurea",
  },
  cells: CELLS,
});
