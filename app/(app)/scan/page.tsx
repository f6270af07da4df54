import type { Metadata } from "next";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { pageUserCan } from "@/lib/server/auth";

export const metadata: Metadata = { title: "Scan a tag" };

export default async function Page() {
  const { allowed } = await pageUserCan("service.record");
  if (!allowed) return <Forbidden what="Scanning" />;
  return (
    <>
      <PageHeader title="Scan a tag" lead="Scan the QR tag on a lube point to see its grease, amount and due state." />
      <EmptyState title="No lube points have tags yet.">
        <p>Once the lubrication lead has set up lube points, each gets a printed QR tag. Scanning it here opens the point, checks the cartridge in your hand against the grease in the bearing, and records the service.</p>
      </EmptyState>
    </>
  );
}
