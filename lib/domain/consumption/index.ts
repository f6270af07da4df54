export type { TrendWeeks } from "./types";
export { TREND_WHOLE_WEEKS, trendWeeks } from "./trend-weeks";
