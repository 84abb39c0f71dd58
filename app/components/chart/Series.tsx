/**
 * The curves: system band and system curve on the head panel, each pump's curve on every panel
 * it has data for (dashed when trimmed or slowed), NPSHa and its label on the NPSH panel.
 * Pumps fade (opacityOf) while another pump is emphasised from the legend.
 */
import { CHART_COLORS as C } from "./colors.ts";
import { pumpSeries, type ChartModel, type DisplayPump, type PanelLayout } from "./model.ts";
import { bandPath, linePath } from "./paths.ts";

/** Dash pattern of an adjusted (trimmed or slowed) pump's curves. */
export const DASH_ADJUSTED = "7 4";

/** What every layer drawn inside a panel receives. */
export type LayerProps = {
  model: ChartModel;
  panel: PanelLayout;
  /** The pumps shown (legend toggles applied). */
  pumps: DisplayPump[];
  opacityOf: (id: string) => number;
};

/** Shaded band between the low and high system curves, with their dotted edges. */
export function SystemBand({ model, panel }: Pick<LayerProps, "model" | "panel">) {
  const sys = model.system;
  if (!sys || sys.band.length <= 1) return null;
  return (
    <g data-series="system-band">
      <path d={bandPath(sys.band, model.x, panel.y)} fill={C.band} fillOpacity={0.22} stroke="none" />
      <path d={linePath(sys.low, model.x, panel.y)} fill="none" stroke={C.band} strokeWidth={1} strokeDasharray="2 3" />
      <path d={linePath(sys.high, model.x, panel.y)} fill="none" stroke={C.band} strokeWidth={1} strokeDasharray="2 3" />
    </g>
  );
}

/** The design system curve. */
export function SystemCurve({ model, panel }: Pick<LayerProps, "model" | "panel">) {
  const sys = model.system;
  if (!sys || sys.design.length <= 1) return null;
  return <path data-series="system" d={linePath(sys.design, model.x, panel.y)} fill="none" stroke={C.system} strokeWidth={2} />;
}

/** NPSHa on the NPSH panel (dashed, system colour). */
export function NpshaCurve({ model, panel }: Pick<LayerProps, "model" | "panel">) {
  if (panel.kind !== "npsh" || model.npsha.length <= 1) return null;
  return (
    <path
      data-series="npsha"
      d={linePath(model.npsha, model.x, panel.y)}
      fill="none"
      stroke={C.npsha}
      strokeWidth={2}
      strokeDasharray="5 3"
    />
  );
}

/** Each shown pump's curve for the panel it is drawn on: head (a wider line) on the head panel, else the panel's own efficiency, power or NPSH (pumps without data skipped). */
export function PumpCurves({ model, panel, pumps, opacityOf }: LayerProps) {
  const kind = panel.kind;
  return (
    <>
      {pumps.map((p) => {
        const s = pumpSeries(p, kind);
        if (s.length === 0) return null;
        return (
          <path
            key={`${kind}-${p.id}`}
            data-series={`pump-${kind}`}
            data-pump-id={p.id}
            d={linePath(s, model.x, panel.y)}
            fill="none"
            stroke={p.color}
            strokeWidth={kind === "head" ? 2.25 : 2}
            strokeDasharray={p.adjusted ? DASH_ADJUSTED : undefined}
            strokeLinejoin="round"
            opacity={opacityOf(p.id)}
          />
        );
      })}
    </>
  );
}

/** "NPSHa" written at the right end of the NPSHa curve (kept inside the plot). */
export function NpshaLabel({ model, panel }: Pick<LayerProps, "model" | "panel">) {
  if (panel.kind !== "npsh" || model.npsha.length <= 1) return null;
  const pts = model.npsha.filter((q) => q.flow <= model.flowMax);
  const end = pts[pts.length - 1];
  if (!end) return null;
  const [, x1] = model.x.range() as [number, number];
  const ex = Math.min(model.x(end.flow), x1);
  return (
    <text x={ex - 4} y={panel.y(end.y) - 5} textAnchor="end" fill={C.npsha} fontWeight={600}>
      NPSHa
    </text>
  );
}
