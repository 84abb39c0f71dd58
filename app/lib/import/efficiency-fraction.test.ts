// A fraction written among percents: a vendor file's efficiency column holds 50, 70, 72, 65 and one cell "0.72". The old
// importer read the column in percent (the values above 1.5 outnumber those in (0, 1]) and took the cell as 0.72 % with no
// word — fast path, no problem — the curve's best (72 %) plausible, so that point's shaft power (ρgQH/η) came out 100× too
// large. Now that cell is an error at its row, in the efficiency column, with the value as written, what it reads as, the
// other reading and the rule; the point is never imported as 0.72 % (skip-curves: the curve out; drop-points: the point
// out). A small efficiency near shut-off, a fraction column and a column of percents below 10 % at best are left alone.
// Thresholds (efficiency-fraction.ts): below 1 %, at a tenth of the best-efficiency flow or more, best 10 % or more —
// at a tenth of its best-efficiency flow a centrifugal pump's efficiency is some tens of percent of its best (common
// practice, from memory). Invented pumps.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import { inSI } from "~/engine/quantityText";
import { BEST_AT_LEAST, FRACTION_BELOW, FROM_BEST_FLOW } from "./efficiency-fraction";

const H = "Model,Speed (rpm),Flow (m3/h),Head (m),Efficiency (%)";
/** Five points 0–40 m³/h; `cells` replaces the efficiency of the points by index (the best, 72 %, at 30 m³/h). */
const text = (cells: Record<number, string> = {}, flows = [0, 10, 20, 30, 40], effs = ["", "50", "70", "72", "65"]) =>
  [H, ...flows.map((q, i) => `A,2900,${q},${30 - i * i},${cells[i] ?? effs[i]}`)].join("\n") + "\n";
const flagged = (t: string, policy?: "drop-points") => {
  const a = analyseCsv(t, policy ? { ...analyseCsv(t).suggestedMapping, policy } : undefined);
  return { a, p: a.result.problems.filter((p) => p.code === "efficiency-fraction").map((p) => ({ row: p.row, column: p.column, severity: p.severity, reason: inSI(p.reason) })) };
};

describe("one cell written as a fraction in a column of percents", () => {
  it("the rule's numbers", () => expect([FRACTION_BELOW, BEST_AT_LEAST, FROM_BEST_FLOW]).toEqual([0.01, 0.1, 0.1]));

  it("“0.72” at 20 m³/h: an error at line 4 in “Efficiency (%)”, with the cell, its reading, the other reading and the rule (old code: taken as 0.72 %, fast path, nothing said)", () => {
    const { a, p } = flagged(text({ 2: "0.72" }));
    expect(p.map(({ row, column, severity }) => ({ row, column, severity }))).toEqual([{ row: 4, column: "Efficiency (%)", severity: "error" }]);
    expect(p[0].reason).toContain("efficiency “0.72” in this column of percents reads as 0.72 %, at 20.0 m³/h, on a curve whose best is 72.0 % (at 30.0 m³/h)");
    expect(p[0].reason).toContain("below 1 % at a tenth of the best-efficiency flow or more");
    expect(p[0].reason).toContain("likely a fraction (72.0 %)");
    expect(a.result.curveSets[0].ok).toBe(false); // skip-curves: the curve out
    expect(a.fastPath).toBe(false);
  });

  it("drop-points: the point is left out, never kept as 0.72 %; the other four imported as written", () => {
    const { a } = flagged(text({ 2: "0.72" }), "drop-points");
    const set = a.result.curveSets[0];
    expect(set.ok).toBe(true);
    expect(set.points.map((x) => Math.round(x.flow * 3600))).toEqual([0, 10, 30, 40]);
    expect(set.points.map((x) => x.efficiency)).toEqual([undefined, 0.5, 0.72, 0.65]); // source: the cells ÷ 100
  });

  it("a decimal-comma file: “0,72” is named as written", () => {
    const t = [H.replace(/,/g, ";"), "A;2900;0;30;", "A;2900;10;29;50,5", "A;2900;20;26;0,72", "A;2900;30;21;72,5", "A;2900;40;14;65"].join("\n") + "\n";
    const { p } = flagged(t);
    expect(p.map((x) => x.reason.slice(0, 62))).toEqual(["efficiency “0,72” in this column of percents reads as 0,72 %, "]);
  });
});

describe("the verdict flips at each threshold, both sides", () => {
  it("the cell: 0.99 is flagged, 1 is not (read as 1 %)", () => {
    expect(flagged(text({ 2: "0.99" })).p).toHaveLength(1);
    expect(flagged(text({ 2: "1" })).p).toHaveLength(0);
  });
  it("the flow: at 10 % of the best-efficiency flow (3 of 30 m³/h) flagged, just below it (2.99) not", () => {
    const at = (q: string) => flagged(text({ 1: "0.5" }, [0, Number(q), 20, 30, 40], ["", "x", "60", "72", "65"])).p;
    expect(at("3")).toHaveLength(1);
    expect(at("2.99")).toHaveLength(0);
  });
  it("the curve's best: 10 % flagged, 9.9 % not (then the best-efficiency rule speaks only below 5 %)", () => {
    expect(flagged(text({ 2: "0.5" }, undefined, ["", "8", "x", "10", "9"])).p).toHaveLength(1);
    expect(flagged(text({ 2: "0.5" }, undefined, ["", "8", "x", "9.9", "9"])).p).toHaveLength(0);
  });
});

describe("left alone", () => {
  it("a small efficiency near shut-off (0.8 % at 0.1 m³/h, best at 30): imported as 0.8 %", () => {
    const a = analyseCsv(text({ 1: "0.8" }, [0, 0.1, 20, 30, 40], ["", "x", "70", "72", "65"]));
    expect(a.result.problems).toEqual([]);
    expect(a.result.curveSets[0].points[1].efficiency).toBeCloseTo(0.008, 15);
  });
  it("a column of fractions (header without a unit, judged from its values): 0.5, 0.7, 0.72, 0.65 read as fractions, nothing said", () => {
    const a = analyseCsv(text({}, undefined, ["", "0.5", "0.7", "0.72", "0.65"]).replace("Efficiency (%)", "Efficiency"));
    expect(a.result.problems).toEqual([]);
    expect(a.result.curveSets[0].points.map((x) => x.efficiency)).toEqual([undefined, 0.5, 0.7, 0.72, 0.65]);
  });
  it("both paths give one result on a clean file and on a flagged one", () => {
    for (const t of [text(), text({ 2: "0.72" })]) expect(analyseCsv(t).result).toEqual(analyseCsv(t, undefined, { fast: false }).result);
    expect(analyseCsv(text()).fastPath).toBe(true);
  });
});
