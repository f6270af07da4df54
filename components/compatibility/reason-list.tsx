import type { Reason } from "@/lib/domain/compatibility";
import { VerdictBadge } from "./verdict-badge";

const KIND_LABEL: Record<Reason["kind"], string> = {
  same_product: "Same product",
  thickener: "Thickeners",
  base_oil: "Base oils",
  viscosity: "Base-oil viscosity",
  consistency: "Consistency (NLGI)",
  food_grade: "Food grade",
  additives: "Solid additives",
  evidence: "Evidence on record",
};

/** Every reason behind a verdict, in plain words, with its source. */
export function ReasonList({ reasons }: { reasons: Reason[] }) {
  return (
    <ol className="space-y-3" aria-label="Reasons">
      {reasons.map((reason, i) => (
        <li key={i} className={`rounded-md border border-line p-3 ${reason.overridden ? "opacity-70" : ""}`}>
          <div className="flex flex-wrap items-center gap-2">
            <VerdictBadge verdict={reason.verdict} size="sm" />
            <span className="text-sm font-bold">{KIND_LABEL[reason.kind]}</span>
            {reason.overridden ? <span className="text-2xs font-bold text-ink-soft">(replaced by the evidence on record)</span> : null}
          </div>
          <p className="mt-1 text-sm">{reason.message}</p>
          {reason.source ? <p className="mt-1 text-2xs text-ink-faint">Source: {reason.source}</p> : null}
        </li>
      ))}
    </ol>
  );
}
