import type { Metadata } from "next";
import { CsvImport } from "@/components/ui/csv-import";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { pageUserCan } from "@/lib/server/auth";
import { GREASE_CSV_COLUMNS } from "@/lib/server/catalogue-csv";
import { commitGreaseImportAction, previewGreaseImportAction } from "./actions";

export const metadata: Metadata = { title: "Import greases" };

export default async function ImportPage() {
  const { allowed } = await pageUserCan("catalogue.write");
  if (!allowed) return <Forbidden what="Changing the catalogue" />;
  return (
    <>
      <PageHeader
        title="Import greases from CSV"
        lead="The file is checked first: every bad row and cell is marked before anything is written. The export of the catalogue has the same columns, so it is a good template."
      />
      <Card>
        <CsvImport
          columns={GREASE_CSV_COLUMNS.map(([c]) => c)}
          preview={previewGreaseImportAction}
          commit={commitGreaseImportAction}
          noun="grease(s)"
          hint={'Packs as kind:grams joined by ";", e.g. cartridge:400;pail:18000.'}
          doneHref="/catalogue"
        />
      </Card>
    </>
  );
}
