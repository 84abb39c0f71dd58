/**
 * DutyChart — head–flow chart with linked efficiency / shaft power / NPSH panels sharing
 * the flow axis. Pure presentational component: SI props in, display units out; renders the
 * same SVG on the server and the client (no window access during render). Interaction
 * (crosshair readout, keyboard cursor, legend toggles) lives in event handlers only.
 *
 * Essential styling is set as SVG attributes so the chart reads right without any CSS;
 * Tailwind classes are used for the surrounding HTML (legend, table view, print rules).
 *
 * This file composes the parts, one concept per file: `model.ts` (layout and scales),
 * `PanelFrame.tsx` (axes, grid, labels), `Series.tsx` (curves), `Marks.tsx` (duty, operating
 * points, BEP, POR, badges), `Crosshair.tsx` / `HtmlReadout.tsx` (readout at the cursor),
 * `useChartCursor.ts` (pointer and keyboard), `Legend.tsx` and `TableView.tsx`.
 */
import { useId, useMemo, useState } from "react";
import { Crosshair, readoutBoxHeight } from "./Crosshair.tsx";
import { HtmlReadout } from "./HtmlReadout.tsx";
import { Legend } from "./Legend.tsx";
import { HeadMarks, PanelMarks, PorShading } from "./Marks.tsx";
import { buildChartModel } from "./model.ts";
import { EmptyMessage, FlowAxisTitle, PanelFrame } from "./PanelFrame.tsx";
import { readoutPowerNote, readoutRows, readoutText } from "./readout.ts";
import { NpshaCurve, NpshaLabel, PumpCurves, SystemBand, SystemCurve, type LayerProps } from "./Series.tsx";
import { ChartTables } from "./TableView.tsx";
import type { DutyChartProps } from "./types.ts";
import { useChartCursor } from "./useChartCursor.ts";

export type { DutyChartProps, Pt, PumpSeries, SystemCurves, OperatingPoint, UnitSystemId } from "./types.ts";
export { ChartTables } from "./TableView.tsx";

const FONT = "'Source Sans 3', ui-sans-serif, system-ui, sans-serif";

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

  const { cursor, announce, pointer, keyboard } = useChartCursor(model, props.defaultCursorFlow);
  const [hidden, setHidden] = useState<ReadonlySet<string>>(() => new Set());
  const [emphasis, setEmphasis] = useState<string | null>(null);

  const { x, width, panels } = model;
  const [x0, x1] = x.range() as [number, number];

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
  const boxInSvg = !model.compact && readoutBoxHeight(readoutRows(model, 0).length, readoutPowerNote(model) !== null) <= 0.6 * panels[0].height;
  const plotBottom = last.top + last.height;

  return (
    <div className={["duty-chart text-slate-800", props.className].filter(Boolean).join(" ")}>
      <div
        tabIndex={0}
        role="group"
        aria-label={`${props.title}: chart cursor`}
        aria-describedby={hintId}
        onKeyDown={keyboard.onKeyDown}
        onBlur={keyboard.onBlur}
        className="relative rounded-md outline-offset-2"
      >
        <svg
          viewBox={`0 0 ${width} ${model.height}`}
          width="100%"
          role="img"
          aria-labelledby={`${titleId} ${descId}`}
          fontFamily={FONT}
          fontSize={model.compact ? 12 : 11}
          onPointerMove={pointer.onPointerMove}
          onPointerDown={pointer.onPointerDown}
          onPointerLeave={pointer.onPointerLeave}
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
          <rect x={0} y={0} width={width} height={model.height} fill="#ffffff" />

          {panels.map((panel) => (
            <PanelFrame key={panel.kind} panel={panel} model={model} isLast={panel === last} />
          ))}

          {panels.map((panel) => (
            <g key={panel.kind} clipPath={`url(#${uid}-clip-${panel.kind})`} data-panel={panel.kind}>
              <PanelContent model={model} panel={panel} pumps={visiblePumps} opacityOf={opacityOf} />
            </g>
          ))}

          {/* Marks drawn unclipped so they are never cut at a panel edge. */}
          <HeadMarks model={model} panel={panels[0]} pumps={visiblePumps} opacityOf={opacityOf} />

          <FlowAxisTitle model={model} />
          {model.empty && <EmptyMessage model={model} />}

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

/** What the head panel and every other panel draw inside their clip, bottom layer first. */
const HEAD_LAYERS = [SystemBand, PorShading, SystemCurve, PumpCurves];
const PANEL_LAYERS = [NpshaCurve, PumpCurves, PanelMarks, NpshaLabel];

function PanelContent(props: LayerProps) {
  return (
    <g>
      {(props.panel.kind === "head" ? HEAD_LAYERS : PANEL_LAYERS).map((Layer, i) => (
        <Layer key={i} {...props} />
      ))}
    </g>
  );
}

export default DutyChart;
