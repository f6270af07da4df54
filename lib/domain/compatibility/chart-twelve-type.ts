import { defineChart, type ChartCode } from "./define-chart";

/**
 * Chart C. A twelve-thickener industrial grease compatibility chart with calcium sulfonate and shear-stable
 * polyurea, widely reproduced in supplier literature; believed (from memory) to be the chart published by
 * ExxonMobil ("Mobil Industrial").
 *
 * From memory, low to medium confidence: no copy was found in the public material (reference/domain.md §1.3,
 * charts-verified.md §2.2). One cell is corroborated: Lithium complex–Aluminium complex = C, which the
 * Lubes'n'Greases article "Contradictory Compatibility" (lubesngreases.com/magazine/25_10) attributes to this
 * publisher's chart. The printed labels below are also from memory. Suspect cells as in Chart B: Calcium
 * stearate–Clay = C, Calcium complex–Lithium complex = C, Calcium complex–Polyurea = C.
 *
 * The diagonal is "n/a": not covered.
 */
const LABELS = [
  "Aluminum Complex",
  "Barium Complex",
  "Calcium Stearate",
  "Calcium 12 Hydroxy",
  "Calcium Complex",
  "Calcium Sulfonate",
  "Clay Non-Soap",
  "Lithium Stearate",
  "Lithium 12 Hydroxy",
  "Lithium Complex",
  "Polyurea Conventional",
  "Polyurea S/S",
] as const;

// prettier-ignore
const CELLS: readonly (readonly ChartCode[])[] = [
  // AlCx BaCx CaSt Ca12 CaCx CaSx Clay LiSt Li12 LiCx  PU  PUss
  ["-", "I", "I", "C", "I", "B", "I", "I", "I", "C", "I", "C"], // Aluminum Complex
  ["I", "-", "I", "C", "I", "B", "I", "I", "I", "I", "I", "B"], // Barium Complex
  ["I", "I", "-", "C", "I", "B", "C", "C", "B", "C", "I", "C"], // Calcium Stearate
  ["C", "C", "C", "-", "B", "C", "C", "C", "C", "C", "I", "C"], // Calcium 12 Hydroxy
  ["I", "I", "I", "B", "-", "I", "I", "I", "I", "C", "C", "C"], // Calcium Complex
  ["B", "B", "B", "C", "I", "-", "I", "B", "B", "C", "I", "C"], // Calcium Sulfonate
  ["I", "I", "C", "C", "I", "I", "-", "I", "I", "I", "I", "B"], // Clay Non-Soap
  ["I", "I", "C", "C", "I", "B", "I", "-", "C", "C", "I", "C"], // Lithium Stearate
  ["I", "I", "B", "C", "I", "B", "I", "C", "-", "C", "I", "C"], // Lithium 12 Hydroxy
  ["C", "I", "C", "C", "C", "C", "I", "C", "C", "-", "I", "C"], // Lithium Complex
  ["I", "I", "I", "I", "C", "I", "I", "I", "I", "I", "-", "C"], // Polyurea Conventional
  ["C", "B", "C", "C", "C", "C", "B", "C", "C", "C", "C", "-"], // Polyurea S/S
];

export const CHART_TWELVE_TYPE = defineChart({
  id: "twelve-type-chart",
  title: "Twelve-thickener compatibility chart",
  shortName: "the twelve-type chart",
  source:
    "Twelve-thickener industrial grease compatibility chart widely reproduced in supplier literature, believed " +
    "to be published by ExxonMobil (Mobil Industrial); cells from memory, no copy seen",
  provenance: "from_memory",
  provenanceNote:
    "No copy of the chart was seen; every cell is from memory and unverified. Only Lithium complex–Aluminium " +
    "complex = C is corroborated (Lubes'n'Greases, \"Contradictory Compatibility\"). The diagonal is n/a.",
  labels: LABELS,
  thickenerLabels: {
    aluminium_complex: "Aluminum Complex",
    barium_complex: "Barium Complex",
    calcium: "Calcium Stearate",
    calcium_12_hydroxy: "Calcium 12 Hydroxy",
    calcium_complex: "Calcium Complex",
    calcium_sulfonate: "Calcium Sulfonate",
    clay: "Clay Non-Soap",
    lithium: "Lithium Stearate",
    lithium_12_hydroxy: "Lithium 12 Hydroxy",
    lithium_complex: "Lithium Complex",
    polyurea: "Polyurea Conventional",
    polyurea_shear_stable: "Polyurea S/S",
  },
  cells: CELLS,
});
