import { describe, expect, it } from "vitest";
import { SMALL_JSON_BYTES, jsonResponse } from "@/lib/server/json-response";

describe("jsonResponse and compression", () => {
  it("marks an answer below the threshold no-transform, so the framework's gzip leaves it alone", async () => {
    // A mix check's answer is about 1.6–1.9 KB: it must go out as it is.
    const answer = jsonResponse({ verdict: "borderline", reasons: ["x".repeat(1900)] });
    expect(answer.headers.get("cache-control")).toBe("private, no-store, no-transform");
    expect(answer.headers.get("content-type")).toBe("application/json");
    expect(JSON.parse(await answer.text()).verdict).toBe("borderline");
  });

  it("lets a larger answer be compressed, and keeps a Cache-Control the caller set", () => {
    const big = jsonResponse({ items: ["y".repeat(SMALL_JSON_BYTES)] });
    expect(big.headers.get("cache-control")).toBe("private, no-store");
    const own = jsonResponse({ ok: true }, { headers: { "Cache-Control": "private, max-age=60" } });
    expect(own.headers.get("cache-control")).toBe("private, max-age=60");
  });

  it("measures the threshold in bytes, not characters (UTF-8 accents and symbols count double or more)", () => {
    // 3,000 'é' are 6,000 bytes, and 4,200 of them 8,400 bytes: only the second crosses 8 KB.
    expect(jsonResponse({ t: "é".repeat(3000) }).headers.get("cache-control")).toContain("no-transform");
    expect(jsonResponse({ t: "é".repeat(4200) }).headers.get("cache-control")).not.toContain("no-transform");
  });
});
