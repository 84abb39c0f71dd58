// A recorded check's stored documents read against their schemas (stored-check.ts): everything the app records reads back
// as stored (a sweep of fixtures × readings × grades through the real evaluation and JSON), and a damaged document is named
// in plain words — where, what, the value stored — never read as numbers. Check values: our product rules (stored-check.ts,
// stored-doc.ts); the fixture's straight-line curve is invented (app/test/fieldcheck-fixture.ts).
import { describe, expect, test } from "vitest";
import { fluidAt, TOLERANCE_GRADES } from "~/engine";
import { DEFAULT_ADJUSTMENT, evaluateSystem } from "~/lib/projects/hydraulics";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";
import { evaluateCheck, gradeRule, parseCheckFields, powerGradeSentences, type CheckFields, type Readings } from "./index";
import { readStoredCheck, unreadableCheckText } from "./stored-check";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const read = (fields: Record<string, string>) => {
  const r = parseCheckFields(fields, { kind: "water" });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r;
};
const stored = (readings: Readings, fields: CheckFields, result: unknown) => ({ readingsJson: JSON.stringify({ readings, fields }), resultJson: JSON.stringify(result) });

test("every check the app works out reads back as stored (4 selections × 11 readings × 2B, and one reading × every grade)", () => {
  const base = frozenFixture();
  const withSystem = { ...base, systemCurve: evaluateSystem(base.system.input, { flowMax: 0.03, points: 41 }) };
  const selections = [
    ["no system curve", base],
    ["with its system curve (chart.system)", withSystem],
    ["no rated speed", frozenFixture({ speed: null })],
    ["2 in parallel", frozenFixture({ adjustment: { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2 } })],
  ] as const;
  // Heads on the fixture's curve H = 40 − 1000·Q (invented): 28 m at 0.012 m³/s is on it; 40 m at 0.012 is far above; 60 m is above shut-off.
  const readings: [string, Record<string, string>][] = [
    ["flow meter, on the curve", fieldsForHead(28, RHO20, { flow: "0.012" })],
    ["flow meter, far off", fieldsForHead(40, RHO20, { flow: "0.012" })],
    ["flow meter with accuracies", fieldsForHead(28.5, RHO20, { flow: "0.012", flowAccuracy: "2", sAccuracy: "1", dAccuracy: "1" })],
    ["no flow meter (inferred, with a band)", fieldsForHead(28, RHO20, { sAccuracy: "2", dAccuracy: "2" })],
    ["no flow meter, above shut-off (off the curve)", fieldsForHead(60, RHO20)],
    ["no speed", fieldsForHead(28, RHO20, { flow: "0.012", rpm: "" })],
    ["drive frequency", fieldsForHead(28, RHO20, { flow: "0.012", speedMode: "vfd", hz: "45", baseHz: "50", baseRpm: "2900", rpm: "" })],
    ["input power with motor efficiency", fieldsForHead(28, RHO20, { flow: "0.012", powerMode: "input", power: "5", motorEfficiency: "90" })],
    ["three-phase electrical power", fieldsForHead(28, RHO20, { flow: "0.012", powerMode: "electrical", volts: "400", amps: "10", powerFactor: "0.85", phases: "3" })],
    ["single-phase electrical power", fieldsForHead(28, RHO20, { powerMode: "electrical", volts: "230", amps: "4", powerFactor: "0.9", phases: "1", motorEfficiency: "80" })],
    ["one gauge absolute", fieldsForHead(28, RHO20, { flow: "0.012", sRef: "absolute", sPressure: "101.325" })],
  ];
  let n = 0;
  for (const [name, f] of selections) {
    for (const [what, fields] of readings) {
      const r = read(fields);
      const result = evaluateCheck(f, r.readings, "2B");
      const got = readStoredCheck(stored(r.readings, r.fields, result));
      expect(got.ok ? [] : got.problems, `${name}: ${what}`).toEqual([]);
      if (got.ok) expect(got.result, `${name}: ${what}`).toEqual(JSON.parse(JSON.stringify(result))); // handed on as stored
      n++;
    }
  }
  const r = read(fieldsForHead(28, RHO20, { flow: "0.012" }));
  for (const g of TOLERANCE_GRADES) {
    const got = readStoredCheck(stored(r.readings, r.fields, evaluateCheck(withSystem, r.readings, g.id)));
    expect(got.ok ? [] : got.problems, g.id).toEqual([]);
    n++;
  }
  expect(n).toBe(selections.length * readings.length + TOLERANCE_GRADES.length);
});

test("a result stored before power and efficiency were judged (no grade allowances, no powerGrade) still reads, and says they were not judged", () => {
  // The shape recorded before this change: grade { id, flow, head, source } and no powerGrade (rule: stored-check.ts, optional keys).
  const r = read(fieldsForHead(28, RHO20, { flow: "0.012", powerMode: "input", power: "5", motorEfficiency: "90" }));
  const now = evaluateCheck(frozenFixture(), r.readings, "2B");
  expect(now.powerGrade?.check).not.toBeNull(); // control: this check judges power now
  const { powerGrade: _pg, ...rest } = now;
  const old = { ...rest, grade: { id: now.grade.id, flow: now.grade.flow, head: now.grade.head, source: now.grade.source } };
  const got = readStoredCheck(stored(r.readings, r.fields, old));
  expect(got.ok ? [] : got.problems).toEqual([]);
  if (!got.ok) return;
  expect(got.result.powerGrade).toBeUndefined();
  expect(powerGradeSentences(got.result)).toEqual([
    "Power and efficiency were not judged against grade 2B: this check was recorded before a grade's power and efficiency limits were judged, so its verdict is on flow and head only.",
  ]);
  expect(gradeRule(got.result.grade, { withSource: false })).toBe("2B: flow −8/+8 %, head −5/+5 %"); // ISO 9906:2012 2B from memory (TOLERANCE_GRADES)
  // A damaged judgement is named like any other part (rule: stored-check.ts PowerGrade).
  const bad = readStoredCheck(stored(r.readings, r.fields, { ...now, powerGrade: { ...now.powerGrade, check: { ...now.powerGrade!.check, pass: "yes" } } }));
  expect(bad.ok ? [] : bad.problems.map((p) => p.label)).toEqual(["result, power and efficiency against the grade, judgement, met"]);
});

describe("a damaged stored check is named, never read as numbers", () => {
  const r = read(fieldsForHead(28, RHO20, { flow: "0.012" }));
  const result = evaluateCheck(frozenFixture(), r.readings, "2B");
  const sound = stored(r.readings, r.fields, result);
  const problemsOf = (row: { readingsJson: string; resultJson: string }) => {
    const got = readStoredCheck(row);
    expect(got.ok).toBe(false);
    return got.ok ? [] : got.problems;
  };

  test("control: the sound record reads", () => {
    expect(readStoredCheck(sound).ok).toBe(true);
  });

  test("a result cut off: not JSON, named as the stored result (rule: stored-doc.ts)", () => {
    const [p, ...rest] = problemsOf({ ...sound, resultJson: sound.resultJson.slice(0, 200) });
    expect(rest).toEqual([]);
    expect(p).toMatchObject({ path: "result", label: "the stored result", stored: null });
    expect(p.message).toMatch(/^Is not valid JSON, so none of its values can be read/);
  });

  test("a reading as text: where, what, and the value stored (rule: stored-check.ts readings schema)", () => {
    const readings = { ...r.readings, suction: { ...r.readings.suction, pressure: "350 kPa" } };
    expect(problemsOf({ ...sound, readingsJson: JSON.stringify({ readings, fields: r.fields }) })).toEqual([
      { keys: ["readings", "suction", "pressure"], path: "readings.suction.pressure", label: "readings, suction gauge, pressure", message: "Should be a number.", stored: '"350 kPa"' },
    ]);
  });

  test("a choice the form never offers, and a part of the result missing, both listed (readings first)", () => {
    const readings = { ...r.readings, speed: { mode: "turbo" } };
    const { delivered: _d, ...noDelivered } = result;
    const problems = problemsOf({ readingsJson: JSON.stringify({ readings, fields: r.fields }), resultJson: JSON.stringify(noDelivered) });
    expect(problems.map((p) => [p.label, p.message, p.stored])).toEqual([
      ["readings, speed, how it was read", 'Should be one of "none", "rpm", "vfd".', '"turbo"'],
      ["result, delivered point", "Missing from the stored document.", null],
    ]);
    expect(unreadableCheckText({ problems, problemCount: problems.length })).toBe(
      "Its stored record cannot be read (2 problems: readings, speed, how it was read; result, delivered point), so its numbers and verdict are not shown.",
    );
  });

  test("a tolerance bound out of range, and a bound pair stored as one number: plain numbers (fractions, not flows) — rule: a grade's bounds are fractions from 0 to 1", () => {
    const bound = problemsOf({ ...sound, resultJson: JSON.stringify({ ...result, grade: { ...result.grade, flow: [0.08, 8] } }) });
    expect(bound.map((p) => [p.label, p.message, p.stored])).toEqual([["result, tolerance grade, flow tolerance, bound 2", "Should be at most 1.", "8"]]);
    const pair = problemsOf({ ...sound, resultJson: JSON.stringify({ ...result, grade: { ...result.grade, head: 0.05 } }) });
    expect(pair.map((p) => [p.label, p.message, p.stored])).toEqual([["result, tolerance grade, head", "Should be a list.", "0.05"]]);
  });

  test("a head written as null (JSON's NaN or Infinity) is not a number", () => {
    const [p, ...rest] = problemsOf({ ...sound, resultJson: JSON.stringify({ ...result, delivered: { ...result.delivered, head: -Infinity } }) });
    expect(rest).toEqual([]);
    expect([p.label, p.message, p.stored]).toEqual(["result, delivered point, head", "Should be a number.", "empty (null)"]);
  });
});
