import { cn } from "@/lib/cn";

export type Due = "ok" | "due" | "overdue";

const LOOK: Record<Due, { icon: string; word: string; classes: string }> = {
  ok: { icon: "○", word: "Not due", classes: "border-good text-good" },
  due: { icon: "◔", word: "Due", classes: "border-caution bg-caution-light text-caution" },
  overdue: { icon: "●", word: "Overdue", classes: "border-bad bg-bad-light text-bad" },
};

/** A due state in a word and a mark, never colour alone. */
export function DueBadge({ due, sealed, className }: { due: Due; sealed?: boolean; className?: string }) {
  if (sealed) {
    return <span className={cn("inline-flex items-center gap-1 rounded border border-line-strong px-1.5 text-2xs font-bold text-ink-soft", className)}>⊘ Sealed for life</span>;
  }
  const look = LOOK[due];
  return (
    <span className={cn("inline-flex items-center gap-1 rounded border px-1.5 text-2xs font-bold", look.classes, className)}>
      <span aria-hidden="true">{look.icon}</span>
      {look.word}
    </span>
  );
}
