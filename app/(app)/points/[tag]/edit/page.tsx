import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { PointForm } from "@/components/points/point-form";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { normaliseTagCode } from "@/lib/domain/service";
import { pageUserCan } from "@/lib/server/auth";
import { NotFoundError } from "@/lib/server/errors";
import { listGreases } from "@/lib/server/queries/greases";
import { assetChoices } from "@/lib/server/queries/plant";
import { getPointByTag } from "@/lib/server/queries/points";
import { savePointAction } from "../../plant-actions";

export const metadata: Metadata = { title: "Edit lube point" };

export default async function EditPointPage({ params }: { params: Promise<{ tag: string }> }) {
  const { user, allowed } = await pageUserCan("points.write");
  if (!allowed) return <Forbidden what="Changing lube points" />;
  const tag = normaliseTagCode((await params).tag);
  if (!tag) notFound();
  const point = await getPointByTag(tag, user.id).catch((e: unknown) => {
    if (e instanceof NotFoundError) notFound();
    throw e;
  });
  const [assets, greases] = await Promise.all([assetChoices(user.id), listGreases()]);
  return (
    <>
      <PageHeader title={`Edit ${point.name}`} lead={`Tag ${point.tag}. Saving works out the plan again.`} />
      <Card>
        <PointForm
          assets={assets}
          greases={greases.map((g) => ({ id: g.id, label: `${g.name} (${g.code})` }))}
          initial={{
            assetId: point.assetId,
            name: point.name,
            bearingType: point.bearingType,
            bearingDesignation: point.bearingDesignation,
            boreMm: point.boreMm,
            outsideDiameterMm: point.outsideDiameterMm,
            widthMm: point.widthMm,
            speedRpm: point.speedRpm,
            operatingTemperatureC: point.operatingTemperatureC,
            runningHoursPerDay: point.runningHoursPerDay,
            verticalShaft: point.verticalShaft,
            contamination: point.contamination,
            moisture: point.moisture,
            vibration: point.vibration,
            foodGradeRequired: point.foodGradeRequired,
            replenishment: point.replenishment,
            sealedForLife: point.sealedForLife,
            assignedGreaseId: point.assignedGrease?.id,
            makerIntervalHours: point.makerIntervalHours,
            makerQuantityGrams: point.makerQuantityGrams,
            makerNote: point.makerNote,
            intervalHoursOverride: point.intervalHoursOverride,
            quantityGramsOverride: point.quantityGramsOverride,
            overrideReason: point.overrideReason,
          }}
          save={savePointAction.bind(null, point.tag)}
          submitLabel="Save the point"
        />
      </Card>
    </>
  );
}
