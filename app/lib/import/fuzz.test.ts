// Hostile and broken input for analyseCsv (pure). The importer must never throw on file content
// (only a bad *mapping* throws v.ValiError, as documented in index.ts) and must return a report
// that is well formed: every problem with a row, code, severity and reason; stats that add up;
// every curve set it marks ok valid under CurveSetSchema (what the service writes) and accepted by the
// engine's createPumpCurve (what the search and the workbench build from it).
// Sources: inputs are built here (seeded PRNG) or taken from fixtures/demo (generate.ts).
import { describe, expect, it } from "vitest";
import * as v from "valibot";
import { generateDemo } from "../../../fixtures/demo/generate";
import { analyseCsv, CurveSetSchema, type AnalyseResult } from "./index";
import type { ProblemCode } from "./types";
import { prng } from "../../../fixtures/prng";
import { expectEngineTakes } from "./test-helpers";

// Every code of types.ts ProblemCode: `satisfies` makes the type check fail when a code is added there and not here (the
// hand-copied list it replaces had missed "efficiency-fraction").
const CODE_SET = {
  "not-a-number": true, "negative": true, "zero": true, "missing-value": true, "missing-model": true, "flow-not-increasing": true,
  "head-rising": true, "efficiency-over-100": true, "too-few-points": true, "duplicate-curve": true, "duplicate-flow": true, "no-speed": true,
  "no-point-values": true, "extra-cells": true, "csv-syntax": true, "mapping": true, "header-changed": true, "run-out": true,
  "inconsistent": true, "zero-dropped": true, "efficiency-implausible": true, "power-constant": true, "npshr-small": true, "key-not-given": true,
  "min-flow": true, "model-line-break": true, "efficiency-fraction": true, "curve-rising": true, "drooping-curve": true,
  "power-below-hydraulic": true, "power-implausible": true, "key-stray": true, "header-repeated": true, "flow-descending": true, "power-efficiency": true,
} satisfies Record<ProblemCode, true>;
const CODES = Object.keys(CODE_SET) as ProblemCode[];


const demo = generateDemo();
const file = (variant: string, d = 0) => demo[d].files.find((f) => f.variant === variant)!.text;

/** Curve sets (as JSON) already held to CurveSetSchema and the engine by `expectWellFormed`. */
const CHECKED = new Set<string>();

/** The report invariants every input must satisfy (source: README "Problems" and index.ts). */
function expectWellFormed(a: AnalyseResult, text: string) {
  const lines = text.split(/\r\n|\r|\n/).length;
  for (const p of a.result.problems) {
    expect(Number.isInteger(p.row) && p.row >= 1 && p.row <= lines + 1, `row ${p.row} of ${lines}`).toBe(true);
    expect(CODES).toContain(p.code);
    expect(["error", "warning"]).toContain(p.severity);
    expect(typeof p.reason === "string" && p.reason.length > 0).toBe(true);
    expect(p.column === null || typeof p.column === "string").toBe(true);
  }
  const errors = a.result.problems.filter((p) => p.severity === "error").length;
  expect(a.result.stats.errors).toBe(errors);
  expect(a.result.stats.warnings).toBe(a.result.problems.length - errors);
  // A curve set read alike before (the same JSON: most of an edited file's are) was held to the schema and the engine
  // then; both are pure, so it is checked once (the 200-edit test spent 45 % of its 19 s re-checking unchanged sets).
  const fresh = a.result.curveSets.filter((c) => c.ok && !CHECKED.has(JSON.stringify(c)));
  for (const c of fresh) {
    const r = v.safeParse(CurveSetSchema, c);
    expect(r.success, `${c.key}: ${r.success ? "" : r.issues.map((i) => i.message).join("; ")}`).toBe(true);
  }
  expectEngineTakes(fresh);
  for (const c of fresh) CHECKED.add(JSON.stringify(c));
  expect(() => JSON.stringify(a)).not.toThrow(); // the report goes to the browser as JSON
}

function analyse(text: string): AnalyseResult {
  let a: AnalyseResult | undefined;
  expect(() => (a = analyseCsv(text))).not.toThrow();
  expectWellFormed(a!, text);
  return a!;
}

describe("random input (seeded)", () => {
  it("60 random byte strings decoded as UTF-8 (replacement characters and all)", () => {
    const r = prng(4242);
    for (let n = 0; n < 60; n++) {
      const bytes = new Uint8Array(1 + Math.floor(r() * 4000));
      for (let i = 0; i < bytes.length; i++) bytes[i] = Math.floor(r() * 256);
      analyse(new TextDecoder("utf-8").decode(bytes));
    }
  });

  it("60 random CSV-like texts (digits, delimiters, quotes, signs, newlines, words)", () => {
    const r = prng(777);
    const atoms = ["0", "1", "7", "12.5", "3,4", "-", "+", ".", "e", ",", ";", "\t", '"', "\n", "\r\n", " ", "Model", "Flow m3/h", "Head m", "Eff %", "rpm", "ø", "1e3", "NaN", "x"];
    for (let n = 0; n < 60; n++) {
      let t = "";
      const len = Math.floor(r() * 3000);
      for (let i = 0; i < len; i++) t += atoms[Math.floor(r() * atoms.length)];
      analyse(t);
    }
  });

  it("the demo clean file with 200 random single-character edits still reads, and the edits only cost points", () => {
    const r = prng(99);
    const base = file("clean");
    const clean = analyseCsv(base);
    for (let n = 0; n < 200; n++) {
      const at = base.indexOf("\n") + 1 + Math.floor(r() * (base.length - base.indexOf("\n") - 1));
      const ch = ",;\"\n-.xe0 "[Math.floor(r() * 10)];
      const t = base.slice(0, at) + ch + base.slice(at + 1);
      const a = analyse(t);
      // a one-character edit touches at most two rows' worth of points (source: construction; a quote may join rows
      // until the next quote, so the bound is loose only for quotes)
      if (ch !== '"') expect(a.result.stats.pointsAccepted).toBeGreaterThanOrEqual(clean.result.stats.pointsAccepted - 12);
    }
  });
});

describe("truncated files", () => {
  const base = file("clean"); // source: fixtures/demo generate.ts, long SI format
  const lines = base.split("\n");

  const keyOf = (line: string) => line.split(",").slice(0, 5).join(",");
  // a data line with at least 3 earlier points of its curve above it (source: generator, 8–12 points per curve)
  const k = lines.findIndex((l, i) => i > 150 && keyOf(l) === keyOf(lines[i - 3]));
  const [model, , , speed, mm] = lines[k].split(",");

  it("cut right after the flow cell: head missing on the last line, its curve is bad, the rest is intact", () => {
    const cut = lines.slice(0, k).join("\n") + "\n" + lines[k].split(",").slice(0, 6).join(",") + ",";
    const a = analyse(cut);
    expect(a.result.problems.map((p) => [p.row, p.column, p.code, p.severity])).toEqual([[k + 1, "head_m", "missing-value", "error"]]); // source: construction
    expect(a.result.curveSets.filter((c) => !c.ok).map((c) => c.key)).toEqual([`${model}|${speed}|${mm}`]); // source: construction
    expect(a.result.curveSets.filter((c) => c.ok)).toHaveLength(a.result.curveSets.length - 1);
  });

  it("cut right after the impeller cell: the row names its curve, so the curve is flagged, not imported a point short", () => {
    const cut = lines.slice(0, k).join("\n") + "\n" + lines[k].split(",").slice(0, 5).join(",") + ",";
    const a = analyse(cut);
    const errs = a.result.problems.filter((p) => p.severity === "error");
    expect(errs.length).toBeGreaterThan(0);
    expect(errs.every((p) => p.row === k + 1 && p.code === "missing-value")).toBe(true); // source: our importer's rule (a keyed row without flow/head is cut short)
    const c = a.result.curveSets.find((c) => c.key === `${model}|${speed}|${mm}`)!;
    expect(c.ok).toBe(false);
  });

  it("cut inside a quoted cell: a CSV syntax error on that line", () => {
    const us = file("us-units"); // quoted model names, CRLF (generator)
    const at = us.indexOf('"', us.indexOf("\r\n", us.length / 2) + 2) + 4; // four characters into a quoted model name
    const cut = us.slice(0, at);
    const a = analyse(cut);
    const lastLine = cut.split("\r\n").length;
    expect(a.result.problems.some((p) => p.code === "csv-syntax" && p.row === lastLine)).toBe(true); // source: construction
  });
});

describe("degenerate files", () => {
  it("an empty file: no curves and one problem at line 1, the missing data rows (not the mapping that follows from them)", () => {
    const a = analyse("");
    expect(a.result.curveSets).toEqual([]);
    expect(a.result.problems.map((p) => [p.row, p.code, p.severity])).toEqual([[1, "missing-value", "error"]]); // source: our importer's rule (index.ts emptyReason)
  });

  it("headers only: no rows, no curves", () => {
    const a = analyse(file("clean").split("\n")[0] + "\n");
    expect([a.rows.length, a.result.curveSets.length]).toEqual([0, 0]); // source: construction
  });
  it("headers only: a problem names the missing data rows", () => {
    const a = analyse(file("clean").split("\n")[0] + "\n");
    const p = a.result.problems.find((x) => x.severity === "error");
    expect(p?.reason).toMatch(/no data rows/); // source: our importer's rule
    expect(p?.row).toBe(1); // source: construction (the header is line 1)
  });

  it("only commas: no curves, the missing data rows said, and the suggested mapping is refused by MappingSchema (ValiError)", () => {
    const t = ",,,,,,\n".repeat(50);
    const a = analyse(t);
    expect(a.result.curveSets).toEqual([]);
    expect(a.result.problems.map((p) => [p.code, p.severity, p.reason.includes("no data rows")])).toEqual([["missing-value", "error", true]]); // source: our importer's rule
    expect(() => analyseCsv(t, a.suggestedMapping)).toThrow(v.ValiError); // documented: an invalid mapping throws (index.ts)
  });

  it("a bad mapping object throws v.ValiError and nothing else", () => {
    expect(() => analyseCsv(file("clean"), { version: 2 })).toThrow(v.ValiError); // documented in index.ts
    expect(() => analyseCsv(file("clean"), null)).toThrow(v.ValiError);
  });

  it("one 10 MB line of numbers under a header: read, its 5 M extra cells reported once, nothing imported", () => {
    const header = "model,speed_rpm,impeller_mm,flow_m3h,head_m\n";
    const t = header + "9,".repeat(5 * 1024 * 1024) + "\n";
    expect(t.length).toBeGreaterThan(10 * 1024 * 1024);
    const a = analyse(t);
    expect(a.result.problems.filter((p) => p.code === "extra-cells").map((p) => p.row)).toEqual([2]); // source: construction
    expect(a.result.stats.curveSetsOk).toBe(0); // one point cannot make a curve (too-few-points)
  });

  it("one 10 MB line without any delimiter: no curves, problems listed", () => {
    const a = analyse("x".repeat(10 * 1024 * 1024));
    expect(a.result.curveSets).toEqual([]);
    expect(a.result.stats.errors).toBeGreaterThan(0);
  });
});

describe("Windows-1252 (Latin-1) text", () => {
  // The semicolon variant holds Ø, ³ and — : all three are single bytes in windows-1252 (0xD8, 0xB3, 0x97).
  const utf8 = file("semicolon").replace(/^\uFEFF/, "");
  const CP1252: Record<string, number> = { "Ø": 0xd8, "³": 0xb3, "—": 0x97 }; // source: windows-1252 code chart
  const bytes = Uint8Array.from([...utf8].map((ch) => (ch.charCodeAt(0) < 0x80 ? ch.charCodeAt(0) : CP1252[ch] ?? 0x3f)));
  const clean = analyseCsv(file("clean"));

  it("the bytes are not valid UTF-8 (so this really is the Latin-1 case)", () => {
    expect(() => new TextDecoder("utf-8", { fatal: true }).decode(bytes)).toThrow();
  });

  it("decoded as windows-1252 (what the server falls back to): the same curves as the UTF-8 file", () => {
    const a = analyse(new TextDecoder("windows-1252").decode(bytes));
    const b = analyseCsv(utf8);
    expect(a.result.problems).toEqual([]);
    expect(a.result.curveSets).toEqual(b.result.curveSets); // source: same text by construction
    expect(a.result.curveSets.length).toBe(clean.result.curveSets.length);
  });

  it("decoded as UTF-8 with replacement characters (a browser without charset detection): still reads every curve", () => {
    const text = new TextDecoder("utf-8").decode(bytes);
    expect(text).toContain("\uFFFD");
    const a = analyse(text);
    // only the header and title lines held non-ASCII text; the units there are the importer's defaults anyway
    expect(a.result.stats.pointsAccepted).toBe(clean.result.stats.pointsAccepted); // source: construction
  });
});

describe("huge and non-finite numbers", () => {
  const H = "model,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m\n";
  const ok = (q: string, h: string, p = "0.1") => `X,2900,200,${q},${h},50,${p},1`;

  it('"NaN", "Infinity", "-Infinity" and "inf" are not numbers: each named on its row', () => {
    const t = H + [ok("0", "10"), ok("NaN", "9"), ok("Infinity", "9"), ok("-Infinity", "9"), ok("inf", "9"), ok("1", "9"), ok("2", "8")].join("\n");
    const a = analyse(t);
    // (the P/η consistency warnings of these made-up rows, and the power-constant warning of their filler power of 0.1 kW on
    // every row, are not the subject here)
    expect(a.result.problems.filter((p) => p.code !== "inconsistent" && p.code !== "power-constant").map((p) => [p.row, p.column, p.code])).toEqual([
      [3, "flow_m3h", "not-a-number"], [4, "flow_m3h", "not-a-number"], [5, "flow_m3h", "not-a-number"], [6, "flow_m3h", "not-a-number"],
    ]); // source: numbers.ts (only decimal notation is a number)
  });

  it("1e308 m of head is finite but no physical value: refused (limit 1e12 in SI units)", () => {
    const a = analyse(H + [ok("0", "1e308"), ok("1", "1e308"), ok("2", "1e307")].join("\n"));
    const heads = a.result.problems.filter((p) => p.column === "head_m");
    expect(heads.map((p) => [p.row, p.code])).toEqual([[2, "not-a-number"], [3, "not-a-number"], [4, "not-a-number"]]); // source: our importer's rule (|value| ≤ 1e12 SI); rows 2–4 by construction
    expect(a.result.curveSets.every((c) => !c.ok)).toBe(true);
  });

  // "1e309" parses to Infinity, and 1e308 kW × 1000 overflows to Infinity W: both must be refused.
  it("1e309 and an overflowing 1e308 kW are refused, never accepted as Infinity", () => {
    const t = H + [ok("0", "10"), ok("1e309", "9"), ok("2", "8", "1e308"), ok("3", "7"), ok("4", "6")].join("\n");
    const a = analyseCsv(t);
    expect(a.result.problems.filter((p) => p.code !== "inconsistent" && p.code !== "power-constant").map((p) => [p.row, p.column, p.severity])).toEqual([[3, "flow_m3h", "error"], [4, "power_kw", "error"]]); // source: construction (P/η consistency and the filler power of 0.1 kW on every row not the subject)
    expectWellFormed(a, t);
  });
});
