import type { Metadata } from "next";
import { UnitsForm } from "@/components/shell/units-form";
import { Card, PageHeader } from "@/components/ui/card";
import { ROLE_LABELS } from "@/lib/domain/permissions";
import { requirePageUser } from "@/lib/server/auth";
import { setUnitsAction } from "./actions";

export const metadata: Metadata = { title: "Your account" };

export default async function AccountPage() {
  const user = await requirePageUser();
  return (
    <>
      <PageHeader title="Your account" lead={`${user.name} · ${user.email} · ${ROLE_LABELS[user.role]}`} />
      <Card className="max-w-xl">
        <UnitsForm current={user.unitSystem} save={setUnitsAction} />
      </Card>
    </>
  );
}
