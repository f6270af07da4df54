import { describe, expect, it } from "vitest";
import { BASE_OIL_TYPES, type BaseOilType } from "@/lib/domain/catalogue";
import { BASE_OIL_MISCIBILITY, baseOilVerdict, type Verdict } from "@/lib/domain/compatibility";

const INNER = "inner.su Table 1";
const ML = "Machinery Lubrication #28867";
const PFPE = "conservative default, unverified (charts-verified.md §3.3)";

// charts-verified.md §3.3 "rules supported by two or more sources" and §7.4.
const CASES: { a: BaseOilType; b: BaseOilType; expected: Verdict; source: string }[] = [
  { a: "mineral", b: "mineral", expected: "compatible", source: INNER },
  { a: "pao", b: "pao", expected: "compatible", source: INNER },
  { a: "ester", b: "ester", expected: "compatible", source: INNER },
  { a: "pag", b: "pag", expected: "compatible", source: INNER },
  { a: "silicone", b: "silicone", expected: "compatible", source: INNER },
  { a: "pfpe", b: "pfpe", expected: "compatible", source: "same type; from memory (bearing maker's table)" },
  { a: "mineral", b: "pao", expected: "compatible", source: `${INNER}; ${ML}` },
  {
    a: "mineral",
    b: "ester",
    expected: "borderline",
    source: `${INNER} conditional < 10 %; charts-verified §3.3 'test'`,
  },
  { a: "mineral", b: "pag", expected: "incompatible", source: `${INNER}; ${ML}` },
  { a: "pao", b: "pag", expected: "incompatible", source: `${INNER}; ${ML}` },
  {
    a: "ester",
    b: "pag",
    expected: "borderline",
    source: `${INNER} conditional < 5 %; ${ML}; charts-verified §7.4`,
  },
  { a: "pao", b: "ester", expected: "compatible", source: INNER },
  { a: "silicone", b: "mineral", expected: "incompatible", source: INNER },
  { a: "silicone", b: "pao", expected: "incompatible", source: INNER },
  { a: "silicone", b: "ester", expected: "incompatible", source: INNER },
  { a: "silicone", b: "pag", expected: "incompatible", source: INNER },
  { a: "pfpe", b: "mineral", expected: "incompatible", source: PFPE },
  { a: "pfpe", b: "pao", expected: "incompatible", source: PFPE },
  { a: "pfpe", b: "ester", expected: "incompatible", source: PFPE },
  { a: "pfpe", b: "pag", expected: "incompatible", source: PFPE },
  { a: "pfpe", b: "silicone", expected: "incompatible", source: PFPE },
  { a: "other", b: "mineral", expected: "unknown", source: "not in any table (lead engineer's rule)" },
  { a: "other", b: "pfpe", expected: "unknown", source: "not in any table" },
  { a: "other", b: "other", expected: "unknown", source: "two unlisted oils may be anything" },
];

describe("baseOilVerdict", () => {
  it.each(CASES)("$a + $b → $expected ($source)", ({ a, b, expected }) => {
    const r = baseOilVerdict(a, b);
    expect(r.kind).toBe("base_oil");
    expect(r.verdict).toBe(expected);
    expect(baseOilVerdict(b, a).verdict).toBe(expected);
  });

  it.each(BASE_OIL_TYPES.filter((t) => t !== "pag"))(
    "pag + %s is at least borderline (charts-verified.md §3.3: PAG vs anything but PAG = at least 'test')",
    (t) => {
      expect(baseOilVerdict("pag", t).verdict).not.toBe("compatible");
    },
  );

  it("has one cell for every unordered pair of the six named types, each with a source", () => {
    const named = BASE_OIL_TYPES.filter((t) => t !== "other");
    expect(BASE_OIL_MISCIBILITY).toHaveLength((named.length * (named.length + 1)) / 2);
    for (const a of named) for (const b of named) expect(baseOilVerdict(a, b).source).toBeTruthy();
  });

  it.each(["mineral", "pao", "ester", "pag", "silicone"] as BaseOilType[])(
    "every PFPE pair with %s names that it is unverified",
    (t) => {
      expect(baseOilVerdict("pfpe", t).source).toMatch(/unverified/);
    },
  );

  it("names both oils and its sources in the reason (PRODUCT.md: every reason with its source)", () => {
    const r = baseOilVerdict("mineral", "pag");
    expect(r.message).toBe(
      "Mineral and polyglycol (PAG) base oils do not mix: polyglycol with other oils gives sludge and tacky residue.",
    );
    expect(r.source).toMatch(/inner\.su/);
    expect(r.source).toMatch(/#28867/);
  });
});
