/**
 * Number formatting for the chart's labels, readout and tables: fixed decimals by magnitude,
 * locale-independent, so the server and the browser render the same text.
 */
import { nearZeroWords } from "../../engine/quantityText.ts";

/**
 * Formats a display value: 3 decimals below 1, 2 below 10, else 1 — e.g. 360 → "360.0",
 * 1585.03 → "1585.0", 4.2 → "4.20". Locale-independent (identical on server and client).
 * Exactly 0 → "0"; non-finite or null → "—".
 */
export function formatValue(v: number | null | undefined): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return "—";
  if (v === 0) return "0";
  const a = Math.abs(v);
  const digits = a < 1 ? 3 : a < 10 ? 2 : 1;
  const s = v.toFixed(digits);
  // Avoid "-0.0".
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}

/**
 * NPSHa as the chart's readout and table view give it (display units): where three decimals would show it as zero though
 * it is not, "< 0.001" above zero and "below 0" below (the engine's `nearZeroWords`, the one rule of every NPSHa text;
 * decisions "npshzero", "npshone"); otherwise as {@link formatValue}.
 * @param v NPSHa in the chart's NPSH unit (m or ft)
 */
export function formatNpshaValue(v: number | null | undefined): string {
  return (v != null && nearZeroWords(v)) || formatValue(v);
}
