import { cn } from "@/lib/cn";
import { axisReach, kg, niceScale, percentOf } from "./chart-scale";

export interface StockLevelRow {
  greaseId: number;
  code: string;
  name: string;
  onHandGrams: number;
  reorderPointGrams: number;
  belowReorderPoint: boolean;
}

export interface StockLevelChartProps {
  siteCode: string;
  siteName: string;
  rows: StockLevelRow[];
  /** The axis end in kg, when several charts share one scale. */
  axisMaxKg?: number;
}

export interface StockLevelPanelProps {
  sites: { siteId: number; code: string; name: string; greases: StockLevelRow[] }[];
}

// Each row: the grease's name and amount on one line, its bar below. Horizontal positions are percentages, so
// the chart takes the card's width and its text keeps its size on a phone.
const ROW_PX = 38;
const NAME_BASELINE_PX = 14;
const BAR_TOP_PX = 20;
const BAR_PX = 12;
const MARKER_OVERHANG_PX = 4;
const AXIS_PX = 24;

/** Two slanted gaps across a bar: it is cut short, the amount is more than the axis shows. */
function BreakMark({ x, y }: { x: string; y: number }) {
  return (
    <svg x={x} y={y} width={14} height={BAR_PX + 6} className="overflow-visible" aria-hidden="true">
      <path
        d={`M1 ${BAR_PX + 6} L6 0 M7 ${BAR_PX + 6} L12 0`}
        className="stroke-paper-raised"
        strokeWidth={2.5}
      />
    </svg>
  );
}

const reachKg = (rows: readonly StockLevelRow[]) =>
  axisReach(
    rows.map((r) => r.onHandGrams / 1000),
    rows.map((r) => r.reorderPointGrams / 1000),
  );

/** The legend and one chart per site, side by side on a wide screen, all on one scale so they compare. */
export function StockLevelPanel({ sites }: StockLevelPanelProps) {
  const axisMaxKg = reachKg(sites.flatMap((s) => s.greases));
  return (
    <>
      <StockLevelLegend />
      <div className="grid gap-8 lg:grid-cols-2">
        {sites.map((site) => (
          <StockLevelChart
            key={site.siteId}
            siteCode={site.code}
            siteName={site.name}
            rows={site.greases}
            axisMaxKg={axisMaxKg}
          />
        ))}
      </div>
    </>
  );
}

/** One horizontal bar per grease of what is on hand, with a marker at its reorder point; the numbers in a table too. */
export function StockLevelChart({ siteCode, siteName, rows, axisMaxKg }: StockLevelChartProps) {
  const id = `stock-level-${siteCode.replace(/[^A-Za-z0-9_-]/g, "")}`;
  const scale = niceScale(axisMaxKg ?? reachKg(rows));
  const plotPx = rows.length * ROW_PX;
  const below = rows.filter((r) => r.belowReorderPoint).length;
  const title = `On hand against reorder point at ${siteName}`;
  if (rows.length === 0) {
    return (
      <figure>
        <figcaption className="font-bold">{siteName}</figcaption>
        <p className="text-sm text-ink-soft">
          No stock here yet, and no lube point or reorder point that calls for any.
        </p>
      </figure>
    );
  }

  return (
    <figure aria-labelledby={`${id}-caption`}>
      <figcaption id={`${id}-caption`} className="mb-2">
        <span className="block font-bold">{siteName}</span>
        <span className="block text-2xs text-ink-soft">
          {rows.length} grease{rows.length === 1 ? "" : "s"} ·{" "}
          {below ? (
            <span className="font-bold text-bad">▼ {below} below reorder point</span>
          ) : (
            <span className="text-good">✔ none below reorder point</span>
          )}
        </span>
      </figcaption>
      <svg
        role="img"
        aria-labelledby={`${id}-title`}
        width="100%"
        height={plotPx + AXIS_PX}
        className="block overflow-visible"
      >
        <title id={`${id}-title`}>{title}</title>
        {scale.ticks.map((tick) => (
          <line
            key={tick}
            x1={`${percentOf(tick, scale.max)}%`}
            x2={`${percentOf(tick, scale.max)}%`}
            y1={BAR_TOP_PX - 6}
            y2={plotPx}
            className="stroke-line"
            strokeWidth={1}
          />
        ))}
        {rows.map((r, i) => {
          const top = i * ROW_PX;
          const onHandPct = percentOf(r.onHandGrams / 1000, scale.max);
          const cut = r.onHandGrams / 1000 > scale.max;
          const reorderPct = percentOf(r.reorderPointGrams / 1000, scale.max);
          return (
            <g key={r.greaseId}>
              <text x={0} y={top + NAME_BASELINE_PX} className="fill-ink text-sm">
                {r.name}
              </text>
              <text
                x="100%"
                y={top + NAME_BASELINE_PX}
                textAnchor="end"
                className={cn(
                  "text-sm tabular-nums",
                  r.belowReorderPoint ? "fill-bad font-bold" : "fill-ink-soft",
                )}
              >
                {r.belowReorderPoint ? `▼ below · ${kg(r.onHandGrams)}` : kg(r.onHandGrams)}
              </text>
              <rect x={0} y={top + BAR_TOP_PX} width="100%" height={BAR_PX} className="fill-paper-sunk" />
              <rect
                x={0}
                y={top + BAR_TOP_PX}
                width={`${onHandPct}%`}
                height={BAR_PX}
                className={r.belowReorderPoint ? "fill-bad" : "fill-steel"}
              />
              {cut ? <BreakMark x="93%" y={top + BAR_TOP_PX - 3} /> : null}
              {r.reorderPointGrams > 0 ? (
                <line
                  x1={`${reorderPct}%`}
                  x2={`${reorderPct}%`}
                  y1={top + BAR_TOP_PX - MARKER_OVERHANG_PX}
                  y2={top + BAR_TOP_PX + BAR_PX + MARKER_OVERHANG_PX}
                  className="stroke-ink"
                  strokeWidth={3}
                />
              ) : null}
            </g>
          );
        })}
        {scale.ticks.map((tick, i) => {
          const last = i === scale.ticks.length - 1;
          return (
            <text
              key={tick}
              x={`${percentOf(tick, scale.max)}%`}
              y={plotPx + 16}
              textAnchor={i === 0 ? "start" : last ? "end" : "middle"}
              className="fill-ink-soft text-2xs tabular-nums"
            >
              {last ? `${tick} kg` : tick}
            </text>
          );
        })}
      </svg>
      {/* On the table itself sr-only does not clip (tables ignore width and overflow) and the page scrolls sideways. */}
      <div className="sr-only">
        <table>
          <caption>{title}</caption>
          <thead>
            <tr>
              <th scope="col">Grease</th>
              <th scope="col">On hand</th>
              <th scope="col">Reorder point</th>
              <th scope="col">State</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => (
              <tr key={r.greaseId}>
                <th scope="row">{`${r.name} (${r.code})`}</th>
                <td>{kg(r.onHandGrams)}</td>
                <td>{kg(r.reorderPointGrams)}</td>
                <td>{r.belowReorderPoint ? "below reorder point" : "at or above reorder point"}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </figure>
  );
}

/** What the bars, the marker and the marks mean, in words. */
function StockLevelLegend() {
  return (
    <ul
      className="mb-4 flex flex-wrap gap-x-5 gap-y-1 text-2xs text-ink-soft"
      aria-label="How to read the chart"
    >
      <li className="flex items-center gap-1.5">
        <svg width="18" height="10" aria-hidden="true">
          <rect width="18" height="10" className="fill-steel" />
        </svg>
        on hand (kg)
      </li>
      <li className="flex items-center gap-1.5">
        <svg width="6" height="16" aria-hidden="true">
          <line x1="3" x2="3" y1="0" y2="16" className="stroke-ink" strokeWidth={3} />
        </svg>
        reorder point
      </li>
      <li className="flex items-center gap-1.5">
        <svg width="22" height="12" aria-hidden="true">
          <rect y="1" width="22" height="10" className="fill-steel" />
          <path d="M7 12 L11 0 M12 12 L16 0" className="stroke-paper-raised" strokeWidth={2.5} />
        </svg>
        bar cut short: more than the axis shows
      </li>
      <li className="flex items-center gap-1.5">
        <svg width="18" height="10" aria-hidden="true">
          <rect width="18" height="10" className="fill-bad" />
        </svg>
        <span className="font-bold text-bad">▼ below</span> on hand under the reorder point
      </li>
    </ul>
  );
}
