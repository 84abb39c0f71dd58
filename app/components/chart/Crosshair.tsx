/**
 * The crosshair at the cursor flow: a vertical line through every panel, a dot where it meets
 * each shown curve, the flow tagged on the axis and, in the wide layout, a readout box inside the
 * head panel listing every curve's value at that flow (placed by `placeReadout`).
 */
import { CHART_COLORS as C } from "./colors.ts";
import { interpolateAt } from "./curves.ts";
import type { DisplayUnits } from "./display-units.ts";
import { formatKindValue, formatNpshaValue, formatValue } from "./format.ts";
import { pumpSeries, type ChartModel, type PanelLayout } from "./model.ts";
import { clamp, r1 } from "./paths.ts";
import { readoutPowerNote, readoutRows, type ReadoutRow } from "./readout.ts";
import { placeReadout } from "./readout-place.ts";

/** Readout column titles per panel kind, e.g. "H m", "η %". */
export function readoutColumnTitles(u: DisplayUnits): Record<string, string> {
  return {
    head: `H ${u.head.label}`,
    efficiency: "η %",
    power: `P ${u.power.label}`,
    npsh: `NPSH ${u.npsh.label}`,
  };
}

const READOUT_FONT = 11;
const READOUT_ROW = READOUT_FONT + 5;
/** Height of the SVG readout box for a number of curve rows (+ flow and column-header rows, + the power note's line when there is one). */
export function readoutBoxHeight(rows: number, note = false): number {
  return READOUT_ROW * (rows + 2 + (note ? 1 : 0)) + 8;
}

export function Crosshair({
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
  const note = readoutPowerNote(model, hidden);
  const boxW = Math.max(nameW + cols.reduce((s, c) => s + c.w, 0) + 10, note ? note.length * charW + 16 : 0);
  const boxH = readoutBoxHeight(rows.length, note !== null);
  const { bx, by } = placeReadout(model, hidden, cx, boxW, boxH);
  const hdr = readoutColumnTitles(model.units);
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
        {note && (
          <text data-mark="readout-power-note" x={r1(bx + 8)} y={r1(by + rowH * (rows.length + 3))} fill={C.tick}>
            {note}
          </text>
        )}
      </g>}
    </g>
  );
}


/** Where the cursor line meets a curve (nothing outside the panel's value range). */
function Dot({ x, v, panel, color }: { x: number; v: number | null; panel: PanelLayout; color: string }) {
  if (v === null) return null;
  const [lo, hi] = panel.y.domain();
  if (v < lo || v > hi) return null;
  return <circle cx={r1(x)} cy={r1(panel.y(v))} r={3.5} fill={color} stroke="#ffffff" strokeWidth={1.25} />;
}

/** One row of the readout box: key line, badge, name (shortened to fit) and one value per panel. */
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
              : row.key === "npsha"
                ? formatNpshaValue(row.values[c.k as keyof ReadoutRow["values"]])
                : formatKindValue(c.k as keyof ReadoutRow["values"], row.values[c.k as keyof ReadoutRow["values"]]);
        return (
          <text key={c.k} x={r1(cx)} y={r1(y)} textAnchor="end" fill={C.title} style={{ fontVariantNumeric: "tabular-nums" }}>
            {text}
          </text>
        );
      })}
    </g>
  );
}

