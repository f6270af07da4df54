import type { Metadata } from "next";
import { DueList } from "@/components/overview/due-list";
import { RolePanels, Stat } from "@/components/overview/panels";
import { Card, PageHeader } from "@/components/ui/card";
import { Notice } from "@/components/ui/notice";
import { ROLE_LABELS } from "@/lib/domain/permissions";
import { requirePageUser } from "@/lib/server/auth";
import { getAdminOverview, getUserSites } from "@/lib/server/queries/overview";
import { listPoints } from "@/lib/server/queries/points";

export const metadata: Metadata = { title: "Overview" };

export default async function OverviewPage() {
  const user = await requirePageUser();
  const sites = await getUserSites(user.id);
  const siteLine = sites.length ? `Sites: ${sites.map((s) => s.name).join(", ")}.` : "You have no site access yet; ask an administrator.";

  return (
    <>
      <PageHeader title={`Good to see you, ${user.name.split(" ")[0]}`} lead={`${ROLE_LABELS[user.role]}. ${siteLine}`} />
      {user.role === "technician" || user.role === "lead" ? <DuePanel userId={user.id} /> : null}
      {user.role === "admin" ? <AdminOverview /> : <RolePanels role={user.role} />}
      {user.role === "technician" || user.role === "lead" ? (
        <Notice tone="caution" title="Before you grease" className="mt-6">
          Isolate and lock out where the job needs it. Open the relief plug and pump slowly: lip seals give way at
          far lower pressure than a grease gun makes. Stop on unusual back pressure. A grease-gun injection through
          skin is a medical emergency even when it looks small. Read the grease&apos;s safety data sheet; mind hot
          surfaces and food-grade areas.
        </Notice>
      ) : null}
    </>
  );
}

async function DuePanel({ userId }: { userId: string }) {
  const points = (await listPoints(userId)).filter((p) => p.due !== "ok");
  const urgent = [...points].sort((a, b) => (a.nextDueAt ?? "").localeCompare(b.nextDueAt ?? ""));
  return (
    <Card className="mb-4">
      <h2 className="mb-2 text-lg font-bold">
        Due and overdue on your sites ({points.filter((p) => p.due === "overdue").length} overdue, {points.filter((p) => p.due === "due").length} due)
      </h2>
      <DueList items={urgent.slice(0, 12)} total={urgent.length} />
    </Card>
  );
}

async function AdminOverview() {
  const data = await getAdminOverview();
  return (
    <div className="grid gap-4 md:grid-cols-2">
      <Card>
        <h2 className="mb-3 text-lg font-bold">People</h2>
        <div className="grid grid-cols-3 gap-3">
          <Stat label="active" value={data.users.active} href="/admin/users" />
          <Stat label="invited, not yet signed in" value={data.users.invited} href="/admin/users" />
          <Stat label="disabled" value={data.users.disabled} href="/admin/users" />
        </div>
        <p className="mt-3 text-sm text-ink-soft">{data.sites} site(s) configured.</p>
      </Card>
      <Card>
        <h2 className="mb-3 text-lg font-bold">Mail</h2>
        <div className="grid grid-cols-3 gap-3">
          <Stat label="waiting to send" value={data.outbox.pending} href="/admin/outbox" />
          <Stat label="gave up" value={data.outbox.dead} href="/admin/outbox" />
          <Stat label="sent" value={data.outbox.sent} href="/admin/outbox" />
        </div>
        <p className="mt-3 text-sm text-ink-soft">
          Mail waits in the outbox while the mail server is away and goes out when it returns.
        </p>
      </Card>
    </div>
  );
}
