import type { Metadata } from "next";
import { ReportForm } from "@/components/incidents/report-form";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { pageUserCan } from "@/lib/server/auth";
import { listGreases } from "@/lib/server/queries/greases";
import { reportIncidentAction } from "../actions";

export const metadata: Metadata = { title: "Report a mix" };

export default async function ReportPage({ searchParams }: { searchParams: Promise<{ point?: string }> }) {
  const { allowed } = await pageUserCan("incidents.report");
  if (!allowed) return <Forbidden what="Reporting incidents" />;
  const { point } = await searchParams;
  const greases = await listGreases();
  return (
    <div className="mx-auto max-w-2xl">
      <PageHeader
        title="Report a mix found after the fact"
        lead="Wrong grease found in a lube point: the engine judges the pair as it stands today, and the incident opens for investigation."
      />
      <Notice tone="caution" title="Before anyone opens the housing">
        Isolate and lock out the machine. A bearing holding two greases that do not mix may run hot or dry:
        decide with the equipment maker&apos;s guidance whether to clean out and repack, or purge with the
        right grease and shorten the interval.
      </Notice>
      <Card className="mt-6">
        <ReportForm
          greases={greases.map((g) => ({ id: g.id, code: g.code, name: g.name }))}
          initialTag={point}
          action={reportIncidentAction}
        />
      </Card>
    </div>
  );
}
