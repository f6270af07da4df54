import type { Metadata } from "next";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { CsvImport } from "@/components/ui/csv-import";
import { pageUserCan } from "@/lib/server/auth";
import { PLANT_CSV_COLUMNS } from "@/lib/server/plant-csv";
import { commitPlantImportAction, previewPlantImportAction } from "./actions";

export const metadata: Metadata = { title: "Import lube points" };

export default async function PlantImportPage() {
  const { allowed } = await pageUserCan("points.write");
  if (!allowed) return <Forbidden what="Changing lube points" />;
  return (
    <>
      <PageHeader
        title="Import assets and lube points from CSV"
        lead="One row per lube point. Areas and assets that do not exist yet are created. Every row is checked first; nothing is written until you import, and then all good rows go in together."
      />
      <Card>
        <CsvImport
          columns={[...PLANT_CSV_COLUMNS]}
          preview={previewPlantImportAction}
          commit={commitPlantImportAction}
          noun="lube point(s)"
          hint="Yes/no columns take yes, no, 1 or 0; levels are low, moderate, high or very_high; grease_code is a catalogue code."
          doneHref="/points"
        />
      </Card>
    </>
  );
}
