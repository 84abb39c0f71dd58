// Reads the candidate adjustment form (AdjustForm) into an Adjustment: decimal commas accepted,
// the ratio in percent (blank: solve for the duty), the motor rating in the user's power unit
// (blank or 0: suggested). Pure: the route validates with AdjustmentSchema through this.
import * as v from "valibot";
import { AdjustmentSchema, MAX_MAGNITUDE, type Adjustment } from "./hydraulics";
import { fromChosen, type UnitChoice } from "../shared/units";

const num = (x: FormDataEntryValue | null) => Number(String(x ?? "").trim().replace(",", "."));

export function readAdjustForm(form: FormData, sys: UnitChoice): { adjustment: Adjustment; error: null } | { adjustment: null; error: string } {
  const ratioRaw = String(form.get("ratio") ?? "").trim();
  const motorRaw = num(form.get("motorRating")) || 0;
  const adj = v.safeParse(AdjustmentSchema, {
    method: form.get("method"),
    ratio: ratioRaw === "" ? null : num(ratioRaw) / 100,
    arrangement: form.get("arrangement"),
    dutyPumps: Number(form.get("dutyPumps") || 1),
    standbyPumps: Number(form.get("standbyPumps") || 0),
    // A rating past MAX_MAGNITUDE would overflow on the way to W (1e308 kW): handed on as typed, for the schema to refuse.
    motorRating: Number.isFinite(motorRaw) && motorRaw > 0 ? (motorRaw > MAX_MAGNITUDE ? motorRaw : fromChosen(sys, "power", motorRaw)) : 0,
    serviceFactor: num(form.get("serviceFactor") ?? "1") || 1,
    ieClass: form.get("ieClass") ?? undefined,
  });
  return adj.success ? { adjustment: adj.output, error: null } : { adjustment: null, error: adj.issues.map((i) => i.message).join("; ") };
}
