import { GRAMS_PER_OUNCE, MM_PER_INCH } from "./constants";

/** Converts millimetres to inches (exact factor 25.4 mm/in). Not rounded; NaN stays NaN. */
export function mmToInch(mm: number): number {
  return mm / MM_PER_INCH;
}

/** Converts inches to millimetres (exact factor 25.4 mm/in). Not rounded; NaN stays NaN. */
export function inchToMm(inches: number): number {
  return inches * MM_PER_INCH;
}

/** Converts grams to avoirdupois ounces (exact factor 28.349523125 g/oz). Not rounded; NaN stays NaN. */
export function gramsToOunces(grams: number): number {
  return grams / GRAMS_PER_OUNCE;
}

/** Converts avoirdupois ounces to grams (exact factor 28.349523125 g/oz). Not rounded; NaN stays NaN. */
export function ouncesToGrams(ounces: number): number {
  return ounces * GRAMS_PER_OUNCE;
}

/** Converts a temperature in degrees Celsius to degrees Fahrenheit: °F = °C × 9/5 + 32. Not rounded. */
export function celsiusToFahrenheit(celsius: number): number {
  return (celsius * 9) / 5 + 32;
}

/** Converts a temperature in degrees Fahrenheit to degrees Celsius: °C = (°F − 32) × 5/9. Not rounded. */
export function fahrenheitToCelsius(fahrenheit: number): number {
  return ((fahrenheit - 32) * 5) / 9;
}
