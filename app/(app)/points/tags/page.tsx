import type { Metadata } from "next";
import Link from "next/link";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { PrintButton } from "@/components/points/print-button";
import { pageUserCan } from "@/lib/server/auth";
import { listAreas, pointsOfArea } from "@/lib/server/queries/points";
import { tagQrSvg } from "@/lib/server/tags";

export const metadata: Metadata = { title: "Print tags" };

export default async function TagSheetPage({ searchParams }: { searchParams: Promise<{ area?: string; paper?: string }> }) {
  const { user, allowed } = await pageUserCan("points.read");
  if (!allowed) return <Forbidden what="Lube-point tags" />;
  const params = await searchParams;
  const paper = params.paper === "letter" ? "letter" : "a4";
  const areas = await listAreas(user.id);
  const areaId = params.area && /^\d{1,9}$/.test(params.area) ? Number(params.area) : undefined;
  const area = areas.find((a) => a.id === areaId);
  const points = area ? await pointsOfArea(user.id, area.id) : [];
  const codes = await Promise.all(points.map((p) => tagQrSvg(p.tag)));

  return (
    <>
      <style>{`@media print { @page { size: ${paper === "letter" ? "letter" : "A4"}; margin: 10mm; } header, footer { display: none !important; } main { padding: 0 !important; } }`}</style>
      <div className="no-print">
        <PageHeader title="Print tags" lead="Choose an area; each lube point gets a QR tag with its name and code in text under it. Laminate or use weatherproof labels." />
        <Card className="mb-6">
          <form className="flex flex-wrap items-end gap-3" method="get">
            <label className="flex flex-col gap-1 text-sm font-bold">
              Area
              <select name="area" defaultValue={area?.id ?? ""} className="min-h-10 rounded-md border border-line-strong bg-paper-raised px-3">
                <option value="">Choose an area…</option>
                {areas.map((a) => (
                  <option key={a.id} value={a.id}>
                    {a.site} — {a.name} ({a.points})
                  </option>
                ))}
              </select>
            </label>
            <label className="flex flex-col gap-1 text-sm font-bold">
              Paper
              <select name="paper" defaultValue={paper} className="min-h-10 rounded-md border border-line-strong bg-paper-raised px-3">
                <option value="a4">A4</option>
                <option value="letter">US Letter</option>
              </select>
            </label>
            <button type="submit" className="min-h-10 rounded-md border border-steel-dark bg-steel px-4 text-sm font-bold text-white">
              Show the sheet
            </button>
            {area ? <PrintButton /> : null}
          </form>
        </Card>
      </div>
      {area ? (
        <section aria-label={`Tags of ${area.name}`} className="grid grid-cols-3 gap-3 print:gap-2" data-testid="tag-sheet">
          {points.map((p, i) => (
            <figure key={p.tag} className="break-inside-avoid rounded border border-ink p-2 text-center">
              <div className="mx-auto w-32" dangerouslySetInnerHTML={{ __html: codes[i]! }} />
              <figcaption className="mt-1 leading-tight">
                <span className="block font-mono text-base font-bold tracking-widest">{p.tag}</span>
                <span className="block text-2xs font-bold">{p.name}</span>
                <span className="block text-2xs">{p.asset}</span>
              </figcaption>
            </figure>
          ))}
        </section>
      ) : (
        <EmptyState title="No area chosen">
          <p>
            Pick an area above to lay out its tags. <Link href="/points">Back to the lube points</Link>.
          </p>
        </EmptyState>
      )}
    </>
  );
}
