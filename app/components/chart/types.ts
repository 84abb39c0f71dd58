/**
 * Props of the duty chart. Everything the chart receives is SI: flow m³/s, head m,
 * efficiency as a fraction 0..1, shaft power W, NPSH m. The chart converts to the user's
 * display units at the edge (see `scales.ts`).
 */
import type { UnitPreset } from "../../engine/units.ts";

/** One curve point: flow (m³/s) and the curve's value (SI, see the series it belongs to). */
export type Pt = { flow: number; y: number };

/** The operating point of one pump on the system curve (SI). */
export type OperatingPoint = {
  flow: number;
  head: number;
  efficiency?: number;
  power?: number;
  npshr?: number;
};

/** One candidate pump (at a given speed / impeller trim). */
export type PumpSeries = {
  id: string;
  label: string;
  /** Index into the chart palette; defaults to the series' position. */
  colorIndex?: number;
  /** Head (m) vs flow. Pass enough points: the chart draws straight segments between them. */
  head: Pt[];
  /** Efficiency (0..1) vs flow. */
  efficiency?: Pt[];
  /** Shaft power (W) vs flow. */
  power?: Pt[];
  /**
   * What the power curve and the operating point's power are for when not one pump's: "2 duty pumps together" (pumps in
   * parallel or series, lib/projects/power-basis.ts). Named on the power panel, the tables and the legend; absent for one pump.
   */
  powerBasis?: string;
  /** NPSH required (m) vs flow. */
  npshr?: Pt[];
  /** Trimmed or slowed curve: drawn dashed. */
  adjusted?: boolean;
  /** Preferred operating region (flows, m³/s): shaded along the head curve. */
  por?: { minFlow: number; maxFlow: number };
  /** Best efficiency point (m³/s, m). */
  bep?: { flow: number; head: number };
  /** Operating point on the system curve, if the pump meets it. */
  operating?: OperatingPoint | null;
};

/** System curve (head m vs flow m³/s) and its band: low/high static × new/aged pipe. */
export type SystemCurves = { design: Pt[]; low?: Pt[]; high?: Pt[] };

/** The display unit per quantity (the user's choice; the engine's presets are two of them). */
export type UnitSystemId = UnitPreset;

export type DutyChartProps = {
  unitSystem: UnitSystemId;
  /** Accessible name of the chart (rendered as the SVG `<title>`). */
  title: string;
  /** Accessible description (rendered as the SVG `<desc>`). */
  description: string;
  system?: SystemCurves;
  pumps: PumpSeries[];
  /** NPSH available (m) vs flow. */
  npsha?: Pt[];
  /**
   * Required duty point (m³/s, m): drawn as an amber target cross. `apartFrom`: the flows delivered against it (the band
   * edges' operating flows, m³/s), which its label is written apart from, as the report's duty row (`dutyFlowText`).
   */
  duty?: { flow: number; head: number; apartFrom?: readonly (number | null | undefined)[] } | null;
  /** x-axis extent, m³/s (else from the data). */
  flowMax?: number;
  /** Total chart height in viewBox units (the head panel takes what the others leave). */
  height?: number;
  /** Narrow layout for phones: smaller viewBox, fewer ticks, larger relative text. */
  compact?: boolean;
  /** Initial cursor flow (m³/s) — shows the crosshair and readout from the first render. */
  defaultCursorFlow?: number | null;
  className?: string;
};
