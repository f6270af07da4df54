import { describe, expect, it } from "vitest";
import { THICKENERS, type Thickener } from "@/lib/domain/catalogue";
import { CHARTS, DEFAULT_ENABLED_CHARTS, thickenerVerdict, type Verdict } from "@/lib/domain/compatibility";

const A = "fist-2-4-table-2";
const B = "ten-type-chart";
const C = "twelve-type-chart";
const LETTER: Record<string, Verdict> = {
  C: "compatible",
  B: "borderline",
  I: "incompatible",
  "-": "unknown",
};

function matrixCases(labels: readonly Thickener[], rows: readonly string[], source: string) {
  return labels.flatMap((a, i) =>
    rows[i]!.split(" ").map((letter, j) => ({ a, b: labels[j]!, expected: LETTER[letter]!, source })),
  );
}

// Chart A, retyped from charts-verified.md §1.1 (all 81 cells seen; identical to domain.md §1.1).
// Rows/columns: Sodium, Aluminum Complex, Barium, Calcium, Calcium Complex, Clay, Lithium, Lithium Complex, Polyurea.
const CHART_A_SOURCE = "FIST 2-4 (11/90) Table 2 p.15, courtesy Conoco, transcribed";
const CHART_A_LABELS: Thickener[] = [
  "sodium",
  "aluminium_complex",
  "barium",
  "calcium",
  "calcium_complex",
  "clay",
  "lithium",
  "lithium_complex",
  "polyurea",
];
const CHART_A_ROWS = [
  "C I I I I I I I I",
  "I C I I I I B C I",
  "I I C I I I I I I",
  "I I I C I I B C I",
  "I I I I C I I I I",
  "I I I I I B I I I",
  "I B I B I I C C I",
  "I C I C I I C C I",
  "I I I I I I I I C",
];

describe("Chart A (FIST 2-4 Table 2), every printed cell, only Chart A enabled", () => {
  const cases = matrixCases(CHART_A_LABELS, CHART_A_ROWS, CHART_A_SOURCE);

  it("has 81 cases", () => expect(cases).toHaveLength(81));

  it.each(cases)("$a + $b → $expected ($source)", ({ a, b, expected }) => {
    const r = thickenerVerdict(a, b, [A]);
    expect(r.verdict).toBe(expected);
    expect(r.charts).toEqual([{ chartId: A, source: expect.stringContaining("FIST"), verdict: expected }]);
  });

  // "Lithium" is read as covering lithium 12-hydroxystearate too (interpretation: ML #30818, most lithium
  // greases are 12-hydroxystearate); the pair then takes the printed Lithium–Lithium cell.
  it.each([
    { a: "lithium_12_hydroxy", b: "lithium", expected: "compatible" },
    { a: "lithium_12_hydroxy", b: "lithium_12_hydroxy", expected: "compatible" },
    { a: "lithium_12_hydroxy", b: "aluminium_complex", expected: "borderline" },
    { a: "lithium_12_hydroxy", b: "calcium", expected: "borderline" },
    { a: "lithium_12_hydroxy", b: "lithium_complex", expected: "compatible" },
    { a: "lithium_12_hydroxy", b: "polyurea", expected: "incompatible" },
    { a: "lithium_12_hydroxy", b: "clay", expected: "incompatible" },
  ] as { a: Thickener; b: Thickener; expected: Verdict }[])(
    "$a + $b → $expected (FIST 2-4 Table 2, Lithium row; 12-OH mapping is our interpretation of ML #30818)",
    ({ a, b, expected }) => {
      expect(thickenerVerdict(a, b, [A]).verdict).toBe(expected);
    },
  );

  it.each([
    { a: "calcium_12_hydroxy", b: "lithium" },
    { a: "barium_complex", b: "barium" },
    { a: "calcium_sulfonate", b: "lithium_complex" },
    { a: "calcium_sulfonate", b: "calcium_sulfonate" },
    { a: "polyurea_shear_stable", b: "polyurea" },
    { a: "ptfe", b: "lithium" },
    { a: "silica", b: "clay" },
    { a: "other", b: "other" },
  ] as { a: Thickener; b: Thickener }[])(
    "$a + $b is not in Chart A → unknown (FIST 2-4 Table 2 has no such class; domain.md §1.1)",
    ({ a, b }) => {
      expect(thickenerVerdict(a, b, [A])).toEqual({
        verdict: "unknown",
        charts: [{ chartId: A, source: expect.any(String), verdict: null }],
      });
    },
  );
});

// Chart B, aluminium-complex row as seen on farmoyl.com (charts-verified.md §1.2): the self-pair prints "n/a".
const CHART_B_SOURCE = "farmoyl.com 'Grease' page, aluminium-complex row, transcribed";
describe("Chart B (ten-type chart), the aluminium-complex row, only Chart B enabled", () => {
  it.each([
    { b: "aluminium_complex", expected: "unknown" },
    { b: "barium", expected: "incompatible" },
    { b: "calcium", expected: "incompatible" },
    { b: "calcium_12_hydroxy", expected: "compatible" },
    { b: "calcium_complex", expected: "incompatible" },
    { b: "clay", expected: "incompatible" },
    { b: "lithium", expected: "incompatible" },
    { b: "lithium_12_hydroxy", expected: "incompatible" },
    { b: "lithium_complex", expected: "compatible" },
    { b: "polyurea", expected: "incompatible" },
  ] as { b: Thickener; expected: Verdict }[])(
    `aluminium_complex + $b → $expected (${CHART_B_SOURCE})`,
    ({ b, expected }) => {
      expect(thickenerVerdict("aluminium_complex", b, [B]).verdict).toBe(expected);
      expect(thickenerVerdict(b, "aluminium_complex", [B]).verdict).toBe(expected);
    },
  );

  it.each([
    { a: "calcium", b: "clay", expected: "compatible" },
    { a: "calcium", b: "lithium_12_hydroxy", expected: "borderline" },
    { a: "calcium_complex", b: "polyurea", expected: "compatible" },
    { a: "calcium_12_hydroxy", b: "polyurea", expected: "incompatible" },
  ] as { a: Thickener; b: Thickener; expected: Verdict }[])(
    "$a + $b → $expected (domain.md §1.2 row from memory, unverified)",
    ({ a, b, expected }) => {
      expect(thickenerVerdict(a, b, [B]).verdict).toBe(expected);
    },
  );

  it.each(["aluminium_complex", "polyurea", "lithium", "clay", "calcium_12_hydroxy"] as Thickener[])(
    "the diagonal %s + itself is printed n/a → unknown when only Chart B is enabled (farmoyl.com prints n/a)",
    (t) => {
      expect(thickenerVerdict(t, t, [B]).verdict).toBe("unknown");
    },
  );

  it("tags the aluminium-complex row as transcribed and the other rows as from memory (charts-verified.md §1.2)", () => {
    const chart = CHARTS.find((c) => c.id === B)!;
    expect(chart.cellProvenance("aluminium_complex", "barium")).toBe("transcribed");
    expect(chart.cellProvenance("lithium_complex", "aluminium_complex")).toBe("transcribed");
    expect(chart.cellProvenance("calcium", "clay")).toBe("from_memory");
    expect(chart.cellProvenance("polyurea", "polyurea")).toBeNull();
  });
});

describe("Chart C (twelve-type chart), a selection, only Chart C enabled", () => {
  it.each([
    {
      a: "lithium_complex",
      b: "aluminium_complex",
      expected: "compatible",
      source: "from memory; corroborated by Lubes'n'Greases 'Contradictory Compatibility'",
    },
    {
      a: "calcium_sulfonate",
      b: "aluminium_complex",
      expected: "borderline",
      source: "from memory, unverified",
    },
    {
      a: "calcium_sulfonate",
      b: "calcium_complex",
      expected: "incompatible",
      source: "from memory, unverified",
    },
    {
      a: "calcium_sulfonate",
      b: "lithium_complex",
      expected: "compatible",
      source: "from memory, unverified",
    },
    { a: "polyurea_shear_stable", b: "polyurea", expected: "compatible", source: "from memory, unverified" },
    {
      a: "polyurea_shear_stable",
      b: "barium_complex",
      expected: "borderline",
      source: "from memory, unverified",
    },
    { a: "polyurea_shear_stable", b: "clay", expected: "borderline", source: "from memory, unverified" },
    { a: "calcium_12_hydroxy", b: "polyurea", expected: "incompatible", source: "from memory, unverified" },
    {
      a: "calcium",
      b: "lithium",
      expected: "compatible",
      source: "from memory, unverified (Calcium stearate–Lithium stearate)",
    },
    { a: "barium_complex", b: "clay", expected: "incompatible", source: "from memory, unverified" },
    {
      a: "calcium_sulfonate",
      b: "calcium_sulfonate",
      expected: "unknown",
      source: "from memory: diagonal n/a",
    },
    {
      a: "barium",
      b: "lithium",
      expected: "unknown",
      source: "Chart C has Barium complex only (domain.md §1.3)",
    },
    { a: "sodium", b: "sodium", expected: "unknown", source: "Chart C has no sodium (domain.md §1.3)" },
  ] as { a: Thickener; b: Thickener; expected: Verdict; source: string }[])(
    "$a + $b → $expected ($source)",
    ({ a, b, expected }) => {
      expect(thickenerVerdict(a, b, [C]).verdict).toBe(expected);
    },
  );
});

describe("the chart catalogue", () => {
  it.each([
    [
      A,
      "transcribed",
      [
        "aluminium_complex",
        "barium",
        "calcium",
        "calcium_complex",
        "clay",
        "lithium",
        "lithium_12_hydroxy",
        "lithium_complex",
        "polyurea",
        "sodium",
      ],
    ],
    [
      B,
      "partly_transcribed",
      [
        "aluminium_complex",
        "barium",
        "calcium",
        "calcium_12_hydroxy",
        "calcium_complex",
        "clay",
        "lithium",
        "lithium_12_hydroxy",
        "lithium_complex",
        "polyurea",
      ],
    ],
    [
      C,
      "from_memory",
      [
        "aluminium_complex",
        "barium_complex",
        "calcium",
        "calcium_12_hydroxy",
        "calcium_complex",
        "calcium_sulfonate",
        "clay",
        "lithium",
        "lithium_12_hydroxy",
        "lithium_complex",
        "polyurea",
        "polyurea_shear_stable",
      ],
    ],
  ])(
    "%s is %s and covers exactly its printed classes (domain.md §1.1–1.3, charts-verified.md §0)",
    (id, provenance, thickeners) => {
      const chart = CHARTS.find((c) => c.id === id)!;
      expect(chart.provenance).toBe(provenance);
      expect(chart.thickeners).toEqual(thickeners);
      expect(chart.source.length).toBeGreaterThan(20);
    },
  );

  it("enables only the fully transcribed chart by default (charts-verified.md §7.1)", () => {
    expect(DEFAULT_ENABLED_CHARTS).toEqual([A]);
  });

  it.each(["ptfe", "silica", "other"] as Thickener[])("no chart covers %s (domain.md §1.0)", (t) => {
    expect(CHARTS.filter((c) => c.thickeners.includes(t))).toEqual([]);
  });

  it.each(CHARTS.map((c) => [c.id, c] as const))(
    "%s is symmetric over every pair of thickeners (printed matrices are symmetric, charts-verified.md §1.1, §3.1)",
    (_id, chart) => {
      for (const a of THICKENERS) for (const b of THICKENERS) expect(chart.cell(a, b)).toBe(chart.cell(b, a));
    },
  );

  it("Chart A's printed diagonal is C except Clay–Clay = B (charts-verified.md §1.1)", () => {
    const chart = CHARTS.find((c) => c.id === A)!;
    const diagonal = CHART_A_LABELS.map((t) => [t, chart.cell(t, t)]);
    expect(diagonal.filter(([, v]) => v !== "compatible")).toEqual([["clay", "borderline"]]);
  });
});
