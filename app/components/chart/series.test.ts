/**
 * Curve layers (Series.tsx) rendered on their own (react-dom/server). Geometry by construction:
 * a straight head line 40 m at 0 → 20 m at 0.2 m³/s (720 m³/h) draws "M56,82L637.4,202"
 * (axis 0–800 m³/h on x 56–702 px, head 0–50 m on y 322–22 px).
 */
import { describe, expect, it } from "vitest";
import { createElement, type FunctionComponent } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { DutyChart } from "./DutyChart.tsx";
import { buildChartModel, type ChartModelInput } from "./model.ts";
import { NpshaCurve, PumpCurves, SystemBand, type LayerProps } from "./Series.tsx";
import type { PumpSeries } from "./types.ts";
import { UNIT_SYSTEMS } from "../../engine/units.ts";
const SI_UNITS = UNIT_SYSTEMS.SI;

const head = [
  { flow: 0, y: 40 },
  { flow: 0.2, y: 20 },
];
const pump = (id: string, over: Partial<PumpSeries> = {}): PumpSeries => ({ id, label: id, head, ...over });
const modelOf = (over: Partial<ChartModelInput> = {}) => buildChartModel({ unitSystem: SI_UNITS, pumps: [pump("a")], ...over });
function layer(C: FunctionComponent<LayerProps>, model: ReturnType<typeof modelOf>, kind = "head", opacityOf = () => 1) {
  const panel = model.panels.find((p) => p.kind === kind)!;
  return renderToStaticMarkup(createElement("svg", null, createElement(C, { model, panel, pumps: model.pumps, opacityOf })));
}

describe("curve layers", () => {
  it("NaN and Infinity points are skipped: the head path joins the finite points only", () => {
    const m = modelOf({
      pumps: [pump("a", { head: [head[0], { flow: Number.NaN, y: 3 }, { flow: 0.1, y: Number.POSITIVE_INFINITY }, head[1]] })],
    });
    expect(layer(PumpCurves, m)).toContain('d="M56,82L637.4,202"');
    const withNaN = pump("a", { head: [head[0], { flow: Number.NaN, y: 3 }, { flow: 0.1, y: Number.POSITIVE_INFINITY }, head[1]] });
    const html = renderToStaticMarkup(
      createElement(DutyChart, { unitSystem: SI_UNITS, title: "t", description: "d", pumps: [withNaN], defaultCursorFlow: 0.1 }),
    );
    expect(html).not.toMatch(/NaN|Infinity/);
  });
  it("a pump with an empty series draws no path on that panel; the others still do", () => {
    const eff = [
      { flow: 0, y: 0 },
      { flow: 0.2, y: 0.8 },
    ];
    const m = modelOf({ pumps: [pump("a", { efficiency: eff }), pump("b", { efficiency: [] })] });
    const html = layer(PumpCurves, m, "efficiency");
    expect(html.split("<path").length - 1).toBe(1);
    expect(html).toContain('data-pump-id="a"');
    expect(html).not.toContain('data-pump-id="b"');
  });
  it("a pump emphasised in the legend stays opaque, the others fade to 0.22 (the chart's opacityOf)", () => {
    const m = modelOf({ pumps: [pump("a"), pump("b")] });
    const html = layer(PumpCurves, m, "head", ((id: string) => (id === "a" ? 1 : 0.22)) as () => number);
    expect(html).toMatch(/data-pump-id="a"[^>]*opacity="1"/);
    expect(html).toMatch(/data-pump-id="b"[^>]*opacity="0.22"/);
  });
  it("adjusted pumps are dashed 7 4, others solid", () => {
    const m = modelOf({ pumps: [pump("a"), pump("b", { adjusted: true })] });
    const html = layer(PumpCurves, m);
    expect(html).toMatch(/data-pump-id="b"[^>]*stroke-dasharray="7 4"/);
    expect(html).not.toMatch(/data-pump-id="a"[^>]*stroke-dasharray/);
  });
  it("the system band needs two points; NPSHa is drawn on the NPSH panel only", () => {
    const one = modelOf({ system: { design: head, low: [head[0]], high: [head[0]] } });
    expect(layer(SystemBand, one)).toBe("<svg></svg>");
    const npsha = [
      { flow: 0, y: 9 },
      { flow: 0.2, y: 5 },
    ];
    const m = modelOf({ pumps: [pump("a", { npshr: npsha })], npsha });
    expect(layer(NpshaCurve, m, "npsh")).toContain('data-series="npsha"');
    expect(layer(NpshaCurve, m, "head")).toBe("<svg></svg>");
  });
});
