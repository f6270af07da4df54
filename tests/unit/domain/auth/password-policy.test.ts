import { describe, expect, it } from "vitest";
import { passwordProblem } from "@/lib/domain/auth";

// OWASP ASVS 5.0 V6.2.1, V6.2.4, V6.2.5, V6.2.9; the 12-character minimum is our choice.
describe("passwordProblem", () => {
  it.each([
    ["short", "elevenchars", /at least 12/],
    ["too long", "x".repeat(129), /at most 128/],
    ["common", "Password1234", /too common/],
  ])("refuses a %s password", (_label, password, message) => {
    expect(passwordProblem(password)).toMatch(message);
  });

  it.each([
    ["twelve plain letters, no composition rules", "bearinghouse"],
    ["a passphrase with spaces", "purge the old grease slowly"],
    ["64 characters", "p".repeat(64)],
    ["128 characters", "q".repeat(128)],
    ["Unicode counted by code point", "ölwechsel🛢️lager"],
  ])("accepts %s", (_label, password) => {
    expect(passwordProblem(password)).toBeNull();
  });

  it("counts code points, not UTF-16 units", () => {
    expect(passwordProblem("🛢".repeat(11))).toMatch(/at least 12/);
  });
});
