import { describe, expect, it } from "vitest";
import { CsvChunkParser, isBlankRow, normaliseNewlines, parseRows, stripBom } from "./parse";
import { fixture } from "./test-helpers";

describe("parseRows", () => {
  it("keeps 1-based source lines across blank lines and quoted cells that span lines", () => {
    const { rows } = parseRows('a,b\n\n"x\ny",2\nc,3\n', { delimiter: "," });
    expect(rows.map((r) => r.line)).toEqual([1, 2, 3, 5]); // source: hand-written case (line 4 is inside the quoted cell)
    expect(rows[2].cells).toEqual(["x\ny", "2"]); // source: hand-written case
  });
  it("can drop blank rows and still number lines from the source", () => {
    const { rows } = parseRows("a,b\n\n,\nc,3", { delimiter: ",", keepBlank: false });
    expect(rows.map((r) => r.line)).toEqual([1, 4]); // source: hand-written case
  });
  it("reports a quote left open, with a line", () => {
    const { issues } = parseRows('a,b\nc,"open\n', { delimiter: "," });
    expect(issues.length).toBeGreaterThan(0); // source: hand-written case (RFC 4180 unterminated quote)
    expect(issues[0].line).toBe(2); // source: hand-written case
  });
  it("strips a BOM and normalises CRLF", () => {
    expect(stripBom("\uFEFFa")).toEqual({ text: "a", hadBom: true }); // source: Unicode BOM U+FEFF
    expect(normaliseNewlines("a\r\nb\rc")).toBe("a\nb\nc"); // source: hand-written case
  });
});

describe("CsvChunkParser gives the same rows as one parse, whatever the chunk size", () => {
  for (const name of ["us-units.csv", "semicolon-decimal-comma.csv", "bad.csv"]) {
    for (const size of [1, 2, 3, 7, 64, 100000]) {
      it(`${name} in chunks of ${size}`, () => {
        const raw = fixture(name);
        const delimiter = name.startsWith("semicolon") ? ";" : ",";
        const whole = parseRows(normaliseNewlines(stripBom(raw).text), { delimiter }).rows.filter((r) => !isBlankRow(r.cells));
        const p = new CsvChunkParser(delimiter);
        const got = [];
        for (let i = 0; i < raw.length; i += size) got.push(...p.push(raw.slice(i, i + size)));
        got.push(...p.finish());
        expect(whole.length).toBeGreaterThan(10); // source: each fixture has more than 10 data rows
        expect(got).toEqual(whole); // source: whole-string parse of the hand-written fixture
      });
    }
  }
  it("a quoted newline split across chunks stays in one cell", () => {
    const p = new CsvChunkParser(",");
    const rows = [...p.push('a,"x'), ...p.push('\ny"\r'), ...p.push("\nb,2"), ...p.finish()];
    expect(rows).toEqual([{ line: 1, cells: ["a", "x\ny"] }, { line: 3, cells: ["b", "2"] }]); // source: hand-written case
  });
});
