// The ranges the static heads and the duty point take where a system is entered (the editor's form, system-form.ts; the
// preview API and every save, `SystemInputEntrySchema` in system-input.ts): past them a unit was mistaken, as 1e12 SI, the
// form's magnitude, let through. Refused in the words of a pipe run's numbers (run-ranges.ts `outOfRange`: the field and
// its range in the unit typed). A system stored before them still reads and computes (the stored schema has no range);
// it is held to them when saved again. Pure.
import { LIMIT_ROUNDING } from "~/engine/quantityText";
import { outOfRange, type NumberRange } from "./run-ranges";

// Common practice, from memory: the highest-head pumps built (multistage boiler feed, high-pressure mine dewatering) give
// some 3000–4000 m; a discharge surface far below the suction surface (a gravity main through a booster) some hundreds of
// metres below; the largest pumps (flood-control, irrigation and cooling-water stations) move some tens of m³/s each,
// small circulators from about 0.1 m³/h at half a metre. The ends leave room around those, in round SI numbers.

/** Static head at either level, m: −1000 to 3000 (common practice, from memory). */
export const STATIC_LOW_RANGE: NumberRange = { label: "Static head at low level", q: "head", min: -1000, max: 3000 };
export const STATIC_HIGH_RANGE: NumberRange = { ...STATIC_LOW_RANGE, label: "Static head at high level" };
/** Duty flow, m³/s: 1e-5 (0.036 m³/h, 0.01 L/s) to 100 (360,000 m³/h) (common practice, from memory). */
export const DUTY_FLOW_RANGE: NumberRange = { label: "Duty flow", q: "flow", min: 1e-5, max: 100 };
/** Duty head, m: 0.1 to 5000 (common practice, from memory). */
export const DUTY_HEAD_RANGE: NumberRange = { label: "Duty head", q: "head", min: 0.1, max: 5000 };

/**
 * Whether `x` (SI) is inside `r`, to 1 part in 10⁸ of the end (engine quantityText.ts `LIMIT_ROUNDING`): an end typed as the
 * refusal shows it in another unit comes back a hair outside after the conversion (0.036 m³/h is 9.999999999999999e-6
 * m³/s), and is taken; a number refused prints apart from the end beside it in every unit (at 1 part in 10⁹ a duty flow
 * 2 parts in 10⁹ under 1e-5 m³/s was refused as "Sent: 0.158503231 gpm" beside "from 0.158503231 gpm").
 */
export const inside = (r: NumberRange, x: number) => x >= r.min - LIMIT_ROUNDING * Math.abs(r.min) && x <= r.max + LIMIT_ROUNDING * Math.abs(r.max);

/** Each ranged number of an entered system by its keys in the document, dotted (the preview API's refusals, preview-words.ts). */
export const ENTRY_RANGES: Readonly<Record<string, NumberRange>> = { staticLow: STATIC_LOW_RANGE, staticHigh: STATIC_HIGH_RANGE, "duty.flow": DUTY_FLOW_RANGE, "duty.head": DUTY_HEAD_RANGE };

/** The entered system's static heads and duty outside their ranges: each number's keys in the document and its refusal. */
export function dutyRangeProblems(s: { staticLow: number; staticHigh: number; duty: { flow: number; head: number } | null }): { keys: string[]; message: string }[] {
  const at: Record<string, number | undefined> = { staticLow: s.staticLow, staticHigh: s.staticHigh, "duty.flow": s.duty?.flow, "duty.head": s.duty?.head };
  return Object.entries(ENTRY_RANGES).flatMap(([path, r]) => {
    const x = at[path];
    return x === undefined || inside(r, x) ? [] : [{ keys: path.split("."), message: outOfRange(r, x) }];
  });
}
