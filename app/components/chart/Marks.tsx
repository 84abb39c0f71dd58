/**
 * The marks: the required duty point (amber target cross with guide lines), each pump's
 * operating point (amber dot), BEP (diamond), POR (a wide translucent stroke along the head
 * curve) and the numbered pump badges. Head-panel marks are drawn unclipped so they are never
 * cut at the panel's edge; the linked panels get the operating dots and, on efficiency, the BEP.
 */
import { placeBadges } from "./badges.ts";
import { CHART_COLORS as C } from "./colors.ts";
import { interpolateAt, sliceCurve } from "./curves.ts";
import { pumpSeries } from "./model.ts";
import { crossPath, diamond, linePath, r1 } from "./paths.ts";
import type { LayerProps } from "./Series.tsx";

/** Preferred operating region: the stretch of each head curve inside it, shaded in the pump's colour. */
export function PorShading({ model, panel, pumps, opacityOf }: LayerProps) {
  return (
    <>
      {pumps.map((p) =>
        p.por ? (
          <path
            key={`por-${p.id}`}
            data-mark="por"
            d={linePath(sliceCurve(p.head, p.por.minFlow, p.por.maxFlow), model.x, panel.y)}
            fill="none"
            stroke={p.color}
            strokeOpacity={0.2 * opacityOf(p.id)}
            strokeWidth={11}
            strokeLinecap="butt"
            strokeLinejoin="round"
          />
        ) : null,
      )}
    </>
  );
}

/** Duty cross, BEP diamonds, operating dots and pump badges on the head panel (marks outside the axes are left out). */
export function HeadMarks({ model, panel, pumps, opacityOf }: LayerProps) {
  const { x } = model;
  const y = panel.y;
  const [x0] = x.range() as [number, number];
  const bottom = panel.top + panel.height;
  const inX = (f: number) => f >= 0 && f <= model.flowMax;
  const inY = (v: number) => v >= y.domain()[0] && v <= y.domain()[1];
  const d = model.duty;
  return (
    <g>
      {pumps.map((p) =>
        p.bep && inX(p.bep.flow) && inY(p.bep.head) ? (
          <path
            key={`bep-${p.id}`}
            data-mark="bep"
            d={diamond(x(p.bep.flow), y(p.bep.head), 5.5)}
            fill="#ffffff"
            stroke={p.color}
            strokeWidth={2}
            opacity={opacityOf(p.id)}
          />
        ) : null,
      )}
      {d && inX(d.flow) && inY(d.head) && (
        <g data-mark="duty" stroke={C.duty} fill="none">
          <line x1={x0} x2={x(d.flow) - 9} y1={y(d.head)} y2={y(d.head)} strokeWidth={1} strokeDasharray="2 3" strokeOpacity={0.8} />
          <line x1={x(d.flow)} x2={x(d.flow)} y1={y(d.head) + 9} y2={bottom} strokeWidth={1} strokeDasharray="2 3" strokeOpacity={0.8} />
          <circle cx={x(d.flow)} cy={y(d.head)} r={7} strokeWidth={2} fill="#ffffff" fillOpacity={0.6} />
          <path d={crossPath(x(d.flow), y(d.head), 3, 13)} strokeWidth={2} strokeLinecap="round" />
        </g>
      )}
      {pumps.map((p) =>
        p.operating && inX(p.operating.flow) && inY(p.operating.head) ? (
          <circle
            key={`op-${p.id}`}
            data-mark="operating"
            cx={x(p.operating.flow)}
            cy={y(p.operating.head)}
            r={5}
            fill={C.duty}
            stroke="#ffffff"
            strokeWidth={1.5}
            opacity={opacityOf(p.id)}
          />
        ) : null,
      )}
      {placeBadges(model, panel, pumps).map(({ p, bx, by }) => (
        <Badge key={`b-${p.id}`} cx={bx} cy={by} n={p.badge} color={p.color} opacity={opacityOf(p.id)} />
      ))}
    </g>
  );
}

/** On an efficiency, power or NPSH panel: BEP diamonds (efficiency only) and operating dots. */
export function PanelMarks({ model, panel, pumps, opacityOf }: LayerProps) {
  const { x } = model;
  const y = panel.y;
  const inX = (f: number) => f >= 0 && f <= model.flowMax;
  return (
    <>
      {panel.kind === "efficiency" &&
        pumps.map((p) => {
          if (!p.bep || !inX(p.bep.flow)) return null;
          const v = interpolateAt(p.efficiency, p.bep.flow);
          return v === null ? null : (
            <path
              key={`bep-e-${p.id}`}
              data-mark="bep"
              d={diamond(x(p.bep.flow), y(v), 4.5)}
              fill="#ffffff"
              stroke={p.color}
              strokeWidth={1.75}
              opacity={opacityOf(p.id)}
            />
          );
        })}
      {pumps.map((p) => {
        const op = p.operating;
        if (!op || !inX(op.flow)) return null;
        const given = panel.kind === "efficiency" ? op.efficiency : panel.kind === "power" ? op.power : op.npshr;
        const v = given ?? interpolateAt(pumpSeries(p, panel.kind), op.flow);
        if (v === null) return null;
        return (
          <circle
            key={`op-${panel.kind}-${p.id}`}
            data-mark="operating"
            cx={x(op.flow)}
            cy={y(v)}
            r={4}
            fill={C.duty}
            stroke="#ffffff"
            strokeWidth={1.25}
            opacity={opacityOf(p.id)}
          />
        );
      })}
    </>
  );
}

/** A pump's number in a white disc ringed in its colour. */
function Badge({ cx, cy, n, color, opacity = 1 }: { cx: number; cy: number; n: number; color: string; opacity?: number }) {
  return (
    <g opacity={opacity} data-mark="badge">
      <circle cx={r1(cx)} cy={r1(cy)} r={7} fill="#ffffff" stroke={color} strokeWidth={1.75} />
      <text x={r1(cx)} y={r1(cy)} dy="0.34em" textAnchor="middle" fontSize={10} fontWeight={700} fill={color}>
        {n}
      </text>
    </g>
  );
}
