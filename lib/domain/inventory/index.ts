export type {
  CalcStep,
  DemandPoint,
  ExpiryDateInput,
  ExpiryDateResult,
  ExpirySource,
  GreaseDemand,
  Lot,
  LotAtRisk,
  LotPick,
  LowStockEpisode,
  OrderQuantityInput,
  OrderQuantityResult,
  PickLotsResult,
  PlannedPurge,
  ReorderPointInput,
  ReorderPointResult,
  WeeklyDemandOptions,
} from "./types";
export { EXPIRY_SOURCES, LOW_STOCK_EPISODES } from "./types";
export { SOURCE_FIFO, SOURCE_REORDER_DESIGN_NOTE, SOURCE_SHELF_LIFE } from "./sources";
export { DEFAULT_FORECAST_WEEKS, weeklyDemand } from "./weekly-demand";
export { weeksOfCover } from "./weeks-of-cover";
export { DEFAULT_SAFETY_STOCK_WEEKS, reorderPoint } from "./reorder-point";
export { DEFAULT_COVER_WEEKS, orderQuantity } from "./order-quantity";
export { isBelowReorderPoint } from "./is-below-reorder-point";
export { lowStockEpisode } from "./low-stock-episode";
export { fefoOrder, isExpiredOn } from "./fefo-order";
export { pickLots } from "./pick-lots";
export { lotsAtRisk } from "./lots-at-risk";
export { addMonthsUtc } from "./add-months-utc";
export { expiryDate } from "./expiry-date";
export { isoWeek } from "./iso-week";
export type { IsoWeek } from "./iso-week";
