import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { GreaseForm } from "@/components/catalogue/grease-form";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { pageUserCan } from "@/lib/server/auth";
import { getGrease, listSupplierNames } from "@/lib/server/queries/greases";
import { updateGreaseAction } from "../../actions";

export const metadata: Metadata = { title: "Edit grease" };

export default async function EditGreasePage({ params }: { params: Promise<{ id: string }> }) {
  const { allowed } = await pageUserCan("catalogue.write");
  if (!allowed) return <Forbidden what="Changing the catalogue" />;
  const { id } = await params;
  const grease = /^\d{1,9}$/.test(id) ? await getGrease(Number(id)) : null;
  if (!grease) notFound();
  const save = updateGreaseAction.bind(null, grease.id);
  return (
    <>
      <PageHeader title={`Edit ${grease.name}`} lead={`Code ${grease.code}. Saving checks that nobody else changed it since you opened this page.`} />
      <Card>
        <GreaseForm initial={grease} save={save} submitLabel="Save changes" suppliers={await listSupplierNames()} />
      </Card>
    </>
  );
}
