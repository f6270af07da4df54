import Link from "next/link";
import { DueBadge, type Due } from "@/components/points/due-badge";
import { EmptyState } from "@/components/ui/empty-state";

export interface DueItem {
  tag: string;
  name: string;
  asset: string;
  area: string;
  due: Due;
  nextDueAt: string | null;
}

/** The points due or overdue on the person's sites, most urgent first. */
export function DueList({ items, total }: { items: DueItem[]; total: number }) {
  if (items.length === 0) {
    return (
      <EmptyState title="Nothing is due this week">
        <p>Points come here a week before they are due. Scan a tag to service a point anyway.</p>
      </EmptyState>
    );
  }
  return (
    <>
      <ul className="divide-y divide-line text-sm">
        {items.map((p) => (
          <li key={p.tag} className="flex items-center justify-between gap-2 py-2">
            <span>
              <Link href={`/points/${p.tag}`} className="font-bold">
                {p.name}
              </Link>
              <span className="block text-2xs text-ink-soft">
                {p.area} · {p.nextDueAt ? `due ${p.nextDueAt.slice(0, 10)}` : "never serviced"}
              </span>
            </span>
            <DueBadge due={p.due} />
          </li>
        ))}
      </ul>
      {total > items.length ? (
        <p className="mt-2 text-sm">
          <Link href="/points/route">{total - items.length} more on the route sheet</Link>
        </p>
      ) : null}
    </>
  );
}
