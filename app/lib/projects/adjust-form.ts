// Reads the candidate adjustment form (AdjustForm) into an Adjustment: numbers through the forms' strict
// reader (shared/decimal.ts: a decimal point or comma, 1,500 refused as ambiguous), the ratio in percent
// (blank: solve for the duty), the motor rating in the user's power unit (blank or 0: suggested), the
// service factor (blank: 1), the duty and standby pumps as counts (digits only; blank: 1 and 0). Text that is not a
// number is an error naming its field, never a silent default. Pure: the route validates with AdjustmentSchema through this.
import * as v from "valibot";
import { AdjustmentSchema, MAX_DUTY_PUMPS, MAX_MAGNITUDE, MAX_STANDBY_PUMPS, type Adjustment } from "./hydraulics";
import { countField, decimalField } from "../shared/decimal";
import { fromChosen, type UnitChoice } from "../shared/units";

export function readAdjustForm(form: FormData, sys: UnitChoice): { adjustment: Adjustment; error: null } | { adjustment: null; error: string } {
  const errors: Record<string, string> = {};
  const ratio = decimalField(form.get("ratio"), "ratio", "the ratio", errors);
  const motor = decimalField(form.get("motorRating"), "motorRating", "the motor rating", errors) ?? 0;
  if (motor < 0) errors.motorRating ??= "The motor rating must be 0 or more (blank or 0: suggested).";
  const serviceFactor = decimalField(form.get("serviceFactor"), "serviceFactor", "the service factor", errors) ?? 1;
  // Counts as digits only (shared/decimal.ts countField), to the schema's own limits: "1e0" or "2,0" were read as pumps.
  const dutyPumps = countField(form.get("dutyPumps"), "dutyPumps", "the number of duty pumps", errors, MAX_DUTY_PUMPS, 1, 1) ?? 1;
  const standbyPumps = countField(form.get("standbyPumps"), "standbyPumps", "the number of standby pumps", errors, MAX_STANDBY_PUMPS) ?? 0;
  const messages = Object.values(errors);
  if (messages.length) return { adjustment: null, error: messages.join(" ") };
  const adj = v.safeParse(AdjustmentSchema, {
    method: form.get("method"),
    ratio: ratio == null ? null : ratio / 100,
    arrangement: form.get("arrangement"),
    dutyPumps,
    standbyPumps,
    // A rating past MAX_MAGNITUDE would overflow on the way to W (1e308 kW): handed on as typed, for the schema to refuse.
    motorRating: motor > 0 ? (motor > MAX_MAGNITUDE ? motor : fromChosen(sys, "power", motor)) : 0,
    serviceFactor,
    ieClass: form.get("ieClass") ?? undefined,
  });
  return adj.success ? { adjustment: adj.output, error: null } : { adjustment: null, error: adj.issues.map((i) => i.message).join("; ") };
}
