/**
 * SI ↔ display units for the duty chart: the user's unit per quantity, flow both ways,
 * any series value to display (efficiency 0..1 → %), whole series. Pure; no React, no DOM.
 */
import { fromSI, unitLabel } from "../../engine/units.ts";
import { cleanPoints } from "./curves.ts";
import type { Pt, UnitSystemId } from "./types.ts";

/** What a series measures; decides its display unit. */
export type SeriesKind = "head" | "efficiency" | "power" | "npsh";

/** Display units of one choice: unit ids (for `fromSI`) and labels. */
export interface DisplayUnits {
  flow: { id: string; label: string };
  head: { id: string; label: string };
  power: { id: string; label: string };
  /** NPSH shares the head unit. */
  npsh: { id: string; label: string };
  efficiency: { id: "%"; label: "%" };
}

/** Display units of the user's choice (flow, head and power each as chosen; NPSH in the head unit). */
export function displayUnits(preset: UnitSystemId): DisplayUnits {
  const head = { id: preset.head, label: unitLabel("head", preset.head) };
  return {
    flow: { id: preset.flow, label: unitLabel("flow", preset.flow) },
    head,
    power: { id: preset.power, label: unitLabel("power", preset.power) },
    npsh: head,
    efficiency: { id: "%", label: "%" },
  };
}

/** Converts a flow in m³/s to the display flow unit. */
export function flowToDisplay(flowSI: number, units: DisplayUnits): number {
  return fromSI("flow", units.flow.id, flowSI);
}

/** Converts a display flow back to m³/s. */
export function flowFromDisplay(flow: number, units: DisplayUnits): number {
  return flow / fromSI("flow", units.flow.id, 1);
}

/** Converts one SI value of a series kind to display units (efficiency 0..1 → %). */
export function valueToDisplay(kind: SeriesKind, valueSI: number, units: DisplayUnits): number {
  switch (kind) {
    case "efficiency":
      return valueSI * 100;
    case "power":
      return fromSI("power", units.power.id, valueSI);
    case "head":
    case "npsh":
      return fromSI("head", units.head.id, valueSI);
  }
}

/** Converts an SI series to display units (flow and value), dropping non-finite points. */
export function seriesToDisplay(
  points: readonly Pt[] | undefined | null,
  kind: SeriesKind,
  units: DisplayUnits,
): Pt[] {
  return cleanPoints(points).map((p) => ({
    flow: flowToDisplay(p.flow, units),
    y: valueToDisplay(kind, p.y, units),
  }));
}
