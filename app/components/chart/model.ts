/**
 * Builds everything the duty chart draws from its SI props: display-unit series, domains,
 * panel layout and scales. Pure (no React, no DOM), so the same props give the same SVG on
 * the server and in the browser.
 */
import { scaleLinear, type ScaleLinear } from "d3-scale";
import { pumpColor } from "./colors.ts";
import { bandBetween, cleanPoints, type BandPt } from "./curves.ts";
import { displayUnits, flowToDisplay, seriesToDisplay, valueToDisplay, type DisplayUnits } from "./display-units.ts";
import { powerHeading } from "./power-basis.ts";
import { dutyFlowText } from "../candidate-figures.ts";
import { fmtHead } from "../../lib/shared/units.ts";
import { extent, niceDomain } from "./scales.ts";
import type { DutyChartProps, Pt } from "./types.ts";

export type PanelKind = "head" | "efficiency" | "power" | "npsh";

/** A pump, converted to display units. */
export interface DisplayPump {
  id: string;
  label: string;
  /** 1-based badge number shown on the chart and in the legend. */
  badge: number;
  color: string;
  adjusted: boolean;
  head: Pt[];
  efficiency: Pt[];
  power: Pt[];
  /** What the power is for when not one pump's ("2 duty pumps together"); null for one pump. */
  powerBasis: string | null;
  npshr: Pt[];
  por: { minFlow: number; maxFlow: number } | null;
  bep: { flow: number; head: number } | null;
  operating: {
    flow: number;
    head: number;
    efficiency: number | null;
    power: number | null;
    npshr: number | null;
  } | null;
}

export interface PanelLayout {
  kind: PanelKind;
  title: string;
  /** Unit label shown in the readout column header. */
  unit: string;
  top: number;
  height: number;
  y: ScaleLinear<number, number>;
  yTicks: number[];
}

export interface ChartModel {
  units: DisplayUnits;
  width: number;
  height: number;
  margin: { left: number; right: number; top: number; bottom: number };
  x: ScaleLinear<number, number>;
  xTicks: number[];
  flowMax: number;
  panels: PanelLayout[];
  pumps: DisplayPump[];
  system: { design: Pt[]; band: BandPt[]; low: Pt[]; high: Pt[] } | null;
  npsha: Pt[];
  /** The duty in display units, and its texts in the reader's units ("42.36 m³/h", apart from the flows delivered against it). */
  duty: { flow: number; head: number; flowText: string; headText: string } | null;
  empty: boolean;
  compact: boolean;
}

const TITLE_H = 18;
const GAP = 12;

/** Builds the chart model from props (all SI in, display units out). */
/** What the model is built from: the chart's data props, not its labels or callbacks. */
export type ChartModelInput = Pick<DutyChartProps, "unitSystem" | "system" | "pumps" | "npsha" | "duty" | "flowMax" | "height" | "compact">;

export function buildChartModel(props: ChartModelInput): ChartModel {
  const compact = Boolean(props.compact);
  const units = displayUnits(props.unitSystem);

  const pumps: DisplayPump[] = (props.pumps ?? []).map((p, i) => {
    const op = p.operating;
    const opOk = op && Number.isFinite(op.flow) && Number.isFinite(op.head);
    const headD = seriesToDisplay(p.head, "head", units);
    const effD = seriesToDisplay(p.efficiency, "efficiency", units);
    const powD = seriesToDisplay(p.power, "power", units);
    const npD = seriesToDisplay(p.npshr, "npsh", units);
    const fin = (v: number | undefined) => (v !== undefined && Number.isFinite(v) ? v : null);
    return {
      id: p.id,
      label: p.label,
      badge: i + 1,
      color: pumpColor(p.colorIndex ?? i),
      adjusted: Boolean(p.adjusted),
      head: headD,
      efficiency: effD,
      power: powD,
      powerBasis: p.powerBasis || null,
      npshr: npD,
      por:
        p.por && Number.isFinite(p.por.minFlow) && Number.isFinite(p.por.maxFlow)
          ? {
              minFlow: flowToDisplay(Math.min(p.por.minFlow, p.por.maxFlow), units),
              maxFlow: flowToDisplay(Math.max(p.por.minFlow, p.por.maxFlow), units),
            }
          : null,
      bep:
        p.bep && Number.isFinite(p.bep.flow) && Number.isFinite(p.bep.head)
          ? {
              flow: flowToDisplay(p.bep.flow, units),
              head: valueToDisplay("head", p.bep.head, units),
            }
          : null,
      operating: opOk
        ? {
            flow: flowToDisplay(op.flow, units),
            head: valueToDisplay("head", op.head, units),
            efficiency: fin(op.efficiency) === null ? null : valueToDisplay("efficiency", op.efficiency!, units),
            power: fin(op.power) === null ? null : valueToDisplay("power", op.power!, units),
            npshr: fin(op.npshr) === null ? null : valueToDisplay("npsh", op.npshr!, units),
          }
        : null,
    };
  });

  const sys = props.system;
  const system =
    sys && (cleanPoints(sys.design).length > 0 || (sys.low && sys.high))
      ? {
          design: seriesToDisplay(sys.design, "head", units),
          low: seriesToDisplay(sys.low, "head", units),
          high: seriesToDisplay(sys.high, "head", units),
          band:
            sys.low && sys.high
              ? bandBetween(seriesToDisplay(sys.low, "head", units), seriesToDisplay(sys.high, "head", units))
              : [],
        }
      : null;
  const npsha = seriesToDisplay(props.npsha, "npsh", units);
  const duty =
    props.duty && Number.isFinite(props.duty.flow) && Number.isFinite(props.duty.head)
      ? {
          flow: flowToDisplay(props.duty.flow, units),
          head: valueToDisplay("head", props.duty.head, units),
          // The report's rule (candidate-figures.ts): never read as a band edge's delivered flow ("42.36" beside 42.35 m³/h).
          flowText: dutyFlowText(props.unitSystem, props.duty.flow, props.duty.apartFrom ?? []),
          headText: fmtHead(props.unitSystem, props.duty.head),
        }
      : null;

  // ----- x domain (display flow) -----
  const xTickCount = compact ? 5 : 8;
  let flowMax: number;
  if (props.flowMax !== undefined && Number.isFinite(props.flowMax) && props.flowMax > 0) {
    flowMax = flowToDisplay(props.flowMax, units);
  } else {
    const flows: number[] = [];
    for (const p of pumps) for (const s of [p.head, p.efficiency, p.power, p.npshr]) for (const q of s) flows.push(q.flow);
    if (pumps.length === 0 && system) for (const q of system.design) flows.push(q.flow);
    if (duty) flows.push(duty.flow * 1.25);
    for (const p of pumps) if (p.operating) flows.push(p.operating.flow * 1.1);
    const e = extent(flows);
    flowMax = niceDomain(0, e ? Math.max(e[1], 0) : 1, xTickCount)[1];
  }
  if (!(flowMax > 0)) flowMax = 1;

  // ----- layout -----
  const width = compact ? 440 : 720;
  const margin = { left: compact ? 44 : 56, right: compact ? 12 : 18, top: TITLE_H + 4, bottom: 42 };
  const x = scaleLinear().domain([0, flowMax]).range([margin.left, width - margin.right]);
  const xTicks = x.ticks(xTickCount);

  const within = (pts: Pt[]) => pts.filter((q) => q.flow <= flowMax * 1.0001);
  const hasEff = pumps.some((p) => p.efficiency.length > 0);
  const hasPow = pumps.some((p) => p.power.length > 0);
  const hasNpsh = pumps.some((p) => p.npshr.length > 0) || npsha.length > 0;
  const subKinds: PanelKind[] = [];
  if (hasEff) subKinds.push("efficiency");
  if (hasPow) subKinds.push("power");
  if (hasNpsh) subKinds.push("npsh");

  const subH = compact ? 86 : 100;
  const subBlock = subKinds.length * (subH + GAP + TITLE_H);
  const defaultHeadH = compact ? 230 : 300;
  const headH =
    props.height !== undefined && Number.isFinite(props.height)
      ? Math.max(140, props.height - margin.top - margin.bottom - subBlock)
      : defaultHeadH;
  const height = margin.top + headH + subBlock + margin.bottom;

  // ----- y domains -----
  const headVals: number[] = [];
  for (const p of pumps) {
    for (const q of within(p.head)) headVals.push(q.y);
    if (p.operating) headVals.push(p.operating.head);
    if (p.bep) headVals.push(p.bep.head);
  }
  if (duty) headVals.push(duty.head);
  if (headVals.length === 0 && system) {
    for (const q of within(system.design)) headVals.push(q.y);
    for (const q of within(system.high)) headVals.push(q.y);
  } else if (system) {
    // Show the system curve's start (static head) even if it lies above the pumps.
    const s0 = system.design[0];
    if (s0) headVals.push(s0.y);
  }
  const headExt = extent(headVals);
  const headTicks = compact ? 5 : 6;
  const headDom = niceDomain(0, headExt ? headExt[1] * 1.06 : 1, headTicks);

  const maxOf = (series: Pt[][], extra: (number | null)[] = []) => {
    const e = extent([...series.flatMap((s) => within(s).map((q) => q.y)), ...extra.filter((v): v is number => v !== null)]);
    return e ? e[1] : 1;
  };
  const effMax = Math.min(100, maxOf(pumps.map((p) => p.efficiency), pumps.map((p) => p.operating?.efficiency ?? null)) * 1.08);
  const powMax = maxOf(pumps.map((p) => p.power), pumps.map((p) => p.operating?.power ?? null)) * 1.08;
  const npshMax = maxOf([...pumps.map((p) => p.npshr), npsha], pumps.map((p) => p.operating?.npshr ?? null)) * 1.08;

  const panels: PanelLayout[] = [];
  let top = margin.top;
  const mk = (kind: PanelKind, title: string, unit: string, h: number, max: number, ticks: number) => {
    const dom = niceDomain(0, max > 0 ? max : 1, ticks);
    const y = scaleLinear().domain(dom).range([top + h, top]);
    panels.push({ kind, title, unit, top, height: h, y, yTicks: y.ticks(ticks) });
    top += h + GAP + TITLE_H;
  };
  mk("head", `Head (${units.head.label})`, units.head.label, headH, headDom[1], headTicks);
  const subTicks = 3;
  if (hasEff) mk("efficiency", "Efficiency (%)", "%", subH, effMax, subTicks);
  if (hasPow) mk("power", powerHeading("Shaft power", units.power.label, pumps), units.power.label, subH, powMax, subTicks);
  if (hasNpsh) mk("npsh", `NPSH (${units.npsh.label})`, units.npsh.label, subH, npshMax, subTicks);

  const empty = pumps.every((p) => p.head.length === 0) && !system && npsha.length === 0;

  return { units, width, height, margin, x, xTicks, flowMax, panels, pumps, system, npsha, duty, empty, compact };
}

/** Value of each series of a pump at a display flow, keyed by panel kind. */
export function pumpSeries(p: DisplayPump, kind: PanelKind): Pt[] {
  switch (kind) {
    case "head":
      return p.head;
    case "efficiency":
      return p.efficiency;
    case "power":
      return p.power;
    case "npsh":
      return p.npshr;
  }
}
