import type { Metadata } from "next";
import { PointForm } from "@/components/points/point-form";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { pageUserCan } from "@/lib/server/auth";
import { listGreases } from "@/lib/server/queries/greases";
import { assetChoices } from "@/lib/server/queries/plant";
import { savePointAction } from "../plant-actions";

export const metadata: Metadata = { title: "Add a lube point" };

export default async function NewPointPage({ searchParams }: { searchParams: Promise<{ asset?: string }> }) {
  const { user, allowed } = await pageUserCan("points.write");
  if (!allowed) return <Forbidden what="Changing lube points" />;
  const [assets, greases] = await Promise.all([assetChoices(user.id), listGreases()]);
  const asset = (await searchParams).asset;
  return (
    <>
      <PageHeader title="Add a lube point" lead="The interval and quantity are worked out from the bearing and the duty; the maker's values and your overrides win." />
      <Card>
        <PointForm
          assets={assets}
          greases={greases.map((g) => ({ id: g.id, label: `${g.name} (${g.code})` }))}
          initial={{ assetId: asset, runningHoursPerDay: 24 }}
          save={savePointAction.bind(null, null)}
          submitLabel="Add the point"
        />
      </Card>
    </>
  );
}
