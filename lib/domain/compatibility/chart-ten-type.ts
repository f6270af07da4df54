import { defineChart, type ChartCode } from "./define-chart";

/**
 * Chart B. The common ten-thickener compatibility chart as reproduced on the farmoyl.com "Grease" resource page
 * (farmoyl.com/en/resources/grease); the page does not name the chart's original author.
 *
 * Partly transcribed: only the aluminium-complex row was read in the source (charts-verified.md §1.2; the row's
 * heading is inferred from its "n/a" self-pair). Every other row is from memory (reference/domain.md §1.2),
 * consistent with that row, with symmetry and with Chart C. Cells charts-verified.md §7 calls suspect even as
 * memory: Calcium–Clay = C (contradicted by Chart A and by D. Turner, Machinery Lubrication Jan 2009), and
 * Calcium complex–Lithium complex = C, Calcium complex–Polyurea = C (Chart A says I). The most-restrictive policy
 * makes them harmless when Chart A is enabled too.
 *
 * The source prints the diagonal as "n/a": not covered.
 */
const LABELS = [
  "Aluminum complex",
  "Barium",
  "Calcium",
  "Calcium 12-hydroxy",
  "Calcium complex",
  "Clay",
  "Lithium",
  "Lithium 12-hydroxy",
  "Lithium complex",
  "Polyurea",
] as const;

// prettier-ignore
const CELLS: readonly (readonly ChartCode[])[] = [
  // AlCx Ba   Ca  Ca12 CaCx Clay  Li  Li12 LiCx  PU
  ["-", "I", "I", "C", "I", "I", "I", "I", "C", "I"], // Aluminum complex (read in the source)
  ["I", "-", "I", "C", "I", "I", "I", "I", "I", "I"], // Barium (from memory)
  ["I", "I", "-", "C", "I", "C", "C", "B", "C", "I"], // Calcium (from memory)
  ["C", "C", "C", "-", "B", "C", "C", "C", "C", "I"], // Calcium 12-hydroxy (from memory)
  ["I", "I", "I", "B", "-", "I", "I", "I", "C", "C"], // Calcium complex (from memory)
  ["I", "I", "C", "C", "I", "-", "I", "I", "I", "I"], // Clay (from memory)
  ["I", "I", "C", "C", "I", "I", "-", "C", "C", "I"], // Lithium (from memory)
  ["I", "I", "B", "C", "I", "I", "C", "-", "C", "I"], // Lithium 12-hydroxy (from memory)
  ["C", "I", "C", "C", "C", "I", "C", "C", "-", "I"], // Lithium complex (from memory)
  ["I", "I", "I", "I", "C", "I", "I", "I", "I", "-"], // Polyurea (from memory)
];

export const CHART_TEN_TYPE = defineChart({
  id: "ten-type-chart",
  title: "Ten-thickener compatibility chart",
  shortName: "the ten-type chart reproduced at farmoyl.com",
  source:
    'Ten-thickener grease compatibility chart as reproduced on the farmoyl.com "Grease" resource page ' +
    "(farmoyl.com/en/resources/grease), original author not stated; aluminium-complex row read there, other " +
    "rows from memory",
  provenance: "partly_transcribed",
  provenanceNote:
    "Only the aluminium-complex row was read in the source; the other 36 pairs are from memory and unverified. " +
    "The diagonal is printed n/a (not covered).",
  labels: LABELS,
  thickenerLabels: {
    aluminium_complex: "Aluminum complex",
    barium: "Barium",
    calcium: "Calcium",
    calcium_12_hydroxy: "Calcium 12-hydroxy",
    calcium_complex: "Calcium complex",
    clay: "Clay",
    lithium: "Lithium",
    lithium_12_hydroxy: "Lithium 12-hydroxy",
    lithium_complex: "Lithium complex",
    polyurea: "Polyurea",
  },
  cells: CELLS,
  transcribedPair: (a, b) => a === "Aluminum complex" || b === "Aluminum complex",
});
