import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { ChangeoverForm } from "@/components/points/changeover-form";
import { DueBadge } from "@/components/points/due-badge";
import { ServicePanel } from "@/components/points/service-panel";
import { Steps } from "@/components/points/steps";
import { Forbidden } from "@/components/shell/forbidden";
import { Card, PageHeader } from "@/components/ui/card";
import { EmptyState } from "@/components/ui/empty-state";
import { Notice } from "@/components/ui/notice";
import type { BearingType, Level } from "@/lib/domain/relubrication";
import { normaliseTagCode } from "@/lib/domain/service";
import { formatLength, formatTemperature } from "@/lib/domain/units";
import { can } from "@/lib/domain/permissions";
import { pageUserCan } from "@/lib/server/auth";
import { NotFoundError } from "@/lib/server/errors";
import { getGrease, listGreases } from "@/lib/server/queries/greases";
import { getPointByTag, listPointServices, listSiteGuns, pointApiDto } from "@/lib/server/queries/points";
import { planPoint } from "@/lib/server/plan";
import { tagQrSvg } from "@/lib/server/tags";
import { cancelChangeoverAction, planChangeoverAction } from "./actions";

export const metadata: Metadata = { title: "Lube point" };

const round = (value: number | null, digits = 0) => (value === null ? "—" : Number(value.toFixed(digits)).toLocaleString("en-GB", { maximumFractionDigits: digits }));

const SOURCE = { override: "set by the lead", maker: "from the equipment maker", calculated: "calculated", none: "not set" } as const;

export default async function PointPage({ params }: { params: Promise<{ tag: string }> }) {
  const { user, allowed } = await pageUserCan("points.read");
  if (!allowed) return <Forbidden what="Lube points" />;
  const tag = normaliseTagCode((await params).tag);
  if (!tag) notFound();
  const point = await getPointByTag(tag, user.id).catch((error: unknown) => {
    if (error instanceof NotFoundError) notFound();
    throw error;
  });
  const units = user.unitSystem;
  const assigned = point.assignedGrease ? await getGrease(point.assignedGrease.id) : null;
  const [services, guns, greases, qr] = await Promise.all([listPointServices(point.id, 20), listSiteGuns(point.siteId), listGreases(), tagQrSvg(point.tag)]);
  const plan = planPoint(
    { ...point, bearingType: point.bearingType as BearingType, contamination: point.contamination as Level, moisture: point.moisture as Level, vibration: point.vibration as Level },
    assigned,
    point.foodGradeRequired,
    guns,
  );
  const canRecord = can(user.role, "service.record");

  return (
    <>
      <PageHeader
        title={point.name}
        lead={`${point.asset} · ${point.area} · ${point.site} · tag ${point.tag}`}
        actions={
          can(user.role, "points.write") ? (
            <Link href={`/points/${point.tag}/edit`} className="rounded-md border border-line-strong bg-paper-raised px-4 py-2 text-sm font-bold no-underline">
              Edit the point
            </Link>
          ) : undefined
        }
      />
      <div className="grid grid-cols-[minmax(0,1fr)] gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
        <div className="space-y-6">
          {canRecord ? (
            <Card>
              <h2 className="mb-3 text-lg font-bold">Service this point</h2>
              <ServicePanel
                tag={point.tag}
                initial={pointApiDto(point)}
                greases={greases.map((g) => ({ id: g.id, code: g.code, name: g.name }))}
                guns={guns}
              />
            </Card>
          ) : null}
          {plan.warnings.length ? (
            <Notice tone="caution" title="Check this point">
              <ul className="list-disc pl-5">
                {plan.warnings.map((w) => (
                  <li key={w}>{w}</li>
                ))}
              </ul>
            </Notice>
          ) : null}
          <Card>
            <h2 className="mb-1 text-lg font-bold">Plan</h2>
            <p className="mb-3 text-sm text-ink-soft">
              Interval {round(plan.effectiveInterval.value)} h ({SOURCE[plan.effectiveInterval.source]}), quantity{" "}
              {round(plan.effectiveQuantity.value, 2)} g ({SOURCE[plan.effectiveQuantity.source]}).
              {point.overrideReason ? ` Override reason: ${point.overrideReason}.` : ""}
              {point.makerNote ? ` Maker: ${point.makerNote}.` : ""} The calculators are planning aids: the bearing or
              machine maker&apos;s instructions come first.
            </p>
            <div className="space-y-3">
              <Steps title="Relubrication interval" method={plan.interval.method} steps={plan.interval.steps} result={plan.interval.intervalHours !== null ? `${round(plan.interval.intervalHours)} h` : "outside the method's range"} />
              <Steps title="Replenishment quantity" method={plan.quantity.method} steps={plan.quantity.steps} result={plan.quantity.quantityGrams !== null ? `${round(plan.quantity.quantityGrams, 2)} g` : "—"} />
              {plan.strokes.length ? (
                <Steps
                  title="Gun strokes"
                  steps={plan.strokes.flatMap((s) => s.steps)}
                  result={plan.strokes.map((s) => `${s.strokes ?? "—"} with ${s.gun} (calibrated ${s.calibratedOn})`).join("; ")}
                />
              ) : null}
              <Steps title="Speed factor n·dm" steps={plan.speed.steps} result={plan.speed.ndm !== null ? `${Math.round(plan.speed.ndm).toLocaleString("en-GB")} mm/min` : "—"} />
              {plan.viscosity ? (
                <Steps title="Viscosity ratio κ" steps={plan.viscosity.steps} result={plan.viscosity.kappa !== null ? `κ = ${plan.viscosity.kappa.toFixed(2)}` : "—"} />
              ) : null}
            </div>
          </Card>
          <Card>
            <h2 className="mb-3 text-lg font-bold">Service history</h2>
            {services.length === 0 ? (
              <EmptyState title="Never serviced">
                <p>Services recorded at this point appear here, newest first.</p>
              </EmptyState>
            ) : (
              <div className="overflow-x-auto">
                <table className="w-full text-sm">
                  <caption className="sr-only">Service history</caption>
                  <thead>
                    <tr className="border-b-2 border-line-strong text-left">
                      <th className="p-1">When (UTC)</th>
                      <th className="p-1">Grease</th>
                      <th className="p-1">Amount</th>
                      <th className="p-1">By</th>
                      <th className="p-1">Seen</th>
                    </tr>
                  </thead>
                  <tbody>
                    {services.map((s) => (
                      <tr key={s.id} className="border-b border-line">
                        <td className="p-1 whitespace-nowrap">{s.performedAt.slice(0, 16).replace("T", " ")}</td>
                        <td className="p-1">{s.grease}</td>
                        <td className="p-1">
                          {s.grams} g{s.strokes ? ` (${s.strokes} strokes)` : ""}
                          {s.quantityFlag && s.quantityFlag !== "ok" ? <span className="ml-1 font-bold text-caution">⚠ {s.quantityFlag}</span> : null}
                        </td>
                        <td className="p-1">{s.by}</td>
                        <td className="p-1 text-2xs">{[...s.observations, s.notes].filter(Boolean).join(", ") || "—"}</td>
                      </tr>
                    ))}
                  </tbody>
                </table>
              </div>
            )}
          </Card>
        </div>
        <div className="space-y-6">
          <Card>
            <div className="mb-2 flex items-center justify-between">
              <h2 className="text-lg font-bold">Tag</h2>
              <DueBadge due={point.due} sealed={point.sealedForLife} />
            </div>
            <div className="mx-auto w-40" dangerouslySetInnerHTML={{ __html: qr }} aria-label={`QR code of tag ${point.tag}`} role="img" />
            <p className="mt-1 text-center font-mono text-lg font-bold tracking-widest">{point.tag}</p>
            <p className="text-center text-2xs">
              <a href={`/api/v1/points/${point.tag}/qr.png`}>PNG</a> · <a href={`/api/v1/points/${point.tag}/qr.svg`}>SVG</a>
            </p>
          </Card>
          <Card>
            <h2 className="mb-2 text-lg font-bold">Bearing and duty</h2>
            <dl className="grid grid-cols-2 gap-x-3 gap-y-1 text-sm">
              <dt className="text-ink-soft">Type</dt>
              <dd>{point.bearingType.replace(/_/g, " ")}{point.bearingDesignation ? ` (${point.bearingDesignation})` : ""}</dd>
              <dt className="text-ink-soft">d × D × B</dt>
              <dd>
                {formatLength(point.boreMm, units)} × {formatLength(point.outsideDiameterMm, units)} × {formatLength(point.widthMm, units)}
              </dd>
              <dt className="text-ink-soft">Speed</dt>
              <dd>{point.speedRpm} r/min</dd>
              <dt className="text-ink-soft">Temperature</dt>
              <dd>{point.operatingTemperatureC !== null ? formatTemperature(point.operatingTemperatureC, units) : "not given"}</dd>
              <dt className="text-ink-soft">Runs</dt>
              <dd>{point.runningHoursPerDay} h a day</dd>
              <dt className="text-ink-soft">Shaft</dt>
              <dd>{point.verticalShaft ? "vertical" : "horizontal"}</dd>
              <dt className="text-ink-soft">Environment</dt>
              <dd>
                dust {point.contamination}, moisture {point.moisture}, vibration {point.vibration}
              </dd>
              <dt className="text-ink-soft">Food-grade area</dt>
              <dd>{point.foodGradeRequired ? "yes — H1 only" : "no"}</dd>
              <dt className="text-ink-soft">Assigned grease</dt>
              <dd>{point.assignedGrease?.name ?? "none"}</dd>
              <dt className="text-ink-soft">Grease in it</dt>
              <dd>{point.currentGrease?.name ?? "not recorded"}</dd>
            </dl>
            {point.changeover ? (
              <Notice tone="info" title="Changeover under way" className="mt-3">
                From {point.changeover.fromGrease?.name ?? "—"} to {point.changeover.toGrease.name} by {point.changeover.method.replace("_", "-")};{" "}
                {point.changeover.servicesDone} of {point.changeover.servicesPlanned} services done
                {point.changeover.shortenedIntervalHours ? `, every ${point.changeover.shortenedIntervalHours} h until then` : ""}.
              </Notice>
            ) : null}
          </Card>
          {can(user.role, "points.write") && !point.sealedForLife ? (
            <Card>
              <h2 className="mb-2 text-lg font-bold">Changeover</h2>
              <ChangeoverForm
                tag={point.tag}
                running={Boolean(point.changeover)}
                greases={greases.map((g) => ({ id: g.id, name: g.name, code: g.code }))}
                plan={planChangeoverAction}
                cancel={cancelChangeoverAction}
              />
            </Card>
          ) : null}
        </div>
      </div>
    </>
  );
}
