import Link from "next/link";
import { Card } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import type { Role } from "@/lib/domain/permissions";

interface Panel {
  title: string;
  empty: string;
  next: React.ReactNode;
}

/**
 * What each role's overview will hold. Until the data exists, each panel says what will appear there
 * and what to do first.
 */
const PANELS: Record<Exclude<Role, "admin">, Panel[]> = {
  technician: [
    {
      title: "Your recent services",
      empty: "You have not recorded a service yet.",
      next: "Each grease job you record — grease, grams or strokes, what you saw — appears here so you can check the shift's work.",
    },
  ],
  lead: [
    {
      title: "Stock below its reorder point",
      empty: "No grease is running low.",
      next: "Greases whose stock falls below the reorder point computed from the schedule are listed here; you also get a mail.",
    },
    {
      title: "Open mixing incidents",
      empty: "No open incidents.",
      next: "Every mix the compatibility check refused opens an incident; it waits here for your investigation.",
    },
  ],
  clerk: [
    {
      title: "Deliveries to receive",
      empty: "No purchase requests are waiting for delivery.",
      next: "Purchase requests raised by the reorder check appear here; receive them with lot number and expiry date.",
    },
    {
      title: "Lots near expiry",
      empty: "No lots expire soon.",
      next: "Containers that expire before they will be used are listed here, so they can be issued first or scrapped.",
    },
  ],
  auditor: [
    {
      title: "Mixing incidents this period",
      empty: "No incidents have been recorded.",
      next: "Counts by state and kind appear here, with the investigation trail of each incident and exports for your records.",
    },
    {
      title: "Audit trail check",
      empty: "The audit trail has no entries yet.",
      next: "The tamper-evidence check of the audit trail reports here whether every entry is still as it was written.",
    },
  ],
};

export function RolePanels({ role }: { role: Exclude<Role, "admin"> }) {
  return (
    <div className="grid gap-4 md:grid-cols-2 xl:grid-cols-3">
      {PANELS[role].map((panel) => (
        <Card key={panel.title} aria-labelledby={`panel-${panel.title}`}>
          <h2 id={`panel-${panel.title}`} className="mb-3 text-lg font-bold">
            {panel.title}
          </h2>
          <EmptyState title={panel.empty}>
            <p>{panel.next}</p>
          </EmptyState>
        </Card>
      ))}
    </div>
  );
}

export function Stat({ label, value, href }: { label: string; value: number; href?: string }) {
  const body = (
    <>
      <span className="block text-2xl font-bold text-ink">{value}</span>
      <span className="text-sm text-ink-soft">{label}</span>
    </>
  );
  return href ? (
    <Link href={href} className="block rounded-md border border-line bg-paper p-3 no-underline hover:border-steel">
      {body}
    </Link>
  ) : (
    <div className="rounded-md border border-line bg-paper p-3">{body}</div>
  );
}
