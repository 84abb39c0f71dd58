// Power figures with their basis for pumps in parallel or series (lib/projects/power-basis.ts): a total of the duty
// pumps as "5.32 kW per pump, 10.6 kW for 2 duty pumps", one pump's figure as "7.34 kW per pump"; a single pump's
// figures as they always read ("10.6 kW"). In the reader's units. Pure; used by the candidates table and the report.
import { fmtPower, type UnitChoice } from "~/lib/shared/units";
import type { PumpsBasis } from "~/lib/projects/power-basis";

/**
 * A power worked out for all duty pumps together, with one pump's share beside it when there are several.
 * @param units the reader's units
 * @param total the duty pumps' power together, W
 * @param b the basis (null: a single pump)
 */
export function totalPowerText(units: UnitChoice, total: number | null | undefined, b: PumpsBasis | null): string {
  if (!b || total == null || !Number.isFinite(total)) return fmtPower(units, total);
  return `${fmtPower(units, total / b.n)} per pump, ${fmtPower(units, total)} ${b.forAll}`;
}

/**
 * One pump's power (the largest on its curve, its motor's limit), said to be per pump when there are several.
 * @param units the reader's units
 * @param perPump one pump's power, W
 * @param b the basis (null: a single pump)
 */
export function perPumpPowerText(units: UnitChoice, perPump: number | null | undefined, b: PumpsBasis | null): string {
  return b && perPump != null && Number.isFinite(perPump) ? `${fmtPower(units, perPump)} per pump` : fmtPower(units, perPump);
}
