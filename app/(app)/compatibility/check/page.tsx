import type { Metadata } from "next";
import Link from "next/link";
import { PairCheck } from "@/components/compatibility/pair-check";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { pageUserCan } from "@/lib/server/auth";
import { listGreases } from "@/lib/server/queries/greases";

export const metadata: Metadata = { title: "Check a pair" };

const asId = (v: string | string[] | undefined) => (typeof v === "string" && /^\d{1,9}$/.test(v) ? Number(v) : undefined);

export default async function PairCheckPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const { allowed } = await pageUserCan("compatibility.evaluate");
  if (!allowed) return <Forbidden what="The compatibility check" />;
  const params = await searchParams;
  const greases = (await listGreases()).map((g) => ({ id: g.id, code: g.code, name: g.name }));
  return (
    <>
      <PageHeader
        title="Check a pair"
        lead={
          <>
            May this grease go into a bearing that holds that one? The answer weighs the thickener charts your site
            trusts, the base oils, viscosity and consistency, food grade, solid additives and any lab evidence on record.
            Untested pairs count as not mixable. <Link href="/compatibility">See the matrix</Link>.
          </>
        }
      />
      <Card>
        <PairCheck greases={greases} initialA={asId(params.a)} initialB={asId(params.b)} />
      </Card>
    </>
  );
}
