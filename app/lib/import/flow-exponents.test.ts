// Flow headers in the SI's exponent spelling ("l.s-1", "l·s⁻¹", "m3.h-1", "m³·h⁻¹": SI Brochure, 9th ed., 5.4.6, a
// product of units with a negative exponent for the divisor) had been given the default m³/h as "assumed" (1000/3.6 =
// 277.8× off for litres per second), and "L·min⁻¹" read as a speed in rpm ("min-1"). Guards: the slash spellings
// and the gallon headers of the same family kept their units (they passed before too). Invented rows.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import { guessHeader, US_GALLON } from "./units-in-headers";
import { relClose } from "./test-helpers";

const file = (flowHeader: string) => `Model,Speed (rpm),${flowHeader},Head (m)\nA,2900,0,20\nA,2900,5,19\nA,2900,10,17\nA,2900,15,14\n`;
/** The flow column's field, unit and where the unit came from, and the second point's flow (5 in the file), m³/s. */
const read = (flowHeader: string) => {
  const a = analyseCsv(file(flowHeader));
  const col = a.mapping.columns.find((c) => c.index === 2)!;
  return { field: col.field, unit: col.unit, source: col.unitSource, q: a.result.curveSets[0]?.points[1]?.flow };
};

describe("flow headers in the exponent spelling are read as written", () => {
  it.each([
    ["Q l.s-1", "l/s", 5e-3], // source: SI Brochure (1 L = 1e-3 m³): 5 L/s = 0.005 m³/s
    ["Q (l·s⁻¹)", "l/s", 5e-3], // source: same
    ["Q L s-1", "l/s", 5e-3], // source: same, a space for the product
    ["Q (m3.h-1)", "m3/h", 5 / 3600], // source: 1 h = 3600 s
    ["Q (m³·h⁻¹)", "m3/h", 5 / 3600], // source: same
    ["Q m3.s-1", "m3/s", 5], // source: SI base unit
    ["Q (L·min⁻¹)", "l/min", 5e-3 / 60], // source: 1 min = 60 s; "min-1" here divides litres, it is not a speed
    ["Q (dm³·min⁻¹)", "l/min", 5e-3 / 60], // source: 1 dm³ = 1 L (SI Brochure)
  ])("%s: %s from the header (old code: m³/h assumed, or a speed)", (h, unit, q) => {
    const r = read(h);
    expect([r.field, r.unit, r.source]).toEqual(["flow", unit, "header"]); // source: the header's unit word
    expect(relClose(r.q!, q as number)).toBe(true);
  });

  it.each([
    ["Q [L/s]", "l/s", 5e-3], // source: 5 L/s
    ["Q l/min", "l/min", 5e-3 / 60], // source: 5 L/min
    ["Q (US gpm)", "gpm", (5 * US_GALLON) / 60], // source: NIST SP 811, 1 US gal = 3.785411784 L
    ["Q [gal/min]", "gpm", (5 * US_GALLON) / 60], // source: same; the US gallon unless the header says imperial (README, Units read from headers)
  ])("guard: %s is still read as %s (passed before too)", (h, unit, q) => {
    const r = read(h);
    expect([r.field, r.unit, r.source]).toEqual(["flow", unit, "header"]); // source: the header's unit word
    expect(relClose(r.q!, q as number)).toBe(true);
  });

  it("guard: speed headers with min⁻¹ stay speed, and a bare Q stays m³/h assumed (passed before too)", () => {
    expect(["Speed (min-1)", "n [min⁻¹]", "n 1.min-1"].map((h) => [guessHeader(h).field, guessHeader(h).unit])).toEqual([["speed", "rpm"], ["speed", "rpm"], ["speed", "rpm"]]); // source: min⁻¹ = rpm, common practice
    expect([guessHeader("Q").unit, guessHeader("Q").unitFromHeader]).toEqual(["m3/h", false]); // source: DEFAULT_UNIT.flow
  });

  it.each([
    ["l·s⁻¹", "l/s", 5e-3], // source: as above
    ["m³·h⁻¹", "m3/h", 5 / 3600], // source: as above
    ["L.min-1", "l/min", 5e-3 / 60], // source: as above
  ])("a units row “%s” under “Q” is merged into it and read as %s (old code: the units row taken for the names)", (u, unit, q) => {
    const a = analyseCsv(`Model,Speed,Q,H\n,rpm,${u},m\nA,2900,0,20\nA,2900,5,19\nA,2900,10,17\nA,2900,15,14\n`);
    const col = a.mapping.columns.find((c) => c.index === 2)!;
    expect([col.header, col.field, col.unit, col.unitSource]).toEqual([`Q ${u}`, "flow", unit, "header"]); // source: units-row.ts (names + units merged)
    expect(relClose(a.result.curveSets[0]!.points[1]!.flow, q as number)).toBe(true);
  });

  it("a header that is only the unit, “m³·h⁻¹”, is flow as “m³/h” is (old code: head, its h read as H)", () => {
    expect([guessHeader("m³·h⁻¹").field, guessHeader("m³·h⁻¹").unit, guessHeader("m³/h").field]).toEqual(["flow", "m3/h", "flow"]); // source: FIELD_RULES reads m3/ as flow
  });
});
