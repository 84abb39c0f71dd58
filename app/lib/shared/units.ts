/**
 * The user's display units: ONE definition for the server and the browser. A choice names a unit
 * id per quantity (ids of `UNITS` in `app/engine/units.ts`); the SI and US presets come from the
 * engine's `UNIT_SYSTEMS`; `unitsOf`/`picksOf` build a choice from overrides, an unknown id falling back
 * to the preset (a user's stored settings are read strictly, with their problems said: auth/stored-units.ts). Formatters and the renderer of quantity tokens (`qt()` in
 * the engine: `⟦flow|0.0111⟧`) live here too, so every page, report and e-mail follows the choice.
 */
import { fromSI, toSI, UNIT_SYSTEMS, UNITS, unitLabel, type Quantity, type UnitPreset } from "~/engine";
import { fmtQuantity, fmtQuantityAboveZero, fmtQuantityExact, renderQuantities } from "~/engine/quantityText";

export { fmtNum, fmtNumExact, fmtPct, fmtPctExact } from "./format";

/** Unit id per quantity, e.g. `{ flow: "L/s", head: "m", … }`. */
export type UnitChoice = UnitPreset;
/** The presets a user starts from (stored in `users.unit_system`). */
export const PRESET_IDS = ["SI", "US"] as const;
export type PresetId = (typeof PRESET_IDS)[number];
export const PRESETS: Readonly<Record<PresetId, UnitChoice>> = UNIT_SYSTEMS;
export const SI_UNITS: UnitChoice = UNIT_SYSTEMS.SI;
export const US_UNITS: UnitChoice = UNIT_SYSTEMS.US;

/** Every quantity the app converts, in the order the account page lists them. */
export const QUANTITIES = Object.keys(UNITS) as Quantity[];

/** The quantities a user may set one by one on the account page (the others follow the preset). */
export const SETTABLE: readonly Quantity[] = [
  "flow", "head", "pressure", "power", "length", "diameter", "roughness", "temperature", "velocity",
  "density", "dynamicViscosity", "kinematicViscosity", "energy",
];

/** Human names of the quantities (account page, CSV headers). */
export const QUANTITY_NAMES: Readonly<Record<Quantity, string>> = {
  flow: "Flow", head: "Head", pressure: "Pressure", power: "Power", length: "Length (pipe runs, elevations)",
  diameter: "Diameter (pipes, impellers)", roughness: "Pipe roughness", temperature: "Temperature", velocity: "Velocity",
  energy: "Energy", density: "Density", dynamicViscosity: "Dynamic viscosity", kinematicViscosity: "Kinematic viscosity", speed: "Speed",
};

export const isPreset = (x: unknown): x is PresetId => x === "SI" || x === "US";
export const isUnitOf = (q: Quantity, id: unknown): id is string => typeof id === "string" && UNITS[q].some((d) => d.id === id);

/** The valid per-quantity picks of stored overrides (an object or its JSON text); anything else is dropped. */
export function picksOf(overrides: unknown): Partial<Record<Quantity, string>> {
  let o: unknown = overrides;
  if (typeof o === "string") {
    try {
      o = JSON.parse(o);
    } catch {
      o = null;
    }
  }
  if (!o || typeof o !== "object" || Array.isArray(o)) return {};
  const rec = o as Record<string, unknown>;
  const out: Partial<Record<Quantity, string>> = {};
  for (const q of QUANTITIES) if (isUnitOf(q, rec[q])) out[q] = rec[q];
  return out;
}

/**
 * The choice from a preset and per-quantity overrides (an object or its JSON text, as stored).
 * An unknown preset is SI; an override that is not a unit of its quantity falls back to the preset.
 */
export function unitsOf(preset: unknown, overrides?: unknown): UnitChoice {
  const base = PRESETS[isPreset(preset) ? preset : "SI"];
  const picks = picksOf(overrides);
  return Object.keys(picks).length ? { ...base, ...picks } : base;
}

/** The preset a choice equals, or null for a mixed choice. */
export function presetOf(choice: UnitChoice): PresetId | null {
  return PRESET_IDS.find((p) => QUANTITIES.every((q) => PRESETS[p][q] === choice[q])) ?? null;
}

/** The chosen unit id of a quantity. */
export const unitOf = (u: UnitChoice, q: Quantity): string => u[q];
/** The chosen unit's label, e.g. `"m³/h"`. */
export const labelOf = (u: UnitChoice, q: Quantity): string => unitLabel(q, u[q]);
/** SI value → the chosen unit. */
export const toChosen = (u: UnitChoice, q: Quantity, si: number): number => fromSI(q, u[q], si);
/** A value typed in the chosen unit → SI. */
export const fromChosen = (u: UnitChoice, q: Quantity, value: number): number => toSI(q, u[q], value);

/** An SI value as text in the chosen unit, e.g. `"42.0 m³/h"`; "—" for a missing or non-finite value. */
export const fmtQ = fmtQuantity;
/** An SI value shown beside values it is compared with (SI), with the decimals it needs not to read as one of them in the chosen unit. */
export const fmtQExact = fmtQuantityExact;
/** A reading judged by its side of zero (NPSHa): "< 0.001 m" above zero and below 0.001 in the unit shown, else as fmtQExact read apart from zero. */
export const fmtQAboveZero = fmtQuantityAboveZero;

/**
 * A value whose zero is a reading of its own (a pressure difference between two surfaces: none at all, or some): exactly
 * zero as "0 kPa", never "0.000 kPa" as if rounded; any other value read apart from zero as {@link fmtQExact} writes it,
 * a value too small for its decimals in the significant-digit form every tiny number takes ("1.00e-7 kPa"; it was
 * "0.0000001 kPa" where a plain token read "1.00e-7 kPa": decision "numtext"), else as {@link fmtQ}.
 * @param u the reader's units
 * @param q physical quantity (unitless id)
 * @param si the value in SI
 */
export const fmtQZero = (u: UnitChoice, q: Quantity, si: number | null | undefined): string => (si === 0 ? `0 ${labelOf(u, q)}` : fmtQExact(u, q, si, [0]));

export const fmtFlow = (u: UnitChoice, si: number | null | undefined) => fmtQ(u, "flow", si);
export const fmtHead = (u: UnitChoice, si: number | null | undefined) => fmtQ(u, "head", si);
export const fmtPower = (u: UnitChoice, si: number | null | undefined) => fmtQ(u, "power", si);
export const fmtPressure = (u: UnitChoice, si: number | null | undefined) => fmtQ(u, "pressure", si);

/** Renders the quantity tokens (`qt()` in the engine) of a text in the chosen units; text without tokens is unchanged. */
export const renderUnits = renderQuantities;

/**
 * Renders every string inside a value (objects, arrays) — for a loader's answer or a stored
 * document on its way to a page. Returns a copy where something changed; numbers stay numbers.
 */
export function renderDeep<T>(value: T, u: UnitChoice): T {
  if (typeof value === "string") return renderUnits(value, u) as T;
  // A copy is made only once something inside changes (a loader's answer is mostly numbers and plain words: 25 search rows
  // made about 1 000 objects and arrays here only to throw them away).
  if (Array.isArray(value)) {
    let out: unknown[] | null = null;
    for (let i = 0; i < value.length; i++) {
      const x = value[i];
      const y = renderDeep(x, u);
      if (y !== x && !out) out = value.slice(0, i);
      if (out) out.push(y);
    }
    return (out ?? value) as T;
  }
  if (value && typeof value === "object" && Object.getPrototypeOf(value) === Object.prototype) {
    const keys = Object.keys(value);
    const from = value as Record<string, unknown>;
    let out: Record<string, unknown> | null = null;
    for (let i = 0; i < keys.length; i++) {
      const x = from[keys[i]];
      const y = renderDeep(x, u);
      if (y !== x && !out) {
        out = {};
        for (let j = 0; j < i; j++) out[keys[j]] = from[keys[j]];
      }
      if (out) out[keys[i]] = y;
    }
    return (out ?? value) as T;
  }
  return value;
}
