// The fast path (fast.ts) must give exactly what the full path gives, or step aside (null).
// Sources: fixtures/csv (hand-written, invented vendors), fixtures/demo generate.ts, make-big.ts.
import { describe, expect, it } from "vitest";
import { generateDemo } from "../../../fixtures/demo/generate";
import { makeBigCsv } from "../../../fixtures/csv/make-big";
import { analyseCsv } from "./index";
import { firstCurveSets } from "./packed";
import { fixture } from "./test-helpers";

const demo = generateDemo();
const cases: [string, string][] = [
  ["fixtures/csv/long-si.csv", fixture("long-si.csv")],
  ["fixtures/csv/us-units.csv", fixture("us-units.csv")],
  ["fixtures/csv/semicolon-decimal-comma.csv", fixture("semicolon-decimal-comma.csv")],
  ["fixtures/csv/wide-by-speed.csv", fixture("wide-by-speed.csv")],
  ["fixtures/csv/bad.csv", fixture("bad.csv")],
  ["make-big 20 000 points", makeBigCsv({ points: 20_000 })],
  ...demo.flatMap((d) => d.files.map((f) => [`demo ${f.name}`, f.text] as [string, string])),
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
