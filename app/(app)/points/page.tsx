import type { Metadata } from "next";
import Link from "next/link";
import { PointTable } from "@/components/points/point-table";
import { ServiceExportForm } from "@/components/points/service-export-form";
import { Forbidden } from "@/components/shell/forbidden";
import { buttonClasses } from "@/components/ui/button";
import { Card, PageHeader } from "@/components/ui/card";
import { can } from "@/lib/domain/permissions";
import { pageUserCan } from "@/lib/server/auth";
import { getUserSites } from "@/lib/server/queries/overview";
import { listPoints } from "@/lib/server/queries/points";
import { SERVICE_EXPORT_DEFAULT_DAYS } from "@/lib/validation/service-export";

export const metadata: Metadata = { title: "Lube points" };

export default async function PointsPage() {
  const { user, allowed } = await pageUserCan("points.read");
  if (!allowed) return <Forbidden what="Lube points" />;
  const mayExport = can(user.role, "services.export");
  const [points, sites] = await Promise.all([listPoints(user.id), mayExport ? getUserSites(user.id) : []]);
  const today = new Date();
  const counts = {
    overdue: points.filter((p) => p.due === "overdue").length,
    due: points.filter((p) => p.due === "due").length,
  };
  return (
    <>
      <PageHeader
        title="Lube points"
        lead={`${points.length} lube points on your sites: ${counts.overdue} overdue, ${counts.due} due within a week.`}
        actions={
          <>
            <Link href="/points/plant" className={buttonClasses("secondary")}>
              Plant tree
            </Link>
            {can(user.role, "points.write") ? (
              <Link href="/points/import" className={buttonClasses("secondary")}>
                Import CSV
              </Link>
            ) : null}
            <Link href="/points/route" className={buttonClasses("secondary")}>
              Route sheet
            </Link>
            <Link href="/points/tags" className={buttonClasses("secondary")}>
              Print tags
            </Link>
          </>
        }
      />
      {mayExport ? (
        <Card className="mb-6" aria-labelledby="service-export-heading">
          <h2 id="service-export-heading" className="text-lg font-bold">
            Service history
          </h2>
          <p className="mb-3 text-sm text-ink-soft">
            Every service at the lube points of your sites in a period (UTC days, both included; up to three
            years), in the order they were recorded, as a CSV file for a spreadsheet. The export is recorded
            in the audit trail.
          </p>
          <ServiceExportForm
            defaultFrom={new Date(today.getTime() - SERVICE_EXPORT_DEFAULT_DAYS * 86_400_000)
              .toISOString()
              .slice(0, 10)}
            defaultTo={today.toISOString().slice(0, 10)}
            sites={sites.map(({ id, name }) => ({ id, name }))}
          />
        </Card>
      ) : null}
      <Card>
        <PointTable rows={points} />
      </Card>
    </>
  );
}
