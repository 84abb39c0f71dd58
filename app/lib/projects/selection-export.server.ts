// Selection exports: CSV (our own layout, documented in the header lines) and JSON (a documented shape: SELECTION_JSON_KEYS).
import type { FrozenSelection } from "./selections.server";
import { selectionCurrency } from "./stored-selection";
import { toCsv } from "../shared/csv";
import { cycleWarnings, lccRangeNoteOf, lccShown, missingSteps, missingStepsText, noStepCounted, pumpsRunningText, stepVerdict, stepWarnings } from "./energy";
import { csvFigureBasis, cycleFiguresBasis, powerColumn, pumpsBasis, STAGED_BASIS, type PumpsBasis } from "./power-basis";
import { cautionFigures } from "./selection-cautions";
import { verdictNpshNote } from "./verdict-npsh";
import { verdictStartNote } from "./verdict-start";
import { verdictMotorNote } from "./verdict-motor";
import { verdictStagedNpshNote } from "./verdict-staged-npsh";
import { MIN_FLOW_RULE, readMinFlowCheck, verdictMinFlowNote } from "./verdict-min-flow";
import { serviceFactorNote } from "./motor-service-factor";
import { inSI } from "~/engine/quantityText";
import { DEFAULT_FLOW_TOLERANCE, UNIT_SYSTEMS, unitLabel, type Quantity } from "~/engine";
import { ratioShown, resultRatiosShown } from "./npsh-ratio";

const row = (xs: unknown[]) => xs;

/** The caution every export of a selection carries (the report shows the same above and below its figures). */
export const SELECTION_CAUTION = "Figures are for design guidance; verify against the manufacturer's certified data, local codes and a licensed engineer.";

/**
 * The display units the texts of both exports are written in (verdict, reasons, rules, warnings, notes, messages: the
 * export route renders every quantity token with the SI preset, `inSI` / `renderDeep(…, SI_UNITS)`), named per quantity
 * from that preset, so the words cannot drift from what the texts hold: "flow m³/h, head m, pressure kPa, …".
 */
export const SELECTION_TEXT_UNITS = (Object.keys(UNIT_SYSTEMS.SI) as Quantity[])
  .map((q) => `${q.replace(/[A-Z]/g, (c) => ` ${c.toLowerCase()}`)} ${unitLabel(q, UNIT_SYSTEMS.SI[q])}`)
  .join(", ");

/**
 * The CSV's units line (a comment line of its header): its numbers in SI, each column's unit in its header name or, in
 * the figures and inputs sections, in the unit column; its texts in the SI preset's display units (`SELECTION_TEXT_UNITS`).
 */
export const SELECTION_CSV_UNITS_LINE =
  "# Units: numbers in SI, each column's unit in its header (m3s = m³/s, m, pa = Pa, w = W, kwh = kWh, h) or, in the figures and inputs sections, in the unit column " +
  "(1: a fraction or ratio; money in the currency named there). Texts (title, note, verdict, reasons, rules, warnings, notes and messages) " +
  `write quantities in the SI preset's display units: ${SELECTION_TEXT_UNITS}.`;

/**
 * The units of the JSON export, named for every kind of number it holds: SI base units, except where a key names its
 * unit; texts (verdict, reasons, warnings) rendered with the SI preset's display units, as the CSV's are.
 */
export const SELECTION_JSON_UNITS =
  "Numbers in SI: flow m3/s, head, lengths, diameters and roughness m, pressure Pa, power W, density kg/m3, dynamic viscosity Pa·s, " +
  "kinematic viscosity m2/s, velocity m/s; except where the key names its unit: temperatureC °C, …KWh kWh, tariffPerKWh per kWh, " +
  "hoursPerYear and hours h; speeds in rpm; efficiencies, ratios, fractions and tolerances as fractions of 1; money in `currency` " +
  "(selections frozen before it was kept: result.figures.motor.currency); times as ISO 8601 UTC. Texts (verdict, reasons, rules, warnings) are written in the SI preset's display units: " + `${SELECTION_TEXT_UNITS}.`;

/** The JSON export's own format (2: a documented shape; 1 spread the stored record, internal ids included). */
export const SELECTION_JSON_FORMAT = "dutymark-selection-export/2";

/**
 * Every key the JSON export has at its top level, and in its `project`, `system`, `pump` and `pump.library` (the parts
 * taken from the stored record key by key); nothing else is written there. The engine's sections (`system.input`,
 * `systemCurve`, `adjustment`, `result`, `energy`) are the frozen inputs and results as the report reads them.
 * Not exported: the record's internal ids (project, system, library, revision, curve set), who created it, workspaces.
 */
export const SELECTION_JSON_KEYS = {
  top: ["format", "reference", "title", "note", "createdAt", "frozenAt", "caution", "units", "verdict", "verdictNpsh", "verdictStart", "verdictMotor", "verdictStagedNpsh", "verdictMinFlow", "project", "system", "systemCurve", "pump", "adjustment", "result", "energy", "flowMax", "currency"],
  project: ["name"],
  system: ["name", "input"],
  pump: ["label", "model", "type", "size", "library", "speed", "impellerDiameter", "minFlow", "points"],
  library: ["name", "revision", "traced"],
} as const;

/**
 * The JSON export, a documented shape (`SELECTION_JSON_KEYS`): the report's reference (DM-00012), title, note and date, the
 * caution and the units it is in, the verdict as the report's headline reads it — `verdict` (absent where the selection
 * was frozen before verdicts existed; null where no duty point was set), and what NPSH, a staged start and the motor check
 * say against it (`verdictNpsh`, `verdictStart`, `verdictMotor`, as the CSV's `verdict_npsh`, `verdict_start` and
 * `verdict_motor`; null: nothing), and a duty below the maker's minimum flow (`verdictMinFlow`, the CSV's `verdict_min_flow`)
 * — then the frozen inputs and results (in SI, texts rendered in SI): the project's and
 * system's names, the system's inputs and curve, the pump as selected (its library by name and revision number, a traced
 * curve's source, `minFlow` the maker's minimum continuous flow in m³/s, null: none recorded), the adjustment, the result, the energy over the duty cycle and the currency. Selections frozen before a
 * part existed export without it (null), as the report reads them.
 */
export function selectionJson(s: { id: number; title: string; note: string; createdAt: Date }, frozen: FrozenSelection) {
  const verdict = frozen.result.verdict;
  const npsh = verdictNpshNote(verdict, frozen.result.npsh);
  const start = verdictStartNote(verdict, frozen.result.stagedStart);
  const motor = verdictMotorNote(verdict, frozen.result.figures);
  const stagedNpsh = verdictStagedNpshNote(verdict, frozen.energy?.cycle);
  const minFlow = verdictMinFlowNote(verdict, frozen.result.minFlow);
  const { pump, system } = frozen;
  const library = pump.library ?? {};
  return {
    format: SELECTION_JSON_FORMAT,
    reference: `DM-${String(s.id).padStart(5, "0")}`,
    title: s.title, note: s.note, createdAt: s.createdAt.toISOString(), frozenAt: frozen.frozenAt,
    caution: SELECTION_CAUTION,
    units: SELECTION_JSON_UNITS,
    verdict,
    verdictNpsh: npsh ? inSI(npsh) : null,
    verdictStart: start ? inSI(start) : null,
    verdictMotor: motor ? inSI(motor) : null,
    verdictStagedNpsh: stagedNpsh ? inSI(stagedNpsh) : null,
    verdictMinFlow: minFlow ? inSI(minFlow) : null,
    project: { name: frozen.project.name },
    system: { name: system.name, input: system.input },
    systemCurve: frozen.systemCurve,
    pump: {
      label: pump.label, model: pump.model, type: pump.type, size: pump.size,
      library: { name: library.name ?? null, revision: library.revision ?? null, traced: library.traced ?? null },
      speed: pump.speed, impellerDiameter: pump.impellerDiameter, minFlow: pump.minFlow ?? null, points: pump.points,
    },
    adjustment: frozen.adjustment,
    result: resultRatiosShown(frozen.result), // no NPSH margin ratio where NPSHa ≤ 0 (npsh-ratio.ts), as the CSV
    energy: frozen.energy ?? null,
    flowMax: frozen.flowMax,
    currency: selectionCurrency(frozen) || null,
  };
}
/**
 * A margin ratio NPSHa / NPSHr as the CSV writes it: blank where NPSHa ≤ 0 (m), where a ratio means nothing and NPSHa
 * decides (a cavitation risk whatever the pump), as every surface gives it (npsh-ratio.ts; a selection frozen before held one).
 */
const ratioCell = ratioShown;

/**
 * Sections, each with its own header row: system curve points, pump curve as used, the band's edges, NPSH at the design
 * point and the band's corners, the duty cycle step by step, the life-cycle cost year by year, and figures (the cycle's totals and life-cycle cost among them).
 * SI units named in every header; money in the workspace's currency, named in the unit column; a units line in the header
 * says so and names the display units the texts are written in (`SELECTION_CSV_UNITS_LINE`). Every caution the report
 * shows is a figure too (selection-cautions.ts), and a traced curve's source and caution a comment line under the guidance.
 * Pumps in parallel or series: a comment line says so, the curve, band and cycle power columns are named as the duty pumps'
 * together (`shaft_power_all_duty_pumps_w`), and the figures get a basis column (per pump, or the duty pumps together) with
 * one pump's shaft power and electrical input beside the totals (power-basis.ts). A single pump's layout is as it was.
 * The engineer's note is a comment line under the title; the system inputs it was judged on close the file (`inputs`).
 */
export function selectionCsv(id: number, title: string, f: FrozenSelection, note = ""): string {
  const lines: unknown[][] = [];
  lines.push(row(["# Dutymark selection export", `DM-${String(id).padStart(5, "0")}`, title]));
  // The engineer's note, on one line (its line breaks as " / "), as the report shows it under the title.
  if (note.trim()) lines.push(row([`# Note: ${note.trim().replace(/\s*\n\s*/g, " / ")}`]));
  lines.push(row([`# ${SELECTION_CAUTION}`]));
  const traced = f.pump.library.traced;
  if (traced) lines.push(row([`# Curve data ${traced.source}: ${traced.caution}`]));
  const basis = pumpsBasis(f.adjustment);
  const staged = !!f.energy?.cycle?.steps.some((s) => s.pumpsRunning != null);
  if (basis) lines.push(row([staged
    ? `# ${basis.arrangement}: pump curve and band are of the ${basis.together} (flows, heads and powers); the duty cycle of ${STAGED_BASIS} (pumps_running, staged by demand; standby pumps never run); figures name their basis`
    : `# ${basis.arrangement}: pump curve, band and duty cycle are of the ${basis.together} (flows, heads and powers); figures name their basis`]));
  lines.push(row(["# NPSHa: system_curve npsha_m through the aged suction pipe (the least over its life); figures npsh_available at the design point (nominal level, new pipe); the npsh section at each point's own level and pipe; npsh_margin_ratio blank where NPSHa <= 0 (no ratio to NPSHr means anything there: NPSHa is beside it)"]));
  lines.push(row([SELECTION_CSV_UNITS_LINE]));
  lines.push([]);
  const w = (name: string) => powerColumn(basis, name);
  lines.push(row(["section", "flow_m3s", "head_m", "head_low_m", "head_high_m", "pressure_pa", "npsha_m"]));
  const sc = f.systemCurve;
  if (sc) sc.flows.forEach((q, i) => lines.push(row(["system_curve", q, sc.design[i], sc.low[i], sc.high[i], sc.pressure[i], sc.npsha[i]?.y])));
  lines.push([]);
  lines.push(row(["section", "flow_m3s", "head_m", "efficiency", w("shaft_power_w"), "npshr_m"]));
  for (const p of f.result.curve) lines.push(row(["pump_curve", p.flow, p.head, p.efficiency, p.power, p.npshr]));
  lines.push([]);
  lines.push(row(["section", "edge", "flow_m3s", "head_m", "efficiency", w("shaft_power_w"), "npsh_margin_ratio", "no_operating_point_reason", "npsha_m"]));
  for (const b of f.result.band ?? []) lines.push(row(["band", b.edge, b.flow, b.head, b.efficiency, b.shaftPower, ratioCell(b.npshMarginRatio, b.npshAvailable), b.reason, b.npshAvailable]));
  const npshPoints = f.result.npsh?.judgedAt;
  if (npshPoints?.length) {
    // Every point NPSH was judged at: the design point and each corner of the band (selections frozen before the corners have none).
    lines.push([]);
    lines.push(row(["section", "at", "flow_m3s", "npsha_m", "npshr_m", "npsh_margin_ratio"]));
    for (const p of npshPoints) lines.push(row(["npsh", p.at, p.flow, p.available, p.required, ratioCell(p.marginRatio, p.available)]));
  }
  energySections(f, lines, basis);
  lines.push([]);
  lines.push(row(["section", "figure", "value", "unit", ...(basis ? ["basis"] : [])]));
  const fig = f.result.figures;
  const cycleWords = cycleFiguresBasis(basis, staged);
  const add = (name: string, value: unknown, unit: string) => lines.push(row(["figures", name, value, unit, ...(basis ? [csvFigureBasis(basis, cycleWords, name)] : [])]));
  add("operating_flow", f.result.operating?.flow, "m3/s");
  add("operating_head", f.result.operating?.head, "m");
  const verdict = f.result.verdict;
  add("verdict", verdict?.status ?? (f.result.verdict === undefined ? "not judged (selected before verdicts existed)" : "no duty point set"), "");
  // What NPSH over the band says against the verdict (a cavitation risk or a low margin), as on the report's verdict line.
  add("verdict_npsh", (() => { const n = verdictNpshNote(verdict, f.result.npsh); return n ? inSI(n) : null; })(), "");
  // What starting pumps in parallel one after another says against the verdict, as on the report's verdict line.
  add("verdict_start", (() => { const n = verdictStartNote(verdict, f.result.stagedStart); return n ? inSI(n) : null; })(), "");
  // What the motor check says against the verdict (overloaded at the operating point, or can overload), as on the report's verdict line.
  add("verdict_motor", (() => { const n = verdictMotorNote(verdict, f.result.figures); return n ? inSI(n) : null; })(), "");
  // What NPSH at a duty-cycle step with fewer pumps in parallel running says against the verdict (step, pumps running, NPSHa, NPSHr, rule).
  add("verdict_staged_npsh", (() => { const n = verdictStagedNpshNote(verdict, f.energy?.cycle); return n ? inSI(n) : null; })(), "");
  // A duty below the maker's minimum continuous flow (verdict-min-flow.ts), as on the report's verdict line, and its numbers.
  add("verdict_min_flow", (() => { const n = verdictMinFlowNote(verdict, f.result.minFlow); return n ? inSI(n) : null; })(), "");
  add("verdict_rule", verdict?.rule, "");
  (verdict?.reasons ?? []).forEach((r, i) => add(`verdict_reason_${i + 1}`, r, ""));
  add("verdict_edge", verdict?.edge, "");
  add("crossing_status", f.result.status, "");
  add("adjustment_method", f.adjustment.method, "");
  add("adjustment_ratio", f.result.ratio, "1");
  add("arrangement", `${f.adjustment.arrangement} x${f.adjustment.dutyPumps} (+${f.adjustment.standbyPumps} standby)`, "");
  add("efficiency", fig?.efficiency, "1");
  add("hydraulic_power", fig?.hydraulicPower, "W");
  add("shaft_power", fig?.shaftPower, "W");
  if (basis) add("shaft_power_per_pump", fig?.shaftPower != null ? fig.shaftPower / basis.n : null, "W");
  add("bep_ratio", fig?.bepRatio, "1");
  minFlowFigures(f, add);
  add("npsh_available", fig?.npshAvailable, "m");
  add("npsh_required", fig?.npshRequired, "m");
  add("npsh_margin_ratio", ratioCell(fig?.npshMarginRatio, fig?.npshAvailable), "1");
  // Over the design point and the band's corners (selections saved before this was judged have none; before the corners, the edges only).
  add("npsh_status_over_band", f.result.npsh?.status ?? null, "");
  add("npsh_lowest_margin_ratio", f.result.npsh?.marginRatio ?? null, "1");
  add("npsh_lowest_at", f.result.npsh?.at ?? null, "");
  add("npsh_available_at_lowest", f.result.npsh?.available ?? null, "m");
  add("npsh_rule", f.result.npsh?.rule ?? null, "");
  add("npsh_not_judged_at", f.result.npsh?.unjudged?.map((p) => `${p.at} (${p.why})`).join("; ") ?? null, "");
  add("max_power_on_curve", fig?.maxPower, "W");
  add("motor_non_overloading", fig?.nonOverloading, "");
  add("motor_overload_check", fig?.motorCheck ?? null, ""); // the verdict with its rule and numbers (absent in selections frozen before)
  // Above the rating, within rating × service factor at the operating point (a note, not an overload: motor-service-factor.ts).
  add("motor_service_factor_note", (() => { const n = serviceFactorNote(fig); return n ? inSI(n) : null; })(), "");
  add("motor_rating", fig?.motor?.rating ?? null, "W");
  add("motor_rating_source", fig?.motor?.ratingSource ?? null, "");
  add("motor_suggested", fig?.motor?.suggestedRating ?? null, "W");
  add("motor_suggestion_basis", fig?.motor?.suggestionBasis ?? null, "");
  add("motor_efficiency", fig?.motor?.efficiency ?? null, "1");
  add("motor_efficiency_source", fig?.motor?.efficiencySource ?? null, "");
  add("drive_efficiency", fig?.motor?.driveEfficiency ?? null, "1");
  add("electrical_input", fig?.motor?.electricalPower ?? null, "W");
  if (basis) add("electrical_input_per_pump", fig?.motor?.electricalPower != null ? fig.motor.electricalPower / basis.n : null, "W");
  add("annual_energy_electrical", fig?.annualEnergyKWh, "kWh");
  add("annual_cost", fig?.annualCost, currencyOf(f));
  // The hours annual_energy_electrical and annual_cost count at the operating point (the system's operating hours), not the duty cycle's.
  add("annual_cost_hours", fig?.motor?.hoursPerYear ?? f.system.input.hoursPerYear, "h/yr");
  add("library", f.pump.library.name, "");
  add("library_revision", f.pump.library.revision, "");
  add("model", f.pump.model, "");
  add("curve_data_source", traced ? `${traced.source}. ${traced.caution}` : traced === null ? "as imported (not traced)" : "not recorded (selected before traced curve data was marked)", "");
  for (const [name, value, unit] of cautionFigures(f)) add(name, value, unit);
  energyFigures(f, add);
  // The system inputs the selection was judged on, as the report's "System inputs" (the CSV carried none of them).
  lines.push([]);
  lines.push(row(["section", "input", "value", "unit"]));
  for (const [name, value, unit] of inputRows(f)) lines.push(row(["inputs", name, value, unit]));
  return toCsv(lines, { precision: 10 });
}

/** The system inputs of a frozen selection (SI), one row each: duty and its tolerance, levels, liquid, suction, operation. */
function inputRows(f: FrozenSelection): [string, unknown, string][] {
  const i = f.system.input;
  const fluid = f.systemCurve?.fluid;
  const tol = i.flowTolerance ?? DEFAULT_FLOW_TOLERANCE;
  return [
    ["duty_flow", i.duty?.flow ?? null, "m3/s"],
    ["duty_head", i.duty?.head ?? null, "m"],
    ["duty_flow_tolerance_minus", tol.minus, "1"],
    ["duty_flow_tolerance_plus", tol.plus, "1"],
    ["system_kind", i.mode, ""],
    ["static_head_low", i.staticLow, "m"],
    ["static_head_high", i.staticHigh, "m"],
    ["pressure_difference", i.pressureDifference, "Pa"],
    ["control_head", i.mode === "closed-loop" ? i.controlHead : null, "m"],
    ["liquid", i.fluid.kind === "custom" ? i.fluid.name || "custom liquid" : "water", ""],
    ["temperature", i.temperatureC, "degC"],
    ["density", fluid?.density ?? null, "kg/m3"],
    ["kinematic_viscosity", fluid?.kinematicViscosity ?? null, "m2/s"],
    ["suction_surface_pressure_abs", i.suctionSurfacePressure, "Pa"],
    ["suction_static_head", i.suctionStaticHead, "m"],
    ["npsh_margin_wanted", i.npshMargin, "1"],
    ["hours_per_year", i.hoursPerYear, "h/yr"],
    ["tariff_per_kwh", i.tariffPerKWh, `${currencyOf(f)}/kWh`],
    ["pipe_runs", i.runs.length, "count"],
  ];
}

/**
 * The duty cycle step by step (a step not met or not computed says so, with the engine's message; the engine's warnings
 * at the step they name) and the life-cycle cost year by year, as the report shows them. Nothing for a selection frozen
 * before load profiles, or whose cycle could not be computed (the figures say why).
 */
function energySections(f: FrozenSelection, lines: unknown[][], basis: PumpsBasis | null) {
  const cycle = f.energy?.cycle;
  if (cycle) {
    // Pumps in parallel staged by demand (engine dutyStaging.ts): the pumps running at each step ("1 of 2") and one pump's
    // shaft power beside the running pumps' together (cycles frozen before staging: as they were).
    const staged = cycle.steps.some((s) => s.pumpsRunning != null);
    const power = (name: string) => (staged ? name.replace(/_w$/, "_pumps_running_w") : powerColumn(basis, name));
    lines.push([]);
    lines.push(row([
      "section", "step", ...(staged ? ["pumps_running"] : []), "flow_fraction", "hours_h", "flow_m3s", "head_m", "status", "speed_ratio", "pump_efficiency", power("shaft_power_w"),
      ...(staged ? ["shaft_power_per_pump_w"] : []), "load_fraction", "motor_efficiency", "drive_efficiency", power("electrical_input_w"), "energy_kwh", "engine_status", "message", "warnings",
    ]));
    cycle.steps.forEach((st, i) =>
      lines.push(row([
        "duty_cycle", i + 1, ...(staged ? [pumpsRunningText(st)] : []), st.flowFraction, st.hours, st.flow, st.head, stepVerdict(st) || "met", st.speedRatio, st.efficiency, st.shaftPower,
        ...(staged ? [st.pumpShaftPower] : []), st.loadFraction, st.motorEfficiency, st.driveEfficiency, st.electricalPower, st.energyKWh, st.status, st.message, stepWarnings(cycle, i).join("; "),
      ])),
    );
  }
  const lcc = lccShown(f.energy);
  if (lcc) {
    const currency = currencyOf(f);
    lines.push([]);
    lines.push(row(["section", "year", `energy_cost_${currency}`, `present_value_${currency}`, `cumulative_present_value_${currency}`]));
    lcc.yearly.forEach((y, i) => lines.push(row(["life_cycle_cost", y.year, y.energyCost, y.presentValue, lcc.cumulative[i + 1]])));
  }
}

/**
 * The maker's minimum continuous flow: the figure as imported (blank: none recorded; "not recorded" for a selection frozen
 * before it was kept), one pump's minimum as run (× the speed or trim ratio), the duty per running pump, and the rule.
 */
function minFlowFigures(f: FrozenSelection, add: (name: string, value: unknown, unit: string) => void) {
  const c = readMinFlowCheck(f.result.minFlow);
  const kept = f.result.minFlow !== undefined;
  add("maker_min_flow", c ? c.published : kept ? null : "not recorded (selected before the maker's minimum flow was kept)", "m3/s");
  add("maker_min_flow_as_run", c?.atPump ?? null, "m3/s");
  add("duty_flow_per_running_pump", c?.dutyPerPump ?? null, "m3/s");
  add("min_flow_rule", c ? MIN_FLOW_RULE : null, "");
}

const currencyOf = (f: FrozenSelection) => selectionCurrency(f) || "currency";

/** The duty cycle's totals and the life-cycle cost as figures, with what is missing from them. */
function energyFigures(f: FrozenSelection, add: (name: string, value: unknown, unit: string) => void) {
  const e = f.energy;
  if (!e) {
    add("duty_cycle", "not frozen (selected before load profiles and life-cycle costs)", "");
    return;
  }
  const currency = currencyOf(f);
  add("cycle_control", e.controlLabel, "");
  add("cycle_profile", e.profileLabel, "");
  add("cycle_profile_source", e.profileSource, "");
  add("cycle_error", e.cycleError, "");
  e.assumptions.forEach((a, i) => add(`cycle_assumption_${i + 1}`, a, "")); // what the step figures rest on (affinity laws, part-load factors, drive)
  const c = e.cycle;
  if (c) {
    const { notMet, notComputed } = missingSteps(c);
    add("cycle_total_hours", c.totalHours, "h");
    add("cycle_annual_energy_electrical", noStepCounted(c) ? `not computed: ${noStepCounted(c)}` : c.annualEnergyKWh, "kWh");
    add("cycle_complete", c.complete, "");
    add("cycle_steps_not_met", notMet, "");
    add("cycle_steps_not_computed", notComputed, "");
    if (!c.complete) add("cycle_incomplete_note", `incomplete: ${missingStepsText(c)}; their energy is missing from the total, the energy cost and the life-cycle cost`, "");
    cycleWarnings(c).forEach((w, i) => add(`cycle_warning_${i + 1}`, w, ""));
  }
  add("cycle_energy_cost_per_year", c && noStepCounted(c) ? `not computed: ${noStepCounted(c)}` : e.annualCost, currency);
  if (c) add("cycle_energy_cost_hours", c.totalHours, "h/yr"); // the duty cycle's hours: not the operating point's (annual_cost_hours)
  add("cost_missing", e.costMissing ?? null, "");
  add("purchase_price", e.purchasePrice, currency);
  const lcc = lccShown(e);
  const none = noStepCounted(c);
  add("lcc_total_present_value", none ? `not computed: ${none}` : (lcc?.total ?? null), currency);
  // Beside the total: the priced steps outside the pump's allowable flow range, their flows and the rule (lcc-range-note.ts).
  add("lcc_range_note", lccRangeNoteOf(e), "");
  add("lcc_energy_present_value", lcc?.energyPresentValue ?? null, currency);
  add("lcc_years", lcc ? lcc.yearly.length : null, "years");
  // The rates the life-cycle cost rests on (fractions per year; blank where frozen before they were kept with it).
  add("lcc_tariff_escalation", lcc?.escalation ?? null, "1/year");
  add("lcc_discount_rate", lcc?.discountRate ?? null, "1/year");
  add("lcc_source", lcc?.source ?? null, "");
  (lcc?.warnings ?? []).forEach((w, i) => add(`lcc_warning_${i + 1}`, w.message, ""));
}
