/**
 * DutyChart — head–flow chart with linked efficiency / shaft power / NPSH panels sharing
 * the flow axis. Pure presentational component: SI props in, display units out; renders the
 * same SVG on the server and the client (no window access during render). Interaction
 * (crosshair readout, keyboard cursor, legend toggles) lives in event handlers only.
 *
 * Essential styling is set as SVG attributes so the chart reads right without any CSS;
 * Tailwind classes are used for the surrounding HTML (legend, table view, print rules).
 */
import { useId, useMemo, useState, type KeyboardEvent, type PointerEvent } from "react";
import { area, line } from "d3-shape";
import type { ScaleLinear } from "d3-scale";
import { buildChartModel, pumpSeries, type ChartModel, type DisplayPump, type PanelLayout } from "./model.ts";
import { readoutRows, readoutText, type ReadoutRow } from "./readout.ts";
import {
  CHART_COLORS as C,
  flowFromDisplay,
  flowToDisplay,
  formatValue,
  interpolateAt,
  sliceCurve,
  type BandPt,
} from "./scales.ts";
import type { DutyChartProps, Pt } from "./types.ts";

export type { DutyChartProps, Pt, PumpSeries, SystemCurves, OperatingPoint, UnitSystemId } from "./types.ts";

const FONT = "'Source Sans 3', ui-sans-serif, system-ui, sans-serif";
const DASH_ADJUSTED = "7 4";

function pathOf(pts: Pt[], x: ScaleLinear<number, number>, y: ScaleLinear<number, number>): string {
  return (
    line<Pt>()
      .x((p) => x(p.flow))
      .y((p) => y(p.y))(pts) ?? ""
  );
}

function bandPath(pts: BandPt[], x: ScaleLinear<number, number>, y: ScaleLinear<number, number>): string {
  return (
    area<BandPt>()
      .x((p) => x(p.flow))
      .y0((p) => y(p.y0))
      .y1((p) => y(p.y1))(pts) ?? ""
  );
}

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));
const r1 = (v: number) => Math.round(v * 10) / 10;

export function DutyChart(props: DutyChartProps) {
  // The model depends on these inputs only; rebuilt when one changes (objects compared by identity).
  const { unitSystem, system, pumps, npsha, duty, flowMax, height, compact } = props;
  const model = useMemo(
    () => buildChartModel({ unitSystem, system, pumps, npsha, duty, flowMax, height, compact }),
    [unitSystem, system, pumps, npsha, duty, flowMax, height, compact],
  );
  const uid = "dc" + useId().replace(/[^A-Za-z0-9_-]/g, "");
  const titleId = `${uid}-title`;
  const descId = `${uid}-desc`;
  const hintId = `${uid}-hint`;

  const [cursorSI, setCursorSI] = useState<number | null>(props.defaultCursorFlow ?? null);
  const [hidden, setHidden] = useState<ReadonlySet<string>>(() => new Set());
  const [emphasis, setEmphasis] = useState<string | null>(null);
  const [announce, setAnnounce] = useState(false);

  const { x, width, panels, units } = model;
  const chartHeight = model.height;
  const [x0, x1] = x.range() as [number, number];
  const cursor =
    cursorSI === null || !Number.isFinite(cursorSI) ? null : clamp(flowToDisplay(cursorSI, units), 0, model.flowMax);

  const tickStep = model.xTicks.length > 1 ? model.xTicks[1] - model.xTicks[0] : model.flowMax / 10;

  function onPointerMove(e: PointerEvent<SVGSVGElement>) {
    const r = e.currentTarget.getBoundingClientRect();
    if (!(r.width > 0)) return;
    const vx = ((e.clientX - r.left) / r.width) * width;
    if (vx < x0 - 10 || vx > x1 + 10) {
      setCursorSI(null);
      return;
    }
    setAnnounce(false);
    setCursorSI(flowFromDisplay(x.invert(clamp(vx, x0, x1)), units));
  }

  function onKeyDown(e: KeyboardEvent<HTMLDivElement>) {
    const step = e.shiftKey ? tickStep : tickStep / 5;
    const start = model.duty?.flow ?? model.pumps.find((p) => p.operating)?.operating?.flow ?? model.flowMax / 2;
    let next: number | null;
    switch (e.key) {
      case "ArrowRight":
      case "ArrowUp":
        next = cursor === null ? start : Math.round((cursor + step) / step) * step;
        break;
      case "ArrowLeft":
      case "ArrowDown":
        next = cursor === null ? start : Math.round((cursor - step) / step) * step;
        break;
      case "PageUp":
        next = cursor === null ? start : cursor + tickStep;
        break;
      case "PageDown":
        next = cursor === null ? start : cursor - tickStep;
        break;
      case "Home":
        next = 0;
        break;
      case "End":
        next = model.flowMax;
        break;
      case "Escape":
        if (cursor === null) return;
        next = null;
        break;
      default:
        return;
    }
    e.preventDefault();
    setAnnounce(true);
    setCursorSI(next === null ? null : flowFromDisplay(clamp(next, 0, model.flowMax), units));
  }

  function toggle(id: string) {
    setHidden((h) => {
      const n = new Set(h);
      if (n.has(id)) n.delete(id);
      else n.add(id);
      return n;
    });
  }

  const visiblePumps = model.pumps.filter((p) => !hidden.has(p.id));
  const opacityOf = (id: string) => (emphasis === null || emphasis === id ? 1 : 0.22);
  const last = panels[panels.length - 1];
  // The readout box sits inside the head panel only when it leaves most of the panel clear;
  // otherwise (phones, short charts, many curves) it is an HTML table under the chart.
  const boxInSvg = !model.compact && readoutBoxHeight(readoutRows(model, 0).length) <= 0.6 * panels[0].height;
  const plotBottom = last.top + last.height;

  return (
    <div className={["duty-chart text-slate-800", props.className].filter(Boolean).join(" ")}>
      <div
        tabIndex={0}
        role="group"
        aria-label={`${props.title}: chart cursor`}
        aria-describedby={hintId}
        onKeyDown={onKeyDown}
        onBlur={() => setAnnounce(false)}
        className="relative rounded-md outline-offset-2"
      >
        <svg
          viewBox={`0 0 ${width} ${chartHeight}`}
          width="100%"
          role="img"
          aria-labelledby={`${titleId} ${descId}`}
          fontFamily={FONT}
          fontSize={model.compact ? 12 : 11}
          onPointerMove={onPointerMove}
          onPointerDown={onPointerMove}
          onPointerLeave={() => setCursorSI(null)}
          style={{ display: "block", height: "auto", touchAction: "pan-y", userSelect: "none" }}
          data-chart="duty"
        >
          <title id={titleId}>{props.title}</title>
          <desc id={descId}>{props.description}</desc>
          <defs>
            {panels.map((p) => (
              <clipPath key={p.kind} id={`${uid}-clip-${p.kind}`}>
                <rect x={x0} y={p.top - 1} width={x1 - x0} height={p.height + 2} />
              </clipPath>
            ))}
          </defs>
          <rect x={0} y={0} width={width} height={chartHeight} fill="#ffffff" />

          {panels.map((panel) => (
            <PanelFrame key={panel.kind} panel={panel} model={model} isLast={panel === last} />
          ))}

          {panels.map((panel) => (
            <g key={panel.kind} clipPath={`url(#${uid}-clip-${panel.kind})`} data-panel={panel.kind}>
              {panel.kind === "head" ? (
                <HeadContent model={model} panel={panel} pumps={visiblePumps} opacityOf={opacityOf} />
              ) : (
                <SubContent model={model} panel={panel} pumps={visiblePumps} opacityOf={opacityOf} />
              )}
            </g>
          ))}

          {/* Marks drawn unclipped so they are never cut at a panel edge. */}
          <HeadMarks model={model} panel={panels[0]} pumps={visiblePumps} opacityOf={opacityOf} />

          {/* x axis title */}
          <text
            x={(x0 + x1) / 2}
            y={chartHeight - 8}
            textAnchor="middle"
            fill={C.title}
            fontWeight={600}
          >
            {`Flow (${units.flow.label})`}
          </text>

          {model.empty && (
            <text
              x={(x0 + x1) / 2}
              y={panels[0].top + panels[0].height / 2}
              textAnchor="middle"
              fill={C.tick}
            >
              No curves to show
            </text>
          )}

          {cursor !== null && (
            <Crosshair model={model} flow={cursor} hidden={hidden} plotBottom={plotBottom} box={boxInSvg} />
          )}
        </svg>
        <p id={hintId} className="mt-1 text-xs text-slate-500 print:hidden">
          Point at the chart, or focus it and use ← → (Shift for larger steps, Esc to hide), to read every curve at one flow.
        </p>
        {!boxInSvg && <HtmlReadout model={model} flow={cursor} hidden={hidden} />}
        <div aria-live="polite" className="sr-only">
          {announce && cursor !== null ? readoutText(model, cursor, hidden) : ""}
        </div>
      </div>

      <Legend model={model} hidden={hidden} onToggle={toggle} onEmphasis={setEmphasis} />

      <details className="mt-3 print:hidden" data-table-view="">
        <summary className="cursor-pointer text-sm font-semibold text-brand-700">Table view</summary>
        <ChartTables model={model} />
      </details>
      {/* Printed copy of the table (a closed <details> does not print its content). */}
      <div className="hidden print:block">
        <ChartTables model={model} />
      </div>
    </div>
  );
}

/* ------------------------------------------------------------------ panels */

function PanelFrame({ panel, model, isLast }: { panel: PanelLayout; model: ChartModel; isLast: boolean }) {
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

type ContentProps = {
  model: ChartModel;
  panel: PanelLayout;
  pumps: DisplayPump[];
  opacityOf: (id: string) => number;
};

function HeadContent({ model, panel, pumps, opacityOf }: ContentProps) {
  const { x } = model;
  const y = panel.y;
  const sys = model.system;
  return (
    <g>
      {sys && sys.band.length > 1 && (
        <g data-series="system-band">
          <path d={bandPath(sys.band, x, y)} fill={C.band} fillOpacity={0.22} stroke="none" />
          <path d={pathOf(sys.low, x, y)} fill="none" stroke={C.band} strokeWidth={1} strokeDasharray="2 3" />
          <path d={pathOf(sys.high, x, y)} fill="none" stroke={C.band} strokeWidth={1} strokeDasharray="2 3" />
        </g>
      )}
      {pumps.map((p) =>
        p.por ? (
          <path
            key={`por-${p.id}`}
            data-mark="por"
            d={pathOf(sliceCurve(p.head, p.por.minFlow, p.por.maxFlow), x, y)}
            fill="none"
            stroke={p.color}
            strokeOpacity={0.2 * opacityOf(p.id)}
            strokeWidth={11}
            strokeLinecap="butt"
            strokeLinejoin="round"
          />
        ) : null,
      )}
      {sys && sys.design.length > 1 && (
        <path
          data-series="system"
          d={pathOf(sys.design, x, y)}
          fill="none"
          stroke={C.system}
          strokeWidth={2}
        />
      )}
      {pumps.map((p) => (
        <path
          key={`h-${p.id}`}
          data-series="pump-head"
          data-pump-id={p.id}
          d={pathOf(p.head, x, y)}
          fill="none"
          stroke={p.color}
          strokeWidth={2.25}
          strokeDasharray={p.adjusted ? DASH_ADJUSTED : undefined}
          strokeLinejoin="round"
          opacity={opacityOf(p.id)}
        />
      ))}
    </g>
  );
}

/** Duty cross, BEP diamonds, operating dots, POR end ticks and pump badges on the head panel. */
function HeadMarks({ model, panel, pumps, opacityOf }: ContentProps) {
  const { x } = model;
  const y = panel.y;
  const [x0, x1] = x.range() as [number, number];
  const top = panel.top;
  const bottom = panel.top + panel.height;
  const inX = (f: number) => f >= 0 && f <= model.flowMax;
  const inY = (v: number) => v >= y.domain()[0] && v <= y.domain()[1];

  // Badges at the end of each head curve, nudged apart vertically.
  const badges = pumps
    .map((p) => {
      const pts = p.head.filter((q) => q.flow <= model.flowMax && inY(q.y));
      const end = pts[pts.length - 1];
      if (!end) return null;
      const ex = x(end.flow);
      const right = ex + 16 <= x1;
      return { p, bx: right ? ex + 10 : ex - 4, by: y(end.y) - (right ? 0 : 10) };
    })
    .filter((b): b is { p: DisplayPump; bx: number; by: number } => b !== null)
    .map((b) => ({ ...b, bx: clamp(b.bx, x0 + 7, x1 - 7), by: clamp(b.by, top + 7, bottom - 7) }))
    .sort((a, b) => a.by - b.by);
  // Push overlapping badges down, then, if the stack runs past the panel, back up.
  for (let i = 1; i < badges.length; i++) {
    if (Math.abs(badges[i].bx - badges[i - 1].bx) < 16 && badges[i].by - badges[i - 1].by < 16) {
      badges[i].by = badges[i - 1].by + 16;
    }
  }
  for (let i = badges.length - 1; i >= 0; i--) {
    const limit = i === badges.length - 1 ? bottom - 7 : badges[i + 1].by - (Math.abs(badges[i + 1].bx - badges[i].bx) < 16 ? 16 : 0);
    if (badges[i].by > limit) badges[i].by = limit;
  }

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
          <path
            d={crossPath(x(d.flow), y(d.head), 3, 13)}
            strokeWidth={2}
            strokeLinecap="round"
          />
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
      {badges.map(({ p, bx, by }) => (
        <Badge key={`b-${p.id}`} cx={bx} cy={by} n={p.badge} color={p.color} opacity={opacityOf(p.id)} />
      ))}
    </g>
  );
}

function SubContent({ model, panel, pumps, opacityOf }: ContentProps) {
  const { x } = model;
  const y = panel.y;
  const inX = (f: number) => f >= 0 && f <= model.flowMax;
  return (
    <g>
      {panel.kind === "npsh" && model.npsha.length > 1 && (
        <path
          data-series="npsha"
          d={pathOf(model.npsha, x, y)}
          fill="none"
          stroke={C.npsha}
          strokeWidth={2}
          strokeDasharray="5 3"
        />
      )}
      {pumps.map((p) => {
        const s = pumpSeries(p, panel.kind);
        if (s.length === 0) return null;
        return (
          <path
            key={`${panel.kind}-${p.id}`}
            data-series={`pump-${panel.kind}`}
            data-pump-id={p.id}
            d={pathOf(s, x, y)}
            fill="none"
            stroke={p.color}
            strokeWidth={2}
            strokeDasharray={p.adjusted ? DASH_ADJUSTED : undefined}
            strokeLinejoin="round"
            opacity={opacityOf(p.id)}
          />
        );
      })}
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
      {panel.kind === "npsh" && model.npsha.length > 1 && <NpshaLabel model={model} panel={panel} />}
    </g>
  );
}

function NpshaLabel({ model, panel }: { model: ChartModel; panel: PanelLayout }) {
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

/* ------------------------------------------------------------------ marks */

function diamond(cx: number, cy: number, r: number): string {
  return `M${r1(cx)},${r1(cy - r)}L${r1(cx + r)},${r1(cy)}L${r1(cx)},${r1(cy + r)}L${r1(cx - r)},${r1(cy)}Z`;
}

function crossPath(cx: number, cy: number, inner: number, outer: number): string {
  const a = r1(cx);
  const b = r1(cy);
  return (
    `M${a - outer},${b}H${a - inner}M${a + inner},${b}H${a + outer}` +
    `M${a},${b - outer}V${b - inner}M${a},${b + inner}V${b + outer}`
  );
}

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

/* ------------------------------------------------------------------ crosshair */

const READOUT_FONT = 11;
const READOUT_ROW = READOUT_FONT + 5;
/** Height of the SVG readout box for a number of curve rows (+ flow and column-header rows). */
function readoutBoxHeight(rows: number): number {
  return READOUT_ROW * (rows + 2) + 8;
}

function Crosshair({
  model,
  flow,
  hidden,
  plotBottom,
  box,
}: {
  model: ChartModel;
  flow: number;
  hidden: ReadonlySet<string>;
  plotBottom: number;
  /** Draw the readout box in the SVG (wide layout); compact shows it as HTML below. */
  box: boolean;
}) {
  const { x, panels } = model;
  const [x0, x1] = x.range() as [number, number];
  const cx = x(flow);
  const rows = readoutRows(model, flow, hidden);
  const kinds = panels.map((p) => p.kind);
  const fs = READOUT_FONT;
  const charW = fs * 0.52;
  const rowH = READOUT_ROW;
  const nameW = Math.min(160, Math.max(64, ...rows.map((r) => r.label.length * charW + (r.badge ? 18 : 0)))) + 16;
  const colW = (k: string) => (k === "head" ? 62 : model.compact ? 46 : 52);
  const cols = kinds.map((k) => ({ k, w: colW(k) }));
  const boxW = nameW + cols.reduce((s, c) => s + c.w, 0) + 10;
  const boxH = readoutBoxHeight(rows.length);
  const { bx, by } = placeReadout(model, hidden, cx, boxW, boxH);
  const hdr: Record<string, string> = {
    head: `H ${model.units.head.label}`,
    efficiency: "η %",
    power: `P ${model.units.power.label}`,
    npsh: `NPSH ${model.units.npsh.label}`,
  };
  const flowText = `${formatValue(flow)} ${model.units.flow.label}`;
  const labelW = flowText.length * charW + 12;

  return (
    <g data-mark="crosshair" className="print:hidden" pointerEvents="none">
      <line x1={r1(cx)} x2={r1(cx)} y1={panels[0].top} y2={plotBottom} stroke={C.cursor} strokeOpacity={0.55} strokeWidth={1} />
      {/* intersection dots */}
      {panels.map((panel) => (
        <g key={panel.kind}>
          {panel.kind === "head" && model.system && model.system.design.length > 0 && (
            <Dot x={cx} v={interpolateAt(model.system.design, flow)} panel={panel} color={C.system} />
          )}
          {panel.kind === "npsh" && <Dot x={cx} v={interpolateAt(model.npsha, flow)} panel={panel} color={C.npsha} />}
          {model.pumps
            .filter((p) => !hidden.has(p.id))
            .map((p) => (
              <Dot key={p.id} x={cx} v={interpolateAt(pumpSeries(p, panel.kind), flow)} panel={panel} color={p.color} />
            ))}
        </g>
      ))}
      {/* flow tag on the axis */}
      <rect
        x={r1(clamp(cx - labelW / 2, x0 - 20, x1 + 20 - labelW))}
        y={plotBottom + 3}
        width={r1(labelW)}
        height={16}
        rx={3}
        fill={C.cursor}
      />
      <text x={r1(clamp(cx, x0 - 20 + labelW / 2, x1 + 20 - labelW / 2))} y={plotBottom + 15} textAnchor="middle" fill="#ffffff" fontWeight={600}>
        {flowText}
      </text>
      {/* readout box */}
      {box && <g data-mark="readout" fontSize={fs}>
        <rect x={r1(bx)} y={r1(by)} width={r1(boxW)} height={r1(boxH)} rx={4} fill={C.readoutBg} fillOpacity={0.96} stroke={C.readoutBorder} />
        <text x={r1(bx + 8)} y={r1(by + rowH)} fontWeight={700} fill={C.title}>
          {`Flow ${flowText}`}
        </text>
        {cols.map((c, i) => (
          <text
            key={c.k}
            x={r1(bx + nameW + cols.slice(0, i + 1).reduce((s, q) => s + q.w, 0))}
            y={r1(by + rowH * 2)}
            textAnchor="end"
            fill={C.tick}
            fontWeight={600}
          >
            {hdr[c.k]}
          </text>
        ))}
        {rows.map((row, ri) => (
          <ReadoutLine key={row.key} row={row} x={bx} y={by + rowH * (ri + 3)} nameW={nameW} cols={cols} charW={charW} />
        ))}
      </g>}
    </g>
  );
}

/** Readout as an HTML table under the chart (compact layout: keeps the small plot clear). */
function HtmlReadout({ model, flow, hidden }: { model: ChartModel; flow: number | null; hidden: ReadonlySet<string> }) {
  const kinds = model.panels.map((p) => p.kind);
  const u = model.units;
  const rows = readoutRows(model, flow ?? Number.NaN, hidden);
  const hdr: Record<string, string> = {
    head: `H ${u.head.label}`,
    efficiency: "η %",
    power: `P ${u.power.label}`,
    npsh: `NPSH ${u.npsh.label}`,
  };
  const td = "px-1 py-0.5 text-right tabular-nums";
  return (
    <div className="mt-1 overflow-x-auto print:hidden" data-readout="html" aria-hidden="true">
      <table className="w-full border-collapse text-xs">
        <thead>
          <tr className="text-slate-600">
            <th className="px-1 py-0.5 text-left font-semibold text-slate-800">
              {flow === null ? "Touch the chart" : `Flow ${formatValue(flow)} ${u.flow.label}`}
            </th>
            {kinds.map((k) => (
              <th key={k} className={td + " font-semibold"}>
                {hdr[k]}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.key} className="border-t border-slate-100">
              <td className="px-1 py-0.5 text-left">
                <Swatch color={r.color} dashed={r.dashed} width={16} />{" "}
                {r.badge !== undefined && (
                  <b style={{ color: r.color }}>{r.badge} </b>
                )}
                {r.label}
              </td>
              {kinds.map((k) => (
                <td key={k} className={td}>
                  {k === "head" && r.headText !== undefined
                    ? r.headText
                    : r.values[k] === undefined
                      ? ""
                      : formatValue(r.values[k])}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

/**
 * Where the readout box covers least: tries right/left of the cursor × top/bottom of the head
 * panel and counts the curve points and marks (weighted) the box would hide.
 */
function placeReadout(
  model: ChartModel,
  hidden: ReadonlySet<string>,
  cx: number,
  boxW: number,
  boxH: number,
): { bx: number; by: number } {
  const head = model.panels[0];
  const [x0] = model.x.range() as [number, number];
  const minX = x0 + 2;
  const maxX = model.width - 2;
  const top = head.top + 6;
  const bottom = head.top + head.height - 6 - boxH;
  const xs = [cx + 14, cx - 14 - boxW].filter((bx) => bx >= minX && bx + boxW <= maxX);
  if (xs.length === 0) xs.push(cx - minX > maxX - cx ? minX : maxX - boxW);
  const ys = bottom > top ? [top, bottom] : [top];
  const pts: { x: number; y: number; w: number }[] = [];
  const addSeries = (s: Pt[], w: number) => {
    for (let i = 0; i < s.length; i++) {
      pts.push({ x: model.x(s[i].flow), y: head.y(s[i].y), w });
      if (i > 0) pts.push({ x: model.x((s[i].flow + s[i - 1].flow) / 2), y: head.y((s[i].y + s[i - 1].y) / 2), w });
    }
  };
  for (const p of model.pumps) {
    if (hidden.has(p.id)) continue;
    addSeries(p.head, 1);
    if (p.operating) pts.push({ x: model.x(p.operating.flow), y: head.y(p.operating.head), w: 8 });
  }
  if (model.system) {
    addSeries(model.system.design, 1);
    addSeries(model.system.low, 0.5);
    addSeries(model.system.high, 0.5);
  }
  if (model.duty) pts.push({ x: model.x(model.duty.flow), y: head.y(model.duty.head), w: 8 });
  let best = { bx: xs[0], by: ys[0], score: Infinity };
  for (const bx of xs)
    for (const by of ys) {
      let score = 0;
      for (const q of pts) {
        const pad = q.w > 1 ? 8 : 0; // keep clear of marks' edges too
        if (q.x >= bx - pad && q.x <= bx + boxW + pad && q.y >= by - pad && q.y <= by + boxH + pad) score += q.w;
      }
      if (score < best.score) best = { bx, by, score };
    }
  return { bx: best.bx, by: best.by };
}

function Dot({ x, v, panel, color }: { x: number; v: number | null; panel: PanelLayout; color: string }) {
  if (v === null) return null;
  const [lo, hi] = panel.y.domain();
  if (v < lo || v > hi) return null;
  return <circle cx={r1(x)} cy={r1(panel.y(v))} r={3.5} fill={color} stroke="#ffffff" strokeWidth={1.25} />;
}

function ReadoutLine({
  row,
  x,
  y,
  nameW,
  cols,
  charW,
}: {
  row: ReadoutRow;
  x: number;
  y: number;
  nameW: number;
  cols: { k: string; w: number }[];
  charW: number;
}) {
  const maxChars = Math.floor((nameW - 30 - (row.badge ? 18 : 0)) / charW);
  const name = row.label.length > maxChars ? row.label.slice(0, Math.max(3, maxChars - 1)) + "…" : row.label;
  let cx = x + nameW;
  return (
    <g>
      <line
        x1={r1(x + 8)}
        x2={r1(x + 22)}
        y1={r1(y - 4)}
        y2={r1(y - 4)}
        stroke={row.color}
        strokeWidth={row.key === "band" ? 6 : 2.5}
        strokeOpacity={row.key === "band" ? 0.5 : 1}
        strokeDasharray={row.dashed ? "4 2" : undefined}
      />
      {row.badge !== undefined && (
        <text x={r1(x + 32)} y={r1(y)} textAnchor="middle" fontWeight={700} fill={row.color}>
          {row.badge}
        </text>
      )}
      <text x={r1(x + (row.badge !== undefined ? 42 : 28))} y={r1(y)} fill={C.title}>
        {name}
      </text>
      {cols.map((c) => {
        cx += c.w;
        const text =
          c.k === "head" && row.headText !== undefined
            ? row.headText
            : row.values[c.k as keyof ReadoutRow["values"]] === undefined
              ? ""
              : formatValue(row.values[c.k as keyof ReadoutRow["values"]]);
        return (
          <text key={c.k} x={r1(cx)} y={r1(y)} textAnchor="end" fill={C.title} style={{ fontVariantNumeric: "tabular-nums" }}>
            {text}
          </text>
        );
      })}
    </g>
  );
}

/* ------------------------------------------------------------------ legend */

function Swatch({ color, dashed, width = 26, thick = 2.5, opacity = 1 }: { color: string; dashed?: boolean; width?: number; thick?: number; opacity?: number }) {
  return (
    <svg width={width} height={12} viewBox={`0 0 ${width} 12`} aria-hidden="true" focusable="false" style={{ display: "inline-block", verticalAlign: "middle", flex: "none" }}>
      <line x1={1} x2={width - 1} y1={6} y2={6} stroke={color} strokeWidth={thick} strokeOpacity={opacity} strokeDasharray={dashed ? "6 3" : undefined} />
    </svg>
  );
}

function MarkSwatch({ kind }: { kind: "duty" | "operating" | "bep" | "por" }) {
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

function opSummary(p: DisplayPump, model: ChartModel): string | null {
  const op = p.operating;
  if (!op) return model.system ? "no operating point on the system curve" : null;
  const u = model.units;
  const parts = [`${formatValue(op.flow)} ${u.flow.label} at ${formatValue(op.head)} ${u.head.label}`];
  if (op.efficiency !== null) parts.push(`η ${formatValue(op.efficiency)} %`);
  if (op.power !== null) parts.push(`${formatValue(op.power)} ${u.power.label}`);
  if (op.npshr !== null) parts.push(`NPSHr ${formatValue(op.npshr)} ${u.npsh.label}`);
  return parts.join(" · ");
}

function Legend({
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
            <Swatch color={C.npsha} dashed /> NPSHa
          </li>
        )}
        {model.duty && (
          <li className="inline-flex items-center gap-1">
            <MarkSwatch kind="duty" /> Duty point {formatValue(model.duty.flow)} {model.units.flow.label} at{" "}
            {formatValue(model.duty.head)} {model.units.head.label}
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

/* ------------------------------------------------------------------ table view */

/** The chart's numbers as tables: curves at ~8 flows over the axis, then the marked points. */
export function ChartTables({ model }: { model: ChartModel }) {
  const u = model.units;
  const kinds = model.panels.map((p) => p.kind);
  const flows = model.x.ticks(8).filter((f) => f >= 0 && f <= model.flowMax);
  const colName: Record<string, string> = {
    head: `Head (${u.head.label})`,
    efficiency: "Eff. (%)",
    power: `Power (${u.power.label})`,
    npsh: `NPSHr (${u.npsh.label})`,
  };
  const hasSystem = Boolean(model.system && model.system.design.length > 0);
  const hasNpsha = model.npsha.length > 0;
  const th = "border-b border-slate-300 px-2 py-1 text-right font-semibold text-slate-700";
  const td = "border-b border-slate-100 px-2 py-0.5 text-right tabular-nums";
  const pumpKinds = (p: DisplayPump) => kinds.filter((k) => pumpSeries(p, k).length > 0);

  return (
    <div className="mt-2 space-y-3 overflow-x-auto" data-tables="">
      <table className="min-w-full border-collapse text-xs">
        <caption className="py-1 text-left text-sm font-semibold text-slate-700">
          Curve values at selected flows (— outside a curve's range)
        </caption>
        <thead>
          <tr>
            <th className={th} rowSpan={2} scope="col">
              Flow ({u.flow.label})
            </th>
            {hasSystem && (
              <th className={th} rowSpan={2} scope="col">
                System head ({u.head.label})
              </th>
            )}
            {model.pumps.map((p) => (
              <th key={p.id} className={th + " text-center"} colSpan={Math.max(1, pumpKinds(p).length)} scope="colgroup">
                {p.badge}. {p.label}
              </th>
            ))}
            {hasNpsha && (
              <th className={th} rowSpan={2} scope="col">
                NPSHa ({u.npsh.label})
              </th>
            )}
          </tr>
          <tr>
            {model.pumps.map((p) =>
              (pumpKinds(p).length ? pumpKinds(p) : (["head"] as const)).map((k) => (
                <th key={`${p.id}-${k}`} className={th} scope="col">
                  {colName[k]}
                </th>
              )),
            )}
          </tr>
        </thead>
        <tbody>
          {flows.map((f) => (
            <tr key={f}>
              <th className={td + " font-semibold"} scope="row">
                {formatValue(f)}
              </th>
              {hasSystem && <td className={td}>{formatValue(interpolateAt(model.system!.design, f))}</td>}
              {model.pumps.map((p) =>
                (pumpKinds(p).length ? pumpKinds(p) : (["head"] as const)).map((k) => (
                  <td key={`${p.id}-${k}`} className={td}>
                    {formatValue(interpolateAt(pumpSeries(p, k), f))}
                  </td>
                )),
              )}
              {hasNpsha && <td className={td}>{formatValue(interpolateAt(model.npsha, f))}</td>}
            </tr>
          ))}
        </tbody>
      </table>

      <table className="min-w-full border-collapse text-xs" data-table="points">
        <caption className="py-1 text-left text-sm font-semibold text-slate-700">Duty, operating points and BEP</caption>
        <thead>
          <tr>
            <th className={th + " text-left"} scope="col">Point</th>
            <th className={th} scope="col">Flow ({u.flow.label})</th>
            <th className={th} scope="col">Head ({u.head.label})</th>
            <th className={th} scope="col">Eff. (%)</th>
            <th className={th} scope="col">Power ({u.power.label})</th>
            <th className={th} scope="col">NPSHr ({u.npsh.label})</th>
          </tr>
        </thead>
        <tbody>
          {model.duty && (
            <tr>
              <th className={td + " text-left font-semibold"} scope="row">Duty point (required)</th>
              <td className={td}>{formatValue(model.duty.flow)}</td>
              <td className={td}>{formatValue(model.duty.head)}</td>
              <td className={td}>—</td>
              <td className={td}>—</td>
              <td className={td}>—</td>
            </tr>
          )}
          {model.pumps.map((p) => {
            const op = p.operating;
            const rows = [
              <tr key={`${p.id}-op`}>
                <th className={td + " text-left font-semibold"} scope="row">
                  {p.badge}. {p.label} — operating point
                </th>
                {op ? (
                  <>
                    <td className={td}>{formatValue(op.flow)}</td>
                    <td className={td}>{formatValue(op.head)}</td>
                    <td className={td}>{formatValue(op.efficiency ?? interpolateAt(p.efficiency, op.flow))}</td>
                    <td className={td}>{formatValue(op.power ?? interpolateAt(p.power, op.flow))}</td>
                    <td className={td}>{formatValue(op.npshr ?? interpolateAt(p.npshr, op.flow))}</td>
                  </>
                ) : (
                  <td className={td + " text-left"} colSpan={5}>
                    does not meet the system curve
                  </td>
                )}
              </tr>,
            ];
            if (p.bep) {
              rows.push(
                <tr key={`${p.id}-bep`}>
                  <th className={td + " text-left"} scope="row">
                    {p.badge}. {p.label} — BEP
                  </th>
                  <td className={td}>{formatValue(p.bep.flow)}</td>
                  <td className={td}>{formatValue(p.bep.head)}</td>
                  <td className={td}>{formatValue(interpolateAt(p.efficiency, p.bep.flow))}</td>
                  <td className={td}>{formatValue(interpolateAt(p.power, p.bep.flow))}</td>
                  <td className={td}>{formatValue(interpolateAt(p.npshr, p.bep.flow))}</td>
                </tr>,
              );
            }
            return rows;
          })}
        </tbody>
      </table>
    </div>
  );
}

export default DutyChart;
