// The fast path (fast.ts) must give exactly what the full path gives, or step aside (null).
// Sources: fixtures/csv (hand-written, invented vendors), fixtures/demo generate.ts, make-big.ts.
import { describe, expect, it } from "vitest";
import { generateDemo } from "../../../fixtures/demo/generate";
import { makeBigCsv } from "../../../fixtures/csv/make-big";
import { analyseCsv } from "./index";
import { firstCurveSets } from "./packed";
import { fixture } from "./test-helpers";

const demo = generateDemo();
const DROOPING: [string, string[]][] = [
  ["a 4 % hump, then a clean curve", ["A,0,40", "A,36,41.6", "A,72,38", "A,108,30", "B,0,30", "B,36,29", "B,72,25"]],
  ["15 % above shut-off, then a clean curve", ["A,0,40", "A,18,44", "A,36,46", "A,54,45", "A,72,42", "A,108,34", "A,144,22", "B,0,30", "B,36,29", "B,72,25"]],
  ["a clean curve, then 15 % above shut-off at the file's end", ["B,0,30", "B,36,29", "B,72,25", "A,0,40", "A,18,44", "A,36,46", "A,54,45", "A,72,42", "A,108,34", "A,144,22"]],
  ["26 % above shut-off", ["A,0,40", "A,18,44", "A,36,50.4", "A,54,45", "A,72,42", "A,144,22"]],
  ["a second rise after falling", ["A,0,40", "A,18,46", "A,36,40", "A,54,42.5", "A,72,30", "A,90,20"]],
  ["rising along most of its length", ["A,0,30", "A,10,31", "A,20,32", "A,30,33", "A,40,34", "A,50,35"]],
];
const droopCsv = (rows: string[]) => ["model,speed_rpm,flow_m3h,head_m", ...rows.map((r) => r.replace(",", ",2900,"))].join("\n") + "\n";
const cases: [string, string][] = [
  ["fixtures/csv/long-si.csv", fixture("long-si.csv")],
  ["fixtures/csv/us-units.csv", fixture("us-units.csv")],
  ["fixtures/csv/semicolon-decimal-comma.csv", fixture("semicolon-decimal-comma.csv")],
  ["fixtures/csv/wide-by-speed.csv", fixture("wide-by-speed.csv")],
  ["fixtures/csv/bad.csv", fixture("bad.csv")],
  ["make-big 20 000 points", makeBigCsv({ points: 20_000 })],
  ...demo.flatMap((d) => d.files.map((f) => [`demo ${f.name}`, f.text] as [string, string])),
  // Drooping curves (point-rules.ts over engine headShape.ts; invented rows, m³/h and m): within the 5 % allowance (fast),
  // kept with a warning, and the errors the shape rule keeps — above 25 %, a second rise, rising along most of its length.
  ...DROOPING.map(([name, rows]) => [`drooping: ${name}`, droopCsv(rows)] as [string, string]),
];

describe("fast path and full path agree", () => {
  for (const [name, text] of cases)
    it(name, () => {
      const fast = analyseCsv(text);
      const full = analyseCsv(text, undefined, { fast: false });
      expect(full.fastPath).toBe(false);
      expect(fast.result).toEqual(full.result); // source: the full path (toLongRows + validateLongRows) is the reference
      expect(fast.mapping).toEqual(full.mapping);
      expect(fast.rows).toEqual(full.rows); // parsed on demand after the fast path
    });

  it("takes the fast path on clean long files and steps aside for anything else", () => {
    expect(analyseCsv(makeBigCsv({ points: 1_000 })).fastPath).toBe(true); // source: make-big writes clean long SI rows
    expect(analyseCsv(demo[0].files.find((f) => f.variant === "clean")!.text).fastPath).toBe(true); // source: FORMAT.md clean file
    expect(analyseCsv(demo[0].files.find((f) => f.variant === "semicolon")!.text).fastPath).toBe(true); // source: decimal comma, long layout
    expect(analyseCsv(fixture("bad.csv")).fastPath).toBe(false); // source: bad.csv has one fault of each kind
    expect(analyseCsv(demo[0].files.find((f) => f.variant === "wide")!.text).fastPath).toBe(false); // source: wide layout is not handled by fast.ts
    expect(analyseCsv(droopCsv(DROOPING[0][1])).fastPath).toBe(true); // source: a 4 % hump is within the 5 % rounding allowance, no message
    for (const [name, rows] of DROOPING.slice(1)) expect(analyseCsv(droopCsv(rows)).fastPath, name).toBe(false); // source: each needs a message (warning or error)
  });

  it("firstCurveSets: the first n curve sets of either path, equal to the whole list's (a preview of a fast-path result builds only those)", () => {
    const text = makeBigCsv({ points: 2_000 });
    for (const a of [analyseCsv(text), analyseCsv(text, undefined, { fast: false })]) {
      const first = firstCurveSets(a.result, 3);
      expect(first).toHaveLength(3);
      expect(first).toEqual(a.result.curveSets.slice(0, 3)); // source: definition (the list's own first three)
      expect(firstCurveSets(a.result, 10_000)).toEqual(a.result.curveSets); // source: definition (n past the end: all)
    }
  });

  it("one bad cell at the end of a big file sends it down the full path, which names it", () => {
    const text = makeBigCsv({ points: 2_000 }).replace(/\n([^\n]*)\n$/, (_, last: string) => `\n${last.replace(/,[^,]*$/, ",n/a")}\n`);
    const a = analyseCsv(text);
    expect(a.fastPath).toBe(false);
    expect(a.result.problems.map((p) => [p.row, p.code])).toEqual([[2001, "not-a-number"]]); // source: construction (header line 1, last point on line 2001)
  });
});
