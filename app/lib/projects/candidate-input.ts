// A candidate as stored: how it is run (adjustment: speed or trim, arrangement, motor), its curve
// points from the database and what its model publishes for the catalogue rule. Pure.
import * as v from "valibot";
import { DEFAULT_IE_CLASS, IE_CLASSES, type PumpPoint } from "~/engine";

/** Pumps of one arrangement: duty pumps 1 to MAX_DUTY_PUMPS, standby 0 to MAX_STANDBY_PUMPS (the form reads its counts to these). */
export const MAX_DUTY_PUMPS = 8;
export const MAX_STANDBY_PUMPS = 8;
// Messages name the field and its range as the adjustment form shows it (the ratio in percent).
const RATIO = "The ratio is 30 % to 120 % (blank: solve for the duty).";
const DUTY = `The number of duty pumps is a whole number from 1 to ${MAX_DUTY_PUMPS}.`;
const STANDBY = `The number of standby pumps is a whole number from 0 to ${MAX_STANDBY_PUMPS}.`;
const SERVICE_FACTOR = "The service factor is 1 to 1.5.";
const MOTOR = "The motor rating is a number, 0 or more (blank or 0: suggested).";
const IE_CLASS = `The motor efficiency class is one of ${IE_CLASSES.join(", ")} (IEC 60034-30-1).`;
export const AdjustmentSchema = v.object({
  method: v.picklist(["none", "speed", "trim"]),
  /** Speed ratio N₂/N₁ or diameter ratio D₂/D₁; null: solve it to hit the duty. */
  ratio: v.nullable(v.pipe(v.number(), v.finite(), v.minValue(0.3, RATIO), v.maxValue(1.2, RATIO))),
  arrangement: v.picklist(["single", "parallel", "series"]),
  dutyPumps: v.pipe(v.number(), v.integer(DUTY), v.minValue(1, DUTY), v.maxValue(MAX_DUTY_PUMPS, DUTY)),
  standbyPumps: v.pipe(v.number(), v.integer(STANDBY), v.minValue(0, STANDBY), v.maxValue(MAX_STANDBY_PUMPS, STANDBY)),
  /** Motor rating W (0: not set) and service factor. */
  motorRating: v.pipe(v.number(MOTOR), v.finite(MOTOR), v.minValue(0, MOTOR), v.maxValue(1e9, "A motor rating above 1 GW? Check the unit.")),
  serviceFactor: v.pipe(v.number(), v.finite(), v.minValue(1, SERVICE_FACTOR), v.maxValue(1.5, SERVICE_FACTOR)),
  /** Motor efficiency class (IEC 60034-30-1); adjustments stored before it parse as IE3. */
  ieClass: v.optional(v.picklist(IE_CLASSES, IE_CLASS), DEFAULT_IE_CLASS),
});
export type Adjustment = v.InferOutput<typeof AdjustmentSchema>;
export const DEFAULT_ADJUSTMENT: Adjustment = { method: "none", ratio: null, arrangement: "single", dutyPumps: 1, standbyPumps: 0, motorRating: 0, serviceFactor: 1, ieClass: DEFAULT_IE_CLASS };

export type CurvePointsIn = { flow: number; head: number; efficiency: number | null; power: number | null; npshr: number | null }[];

/** What the model publishes, for the catalogue rule (SI; null when not known). */
export type CatalogueData = { impellerMin: number | null; impellerMax: number | null; ratedSpeed: number | null };

/** Stored curve points (nullable columns) as engine points (absent columns left out). */
export function toPumpPoints(points: CurvePointsIn): PumpPoint[] {
  return points.map((p) => {
    const o: PumpPoint = { flow: p.flow, head: p.head };
    if (p.efficiency != null) o.efficiency = p.efficiency;
    if (p.power != null) o.power = p.power;
    if (p.npshr != null) o.npshr = p.npshr;
    return o;
  });
}
