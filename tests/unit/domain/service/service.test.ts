import { describe, expect, it } from "vitest";
import { containerCodeFromScan, normaliseTagCode, quantityFlag, scannedKind, tagCodeFrom, tagCodeFromScan } from "@/lib/domain/service";

describe("quantityFlag (±30 %, common practice, no source)", () => {
  it.each([
    [10, 10, "ok"],
    [13, 10, "ok"],
    [13.1, 10, "over"],
    [7, 10, "ok"],
    [6.9, 10, "under"],
    [10, null, null],
    [10, 0, null],
  ] as const)("%s g against a plan of %s g → %s", (applied, planned, flag) => {
    expect(quantityFlag(applied, planned)).toBe(flag);
  });
});

describe("tag codes (Crockford base 32)", () => {
  it("makes 8 characters from the alphabet", () => {
    expect(tagCodeFrom(new Uint8Array([0, 1, 31, 32, 33, 255, 10, 17]))).toBe("01Z01Z" + "AH");
  });
  it.each([
    ["k7qx-3mpa", "K7QX3MPA"],
    ["K7QX 3MPA", "K7QX3MPA"],
    ["O0IL1234", "00111234"],
    ["ABC-12", null],
    ["K7QX3MPU", null],
  ])("normalises %j to %j", (typed, code) => {
    expect(normaliseTagCode(typed)).toBe(code);
  });
  it.each([
    ["http://127.0.0.1:3000/p/K7QX3MPA", "K7QX3MPA"],
    ["https://lube.example.com/p/k7qx3mpa/", "K7QX3MPA"],
    ["K7QX3MPA", "K7QX3MPA"],
    ["https://evil.example/other", null],
  ])("reads the code from the scan %j", (text, code) => {
    expect(tagCodeFromScan(text)).toBe(code);
  });
  // Our own formats (no source): a point tag carries /p/<code>, a container label /c/<code>.
  it.each([
    ["http://127.0.0.1:3000/c/K7QX3MPA", "K7QX3MPA", null, "container"],
    ["https://lube.example.com/c/k7qx3mpa/", "K7QX3MPA", null, "container"],
    ["http://127.0.0.1:3000/p/K7QX3MPA", null, "K7QX3MPA", "point"],
    ["K7QX3MPA", "K7QX3MPA", "K7QX3MPA", "bare"],
    ["https://evil.example/c/NOT-A-CODE-AT-ALL", null, null, null],
    ["", null, null, null],
  ] as const)("tells a container label from a point tag in %j", (text, container, point, kind) => {
    expect(containerCodeFromScan(text)).toBe(container);
    expect(tagCodeFromScan(text)).toBe(point);
    expect(scannedKind(text)).toBe(kind);
  });
});

import { effectiveValue } from "@/lib/domain/service";

describe("effectiveValue: override, then the maker's value, then the calculator (product brief §Points)", () => {
  it.each([
    [{ override: 500, maker: 2000, calculated: 4000 }, { value: 500, source: "override" }],
    [{ override: null, maker: 2000, calculated: 4000 }, { value: 2000, source: "maker" }],
    [{ maker: 0, calculated: 4000 }, { value: 4000, source: "calculated" }],
    [{ calculated: null }, { value: null, source: "none" }],
    [{ override: -5, calculated: Number.NaN }, { value: null, source: "none" }],
  ])("%j → %j", (input, expected) => {
    expect(effectiveValue(input)).toEqual(expected);
  });
});
