import { cn } from "@/lib/cn";
import { mass, massAxis, percentOf, shortDay } from "./chart-scale";

export interface TrendWeek {
  weekStart: string;
  appliedGrams: number;
  issuedGrams: number;
}

export interface TrendGrease {
  greaseId: number;
  code: string;
  name: string;
  forecastGramsPerWeek: number;
  weekly: TrendWeek[];
}

export interface ConsumptionTrendProps {
  siteCode: string;
  siteName: string;
  /** Every grease of the site together, oldest week first; the last week is the current one. */
  weekly: TrendWeek[];
  forecastGramsPerWeek: number;
  greases: TrendGrease[];
  /** How many of the most used greases get a small chart of their own. */
  top?: number;
}

const sum = (weeks: TrendWeek[]) => weeks.reduce((total, w) => total + w.appliedGrams, 0);

/** Average over the whole weeks: the current week is not over yet. */
const wholeWeekAverage = (weeks: TrendWeek[]) =>
  weeks.length > 1 ? sum(weeks.slice(0, -1)) / (weeks.length - 1) : 0;

interface BarsProps {
  weekly: TrendWeek[];
  forecastGramsPerWeek: number;
  heightPx: number;
  label: string;
  axis: boolean;
}

/** Weekly bars of grease applied, the forecast as a dashed line. Horizontal positions in percent, heights in px. */
function WeeklyBars({ weekly, forecastGramsPerWeek, heightPx, label, axis }: BarsProps) {
  const scale = massAxis(Math.max(forecastGramsPerWeek, ...weekly.map((w) => w.appliedGrams)), axis ? 4 : 1);
  const slot = 100 / Math.max(1, weekly.length);
  const y = (grams: number) => heightPx - (percentOf(grams, scale.maxGrams) / 100) * heightPx;
  const labelEvery = 4;
  return (
    <svg
      role="img"
      aria-label={label}
      width="100%"
      height={heightPx + (axis ? 22 : 2)}
      className="block overflow-visible"
    >
      {axis ? (
        scale.ticks.map((tick, i) => (
          <g key={tick.grams}>
            <line
              x1={0}
              x2="100%"
              y1={y(tick.grams)}
              y2={y(tick.grams)}
              className="stroke-line"
              strokeWidth={1}
            />
            <text
              x={-6}
              y={y(tick.grams) + 4}
              textAnchor="end"
              className="fill-ink-soft text-2xs tabular-nums"
            >
              {i === scale.ticks.length - 1 ? `${tick.label} ${scale.unit}` : tick.label}
            </text>
          </g>
        ))
      ) : (
        <line x1={0} x2="100%" y1={heightPx} y2={heightPx} className="stroke-line" strokeWidth={1} />
      )}
      {weekly.map((w, i) => {
        const current = i === weekly.length - 1;
        const top = y(w.appliedGrams);
        return (
          <rect
            key={w.weekStart}
            x={`${i * slot + slot * 0.15}%`}
            y={top}
            width={`${slot * 0.7}%`}
            height={Math.max(0, heightPx - top)}
            className={current ? "fill-paper-raised stroke-steel" : "fill-steel/55"}
            strokeWidth={current ? 1 : 0}
          />
        );
      })}
      {forecastGramsPerWeek > 0 ? (
        <line
          x1={0}
          x2="100%"
          y1={y(forecastGramsPerWeek)}
          y2={y(forecastGramsPerWeek)}
          className="stroke-ink"
          strokeWidth={2}
          strokeDasharray="6 4"
        />
      ) : null}
      {axis
        ? weekly.map((w, i) => {
            const current = i === weekly.length - 1;
            if (!current && i % labelEvery !== 0) return null;
            return (
              <text
                key={w.weekStart}
                x={current ? "100%" : `${i * slot + slot / 2}%`}
                y={heightPx + 16}
                textAnchor={current ? "end" : i === 0 ? "start" : "middle"}
                className={cn("text-2xs", current ? "fill-ink font-bold" : "fill-ink-soft")}
              >
                {current ? "this week" : shortDay(w.weekStart)}
              </text>
            );
          })
        : null}
    </svg>
  );
}

/**
 * Grease applied at the lube points per week, for the whole site and for its most used greases, against the
 * schedule's forecast; the numbers in a table too.
 */
export function ConsumptionTrend({
  siteCode,
  siteName,
  weekly,
  forecastGramsPerWeek,
  greases,
  top = 6,
}: ConsumptionTrendProps) {
  const id = `consumption-${siteCode.replace(/[^A-Za-z0-9_-]/g, "")}`;
  const used = greases
    .map((g) => ({ ...g, totalGrams: sum(g.weekly) }))
    .filter((g) => g.totalGrams > 0)
    .sort((a, b) => b.totalGrams - a.totalGrams || a.name.localeCompare(b.name))
    .slice(0, top);
  const average = wholeWeekAverage(weekly);
  const issuedTotal = weekly.reduce((total, w) => total + w.issuedGrams, 0);
  const title = `Grease applied per week at ${siteName}`;
  const first = weekly[0]?.weekStart;

  return (
    <figure aria-labelledby={`${id}-caption`}>
      <figcaption id={`${id}-caption`} className="mb-2">
        <span className="block font-bold">{siteName}</span>
        <span className="block text-2xs text-ink-soft">
          Whole weeks averaged {mass(average)} a week; the schedule forecasts {mass(forecastGramsPerWeek)} a
          week.
        </span>
        <span className="block text-2xs text-ink-soft">
          In these {weekly.length} weeks: {mass(sum(weekly))} applied at points, {mass(issuedTotal)} issued
          from the store.
        </span>
      </figcaption>
      <div className="mt-4 pl-9">
        <WeeklyBars
          weekly={weekly}
          forecastGramsPerWeek={forecastGramsPerWeek}
          heightPx={140}
          axis
          label={`${title}${first ? ` since the week of ${shortDay(first)}` : ""}: whole weeks averaged ${mass(average)}, forecast ${mass(forecastGramsPerWeek)} a week. The table below has each week.`}
        />
      </div>
      <p className="mt-1 text-2xs text-ink-faint">
        Grease applied per week; weeks run Monday to Sunday (UTC).
      </p>

      {used.length ? (
        <>
          <h4 className="mt-5 mb-2 text-sm font-bold">Most used greases, each on its own scale</h4>
          <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3">
            {used.map((g) => (
              <li key={g.greaseId} className="min-w-0">
                <span className="block truncate text-2xs font-bold" title={g.name}>
                  {g.name}
                </span>
                <span className="block text-2xs text-ink-soft tabular-nums">
                  {mass(g.totalGrams)} in {g.weekly.length} weeks
                </span>
                <span className="block text-2xs text-ink-soft tabular-nums">
                  forecast {mass(g.forecastGramsPerWeek)} a week
                </span>
                <div className="mt-1">
                  <WeeklyBars
                    weekly={g.weekly}
                    forecastGramsPerWeek={g.forecastGramsPerWeek}
                    heightPx={36}
                    axis={false}
                    label={`${g.name}: ${mass(g.totalGrams)} applied in ${g.weekly.length} weeks, whole weeks averaged ${mass(wholeWeekAverage(g.weekly))}, forecast ${mass(g.forecastGramsPerWeek)} a week.`}
                  />
                </div>
              </li>
            ))}
          </ul>
        </>
      ) : null}

      {/* On the table itself sr-only does not clip (tables ignore width and overflow) and the page scrolls sideways. */}
      <div className="sr-only">
        <table>
          <caption>{title}</caption>
          <thead>
            <tr>
              <th scope="col">Week starting</th>
              <th scope="col">All greases, applied</th>
              <th scope="col">All greases, issued from store</th>
              {used.map((g) => (
                <th key={g.greaseId} scope="col">
                  {g.name}, applied
                </th>
              ))}
            </tr>
          </thead>
          <tbody>
            {weekly.map((w, i) => (
              <tr key={w.weekStart}>
                <th scope="row">
                  {w.weekStart}
                  {i === weekly.length - 1 ? " (this week, so far)" : ""}
                </th>
                <td>{mass(w.appliedGrams)}</td>
                <td>{mass(w.issuedGrams)}</td>
                {used.map((g) => (
                  <td key={g.greaseId}>{mass(g.weekly[i]?.appliedGrams ?? 0)}</td>
                ))}
              </tr>
            ))}
            <tr>
              <th scope="row">Schedule forecast per week</th>
              <td>{mass(forecastGramsPerWeek)}</td>
              <td></td>
              {used.map((g) => (
                <td key={g.greaseId}>{mass(g.forecastGramsPerWeek)}</td>
              ))}
            </tr>
          </tbody>
        </table>
      </div>
    </figure>
  );
}

export interface ConsumptionPanelProps {
  sites: {
    siteId: number;
    code: string;
    name: string;
    weekly: TrendWeek[];
    forecastGramsPerWeek: number;
    greases: TrendGrease[];
  }[];
}

/** The legend and one trend per site, side by side on a wide screen; each site on its own scale. */
export function ConsumptionPanel({ sites }: ConsumptionPanelProps) {
  return (
    <>
      <ConsumptionLegend />
      <div className="grid gap-8 lg:grid-cols-2">
        {sites.map((site) => (
          <ConsumptionTrend
            key={site.siteId}
            siteCode={site.code}
            siteName={site.name}
            weekly={site.weekly}
            forecastGramsPerWeek={site.forecastGramsPerWeek}
            greases={site.greases}
          />
        ))}
      </div>
    </>
  );
}

/** What the bars and the lines mean, in words. */
function ConsumptionLegend() {
  return (
    <ul
      className="mb-4 flex flex-wrap gap-x-5 gap-y-1 text-2xs text-ink-soft"
      aria-label="How to read the charts"
    >
      <li className="flex items-center gap-1.5">
        <svg width="10" height="14" aria-hidden="true">
          <rect width="10" height="14" className="fill-steel/55" />
        </svg>
        grease applied at lube points in a week
      </li>
      <li className="flex items-center gap-1.5">
        <svg width="10" height="14" aria-hidden="true">
          <rect
            x="0.5"
            y="0.5"
            width="9"
            height="13"
            className="fill-paper-raised stroke-steel"
            strokeWidth={1}
          />
        </svg>
        this week, so far
      </li>
      <li className="flex items-center gap-1.5">
        <svg width="22" height="6" aria-hidden="true">
          <line x1="0" x2="22" y1="3" y2="3" className="stroke-ink" strokeWidth={2} strokeDasharray="6 4" />
        </svg>
        dashed line: the schedule&apos;s forecast per week
      </li>
    </ul>
  );
}
