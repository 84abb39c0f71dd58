// The history of a selection's field checks as CSV (SI units in every header; the notes in the app's SI display units,
// which the header names), through the one CSV writer. Pure: takes what `checkHistory` returns.
import { toCsv } from "../shared/csv";
import { problemLine, type DocProblem } from "../projects/stored-doc";
import type { Readings, Verdict } from "./form";
import { powerGradeState, powerLimitStates } from "./power-grade";
import { verdictNote, type CheckResult } from "./result";
import { inSI } from "~/engine/quantityText";
import { UNIT_SYSTEMS, unitLabel, type Quantity } from "~/engine";
import type { CheckTimes } from "./taken-at";

type CheckBase = { id: number; chainId: number; version: number; superseded: boolean; createdAt: string; times: CheckTimes; byName: string; byWorkspace: string; verdict: Verdict; grade: string; notes: string; /** Today's verdict on the readings where it differs from the stored one (judged-today.ts); null or missing where not. */ verdictToday?: Verdict | null; /** Today's verdict's rule and numbers where it differs (quantity tokens); null or missing where not. */ verdictTodayRule?: string | null };

/** What `checkHistory` (records.server.ts) answers, as far as the CSV reads it. */
export type CheckHistoryForCsv = {
  selection: { id: number; title: string; projectName: string };
  checks: (CheckBase & ({ readable: true; result: CheckResult; readings: Readings } | { readable: false; problems: DocProblem[]; problemCount: number }))[];
};

/**
 * How each row's verdict follows from its columns (evaluate.ts `verdictFor`; cross.ts; ISO 9906:2012 6.4.2, from memory), so a
 * row reads on its own: a pass with head −6 % beside flow +4 % under grade 2B is the flow arm met, not an error.
 */
const VERDICT_RULE =
  "# verdict: pass when either arm of the grade's tolerance cross is met at the delivered point (ISO 9906:2012, from memory) — " +
  "head_dev_from_curve from −head_allowed_below to +head_allowed_above (the curve's head at the measured flow), or " +
  "flow_dev_from_curve from −flow_allowed_below to +flow_allowed_above (the curve's flow at the measured head); all fractions. " +
  "marginal: missed as read but met within the readings' uncertainty (flow meter accuracy, gauge head uncertainty), or a power or efficiency limit " +
  "missed as read (power_dev_from_curve above power_allowed_above, or efficiency_dev_from_curve below −efficiency_allowed_below) but met within power_accuracy " +
  "(power_limits \"met within accuracy\", power_limits_within_accuracy met: met at the lowest power within it, reading × (1 − power_accuracy)), " +
  "only while power_accuracy is no wider than the allowance of each limit missed as read (power_allowed_above for power; for efficiency power_accuracy/(1 − power_accuracy), the efficiency's upward uncertainty, against efficiency_allowed_below: 0 for 1E and 1U, so an efficiency shortfall as read is never marginal there); wider, unknown. " +
  "fail: missed, or a power or efficiency limit missed as read with no power_accuracy given (blank) or missed beyond it (power_limits_within_accuracy not met). " +
  "power_limit and efficiency_limit: each limit on its own, whatever the verdict (met, met within accuracy, not met; blank where not judged). " +
  "unknown: no flow meter, so flow and head are not judged; or, with one, verdict_note says why (the measured speed outside the range the curve may be translated in, " +
  "a liquid with no curve to hold the pump to, a suction reading at or below the liquid's vapour pressure (misread, or the pump cavitating), the readings' uncertainty wider than the grade's tolerance (head, flow, or power_accuracy as above), a measured flow outside the flows the curve is published for that the grade's flow arm does not reach, " +
  "or one whose flow arm reaches them at a measured head the published curve does not state, so that neither arm can be read as read). " +
  "A flow outside the published flows whose flow arm reaches them is judged on that part of the curve only, and verdict_note says so. " +
  "verdict is the one recorded, kept as recorded; verdict_today is what the row's own readings give under today's rules where that differs (a rule changed since it was recorded; amending records it), blank where they agree or cannot be judged today; verdict_today_rule (the last column) is today's rule with its numbers (the tolerance cross's arms, the point within the readings' uncertainty, the power limits, or why no verdict) where verdict_today is given.";

/** The quantities a note may carry (verdict-note words: flows, heads, pressures, power, temperature, speed). */
const NOTE_QUANTITIES: readonly Quantity[] = ["flow", "head", "pressure", "power", "temperature", "speed"];

/**
 * What the header says of units: the columns in SI named in each header, and the notes (`verdict_note`) in the app's SI
 * display units (`inSI`: m³/h, kPa, kW…), named from the preset they are rendered with, so the line cannot drift from them.
 */
export const UNITS_LINE = `# Columns in SI units, each named in its header (m3s = m³/s, m, pa = Pa, w = W, c = °C; deviations, allowances and efficiencies as fractions). verdict_note writes quantities in the app's SI display units: ${NOTE_QUANTITIES.map((q) => `${q} ${unitLabel(q, UNIT_SYSTEMS.SI[q])}`).join(", ")}.`;

/**
 * One row per check (oldest taken first, as `checksOf` orders them, reversed) after three comment lines naming the selection, the cautions and the verdict rule. A check whose stored
 * record cannot be read has no row (no blank numbers a spreadsheet would sum as zeros): a comment line above the header
 * names it — id, version, date, who — and says what is wrong.
 */
export function historyCsv(h: CheckHistoryForCsv): string {
  const unreadable = [...h.checks].reverse().flatMap((c) => {
    if (c.readable) return [];
    const n = c.problemCount;
    const more = n > c.problems.length ? `; and ${n - c.problems.length} more` : "";
    return [[`# check ${c.id} (chain ${c.chainId}, version ${c.version}, recorded ${c.createdAt} by ${c.byName || "a former member"}, ${c.byWorkspace}) cannot be read, so it has no row below: ${n} problem${n === 1 ? "" : "s"} in its stored record — ${c.problems.map(problemLine).join("; ")}${more}`]];
  });
  const lines: unknown[][] = [
    ["# Dutymark field checks", `selection ${h.selection.id}`, h.selection.title, h.selection.projectName],
    [`${UNITS_LINE} Pressurised systems, rotating equipment and electrical work are for qualified people; follow site rules, local codes and licensed practice.`],
    [VERDICT_RULE],
    ...unreadable,
    [
      "check_id", "chain_id", "version", "superseded", "recorded_at", "taken_at_device_clock", "device_clock_flags", "recorded_by", "workspace", "verdict", "verdict_today", "verdict_note", "grade", "flow_source",
      "flow_m3s", "flow_band_low_m3s", "flow_band_high_m3s", "tdh_m", "curve_head_m", "head_dev_from_curve", "flow_dev_from_curve",
      "head_allowed_below", "head_allowed_above", "flow_allowed_below", "flow_allowed_above",
      "duty_flow_m3s", "duty_head_m", "flow_dev_from_duty", "head_dev_from_duty", "speed_rpm", "input_power_w", "overall_efficiency",
      "suction_pa_as_read", "suction_reference", "discharge_pa_as_read", "discharge_reference",
      "suction_pa_gauge", "discharge_pa_gauge", "temperature_c", "suction_accuracy_pa", "discharge_accuracy_pa", "flow_accuracy",
      "power_limits", "shaft_power_w", "power_dev_from_curve", "power_allowed_above", "pump_efficiency", "efficiency_dev_from_curve", "efficiency_allowed_below",
      "power_accuracy", "power_limits_within_accuracy", "power_limit", "efficiency_limit", "notes", "verdict_today_rule",
    ],
  ];
  for (const c of [...h.checks].reverse()) {
    if (!c.readable) continue;
    const r = c.result;
    lines.push([
        c.id, c.chainId, c.version, c.superseded ? "yes" : "no", c.createdAt, c.times.takenAt, c.times.warnings.join(" "), c.byName, c.byWorkspace, c.verdict, c.verdictToday ?? "", verdictNote(r) === null ? "" : inSI(verdictNote(r)!), c.grade, r.engine.flowSource,
        r.delivered.flow, r.engine.flowBand?.low, r.engine.flowBand?.high, r.delivered.head, r.engine.curveHead, r.deviation.curveHead, r.deviation.curveFlow,
        r.grade.head[0], r.grade.head[1], r.grade.flow[0], r.grade.flow[1],
        r.duty?.flow, r.duty?.head, r.deviation.dutyFlow, r.deviation.dutyHead, r.speed.measured, r.power?.input, r.power?.overall,
        c.readings.suction.pressure, c.readings.suction.reference, c.readings.discharge.pressure, c.readings.discharge.reference,
        r.gauges.suction, r.gauges.discharge, c.readings.temperatureC,
        // The instruments' accuracies as entered (± Pa, ± fraction of the reading); blank where not given — never 0, a perfect one.
        c.readings.suction.accuracy, c.readings.discharge.accuracy, c.readings.flowAccuracy, ...powerColumns(r), ...accuracyColumns(c.readings, r), ...limitColumns(r), c.notes,
        // Free text last, after the notes: today's rule with its numbers where verdict_today is given.
        c.verdictTodayRule ? inSI(c.verdictTodayRule) : "",
    ]);
  }
  return toCsv(lines, { precision: 8 });
}

/**
 * The grade's power and efficiency limits as judged (power-grade.ts), in agreement with the verdict: "met" (as read),
 * "met within accuracy" (missed as read but met at the lowest power within the reading's accuracy: the check is marginal),
 * "not met" or "not judged" (a check recorded before they were judged reads "not judged" too), then shaft power (W), its deviation from the curve and the
 * allowance, the pump's efficiency, its deviation and the allowance (fractions); blank where not judged.
 */
function powerColumns(r: CheckResult): unknown[] {
  const c = r.powerGrade?.check ?? null;
  if (!c || c.pass === null) return ["not judged", null, null, null, null, null, null];
  const state = powerGradeState(r.powerGrade);
  return [state === "met" ? "met" : state === "within" ? "met within accuracy" : "not met", c.power?.measured, c.power?.deviation, c.power?.allowed, c.efficiency?.measured, c.efficiency?.deviation, c.efficiency?.allowed];
}

/**
 * The power reading's accuracy as entered (± fraction of the reading; blank when none was given, or no power was recorded),
 * and whether the grade's power and efficiency limits are met within it: "met" (as read, or at a lower power within it) or
 * "not met"; blank when no accuracy was given or the limits were not judged.
 */
function accuracyColumns(readings: Readings, r: CheckResult): unknown[] {
  const a = readings.power.mode === "none" ? null : (readings.power.readingAccuracy ?? null);
  const state = r.powerGrade?.accuracy != null ? powerGradeState(r.powerGrade) : null;
  return [a, state === null ? null : state === "missed" ? "not met" : "met"];
}

/**
 * Each limit on its own (power-grade.ts `powerLimitStates`), whatever the verdict: "met" (as read), "met within accuracy" (met at
 * the lowest power within the reading's accuracy — also in a row that fails on the other limit or on flow and head), "not met";
 * blank where that limit was not judged.
 */
function limitColumns(r: CheckResult): unknown[] {
  const words = { met: "met", within: "met within accuracy", missed: "not met" } as const;
  const s = powerLimitStates(r.powerGrade);
  return [s.power && words[s.power], s.efficiency && words[s.efficiency]];
}
