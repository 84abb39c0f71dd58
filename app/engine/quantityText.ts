/**
 * Quantities inside text. The engine and the services write messages (warnings, notes, verdict
 * reasons) with each physical value as a token `⟦quantity|SI value⟧`, e.g. `⟦flow|0.0111⟧` for
 * 0.0111 m³/s; the edges (pages, report, e-mail) render the tokens in the reader's units with
 * {@link renderQuantities} (re-exported as `renderUnits` by `app/lib/shared/units.ts`). Text without
 * tokens renders unchanged, so stored messages written before the tokens still display.
 * Display helpers, not part of the engine's public face (index.ts): import this file by path.
 */
import { fromSI, UNIT_SYSTEMS, UNITS, unitLabel, type Quantity, type UnitPreset } from "./units.ts";
import { EngineInputError } from "./errors.ts";

/** Matches one token: quantity name (letters) and a number as written by {@link qt} (or NaN). */
export const QUANTITY_TOKEN = /⟦([A-Za-z]+)\|([^⟦⟧|]*)⟧/g;

/**
 * A quantity token for text: `⟦flow|0.0111⟧`.
 * @param quantity physical quantity of the value (unitless id)
 * @param si the value in SI (temperature in °C, as the engine's public face); kept to 6 significant digits
 */
export function qt(quantity: Quantity, si: number): string {
  return `⟦${quantity}|${Number.isFinite(si) ? String(Number(si.toPrecision(6))) : "NaN"}⟧`;
}

/**
 * A number for reading (not a form field): fixed decimals chosen per magnitude (≥100: 0, ≥10: 1, ≥1: 2, else 3); "—" when missing.
 * @param x the number, in any unit
 * @param digits decimals wanted instead (count)
 */
export function fmtNum(x: number | null | undefined, digits?: number): string {
  if (x == null || !Number.isFinite(x)) return "—";
  const d = digits ?? (Math.abs(x) >= 100 ? 0 : Math.abs(x) >= 10 ? 1 : Math.abs(x) >= 1 ? 2 : 3);
  return x.toFixed(d);
}

/**
 * A fraction as a percentage for reading, e.g. 0.723 → "72.3 %"; "—" when missing.
 * @param x the fraction (dimensionless)
 * @param digits decimals (count)
 */
export function fmtPct(x: number | null | undefined, digits = 1): string {
  return x == null || !Number.isFinite(x) ? "—" : `${(x * 100).toFixed(digits)} %`;
}

/**
 * A fraction as a percentage in a text that compares it with thresholds: as fmtPct, with more decimals
 * (up to 6) while it would read the same as one of `against`, or as zero, though it is not, so a value
 * judged outside a limit never reads as the limit ("99.96 %" beside a limit of 100 %, not "100.0 %").
 * @param x the fraction (dimensionless)
 * @param against the thresholds it is compared with (fractions, dimensionless)
 * @param digits decimals at the least (count)
 */
export function fmtPctExact(x: number | null | undefined, against: readonly number[] = [], digits = 1): string {
  if (x == null || !Number.isFinite(x)) return "—";
  const shown = (v: number, d: number) => Number((v * 100).toFixed(d)); // -0 and 0 read the same
  let d = digits;
  while (d < 6 && [0, ...against].some((a) => a !== x && shown(a, d) === shown(x, d))) d++;
  return fmtPct(x, d);
}

/**
 * A threshold as a percentage with the decimals it needs (at most 3, no trailing zeros): a tolerance or a
 * range end as typed, e.g. 0.025 → "2.5 %", 0.011 → "1.1 %", 0.1 → "10 %".
 * @param x the fraction (dimensionless)
 */
export function fmtPctLimit(x: number): string {
  return Number.isFinite(x) ? `${Number((x * 100).toFixed(3))} %` : "—";
}

/**
 * An SI value as text in the unit chosen for its quantity, e.g. `"42.0 m³/h"`; "—" for a missing or non-finite value.
 * @param units unit id per quantity (unitless ids)
 * @param q physical quantity (unitless id)
 * @param si the value in SI (temperature in °C)
 * @param digits decimals wanted instead of the magnitude rule (count)
 */
export function fmtQuantity(units: UnitPreset, q: Quantity, si: number | null | undefined, digits?: number): string {
  if (si == null || !Number.isFinite(si)) return "—";
  const unit = units[q];
  return `${fmtNum(fromSI(q, unit, si), digits)} ${unitLabel(q, unit)}`;
}

const isQuantity = (x: string): x is Quantity => Object.prototype.hasOwnProperty.call(UNITS, x);

/**
 * Renders the quantity tokens of a text in the chosen units. A token of an unknown quantity or
 * with a value that is no number stays as written (visible, so a wrong token is noticed); NaN
 * renders as "—"; text without tokens comes back unchanged.
 * @param text the text with tokens (unitless)
 * @param units unit id per quantity (unitless ids)
 */
export function renderQuantities(text: string, units: UnitPreset): string {
  if (!text.includes("⟦")) return text;
  return text.replace(QUANTITY_TOKEN, (whole, q: string, raw: string) => {
    if (!isQuantity(q)) return whole;
    if (raw === "NaN") return "—";
    const x = raw.trim() === "" ? NaN : Number(raw);
    if (!Number.isFinite(x)) return whole;
    try {
      return fmtQuantity(units, q, x);
    } catch (e) {
      if (e instanceof EngineInputError) return whole; // past a double in this unit (a typed ⟦flow|1e308⟧ in m³/h): as written
      throw e;
    }
  });
}

/** Renders in the SI preset (SI: for tests and exports that keep SI). */
export const inSI = (text: string): string => renderQuantities(text, UNIT_SYSTEMS.SI);
