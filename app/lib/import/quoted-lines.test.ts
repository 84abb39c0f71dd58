// A quoted cell written on two lines on every row (a model name with a line break, as a spreadsheet exports a cell holding
// Alt+Enter), and a model with an inch mark (P 6") on every row. The sniffer judged the delimiter line by line, so no
// delimiter fitted any line (a quote opened on one line and closed on the next), tab was taken by default, and every row was
// refused ("no column is mapped to model", "CSV syntax: Trailing quote on quoted field is malformed" on each line). Now,
// where none fits line by line, the delimiter is judged again record by record, a quote's line breaks kept inside its
// record. Lines still come first: a file that fitted before is read as before. Hand-written cases, invented pumps.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import { detectDelimiter } from "./sniff";

const rows = (d: string, desc: (i: number) => string) =>
  [["Model", "Description", "Speed (rpm)", "Flow (m3/h)", "Head (m)"].join(d), ...[0, 10, 20, 30].map((q, i) => ["QL-1", desc(i), "2900", String(q), String(30 - i * i)].join(d))].join("\n") + "\n";
const twoLines = (i: number) => `"end suction\nrow ${i}"`;

describe("a quoted cell on two lines on every row", () => {
  for (const [name, d] of [["comma", ","], ["semicolon", ";"], ["tab", "\t"]] as const) {
    it(`${name}: a description cell on two lines in the second column; the delimiter is found and the curve reads whole`, () => {
      const text = rows(d, twoLines);
      expect(detectDelimiter(text)).toBe(d);
      const a = analyseCsv(text);
      expect(a.result.problems.filter((p) => p.severity === "error")).toEqual([]);
      expect(a.result.curveSets.map((c) => [c.model, c.ok, c.points.length])).toEqual([["QL-1", true, 4]]); // source: construction
      expect(a.rows.map((r) => r.line)).toEqual([2, 4, 6, 8]); // each record starts on its own source line, the cell's second line after it
    });
  }

  it("a model cell on two lines: comma, and its curve reads under that name on one line (old code: tab, every row refused; model-line-break.test.ts)", () => {
    const text = ["Model,Speed (rpm),Flow (m3/h),Head (m)", '"Pump\nX",2900,0,30', '"Pump\nX",2900,10,29', '"Pump\nX",2900,20,27'].join("\n");
    const a = analyseCsv(text);
    expect(a.sniff.delimiter).toBe(",");
    expect(a.result.curveSets.map((c) => [c.model, c.ok, c.points.length])).toEqual([["Pump X", true, 3]]);
  });
});

describe("an inch mark, and files that fitted before", () => {
  it("an unquoted inch mark (P 6\") on every row: comma, the curve reads whole (old code: tab, every row refused)", () => {
    const text = ['Model,Flow (m3/h),Head (m)', 'P 6",0,30', 'P 6",10,29', 'P 6",20,27', 'P 6",30,23'].join("\n");
    expect(detectDelimiter(text)).toBe(",");
    expect(analyseCsv(text).result.curveSets.map((c) => [c.model, c.ok, c.points.length])).toEqual([['P 6"', true, 4]]);
  });
  it("a quoted cell on two lines on one row of many: comma, as before", () => {
    expect(detectDelimiter(rows(",", (i) => (i === 1 ? twoLines(i) : "end suction")))).toBe(",");
  });
});
