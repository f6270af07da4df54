/**
 * Decides whether a grease's stock is low: strictly below its reorder point (at the reorder point is not low).
 *
 * An onHandGrams that is negative or not a number counts as 0 (unknown stock is treated as none, the safe side);
 * a reorderPointGrams that is not a number ≥ 0 gives false (no reorder point, no alert).
 */
export function isBelowReorderPoint(onHandGrams: number, reorderPointGrams: number): boolean {
  if (!(Number.isFinite(reorderPointGrams) && reorderPointGrams >= 0)) return false;
  const onHand = Number.isFinite(onHandGrams) && onHandGrams > 0 ? onHandGrams : 0;
  return onHand < reorderPointGrams;
}
