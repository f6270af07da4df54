import { describe, expect, it } from "vitest";
import { EnvError, cookiesAreSecure, parseEnv } from "@/lib/env";

const minimal = { DATABASE_PASSWORD: "secret" };

function problems(raw: Record<string, string | undefined>): Record<string, string> {
  try {
    parseEnv(raw);
  } catch (error) {
    expect(error).toBeInstanceOf(EnvError);
    return (error as EnvError).variables;
  }
  throw new Error("expected parseEnv to throw");
}

describe("parseEnv", () => {
  it("fills defaults around the one required variable", () => {
    const env = parseEnv(minimal);
    expect(env.DATABASE_PORT).toBe(3307);
    expect(env.SMTP_PORT).toBe(2525);
    expect(env.APP_URL).toBe("http://localhost:3000");
    expect(env.OUTBOX_RELAY).toBe(true);
  });

  it.each([
    ["DATABASE_PASSWORD", {}],
    ["DATABASE_PORT", { ...minimal, DATABASE_PORT: "not-a-port" }],
    ["DATABASE_PORT", { ...minimal, DATABASE_PORT: "70000" }],
    ["SMTP_PORT", { ...minimal, SMTP_PORT: "-1" }],
    ["APP_URL", { ...minimal, APP_URL: "localhost:3000" }],
    ["APP_URL", { ...minimal, APP_URL: "ftp://example.com" }],
    ["DATABASE_NAME", { ...minimal, DATABASE_NAME: "drop;table" }],
    ["COOKIE_SECURE", { ...minimal, COOKIE_SECURE: "maybe" }],
    ["OUTBOX_RELAY", { ...minimal, OUTBOX_RELAY: "sometimes" }],
    ["NODE_ENV", { ...minimal, NODE_ENV: "staging" }],
  ])("names %s when it is wrong", (name, raw) => {
    const found = problems(raw as Record<string, string>);
    expect(Object.keys(found)).toContain(name);
    expect(() => parseEnv(raw as Record<string, string>)).toThrow(new RegExp(name));
  });

  it("names every bad variable at once", () => {
    const found = problems({ DATABASE_PORT: "x", SMTP_PORT: "y" });
    expect(Object.keys(found).sort()).toEqual(["DATABASE_PASSWORD", "DATABASE_PORT", "SMTP_PORT"]);
  });

  it("treats an empty string as unset", () => {
    expect(parseEnv({ ...minimal, DATABASE_PORT: "" }).DATABASE_PORT).toBe(3307);
  });

  it.each([
    ["auto", "http://localhost:3000", false],
    ["auto", "https://lube.example.com", true],
    ["true", "http://localhost:3000", true],
    ["false", "https://lube.example.com", false],
  ] as const)("COOKIE_SECURE=%s with %s gives secure=%s", (mode, url, secure) => {
    expect(cookiesAreSecure(parseEnv({ ...minimal, COOKIE_SECURE: mode, APP_URL: url }))).toBe(secure);
  });
});
