import { BASE_OIL_LABELS, FOOD_GRADE_LABELS, THICKENER_LABELS, type BaseOilType, type FoodGrade, type Thickener } from "@/lib/domain/catalogue";

export function FoodGradeBadge({ grade }: { grade: FoodGrade }) {
  if (grade === "none") return <span className="text-ink-faint">—</span>;
  return (
    <span className="inline-flex items-center gap-1 rounded border border-good px-1.5 text-2xs font-bold text-good" title={FOOD_GRADE_LABELS[grade]}>
      <span aria-hidden="true">◆</span>
      {grade}
    </span>
  );
}

export const thickenerLabel = (t: Thickener) => THICKENER_LABELS[t];
export const baseOilLabel = (b: BaseOilType) => BASE_OIL_LABELS[b];
