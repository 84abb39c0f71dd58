// What NPSHa at the duty says of a search, in words with its number (quantity tokens, rendered in the reader's units by
// each surface): the pumps left out for NPSH at the duty, and — whenever NPSHa there is at or below zero, whether or not
// any pump was left out for it — that no pump can run at the duty without cavitating. The search judges NPSHa below zero
// as zero (search.server.ts `searchOptionsFor`): every pump with an NPSHr at the duty is then left out whatever its NPSHr,
// and a pump that publishes none there is not ruled out by it, yet cavitates there too (common practice: NPSHa ≤ 0 is a
// cavitation risk whatever the pump). Used by the search page (stats line and note) and the systems search read API
// (`npshaNote`). Pure.
import { qtAboveZero } from "~/engine/quantityText";

/** NPSHa at the duty at or below zero (m): no NPSHr decides there. */
const atOrBelowZero = (npshaAtDuty: number | null | undefined): npshaAtDuty is number => npshaAtDuty != null && npshaAtDuty <= 0;

/**
 * The note where NPSHa at the duty is at or below zero: "NPSHa at the duty is -0.25 m, at or below zero: no pump can run
 * there without cavitating, whatever its NPSHr. 2 pumps with an NPSHr at the duty were left out for it; a pump without
 * one is not ruled out by it, and cavitates there too."; null where NPSHa there is above zero or not known.
 * @param npshaAtDuty NPSHa at the duty flow, m (the true value, negative allowed; null: no duty or not known)
 * @param leftOut pumps the search left out for NPSH at the duty (count)
 */
export function npshaAtDutyNote(npshaAtDuty: number | null | undefined, leftOut: number): string | null {
  if (!atOrBelowZero(npshaAtDuty)) return null;
  const head = `NPSHa at the duty is ${qtAboveZero("head", npshaAtDuty, [])}, at or below zero: no pump can run there without cavitating, whatever its NPSHr.`;
  return leftOut > 0
    ? `${head} ${leftOut} pump${leftOut === 1 ? "" : "s"} with an NPSHr at the duty ${leftOut === 1 ? "was" : "were"} left out for it; a pump without one is not ruled out by it, and cavitates there too.`
    : `${head} A pump without an NPSHr at the duty is not ruled out by it, and cavitates there too.`;
}

/**
 * The stats line's count of pumps left out for NPSH at the duty: "23 left out because their NPSHr at the duty is above
 * the NPSHa there (1.234 m)"; where NPSHa there is at or below zero no NPSHr is the reason, and the count points to the
 * note (`npshaAtDutyNote`), which carries NPSHa and the count.
 * @param count pumps left out (count)
 * @param npshaAtDuty NPSHa at the duty flow, m (null: not known)
 */
export function npshLeftOutText(count: number, npshaAtDuty: number | null | undefined): string {
  if (atOrBelowZero(npshaAtDuty)) return `${count} left out for NPSH at the duty (NPSHa there at or below zero: see below)`;
  return `${count} left out because their NPSHr at the duty is above the NPSHa there (${npshaAtDuty != null ? qtAboveZero("head", npshaAtDuty, []) : "—"})`;
}
