import { describe, expect, it } from "vitest";
import { greaseSchema } from "@/lib/validation/grease";
import { pointSchema } from "@/lib/validation/points";
import { zodFieldErrors } from "@/lib/validation/field-errors";

// Found by the route fuzz: a JSON body of `null` reached the cross-field rules, which read its fields and threw,
// so POST /api/v1/greases answered 500 instead of 400.
describe("schemas with cross-field rules refuse a body that is not an object", () => {
  it.each([null, [], "grease", 42, true])("greaseSchema and pointSchema: %j is a field error, not a throw", (body) => {
    for (const schema of [greaseSchema, pointSchema]) {
      const result = schema.safeParse(body);
      expect(result.success).toBe(false);
      expect(Object.keys(zodFieldErrors(result.error!))).toEqual(["body"]);
    }
  });

  it("still runs the cross-field rules on an object whose other fields are wrong", () => {
    const result = greaseSchema.safeParse({ code: "", viscosity40: 100, viscosity100: 200 });
    expect(result.success).toBe(false);
    const fields = zodFieldErrors(result.error!);
    expect(fields.code).toBeDefined();
    expect(fields.viscosity100).toEqual(["Viscosity at 100 °C must be lower than at 40 °C."]);
  });
});
