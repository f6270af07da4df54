import { cn } from "@/lib/cn";

export type NoticeTone = "info" | "success" | "caution" | "danger";

const TONES: Record<NoticeTone, { icon: string; word: string; classes: string }> = {
  info: { icon: "ℹ", word: "Note", classes: "border-steel bg-steel-light text-steel-dark" },
  success: { icon: "✔", word: "Done", classes: "border-good bg-good-light text-good" },
  caution: { icon: "⚠", word: "Caution", classes: "border-caution bg-caution-light text-caution" },
  danger: { icon: "✖", word: "Problem", classes: "border-bad bg-bad-light text-bad" },
};

/** A message box that names its tone in words and with an icon, not by colour alone. */
export function Notice({ tone = "info", title, children, className }: { tone?: NoticeTone; title?: string; children: React.ReactNode; className?: string }) {
  const t = TONES[tone];
  return (
    <div role={tone === "danger" ? "alert" : "status"} className={cn("flex gap-3 rounded-md border-l-4 p-3 text-sm", t.classes, className)}>
      <span aria-hidden="true" className="text-lg leading-none">
        {t.icon}
      </span>
      <div>
        <p className="font-bold">{title ?? t.word}</p>
        <div className="text-ink">{children}</div>
      </div>
    </div>
  );
}
