export interface ContainerLabelProps {
  qrSvg: string;
  lot: {
    labelCode: string;
    lotNumber: string;
    grease: {
      code: string;
      name: string;
      thickener: string;
      baseOilType: string;
      nlgiGrade: string;
      foodGrade: string;
    };
    pack: { kind: string; netMassGrams: number };
    expiresOn: string | null;
    receivedOn: string;
  };
}

const words = (s: string) => s.replace(/_/g, " ");

/**
 * One printed label for a grease container: the QR code of the lot on the left, what a technician needs to
 * check by eye on the right (product, lot, use-by date, thickener and base oil), the code in text under the QR.
 */
export function ContainerLabel({ qrSvg, lot }: ContainerLabelProps) {
  return (
    <figure
      className="flex break-inside-avoid gap-3 rounded border-2 border-ink p-2"
      data-testid="container-label"
    >
      <div className="w-28 shrink-0 text-center">
        <div className="w-28" dangerouslySetInnerHTML={{ __html: qrSvg }} />
        <span className="block font-mono text-sm font-bold tracking-widest">{lot.labelCode}</span>
      </div>
      <figcaption className="min-w-0 space-y-0.5 text-xs leading-tight">
        <span className="block text-base font-bold">{lot.grease.name}</span>
        <span className="block">
          {lot.grease.code} · {lot.pack.kind} {lot.pack.netMassGrams} g
        </span>
        <span className="block">
          {words(lot.grease.thickener)} · {words(lot.grease.baseOilType)} oil · NLGI {lot.grease.nlgiGrade}
        </span>
        <span className="block font-bold">Lot {lot.lotNumber}</span>
        <span className="block font-bold">Use by {lot.expiresOn ?? "— (no date)"}</span>
        <span className="block">Received {lot.receivedOn}</span>
        {lot.grease.foodGrade === "H1" ? (
          <span className="block font-bold">Food grade H1: incidental food contact allowed</span>
        ) : null}
        <span className="block text-2xs">Do not mix with another grease. Read the safety data sheet.</span>
      </figcaption>
    </figure>
  );
}
