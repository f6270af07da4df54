import { describe, expect, it } from "vitest";
import { pointSchema, serviceSchema } from "@/lib/validation/points";
import { zodFieldErrors } from "@/lib/validation/field-errors";

const good = {
  assetId: "3", name: "Drive end", bearingType: "ball", boreMm: "50", outsideDiameterMm: "110", widthMm: "27", speedRpm: "1480",
  runningHoursPerDay: "24", contamination: "low", moisture: "low", vibration: "low", replenishment: "side", assignedGreaseId: "1",
};

describe("pointSchema", () => {
  it("reads form strings and checkboxes", () => {
    const parsed = pointSchema.parse({ ...good, verticalShaft: "on" });
    expect(parsed).toMatchObject({ assetId: 3, boreMm: 50, verticalShaft: true, foodGradeRequired: false, sealedForLife: false, assignedGreaseId: 1 });
  });

  it.each([
    ["D not larger than d", { outsideDiameterMm: "50" }, "outsideDiameterMm"],
    ["an override without a reason", { intervalHoursOverride: "500" }, "overrideReason"],
    ["no grease and not sealed", { assignedGreaseId: "" }, "assignedGreaseId"],
    ["more than 24 running hours", { runningHoursPerDay: "30" }, "runningHoursPerDay"],
    ["a bore that is not a number", { boreMm: "fifty" }, "boreMm"],
  ])("names the field for %s", (_label, change, field) => {
    const result = pointSchema.safeParse({ ...good, ...change });
    expect(result.success).toBe(false);
    expect(Object.keys(zodFieldErrors(result.error!))).toContain(field);
  });

  it("a sealed-for-life point needs no grease", () => {
    expect(pointSchema.safeParse({ ...good, assignedGreaseId: "", sealedForLife: "on" }).success).toBe(true);
  });
});

describe("serviceSchema", () => {
  it("accepts grams or strokes as numbers or strings", () => {
    expect(serviceSchema.parse({ greaseId: 2, grams: "12,5" }).grams).toBe(12.5);
    expect(serviceSchema.parse({ greaseId: 2, strokes: 9, gunId: 1 }).strokes).toBe(9);
  });
  it("names greaseId and refuses fractional strokes", () => {
    const result = serviceSchema.safeParse({ strokes: 2.5 });
    expect(Object.keys(zodFieldErrors(result.error!)).sort()).toEqual(["greaseId", "strokes"]);
  });
});
