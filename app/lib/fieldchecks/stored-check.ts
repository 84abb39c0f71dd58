// A recorded field check's two stored documents read honestly (projects/stored-doc.ts): the readings as recorded
// (field_checks.readings_json: `{ readings, fields }`) and the result worked out when it was recorded
// (field_checks.result_json: `CheckResult`). Both are checked on every read against the parts that the check's page, the
// lists, the CSV, the chart and the tolerance cross read, with their types (finite numbers, the choices the form offers);
// not against the form's plausibility bounds — a record shows what was recorded. A check whose documents fail (edited in the
// database, cut off, not JSON) is never shown with numbers: the lists name it as unreadable, its page says so. Extra keys
// are allowed and kept: a document that passes is handed on as stored. Pure (no server module): the readers are in
// records.server.ts.
import * as v from "valibot";
import { problemsSummary, readStoredDoc, type DocProblem, type DocWords } from "../projects/stored-doc";
import type { CheckFields, Readings } from "./form";
import type { CheckResult } from "./result";

const num = v.pipe(v.number(), v.finite());
/** A number the check may not have had (JSON writes NaN as null too): null or a finite number. */
const numOrNull = v.nullable(num);
const str = v.string();
const obj = v.looseObject;
const fraction = v.pipe(num, v.minValue(0), v.maxValue(1));

const Gauge = obj({ pressure: num, reference: v.picklist(["gauge", "absolute"]), elevation: num, diameter: num, accuracy: numOrNull });
const Speed = v.variant("mode", [
  obj({ mode: v.literal("none") }),
  obj({ mode: v.literal("rpm"), rpm: num }),
  obj({ mode: v.literal("vfd"), hz: num, baseHz: num, baseRpm: num }),
]);
const Power = v.variant("mode", [
  obj({ mode: v.literal("none") }),
  obj({ mode: v.literal("input"), watts: num, motorEfficiency: numOrNull, readingAccuracy: v.optional(numOrNull) }),
  obj({ mode: v.literal("electrical"), volts: num, amps: num, powerFactor: num, phases: v.picklist([1, 3]), motorEfficiency: numOrNull, readingAccuracy: v.optional(numOrNull) }),
]);

/** field_checks.readings_json: the readings in SI and the form's fields as typed (an amendment starts from them). */
export const StoredReadingsSchema = obj({
  readings: obj({ suction: Gauge, discharge: Gauge, flow: numOrNull, flowAccuracy: numOrNull, speed: Speed, power: Power, temperatureC: num }),
  fields: v.record(str, str),
});

const Pt = obj({ flow: num, y: num });
/** The system curve's points: its design head is null where the system cannot be worked out (as frozen). */
const PtOrNull = obj({ flow: num, y: numOrNull });
const Engine = obj({
  tdh: num,
  velocityHead: obj({ suction: num, discharge: num }),
  flow: numOrNull,
  flowSource: v.picklist(["measured", "inferred-from-curve"]),
  curveHead: numOrNull,
  flowBand: v.nullable(obj({ low: numOrNull, high: numOrNull, headUncertainty: num })),
});

/** One of a grade's power or efficiency limits as judged (engine gradePower.ts). */
const Limit = obj({ measured: num, curve: numOrNull, deviation: numOrNull, allowed: fraction, pass: v.nullable(v.boolean()) });
const PowerCheck = obj({ power: v.nullable(Limit), efficiency: v.nullable(Limit), pass: v.nullable(v.boolean()) });
/**
 * The grade's power and efficiency limits (power-grade.ts): judged, or why not. `accuracy` and `within` (the power reading's
 * accuracy and a power within it meeting the limits) are optional: results recorded before the accuracy could be entered lack them.
 */
const PowerGrade = obj({
  notJudged: v.nullable(str),
  basis: v.nullable(obj({ input: num, motorEfficiency: num })),
  check: v.nullable(PowerCheck),
  accuracy: v.optional(v.nullable(fraction)),
  within: v.optional(v.nullable(obj({ shaft: num, check: PowerCheck }))),
});

/**
 * field_checks.result_json: the check as worked out when it was recorded (evaluate.ts), as its readers read it. The grade's
 * `powerAbove`/`efficiencyBelow` and `powerGrade` are optional: results recorded before power and efficiency were judged
 * lack them and still read (their page says power and efficiency were not judged).
 */
export const CheckResultSchema = obj({
  format: str,
  grade: obj({ id: str, flow: v.tuple([fraction, fraction]), head: v.tuple([fraction, fraction]), powerAbove: v.optional(fraction), efficiencyBelow: v.optional(fraction), source: str }),
  verdict: v.picklist(["pass", "marginal", "fail", "unknown"]),
  verdictText: str,
  message: str,
  engine: Engine,
  fluid: obj({ name: str, density: num }),
  speed: obj({ rated: numOrNull, design: numOrNull, measured: numOrNull, rescaled: v.boolean() }),
  gauges: obj({ suction: num, discharge: num, headUncertainty: num }),
  duty: v.nullable(obj({ flow: num, head: num })),
  delivered: obj({ flow: numOrNull, head: num }),
  deviation: obj({ curveFlow: numOrNull, curveHead: numOrNull, dutyFlow: numOrNull, dutyHead: numOrNull }),
  power: v.nullable(obj({ input: numOrNull, hydraulic: numOrNull, overall: numOrNull, shaft: numOrNull, pump: numOrNull, curve: numOrNull })),
  powerGrade: v.optional(PowerGrade),
  hints: v.array(str),
  warnings: v.array(str),
  chart: obj({
    selected: v.array(Pt), measured: v.array(Pt), selectedEff: v.array(Pt), measuredEff: v.array(Pt), system: v.nullable(v.array(PtOrNull)),
    flowMax: num, band: v.nullable(obj({ low: numOrNull, high: numOrNull })), selectedLabel: str, measuredLabel: str,
  }),
});

const percent = (key: string, x: number) => (["flowAccuracy", "motorEfficiency", "readingAccuracy"].includes(key) ? `${Number((x * 100).toPrecision(6))} %` : undefined);

const READINGS_WORDS: DocWords = {
  whole: "the stored readings",
  labels: {
    readings: "readings", fields: "form fields as typed", suction: "suction gauge", discharge: "discharge gauge", pressure: "pressure", reference: "reference (gauge or absolute)",
    elevation: "elevation", diameter: "pipe inner diameter", accuracy: "accuracy", flow: "flow", flowAccuracy: "flow meter accuracy", speed: "speed",
    mode: "how it was read", rpm: "speed", hz: "drive frequency", baseHz: "motor's base frequency", baseRpm: "motor's base speed", power: "power", watts: "input power",
    volts: "voltage", amps: "current", powerFactor: "power factor", phases: "phases", motorEfficiency: "motor efficiency", readingAccuracy: "power reading accuracy", temperatureC: "fluid temperature",
  },
  items: {},
  quantities: { pressure: "pressure", accuracy: "pressure", elevation: "length", diameter: "diameter", flow: "flow", watts: "power", temperatureC: "temperature" },
  number: percent,
};

const RESULT_WORDS: DocWords = {
  whole: "the stored result",
  labels: {
    format: "format", grade: "tolerance grade", id: "id", source: "source", verdict: "verdict", verdictText: "verdict in words", message: "message", engine: "check as worked out",
    tdh: "total dynamic head", velocityHead: "velocity heads", flow: "flow", flowSource: "flow source (measured or inferred)", curveHead: "curve head", flowBand: "flow band",
    low: "low end", high: "high end", headUncertainty: "head uncertainty", fluid: "fluid", name: "name", density: "density", speed: "speed", rated: "curve's rated speed",
    design: "design speed", measured: "measured", rescaled: "rescaled", gauges: "gauges as used", suction: "suction", discharge: "discharge", duty: "design duty",
    delivered: "delivered point", head: "head", deviation: "deviations", curveFlow: "flow from the curve", dutyFlow: "flow from the duty", dutyHead: "head from the duty",
    power: "power", input: "input power", hydraulic: "hydraulic power", overall: "overall efficiency", shaft: "shaft power", pump: "pump efficiency", curve: "the curve's value at the measured flow",
    powerAbove: "power allowance", efficiencyBelow: "efficiency allowance", powerGrade: "power and efficiency against the grade", notJudged: "why not judged",
    basis: "shaft power from", motorEfficiency: "motor efficiency", check: "judgement", accuracy: "power reading accuracy", within: "met within the power reading accuracy", efficiency: "efficiency", allowed: "allowance", pass: "met",
    hints: "hints", warnings: "notes on the working", chart: "chart", flowMax: "flow range", band: "flow band", selectedLabel: "label of the curve as selected", measuredLabel: "label of the curve compared",
  },
  items: {
    hints: "hint", warnings: "note", selected: "curve as selected, point", measured: "curve compared, point", selectedEff: "efficiency as selected, point",
    measuredEff: "efficiency compared, point", system: "system curve, point", flow: "flow tolerance, bound", head: "head tolerance, bound",
  },
  // No quantities: a key means different things here ("flow" is m³/s at the delivered point, a pair of fractions in the
  // grade), and the numbers the schema refuses are the grade's fractions: shown as stored.
  quantities: {},
};

export type StoredCheck = { ok: true; readings: Readings; fields: CheckFields; result: CheckResult } | { ok: false; problems: DocProblem[] };

/** A check's result problems named from the check: "result, delivered point, head". */
const underResult = (p: DocProblem): DocProblem =>
  p.keys.length ? { ...p, keys: ["result", ...p.keys], path: `result.${p.path}`, label: `result, ${p.label}` } : { ...p, keys: ["result"], path: "result" };

/**
 * Readings recorded before a blank accuracy was kept as null stored 0 for it (a perfect instrument, read back so): where
 * the form's field as typed is blank, such a 0 is read as not given. An entered 0 ("0" in its field) stays 0.
 */
function blanksNotGiven(r: Readings, fields: CheckFields): Readings {
  const blank = (key: string, x: number | null) => (x === 0 && (fields[key] ?? "").trim() === "" ? null : x);
  const gauge = (g: Readings["suction"], key: string) => ({ ...g, accuracy: blank(key, g.accuracy) });
  return { ...r, suction: gauge(r.suction, "sAccuracy"), discharge: gauge(r.discharge, "dAccuracy"), flowAccuracy: blank("flowAccuracy", r.flowAccuracy) };
}

/** A recorded check's readings and result as stored when both pass their schemas, else what is wrong with them (both, readings first). */
export function readStoredCheck(row: { readingsJson: string; resultJson: string }): StoredCheck {
  const readings = readStoredDoc(row.readingsJson, StoredReadingsSchema, READINGS_WORDS);
  const result = readStoredDoc(row.resultJson, CheckResultSchema, RESULT_WORDS);
  if (readings.ok && result.ok) {
    const stored = readings.raw as { readings: Readings; fields: CheckFields };
    return { ok: true, readings: blanksNotGiven(stored.readings, stored.fields), fields: stored.fields, result: result.raw as CheckResult };
  }
  return { ok: false, problems: [...(readings.ok ? [] : readings.problems), ...(result.ok ? [] : result.problems.map(underResult))] };
}

/**
 * A recorded check's readings alone (as `readStoredCheck` reads them), or null where they fail their schema: what a list
 * needs to judge them again today without reading the stored result.
 * @param readingsJson the check's stored readings and fields, as stored
 */
export function readStoredReadings(readingsJson: string): Readings | null {
  const readings = readStoredDoc(readingsJson, StoredReadingsSchema, READINGS_WORDS);
  if (!readings.ok) return null;
  const stored = readings.raw as { readings: Readings; fields: CheckFields };
  return blanksNotGiven(stored.readings, stored.fields);
}

/**
 * What a list says of a check whose stored record cannot be read, in place of its numbers and verdict: how many problems
 * and where ("2 problems: readings, suction gauge, pressure; result, delivered point, head").
 */
export function unreadableCheckText(c: { problems: readonly DocProblem[]; problemCount: number }): string {
  return `Its stored record cannot be read (${problemsSummary(c.problems, c.problemCount)}), so its numbers and verdict are not shown.`;
}
