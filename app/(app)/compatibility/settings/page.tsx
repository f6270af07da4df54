import type { Metadata } from "next";
import { SettingsForm } from "@/components/compatibility/settings-form";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { CHARTS } from "@/lib/domain/compatibility";
import { pageUserCan } from "@/lib/server/auth";
import { getSiteSettings } from "@/lib/server/queries/compatibility";
import { getUserSites } from "@/lib/server/queries/overview";
import { saveSettingsAction } from "./actions";

export const metadata: Metadata = { title: "Compatibility settings" };

export default async function SettingsPage() {
  const { user, allowed } = await pageUserCan("compatibility.rules.manage");
  if (!allowed) return <Forbidden what="Changing the compatibility rules" />;
  const sites = await getUserSites(user.id);
  const settings = await Promise.all(sites.map((s) => getSiteSettings(s.id)));
  const charts = CHARTS.map((c) => ({ id: c.id, title: c.title, provenance: c.provenance, note: c.provenanceNote }));
  return (
    <>
      <PageHeader title="Compatibility settings" lead="Per site: which published charts the pair check trusts, and the thresholds it applies. Every change is recorded with who made it." />
      {sites.length === 0 ? (
        <EmptyState title="You have no site">
          <p>Ask an administrator to give you access to a site.</p>
        </EmptyState>
      ) : null}
      <div className="space-y-6">
        {sites.map((site, i) => (
          <Card key={site.id}>
            <h2 className="mb-4 text-lg font-bold">{site.name}</h2>
            <SettingsForm site={site} charts={charts} values={settings[i]!} save={saveSettingsAction} />
          </Card>
        ))}
      </div>
    </>
  );
}
