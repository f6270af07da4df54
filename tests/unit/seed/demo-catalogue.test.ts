import { describe, expect, it } from "vitest";
import { DEMO_GREASES } from "@/seed/catalogue";
import { greaseSchema } from "@/lib/validation/grease";
import { isoViscosityGrade } from "@/lib/domain/viscosity";
import { penetrationMatchesGrade } from "@/lib/domain/consistency";

describe("the demo catalogue", () => {
  it.each(DEMO_GREASES.map((g) => [g.code, g] as const))("%s passes the same validation as the form", (_code, grease) => {
    const result = greaseSchema.safeParse(grease);
    expect(result.success ? [] : result.error.issues).toEqual([]);
  });

  it("has 12–20 greases over at least eight thickeners and five base oils", () => {
    expect(DEMO_GREASES.length).toBeGreaterThanOrEqual(12);
    expect(DEMO_GREASES.length).toBeLessThanOrEqual(20);
    expect(new Set(DEMO_GREASES.map((g) => g.thickener)).size).toBeGreaterThanOrEqual(8);
    expect(new Set(DEMO_GREASES.map((g) => g.baseOilType)).size).toBeGreaterThanOrEqual(5);
  });

  it("includes the greases the demo scenario needs", () => {
    expect(DEMO_GREASES.some((g) => g.foodGrade === "H1")).toBe(true);
    expect(DEMO_GREASES.some((g) => g.thickener === "polyurea")).toBe(true);
    expect(DEMO_GREASES.some((g) => g.thickener === "lithium_complex" && /motor/i.test(g.notes ?? ""))).toBe(true);
    expect(DEMO_GREASES.some((g) => g.thickener === "clay" && (g.maxTemperatureC ?? 0) >= 180)).toBe(true);
    expect(DEMO_GREASES.some((g) => g.baseOilType === "pag")).toBe(true);
  });

  it("uses base-oil viscosities that sit in an ISO VG class and penetrations that match the grade", () => {
    for (const g of DEMO_GREASES) {
      expect(isoViscosityGrade(g.viscosity40), g.code).not.toBeNull();
      if (g.workedPenetration !== undefined) expect(penetrationMatchesGrade(g.nlgiGrade, g.workedPenetration), g.code).toBe(true);
    }
  });
});
