import type { Metadata } from "next";
import Link from "next/link";
import { GreaseTable } from "@/components/catalogue/grease-table";
import { Forbidden } from "@/components/shell/forbidden";
import { buttonClasses } from "@/components/ui/button";
import { Card, PageHeader } from "@/components/ui/card";
import { can } from "@/lib/domain/permissions";
import { pageUserCan } from "@/lib/server/auth";
import { listGreases } from "@/lib/server/queries/greases";

export const metadata: Metadata = { title: "Grease catalogue" };

export default async function CataloguePage() {
  const { user, allowed } = await pageUserCan("catalogue.read");
  if (!allowed) return <Forbidden what="The grease catalogue" />;
  const greases = await listGreases();
  const canWrite = can(user.role, "catalogue.write");
  return (
    <>
      <PageHeader
        title="Grease catalogue"
        lead="Every grease the plant uses: thickener, base oil, base-oil viscosity, NLGI grade, food grade and packs."
        actions={
          <>
            <Link href="/compatibility/check" className={buttonClasses("secondary")}>
              Check a pair
            </Link>
            <Link href="/catalogue/consolidation" className={buttonClasses("secondary")}>
              Consolidate
            </Link>
            <a href="/api/v1/greases/export" download className={buttonClasses("secondary")}>
              Export CSV
            </a>
            {canWrite ? (
              <>
                <Link href="/catalogue/import" className={buttonClasses("secondary")}>
                  Import CSV
                </Link>
                <Link href="/catalogue/new" className={buttonClasses("primary")}>
                  Add a grease
                </Link>
              </>
            ) : null}
          </>
        }
      />
      <Card>
        <GreaseTable initial={greases} canWrite={canWrite} />
      </Card>
    </>
  );
}
