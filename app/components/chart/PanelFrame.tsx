/**
 * The frame of each panel: panel title, grid lines, y ticks and labels, the axis lines, and on
 * the last panel the flow ticks; plus the flow-axis title and the "no curves" message.
 * Drawn as SVG attributes only (no CSS needed).
 */
import { CHART_COLORS as C } from "./colors.ts";
import type { ChartModel, PanelLayout } from "./model.ts";
import { r1 } from "./paths.ts";

export function PanelFrame({ panel, model, isLast }: { panel: PanelLayout; model: ChartModel; isLast: boolean }) {
  const { x, xTicks } = model;
  const [x0, x1] = x.range() as [number, number];
  const bottom = panel.top + panel.height;
  const yFmt = panel.y.tickFormat(panel.yTicks.length);
  const xFmt = x.tickFormat(xTicks.length);
  return (
    <g data-frame={panel.kind}>
      <text x={x0} y={panel.top - 6} fill={C.title} fontWeight={600}>
        {panel.title}
      </text>
      {xTicks.map((t) => (
        <line key={`vx${t}`} x1={r1(x(t))} x2={r1(x(t))} y1={panel.top} y2={bottom} stroke={C.gridFaint} strokeWidth={1} />
      ))}
      {panel.yTicks.map((t) => (
        <g key={`y${t}`}>
          <line x1={x0} x2={x1} y1={r1(panel.y(t))} y2={r1(panel.y(t))} stroke={C.grid} strokeWidth={1} />
          <text x={x0 - 6} y={r1(panel.y(t))} dy="0.32em" textAnchor="end" fill={C.tick}>
            {yFmt(t)}
          </text>
        </g>
      ))}
      <line x1={x0} x2={x0} y1={panel.top} y2={bottom} stroke={C.axis} strokeWidth={1} />
      <line x1={x0} x2={x1} y1={bottom} y2={bottom} stroke={C.axis} strokeWidth={1} />
      {isLast &&
        xTicks.map((t) => (
          <g key={`xt${t}`}>
            <line x1={r1(x(t))} x2={r1(x(t))} y1={bottom} y2={bottom + 4} stroke={C.axis} />
            <text x={r1(x(t))} y={bottom + 15} textAnchor="middle" fill={C.tick}>
              {xFmt(t)}
            </text>
          </g>
        ))}
    </g>
  );
}

/** Title of the flow axis, under the last panel. */
export function FlowAxisTitle({ model }: { model: ChartModel }) {
  const [x0, x1] = model.x.range() as [number, number];
  return (
    <text x={(x0 + x1) / 2} y={model.height - 8} textAnchor="middle" fill={C.title} fontWeight={600}>
      {`Flow (${model.units.flow.label})`}
    </text>
  );
}

/** "No curves to show", centred in the head panel. */
export function EmptyMessage({ model }: { model: ChartModel }) {
  const [x0, x1] = model.x.range() as [number, number];
  const head = model.panels[0];
  return (
    <text x={(x0 + x1) / 2} y={head.top + head.height / 2} textAnchor="middle" fill={C.tick}>
      No curves to show
    </text>
  );
}
