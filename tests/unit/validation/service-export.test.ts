import { describe, expect, it } from "vitest";
import { zodFieldErrors } from "@/lib/validation/field-errors";
import { serviceExportSchema } from "@/lib/validation/service-export";

const NOW = new Date("2026-06-15T10:30:00Z");
const parse = (query: Record<string, string>) => serviceExportSchema(NOW).safeParse(query);
const fieldsOf = (query: Record<string, string>) => {
  const result = parse(query);
  expect(result.success).toBe(false);
  return zodFieldErrors(result.error!);
};

describe("serviceExportSchema", () => {
  it("defaults to csv, to today (UTC) and from 365 days before to", () => {
    expect(parse({}).data).toEqual({
      format: "csv",
      from: "2025-06-15",
      to: "2026-06-15",
      siteId: undefined,
    });
    expect(parse({ to: "2024-03-01", site: "2" }).data).toEqual({
      format: "csv",
      from: "2023-03-02",
      to: "2024-03-01",
      siteId: 2,
    });
  });

  it("takes an explicit period, both ends included, and a one-day period", () => {
    expect(parse({ from: "2026-01-01", to: "2026-01-01" }).data).toMatchObject({
      from: "2026-01-01",
      to: "2026-01-01",
    });
  });

  it.each([
    ["a month 13", { from: "2026-13-01" }, "from"],
    ["30 February (not rolled into March)", { from: "2026-02-30" }, "from"],
    ["a day without dashes", { to: "20260101" }, "to"],
    ["from after to", { from: "2026-05-02", to: "2026-05-01" }, "from"],
    ["a span of three years and a day", { from: "2023-01-01", to: "2026-01-01" }, "from"],
    ["a site that is not a number", { site: "north" }, "site"],
    ["a site that is not whole", { site: "1.5" }, "site"],
    ["another format", { format: "xlsx" }, "format"],
  ])("names the field for %s", (_label, query, field) => {
    expect(Object.keys(fieldsOf(query))).toEqual([field]);
  });

  it("accepts exactly three years less a day, and says what from may be when the span is too long", () => {
    expect(parse({ from: "2023-01-02", to: "2026-01-01" }).success).toBe(true);
    expect(fieldsOf({ from: "2023-01-01", to: "2026-01-01" }).from![0]).toContain("after 2023-01-01");
  });
});
