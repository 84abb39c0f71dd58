import { describe, expect, it } from "vitest";
import * as v from "valibot";
import { analyseCsv } from "./index";
import { MappingSchema, suggestMapping, toLongRows, type Mapping } from "./mapping";
import { fixture } from "./test-helpers";

describe("MappingSchema", () => {
  for (const name of ["long-si.csv", "us-units.csv", "semicolon-decimal-comma.csv", "wide-by-diameter.csv", "wide-by-speed.csv"]) {
    it(`the suggested mapping for ${name} round-trips through JSON and MappingSchema`, () => {
      const a = analyseCsv(fixture(name));
      const back = v.parse(MappingSchema, JSON.parse(JSON.stringify(a.suggestedMapping)));
      expect(back).toEqual(a.suggestedMapping); // source: round-trip requirement in the task brief
      const again = analyseCsv(fixture(name), back);
      expect(again.result).toEqual(a.result); // source: same mapping, same result
    });
  }
  const good = analyseCsv(fixture("long-si.csv")).suggestedMapping;
  const broken: Array<[string, (m: Mapping) => unknown]> = [
    ["a unit that does not fit its field", (m) => ({ ...m, columns: m.columns.map((c) => (c.field === "head" ? { ...c, unit: "gpm" } : c)) })],
    ["a column mapped twice", (m) => ({ ...m, columns: [...m.columns, { ...m.columns[0] }] })],
    ["no flow column", (m) => ({ ...m, columns: m.columns.filter((c) => c.field !== "flow") })],
    ["a block in a long layout", (m) => ({ ...m, columns: m.columns.map((c) => (c.field === "head" ? { ...c, block: { speed: 2900 } } : c)) })],
    ["a wide layout without blocks", (m) => ({ ...m, layout: "wide" })],
    ["another version", (m) => ({ ...m, version: 2 })],
    ["a text field with a unit", (m) => ({ ...m, columns: m.columns.map((c) => (c.field === "model" ? { ...c, unit: "m" } : c)) })],
    ["a default impeller without unit", (m) => ({ ...m, defaults: { impeller: 250 } })],
    ["a speed block on a speed column", (m) => ({ ...m, layout: "wide", columns: m.columns.map((c) => (c.field === "speed" ? { ...c, block: { speed: 2900 } } : c)) })],
  ];
  it.each(broken)("rejects %s", (_, change) => {
    expect(v.safeParse(MappingSchema, good).success).toBe(true); // source: suggested mapping is valid
    expect(v.safeParse(MappingSchema, change(good)).success).toBe(false); // source: rules in MappingSchema
  });
  it("analyseCsv throws on an invalid mapping from a form", () => {
    expect(() => analyseCsv(fixture("long-si.csv"), { ...good, version: 2 })).toThrow(v.ValiError); // source: analyseCsv contract
  });
});

describe("suggestMapping", () => {
  it("settles efficiency % vs fraction from the data when the header has no unit", () => {
    const rows = (x: string) => [{ line: 2, cells: ["A", "10", "20", x] }];
    const h = ["Model", "Flow", "Head", "Efficiency"];
    expect(suggestMapping(h, rows("0.78"), false).columns[3]).toMatchObject({ unit: "fraction", unitSource: "data" }); // source: hand-written case
    expect(suggestMapping(h, rows("78"), false).columns[3]).toMatchObject({ unit: "%", unitSource: "data" }); // source: hand-written case
  });
  it("prefers P2 (shaft power) over P1 and ignores the other", () => {
    const m = suggestMapping(["Model", "Q m3/h", "H m", "P1 kW", "P2 kW"], [], false);
    expect(m.columns.map((c) => c.field)).toEqual(["model", "flow", "head", "ignore", "power"]); // source: common practice (pump curves give shaft power P2)
  });
  it("takes an unnamed text column as the model", () => {
    const m = suggestMapping(["Designation", "Flow", "Head"], [{ line: 2, cells: ["Orrin 12", "1", "2"] }], false);
    expect(m.columns[0].field).toBe("model"); // source: hand-written case
  });
});

describe("user changes and saved mappings", () => {
  const text = "Model,Speed,Flow,Head\nA,2900,0,40\nA,2900,100,39\nA,2900,200,36\n";
  it("a unit changed by the user is applied", () => {
    const m = analyseCsv(text).suggestedMapping;
    expect(m.columns[2]).toMatchObject({ unit: "m3/h", unitSource: "default" }); // source: DEFAULT_UNIT
    const gpm: Mapping = { ...m, columns: m.columns.map((c) => (c.index === 2 ? { ...c, unit: "gpm", unitSource: "user" } : c)) };
    const p = analyseCsv(text, gpm).result.curveSets[0].points[1];
    expect(p.flow).toBeCloseTo(100 * 6.30901964e-5, 15); // source: NIST SP 811 (1 gpm = 6.30901964e-5 m³/s)
  });
  it("a saved mapping whose header text changed gets a warning naming the column", () => {
    const m = analyseCsv(text).suggestedMapping;
    const p = analyseCsv(text.replace("Head", "Head ft"), m).result.problems;
    expect(p.map((x) => [x.row, x.column, x.code, x.severity])).toEqual([[1, "Head ft", "header-changed", "warning"]]); // source: hand-written case
  });
  it("defaults fill in a missing model and speed", () => {
    const t = "Flow,Head\n0,40\n10,39\n20,36\n";
    const m = analyseCsv(t).suggestedMapping;
    const r = analyseCsv(t, { ...m, defaults: { model: "Orrin 12", speed: 1450 } }).result;
    expect(r.curveSets.map((c) => [c.key, c.ok])).toEqual([["Orrin 12|1450|", true]]); // source: hand-written case
    expect(r.problems).toEqual([]); // source: hand-written case
  });
  it("source overrides: a header row chosen by the user", () => {
    const t = "Model,Flow,Head\nModel,Flow gpm,Head ft\nA,0,40\nA,10,39\nA,20,36\n";
    const m = analyseCsv(t).suggestedMapping;
    const r = analyseCsv(t, { ...m, source: { headerRowIndex: 1 } });
    expect(r.sniff.headers).toEqual(["Model", "Flow gpm", "Head ft"]); // source: hand-written case
    expect(r.sniff.dataStartLine).toBe(3); // source: hand-written case
  });
});

describe("wide → long", () => {
  it("wide-by-diameter.csv: one long row per row and trim, blank trims skipped", () => {
    const a = analyseCsv(fixture("wide-by-diameter.csv"));
    expect(a.mapping.layout).toBe("wide"); // source: header "Head 250mm;Head 230mm;Head 210mm"
    const long = toLongRows(a.rows, a.mapping, a.sniff.headers).rows;
    expect(long).toHaveLength(14 * 3 - 4); // source: fixture has 14 rows × 3 trims, 2 blank cells on each of lines 8 and 15
    const l8 = long.filter((r) => r.line === 8);
    expect(l8.map((r) => [r.cells.impeller!.preset, r.cells.head!.column, r.cells.flow!.raw])).toEqual([[250, "Head 250mm", "180.0"]]); // source: fixture line 8
  });
  it("wide-by-speed.csv: Q@/H@ blocks become two speeds", () => {
    const a = analyseCsv(fixture("wide-by-speed.csv"));
    const long = toLongRows(a.rows, a.mapping, a.sniff.headers).rows;
    const l3 = long.filter((r) => r.line === 3).map((r) => [r.cells.speed!.preset, r.cells.flow!.raw, r.cells.head!.raw]);
    expect(l3).toEqual([[2900, "10.0", "29.46"], [1450, "5.0", "7.36"]]); // source: wide-by-speed.csv line 3
  });
  it("a group row (\"2900 rpm\" over Q;H) turns into speed blocks", () => {
    const r = analyseCsv(",2900 rpm,,1450 rpm,\nModel,Q,H,Q,H\nA,0,30,0,7.5\nA,10,29,5,7.3\nA,20,27,10,6.8\n").result;
    expect(r.curveSets.map((c) => [c.key, c.points.length, c.ok])).toEqual([["A|2900|", 3, true], ["A|1450|", 3, true]]); // source: hand-written case
  });
});
