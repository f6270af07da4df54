import { beforeAll, describe, expect, it } from "vitest";
import { Client, rootQuery } from "./helpers";

const tech = new Client();
const auditor = new Client();
let ids: Record<string, number> = {};

beforeAll(async () => {
  await tech.signIn("tech@example.com");
  await auditor.signIn("auditor@example.com");
  const rows = await rootQuery<{ id: number; code: string }>("SELECT id, code FROM grease");
  ids = Object.fromEntries(rows.map((r) => [r.code, Number(r.id)]));
});

const evaluate = (client: Client, body: unknown) => client.request("POST", "/api/v1/compatibility/evaluate", { json: body });

describe("POST /api/v1/compatibility/evaluate", () => {
  it("blocks lithium complex into polyurea (FIST 2-4 Table 2: I) with the reasons and the chart", async () => {
    const response = await evaluate(tech, { a: { greaseId: ids["GL-EM2"] }, b: { greaseId: ids["GL-LX2"] } });
    expect(response.status).toBe(200);
    expect(response.body.verdict).toBe("incompatible");
    expect(response.body.mixingAllowed).toBe(false);
    const thickener = response.body.reasons.find((r: { kind: string }) => r.kind === "thickener");
    expect(thickener.verdict).toBe("incompatible");
    expect(thickener.source).toMatch(/FIST/);
    expect(response.body.charts).toEqual(expect.arrayContaining([expect.objectContaining({ chartId: "fist-2-4-table-2", verdict: "incompatible" })]));
  });

  it("the same product is compatible with itself", async () => {
    const response = await evaluate(auditor, { a: { greaseId: ids["GL-LX2"] }, b: { greaseId: ids["GL-LX2"] } });
    expect(response.body).toMatchObject({ verdict: "compatible", mixingAllowed: true });
    expect(response.body.reasons[0].kind).toBe("same_product");
  });

  it("lab evidence on record overrides a pair no default chart covers (calcium sulfonate + lithium complex)", async () => {
    const response = await evaluate(tech, { a: { greaseId: ids["GL-CS2"] }, b: { greaseId: ids["GL-LX2"] } });
    expect(response.body.verdict).toBe("compatible");
    const kinds = response.body.reasons.map((r: { kind: string }) => r.kind);
    expect(kinds).toContain("evidence");
    expect(response.body.reasons.find((r: { kind: string }) => r.kind === "thickener").overridden).toBe(true);
  });

  it("a food-grade point refuses a grease that is not H1", async () => {
    const response = await evaluate(tech, { a: { greaseId: ids["GL-FG2"] }, b: { greaseId: ids["GL-FG2"] }, point: { foodGradeRequired: true } });
    expect(response.body.verdict).toBe("compatible");
    const refused = await evaluate(tech, {
      a: { profile: { thickener: "aluminium_complex", baseOilType: "pao", foodGrade: "H1" } },
      b: { profile: { thickener: "aluminium_complex", baseOilType: "pao", foodGrade: "none" } },
      point: { foodGradeRequired: true },
    });
    expect(refused.body.verdict).toBe("incompatible");
    expect(refused.body.reasons.some((r: { kind: string; verdict: string }) => r.kind === "food_grade" && r.verdict === "incompatible")).toBe(true);
  });

  it("typed-in profiles work, and a polyglycol base oil is refused against mineral oil", async () => {
    const response = await evaluate(tech, {
      a: { profile: { thickener: "lithium_complex", baseOilType: "mineral", viscosity40: 220 } },
      b: { profile: { thickener: "lithium_complex", baseOilType: "pag", viscosity40: 220 } },
    });
    expect(response.status).toBe(200);
    expect(response.body.verdict).toBe("incompatible");
    expect(response.body.reasons.find((r: { kind: string }) => r.kind === "base_oil").verdict).toBe("incompatible");
  });

  it.each([
    [{}, ["a", "b"]],
    [{ a: { greaseId: "x" }, b: { profile: { thickener: "mud", baseOilType: "mineral" } } }, ["a", "b"]],
    [{ a: { greaseId: 1 }, b: { greaseId: 1 }, point: { foodGradeRequired: "yes" } }, ["point.foodGradeRequired"]],
  ])("an invalid body gives 400 naming the fields (%j)", async (body, fields) => {
    const response = await evaluate(tech, body);
    expect(response.status).toBe(400);
    for (const field of fields) expect(Object.keys(response.body.error.fields).some((k) => k.startsWith(field))).toBe(true);
  });

  it("an unknown grease id is a 400 on that field, not a 500", async () => {
    const response = await evaluate(tech, { a: { greaseId: 987654 }, b: { greaseId: ids["GL-LX2"] } });
    expect(response.status).toBe(400);
    expect(response.body.error.fields["a.greaseId"]).toBeDefined();
  });

  it("needs a session", async () => {
    expect((await evaluate(new Client(), { a: { greaseId: 1 }, b: { greaseId: 1 } })).status).toBe(401);
  });
});

describe("POST /api/v1/calculations/consistency (NLGI grades from ASTM D217 worked penetration, domain.md §3)", () => {
  it.each([
    [280, { nlgiGrade: "2" }],
    [265, { nlgiGrade: "2" }],
    [300, { nlgiGrade: null, between: ["1", "2"] }],
    [85, { nlgiGrade: "6" }],
    [5, { nlgiGrade: null }],
  ])("worked penetration %i → %j", async (workedPenetration, expected) => {
    const response = await tech.request("POST", "/api/v1/calculations/consistency", { json: { workedPenetration } });
    expect(response.status).toBe(200);
    expect(response.body).toEqual(expected);
  });

  it("names the field when it is not a number", async () => {
    const response = await tech.request("POST", "/api/v1/calculations/consistency", { json: { workedPenetration: "soft" } });
    expect(response.status).toBe(400);
    expect(response.body.error.fields.workedPenetration).toBeDefined();
  });
});
