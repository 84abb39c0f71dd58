// Text cells written by our CSV writer (app/lib/shared/csv.ts) come back as written: the writer puts an
// apostrophe before text a spreadsheet would run as a formula (OWASP "CSV Injection", common practice);
// the importer takes exactly that one apostrophe off again (text-cells.ts). Model names are invented.
import { describe, expect, it } from "vitest";
import { toCsv } from "~/lib/shared/csv";
import { curvesToCsv } from "~/lib/libraries/csv-export";
import type { LibraryCurveSet } from "~/lib/libraries/libraries.server";
import { tracedCsv } from "~/lib/tracer";
import { analyseCsv } from "./index";

const HEADER = ["model", "type", "size", "speed_rpm", "impeller_mm", "flow_m3h", "head_m"];
// Names a spreadsheet would take for a formula (first character = + - @, tab, CR), and ones it would not.
const NAMES = ["+GF 50-250", "-GF 65-160", "=GF 80-200", "@GF 32-125", "\tGF 40-160", "'plain 50-125", "GF 'quoted' 50-160", "'=GF 50-200", "''+GF 40-200"];
// What the importer keeps: the name as written, trimmed as every text cell is (a leading tab is space).
const kept = (name: string) => name.trim();

function rowsFor(names: readonly string[], type: string, size: string): unknown[][] {
  const rows: unknown[][] = [HEADER];
  names.forEach((n, i) => {
    for (const [q, h] of [[0, 50], [20, 48], [40, 42]]) rows.push([n, type, size, 2900, 200 + i, q, h]);
  });
  return rows;
}

describe("text cells defused by our CSV writer read back as written", () => {
  it("models, types and sizes round-trip through toCsv and the importer (quoted cells: the full path)", () => {
    const a = analyseCsv(toCsv(rowsFor(NAMES, "+inline", "-DN50"), { newline: "\n" }));
    expect(a.result.curveSets.map((c) => c.ok)).toEqual(NAMES.map(() => true));
    expect(a.result.curveSets.map((c) => c.model)).toEqual(NAMES.map(kept));
    expect(a.result.curveSets.map((c) => [c.type, c.size])).toEqual(NAMES.map(() => ["+inline", "-DN50"]));
  });

  it("names that start with apostrophes before = + - @ come back with every apostrophe (the writer adds one more, the importer takes one off)", () => {
    const odd = ["'=X 50-125", "=X 50-125", "''+Y 65-160", "'''-Z 80-200", "'@W 32-125"];
    const a = analyseCsv(toCsv(rowsFor(odd, "'-inline", "''=DN50"), { newline: "\n" }));
    expect(a.result.curveSets.map((c) => [c.ok, c.model, c.type, c.size])).toEqual(odd.map((n) => [true, n, "'-inline", "''=DN50"]));
    const unquoted = "model,speed_rpm,flow_m3h,head_m\n''=X,2900,0,50\n''=X,2900,20,48\n''=X,2900,40,42\n"; // as a spreadsheet saves it again: the fast path
    expect(analyseCsv(unquoted).result.curveSets.map((c) => c.model)).toEqual(["'=X"]);
  });

  it("an unquoted defused cell (a file saved again without quotes) reads the same on the fast path", () => {
    const text = "model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m\n'+GF 50-250,'@end,'=DN50,2900,200,0,50\n'+GF 50-250,'@end,'=DN50,2900,200,20,48\n'+GF 50-250,'@end,'=DN50,2900,200,40,42\n";
    const a = analyseCsv(text);
    expect(a.result.curveSets.map((c) => [c.model, c.type, c.size])).toEqual([["+GF 50-250", "@end", "=DN50"]]);
  });

  it("the library export and the tracer's CSV read back with the names they were given", () => {
    const set = (model: string, id: number): LibraryCurveSet => ({
      id, modelId: id, model, type: "-end-suction", nominalSize: "@DN65", speed: 2900, impellerDiameter: 0.2 + id / 1000,
      impellerMin: null, impellerMax: null, ratedSpeed: null, minFlow: null,
      points: [0, 0.005, 0.01].map((flow, i) => ({ flow, head: 50 - 20 * i, efficiency: i ? 0.6 : null, power: null, npshr: null })),
    });
    const lib = analyseCsv(curvesToCsv(NAMES.map((n, i) => set(n, i + 1))));
    expect(lib.result.curveSets.map((c) => [c.model, c.type, c.size])).toEqual(NAMES.map((n) => [kept(n), "-end-suction", "@DN65"]));
    const head = [0, 10, 20, 30].map((x) => ({ x, y: 40 - 0.01 * x * x }));
    const traced = analyseCsv(tracedCsv([{ model: "+GF 50-250", speedRpm: 2900, impellerMm: 250, curves: { head } }], { flow: "m3/h", head: "m", efficiency: "%", power: "kW", npshr: "m" }, 5));
    expect(traced.result.curveSets.map((c) => c.model)).toEqual(["+GF 50-250"]);
  });
});
