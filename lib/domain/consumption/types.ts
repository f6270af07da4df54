/** The weeks a consumption trend covers, Monday to Sunday in UTC. */
export interface TrendWeeks {
  /** Each week's Monday as "YYYY-MM-DD", oldest first; the last one holds `now`. */
  weekStarts: string[];
  /** Monday 00:00 UTC of the oldest week (inclusive). */
  from: Date;
  /** Monday 00:00 UTC after the current week (exclusive). */
  to: Date;
}
