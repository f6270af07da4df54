import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { PrintButton } from "@/components/points/print-button";
import { Forbidden } from "@/components/shell/forbidden";
import { ContainerLabel } from "@/components/stock/container-label";
import { Card, PageHeader } from "@/components/ui/card";
import { normaliseTagCode } from "@/lib/domain/service";
import { pageUserCan } from "@/lib/server/auth";
import { NotFoundError } from "@/lib/server/errors";
import { getLotLabel } from "@/lib/server/queries/stock-lots";
import { containerQrSvg } from "@/lib/server/tags";

export const metadata: Metadata = { title: "Container labels" };

export default async function LabelSheetPage({
  searchParams,
}: {
  searchParams: Promise<{ code?: string; copies?: string; paper?: string }>;
}) {
  const { user, allowed } = await pageUserCan("stock.read");
  if (!allowed) return <Forbidden what="Container labels" />;
  const params = await searchParams;
  const code = params.code ? normaliseTagCode(params.code) : null;
  if (!code) notFound();
  const lot = await getLotLabel(code, user.id).catch((error: unknown) => {
    if (error instanceof NotFoundError) notFound();
    throw error;
  });
  const paper = params.paper === "letter" ? "letter" : "a4";
  const copies =
    params.copies && /^\d{1,3}$/.test(params.copies)
      ? Math.min(Math.max(Number(params.copies), 1), 120)
      : Math.max(1, Math.min(lot.onHand, 120));
  const qr = await containerQrSvg(lot.labelCode);

  return (
    <>
      <style>{`@media print { @page { size: ${paper === "letter" ? "letter" : "A4"}; margin: 8mm; } header, footer { display: none !important; } main { padding: 0 !important; } }`}</style>
      <div className="no-print">
        <PageHeader
          title="Container labels"
          lead={`Lot ${lot.lotNumber} of ${lot.grease.name}: one label per container. The QR code opens the lot; a technician scans it at the lube point to confirm the grease.`}
        />
        <Card className="mb-6">
          <form className="flex flex-wrap items-end gap-3" method="get">
            <input type="hidden" name="code" value={lot.labelCode} />
            <label className="flex flex-col gap-1 text-sm font-bold">
              Labels
              <input
                name="copies"
                inputMode="numeric"
                defaultValue={copies}
                className="min-h-10 w-24 rounded-md border border-line-strong bg-paper-raised px-3"
              />
            </label>
            <label className="flex flex-col gap-1 text-sm font-bold">
              Paper
              <select
                name="paper"
                defaultValue={paper}
                className="min-h-10 rounded-md border border-line-strong bg-paper-raised px-3"
              >
                <option value="a4">A4</option>
                <option value="letter">US Letter</option>
              </select>
            </label>
            <button
              type="submit"
              className="min-h-10 rounded-md border border-steel-dark bg-steel px-4 text-sm font-bold text-white"
            >
              Lay out
            </button>
            <PrintButton />
            <Link href={`/stock/lots/${lot.labelCode}`} className="min-h-10 content-center text-sm">
              Back to the lot
            </Link>
          </form>
        </Card>
      </div>
      <section
        aria-label={`Labels of lot ${lot.lotNumber}`}
        className="grid grid-cols-1 gap-3 sm:grid-cols-2 print:grid-cols-2 print:gap-2"
        data-testid="label-sheet"
      >
        {Array.from({ length: copies }, (_, i) => (
          <ContainerLabel key={i} qrSvg={qr} lot={lot} />
        ))}
      </section>
    </>
  );
}
