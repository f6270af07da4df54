import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { DocumentUpload } from "@/components/catalogue/document-upload";
import { CompatibilityAtAGlance } from "@/components/compatibility/at-a-glance";
import { FoodGradeBadge } from "@/components/catalogue/labels";
import { buttonClasses } from "@/components/ui/button";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Forbidden } from "@/components/shell/forbidden";
import { Notice } from "@/components/ui/notice";
import { BASE_OIL_LABELS, SOLID_ADDITIVE_LABELS, THICKENER_LABELS } from "@/lib/domain/catalogue";
import { can } from "@/lib/domain/permissions";
import { isoViscosityGrade } from "@/lib/domain/viscosity";
import { pageUserCan } from "@/lib/server/auth";
import { compatibilityWithAll } from "@/lib/server/queries/compatibility";
import { getGrease, listGreaseDocuments } from "@/lib/server/queries/greases";

export const metadata: Metadata = { title: "Grease" };

const DOCS = { sds: "safety data sheet", tds: "technical data sheet" } as const;

export default async function GreasePage({ params }: { params: Promise<{ id: string }> }) {
  const { user, allowed } = await pageUserCan("catalogue.read");
  if (!allowed) return <Forbidden what="The grease catalogue" />;
  const { id } = await params;
  const grease = /^\d{1,9}$/.test(id) ? await getGrease(Number(id)) : null;
  if (!grease) notFound();
  const [documents, glance] = await Promise.all([listGreaseDocuments(grease.id), compatibilityWithAll(grease.id, user.id)]);
  const canWrite = can(user.role, "catalogue.write");
  const iso = isoViscosityGrade(grease.viscosity40);

  const facts: [string, React.ReactNode][] = [
    ["Supplier", grease.supplier],
    ["Thickener", THICKENER_LABELS[grease.thickener]],
    ["Base oil", BASE_OIL_LABELS[grease.baseOilType]],
    ["Base-oil viscosity at 40 °C", `${grease.viscosity40} mm²/s${iso ? ` (ISO VG ${iso})` : ""}`],
    ["Base-oil viscosity at 100 °C", grease.viscosity100 !== undefined ? `${grease.viscosity100} mm²/s` : "not given"],
    ["NLGI grade", grease.nlgiGrade],
    ["Worked penetration", grease.workedPenetration !== undefined ? `${grease.workedPenetration} (0.1 mm)` : "not given"],
    ["Dropping point", grease.droppingPointC !== undefined ? `${grease.droppingPointC} °C` : "not given"],
    [
      "Operating temperature",
      grease.minTemperatureC !== undefined || grease.maxTemperatureC !== undefined
        ? `${grease.minTemperatureC ?? "?"} °C to ${grease.maxTemperatureC ?? "?"} °C`
        : "not given",
    ],
    ["Food grade", <FoodGradeBadge key="fg" grade={grease.foodGrade} />],
    ["Solid additives", grease.solidAdditives.length ? grease.solidAdditives.map((s) => SOLID_ADDITIVE_LABELS[s]).join(", ") : "none"],
    ["Shelf life", grease.shelfLifeMonths ? `${grease.shelfLifeMonths} months` : "not given"],
  ];

  return (
    <>
      <PageHeader
        title={grease.name}
        lead={`Code ${grease.code}`}
        actions={
          <>
            <Link href={`/compatibility/check?a=${grease.id}`} className={buttonClasses("secondary")}>
              Check against another grease
            </Link>
            {canWrite ? (
              <Link href={`/catalogue/${grease.id}/edit`} className={buttonClasses("primary")}>
                Edit
              </Link>
            ) : null}
          </>
        }
      />
      <div className="grid gap-6 lg:grid-cols-2">
        <Card>
          <h2 className="mb-3 text-lg font-bold">Properties</h2>
          <dl className="grid grid-cols-[minmax(10rem,auto)_1fr] gap-x-4 gap-y-2 text-sm">
            {facts.map(([label, value]) => (
              <div key={label} className="contents">
                <dt className="font-bold text-ink-soft">{label}</dt>
                <dd>{value}</dd>
              </div>
            ))}
          </dl>
          {grease.notes ? <p className="mt-4 whitespace-pre-wrap text-sm">{grease.notes}</p> : null}
        </Card>
        <div className="space-y-6">
          <Card>
            <h2 className="mb-3 text-lg font-bold">Packs</h2>
            {grease.packs.length === 0 ? (
              <EmptyState title="No pack sizes">
                <p>{canWrite ? "Edit the grease to add the containers it comes in." : "The lead adds the containers this grease comes in."}</p>
              </EmptyState>
            ) : (
              <ul className="space-y-1 text-sm">
                {grease.packs.map((p) => (
                  <li key={p.id}>
                    <span className="font-bold capitalize">{p.kind}</span> · {p.netMassGrams.toLocaleString("en-GB")} g
                    {p.label ? ` · ${p.label}` : ""}
                  </li>
                ))}
              </ul>
            )}
          </Card>
          <Card>
            <h2 className="mb-3 text-lg font-bold">Data sheets</h2>
            <Notice tone="caution" title="Read the safety data sheet" className="mb-4">
              Before handling a grease, read its safety data sheet for first aid, protective equipment and disposal.
            </Notice>
            <ul className="mb-4 space-y-2 text-sm">
              {(["sds", "tds"] as const).map((kind) => {
                const doc = documents.find((d) => d.kind === kind);
                return (
                  <li key={kind}>
                    <span className="font-bold capitalize">{DOCS[kind]}: </span>
                    {doc ? (
                      <a href={`/api/v1/greases/${grease.id}/documents/${kind}`}>
                        {doc.originalName} ({Math.ceil(doc.sizeBytes / 1024)} kB)
                      </a>
                    ) : (
                      <span className="text-ink-faint">not uploaded yet</span>
                    )}
                  </li>
                );
              })}
            </ul>
            {canWrite ? (
              <div className="space-y-3">
                <DocumentUpload greaseId={grease.id} kind="sds" label="safety data sheet" />
                <DocumentUpload greaseId={grease.id} kind="tds" label="technical data sheet" />
              </div>
            ) : null}
          </Card>
        </div>
      </div>
      <Card className="mt-6">
        <h2 className="mb-1 text-lg font-bold">Compatibility with every other product</h2>
        <p className="mb-4 text-sm text-ink-soft">
          May this grease meet the others in one bearing? Under your site&apos;s chart settings, with the evidence on record.
        </p>
        <CompatibilityAtAGlance greaseId={grease.id} items={glance} />
      </Card>
    </>
  );
}
