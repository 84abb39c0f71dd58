/**
 * The legend under the chart: one button per pump (press to show or hide it; hover or focus
 * emphasises it) with its badge and operating point, then a key to the other curves and marks.
 */
import { CHART_COLORS as C } from "./colors.ts";
import { formatKindValue, formatValue } from "./format.ts";
import type { ChartModel, DisplayPump } from "./model.ts";
import { MarkSwatch, Swatch } from "./Swatches.tsx";

/** A pump's operating point in one line (or why there is none); null without a system curve. */
export function opSummary(p: DisplayPump, model: ChartModel): string | null {
  const op = p.operating;
  if (!op) return model.system ? "no operating point on the system curve" : null;
  const u = model.units;
  const parts = [`${formatValue(op.flow)} ${u.flow.label} at ${formatValue(op.head)} ${u.head.label}`];
  if (op.efficiency !== null) parts.push(`η ${formatKindValue("efficiency", op.efficiency)} %`);
  if (op.power !== null) parts.push(`${formatValue(op.power)} ${u.power.label}${p.powerBasis ? ` (${p.powerBasis})` : ""}`);
  if (op.npshr !== null) parts.push(`NPSHr ${formatValue(op.npshr)} ${u.npsh.label}`);
  return parts.join(" · ");
}

export function Legend({
  model,
  hidden,
  onToggle,
  onEmphasis,
}: {
  model: ChartModel;
  hidden: ReadonlySet<string>;
  onToggle: (id: string) => void;
  onEmphasis: (id: string | null) => void;
}) {
  const kinds = new Set(model.panels.map((p) => p.kind));
  const hasPor = model.pumps.some((p) => p.por);
  const hasBep = model.pumps.some((p) => p.bep);
  const hasOp = model.pumps.some((p) => p.operating);
  return (
    <div className="mt-2 text-sm" data-legend="">
      {model.pumps.length > 0 && (
        <ul className="flex flex-col gap-1" aria-label="Pumps (press to show or hide)">
          {model.pumps.map((p) => {
            const shown = !hidden.has(p.id);
            return (
              <li key={p.id}>
                <button
                  type="button"
                  aria-pressed={shown}
                  onClick={() => onToggle(p.id)}
                  onPointerEnter={() => onEmphasis(p.id)}
                  onPointerLeave={() => onEmphasis(null)}
                  onFocus={() => onEmphasis(p.id)}
                  onBlur={() => onEmphasis(null)}
                  className={
                    "inline-flex max-w-full flex-wrap items-center gap-x-2 rounded px-1 py-0.5 text-left hover:bg-slate-100 " +
                    (shown ? "" : "opacity-50 line-through print:hidden")
                  }
                >
                  <Swatch color={p.color} dashed={p.adjusted} />
                  <span
                    className="inline-flex h-4 w-4 items-center justify-center rounded-full border text-[10px] font-bold"
                    style={{ borderColor: p.color, color: p.color }}
                  >
                    {p.badge}
                  </span>
                  <span className="font-semibold">{p.label}</span>
                  {p.adjusted && <span className="text-slate-500">(adjusted, dashed)</span>}
                  {opSummary(p, model) ? <span className="text-slate-600 tabular-nums">— {opSummary(p, model)}</span> : null}
                </button>
              </li>
            );
          })}
        </ul>
      )}
      <ul className="mt-1 flex flex-wrap gap-x-4 gap-y-1 text-xs text-slate-600" aria-label="Key">
        {model.system && model.system.design.length > 0 && (
          <li className="inline-flex items-center gap-1">
            <Swatch color={C.system} /> System curve
          </li>
        )}
        {model.system && model.system.band.length > 0 && (
          <li className="inline-flex items-center gap-1">
            <Swatch color={C.band} thick={8} opacity={0.45} /> System band (static level, pipe age)
          </li>
        )}
        {kinds.has("npsh") && model.npsha.length > 0 && (
          <li className="inline-flex items-center gap-1">
            <Swatch color={C.npsha} dashed /> NPSHa (aged suction pipe)
          </li>
        )}
        {model.duty && (
          <li className="inline-flex items-center gap-1">
            <MarkSwatch kind="duty" /> Duty point {model.duty.flowText} at {model.duty.headText}
          </li>
        )}
        {hasOp && (
          <li className="inline-flex items-center gap-1">
            <MarkSwatch kind="operating" /> Operating point
          </li>
        )}
        {hasBep && (
          <li className="inline-flex items-center gap-1">
            <MarkSwatch kind="bep" /> BEP
          </li>
        )}
        {hasPor && (
          <li className="inline-flex items-center gap-1">
            <MarkSwatch kind="por" /> POR (shaded along the curve)
          </li>
        )}
      </ul>
    </div>
  );
}
