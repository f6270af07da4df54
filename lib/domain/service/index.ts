export { QUANTITY_TOLERANCE, quantityFlag, type QuantityFlag } from "./quantity-flag";
export { TAG_ALPHABET, containerCodeFromScan, normaliseTagCode, scannedKind, tagCodeFrom, tagCodeFromScan } from "./tag-code";
export { effectiveValue, type EffectiveValue, type PlanSource } from "./effective-plan";
