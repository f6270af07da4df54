import { cn } from "@/lib/cn";

export const KIND_LABEL: Record<string, string> = {
  refused_mix: "Refused at the point",
  changeover_exception: "Changeover exception",
  found_after_fact: "Found after the fact",
};

const STATE_LOOK: Record<string, { word: string; icon: string; classes: string }> = {
  open: { word: "Open", icon: "●", classes: "border-bad text-bad" },
  investigating: { word: "Investigating", icon: "◐", classes: "border-caution text-caution" },
  closed: { word: "Closed", icon: "○", classes: "border-good text-good" },
};

/** An incident's state as a word and a shape, never colour alone. */
export function IncidentStateBadge({ state }: { state: string }) {
  const look = STATE_LOOK[state] ?? { word: state, icon: "?", classes: "border-line-strong" };
  return (
    <span
      className={cn("inline-flex items-center gap-1 rounded border px-1.5 text-2xs font-bold", look.classes)}
    >
      <span aria-hidden="true">{look.icon}</span>
      {look.word}
    </span>
  );
}
