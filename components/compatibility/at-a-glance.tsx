import Link from "next/link";
import type { MixResult, Verdict } from "@/lib/domain/compatibility";
import { VerdictBadge } from "./verdict-badge";

export interface GlanceItem {
  other: { id: number; name: string; code: string };
  result: MixResult;
}

const ORDER: Verdict[] = ["compatible", "borderline", "unknown", "incompatible"];

/** One grease against every other product: grouped by verdict, each linking to the full pair check. */
export function CompatibilityAtAGlance({ greaseId, items }: { greaseId: number; items: GlanceItem[] }) {
  if (items.length === 0) return <p className="text-sm text-ink-soft">No other greases in the catalogue yet.</p>;
  return (
    <div className="space-y-4">
      {ORDER.map((verdict) => {
        const group = items.filter((i) => i.result.verdict === verdict);
        if (!group.length) return null;
        return (
          <section key={verdict} aria-label={`${verdict} with this grease`}>
            <h3 className="mb-1 flex items-center gap-2 text-sm font-bold">
              <VerdictBadge verdict={verdict} size="sm" /> {group.length}
            </h3>
            <ul className="grid gap-x-4 text-sm sm:grid-cols-2">
              {group.map(({ other, result }) => {
                const main = result.reasons.find((r) => !r.overridden && r.verdict === result.verdict);
                return (
                  <li key={other.id} className="border-b border-line py-1">
                    <Link href={`/compatibility/check?a=${greaseId}&b=${other.id}`}>{other.name}</Link>
                    {main ? <span className="block text-2xs text-ink-soft">{main.message}</span> : null}
                  </li>
                );
              })}
            </ul>
          </section>
        );
      })}
    </div>
  );
}
