/**
 * Per-unit values: "p.u." (per unit) is a ratio to a base quantity (common practice in electrical engineering, and in
 * pump curves drawn in per-unit of the best efficiency point), not a unit of its own. For efficiency a per-unit value is
 * the fraction 0..1 (units-in-headers.ts reads it so). A power header in per-unit ("P.U.", "Power (p.u.)", "P per unit")
 * holds ratios to a base power the file does not give: read in the power field's default kW, 0.8 p.u. became 800 W of
 * shaft power whatever the base. Such a column is left unmapped ("ignore") and checkMapping says why
 * (notShaftPowerMessage with PER_UNIT_POWER). Pure: no Node or DOM APIs. Patterns run on the normalised, lower-case header.
 */
import type { NotShaftPower } from "./input-power";

/** "p.u.", "p. u.", "p.u", "per unit", "per-unit": the dots tell it from P_u, the pump power output (hydraulic-power.ts). */
export const PER_UNIT = /(?<![\p{L}\p{N}])(?:p\.\s*u\.?|per\s*-?\s*unit)(?![\p{L}\p{N}])/u;

/** A per-unit power, for notShaftPowerMessage (input-power.ts). */
export const PER_UNIT_POWER: NotShaftPower = {
  names: "a per-unit value (p.u.: a ratio to a base power), not a power",
  leftOut: "",
  values: "per-unit ratios",
  note: "a per-unit (p.u.) ratio, not a power in kW, W or hp",
  why:
    "Dutymark's power is the pump's shaft power (P2) in kW, W or hp, and a per-unit value becomes one only when multiplied by its base power, " +
    "which the file does not give: read in kW, 0.8 p.u. would become 800 W of shaft power whatever the base",
};
