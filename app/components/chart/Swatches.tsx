/**
 * Small inline SVG keys: a line swatch (curves, band) and the mark swatches (duty cross,
 * operating dot, BEP diamond, POR shading) used by the legend and the HTML readout.
 */
import { CHART_COLORS as C } from "./colors.ts";
import { crossPath, diamond } from "./paths.ts";

/** A short line in a curve's colour and dash. */
export function Swatch({ color, dashed, width = 26, thick = 2.5, opacity = 1 }: { color: string; dashed?: boolean; width?: number; thick?: number; opacity?: number }) {
  return (
    <svg width={width} height={12} viewBox={`0 0 ${width} 12`} aria-hidden="true" focusable="false" style={{ display: "inline-block", verticalAlign: "middle", flex: "none" }}>
      <line x1={1} x2={width - 1} y1={6} y2={6} stroke={color} strokeWidth={thick} strokeOpacity={opacity} strokeDasharray={dashed ? "6 3" : undefined} />
    </svg>
  );
}

/** A mark as drawn on the chart, at legend size. */
export function MarkSwatch({ kind }: { kind: "duty" | "operating" | "bep" | "por" }) {
  return (
    <svg width={18} height={18} viewBox="0 0 18 18" aria-hidden="true" focusable="false" style={{ display: "inline-block", verticalAlign: "middle", flex: "none" }}>
      {kind === "duty" && (
        <g stroke={C.duty} fill="none" strokeWidth={1.75} strokeLinecap="round">
          <circle cx={9} cy={9} r={5} />
          <path d={crossPath(9, 9, 2, 8.5)} />
        </g>
      )}
      {kind === "operating" && <circle cx={9} cy={9} r={5} fill={C.duty} stroke="#ffffff" strokeWidth={1.5} />}
      {kind === "bep" && <path d={diamond(9, 9, 5)} fill="#ffffff" stroke="#475569" strokeWidth={1.75} />}
      {kind === "por" && <line x1={1} x2={17} y1={9} y2={9} stroke="#475569" strokeOpacity={0.3} strokeWidth={9} />}
    </svg>
  );
}
