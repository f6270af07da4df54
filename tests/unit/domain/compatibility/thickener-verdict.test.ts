import { describe, expect, it } from "vitest";
import type { Thickener } from "@/lib/domain/catalogue";
import { strictestVerdict, thickenerVerdict, VERDICTS, type Verdict } from "@/lib/domain/compatibility";

const A = "fist-2-4-table-2";
const B = "ten-type-chart";
const C = "twelve-type-chart";

describe("strictestVerdict", () => {
  it.each([
    [["compatible", "borderline"], "borderline"],
    [["borderline", "unknown"], "unknown"],
    [["unknown", "incompatible"], "incompatible"],
    [["incompatible", "compatible", "borderline"], "incompatible"],
    [["compatible", "compatible"], "compatible"],
    [[], "unknown"],
  ] as [Verdict[], Verdict][])(
    "%j → %s (order compatible < borderline < unknown < incompatible; lead engineer's rule)",
    (vs, expected) => {
      expect(strictestVerdict(vs)).toBe(expected);
      expect(strictestVerdict([...vs].reverse())).toBe(expected);
    },
  );

  it("lists the four verdicts", () =>
    expect([...VERDICTS].sort()).toEqual(["borderline", "compatible", "incompatible", "unknown"]));
});

describe("thickenerVerdict across several charts: the strictest covering chart wins", () => {
  it.each([
    {
      a: "lithium",
      b: "aluminium_complex",
      charts: [A, B],
      expected: "incompatible",
      per: ["borderline", "incompatible"],
      source: "A=B (FIST, transcribed), B=I (farmoyl.com row, transcribed); charts-verified.md §6.2",
    },
    {
      a: "lithium",
      b: "calcium",
      charts: [A, B],
      expected: "borderline",
      per: ["borderline", "compatible"],
      source: "A=B (FIST), B=C (from memory); charts-verified.md §6.2",
    },
    {
      a: "lithium",
      b: "calcium",
      charts: [A, B, C],
      expected: "borderline",
      per: ["borderline", "compatible", "compatible"],
      source: "A=B, B and C = C (from memory)",
    },
    {
      a: "calcium_complex",
      b: "lithium_complex",
      charts: [A, B],
      expected: "incompatible",
      per: ["incompatible", "compatible"],
      source: "A=I, B=C (from memory, suspect); charts-verified.md §7.2",
    },
    {
      a: "calcium",
      b: "clay",
      charts: [A, B, C],
      expected: "incompatible",
      per: ["incompatible", "compatible", "compatible"],
      source: "A=I, B/C=C (from memory, suspect); charts-verified.md §7.2",
    },
    {
      a: "lithium_complex",
      b: "aluminium_complex",
      charts: [A, B, C],
      expected: "compatible",
      per: ["compatible", "compatible", "compatible"],
      source: "A, B row and C (L&G) all C; charts-verified.md §6.2",
    },
    {
      a: "calcium_sulfonate",
      b: "lithium_complex",
      charts: [A, C],
      expected: "compatible",
      per: [null, "compatible"],
      source: "only C covers calcium sulfonate (from memory); A gives null",
    },
    {
      a: "clay",
      b: "clay",
      charts: [A, B, C],
      expected: "borderline",
      per: ["borderline", null, null],
      source: "A prints Clay–Clay B; B and C print n/a",
    },
    {
      a: "polyurea",
      b: "polyurea",
      charts: [A],
      expected: "compatible",
      per: ["compatible"],
      source: "FIST 2-4 Table 2 diagonal, as printed",
    },
    {
      a: "polyurea",
      b: "polyurea",
      charts: [B],
      expected: "unknown",
      per: [null],
      source: "farmoyl.com prints n/a on the diagonal",
    },
    {
      a: "polyurea",
      b: "polyurea",
      charts: [A, B],
      expected: "compatible",
      per: ["compatible", null],
      source: "A covers it, B does not",
    },
  ] as {
    a: Thickener;
    b: Thickener;
    charts: string[];
    expected: Verdict;
    per: (Verdict | null)[];
    source: string;
  }[])("$a + $b with $charts → $expected ($source)", ({ a, b, charts, expected, per }) => {
    const r = thickenerVerdict(a, b, charts);
    expect(r.verdict).toBe(expected);
    expect(r.charts.map((c) => c.verdict)).toEqual(per);
    expect(thickenerVerdict(b, a, [...charts].reverse())).toEqual(r);
  });

  it.each([
    {
      a: "calcium_sulfonate",
      b: "lithium",
      charts: [A],
      why: "calcium sulfonate is missing from the older charts (domain.md §1.0)",
    },
    { a: "ptfe", b: "lithium", charts: [A, B, C], why: "PTFE is in no chart (domain.md §1.0)" },
    { a: "silica", b: "silica", charts: [A, B, C], why: "silica is in no chart" },
    { a: "lithium", b: "lithium_complex", charts: [], why: "no chart enabled" },
    { a: "lithium", b: "lithium_complex", charts: ["no-such-chart"], why: "unknown chart ids are ignored" },
  ] as { a: Thickener; b: Thickener; charts: string[]; why: string }[])(
    "$a + $b with $charts → unknown ($why)",
    ({ a, b, charts }) => {
      expect(thickenerVerdict(a, b, charts).verdict).toBe("unknown");
    },
  );

  it("reports charts in catalogue order, once each, whatever order they are enabled in", () => {
    expect(thickenerVerdict("lithium", "calcium", [C, A, C, B]).charts.map((c) => c.chartId)).toEqual([
      A,
      B,
      C,
    ]);
  });
});
