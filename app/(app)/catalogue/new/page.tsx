import type { Metadata } from "next";
import { GreaseForm } from "@/components/catalogue/grease-form";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { pageUserCan } from "@/lib/server/auth";
import { listSupplierNames } from "@/lib/server/queries/greases";
import { createGreaseAction } from "../actions";

export const metadata: Metadata = { title: "Add a grease" };

export default async function NewGreasePage() {
  const { allowed } = await pageUserCan("catalogue.write");
  if (!allowed) return <Forbidden what="Changing the catalogue" />;
  return (
    <>
      <PageHeader title="Add a grease" lead="Take the values from the product's technical data sheet. Fields without a mark are required." />
      <Card>
        <GreaseForm save={createGreaseAction} submitLabel="Add the grease" suppliers={await listSupplierNames()} />
      </Card>
    </>
  );
}
