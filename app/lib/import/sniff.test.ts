import { describe, expect, it } from "vitest";
import { detectDelimiter, sniffCsv } from "./sniff";
import { isUnitCell } from "./units-row";
import { fixture } from "./test-helpers";

describe("sniffCsv on the fixtures", () => {
  it("long-si.csv: comma, dot decimals, header on line 1", () => {
    const s = sniffCsv(fixture("long-si.csv"));
    expect(s.delimiter).toBe(","); // source: hand-written fixture long-si.csv
    expect(s.decimalComma).toBe(false); // source: hand-written fixture
    expect([s.headerRowIndex, s.headerLine, s.dataStartRow, s.dataStartLine]).toEqual([0, 1, 1, 2]); // source: fixture line 1 is the header
    expect(s.headers).toHaveLength(8); // source: fixture header has 8 names
    expect(s.hadBom).toBe(false); // source: fixture has no BOM
  });
  it("semicolon-decimal-comma.csv: BOM stripped, ';', decimal comma, header below two title lines and a blank line", () => {
    const s = sniffCsv(fixture("semicolon-decimal-comma.csv"));
    expect(s.hadBom).toBe(true); // source: fixture written with a UTF-8 BOM
    expect(s.delimiter).toBe(";"); // source: hand-written fixture
    expect(s.decimalComma).toBe(true); // source: fixture cells like 21,60
    expect([s.headerRowIndex, s.headerLine, s.dataStartRow, s.dataStartLine]).toEqual([3, 4, 4, 5]); // source: fixture lines 1-2 titles, 3 blank, 4 header
    expect(s.headers[0]).toBe("Model"); // source: fixture line 4 (BOM not glued to a name)
    expect(s.headers[3]).toBe("Q [m³/h]"); // source: fixture line 4
  });
  it("wide-by-speed.csv: ';' with dot decimals is not a decimal-comma file", () => {
    const s = sniffCsv(fixture("wide-by-speed.csv"));
    expect(s.delimiter).toBe(";"); // source: hand-written fixture
    expect(s.decimalComma).toBe(false); // source: fixture cells like 29.46
  });
});

describe("sniffCsv on inline cases", () => {
  it("tab-separated with decimal comma", () => {
    const s = sniffCsv("Model\tQ m3/h\tH m\nA\t1,5\t20,1\nA\t3,0\t19,0\n");
    expect(s.delimiter).toBe("\t"); // source: hand-written case
    expect(s.decimalComma).toBe(true); // source: hand-written case
  });
  it("a comma file whose notes contain semicolons stays comma-separated", () => {
    const text = "Model,Flow,Head,Notes\nA,1,20,\"x; y\"\nA,2,19,ok\nA,3,17,\"p; q; r\"\nA,4,14,ok\n";
    expect(detectDelimiter(text)).toBe(","); // source: hand-written case
  });
  it("a file with no header row gets Column N names", () => {
    const s = sniffCsv("A,1,20\nA,2,19\nA,3,17\n");
    expect(s.headerRowIndex).toBe(-1); // source: hand-written case (all rows numeric)
    expect(s.headers).toEqual(["Column 1", "Column 2", "Column 3"]); // source: naming rule in sniff.ts
    expect(s.dataStartLine).toBe(1); // source: hand-written case
  });
  it("a units row under the names is merged into the headers", () => {
    const s = sniffCsv("Vendor list\nModel;Flow;Head\n;m3/h;m\nA;1;20\nA;2;19\n");
    expect(s.headerRowCount).toBe(2); // source: hand-written case
    expect(s.headers).toEqual(["Model", "Flow m3/h", "Head m"]); // source: hand-written case
    expect([s.headerLine, s.dataStartLine]).toEqual([2, 4]); // source: hand-written case
  });
  it("a row under the names is a units row only when every filled cell is a unit word: a model row (“CM 32-160”) stays data", () => {
    expect(isUnitCell("CM 32-160")).toBe(false); // source: importer rule (digits outside a unit's spelling; "cm" alone would be a unit)
    expect(isUnitCell("2900 rpm")).toBe(false); // source: same (a group label, not a unit)
    expect(["l/h", "rpm", "(ft)", "m³/h", "min-1", "Imp. gpm", "bkW", "%", "-", "kPa"].every(isUnitCell)).toBe(true); // source: units-in-headers.ts (read) and unit-words.ts (refused)
    const s = sniffCsv("Model,Flow,Head\nCM 32-160,,\n,0,20\n,10,19\n,20,17\n");
    expect([s.headerRowCount, s.headers, s.dataStartLine]).toEqual([1, ["Model", "Flow", "Head"], 2]); // source: hand-written case (fill-down layout)
  });
  it("a group row above the names (\"2900 rpm\" over Q;H) qualifies the columns below it", () => {
    const s = sniffCsv(",2900 rpm,,1450 rpm,\nModel,Q,H,Q,H\nA,0,30,0,7.5\nA,10,29,5,7.3\n");
    expect(s.headers).toEqual(["Model", "Q @ 2900 rpm", "H @ 2900 rpm", "Q @ 1450 rpm", "H @ 1450 rpm"]); // source: hand-written case
    expect([s.headerRowIndex, s.headerRowCount, s.dataStartLine]).toEqual([0, 2, 3]); // source: hand-written case
  });
  it("a title line with two cells is not taken for the header", () => {
    const s = sniffCsv("Exported 2025-01-02,by someone\nModel,Flow,Head\nA,1,20\nA,2,19\n");
    expect(s.headerLine).toBe(2); // source: hand-written case
  });
  it("overrides win over detection", () => {
    const s = sniffCsv("x;y\nModel;Flow;Head\nA;1,5;20\n", { delimiter: ";", decimalComma: false, headerRowIndex: 1 });
    expect([s.delimiter, s.decimalComma, s.headerLine, s.headers[1]]).toEqual([";", false, 2, "Flow"]); // source: hand-written case
  });
  it("data wider than the header gets named extra columns only where cells are filled", () => {
    const s = sniffCsv("Model,Flow,Head\nA,1,20,x\nA,2,19,\n");
    expect(s.headers).toEqual(["Model", "Flow", "Head", "Column 4"]); // source: hand-written case
  });
});
