/**
 * The chart cursor's rules (useChartCursor.ts), without a DOM. Geometry by construction: a
 * straight head line 40 m at 0 → 20 m at 0.2 m³/s (720 m³/h) gives a flow axis 0–800 m³/h
 * (d3-scale nice) on plot x 56–702 px (the model's margins); 1 m³/h = 1/3600 m³/s (SI definition).
 */
import { describe, expect, it } from "vitest";
import { buildChartModel, type ChartModelInput } from "./model.ts";
import { linePump } from "./test-pumps.ts";
import {
  OUTSIDE_PX,
  cursorDisplayFlow,
  cursorHandlers,
  flowAfterKey,
  flowAtViewX,
  keepsCursorOnLeave,
  tickStepOf,
} from "./useChartCursor.ts";
import { UNIT_SYSTEMS } from "../../engine/units.ts";
const SI_UNITS = UNIT_SYSTEMS.SI;

const H = 3600; // m³/h per m³/s (SI definition of the hour)
const modelOf = (over: Partial<ChartModelInput> = {}) => buildChartModel({ unitSystem: SI_UNITS, pumps: [linePump()], ...over });

describe("geometry the checks rely on (model, by construction)", () => {
  it("flow axis 0–800 m³/h on x 56–702 px, ticks every 100 m³/h", () => {
    const m = modelOf();
    expect(m.x.domain()).toEqual([0, 800]);
    expect(m.x.range()).toEqual([56, 702]);
    expect(tickStepOf(m)).toBe(100);
  });
});

describe("pointer → cursor flow (flowAtViewX)", () => {
  const m = modelOf();
  it("the plot's left edge is flow 0 and its right edge the axis end, 800 m³/h (by construction)", () => {
    expect(flowAtViewX(m, 56)).toBe(0);
    expect(flowAtViewX(m, 702)! * H).toBeCloseTo(800, 9);
  });
  it("the middle of the plot, x 379 px, is 400 m³/h (linear scale, by construction)", () => {
    expect(flowAtViewX(m, 379)! * H).toBeCloseTo(400, 9);
  });
  it(`up to ${OUTSIDE_PX} px outside the plot the cursor sticks to the edge; beyond, it hides (common practice)`, () => {
    expect(flowAtViewX(m, 56 - OUTSIDE_PX)).toBe(0);
    expect(flowAtViewX(m, 702 + OUTSIDE_PX)! * H).toBeCloseTo(800, 9);
    expect(flowAtViewX(m, 56 - OUTSIDE_PX - 0.1)).toBeNull();
    expect(flowAtViewX(m, 702 + OUTSIDE_PX + 0.1)).toBeNull();
  });
  it("an empty chart (no curves) still maps the pointer: axis 0–1 m³/h, middle 0.5 m³/h (by construction)", () => {
    const e = buildChartModel({ unitSystem: SI_UNITS, pumps: [] });
    expect(e.empty).toBe(true);
    expect(flowAtViewX(e, 379)! * H).toBeCloseTo(0.5, 12);
  });
});

describe("cursor shown (cursorDisplayFlow)", () => {
  const m = modelOf();
  it("0.1 m³/s shows at 360 m³/h (SI definition of the hour)", () => {
    expect(cursorDisplayFlow(m, 0.1)).toBeCloseTo(360, 9);
  });
  it("none, NaN and Infinity show no cursor; a flow off the axis is clamped to its ends (by construction)", () => {
    expect(cursorDisplayFlow(m, null)).toBeNull();
    expect(cursorDisplayFlow(m, Number.NaN)).toBeNull();
    expect(cursorDisplayFlow(m, Number.POSITIVE_INFINITY)).toBeNull();
    expect(cursorDisplayFlow(m, -0.05)).toBe(0);
    expect(cursorDisplayFlow(m, 1)).toBe(800);
  });
});

describe("keyboard (flowAfterKey): tick step 100 m³/h, small step 20 m³/h", () => {
  const m = modelOf({ duty: { flow: 0.1, head: 30 } });
  const key = (cursor: number | null, k: string, shift = false) => {
    const r = flowAfterKey(m, cursor, k, shift);
    return typeof r === "number" ? r * H : r;
  };
  it("the first arrow press starts at the duty flow, 360 m³/h (common practice: start where the user works)", () => {
    expect(key(null, "ArrowRight")).toBeCloseTo(360, 9);
    expect(key(null, "ArrowLeft")).toBeCloseTo(360, 9);
  });
  it("without a duty it starts at the first operating point, else mid-axis (by construction)", () => {
    const op = modelOf({ pumps: [linePump({ operating: { flow: 0.05, head: 35 } })] });
    expect(flowAfterKey(op, null, "ArrowUp", false)! * H).toBeCloseTo(180, 9);
    const bare = modelOf();
    expect(flowAfterKey(bare, null, "ArrowUp", false)! * H).toBeCloseTo(400, 9);
  });
  it("arrows move by a fifth of a tick and snap to that step: 365 → 380, 365 → 340 (by construction)", () => {
    expect(key(360, "ArrowRight")).toBeCloseTo(380, 9);
    expect(key(365, "ArrowRight")).toBeCloseTo(380, 9);
    expect(key(365, "ArrowDown")).toBeCloseTo(340, 9);
  });
  it("Shift+arrow moves a whole tick and snaps: 360 → 500 (round(460/100)·100), PageUp adds a tick unsnapped (by construction)", () => {
    expect(key(360, "ArrowRight", true)).toBeCloseTo(500, 9);
    expect(key(365, "PageUp")).toBeCloseTo(465, 9);
    expect(key(365, "PageDown")).toBeCloseTo(265, 9);
  });
  it("stops at the axis ends: Home 0, End 800, left of 0 stays 0, PageUp from 750 stays 800 (by construction)", () => {
    expect(key(360, "Home")).toBe(0);
    expect(key(360, "End")).toBeCloseTo(800, 9);
    expect(key(0, "ArrowLeft")).toBe(0);
    expect(key(750, "PageUp")).toBeCloseTo(800, 9);
  });
  it("Escape hides a shown cursor and is left alone when none is shown; other keys are not the cursor's", () => {
    expect(key(360, "Escape")).toBeNull();
    expect(key(null, "Escape")).toBeUndefined();
    expect(key(360, "a")).toBeUndefined();
    expect(key(360, "Tab")).toBeUndefined();
  });
});

describe("event handlers (cursorHandlers)", () => {
  const m = modelOf();
  // The SVG drawn at half its viewBox width: 360 CSS px for 720 viewBox px, starting at 10 px.
  const rect = { left: 10, width: 360 };
  const at = (vx: number, pointerType = "mouse") => ({
    clientX: rect.left + (vx / m.width) * rect.width,
    pointerType,
    currentTarget: { getBoundingClientRect: () => rect },
  });
  function recorder(cursor: number | null = null) {
    const calls: [string, unknown][] = [];
    const h = cursorHandlers(m, cursor, {
      cursorSI: (f) => calls.push(["cursor", f]),
      announce: (on) => calls.push(["announce", on]),
    });
    return { h, calls };
  }

  it("a pointer over the plot sets the cursor (CSS px → viewBox px) and silences the live region", () => {
    const { h, calls } = recorder();
    h.pointer.onPointerMove(at(379));
    expect(calls[0]).toEqual(["announce", false]);
    expect(calls[1][0]).toBe("cursor");
    expect((calls[1][1] as number) * H).toBeCloseTo(400, 6);
  });
  it("a pointer well outside the plot hides the cursor; a chart with no width is ignored", () => {
    const { h, calls } = recorder();
    h.pointer.onPointerMove(at(20));
    expect(calls).toEqual([["cursor", null]]);
    const { h: h2, calls: c2 } = recorder();
    h2.pointer.onPointerMove({ ...at(379), currentTarget: { getBoundingClientRect: () => ({ left: 0, width: 0 }) } });
    expect(c2).toEqual([]);
  });
  it("a mouse or pen leaving the chart hides the cursor", () => {
    for (const t of ["mouse", "pen"]) {
      const { h, calls } = recorder(360);
      h.pointer.onPointerLeave({ pointerType: t });
      expect(calls).toEqual([["cursor", null]]);
    }
  });
  it("a touch keeps the cursor where the finger last was: down at 100 m³/h, slide to 400, lift → 400 stays (issue 19)", () => {
    expect(keepsCursorOnLeave("touch")).toBe(true);
    expect(keepsCursorOnLeave("mouse")).toBe(false);
    const { h, calls } = recorder();
    h.pointer.onPointerDown(at(56 + 646 / 8, "touch")); // 100 m³/h
    h.pointer.onPointerMove(at(379, "touch")); // 400 m³/h
    h.pointer.onPointerLeave({ pointerType: "touch" }); // the finger lifts: pointerup, then pointerleave
    const set = calls.filter(([k]) => k === "cursor").map(([, v]) => (v as number) * H);
    expect(set).toHaveLength(2);
    expect(set[0]).toBeCloseTo(100, 6);
    expect(set[1]).toBeCloseTo(400, 6);
  });
  it("a cursor key is taken (default prevented, announced); other keys pass through untouched", () => {
    let prevented = 0;
    const ev = (key: string) => ({ key, shiftKey: false, preventDefault: () => void prevented++ });
    const { h, calls } = recorder(360);
    h.keyboard.onKeyDown(ev("ArrowRight"));
    expect(prevented).toBe(1);
    expect(calls[0]).toEqual(["announce", true]);
    expect((calls[1][1] as number) * H).toBeCloseTo(380, 6);
    h.keyboard.onKeyDown(ev("x"));
    expect(prevented).toBe(1);
    expect(calls).toHaveLength(2);
    h.keyboard.onBlur();
    expect(calls[2]).toEqual(["announce", false]);
  });
});
