// A file with no data rows: the old importer flagged a 1-byte file ("A" or a lone line break) only as "no column is mapped
// to model and no default model is set" — a consequence, not what is wrong. Now the error says the file has no data rows,
// and says it alone (the mapping's errors follow from it). Hand-written cases.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";

const said = (t: string) => analyseCsv(t).result.problems.map((p) => [p.row, p.column, p.code, p.severity, p.reason]);

describe("no data rows: said first, and alone", () => {
  it("“A”, one byte: line 1 is all it holds (old code: “no column is mapped to model…”)", () => {
    expect(said("A")).toEqual([[1, null, "missing-value", "error", "the file has no data rows: line 1 (“A”) is all it holds, read as its header; a curve file has rows of flow and head below it"]]);
  });
  it("a lone line break: nothing but blank lines", () => {
    expect(said("\n")).toEqual([[1, null, "missing-value", "error", "the file has no data rows: it holds nothing but blank lines; a curve file has a header and rows of flow and head below it"]]);
  });
  it("an empty text: the same", () => {
    expect(said("")[0][4]).toContain("it holds nothing but blank lines");
  });
  it("a header alone, mapped: the header named, nothing else said", () => {
    expect(said("Model,Speed (rpm),Flow (m3/h),Head (m)\n")).toEqual([[1, null, "missing-value", "error", "the file has no data rows: line 1 (“Model, Speed (rpm), Flow (m3/h), Head (m)”) is all it holds, read as its header; a curve file has rows of flow and head below it"]]);
  });
  it("one data row under the header: no such error (the other rules speak)", () => {
    const p = analyseCsv("Model,Speed (rpm),Flow (m3/h),Head (m)\nA,2900,0,30\n").result.problems;
    expect(p.some((x) => x.reason.includes("no data rows"))).toBe(false);
    expect(p.map((x) => x.code)).toContain("too-few-points");
  });
});
