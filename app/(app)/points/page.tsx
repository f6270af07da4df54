import type { Metadata } from "next";
import Link from "next/link";
import { PointTable } from "@/components/points/point-table";
import { Forbidden } from "@/components/shell/forbidden";
import { buttonClasses } from "@/components/ui/button";
import { Card, PageHeader } from "@/components/ui/card";
import { can } from "@/lib/domain/permissions";
import { pageUserCan } from "@/lib/server/auth";
import { listPoints } from "@/lib/server/queries/points";

export const metadata: Metadata = { title: "Lube points" };

export default async function PointsPage() {
  const { user, allowed } = await pageUserCan("points.read");
  if (!allowed) return <Forbidden what="Lube points" />;
  const points = await listPoints(user.id);
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
      <Card>
        <PointTable rows={points} />
      </Card>
    </>
  );
}
