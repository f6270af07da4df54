import { describe, expect, it } from "vitest";
import { proposeConsolidation, type ConsolidationProduct } from "@/lib/domain/consolidation";

// The rules are ours (common practice for SKU rationalisation, reference/domain.md §11.5, no numeric source).
const base: ConsolidationProduct = {
  id: 1,
  name: "A",
  thickener: "lithium_complex",
  baseOilType: "mineral",
  viscosity40: 100,
  nlgiGrade: "2",
  minTemperatureC: -20,
  maxTemperatureC: 140,
  foodGrade: "none",
};
const b = (over: Partial<ConsolidationProduct>): ConsolidationProduct => ({ ...base, id: 2, name: "B", ...over });

const replaces = (a: ConsolidationProduct, other: ConsolidationProduct) =>
  proposeConsolidation([a, other]).some((p) => p.replace.id === a.id && p.by.id === other.id);

describe("proposeConsolidation", () => {
  it("proposes a product with the same family, mixing base oils, close viscosity and grade and a wider range", () => {
    const wider = b({ minTemperatureC: -30, maxTemperatureC: 150, viscosity40: 120 });
    expect(replaces(base, wider)).toBe(true);
    expect(replaces(wider, base)).toBe(false); // the narrower range does not cover the wider one
    const proposal = proposeConsolidation([base, wider])[0]!;
    expect(proposal.reasons.join(" ")).toMatch(/lithium complex/);
  });

  it.each([
    ["another thickener family", { thickener: "polyurea" }],
    ["lithium soap is not lithium complex", { thickener: "lithium_12_hydroxy" }],
    ["a base oil that does not mix (PAG)", { baseOilType: "pag" }],
    ["a viscosity too far apart (100 vs 220)", { viscosity40: 220 }],
    ["two NLGI steps apart", { nlgiGrade: "0" }],
    ["a narrower temperature range", { maxTemperatureC: 120 }],
    ["an unknown upper limit", { maxTemperatureC: null }],
  ] as const)("refuses %s", (_label, over) => {
    expect(replaces(base, b(over as Partial<ConsolidationProduct>))).toBe(false);
  });

  it("keeps food grade: an H1 product is replaced only by H1, an H1 product may replace a non-food one", () => {
    const h1 = { ...base, foodGrade: "H1" as const };
    expect(replaces(h1, b({}))).toBe(false);
    expect(replaces(h1, b({ foodGrade: "H1" }))).toBe(true);
    expect(replaces(base, b({ foodGrade: "H1" }))).toBe(true);
  });

  it("lithium and lithium 12-hydroxystearate are one family; mineral and PAO mix", () => {
    expect(replaces({ ...base, thickener: "lithium" }, b({ thickener: "lithium_12_hydroxy", baseOilType: "pao" }))).toBe(true);
  });

  it("never proposes a product for itself and returns nothing for one product", () => {
    expect(proposeConsolidation([base])).toEqual([]);
  });
});
