import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import { fixture, relClose } from "./test-helpers";

const GPM = 6.30901964e-5; // m³/s, NIST SP 811
const FT = 0.3048; // m, NIST SP 811
const HP = 745.69987; // W, NIST SP 811 (rounded)

describe("long-si.csv", () => {
  const a = analyseCsv(fixture("long-si.csv"));
  it("3 models × 2 speeds × 8 points, no problems", () => {
    expect(a.result.problems).toEqual([]); // source: hand-written fixture (clean)
    expect(a.result.curveSets.map((c) => c.points.length)).toEqual([8, 8, 8, 8, 8, 8]); // source: hand-written fixture
    expect(new Set(a.result.curveSets.map((c) => c.model)).size).toBe(3); // source: hand-written fixture
    expect(a.result.stats).toMatchObject({ pointRows: 48, pointsAccepted: 48, curveSetsOk: 6 }); // source: hand-written fixture
  });
  it("line 3 converted to SI", () => {
    const c = a.result.curveSets[0];
    expect([c.model, c.speed, c.impellerDiameter]).toEqual(["Kestrel KR-3", 2900, 0.165]); // source: long-si.csv line 3
    expect(c.sourceRows).toEqual([2, 3, 4, 5, 6, 7, 8, 9]); // source: long-si.csv lines 2-9
    const p = c.points[1];
    expect(relClose(p.flow, 5.71 / 3600)).toBe(true); // source: long-si.csv line 3 (5.71 m³/h)
    expect(p.head).toBe(33.66); // source: long-si.csv line 3
    expect(p.efficiency).toBeCloseTo(0.277, 12); // source: long-si.csv line 3 (27.7 %)
    expect(p.power).toBeCloseTo(1889, 9); // source: long-si.csv line 3 (1.889 kW)
    expect(p.npshr).toBe(1.62); // source: long-si.csv line 3
  });
});

describe("us-units.csv", () => {
  const a = analyseCsv(fixture("us-units.csv"));
  it("reads gpm, ft, hp, in and CRLF line ends", () => {
    expect(a.result.problems).toEqual([]); // source: hand-written fixture (clean)
    expect(a.result.curveSets.map((c) => c.key)).toEqual([
      "NQ Tern 3x2-7|1770|177.8", // source: 7.00 in × 25.4 mm/in (NIST SP 811)
      "NQ Tern 3x2-7|1770|158.75", // source: 6.25 in × 25.4
      "NQ Tern 4x3-9|1770|228.6", // source: 9.00 in × 25.4
      "NQ Tern 4x3-9|1770|203.2", // source: 8.00 in × 25.4
    ]);
  });
  it("line 3 converted with NIST SP 811 factors", () => {
    const c = a.result.curveSets[0];
    expect(relClose(c.impellerDiameter!, 7 * 0.0254)).toBe(true); // source: us-units.csv line 3, 1 in = 0.0254 m
    const p = c.points[1];
    expect(relClose(p.flow, 70 * GPM)).toBe(true); // source: us-units.csv line 3 (70 gpm)
    expect(relClose(p.head, 118.4 * FT)).toBe(true); // source: us-units.csv line 3 (118.4 ft)
    expect(relClose(p.power!, 6.61 * HP, 1e-8)).toBe(true); // source: us-units.csv line 3 (6.61 hp)
    expect(relClose(p.npshr!, 5.1 * FT)).toBe(true); // source: us-units.csv line 3 (5.1 ft)
    expect(p.efficiency).toBeCloseTo(0.317, 12); // source: us-units.csv line 3 (31.7 %)
  });
});

describe("semicolon-decimal-comma.csv", () => {
  const a = analyseCsv(fixture("semicolon-decimal-comma.csv"));
  it("reads decimal commas below title lines", () => {
    expect(a.result.problems).toEqual([]); // source: hand-written fixture (clean)
    expect(a.result.curveSets.map((c) => [c.key, c.points.length])).toEqual([["Tallow TM 32|2900|148", 6], ["Tallow TM 50|2900|192", 6]]); // source: fixture
    const c = a.result.curveSets[0];
    expect(c.sourceRows[0]).toBe(5); // source: fixture line 5 is the first data row
    const p = c.points[1];
    expect(relClose(p.flow, 4.8 / 3600)).toBe(true); // source: fixture line 6 (4,8 m³/h)
    expect(p.head).toBe(21.6); // source: fixture line 6 (21,60 m)
    expect(p.efficiency).toBeCloseTo(0.33, 12); // source: fixture line 6 (33,0 %)
    expect(p.power).toBeCloseTo(856, 9); // source: fixture line 6 (0,856 kW)
    expect(p.npshr).toBe(1.23); // source: fixture line 6
  });
});

// One column block per trim or per speed: each block becomes a curve set of its own.
describe.each([
  {
    file: "wide-by-diameter.csv",
    what: "2 models × 3 trims",
    sets: [
      ["Ridgeway RW-100|2900|250", 7], // source: fixture lines 2-8
      ["Ridgeway RW-100|2900|230", 6], // source: fixture lines 2-7 (line 8 blank)
      ["Ridgeway RW-100|2900|210", 6],
      ["Ridgeway RW-125|2900|250", 7], // source: fixture lines 9-15
      ["Ridgeway RW-125|2900|230", 6],
      ["Ridgeway RW-125|2900|210", 6],
    ],
  },
  {
    file: "wide-by-speed.csv",
    what: "2 models × 2 speeds",
    sets: [
      ["Coldbrook CB 2|2900|180", 6], // source: fixture lines 2-7
      ["Coldbrook CB 2|1450|180", 6],
      ["Coldbrook CB 4|2900|230", 6], // source: fixture lines 8-13
      ["Coldbrook CB 4|1450|230", 6],
    ],
  },
])("$file", ({ file, what, sets }) => {
  it(`becomes ${what}`, () => {
    const a = analyseCsv(fixture(file));
    expect(a.result.problems).toEqual([]); // source: hand-written fixture (clean)
    expect(a.result.curveSets.map((c) => [c.key, c.points.length])).toEqual(sets);
  });
});

it("wide-by-diameter.csv: the trim comes from the block's header", () => {
  const t230 = analyseCsv(fixture("wide-by-diameter.csv")).result.curveSets[1];
  expect(t230.impellerDiameter).toBeCloseTo(0.23, 12); // source: header "Head 230mm"
  expect([t230.points[0].flow, t230.points[0].head]).toEqual([0, 54.17]); // source: fixture line 2
});

it("wide-by-speed.csv: the speed comes from the block's header", () => {
  const p = analyseCsv(fixture("wide-by-speed.csv")).result.curveSets[1].points[1];
  expect(relClose(p.flow, 5 / 3600)).toBe(true); // source: fixture line 3, Q@1450 = 5.0 m³/h
  expect(p.head).toBe(7.36); // source: fixture line 3, H@1450
});
