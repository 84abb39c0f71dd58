// The power panel and tables name what the power is for when curves of pumps in parallel or series are drawn (each such
// curve's power is its duty pumps' together): shared, mixed with one pump's curves, or none (one pump each: as before).
// Rendered with react-dom/server; the expected words are this feature's own wording (power-basis.ts), the unit kW the SI
// preset's (engine/units.ts).
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import { DutyChart } from "./DutyChart.tsx";
import { buildChartModel } from "./model.ts";
import { Crosshair } from "./Crosshair.tsx";
import { HtmlReadout } from "./HtmlReadout.tsx";
import { readoutPowerNote, readoutText } from "./readout.ts";
import { linePump } from "./test-pumps.ts";
import type { DutyChartProps, PumpSeries } from "./types.ts";
import { UNIT_SYSTEMS } from "../../engine/units.ts";

// A power curve of 20 kW at 0 → 40 kW at 0.2 m³/s (invented).
const power = [{ flow: 0, y: 20_000 }, { flow: 0.2, y: 40_000 }];
const pump = (id: string, over: Partial<PumpSeries> = {}) => linePump({ id, label: `Pump ${id}`, power, ...over });
const props = (pumps: PumpSeries[]): DutyChartProps => ({ unitSystem: UNIT_SYSTEMS.SI, title: "t", description: "d", pumps });
const powerTitle = (pumps: PumpSeries[]) => buildChartModel(props(pumps)).panels.find((p) => p.kind === "power")?.title;

describe("the power panel's title names its basis", () => {
  it("one pump each: as before", () => expect(powerTitle([pump("a"), pump("b")])).toBe("Shaft power (kW)"));
  it("every power curve of 2 duty pumps: the shared basis", () => {
    expect(powerTitle([pump("a", { powerBasis: "2 duty pumps together" }), pump("b", { powerBasis: "2 duty pumps together" })])).toBe("Shaft power, 2 duty pumps together (kW)");
  });
  it("mixed (a system's candidates): each curve by its badge", () => {
    const mixed = [pump("a"), pump("b", { powerBasis: "2 duty pumps together" }), pump("c", { powerBasis: "3 duty pumps together" }), pump("d", { powerBasis: "2 duty pumps together" })];
    expect(powerTitle(mixed)).toBe("Shaft power (kW) — curve 1: one pump; curves 2, 4: 2 duty pumps together; curve 3: 3 duty pumps together");
  });
  it("a curve without a power curve does not count", () => {
    expect(powerTitle([pump("a", { power: undefined }), pump("b", { powerBasis: "2 duty pumps together" })])).toBe("Shaft power, 2 duty pumps together (kW)");
  });
});

describe("the tables (screen and print) and the legend say it beside the numbers", () => {
  const html = renderToStaticMarkup(createElement(DutyChart, props([pump("a", { operating: { flow: 0.1, head: 30, power: 30_000 } }), pump("b", { powerBasis: "2 duty pumps together", operating: { flow: 0.1, head: 30, power: 30_000 } })])));
  it("each curve's power column by its own basis; the points table's power by curve", () => {
    const copies = html.split('data-tables=""').slice(1);
    expect(copies).toHaveLength(2); // the "Table view" and the printed copy
    for (const t of copies) {
      expect(t).toContain('scope="col">Power (kW)</th>');
      expect(t).toContain('scope="col">Power, 2 duty pumps together (kW)</th>');
      expect(t).toContain('scope="col">Power (kW) — curve 1: one pump; curve 2: 2 duty pumps together</th>');
    }
  });
  it("the legend's operating point: 30 kW bare for one pump, with its basis for the 2 duty pumps (30 000 W = 30 kW)", () => {
    expect(html).toContain("at 30.0 m · 30.0 kW</span>"); // pump a: bare, last in its line
    expect(html).toContain("30.0 kW (2 duty pumps together)");
    expect(html.split("(2 duty pumps together)")).toHaveLength(2); // once: pump a's reads bare
  });
});

describe("the cursor readout names its power basis (the box, the compact table and the spoken line)", () => {
  const both = [pump("a"), pump("b", { powerBasis: "2 duty pumps together" })];
  const model = (pumps: PumpSeries[]) => buildChartModel(props(pumps));
  const box = (pumps: PumpSeries[], hidden = new Set<string>()) =>
    renderToStaticMarkup(createElement("svg", null, createElement(Crosshair, { model: model(pumps), flow: 100, hidden, plotBottom: 300, box: true })));
  const compact = (pumps: PumpSeries[], hidden = new Set<string>()) => renderToStaticMarkup(createElement(HtmlReadout, { model: model(pumps), flow: 100, hidden }));
  it("one pump each: no note anywhere, as before", () => {
    expect(readoutPowerNote(model([pump("a"), pump("b")]))).toBeNull();
    expect(box([pump("a"), pump("b")])).not.toContain("readout-power-note");
    expect(compact([pump("a"), pump("b")])).not.toContain("power-note");
    expect(readoutText(model([pump("a"), pump("b")]), 100)).not.toContain("duty pumps");
  });
  it("a curve of 2 duty pumps beside one pump's: each curve's basis by its badge, in the box, the table and the spoken line", () => {
    const note = "P (kW) — curve 1: one pump; curve 2: 2 duty pumps together";
    expect(readoutPowerNote(model(both))).toBe(note);
    expect(box(both)).toContain(`>${note}</text>`);
    expect(compact(both)).toContain(`>${note}</p>`);
    expect(readoutText(model(both), 100).endsWith(`${note}.`)).toBe(true);
  });
  it("the one-pump curve hidden: the shown curves' shared basis", () => {
    expect(readoutPowerNote(model(both), new Set(["a"]))).toBe("P, 2 duty pumps together (kW)");
    expect(box(both, new Set(["a"]))).toContain(">P, 2 duty pumps together (kW)</text>");
  });
  it("the several-pump curve hidden: no note (the readout shows one pump's power only)", () => {
    expect(readoutPowerNote(model(both), new Set(["b"]))).toBeNull();
  });
  it("the box grows a line for the note", () => {
    const h = (s: string) => Number(/data-mark="readout"[^>]*><rect[^>]*height="([\d.]+)"/.exec(s)?.[1]);
    expect(h(box(both)) - h(box([pump("a"), pump("b")]))).toBe(16); // one readout row: font 11 + 5 (Crosshair.tsx)
  });
});
