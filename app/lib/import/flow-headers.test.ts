// Flow headers whose unit word was misread or not read at all: a cubic decimetre read as a cubic metre (1000× off), the
// French "Débit" read as an impeller diameter, our own format's underscore spelling ("flow_m3s", "flow_ls") and litres
// spelt out ("lit/s", "litres/min") given the default m³/h as "assumed" (3600× or 3.6× off). Invented rows.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import { guessHeader } from "./units-in-headers";
import { relClose } from "./test-helpers";

const file = (flowHeader: string) => `Model,Speed (rpm),${flowHeader},Head (m)\nA,2900,0,20\nA,2900,5,19\nA,2900,10,17\nA,2900,15,14\n`;
/** The second point's flow, m³/s, and the flow column's unit and where it came from. */
const read = (flowHeader: string) => {
  const a = analyseCsv(file(flowHeader));
  const col = a.mapping.columns.find((c) => c.index === 2)!;
  return { field: col.field, unit: col.unit, source: col.unitSource, q: a.result.curveSets[0]?.points[1]?.flow, problems: a.result.problems };
};

describe("flow headers read by their unit word", () => {
  it.each(["Flow (dm3/s)", "Flow (dm³/s)", "Q [dm3/s]"])("%s: 5 dm³/s is 0.005 m³/s (1 dm³ = 1 L, SI Brochure), not 5 m³/s (old code: m3/s)", (h) => {
    const r = read(h);
    expect([r.field, r.unit, r.source]).toEqual(["flow", "l/s", "header"]); // source: SI Brochure (1 L = 1 dm³)
    expect(relClose(r.q!, 0.005)).toBe(true); // source: 5 × 1e-3 m³/s
  });

  it("dm³/h and dm³/min: litres per hour and per minute (SI Brochure)", () => {
    expect(guessHeader("Flow (dm3/h)").unit).toBe("l/h"); // source: 1 dm³ = 1 L
    expect(guessHeader("Flow (dm³/min)").unit).toBe("l/min"); // source: 1 dm³ = 1 L
  });

  it("guard: m3/s, m³/h and cu m/h are still read as before (passed before too)", () => {
    expect(["Flow (m3/s)", "Flow [m³/h]", "Flow cu m/h"].map((h) => guessHeader(h).unit)).toEqual(["m3/s", "m3/h", "m3/h"]); // source: NIST SP 811 unit names
  });

  it.each([["Débit (l/s)", "l/s"], ["Débit m3/h", "m3/h"], ["débit", "m3/h"]])("%s: the French flow, not an impeller diameter (old code: field impeller)", (h, unit) => {
    expect([guessHeader(h).field, guessHeader(h).unit]).toEqual(["flow", unit]); // source: débit = flow rate (French), common practice
  });

  it("guard: “D2 (mm)” and “d” are still an impeller diameter (passed before too)", () => {
    expect(["D2 (mm)", "d", "Ø mm"].map((h) => guessHeader(h).field)).toEqual(["impeller", "impeller", "impeller"]); // source: common practice (D2, outer impeller diameter)
  });

  it.each([
    ["flow_m3s", "m3/s", 5], // source: our format's spelling (flow_m3h) with s for seconds
    ["flow_ls", "l/s", 0.005], // source: 5 L/s = 0.005 m³/s
    ["Flow (lit/s)", "l/s", 0.005], // source: 5 L/s
    ["Flow (ltr/s)", "l/s", 0.005], // source: 5 L/s
    ["Flow litres/min", "l/min", 5e-3 / 60], // source: 5 L/min = 5e-3/60 m³/s
    ["Flow (liters/h)", "l/h", 5e-3 / 3600], // source: 5 L/h
  ])("%s: read as %s from the header (old code: m³/h assumed)", (h, unit, q) => {
    const r = read(h);
    expect([r.field, r.unit, r.source]).toEqual(["flow", unit, "header"]); // source: the header's unit word
    expect(relClose(r.q!, q as number)).toBe(true);
  });
});
