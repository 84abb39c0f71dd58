// The search page's count of pumps left out for NPSH at the duty, in words with the number it was judged on. Pure.
import { fmtQExact, type UnitChoice } from "~/lib/shared/units";

/**
 * "23 left out because their NPSHr at the duty is above the NPSHa there (1.234 m)"; where NPSHa at the duty is at or
 * below zero no NPSHr is the reason (the search judges them against zero, search.server.ts `searchOptionsFor`): no pump
 * runs there without cavitating, whatever its NPSHr, and the line says so.
 * @param count pumps left out
 * @param npshaAtDuty NPSHa at the duty flow, m (null: not known)
 * @param units the reader's units
 */
export function npshLeftOutText(count: number, npshaAtDuty: number | null, units: UnitChoice): string {
  if (npshaAtDuty != null && npshaAtDuty <= 0)
    return `${count} left out because NPSHa at the duty is ${fmtQExact(units, "head", npshaAtDuty, [0])}, at or below zero: no pump can run there without cavitating, whatever its NPSHr`;
  return `${count} left out because their NPSHr at the duty is above the NPSHa there (${npshaAtDuty != null ? fmtQExact(units, "head", npshaAtDuty, [0]) : "—"})`;
}
