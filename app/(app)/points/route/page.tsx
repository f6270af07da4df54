import type { Metadata } from "next";
import Link from "next/link";
import { DueBadge } from "@/components/points/due-badge";
import { PrintButton } from "@/components/points/print-button";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { pageUserCan } from "@/lib/server/auth";
import { listPointsDueBy } from "@/lib/server/queries/points";

export const metadata: Metadata = { title: "Route sheet" };

const DAYS = [1, 3, 7, 14] as const;

export default async function RoutePage({ searchParams }: { searchParams: Promise<{ days?: string }> }) {
  const { user, allowed } = await pageUserCan("points.read");
  if (!allowed) return <Forbidden what="Route sheets" />;
  const raw = Number((await searchParams).days);
  const days = (DAYS as readonly number[]).includes(raw) ? raw : 1;
  const now = new Date();
  const until = now.getTime() + days * 86_400_000;
  const points = await listPointsDueBy(user.id, new Date(until), now);
  const groups = new Map<string, typeof points>();
  for (const p of points) groups.set(`${p.site} — ${p.area}`, [...(groups.get(`${p.site} — ${p.area}`) ?? []), p]);

  return (
    <>
      <div className="no-print">
        <PageHeader
          title="Route sheet"
          lead="The points due up to the chosen day, area by area in walking order. Tick each one off on paper if the phone stays in the van."
          actions={<PrintButton />}
        />
        <nav aria-label="Days ahead" className="mb-4 flex gap-2">
          {DAYS.map((d) => (
            <Link key={d} href={`/points/route?days=${d}`} aria-current={d === days ? "page" : undefined} className={`rounded-md border px-3 py-2 text-sm font-bold no-underline ${d === days ? "border-steel bg-steel text-white" : "border-line-strong"}`}>
              {d === 1 ? "Today" : `${d} days`}
            </Link>
          ))}
        </nav>
      </div>
      <h2 className="mb-3 hidden text-xl font-bold print:block">
        Route sheet — due by {new Date(until).toISOString().slice(0, 10)} ({points.length} points)
      </h2>
      {points.length === 0 ? (
        <EmptyState title="Nothing is due in this period">
          <p>Choose a longer period, or check the overdue list on the lube points page.</p>
        </EmptyState>
      ) : (
        <div className="space-y-4" data-testid="route-sheet">
          {[...groups.entries()].map(([area, list]) => (
            <Card key={area} className="break-inside-avoid">
              <h3 className="mb-2 font-bold">
                {area} ({list.length})
              </h3>
              <table className="w-full text-sm">
                <thead>
                  <tr className="border-b border-line-strong text-left">
                    <th className="w-8 p-1">✓</th>
                    <th className="p-1">Point</th>
                    <th className="p-1">Asset</th>
                    <th className="p-1">Due</th>
                    <th className="p-1">Tag</th>
                  </tr>
                </thead>
                <tbody>
                  {list.map((p) => (
                    <tr key={p.tag} className="border-b border-line">
                      <td className="p-1">☐</td>
                      <td className="p-1">
                        <Link href={`/points/${p.tag}`}>{p.name}</Link>
                      </td>
                      <td className="p-1">{p.asset}</td>
                      <td className="p-1">
                        <DueBadge due={p.due} /> {p.nextDueAt ? p.nextDueAt.slice(0, 10) : "never"}
                      </td>
                      <td className="p-1 font-mono text-2xs">{p.tag}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </Card>
          ))}
        </div>
      )}
    </>
  );
}
