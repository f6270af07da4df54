import { describe, expect, it } from "vitest";
import { incidentFilterSchema } from "@/lib/validation/incidents";

describe("the incident filter's dates", () => {
  it.each([
    ["30 February", "2026-02-30"],
    ["31 April", "2026-04-31"],
    ["29 February of a common year", "2027-02-29"],
    ["month 13", "2026-13-01"],
  ])("refuses %s, naming the field, instead of rolling it over", (_what, day) => {
    const result = incidentFilterSchema.safeParse({ from: day });
    expect(result.success).toBe(false);
    expect(result.error!.issues.map((i) => i.path.join("."))).toContain("from");
    expect(result.error!.issues.map((i) => i.message).join(" ")).toMatch(/not a real date/);
  });

  it("takes real days, 29 February of a leap year among them", () => {
    expect(incidentFilterSchema.safeParse({ from: "2028-02-29", to: "2028-03-01" }).success).toBe(true);
  });
});
