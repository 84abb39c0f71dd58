/**
 * Flow units in the SI's exponent spelling: a product of units with a negative exponent for the divisor
 * ("l.s-1", "l·s⁻¹", "L s-1", "m3.h-1", "m³·h⁻¹", "dm3·min-1": SI Brochure, 9th ed., 5.4.6). Read as the slash spellings
 * they equal; "min-1" after a volume divides litres and is no speed. Pure: runs on the normalised header (normaliseHeader
 * folds "⁻¹" to "-1" and "³" to "3").
 */
import type { FlowUnit } from "./units-in-headers";

const PRODUCT = String.raw`(?:\s*[.·⋅*×]\s*|\s+)`;
const TIME = String.raw`(s|sec|min|h|hr|d)`;
const INVERSE = String.raw`${PRODUCT}${TIME}\s*-1(?![0-9])`;
const CUBIC_METRE = new RegExp(String.raw`(?<![a-z])m3${INVERSE}`);
const LITRE = new RegExp(String.raw`(?<![a-z])(?:l|lit|ltr|liters?|litres?|dm3)${INVERSE}`);

const M3: Record<string, FlowUnit> = { s: "m3/s", sec: "m3/s", min: "m3/min", h: "m3/h", hr: "m3/h", d: "m3/d" };
const L: Record<string, FlowUnit | undefined> = { s: "l/s", sec: "l/s", min: "l/min", h: "l/h", hr: "l/h" }; // L/d: no factor (refused as l/d)

/** The flow unit a (normalised) header writes in the exponent spelling, or null. */
export function exponentFlowUnit(norm: string): FlowUnit | null {
  const m3 = norm.match(CUBIC_METRE);
  if (m3) return M3[m3[1]];
  const l = norm.match(LITRE);
  return l ? (L[l[1]] ?? null) : null;
}

const ANY = new RegExp(String.raw`(?<![a-z])(?:m3|l|lit|ltr|liters?|litres?|dm3)${INVERSE}`, "g");

/**
 * The header with its exponent-spelt flow units blanked: its "min-1" is then no speed and its "h" no head, and its digits
 * are a unit's (units-row.ts). Equal to `norm` when it writes none.
 */
export const withoutExponentFlow = (norm: string): string => norm.replace(ANY, " ");
