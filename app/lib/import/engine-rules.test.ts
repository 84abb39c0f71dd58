// The importer applies the engine's point rules (point-rules.ts; app/engine/pumpCurve.ts checkPumpPoints)
// and judges each curve set's best efficiency: no curve set it accepts is refused by createPumpCurve or
// left out of the search index, and a unit read 100× off is flagged, not imported. Both paths (fast.ts
// and the full path) give the same result on every file here.
// Sources: fixtures/demo (invented libraries, generate.ts) and fixtures/csv (hand-written, invented),
// hostile variants built here from them; thresholds from point-rules.ts (common practice: a centrifugal
// pump's best efficiency lies roughly between 20 and 92 %).
import { readdirSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { generateDemo } from "../../../fixtures/demo/generate";
import { analyseCsv, decodeBytes, type AnalyseResult, type Mapping } from "./index";
import { expectEngineTakes } from "./test-helpers";
import { inSI, renderQuantities } from "~/engine/quantityText";
import { UNIT_SYSTEMS } from "~/engine/units";
import { RISE_FRACTION, RISE_SLACK } from "./point-rules";

const dir = (d: string) => new URL(`../../../fixtures/${d}/`, import.meta.url);
const filesIn = (d: string) =>
  readdirSync(dir(d)).filter((f) => f.endsWith(".csv")).map((f) => [`fixtures/${d}/${f}`, decodeBytes(readFileSync(new URL(f, dir(d)))).text] as [string, string]);

/** Both paths, under both policies: equal results, and every accepted set taken by the engine. */
function sweep(name: string, text: string): AnalyseResult {
  const a = analyseCsv(text);
  const full = analyseCsv(text, undefined, { fast: false });
  expect(a.result, name).toEqual(full.result); // source: the full path is the reference (fast.test.ts)
  expectEngineTakes(a.result.curveSets);
  const drop = analyseCsv(text, { ...a.mapping, policy: "drop-points" } satisfies Mapping);
  expect(drop.result, name).toEqual(analyseCsv(text, { ...a.mapping, policy: "drop-points" }, { fast: false }).result);
  expectEngineTakes(drop.result.curveSets);
  return a;
}

// ---------- hostile variants of a clean demo file (model,…,flow_m3h,head_m,efficiency_pct,power_kw,npshr_m) ----------

const CLEAN = filesIn("demo").find(([n]) => n.endsWith("/nordquay.csv"))![1];
const HEAD = CLEAN.split("\n")[0].split(",");
const col = (name: string) => HEAD.indexOf(name);
type Row = string[];
/** Rewrites every data row: `edit(cells, k, line)` with k the row's position within its curve (0 = first point). */
function variant(edit: (cells: Row, k: number, line: number) => void): string {
  const lines = CLEAN.split("\n");
  let key = "";
  let k = 0;
  return lines
    .map((line, i) => {
      if (i === 0 || line === "") return line;
      const cells = line.split(",");
      const kNow = cells.slice(0, 5).join(",");
      k = kNow === key ? k + 1 : 0;
      key = kNow;
      edit(cells, k, i + 1);
      return cells.join(",");
    })
    .join("\n");
}
const HEAD_M = col("head_m"), EFF = col("efficiency_pct"), POW = col("power_kw"), NPSH = col("npshr_m");

const HOSTILE: [string, string][] = [
  ["NPSHr 0 at shutoff on every curve", variant((c, k) => k === 0 && (c[NPSH] = "0"))],
  ["power 0 at shutoff on every curve", variant((c, k) => k === 0 && (c[POW] = "0.000"))],
  ["power -0 at shutoff", variant((c, k) => k === 0 && (c[POW] = "-0"))],
  ["NPSHr 0 at the third point", variant((c, k) => k === 2 && (c[NPSH] = "0"))],
  ["power 0 at the third point", variant((c, k) => k === 2 && (c[POW] = "0"))],
  ["efficiency 0 at the second point", variant((c, k) => k === 1 && (c[EFF] = "0"))],
  ["first head 0", variant((c, k) => k === 0 && (c[HEAD_M] = "0"))],
  ["head rising 2 m a step from the second point", variant((c, k) => k >= 1 && (c[HEAD_M] = (Number(c[HEAD_M]) + 2 * k).toFixed(2)))],
  ["efficiency in fractions for every row", variant((c) => (c[EFF] = (Number(c[EFF]) / 100).toFixed(4)))],
  ["efficiency in fractions on lines 2–41", variant((c, _k, line) => line <= 41 && (c[EFF] = (Number(c[EFF]) / 100).toFixed(4)))],
  ["1e-400 in NPSHr cells", variant((c, k) => k === 3 && (c[NPSH] = "1e-400"))],
  ["0.000…01 past a double's range in head cells", variant((c, k) => k === 4 && (c[HEAD_M] = `0.${"0".repeat(400)}1`))],
];

describe("every curve set the importer accepts is taken by the engine (createPumpCurve, prepareSearchIndex)", () => {
  for (const [name, text] of [...filesIn("demo"), ...filesIn("csv")]) it(name, () => sweep(name, text));
  for (const d of generateDemo()) for (const f of d.files) it(`generated ${f.name}`, () => sweep(f.name, f.text));
  for (const [name, text] of HOSTILE)
    it(`hostile: ${name} (never silent: each change is named)`, () => {
      const a = sweep(name, text);
      expect(a.result.problems.length, name).toBeGreaterThan(0); // source: construction (every variant breaks an engine rule or the unit)
    });
});

// ---------- the rules one by one, with their thresholds ----------

const T = "Model,Speed rpm,Flow m3/h,Head m";
const csv = (head: string, rows: string[]) => [head, ...rows].join("\n") + "\n";
const codes = (a: AnalyseResult) => a.result.problems.map((p) => [p.row, p.code, p.severity]);

describe("zero power, NPSHr and efficiency (the engine requires them above zero)", () => {
  it("NPSHr 0 at shutoff: the cell is left out with a warning, the point and the curve kept", () => {
    const a = analyseCsv(csv(`${T},NPSHr m`, ["A,2900,0,20,0", "A,2900,10,19,1.2", "A,2900,20,17,2", "A,2900,30,14,3.1"]));
    expect(codes(a)).toEqual([[2, "zero-dropped", "warning"]]); // source: rule (point-rules.ts), line 2 is the shutoff row
    expect(a.result.curveSets[0].ok).toBe(true);
    expect(a.result.curveSets[0].points[0]).toEqual({ flow: 0, head: 20 }); // source: construction (NPSHr dropped, head kept)
    expect(a.result.problems[0].reason).toContain("NPSHr 0 at shutoff");
  });
  it("power 0 at shutoff likewise; at a flow above zero it is an error", () => {
    const shut = analyseCsv(csv(`${T},Power kW`, ["A,2900,0,20,0", "A,2900,10,19,1.0", "A,2900,20,17,1.3", "A,2900,30,14,1.6"]));
    expect(codes(shut)).toEqual([[2, "zero-dropped", "warning"]]); // source: rule
    const mid = analyseCsv(csv(`${T},Power kW`, ["A,2900,0,20,0.8", "A,2900,10,19,0", "A,2900,20,17,1.3", "A,2900,30,14,1.6"]));
    expect(codes(mid)).toEqual([[3, "zero", "error"]]); // source: rule (flow 10 m³/h > 0)
    expect(mid.result.curveSets[0].ok).toBe(false);
  });
  it("NPSHr 0 at a flow above zero is an error", () => {
    const a = analyseCsv(csv(`${T},NPSHr m`, ["A,2900,0,20,1", "A,2900,10,19,0", "A,2900,20,17,2", "A,2900,30,14,3.1"]));
    expect(codes(a)).toEqual([[3, "zero", "error"]]); // source: rule
  });
  it("efficiency 0 where flow is above zero is an error; at shutoff it is fine", () => {
    const a = analyseCsv(csv(`${T},Eff %`, ["A,2900,0,20,0", "A,2900,0.5,20,0", "A,2900,20,17,72", "A,2900,30,14,68"]));
    expect(codes(a)).toEqual([[3, "zero", "error"]]); // source: rule (line 3 has flow 0.5 m³/h)
    expect(a.result.problems[0].column).toBe("Eff %");
  });
});

describe("rising head: the engine's shape rule (headShape.ts), 5 % of the first head for rounding", () => {
  it("heads 20, 20.98, 21.96, 18 at 0–30 m³/h: highest at 20 m³/h, two thirds along its flows — a curve rising along most of its length, refused whole (curve-rising)", () => {
    const a = analyseCsv(csv(T, ["A,2900,0,20", "A,2900,10,20.98", "A,2900,20,21.96", "A,2900,30,18"]));
    expect(codes(a)).toEqual([[4, "curve-rising", "error"]]); // source: rule, peak at 20 m³/h past 50 % of 0–30 m³/h (old code: head-rising at line 4)
    expect(inSI(a.result.problems[0].reason)).toContain("to its highest, 22.0 m at 20.0 m³/h (line 4), 66.7 % of the way along its flows"); // source: 20 / 30 (arithmetic)
  });
  it("exactly 5 % above the lowest head passes, also after a dip", () => {
    const a = analyseCsv(csv(T, ["A,2900,0,20", "A,2900,10,21", "A,2900,20,19", "A,2900,30,20", "A,2900,40,15"]));
    expect(a.result.problems).toEqual([]); // source: 21 − 20 = 1.0 m and 20 − 19 = 1.0 m, both = 5 % of 20 m
    const b = analyseCsv(csv(T, ["A,2900,0,20", "A,2900,10,21", "A,2900,20,19", "A,2900,30,20.01", "A,2900,40,15"]));
    expect(codes(b)).toEqual([[5, "head-rising", "error"]]); // source: 20.01 − 19 = 1.01 m > 1.0 m
  });
  // The message prints the rise apart from its limit, 5 % of the first head (qtExact/qtLimit, fmtPctExact): the old text
  // printed a rise of 1.0004 m as “1.00 m”, which reads as the limit itself (edge hunt of 2026-12-03, item 4).
  it("at the threshold the message prints the rise apart from its limit: 1.0004 m against 1.00 m, 5.002 % against 5 %", () => {
    const a = analyseCsv(csv(T, ["A,2900,0,20", "A,2900,10,17", "A,2900,20,18.0004", "A,2900,30,15"]));
    expect(codes(a)).toEqual([[4, "head-rising", "error"]]); // source: rule, 18.0004 − 17 = 1.0004 m > 5 % × 20 m = 1.0 m
    expect(inSI(a.result.problems[0].reason)).toBe(
      "head rises again to 18.0 m, 1.0004 m above the lowest head since the curve began to fall (17.0 m, line 3; its peak 20.0 m, line 2): 5.002 % of the first point's head (20.0 m), more than the 5 % allowed (1.00 m) — a pump curve rises at most once, from shut-off to one peak, then falls: a second rise is a mistyped value or a shifted row",
    ); // source: 1.0004 / 20 = 5.002 % (arithmetic); limit 0.05 × 20 m = 1 m (importer rule)
    expect(renderQuantities(a.result.problems[0].reason, UNIT_SYSTEMS.US)).toContain("3.282 ft above the lowest head"); // source: 1.0004 m / 0.3048 = 3.2822 ft (NIST SP 811 foot) against 3.2808 ft
  });
  it("flip at the slack: a rise within 1e-6 of the limit passes; one past it is refused and reads apart from the limit in SI and US units", () => {
    const parts = /, ([\d.]+) (?:m|ft) above .*: ([\d.]+) % of the first point's head .*allowed \(([\d.]+) (?:m|ft)\) — /;
    for (const first of [20, 19.96, 7.3, 123.4, 0.9, 3.05]) {
      const lowest = first * 0.8;
      const limit = RISE_FRACTION * first;
      for (const k of [0.99, 1.01, 1.5, 10, 1e3, 1e5]) {
        const head = lowest + limit * (1 + RISE_SLACK * k);
        const a = analyseCsv(csv(T, [`A,2900,0,${first}`, `A,2900,10,${lowest}`, `A,2900,20,${head}`, `A,2900,30,${lowest / 2}`]));
        const label = `first ${first} m, ${k} × the slack`;
        if (k < 1) {
          expect(a.result.problems, label).toEqual([]); // source: point-rules.ts (rise ≤ 5 % of the first head × (1 + RISE_SLACK))
          continue;
        }
        expect(codes(a), label).toEqual([[4, "head-rising", "error"]]); // source: same, past the slack
        for (const units of [UNIT_SYSTEMS.SI, UNIT_SYSTEMS.US]) {
          const m = parts.exec(renderQuantities(a.result.problems[0].reason, units));
          expect(m, label).not.toBeNull(); // source: the message's form (validate.ts)
          const [, rise, pct, lim] = m!;
          expect(rise, label).not.toBe(lim); // source: importer rule (a refused rise never reads as its limit)
          expect(Number(rise), label).toBeGreaterThan(Number(lim)); // source: same, and in the order of their values
          expect(Number(pct), label).toBeGreaterThan(5); // source: same, as a percentage of the first head
        }
      }
    }
  });
  it("a system curve (10 → 30 m, rising everywhere) is not a pump curve", () => {
    const rows = Array.from({ length: 21 }, (_, i) => `S,2900,${i * 5},${(10 + 0.05 * i * i).toFixed(2)}`);
    const a = analyseCsv(csv(T, rows));
    expect(a.result.curveSets[0].ok).toBe(false); // source: 30 − 10 m ≫ 0.5 m
  });
  it("a first head of 0 is named once; the next point is then the first", () => {
    const text = csv(T, ["A,2900,0,0", "A,2900,10,20", "A,2900,20,15", "A,2900,30,10"]);
    const a = analyseCsv(text);
    expect(codes(a)).toEqual([[2, "zero", "error"]]); // source: construction (one problem, at the first row)
    const drop = analyseCsv(text, { ...a.mapping, policy: "drop-points" });
    expect(drop.result.curveSets[0].ok).toBe(true); // source: drop-points keeps a curve with ≥ 3 good points
    expect(drop.result.curveSets[0].points.map((p) => p.head)).toEqual([20, 15, 10]); // source: construction
  });
});

describe("best efficiency per curve set after conversion: within 5–95 %", () => {
  const E = `${T},Eff`;
  const set = (head: string, effs: string[]) => analyseCsv(csv(head, effs.map((e, i) => `A,2900,${i * 10},${20 - i},${e}`)));
  it("flip: a best of 0.72 % is flagged (a fraction column read in percent); 0.72 as a fraction is not", () => {
    const pctHeader = set(`${T},Eff %`, ["0", "0.55", "0.72", "0.68"]);
    expect(codes(pctHeader)).toEqual([[4, "efficiency-implausible", "error"]]); // source: 0.72 % < 5 %, line of the best point
    expect(pctHeader.result.problems[0].reason).toContain("0.72 %");
    expect(pctHeader.result.problems[0].reason).toContain("fractions (0–1)");
    const fraction = set(E, ["0", "0.55", "0.72", "0.68"]);
    expect(fraction.result.problems).toEqual([]); // source: 72 %, within 5–95 %
    expect(fraction.result.curveSets[0].ok).toBe(true);
  });
  it("thresholds: 5 % and 95 % pass, 4.99 % and 95.01 % are flagged (percent and fraction columns)", () => {
    expect(set(`${T},Eff %`, ["0", "3", "5", "4"]).result.problems).toEqual([]); // source: BEST_EFFICIENCY.min = 5 %
    expect(codes(set(`${T},Eff %`, ["0", "3", "4.99", "4"]))).toEqual([[4, "efficiency-implausible", "error"]]); // source: 4.99 % < 5 %
    expect(set(`${T},Eff %`, ["0", "60", "95", "80"]).result.problems).toEqual([]); // source: BEST_EFFICIENCY.max = 95 %
    expect(codes(set(`${T},Eff %`, ["0", "60", "95.01", "80"]))).toEqual([[4, "efficiency-implausible", "error"]]); // source: 95.01 % > 95 %
    expect(set(`${T},Eff (-)`, ["0", "0.6", "0.95", "0.8"]).result.problems).toEqual([]); // source: 0.95 = 95 %
    expect(codes(set(`${T},Eff (-)`, ["0", "0.6", "0.9501", "0.8"]))).toEqual([[4, "efficiency-implausible", "error"]]); // source: 95.01 %
  });
  it("a percent column that never exceeds 1 (read as a fraction) is flagged above 95 %, asking about percent", () => {
    const a = set(E, ["0", "0.5", "0.9", "1.0"]);
    expect(a.mapping.columns[4].unit).toBe("fraction"); // source: every value ≤ 1
    expect(codes(a)).toEqual([[5, "efficiency-implausible", "error"]]); // source: 1.0 = 100 % > 95 %
    expect(a.result.problems[0].reason).toContain("in percent (0–100)");
  });
  it("one typo (1.6 among fractions) no longer reads the whole column in percent: only its row is flagged", () => {
    const text = csv(E, ["A,2900,0,20,0", "A,2900,10,19,0.55", "A,2900,20,17,0.72", "A,2900,30,14,0.68",
      "B,2900,0,20,0", "B,2900,10,19,0.55", "B,2900,20,17,1.6", "B,2900,30,14,0.68"]);
    const a = analyseCsv(text);
    expect(a.mapping.columns[4].unit).toBe("fraction"); // source: 5 values in (0, 1], one above 1.5
    expect(a.result.curveSets.map((c) => [c.key, c.ok])).toEqual([["A|2900|", true], ["B|2900|", false]]); // source: construction
    expect(Math.max(...a.result.curveSets[0].points.map((p) => p.efficiency ?? 0))).toBe(0.72); // source: A's column as written
  });
  it("a file with one model in fractions and one in percent: the minority curve is flagged, under either policy", () => {
    const text = csv(E, ["A,2900,0,20,0", "A,2900,10,19,0.55", "A,2900,20,17,0.72", "A,2900,30,14,0.68",
      "B,2900,0,20,0", "B,2900,10,19,55", "B,2900,20,17,72", "B,2900,30,14,68"]);
    const a = analyseCsv(text);
    expect(a.result.curveSets.map((c) => c.ok)).toEqual([false, true]); // source: a tie reads percent; A's best 0.72 % < 5 %
    expect(a.result.problems.map((p) => p.code)).toEqual(["efficiency-implausible"]);
    const drop = analyseCsv(text, { ...a.mapping, policy: "drop-points" });
    expect(drop.result.curveSets.map((c) => c.ok)).toEqual([false, true]); // source: the unit is wrong, not one point: the set stays out
  });
});

describe("numbers out of a double's range", () => {
  it("1e-400 and 0.000…01 past the range are refused, not read as 0 (as the form reader refuses them)", () => {
    for (const cell of ["1e-400", `0.${"0".repeat(400)}1`, "-1E-999"]) {
      const a = analyseCsv(csv(`${T},NPSHr m`, ["A,2900,0,20,1", "A,2900,10,19,1.1", `A,2900,20,17,${cell}`, "A,2900,30,14,3.1"]));
      expect(codes(a), cell).toEqual([[4, "not-a-number", "error"]]); // source: shared/decimal.ts rule (range)
      expect(a.result.problems[0].reason).toContain("out of range");
    }
  });
  it("0, 0.0 and 0e5 are still zero", () => {
    for (const cell of ["0", "0.0", "0e5"]) {
      const a = analyseCsv(csv(`${T},Eff %`, ["A,2900,0,20," + cell, "A,2900,10,19,50", "A,2900,20,17,70", "A,2900,30,14,65"]));
      expect(a.result.problems, cell).toEqual([]); // source: a written zero is zero (efficiency 0 at shutoff is allowed)
      expect(a.result.curveSets[0].points[0].efficiency).toBe(0);
    }
  });
});
