// Reads the candidate adjustment form (AdjustForm) into an Adjustment: numbers through the forms' strict
// reader (shared/decimal.ts: a decimal point or comma, 1,500 refused as ambiguous), the ratio in percent
// (blank: solve for the duty), the motor rating in the user's power unit (blank or 0: suggested), the
// service factor (blank: 1). Text that is not a number is an error naming its field, never a silent
// default. Pure: the route validates with AdjustmentSchema through this.
import * as v from "valibot";
import { AdjustmentSchema, MAX_MAGNITUDE, type Adjustment } from "./hydraulics";
import { decimalField } from "../shared/decimal";
import { fromChosen, type UnitChoice } from "../shared/units";

export function readAdjustForm(form: FormData, sys: UnitChoice): { adjustment: Adjustment; error: null } | { adjustment: null; error: string } {
  const errors: Record<string, string> = {};
  const ratio = decimalField(form.get("ratio"), "ratio", "the ratio", errors);
  const motor = decimalField(form.get("motorRating"), "motorRating", "the motor rating", errors) ?? 0;
  if (motor < 0) errors.motorRating ??= "The motor rating must be 0 or more (blank or 0: suggested).";
  const serviceFactor = decimalField(form.get("serviceFactor"), "serviceFactor", "the service factor", errors) ?? 1;
  const dutyPumps = decimalField(form.get("dutyPumps"), "dutyPumps", "the number of duty pumps", errors) ?? 1;
  const standbyPumps = decimalField(form.get("standbyPumps"), "standbyPumps", "the number of standby pumps", errors) ?? 0;
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
