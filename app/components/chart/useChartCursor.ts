/**
 * The chart cursor: one flow read across every panel, moved by the pointer or the keyboard.
 * State is the cursor flow in SI (m³/s, so it survives a change of unit system) and whether the
 * live region should announce it (keyboard moves only). The rules are plain functions, so they
 * are tested without a DOM; `useChartCursor` only holds the state and hands out the handlers.
 *
 * Pointer: the cursor follows the pointer across the plot (clamped to it) and hides more than
 * OUTSIDE_PX beyond the plot's edges or when a mouse/pen leaves the chart. A touch pointer keeps
 * the cursor where the finger lifted, so the readout stays readable on a phone.
 * Keyboard: ← → ↑ ↓ move by a fifth of a tick step (Shift: a tick step, snapped to the step),
 * PageUp/PageDown by a tick step, Home/End to the axis ends, Escape hides; the first key press
 * starts at the duty flow (else the first operating point, else mid-axis).
 */
import { useState } from "react";
import { flowFromDisplay, flowToDisplay } from "./display-units.ts";
import type { ChartModel } from "./model.ts";
import { clamp } from "./paths.ts";

/** How far (viewBox px) beyond the plot's left/right edge the pointer still moves the cursor. */
export const OUTSIDE_PX = 10;

/** The cursor in display units, clamped to the flow axis; null when there is none (or not finite). */
export function cursorDisplayFlow(model: ChartModel, cursorSI: number | null): number | null {
  return cursorSI === null || !Number.isFinite(cursorSI) ? null : clamp(flowToDisplay(cursorSI, model.units), 0, model.flowMax);
}

/** Cursor flow (m³/s) for a pointer at viewBox x `vx`: clamped onto the plot, null when well outside it. */
export function flowAtViewX(model: ChartModel, vx: number): number | null {
  const [x0, x1] = model.x.range() as [number, number];
  if (vx < x0 - OUTSIDE_PX || vx > x1 + OUTSIDE_PX) return null;
  return flowFromDisplay(model.x.invert(clamp(vx, x0, x1)), model.units);
}

/** Flow between two x-axis ticks (display units); a tenth of the axis when there is only one tick. */
export function tickStepOf(model: ChartModel): number {
  return model.xTicks.length > 1 ? model.xTicks[1] - model.xTicks[0] : model.flowMax / 10;
}

/**
 * The cursor after a key press, in m³/s: a number, null (hide), or undefined when the key is not
 * the cursor's (the event is left alone). `cursor` is the current display flow (or null).
 */
export function flowAfterKey(model: ChartModel, cursor: number | null, key: string, shift: boolean): number | null | undefined {
  const tickStep = tickStepOf(model);
  const step = shift ? tickStep : tickStep / 5;
  const start = model.duty?.flow ?? model.pumps.find((p) => p.operating)?.operating?.flow ?? model.flowMax / 2;
  let next: number | null;
  switch (key) {
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
      if (cursor === null) return undefined;
      next = null;
      break;
    default:
      return undefined;
  }
  return next === null ? null : flowFromDisplay(clamp(next, 0, model.flowMax), model.units);
}

/** Whether a pointer leaving the chart keeps the cursor: only a touch (the finger lifted). */
export function keepsCursorOnLeave(pointerType: string): boolean {
  return pointerType === "touch";
}

/** The parts of the DOM events the handlers read (React's events fit these). */
type PointerLike = { clientX: number; currentTarget: { getBoundingClientRect(): { left: number; width: number } } };
type LeaveLike = { pointerType: string };
type KeyLike = { key: string; shiftKey: boolean; preventDefault(): void };

/** Event handlers for a cursor shown at display flow `cursor`; they report changes through `set`. */
export function cursorHandlers(
  model: ChartModel,
  cursor: number | null,
  set: { cursorSI: (flow: number | null) => void; announce: (on: boolean) => void },
) {
  function onPointerMove(e: PointerLike) {
    const r = e.currentTarget.getBoundingClientRect();
    if (!(r.width > 0)) return;
    const flow = flowAtViewX(model, ((e.clientX - r.left) / r.width) * model.width);
    if (flow !== null) set.announce(false);
    set.cursorSI(flow);
  }
  return {
    /** For the SVG. */
    pointer: {
      onPointerMove,
      onPointerDown: onPointerMove,
      onPointerLeave(e: LeaveLike) {
        if (!keepsCursorOnLeave(e.pointerType)) set.cursorSI(null);
      },
    },
    /** For the focusable group around the SVG. */
    keyboard: {
      onKeyDown(e: KeyLike) {
        const next = flowAfterKey(model, cursor, e.key, e.shiftKey);
        if (next === undefined) return;
        e.preventDefault();
        set.announce(true);
        set.cursorSI(next);
      },
      onBlur() {
        set.announce(false);
      },
    },
  };
}

/** Cursor state of one chart: the display flow (or null), whether to announce it, and the handlers. */
export function useChartCursor(model: ChartModel, defaultCursorFlow: number | null | undefined) {
  const [cursorSI, setCursorSI] = useState<number | null>(defaultCursorFlow ?? null);
  const [announce, setAnnounce] = useState(false);
  const cursor = cursorDisplayFlow(model, cursorSI);
  return { cursor, announce, ...cursorHandlers(model, cursor, { cursorSI: setCursorSI, announce: setAnnounce }) };
}
