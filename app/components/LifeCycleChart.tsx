// Cumulative life-cycle cost (present value) over the years, the candidates side by side:
// year 0 is the purchase price, each later year adds that year's discounted energy cost.
import { scaleLinear } from "d3-scale";
import { line } from "d3-shape";
import { moneyText } from "~/components/energy-numbers";

export type LifeCycleSeries = { id: number; label: string; cumulative: number[] };

const COLOURS = ["#1d4ed8", "#b45309", "#047857", "#7c3aed", "#be123c", "#0f766e"];

/** `notDrawn`: the candidates with no life-cycle cost to draw, each with why ("2 Pump B: not computed (…)"), named under the chart. */
export function LifeCycleChart({ series, currency, title, notDrawn = [] }: { series: LifeCycleSeries[]; currency: string; title: string; notDrawn?: string[] }) {
  const shown = series.filter((s) => s.cumulative.length > 1 && s.cumulative.every(Number.isFinite));
  const missing = notDrawn.length ? <p className="text-xs text-duty-ink" data-testid="lcc-not-drawn">Not drawn: {notDrawn.join("; ")}.</p> : null;
  if (shown.length === 0) return missing;
  const width = 640, height = 280;
  const m = { top: 16, right: 16, bottom: 40, left: 72 };
  const years = Math.max(...shown.map((s) => s.cumulative.length - 1));
  const yMax = Math.max(...shown.flatMap((s) => s.cumulative));
  const x = scaleLinear().domain([0, years]).range([m.left, width - m.right]);
  const y = scaleLinear().domain([0, yMax > 0 ? yMax : 1]).nice(5).range([height - m.bottom, m.top]);
  const path = line<number>().x((_, i) => x(i)).y((v) => y(v));
  // The period's last year always labelled (15 years ticked 0, 2 … 14 left the line's end, whose figure is read, unlabelled).
  const xTicks = [...new Set([...x.ticks(Math.min(years, 10)).filter(Number.isInteger), years])];
  // Each cost tick with the decimals its step needs, thousands grouped (d3's tick format): whole numbers alone read
  // 0.2 and 0.4 as "0" (0 0 0 1 1 1 on a cost of 0 or a few cents).
  const yText = y.tickFormat(5, ",f");
  return (
    <figure className="space-y-1">
      <svg viewBox={`0 0 ${width} ${height}`} className="w-full max-w-3xl" role="img" aria-label={title}>
        <title>{title}</title>
        {y.ticks(5).map((t) => (
          <g key={`y${t}`}>
            <line x1={m.left} x2={width - m.right} y1={y(t)} y2={y(t)} stroke="#e2e8f0" />
            <text x={m.left - 6} y={y(t)} dy="0.32em" textAnchor="end" fontSize="11" fill="#475569">
              {yText(t)}
            </text>
          </g>
        ))}
        {xTicks.map((t) => (
          <text key={`x${t}`} x={x(t)} y={height - m.bottom + 16} textAnchor="middle" fontSize="11" fill="#475569">
            {t}
          </text>
        ))}
        <text x={(m.left + width - m.right) / 2} y={height - 6} textAnchor="middle" fontSize="11" fill="#475569">
          year
        </text>
        <text x={12} y={m.top} fontSize="11" fill="#475569">
          {currency || "(currency not set)"}
        </text>
        {shown.map((s, i) => (
          <path key={s.id} d={path(s.cumulative) ?? ""} fill="none" stroke={COLOURS[i % COLOURS.length]} strokeWidth={2} data-testid={`lcc-line-${s.id}`} />
        ))}
      </svg>
      <figcaption className="flex flex-wrap gap-3 text-xs text-slate-700">
        {shown.map((s, i) => (
          <span key={s.id} className="inline-flex items-center gap-1">
            <span className="inline-block h-0.5 w-4" style={{ background: COLOURS[i % COLOURS.length] }} />
            {s.label}: {moneyText(s.cumulative[s.cumulative.length - 1], currency)}
          </span>
        ))}
      </figcaption>
      {missing}
    </figure>
  );
}
