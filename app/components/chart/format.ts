/**
 * Number text for the chart's labels, readout and tables: the app's unit-aware formatters' (app/lib/shared/units.ts), so a
 * value on the chart reads as the same value in the candidates table, the report and the CSV's texts. The chart holds its
 * values in the reader's display unit (display-units.ts: `fromSI` of the reader's unit, as `fmtQ` converts), so the number
 * `fmtQ` prints is `fmtNum` of the display value: decimals by magnitude (≥100: 0, ≥10: 1, ≥1: 2, else 3; "360", "42.4",
 * "4.20", "0.123"), a percentage to one decimal as `fmtPct`. Locale-independent (server and browser give the same text).
 */
import { nearZeroWords, trueMinus } from "../../engine/quantityText.ts";
import { fmtNum, fmtNumExact, fmtPct } from "../../lib/shared/units.ts";

/** A panel kind's value (display unit: efficiency in %). */
type Kind = "head" | "efficiency" | "power" | "npsh";

/**
 * A display value's number as `fmtQ` prints it in the reader's unit ("360" m³/h, "1585" gpm, "4.20" m); "—" when missing.
 * @param v the value in its display unit
 */
export function formatValue(v: number | null | undefined): string {
  return trueMinus(fmtNum(v)); // "−" as fmtQ writes it (quantityText.ts `trueMinus`)
}

/**
 * A display value of a panel kind: an efficiency (in %) to one decimal as `fmtPct` ("75.0"), any other as {@link formatValue}.
 * @param kind the panel kind the value belongs to
 * @param v the value in its display unit (efficiency in %)
 */
export function formatKindValue(kind: Kind, v: number | null | undefined): string {
  if (kind !== "efficiency") return formatValue(v);
  return v == null || !Number.isFinite(v) ? "—" : fmtPct(v / 100).replace(/ %$/, ""); // "−" and an unsigned rounded zero, as fmtPct
}

/**
 * NPSHa as the app's other NPSHa texts give it: where three decimals would show it as zero though it is not, "< 0.001"
 * above zero and "below 0" below (the engine's `nearZeroWords`, the one rule of every NPSHa text; decisions "npshzero",
 * "npshone"); otherwise read apart from zero (NPSHa at zero reads "0.000", as the candidates table writes it).
 * @param v NPSHa in the chart's NPSH unit (m or ft)
 */
export function formatNpshaValue(v: number | null | undefined): string {
  return (v != null && nearZeroWords(v)) || trueMinus(fmtNumExact(v, [0]));
}

/**
 * The number of a unit-aware text for a cell whose column heading names the unit: "42.36 m³/h" → "42.36".
 * @param text the text as `fmtQ` and its kin write it (number, space, unit label)
 * @param label the unit's label
 */
export function numberOf(text: string, label: string): string {
  return text.endsWith(` ${label}`) ? text.slice(0, -label.length - 1) : text;
}
