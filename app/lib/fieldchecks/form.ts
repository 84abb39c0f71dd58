// The field-check form: what the contractor types (any unit) ⇄ readings in SI. Pure: no
// database, no React; the server validates with it and the record page prefills amendments from it.
// Units convert here, at the edge; everything after this works in SI (Pa, m, m³/s, W, rpm, °C).
import { fluidTemperatureRangeC, fromSI, STANDARD_ATMOSPHERE, toSI, unitLabel, type Quantity, type ToleranceGrade } from "~/engine";
import { boundInward, fmtPctLimit } from "~/engine/quantityText";
import { decimalField, MAX_MAGNITUDE } from "../shared/decimal";
import { groupThousands, numberAsTyped } from "../shared/format";
import type { UnitChoice } from "../shared/units";

export type GaugeRef = "gauge" | "absolute";

/** The grade preselected on the form (ISO 9906 grade 2B, a common acceptance grade for site work — common practice). */
export const DEFAULT_GRADE = "2B";
export type Verdict = "pass" | "marginal" | "fail" | "unknown";

/**
 * A grade's rule in words, e.g. "2B: flow −8/+8 %, head −5/+5 %, power ≤ +8 %, efficiency ≥ −5 % of the curve's (ISO 9906:2012 …)";
 * `withSource: false` leaves the source off (the form's select). A grade stored before its power and efficiency limits were
 * judged has none, and its rule names flow and head only.
 */
export function gradeRule(g: Pick<ToleranceGrade, "id" | "flow" | "head" | "powerAbove" | "efficiencyBelow" | "source">, { withSource = true } = {}): string {
  const pct = (x: number) => fmtPctLimit(x).replace(" %", ""); // a limit as typed (2.5, not 3), the unit once at the end
  const power = g.powerAbove !== undefined ? `, power ≤ +${pct(g.powerAbove)} %` : "";
  const eff = g.efficiencyBelow === undefined ? "" : g.efficiencyBelow === 0 ? ", efficiency ≥ the curve's" : `, efficiency ≥ −${pct(g.efficiencyBelow)} % of the curve's`;
  return `${g.id}: flow −${pct(g.flow[0])}/+${pct(g.flow[1])} %, head −${pct(g.head[0])}/+${pct(g.head[1])} %${power}${eff}${withSource ? ` (${g.source})` : ""}`;
}

/** Words for the verdicts, the same on the form, the record, the list, the CSV and the e-mail. */
export const VERDICT_TEXT: Record<Verdict, string> = {
  pass: "within tolerance",
  marginal: "at the tolerance limit (within the reading uncertainty)",
  fail: "outside tolerance",
  unknown: "no tolerance verdict", // why is said beside it: no flow meter, or a speed too far from the curve's
};

/** One gauge as read on site, SI. */
export type GaugeSI = {
  /** Pressure as read, Pa, on the stated reference. */
  pressure: number;
  reference: GaugeRef;
  /** Gauge elevation above a common datum, m. */
  elevation: number;
  /** Pipe inner diameter at the tap, m. */
  diameter: number;
  /**
   * Gauge accuracy, ± Pa; null when not given (a blank field: unknown, never a perfect gauge). Readings recorded before a
   * blank was kept stored 0 for it: `readStoredCheck` reads such a 0 back as null where its field was blank.
   */
  accuracy: number | null;
};

export type SpeedSI =
  | { mode: "none" }
  | { mode: "rpm"; rpm: number }
  /** VFD frequency with the motor's base frequency and base (nameplate) speed. */
  | { mode: "vfd"; hz: number; baseHz: number; baseRpm: number };

/**
 * The power reading's accuracy, ± fraction of the reading (a clamp meter or the drive's display, as its data sheet states it);
 * null when none was entered. Missing from readings recorded before it could be entered (read as none).
 */
type PowerAccuracy = { readingAccuracy?: number | null };

export type PowerSI =
  | { mode: "none" }
  /** Motor input power, W, read from a meter or the drive. */
  | ({ mode: "input"; watts: number; motorEfficiency: number | null } & PowerAccuracy)
  | ({ mode: "electrical"; volts: number; amps: number; powerFactor: number; phases: 1 | 3; motorEfficiency: number | null } & PowerAccuracy);

/**
 * The largest power reading accuracy the form takes, ± % of the reading (product rule): a reading worse than ±20 % cannot
 * judge a power limit of +4 to +16 % (ISO 9906 grades, from memory); clamp meters and drive displays state about ±1–5 %.
 */
export const POWER_ACCURACY_MAX_PCT = 20;

/** Everything read on site, SI. */
export type Readings = {
  suction: GaugeSI;
  discharge: GaugeSI;
  /** Flow meter reading, m³/s, or null without a meter. */
  flow: number | null;
  /** Flow meter accuracy as a fraction of the reading; null when not given (as the gauges' accuracy). */
  flowAccuracy: number | null;
  speed: SpeedSI;
  power: PowerSI;
  /** Fluid temperature, °C. */
  temperatureC: number;
};

export const PRESSURE_UNITS = ["kPa", "bar", "psi", "Pa"] as const;
export const ELEVATION_UNITS = ["m", "mm", "ft", "in"] as const;
export const DIAMETER_UNITS = ["mm", "in", "m"] as const;
export const FLOW_UNITS = ["m3/h", "L/s", "L/min", "gpm", "m3/s"] as const;
export const POWER_UNITS = ["kW", "W", "hp"] as const;
export const TEMPERATURE_UNITS = ["C", "F"] as const;

/** Form field names and their raw string values (what the contractor typed). */
export type CheckFields = Record<string, string>;

export const labelOf = (q: Quantity, unit: string) => unitLabel(q, unit);

/**
 * Defaults for a blank form in the user's units (each quantity as chosen, where the form offers that unit); pipe diameters (m) and the fluid
 * temperature (°C) from the selection when known, converted by the engine's unit table.
 */
export function blankFields(u: UnitChoice, known: { suction?: number | null; discharge?: number | null; temperatureC?: number | null } = {}): CheckFields {
  const among = <T extends string>(list: readonly T[], id: string, fallback: T): T => (list as readonly string[]).includes(id) ? (id as T) : fallback;
  const diameterUnit = among(DIAMETER_UNITS, u.diameter, "mm");
  const temperatureUnit = among(TEMPERATURE_UNITS, u.temperature, "C");
  const diameter = (metres?: number | null) => (metres && metres > 0 ? String(Number(fromSI("diameter", diameterUnit, metres).toFixed(diameterUnit === "in" ? 3 : 1))) : "");
  const temperatureC = known.temperatureC ?? 20;
  return {
    pressureUnit: among(PRESSURE_UNITS, u.pressure, "kPa"),
    sRef: "gauge",
    dRef: "gauge",
    sPressure: "",
    dPressure: "",
    sAccuracy: "",
    dAccuracy: "",
    elevationUnit: among(ELEVATION_UNITS, u.length, "m"),
    sElevation: "0",
    dElevation: "0",
    diameterUnit,
    sDiameter: diameter(known.suction),
    dDiameter: diameter(known.discharge),
    flowUnit: among(FLOW_UNITS, u.flow, "m3/h"),
    flow: "",
    flowAccuracy: "",
    speedMode: "rpm",
    rpm: "",
    hz: "",
    baseHz: "50",
    baseRpm: "",
    powerMode: "none",
    powerUnit: among(POWER_UNITS, u.power, "kW"),
    power: "",
    volts: "",
    amps: "",
    powerFactor: "",
    phases: "3",
    motorEfficiency: "",
    powerAccuracy: "",
    temperatureUnit,
    temperature: String(Number(fromSI("temperature", temperatureUnit, temperatureC).toFixed(1))),
    notes: "",
  };
}

export type ParseResult = { ok: true; readings: Readings; notes: string; fields: CheckFields } | { ok: false; errors: Record<string, string>; fields: CheckFields };

/** The liquid the selection pumps (its system's `fluid`): only its kind decides the temperatures the form takes. */
export type LiquidKind = { kind: "water" | "custom" };

/** Temperatures taken for a user-defined liquid, °C: plausibility bounds (common practice); its properties do not depend on it. */
const CUSTOM_LIQUID_C = { min: -20, max: 200 } as const;

/**
 * The fluid temperatures the form takes, °C. Water: the range its properties are computed for, read from the engine's
 * fluid table (`fluidTemperatureRangeC`, fluids.ts — one source), so a reading the check could not work out is refused
 * at its field, not answered 422 after the fact. A user-defined liquid: plausibility bounds.
 * @param liquid the selection's liquid (its kind)
 */
export function temperatureLimitsC(liquid: LiquidKind): { min: number; max: number; rule: string } {
  const table = fluidTemperatureRangeC(liquid);
  return table
    ? { ...table, rule: "water's properties are computed for this range only (IAPWS formulations; describe another liquid or temperature as a user-defined fluid on the system)" }
    : { ...CUSTOM_LIQUID_C, rule: "the form's plausibility bounds for a user-defined liquid (its properties are taken as given)" };
}

/**
 * The form's temperature limits in a unit, e.g. "0 to 100 °C" or "32 to 212 °F": the field's hint and its message.
 * @param liquid the selection's liquid (its kind)
 * @param unit temperature unit id (°C, °F)
 */
export function temperatureRangeText(liquid: LiquidKind, unit: string): string {
  const show = (x: number) => String(x).replace("-", "−");
  return temperatureEndsShown(liquid, unit).map(show).join(" to ") + ` ${unitLabel("temperature", unit)}`;
}

/** The range's ends as the hint and the refusal state them, in the unit typed (to 2 decimals: −4 and 392 °F, 473.15 K). */
function temperatureEndsShown(liquid: LiquidKind, unit: string): [number, number] {
  const { min, max } = temperatureLimitsC(liquid);
  const shown = (c: number) => Number(fromSI("temperature", unit, c).toFixed(2));
  return [shown(min), shown(max)];
}

const MAX_NOTES = 4000;

/**
 * Reads the raw form into SI readings, with a message per bad field. Limits are plausibility
 * bounds for building-services and water pumps (common practice), not physics — except the fluid
 * temperature, which follows the liquid the selection pumps (`temperatureLimitsC`).
 * @param raw the form's fields as posted
 * @param liquid the selection's liquid (its system's `fluid`)
 */
export function parseCheckFields(raw: Record<string, unknown>, liquid: LiquidKind): ParseResult {
  const f: CheckFields = {};
  for (const [k, v] of Object.entries(raw)) if (typeof v === "string") f[k] = v.trim();
  const errors: Record<string, string> = {};
  const pick = <T extends string>(key: string, allowed: readonly T[], fallback: T): T => {
    const v = f[key];
    if (v === undefined || v === "") return fallback;
    if ((allowed as readonly string[]).includes(v)) return v as T;
    errors[key] = "Choose one of the listed options.";
    f[key] = fallback; // the form is drawn again from these fields: only a unit it offers
    return fallback;
  };
  /**
   * A number in `unit` → SI; required unless `optional`; bounds in SI. Every refusal names the field and the range the form
   * takes, in the unit typed (`word`: the unit's label where the field has no quantity), and `why` a bound is where it is.
   */
  const num = (key: string, label: string, q: Quantity | null, unit: string, opts: { optional?: boolean; min?: number; max?: number; minOpen?: boolean; word?: string; why?: string } = {}): number | null => {
    // A range's end to 6 significant digits, its whole part grouped by spaces as every limit ("100 000 kPa"; engine
    // limitText.ts), rounded inward where those digits would put it outside (checked exactly: 100 000 kPa is
    // 14 503.7738 psi, "14 503.7 psi", not "14 503.8 psi"), so the end typed back as printed is taken (decision "inputedge").
    const shown = (si: number, side: "min" | "max") => {
      const v = q ? fromSI(q, unit, si) : si;
      return groupThousands(boundInward(String(Number(v.toPrecision(6))), v, side, 0)).replace("-", "−");
    };
    const word = q ? unitLabel(q, unit) : (opts.word ?? "");
    const w = word ? (word === "%" ? " %" : ` ${word}`) : "";
    const range = opts.min !== undefined && opts.max !== undefined
      ? `${opts.minOpen ? `more than ${shown(opts.min, "min")}${w} and at most` : `from ${shown(opts.min, "min")}${w} to`} ${shown(opts.max, "max")}${w}${opts.why ? ` (${opts.why})` : ""}`
      : null;
    const takes = range ? `: the form takes ${range}` : "";
    // The forms' strict reader (shared/decimal.ts): a decimal point or comma; 1,500 refused as ambiguous.
    const x = decimalField(f[key] ?? "", key, label, errors, !opts.optional);
    if (x === null) {
      // Not a number (NaN, Infinity, 1e400…): the message says so, then the range the field takes.
      // Text that is not a number is named too ("…must be a number, not “0x64”; …"), as a number out of range is.
      const raw = f[key] ?? "";
      const named = errors[key]?.endsWith(" must be a number.") ? `${errors[key].slice(0, -1)}, not “${raw.length > 40 ? `${raw.slice(0, 39)}…` : raw}”.` : errors[key];
      if (range && named && !named.startsWith("Enter ") && !named.includes("ambiguous")) errors[key] = `${named.replace(/\.$/, "")}; the form takes ${range}.`;
      return null;
    }
    // The number refused, in the unit typed, as the system editor's refusals name it (projects/run-ranges.ts `outOfRange`):
    // ", not −350 kPa". Written in full (never rounded onto the end it is past), grouped as the ends are.
    const not = `, not ${numberAsTyped(x)}${w}`;
    // Far past every bound below (and past a double once in SI, as 1e308 kPa would be): refused before converting.
    if (!(Math.abs(x) <= MAX_MAGNITUDE)) {
      errors[key] = `${capital(label)} is too ${x < 0 ? "low" : "high"}${takes}${not}; check the value and its unit.`;
      return null;
    }
    const si = q ? toSI(q, unit, x) : x;
    if (opts.min !== undefined && (opts.minOpen ? !(si > opts.min) : si < opts.min)) {
      errors[key] = `${capital(label)} is too low${takes}${not}; check the value and its unit.`;
      return null;
    }
    if (opts.max !== undefined && si > opts.max) {
      errors[key] = `${capital(label)} is too high${takes}${not}; check the value and its unit.`;
      return null;
    }
    return si;
  };

  const pUnit = pick("pressureUnit", PRESSURE_UNITS, "kPa");
  const eUnit = pick("elevationUnit", ELEVATION_UNITS, "m");
  const dUnit = pick("diameterUnit", DIAMETER_UNITS, "mm");
  const qUnit = pick("flowUnit", FLOW_UNITS, "m3/h");
  const wUnit = pick("powerUnit", POWER_UNITS, "kW");
  const tUnit = pick("temperatureUnit", TEMPERATURE_UNITS, "C");

  const gauge = (p: "s" | "d", side: string): GaugeSI | null => {
    const reference = pick(`${p}Ref`, ["gauge", "absolute"] as const, "gauge");
    // Gauge: from full vacuum (−1 atm) to 1000 bar; absolute: from 0.
    const pressure = num(`${p}Pressure`, `the ${side} pressure`, "pressure", pUnit, {
      min: reference === "absolute" ? 0 : -STANDARD_ATMOSPHERE,
      max: 1e8,
      why: reference === "absolute" ? "an absolute reading is never below zero; up to 1\u202f000 bar" : "a gauge reads no lower than full vacuum, −1 standard atmosphere gauge; up to 1\u202f000 bar",
    });
    // Blank is "not given" (null), kept apart from an entered 0 everywhere after (decision "fieldmeter").
    const accuracy = num(`${p}Accuracy`, `the ${side} gauge accuracy`, "pressure", pUnit, { optional: true, min: 0, max: 1e7, why: "± the reading" });
    const elevation = num(`${p}Elevation`, `the ${side} gauge elevation`, "length", eUnit, { min: -100, max: 100 });
    const diameter = num(`${p}Diameter`, `the ${side} pipe inner diameter`, "diameter", dUnit, { min: 0.005, max: 3 });
    if (pressure === null || elevation === null || diameter === null) return null;
    return { pressure, reference, elevation, diameter, accuracy };
  };
  const suction = gauge("s", "suction");
  const discharge = gauge("d", "discharge");
  const flow = num("flow", "the flow reading", "flow", qUnit, { optional: true, min: 0, max: 100, why: "a flow meter reads the flow forward" });
  const flowAccPct = num("flowAccuracy", "the flow meter accuracy", null, "", { optional: true, min: 0, max: 50, word: "%" });

  let speed: SpeedSI = { mode: "none" };
  const speedMode = pick("speedMode", ["rpm", "vfd"] as const, "rpm");
  if (speedMode === "rpm") {
    const rpm = num("rpm", "the speed", null, "", { optional: true, min: 100, max: 10_000, word: "rpm", why: "a running pump; leave it blank when the speed was not measured" });
    if (rpm !== null) speed = { mode: "rpm", rpm };
  } else {
    const hz = num("hz", "the drive frequency", null, "", { min: 5, max: 120, word: "Hz" });
    const baseHz = num("baseHz", "the motor's base frequency", null, "", { min: 25, max: 120, word: "Hz" });
    const baseRpm = num("baseRpm", "the motor's base speed", null, "", { min: 100, max: 10_000, word: "rpm" });
    if (hz !== null && baseHz !== null && baseRpm !== null) speed = { mode: "vfd", hz, baseHz, baseRpm };
  }

  let power: PowerSI = { mode: "none" };
  const powerMode = pick("powerMode", ["none", "input", "electrical"] as const, "none");
  const motorEffPct = powerMode === "none" ? null : num("motorEfficiency", "the motor efficiency", null, "", { optional: true, min: 30, max: 100, word: "%" });
  const motorEfficiency = motorEffPct === null ? null : motorEffPct / 100;
  const readingAccuracy = powerMode === "none" ? null : powerAccuracyOf(f.powerAccuracy ?? "", errors);
  if (powerMode === "input") {
    const watts = num("power", "the motor input power", "power", wUnit, { min: 0, minOpen: true, max: 5e6 });
    if (watts !== null) power = { mode: "input", watts, motorEfficiency, readingAccuracy };
  } else if (powerMode === "electrical") {
    const volts = num("volts", "the voltage", null, "", { min: 50, max: 15_000, word: "V" });
    const amps = num("amps", "the current", null, "", { min: 0, minOpen: true, max: 5000, word: "A" });
    const powerFactor = num("powerFactor", "the power factor", null, "", { min: 0.05, max: 1 });
    const phases = pick("phases", ["1", "3"] as const, "3");
    if (volts !== null && amps !== null && powerFactor !== null) power = { mode: "electrical", volts, amps, powerFactor, phases: phases === "1" ? 1 : 3, motorEfficiency, readingAccuracy };
  }

  let temperatureC = num("temperature", "the fluid temperature", "temperature", tUnit);
  const tLimits = temperatureLimitsC(liquid);
  // Judged as typed, in the unit typed, against the ends the hint states there, exactly: 392 °F is taken and
  // 392.000000001 °F refused (a slack of 1e-9 °C on the converted value took it); a reading taken is kept within the
  // range in °C (392 °F converts to 200.00000000000003 °C: the conversion's last bit, not the reading).
  if (temperatureC !== null) {
    // The number as typed (read again: −4 °F through °C and back is −3.9999999999999964), in the unit typed.
    const typed = decimalField(f.temperature ?? "", "temperature", "", {}) ?? fromSI("temperature", tUnit, temperatureC);
    const [lo, hi] = temperatureEndsShown(liquid, tUnit);
    if (typed < lo || typed > hi) {
      errors.temperature = `Fluid temperature is too ${typed < lo ? "low" : "high"}: the form takes ${temperatureRangeText(liquid, tUnit)}, not ${numberAsTyped(typed)} ${unitLabel("temperature", tUnit)} — ${tLimits.rule}.`;
      temperatureC = null;
    } else temperatureC = Math.min(tLimits.max, Math.max(tLimits.min, temperatureC));
  }
  const notes = f.notes ?? "";
  if (notes.length > MAX_NOTES) errors.notes = `Keep the notes under ${MAX_NOTES} characters.`;
  if (Object.keys(errors).length || !suction || !discharge || temperatureC === null) return { ok: false, errors, fields: f };
  return {
    ok: true,
    readings: { suction, discharge, flow, flowAccuracy: flowAccPct === null ? null : flowAccPct / 100, speed, power, temperatureC },
    notes,
    fields: f,
  };
}

/**
 * The power reading's accuracy as typed (± % of the reading) → a fraction, or null when blank; anything but a number from 0
 * to `POWER_ACCURACY_MAX_PCT` is an error under `powerAccuracy` naming the rule and what was typed.
 */
function powerAccuracyOf(typed: string, errors: Record<string, string>): number | null {
  const range = `from 0 to ${POWER_ACCURACY_MAX_PCT} % (± % of the reading, as the meter's data sheet states it)`;
  const pct = decimalField(typed, "powerAccuracy", "the power reading accuracy", errors);
  if (pct === null) {
    // "must be a number." alone: the range and the way out too (an ambiguous comma or an overflow says its own fix).
    if (errors.powerAccuracy?.endsWith(" must be a number.")) errors.powerAccuracy = `${errors.powerAccuracy.slice(0, -1)} ${range}; leave it blank when the accuracy is not known.`;
    return null;
  }
  if (pct >= 0 && pct <= POWER_ACCURACY_MAX_PCT) return pct / 100;
  errors.powerAccuracy = `The power reading accuracy must be ${range}: “${typed}” is ${pct < 0 ? "negative" : `past ${POWER_ACCURACY_MAX_PCT} %`}.`;
  return null;
}

function capital(s: string) {
  const t = s.replace(/^the /, "");
  return t.charAt(0).toUpperCase() + t.slice(1);
}

/** Speed in rpm from the readings (VFD: base speed × f / f_base, ignoring the change of slip — common practice). */
export function speedRpm(s: SpeedSI): number | null {
  if (s.mode === "rpm") return s.rpm;
  if (s.mode === "vfd") return (s.baseRpm * s.hz) / s.baseHz;
  return null;
}

/**
 * Electrical input power, W. Three-phase: P = √3·V_LL·I·PF; single-phase: P = V·I·PF
 * (standard AC power relations, e.g. IEC 60050 / any electrical handbook; V line-to-line for three-phase).
 */
export function inputPowerW(p: PowerSI): number | null {
  if (p.mode === "input") return p.watts;
  if (p.mode === "electrical") return (p.phases === 3 ? Math.sqrt(3) : 1) * p.volts * p.amps * p.powerFactor;
  return null;
}
