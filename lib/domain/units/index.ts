export type { UnitSystem } from "./types";
export { UNIT_SYSTEMS } from "./types";
export { GRAMS_PER_OUNCE, MM_PER_INCH } from "./constants";
export {
  celsiusToFahrenheit,
  fahrenheitToCelsius,
  gramsToOunces,
  inchToMm,
  mmToInch,
  ouncesToGrams,
} from "./convert";
export { formatFixed, formatNumber } from "./format-number";
export { formatLength } from "./format-length";
export { formatMass } from "./format-mass";
export { formatTemperature } from "./format-temperature";
