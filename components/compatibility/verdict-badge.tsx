import type { Verdict } from "@/lib/domain/compatibility";
import { cn } from "@/lib/cn";

/** Our verdict marks: a word, a shape and a colour, so no verdict depends on colour alone. */
export const VERDICT_LOOK: Record<Verdict, { word: string; icon: string; classes: string }> = {
  compatible: { word: "Compatible", icon: "✔", classes: "border-good bg-good-light text-good" },
  borderline: { word: "Borderline", icon: "▲", classes: "border-caution bg-caution-light text-caution" },
  incompatible: { word: "Incompatible", icon: "✖", classes: "border-bad bg-bad-light text-bad" },
  unknown: { word: "Unknown", icon: "?", classes: "border-line-strong bg-paper-sunk text-ink-soft" },
};

export function VerdictBadge({ verdict, size = "md", className }: { verdict: Verdict; size?: "sm" | "md" | "lg"; className?: string }) {
  const look = VERDICT_LOOK[verdict];
  return (
    <span
      className={cn(
        "inline-flex items-center gap-1.5 rounded border font-bold",
        size === "sm" && "px-1 text-2xs",
        size === "md" && "px-2 py-0.5 text-sm",
        size === "lg" && "px-3 py-1 text-xl",
        look.classes,
        className,
      )}
    >
      <span aria-hidden="true">{look.icon}</span>
      {look.word}
    </span>
  );
}
