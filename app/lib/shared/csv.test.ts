// One CSV writer for every export, with formula text neutralised (OWASP "CSV Injection": a cell
// starting with =, +, -, @, tab or CR is run by spreadsheets; common practice is a leading apostrophe).
import Papa from "papaparse";
import { expect, test } from "vitest";
import { toCsv } from "./csv";
import { selectionCsv } from "../projects/selection-export.server";
import { curvesToCsv, type LibraryCurveSet } from "../libraries";
import { frozenFixture } from "~/test/fieldcheck-fixture";

const EVIL = ["=HYPERLINK(\"http://evil.example\")", "+1+cmd|' /C calc'!A0", "-2+3", "@SUM(A1)", "\t=1", "=a\nb"];
const cells = (csv: string) => Papa.parse<string[]>(csv, { skipEmptyLines: true }).data.flat();

test("toCsv: formula text gets an apostrophe; numbers (negative too) stay numbers; quotes and newlines are quoted", () => {
  const csv = toCsv([[...EVIL, -1.5, 0, null, Number.NaN, 'say "hi"', "a,b"]]);
  const out = cells(csv);
  for (const e of EVIL) expect(out).toContain(`'${e}`);
  expect(out).toEqual(expect.arrayContaining(["-1.5", "0", "", 'say "hi"', "a,b"]));
  expect(out).not.toContain("=HYPERLINK(\"http://evil.example\")");
});

test("toCsv: text starting with apostrophes before = + - @ gets one more (the importer takes one off, text-cells.ts)", () => {
  expect(cells(toCsv([["'=X", "=X", "''+Y", "'plain", "''", "'-1"]]))).toEqual(["''=X", "'=X", "'''+Y", "'plain", "''", "''-1"]);
});

test("selection export: model, project and title starting with = + - @ are written as text", () => {
  const f = frozenFixture();
  const frozen = { ...f, pump: { ...f.pump, model: EVIL[0], library: { name: EVIL[3], revision: 1 } } };
  const out = cells(selectionCsv(7, EVIL[1], frozen as typeof f));
  expect(out).toContain(`'${EVIL[0]}`);
  expect(out).toContain(`'${EVIL[1]}`);
  expect(out).toContain(`'${EVIL[3]}`);
  expect(out.some((c) => /^[=+@]/.test(c))).toBe(false);
});

test("library export: model, type and size starting with = + - @ are written as text; numbers unchanged", () => {
  const set = { model: EVIL[0], type: EVIL[2], nominalSize: EVIL[3], speed: 2900, impellerDiameter: 0.2, points: [{ flow: 0.01, head: 30, efficiency: 0.7, power: 4000, npshr: 2 }] } as unknown as LibraryCurveSet;
  const csv = curvesToCsv([set]);
  expect(csv.split("\n")[1]).toBe(`"'=HYPERLINK(""http://evil.example"")","'-2+3","'@SUM(A1)",2900,200,36,30,70,4,2`);
});
