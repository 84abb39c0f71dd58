/**
 * Units: one table for the UI (labels, conversion) and the engine (SI inside).
 *
 * Factors are exact by definition where a definition exists (NIST SP 811, 2008 edition,
 * Appendix B; CGPM): 1 ft = 0.3048 m, 1 in = 0.0254 m, 1 US gal = 3.785411784e-3 m³,
 * 1 lbf = 4.4482216152605 N (from 1 lb = 0.45359237 kg and g₀ = 9.80665 m/s²), so
 * 1 psi = lbf/in² = 6894.757293168… Pa and 1 hp (550 ft·lbf/s) = 745.69987158… W;
 * SP 811 prints these last two rounded as 6.894757 E+03 and 7.456999 E+02.
 * Temperature: T[K] = T[°C] + 273.15, T[°F] = 1.8·T[°C] + 32 (exact).
 */
import { EngineInputError, requireFinite, requireFiniteResult } from "./errors.ts";

/** Standard acceleration of gravity g₀, m/s² (CGPM 1901; NIST SP 811). */
export const G0 = 9.80665;
/** Standard atmosphere, Pa (NIST SP 811). */
export const STANDARD_ATMOSPHERE = 101_325;

const FT = 0.3048;
const IN = 0.0254;
const US_GALLON = 3.785411784e-3; // m³
const LBF = 0.45359237 * G0; // N, exact by definition
const PSI = LBF / (IN * IN); // Pa
const HP = 550 * FT * LBF; // W (mechanical horsepower, 550 ft·lbf/s)

/** Physical quantities the UI converts. Diameter shares length units but has its own preset. */
export type Quantity =
  | "flow"
  | "head"
  | "pressure"
  | "power"
  | "length"
  | "diameter"
  | "roughness"
  | "temperature"
  | "velocity"
  | "energy"
  | "density"
  | "dynamicViscosity"
  | "kinematicViscosity"
  | "speed";

/** One unit: value_SI = value·factor + offset. */
export interface UnitDef {
  /** Stable id used in stored settings, e.g. `"m3/h"`. */
  id: string;
  /** Label for display, e.g. `"m³/h"`. */
  label: string;
  /** Multiply a value in this unit by `factor` (then add `offset`) to get SI. */
  factor: number;
  /** Additive offset to SI (temperatures only), in SI unit. */
  offset?: number;
}

function u(id: string, label: string, factor: number, offset?: number): UnitDef {
  return offset === undefined ? { id, label, factor } : { id, label, factor, offset };
}

const lengthUnits = [u("m", "m", 1), u("mm", "mm", 1e-3), u("in", "in", IN), u("ft", "ft", FT)];

/**
 * Every quantity's units. The first entry of each list is the SI base the engine uses
 * (temperature is the exception: the engine takes °C at its public face, listed first).
 */
export const UNITS: Readonly<Record<Quantity, readonly UnitDef[]>> = {
  flow: [
    u("m3/s", "m³/s", 1),
    u("m3/h", "m³/h", 1 / 3600),
    u("L/s", "L/s", 1e-3),
    u("L/min", "L/min", 1e-3 / 60),
    u("gpm", "gpm", US_GALLON / 60),
  ],
  head: [u("m", "m", 1), u("ft", "ft", FT)],
  pressure: [
    u("Pa", "Pa", 1),
    u("kPa", "kPa", 1e3),
    u("bar", "bar", 1e5),
    u("psi", "psi", PSI),
  ],
  power: [u("W", "W", 1), u("kW", "kW", 1e3), u("hp", "hp", HP)],
  length: lengthUnits,
  diameter: lengthUnits,
  roughness: lengthUnits,
  temperature: [u("C", "°C", 1, 0), u("F", "°F", 5 / 9, -32 * (5 / 9)), u("K", "K", 1, -273.15)],
  velocity: [u("m/s", "m/s", 1), u("ft/s", "ft/s", FT)],
  energy: [u("J", "J", 1), u("kWh", "kWh", 3.6e6), u("MWh", "MWh", 3.6e9)],
  density: [u("kg/m3", "kg/m³", 1), u("lb/ft3", "lb/ft³", 0.45359237 / (FT * FT * FT))],
  dynamicViscosity: [u("Pa.s", "Pa·s", 1), u("mPa.s", "mPa·s", 1e-3), u("cP", "cP", 1e-3)],
  kinematicViscosity: [u("m2/s", "m²/s", 1), u("mm2/s", "mm²/s", 1e-6), u("cSt", "cSt", 1e-6)],
  speed: [u("rpm", "rpm", 1), u("rad/s", "rad/s", 60 / (2 * Math.PI))],
};

/** Exact conversion factors, SI per unit, for reference and tests (NIST SP 811). */
export const FACTORS = { FT, IN, US_GALLON, LBF, PSI, HP, GPM: US_GALLON / 60 } as const;

/**
 * Looks a unit up; throws {@link EngineInputError} if the quantity has no such unit.
 * @param quantity physical quantity (unitless id)
 * @param unit unit id within that quantity (unitless id)
 */
export function unitDef(quantity: Quantity, unit: string): UnitDef {
  const list = UNITS[quantity];
  if (!list) throw new EngineInputError("quantity", `unknown quantity "${String(quantity)}"`);
  const def = list.find((d) => d.id === unit);
  if (!def) throw new EngineInputError("unit", `"${unit}" is not a unit of ${quantity}`);
  return def;
}

/**
 * Converts a value in `unit` to SI (temperature: to °C, the engine's public temperature).
 * @param quantity physical quantity (unitless id)
 * @param unit unit id the value is in (unitless id)
 * @param value the value, in the unit of `unit`
 */
export function toSI(quantity: Quantity, unit: string, value: number): number {
  requireFinite("value", value);
  const d = unitDef(quantity, unit);
  return requireFiniteResult("value", value * d.factor + (d.offset ?? 0));
}

/**
 * Converts an SI value (temperature: °C) to `unit`.
 * @param quantity physical quantity (unitless id)
 * @param unit unit id wanted (unitless id)
 * @param value the value, in SI (temperature in °C)
 */
export function fromSI(quantity: Quantity, unit: string, value: number): number {
  requireFinite("value", value);
  const d = unitDef(quantity, unit);
  return requireFiniteResult("value", (value - (d.offset ?? 0)) / d.factor);
}

/**
 * Converts between two units of one quantity.
 * @param quantity physical quantity (unitless id)
 * @param value the value, in the unit of `from`
 * @param from unit id of the value (unitless id)
 * @param to unit id wanted (unitless id)
 */
export function convert(quantity: Quantity, value: number, from: string, to: string): number {
  return fromSI(quantity, to, toSI(quantity, from, value));
}

/** Display unit per quantity. */
export type UnitPreset = Readonly<Record<Quantity, string>>;

/** Unit system presets for the UI: SI (m³/h, m, kPa, kW, mm) and US (gpm, ft, psi, hp, in). */
export const UNIT_SYSTEMS: Readonly<{ SI: UnitPreset; US: UnitPreset }> = {
  SI: {
    flow: "m3/h",
    head: "m",
    pressure: "kPa",
    power: "kW",
    length: "m",
    diameter: "mm",
    roughness: "mm",
    temperature: "C",
    velocity: "m/s",
    energy: "kWh",
    density: "kg/m3",
    dynamicViscosity: "mPa.s",
    kinematicViscosity: "mm2/s",
    speed: "rpm",
  },
  US: {
    flow: "gpm",
    head: "ft",
    pressure: "psi",
    power: "hp",
    length: "ft",
    diameter: "in",
    roughness: "in",
    temperature: "F",
    velocity: "ft/s",
    energy: "kWh",
    density: "lb/ft3",
    dynamicViscosity: "cP",
    kinematicViscosity: "cSt",
    speed: "rpm",
  },
};

/**
 * Label of a unit, e.g. `"m³/h"`.
 * @param quantity physical quantity (unitless id)
 * @param unit unit id (unitless id)
 */
export function unitLabel(quantity: Quantity, unit: string): string {
  return unitDef(quantity, unit).label;
}
