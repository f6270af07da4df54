import type { Metadata } from "next";
import Link from "next/link";
import { AreaForm, AssetForm } from "@/components/points/plant-forms";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { can } from "@/lib/domain/permissions";
import { pageUserCan } from "@/lib/server/auth";
import { getUserSites } from "@/lib/server/queries/overview";
import { plantTree } from "@/lib/server/queries/plant";
import { createAreaAction, createAssetAction } from "../plant-actions";

export const metadata: Metadata = { title: "Plant tree" };

export default async function PlantPage() {
  const { user, allowed } = await pageUserCan("points.read");
  if (!allowed) return <Forbidden what="Lube points" />;
  const [tree, sites] = await Promise.all([plantTree(user.id), getUserSites(user.id)]);
  const canWrite = can(user.role, "points.write");
  const areas = tree.sites.flatMap((s) => s.areas.map((a) => ({ id: a.id, label: `${s.name} — ${a.name}` })));
  return (
    <>
      <PageHeader
        title="Plant tree"
        lead="Sites, areas, assets and their lube points."
        actions={
          canWrite ? (
            <Link href="/points/new" className="rounded-md border border-steel-dark bg-steel px-4 py-2 text-sm font-bold text-white no-underline">
              Add a lube point
            </Link>
          ) : undefined
        }
      />
      <div className="grid gap-6 xl:grid-cols-[minmax(0,1fr)_20rem]">
        <Card data-testid="plant-tree">
          {tree.sites.length === 0 ? (
            <EmptyState title="No areas yet">
              <p>{canWrite ? "Add an area with the form beside this, then its assets and lube points." : "The lead sets up areas, assets and lube points."}</p>
            </EmptyState>
          ) : null}
          {tree.sites.map((site) => (
            <details key={site.id} open className="mb-3">
              <summary className="cursor-pointer text-lg font-bold">{site.name}</summary>
              {site.areas.map((area) => (
                <details key={area.id} className="ml-4 mt-2">
                  <summary className="cursor-pointer font-bold">
                    {area.name} <span className="text-2xs text-ink-faint">({area.assets.length} assets)</span>
                  </summary>
                  <ul className="ml-4 mt-1 space-y-1">
                    {area.assets.map((asset) => (
                      <li key={asset.id}>
                        <details>
                          <summary className="cursor-pointer text-sm">
                            <span className="font-mono text-2xs">{asset.tag}</span> {asset.name} <span className="text-2xs text-ink-faint">({asset.points.length} points)</span>
                          </summary>
                          <ul className="ml-6 text-sm">
                            {asset.points.map((p) => (
                              <li key={p.tag}>
                                <Link href={`/points/${p.tag}`}>{p.name}</Link>
                                {p.sealed ? <span className="ml-1 text-2xs">⊘ sealed</span> : null}
                              </li>
                            ))}
                            {canWrite ? (
                              <li>
                                <Link href={`/points/new?asset=${asset.id}`} className="text-2xs">
                                  + add a point to this asset
                                </Link>
                              </li>
                            ) : null}
                          </ul>
                        </details>
                      </li>
                    ))}
                  </ul>
                </details>
              ))}
            </details>
          ))}
        </Card>
        {canWrite ? (
          <div className="space-y-6">
            <Card>
              <h2 className="mb-2 font-bold">Add an area</h2>
              <AreaForm sites={sites} save={createAreaAction} />
            </Card>
            {areas.length ? (
              <Card>
                <h2 className="mb-2 font-bold">Add an asset</h2>
                <AssetForm areas={areas} save={createAssetAction} />
              </Card>
            ) : null}
          </div>
        ) : null}
      </div>
    </>
  );
}
