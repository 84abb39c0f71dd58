// A decimal comma in the LAST named column of a comma-separated file: "A,0,30,12,5" under "Model,Flow (m3/h),Head (m),Min
// flow (m3/h)" is five cells under four names, on every row, so the sniffer widened the header to an unnamed "Column 5",
// which the mapping leaves out. The old importer said nothing: min flow 12 m³/h for 12,5 (and head 27 for 27,5 when head is
// last). Now a number in an unnamed column after the last named one, beside a number there, is an extra-cells error at the
// row, charged to the last named column, naming the cells as read and the rule; the point is left out. Text there (a note
// column with no header) is ignored as before. Hand-written cases, invented pumps.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";

const file = (header: string, rows: string[]) => [header, ...rows].join("\n") + "\n";
const MIN = "Model,Speed (rpm),Flow (m3/h),Head (m),Min flow (m3/h)";
const minRows = (last: string) => [`A,2900,0,30,${last}`, `A,2900,10,29,${last}`, `A,2900,20,26,${last}`, `A,2900,30,22,${last}`, `A,2900,40,17,${last}`];
const HEAD = "Model,Speed (rpm),Flow (m3/h),Head (m)";
const headRows = (tail: string) => [`A,2900,0,30,${tail}`, `A,2900,10,29,${tail}`, `A,2900,20,27,${tail}`, `A,2900,30,22,${tail}`, `A,2900,40,17,${tail}`];
const said = (t: string, policy?: "drop-points") => analyseCsv(t, policy ? { ...analyseCsv(t).suggestedMapping, policy } : undefined).result;
const fullPath = (t: string) => analyseCsv(t, undefined, { fast: false }).result; // the full path alone, to compare

describe("a number in an unnamed column after a numeric last column (comma-separated)", () => {
  it("min flow “12,5” unquoted on every row: refused at each row and the min flow column, never 12 m³/h (old code: no problem, minFlow 12 m³/h)", () => {
    const r = said(file(MIN, minRows("12,5")));
    const refused = r.problems.filter((p) => p.code === "extra-cells");
    expect(refused.map((p) => [p.row, p.column, p.severity])).toEqual([2, 3, 4, 5, 6].map((row) => [row, "Min flow (m3/h)", "error"]));
    expect(refused[0].reason).toContain("Min flow (m3/h) “12” is followed by a number, “5”, in Column 6, a column with no header; its cells as read: A | 2900 | 0 | 30 | 12 | 5.");
    expect(refused[0].reason).toContain("A number in a column with no header beside a numeric last column is likely a decimal comma (12,5)");
    expect(refused[0].reason).toContain("write 12.5 (a comma-separated file takes a decimal point)");
    expect(r.curveSets.filter((c) => c.ok)).toEqual([]);
    expect(r.curveSets.every((c) => c.minFlow === undefined)).toBe(true); // no 12 m³/h kept anywhere
    expect(fullPath(file(MIN, minRows("12,5"))).problems).toEqual(r.problems); // both paths say the same
  });
  it("drop-points: every point refused, so no curve imports with min flow 12", () => {
    const r = said(file(MIN, minRows("12,5")), "drop-points");
    expect(r.curveSets.filter((c) => c.ok)).toEqual([]);
  });
  it("head “27,5” last: refused at the head column, never head 27 (old code: imported 30, 29, 27, 22, 17 m)", () => {
    const r = said(file(HEAD, headRows("5")));
    expect(r.problems.filter((p) => p.code === "extra-cells").map((p) => [p.row, p.column])).toEqual([2, 3, 4, 5, 6].map((row) => [row, "Head (m)"]));
    expect(r.curveSets[0].ok).toBe(false);
  });
  it("the last named column with text and a number after it: no split to name, left as it was (ignored column)", () => {
    const t = file("Model,Speed (rpm),Flow (m3/h),Head (m),Notes", ["A,2900,0,30,new,5", "A,2900,10,29,new,5", "A,2900,20,27,new,5", "A,2900,30,22,new,5"]);
    expect(said(t).problems.filter((p) => p.code === "extra-cells")).toEqual([]);
  });
});

describe("left as it was", () => {
  it("text in the unnamed column (a note column with no header): ignored, the curve imported as written", () => {
    const r = said(file(HEAD, headRows("checked")));
    expect(r.problems.filter((p) => p.severity === "error")).toEqual([]);
    expect(r.curveSets[0].ok).toBe(true);
    expect(r.curveSets[0].points.map((p) => p.head)).toEqual([30, 29, 27, 22, 17]); // source: the cells
  });
  it("a stray note beyond the header on one row: the extra-cells warning, as before", () => {
    const rows = headRows("").map((x) => x.slice(0, -1));
    rows[2] += ",see note";
    const r = said(file(HEAD, rows));
    expect(r.problems.map((p) => [p.row, p.code, p.severity])).toEqual([[4, "extra-cells", "warning"]]);
  });
  it("the unnamed column mapped by the user (to NPSHr): read as mapped, not refused", () => {
    const t = file(HEAD, headRows("2"));
    const m = analyseCsv(t).suggestedMapping;
    const mapping = { ...m, columns: m.columns.map((c) => (c.index === 4 ? { ...c, field: "npshr" as const, unit: "m" as const } : c)) };
    const r = analyseCsv(t, mapping).result;
    expect(r.problems.filter((p) => p.code === "extra-cells")).toEqual([]);
    expect(r.curveSets[0].points.map((p) => p.npshr)).toEqual([2, 2, 2, 2, 2]);
  });
  it("a semicolon file with a decimal comma keeps “12,5” in one cell: min flow 12.5 m³/h", () => {
    const t = file(MIN.replaceAll(",", ";"), minRows("12,5").map((x) => x.replaceAll(",", ";").replace(/;12;5$/, ";12,5")));
    const r = said(t);
    expect(r.curveSets[0].minFlow! * 3600).toBeCloseTo(12.5, 9); // source: the cell, m³/h ÷ 3600
  });
});
