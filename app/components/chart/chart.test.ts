/**
 * Duty chart: pure helpers and the server-rendered markup (node environment,
 * react-dom/server renderToStaticMarkup). Each check names where its expected value comes from.
 */
import { describe, expect, it } from "vitest";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { DutyChart } from "./DutyChart.tsx";
import { buildChartModel } from "./model.ts";
import { readoutRows } from "./readout.ts";
import {
  bandBetween,
  displayUnits,
  extent,
  flowFromDisplay,
  flowToDisplay,
  formatValue,
  interpolateAt,
  niceDomain,
  PUMP_PALETTE,
  seriesToDisplay,
  sliceCurve,
  valueToDisplay,
} from "./scales.ts";
import { sampleProps } from "./sample.ts";
import { linePump } from "./test-pumps.ts";
import type { DutyChartProps } from "./types.ts";
import { UNIT_SYSTEMS } from "../../engine/units.ts";
import { fmtQ } from "../../lib/shared/units.ts";
const SI_UNITS = UNIT_SYSTEMS.SI;
const US_UNITS = UNIT_SYSTEMS.US;

const render = (p: DutyChartProps) => renderToStaticMarkup(createElement(DutyChart, p));
const count = (html: string, needle: string) => html.split(needle).length - 1;
/** Text of the element that carries `attr` (up to its closing tag). */
function section(html: string, attr: string, tag: string): string {
  const i = html.indexOf(attr);
  expect(i, `markup has ${attr}`).toBeGreaterThanOrEqual(0);
  const j = html.indexOf(`</${tag}>`, i);
  return html.slice(i, j);
}


const base = (over: Partial<DutyChartProps> = {}): DutyChartProps => ({
  unitSystem: SI_UNITS,
  title: "Test chart title",
  description: "Test chart description",
  pumps: [linePump()],
  ...over,
});

describe("interpolateAt (linear; by construction)", () => {
  const pts = [
    { flow: 0, y: 10 },
    { flow: 2, y: 20 },
    { flow: 4, y: 10 },
  ];
  it("interpolates between neighbours", () => {
    expect(interpolateAt(pts, 1)).toBeCloseTo(15, 12);
    expect(interpolateAt(pts, 0.5)).toBeCloseTo(12.5, 12);
    expect(interpolateAt(pts, 3)).toBeCloseTo(15, 12);
  });
  it("returns the point itself at a knot, including both ends", () => {
    expect(interpolateAt(pts, 0)).toBe(10);
    expect(interpolateAt(pts, 2)).toBe(20);
    expect(interpolateAt(pts, 4)).toBe(10);
  });
  it("returns null outside the curve's range and for empty curves", () => {
    expect(interpolateAt(pts, -0.001)).toBeNull();
    expect(interpolateAt(pts, 4.001)).toBeNull();
    expect(interpolateAt([], 1)).toBeNull();
    expect(interpolateAt(undefined, 1)).toBeNull();
    expect(interpolateAt(pts, Number.NaN)).toBeNull();
  });
  it("accepts unsorted points and ignores non-finite ones", () => {
    const messy = [pts[2], { flow: 1, y: Number.NaN }, pts[0], pts[1]];
    expect(interpolateAt(messy, 1)).toBeCloseTo(15, 12);
    expect(interpolateAt(messy, 3)).toBeCloseTo(15, 12);
  });
});

describe("other pure helpers", () => {
  it("extent skips non-finite values (by construction)", () => {
    expect(extent([3, Number.NaN, -1, 7, Infinity])).toEqual([-1, 7]);
    expect(extent([])).toBeNull();
  });
  it("niceDomain rounds outward to tick steps (d3-scale linear.nice)", () => {
    expect(niceDomain(0, 53, 6)).toEqual([0, 60]);
    expect(niceDomain(0, 0.97, 5)).toEqual([0, 1]);
    const [a, b] = niceDomain(5, 5);
    expect(a).toBeLessThan(b);
  });
  it("bandBetween keeps y0 ≤ y1 on the union of both grids (by construction)", () => {
    const low = [
      { flow: 0, y: 10 },
      { flow: 2, y: 14 },
    ];
    const high = [
      { flow: 0, y: 8 },
      { flow: 1, y: 12 },
      { flow: 2, y: 20 },
    ];
    const band = bandBetween(high, low);
    expect(band.map((b) => b.flow)).toEqual([0, 1, 2]);
    expect(band[0]).toEqual({ flow: 0, y0: 8, y1: 10 });
    expect(band[1]).toEqual({ flow: 1, y0: 12, y1: 12 });
    expect(band[2]).toEqual({ flow: 2, y0: 14, y1: 20 });
  });
  it("sliceCurve cuts a curve with interpolated ends (by construction)", () => {
    const s = sliceCurve(linePump().head, 0.05, 0.15);
    expect(s).toHaveLength(2);
    expect(s[0].flow).toBe(0.05);
    expect(s[0].y).toBeCloseTo(35, 12);
    expect(s[1].y).toBeCloseTo(25, 12);
  });
  it("formatValue: the app's unit-aware number (units.ts fmtQ's fmtNum: decimals by magnitude), locale-free (by construction)", () => {
    expect(formatValue(360)).toBe("360"); // as the candidates table's "360 m³/h" (it read "360.0")
    expect(formatValue(360)).toBe(fmtQ(SI_UNITS, "flow", 0.1).split(" ")[0]); // 0.1 m³/s = 360 m³/h (SI definition of the hour)
    expect(formatValue(1585.0323)).toBe("1585");
    expect(formatValue(4.2)).toBe("4.20");
    expect(formatValue(0.1234)).toBe("0.123");
    expect(formatValue(0)).toBe("0.000"); // as fmtQ writes a zero reading (fmtNum, limits-apart.test.ts)
    expect(formatValue(null)).toBe("—");
    expect(formatValue(Number.NaN)).toBe("—");
  });
  it("pump palette has six distinct colours, none of them the duty amber or the failure red (app.css tokens)", () => {
    expect(new Set(PUMP_PALETTE).size).toBe(PUMP_PALETTE.length);
    for (const c of PUMP_PALETTE) {
      expect(c.toLowerCase()).not.toBe("#d97706");
      expect(c.toLowerCase()).not.toBe("#b91c1c");
    }
  });
});

describe("conversion to display units", () => {
  const si = displayUnits(SI_UNITS);
  const us = displayUnits(US_UNITS);
  it("each axis follows its own quantity's choice: L/s flow, ft head, hp power (0.1 m³/s = 100 L/s, 30 m = 98.43 ft, 1 hp = 745.69987 W, NIST SP 811)", () => {
    const mixed = displayUnits({ ...SI_UNITS, flow: "L/s", head: "ft", power: "hp" });
    expect([mixed.flow.label, mixed.head.label, mixed.npsh.label, mixed.power.label]).toEqual(["L/s", "ft", "ft", "hp"]);
    expect(flowToDisplay(0.1, mixed)).toBeCloseTo(100, 9);
    expect(valueToDisplay("head", 30, mixed)).toBeCloseTo(30 / 0.3048, 9);
    expect(valueToDisplay("power", 745.69987158, mixed)).toBeCloseTo(1, 6);
    const model = buildChartModel({ ...sampleProps(), unitSystem: { ...SI_UNITS, flow: "L/s", head: "ft" } });
    expect(JSON.stringify(model)).toContain("L/s");
    expect(JSON.stringify(model)).not.toContain("m³/h");
  });
  it("0.1 m³/s is 360 m³/h (1 h = 3600 s, SI definition)", () => {
    expect(flowToDisplay(0.1, si)).toBeCloseTo(360, 9);
    expect(si.flow.label).toBe("m³/h");
  });
  it("0.1 m³/s is 1585.03 gpm (1 gpm = 6.30901964e-5 m³/s, NIST SP 811)", () => {
    expect(flowToDisplay(0.1, us)).toBeCloseTo(0.1 / 6.30901964e-5, 6);
    expect(flowToDisplay(0.1, us)).toBeCloseTo(1585.0323, 3);
    expect(flowFromDisplay(flowToDisplay(0.1, us), us)).toBeCloseTo(0.1, 12);
  });
  it("30 m is 98.425 ft (1 ft = 0.3048 m exactly, NIST SP 811)", () => {
    expect(valueToDisplay("head", 30, us)).toBeCloseTo(30 / 0.3048, 9);
    expect(valueToDisplay("npsh", 3.048, us)).toBeCloseTo(10, 9);
  });
  it("745.69987158 W is 1 hp and 1000 W is 1 kW (NIST SP 811, 1 hp = 550 ft·lbf/s)", () => {
    expect(valueToDisplay("power", 745.69987158, us)).toBeCloseTo(1, 9);
    expect(valueToDisplay("power", 1000, si)).toBeCloseTo(1, 12);
  });
  it("efficiency fraction is shown in percent (by construction)", () => {
    expect(valueToDisplay("efficiency", 0.78, si)).toBeCloseTo(78, 12);
  });
  it("seriesToDisplay drops non-finite points and sorts by flow", () => {
    const out = seriesToDisplay(
      [
        { flow: 0.1, y: 30 },
        { flow: Number.NaN, y: 1 },
        { flow: 0, y: 40 },
      ],
      "head",
      si,
    );
    expect(out).toHaveLength(2);
    expect(out[0]).toEqual({ flow: 0, y: 40 });
    expect(out[1].y).toBe(30);
    expect(out[1].flow).toBeCloseTo(360, 9);
  });
});

describe("DutyChart markup (react-dom/server)", () => {
  it("svg is role=img, labelled by its <title> and <desc>", () => {
    const html = render(base());
    const svg = section(html, "<svg", "svg");
    expect(svg).toContain('role="img"');
    const m = /aria-labelledby="([^"]+) ([^"]+)"/.exec(svg);
    expect(m).not.toBeNull();
    expect(svg).toContain(`<title id="${m![1]}">Test chart title</title>`);
    expect(svg).toContain(`<desc id="${m![2]}">Test chart description</desc>`);
  });

  it("draws one head path per pump (by construction: 3 sample pumps, then 1)", () => {
    expect(count(render(sampleProps("SI")), 'data-series="pump-head"')).toBe(3);
    expect(count(render(base()), 'data-series="pump-head"')).toBe(1);
    expect(count(render(base({ pumps: [] })), 'data-series="pump-head"')).toBe(0);
  });

  it("adjusted pumps are dashed, others solid (by construction)", () => {
    const html = render(base({ pumps: [linePump(), linePump({ id: "p2", label: "Trimmed", adjusted: true })] }));
    const paths = html.match(/<path[^>]*data-series="pump-head"[^>]*>/g) ?? [];
    expect(paths).toHaveLength(2);
    expect(paths[0]).not.toContain("stroke-dasharray");
    expect(paths[1]).toContain('stroke-dasharray="7 4"');
  });

  it("shows the linked panels only when some series has their data", () => {
    const headOnly = render(base());
    expect(count(headOnly, 'data-panel="head"')).toBe(1);
    expect(headOnly).not.toContain('data-panel="efficiency"');
    expect(headOnly).not.toContain('data-panel="power"');
    expect(headOnly).not.toContain('data-panel="npsh"');

    const withEff = render(
      base({
        pumps: [
          linePump({
            efficiency: [
              { flow: 0, y: 0 },
              { flow: 0.2, y: 0.5 },
            ],
          }),
        ],
      }),
    );
    expect(withEff).toContain('data-panel="efficiency"');
    expect(withEff).not.toContain('data-panel="power"');
    expect(withEff).not.toContain('data-panel="npsh"');

    // NPSHa alone is enough for the NPSH panel.
    const withNpsha = render(
      base({
        npsha: [
          { flow: 0, y: 9 },
          { flow: 0.2, y: 7 },
        ],
      }),
    );
    expect(withNpsha).toContain('data-panel="npsh"');
    expect(withNpsha).toContain('data-series="npsha"');

    const full = render(sampleProps("SI"));
    for (const k of ["head", "efficiency", "power", "npsh"]) expect(full).toContain(`data-panel="${k}"`);
  });

  it("draws the duty target cross in amber only when a duty is given", () => {
    const html = render(base({ duty: { flow: 0.1, head: 30 } }));
    const duty = section(html, 'data-mark="duty"', "g");
    expect(duty).toContain('stroke="#d97706"');
    expect(render(base({ duty: null }))).not.toContain('data-mark="duty"');
  });

  it("operating points are amber dots (on head and on each linked panel)", () => {
    const html = render(sampleProps("SI"));
    const dots = html.match(/<circle[^>]*data-mark="operating"[^>]*>/g) ?? [];
    // 3 pumps × (head + efficiency + power + NPSH) = 12, all with operating points inside the axis.
    expect(dots).toHaveLength(12);
    for (const d of dots) expect(d).toContain('fill="#d97706"');
  });

  it("POR and BEP marks appear when given", () => {
    const html = render(base({ pumps: [linePump({ por: { minFlow: 0.05, maxFlow: 0.12 }, bep: { flow: 0.1, head: 30 } })] }));
    expect(html).toContain('data-mark="por"');
    expect(html).toContain('data-mark="bep"');
    expect(render(base())).not.toContain('data-mark="por"');
  });

  it("table view lists converted numbers: 0.1 m³/s → 360 m³/h (SI) and → 1585 gpm (NIST SP 811)", () => {
    const op = { flow: 0.1, head: 30, efficiency: 0.75, power: 40_000 };
    const props = base({ pumps: [linePump({ operating: op })], duty: { flow: 0.1, head: 30 } });

    const si = render(props);
    expect(si).toContain("<summary");
    expect(si).toContain("Table view");
    const siPoints = section(si, 'data-table="points"', "table");
    expect(siPoints).toContain("Flow (m³/h)");
    expect(siPoints).toContain(">360<");
    expect(siPoints).toContain("30.0"); // head in m
    expect(siPoints).toContain("75.0"); // %
    expect(siPoints).toContain("40.0"); // kW

    const us = render({ ...props, unitSystem: US_UNITS });
    const usPoints = section(us, 'data-table="points"', "table");
    expect(usPoints).toContain("Flow (gpm)");
    expect(usPoints).toContain(">1585<");
    expect(usPoints).not.toContain(">360<");
    expect(usPoints).toContain("98.4"); // 30 m / 0.3048 = 98.43 ft (NIST SP 811)
    expect(usPoints).toContain("53.6"); // 40 kW / 745.6999 W = 53.64 hp (NIST SP 811)
  });

  it("table view: an operating-point row only where there is a system curve to meet (a library's curves alone have none)", () => {
    // No system: nothing to meet, so no "operating point" row and no "does not meet the system curve" (the legend says nothing
    // either); no duty and no BEP leave no marked point, so no points table.
    const alone = render(base());
    expect(alone).not.toContain("operating point");
    expect(alone).not.toContain("does not meet");
    expect(alone).not.toContain('data-table="points"');
    expect(section(render(base({ pumps: [linePump({ bep: { flow: 0.1, head: 30 } })] })), 'data-table="points"', "table")).toContain("Line pump — BEP");
    // With a system curve the pump does not reach: the row stays and says so (product rule, as the legend's opSummary).
    const missed = section(render(base({ system: { design: [{ flow: 0, y: 50 }, { flow: 0.2, y: 60 }] } })), 'data-table="points"', "table");
    expect(missed).toContain("Line pump — operating point");
    expect(missed).toContain("does not meet the system curve");
  });

  it("table view samples the curves at ~10 flows with interpolated values (by construction)", () => {
    // Line pump: 40 m at 0 → 20 m at 720 m³/h; flowMax 0.2 m³/s = 720 m³/h; ticks every 100 m³/h.
    const html = render(base({ flowMax: 0.2 }));
    const table = section(html, "Curve values at selected flows", "table");
    const rows = table.match(/<tr>/g) ?? [];
    // 2 header rows + flows 0, 100, …, 700.
    expect(rows.length - 2).toBe(8);
    // At 360 m³/h (0.1 m³/s) the head is 30 m; at 100 m³/h it is 40 − 20·100/720 = 37.22 m.
    expect(table).toContain(">37.2<");
  });

  it("marks a missing curve value as — outside its range (by construction)", () => {
    const html = render(base({ flowMax: 0.3 }));
    const table = section(html, "Curve values at selected flows", "table");
    // Line pump ends at 720 m³/h; the axis runs to 1080 m³/h.
    expect(table).toContain(">—<");
  });

  it("readout at the cursor lists every curve's value at that flow (by construction: 30 m at 0.1 m³/s)", () => {
    const props = base({
      pumps: [linePump(), linePump({ id: "p2", label: "Short pump", head: [{ flow: 0, y: 50 }, { flow: 0.05, y: 45 }] })],
      defaultCursorFlow: 0.1,
    });
    const html = render(props);
    const readout = section(html, 'data-mark="readout"', "svg"); // readout is the last group in the svg
    expect(html).toContain('data-mark="crosshair"');
    expect(readout).toContain("Flow 360 m³/h");
    expect(readout).toContain(">30.0<");
    expect(readout).toContain(">—<"); // short pump ends at 180 m³/h
    const us = render({ ...props, unitSystem: US_UNITS });
    expect(us).toContain(">98.4<");

    expect(render(base())).not.toContain('data-mark="crosshair"');
  });

  it("readout rows from the model: system, pumps and NPSHa at a display flow", () => {
    const model = buildChartModel(sampleProps("SI"));
    const rows = readoutRows(model, 360);
    expect(rows.map((r) => r.key)).toEqual(["system", "band", "pump-a", "pump-b", "pump-c", "npsha"]);
    // System sample H = 12 + 1800·Q² → 30 m at 0.1 m³/s = 360 m³/h; linear interpolation between
    // samples every 0.005 m³/s lands within 0.02 m of the parabola.
    expect(rows[0].values.head!).toBeCloseTo(30, 1);
    const hidden = readoutRows(model, 360, new Set(["b"]));
    expect(hidden.map((r) => r.key)).not.toContain("pump-b");
  });

  it("compact layout uses a narrower viewBox and an HTML readout (by construction)", () => {
    const html = render({ ...sampleProps("US"), compact: true });
    expect(html).toMatch(/viewBox="0 0 440 /);
    expect(html).toContain('data-readout="html"');
    expect(render(sampleProps("US"))).toMatch(/viewBox="0 0 720 /);
  });

  it("renders identical markup on repeated server renders (SSR-safe, deterministic)", () => {
    const a = render(sampleProps("US"));
    const b = render(sampleProps("US"));
    expect(a).toBe(b);
  });

  it("legend entries are buttons (keyboard reachable) showing each operating point", () => {
    const html = render(sampleProps("SI"));
    const legend = section(html, "data-legend", "ul");
    expect(count(legend, "<button")).toBe(3);
    expect(count(legend, 'aria-pressed="true"')).toBe(3);
    expect(legend).toContain("m³/h at");
  });

  it("empty data renders a message, not a crash", () => {
    const html = render(base({ pumps: [] }));
    expect(html).toContain("No curves to show");
  });
});
