export type {
  BearingType,
  CalcStep,
  DueState,
  DueStateInput,
  GunStrokesResult,
  ImperialQuantityInput,
  ImperialQuantityResult,
  IntervalFactor,
  IntervalResult,
  Level,
  NextDueInput,
  QuantityInput,
  QuantityResult,
  RelubricationInput,
  RelubricationOptions,
  ReplenishmentSide,
  SpeedFactorInput,
  SpeedFactorResult,
} from "./types";
export { BEARING_TYPES, DUE_STATES, LEVELS } from "./types";
export type { BearingTypeFactor } from "./bearing-type-factors";
export { BEARING_TYPE_FACTORS } from "./bearing-type-factors";
export type { LevelAdjustment, LevelFactor } from "./interval-adjustments";
export {
  CONTAMINATION_FACTORS,
  DEFAULT_INTERVAL_CAP_HOURS,
  MOISTURE_FACTORS,
  SKF_TABLE_2_RULES,
  VIBRATION_FACTORS,
} from "./interval-adjustments";
export type { SpeedLimit } from "./speed-limits";
export { SPEED_FACTOR_CHECK_SHARE, SPEED_FACTOR_LIMITS } from "./speed-limits";
export type { QuantityFactor } from "./quantity-factors";
export { IMPERIAL_QUANTITY_FACTORS, METRIC_QUANTITY_FACTORS } from "./quantity-factors";
export { temperatureFactor } from "./temperature-factor";
export { RELUBRICATION_INTERVAL_METHOD, relubricationInterval } from "./relubrication-interval";
export { replenishmentQuantity } from "./replenishment-quantity";
export { replenishmentQuantityImperial } from "./replenishment-quantity-imperial";
export { PLAUSIBLE_GRAMS_PER_STROKE, gunStrokes } from "./gun-strokes";
export { speedFactor } from "./speed-factor";
export { nextDueAt } from "./next-due-at";
export { DEFAULT_DUE_WINDOW_HOURS, dueState } from "./due-state";
