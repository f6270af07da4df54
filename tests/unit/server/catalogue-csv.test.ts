import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { neutraliseCell, restoreCell } from "@/lib/csv";
import { GREASE_CSV_COLUMNS, greasesToCsv, parseGreaseCsv } from "@/lib/server/catalogue-csv";
import type { GreaseDto } from "@/lib/server/queries/greases";

const header = GREASE_CSV_COLUMNS.map(([c]) => c).join(",");
const good = "GL-1,Test Grease,Acme Oils,lithium_complex,mineral,100,11,2,280,100,260,-30,150,none,,36,cartridge:400;pail:18000,";

describe("CSV formula neutralisation (OWASP CSV injection guidance)", () => {
  it.each([
    ["=HYPERLINK(\"x\")", "'=HYPERLINK(\"x\")"],
    ["+1+1", "'+1+1"],
    ["@SUM(A1)", "'@SUM(A1)"],
    ["-cmd", "'-cmd"],
    ["\tTabbed", "'\tTabbed"],
    ["-30", "-30"],
    ["-12.5", "-12.5"],
    ["plain", "plain"],
  ])("%j exports as %j and reads back", (input, output) => {
    expect(neutraliseCell(input)).toBe(output);
    expect(restoreCell(neutraliseCell(input))).toBe(input);
  });
});

describe("parseGreaseCsv", () => {
  it("accepts a good row and turns packs and numbers into values", () => {
    const preview = parseGreaseCsv(`${header}\n${good}\n`);
    expect(preview.problems).toEqual([]);
    expect(preview.rows[0]!.errors).toEqual({});
    expect(preview.rows[0]!.input).toMatchObject({ code: "GL-1", viscosity40: 100, minTemperatureC: -30, packs: [{ kind: "cartridge", netMassGrams: 400 }, { kind: "pail", netMassGrams: 18000 }] });
  });

  it("marks each bad cell by its column and line, and keeps the good rows", () => {
    const bad = "GL-2,Bad Grease,Acme Oils,unobtainium,mineral,abc,11,7,,,,150,100,none,,,barrel:5,";
    const preview = parseGreaseCsv(`${header}\n${good}\n${bad}\n`);
    const row = preview.rows[1]!;
    expect(row.line).toBe(3);
    expect(Object.keys(row.errors).sort()).toEqual(["max_temperature_c", "nlgi_grade", "packs", "thickener", "viscosity_40_mm2s"].sort());
    expect(row.input).toBeUndefined();
    expect(preview.rows[0]!.input).toBeDefined();
  });

  it("flags a code that appears twice in the file", () => {
    const preview = parseGreaseCsv(`${header}\n${good}\n${good}\n`);
    expect(preview.rows[1]!.errors.code).toMatch(/line 2/);
  });

  it("names missing columns and refuses unreadable files without throwing", () => {
    expect(parseGreaseCsv("code,name\nA,B\n").problems[0]).toMatch(/Missing column/);
    expect(parseGreaseCsv("").problems[0]).toMatch(/empty/);
    expect(parseGreaseCsv(`${header}\n"unclosed,quote\n`).problems[0]).toMatch(/not readable/);
  });

  it("round-trips an export, awkward text included", () => {
    const grease: GreaseDto = {
      id: 1, code: "GL-Q", name: 'Quote "and", comma', supplier: "=Evil Supplier", thickener: "clay", baseOilType: "pao",
      viscosity40: 460, viscosity100: 31, nlgiGrade: "2", minTemperatureC: -10, maxTemperatureC: 200, foodGrade: "H1",
      solidAdditives: ["graphite", "ptfe"], shelfLifeMonths: 36, notes: "Line one\nline two — ünïcödé", version: 1,
      packs: [{ id: 9, kind: "keg", netMassGrams: 50000 }], updatedAt: new Date(0).toISOString(),
    };
    const csv = greasesToCsv([grease]);
    expect(csv).toContain("\r\n");
    const raw = parse(csv) as string[][];
    expect(raw[1]![2]).toBe("'=Evil Supplier");
    const back = parseGreaseCsv(csv).rows[0]!;
    expect(back.errors).toEqual({});
    expect(back.input).toMatchObject({ name: 'Quote "and", comma', supplier: "=Evil Supplier", notes: "Line one\nline two — ünïcödé", solidAdditives: ["graphite", "ptfe"], packs: [{ kind: "keg", netMassGrams: 50000 }] });
  });
});
