import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  GRAMS_PER_OUNCE,
  MM_PER_INCH,
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  formatLength,
  formatMass,
  formatNumber,
  formatTemperature,
  gramsToOunces,
  inchToMm,
  mmToInch,
  ouncesToGrams,
} from "@/lib/domain/units";

// The definitions: 1 in = 25.4 mm and 1 oz (avoirdupois) = 28.349523125 g exactly (1959 international yard and
// pound; NIST Handbook 44 App. C). °F = °C·9/5 + 32 by definition of the scales.
const DEFINITION = "exact by definition (NIST Handbook 44 App. C)";

describe("conversion constants", () => {
  it(`are the exact definitions (${DEFINITION})`, () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(GRAMS_PER_OUNCE).toBe(28.349523125);
  });
});

describe("length, mass and temperature conversions", () => {
  it.each([
    { fn: "inchToMm", input: 1, expected: 25.4, source: DEFINITION },
    { fn: "mmToInch", input: 25.4, expected: 1, source: DEFINITION },
    { fn: "mmToInch", input: 100, expected: 3.937007874, source: "derived: 100 / 25.4 = 3.937007874" },
    { fn: "ouncesToGrams", input: 1, expected: 28.349523125, source: DEFINITION },
    { fn: "ouncesToGrams", input: 16, expected: 453.59237, source: "derived: 16 oz = 1 lb = 453.59237 g" },
    {
      fn: "gramsToOunces",
      input: 400,
      expected: 14.109585,
      source: "derived: 400 / 28.349523125 = 14.109585",
    },
    { fn: "celsiusToFahrenheit", input: 0, expected: 32, source: "water freezes, scale definition" },
    { fn: "celsiusToFahrenheit", input: 100, expected: 212, source: "water boils, scale definition" },
    { fn: "celsiusToFahrenheit", input: 70, expected: 158, source: "derived: 70·9/5 + 32 = 158" },
    { fn: "celsiusToFahrenheit", input: -40, expected: -40, source: "the scales cross at −40" },
    {
      fn: "fahrenheitToCelsius",
      input: 160,
      expected: 71.111111,
      source: "derived: (160 − 32)·5/9 = 71.111",
    },
    { fn: "fahrenheitToCelsius", input: 212, expected: 100, source: "scale definition" },
  ] as const)("$fn($input) = $expected ($source)", ({ fn, input, expected }) => {
    const fns = {
      inchToMm,
      mmToInch,
      ouncesToGrams,
      gramsToOunces,
      celsiusToFahrenheit,
      fahrenheitToCelsius,
    };
    expect(fns[fn](input)).toBeCloseTo(expected, 5);
  });

  it("15 °C of the relubrication rule is 27 °F of temperature difference (SKF Table 2 prints both)", () => {
    expect(celsiusToFahrenheit(85) - celsiusToFahrenheit(70)).toBeCloseTo(27, 9);
  });

  it("each conversion undoes its inverse (property)", () => {
    fc.assert(
      fc.property(fc.double({ min: -1e6, max: 1e6, noNaN: true }), (x) => {
        expect(inchToMm(mmToInch(x))).toBeCloseTo(x, 6);
        expect(ouncesToGrams(gramsToOunces(x))).toBeCloseTo(x, 6);
        expect(fahrenheitToCelsius(celsiusToFahrenheit(x))).toBeCloseTo(x, 6);
      }),
    );
  });
});

describe("formatLength / formatMass / formatTemperature", () => {
  // Rounding rules are ours (documented in the functions); the converted values are derived from the definitions.
  it.each([
    { mm: 25.4, system: "metric", expected: "25.4 mm", why: "0.1 mm" },
    { mm: 50, system: "metric", expected: "50 mm", why: "trailing .0 dropped" },
    { mm: 62.04, system: "metric", expected: "62 mm", why: "rounded to 0.1 mm, .0 dropped" },
    { mm: 25.4, system: "imperial", expected: "1.00 in", why: "25.4 / 25.4 = 1, two decimals" },
    { mm: 50, system: "imperial", expected: "1.97 in", why: "50 / 25.4 = 1.9685" },
    { mm: 0, system: "imperial", expected: "0.00 in", why: "zero" },
  ] as const)("formatLength($mm, $system) = $expected ($why)", ({ mm, system, expected }) => {
    expect(formatLength(mm, system)).toBe(expected);
  });

  it.each([
    { g: 400, system: "metric", expected: "400 g", why: "whole grams from 10 g" },
    { g: 3.9, system: "metric", expected: "3.9 g", why: "0.1 g below 10 g (a 6205's 0.005·52·15 g)" },
    { g: 9.04, system: "metric", expected: "9 g", why: "0.1 g, .0 dropped" },
    { g: 12.6, system: "metric", expected: "13 g", why: "whole grams" },
    { g: 400, system: "imperial", expected: "14.1 oz", why: "400 / 28.3495 = 14.11" },
    { g: 453.59237, system: "imperial", expected: "16.0 oz", why: "one pound" },
    {
      g: 4.9,
      system: "imperial",
      expected: "0.17 oz",
      why: "4.9 / 28.3495 = 0.173, two decimals below 1 oz",
    },
  ] as const)("formatMass($g, $system) = $expected ($why)", ({ g, system, expected }) => {
    expect(formatMass(g, system)).toBe(expected);
  });

  it.each([
    { c: 70, system: "metric", expected: "70 °C", why: "whole degrees" },
    { c: 70, system: "imperial", expected: "158 °F", why: "70·9/5 + 32" },
    { c: 85.4, system: "metric", expected: "85 °C", why: "rounded" },
    { c: -0.3, system: "metric", expected: "0 °C", why: "no '-0'" },
    { c: -20, system: "imperial", expected: "-4 °F", why: "−20·9/5 + 32 = −4" },
    { c: 121, system: "imperial", expected: "250 °F", why: "121·9/5 + 32 = 249.8" },
  ] as const)("formatTemperature($c, $system) = $expected ($why)", ({ c, system, expected }) => {
    expect(formatTemperature(c, system)).toBe(expected);
  });

  it("writes an em dash, not NaN, for a value that is not a finite number (our rule)", () => {
    expect(formatMass(Number.NaN, "metric")).toBe("—");
    expect(formatLength(Number.POSITIVE_INFINITY, "imperial")).toBe("—");
    expect(formatTemperature(Number.NaN, "metric")).toBe("—");
    expect(formatNumber(Number.POSITIVE_INFINITY)).toBe("∞");
  });
});
