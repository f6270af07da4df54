import { describe, expect, it } from "vitest";
import { inviteUserSchema, setPasswordSchema, signInSchema } from "@/lib/validation/auth";
import { zodFieldErrors } from "@/lib/validation/field-errors";

describe("signInSchema", () => {
  it("normalises the e-mail address", () => {
    expect(signInSchema.parse({ email: "  Lead@Example.COM ", password: "x" }).email).toBe("lead@example.com");
  });

  it.each([
    [{ email: "", password: "x" }, "email"],
    [{ email: "not-an-address", password: "x" }, "email"],
    [{ email: "a@b.co", password: "" }, "password"],
    [{ email: 42, password: "x" }, "email"],
    [{}, "email"],
  ])("names the bad field in %j", (input, field) => {
    const result = signInSchema.safeParse(input);
    expect(result.success).toBe(false);
    expect(Object.keys(zodFieldErrors(result.error!))).toContain(field);
  });
});

describe("inviteUserSchema", () => {
  it("coerces site ids from form strings", () => {
    const parsed = inviteUserSchema.parse({ email: "a@b.co", name: "A", role: "clerk", siteIds: ["1", "2"] });
    expect(parsed.siteIds).toEqual([1, 2]);
  });

  it("refuses an unknown role", () => {
    const result = inviteUserSchema.safeParse({ email: "a@b.co", name: "A", role: "owner" });
    expect(result.success).toBe(false);
    expect(zodFieldErrors(result.error!).role).toBeDefined();
  });
});

describe("setPasswordSchema", () => {
  it("says when the confirmation differs", () => {
    const result = setPasswordSchema.safeParse({ token: "0123456789ab", password: "a long enough one", confirm: "another" });
    expect(zodFieldErrors(result.error!).confirm).toEqual(["The two passwords differ."]);
  });

  it("applies the password policy", () => {
    const result = setPasswordSchema.safeParse({ token: "0123456789ab", password: "short", confirm: "short" });
    expect(zodFieldErrors(result.error!).password?.[0]).toMatch(/at least 12/);
  });
});
