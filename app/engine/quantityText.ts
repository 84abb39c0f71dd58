/**
 * Quantities inside text. The engine and the services write messages (warnings, notes, verdict
 * reasons) with each physical value as a token `⟦quantity|SI value⟧`, e.g. `⟦flow|0.0111⟧` for
 * 0.0111 m³/s; the edges (pages, report, e-mail, exports) render the tokens in the reader's units
 * (`renderUnits` in `app/lib/shared/units.ts`). Text without tokens renders unchanged, so stored
 * messages written before the tokens still display.
 */
import type { Quantity } from "./units.ts";

/** Matches one token: quantity name (letters) and a number as written by {@link qt} (or NaN). */
export const QUANTITY_TOKEN = /⟦([A-Za-z]+)\|([^⟦⟧|]*)⟧/g;

/**
 * A quantity token for text: `⟦flow|0.0111⟧`.
 * @param quantity physical quantity of the value
 * @param si the value in SI (temperature in °C, as the engine's public face); kept to 6 significant digits
 */
export function qt(quantity: Quantity, si: number): string {
  return `⟦${quantity}|${Number.isFinite(si) ? String(Number(si.toPrecision(6))) : "NaN"}⟧`;
}
