import type { Metadata } from "next";
import { TagScanner } from "@/components/points/scanner";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { pageUserCan } from "@/lib/server/auth";

export const metadata: Metadata = { title: "Scan a tag" };

export default async function ScanPage() {
  const { allowed } = await pageUserCan("points.read");
  if (!allowed) return <Forbidden what="Scanning tags" />;
  return (
    <div className="mx-auto max-w-md">
      <PageHeader title="Scan a tag" lead="Point the camera at the QR tag on the bearing housing. The point opens with its grease, amount and due state." />
      <Card>
        <TagScanner />
      </Card>
    </div>
  );
}
