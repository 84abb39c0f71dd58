// A candidate's stored adjustment (candidates.adjustment_json) read honestly: checked against AdjustmentSchema on every
// read (stored-doc.ts). One that does not pass (an older or looser schema, a hand edit, text that is not JSON) is never
// read as "as published, one pump" (DEFAULT_ADJUSTMENT): the candidate is not evaluated, compared or selected; the
// system page lists it as needing review with its problems and offers the adjust form (filled with the stored values,
// `adjustFormValues`) or removal. Pure.
import { DEFAULT_IE_CLASS, IE_CLASSES } from "~/engine";
import { AdjustmentSchema, type Adjustment } from "./candidate-input";
import { docPathLabel, readStoredDoc, type DocProblem, type DocWords } from "./stored-doc";

export type StoredAdjustment = { ok: true; adjustment: Adjustment } | { ok: false; raw: unknown; problems: DocProblem[] };

const WORDS: DocWords = {
  whole: "the stored adjustment",
  labels: {
    method: "adjusted by (nothing, speed or trim)", ratio: "ratio", arrangement: "pumps (one, parallel or series)", dutyPumps: "duty pumps",
    standbyPumps: "standby pumps", motorRating: "motor rating", serviceFactor: "service factor", ieClass: "motor efficiency class",
  },
  items: {},
  quantities: { motorRating: "power" },
  // The ratio is stored as a fraction and typed (and refused) as a percentage.
  number: (key, x) => (key === "ratio" ? `${Number((x * 100).toPrecision(6))} %` : undefined),
};

/** The stored adjustment when it passes the schema, else what is wrong with it (never DEFAULT_ADJUSTMENT in its place). */
export function readStoredAdjustment(json: string): StoredAdjustment {
  const r = readStoredDoc(json, AdjustmentSchema, WORDS);
  return r.ok ? { ok: true, adjustment: r.value } : { ok: false, raw: r.raw, problems: r.problems };
}

/** Where in the adjustment, in words. */
export const adjustmentPathLabel = (keys: readonly (string | number)[]) => docPathLabel(keys, WORDS);

type Obj = Record<string, unknown>;
const num = (o: Obj, k: string) => (typeof o[k] === "number" ? (o[k] as number) : NaN);

/**
 * A stored adjustment that does not pass the schema, as the adjust form can show it: each number as stored (out of
 * range too, refused again when applied), one that is missing or not a number NaN (a blank field), a choice that is
 * none of the options the form's first. Only to fill the form, never to compute with.
 */
export function adjustFormValues(raw: unknown): Adjustment {
  const o: Obj = raw && typeof raw === "object" && !Array.isArray(raw) ? (raw as Obj) : {};
  const pick = <T extends string>(k: string, options: readonly T[]): T => (options.includes(o[k] as T) ? (o[k] as T) : options[0]);
  return {
    method: pick("method", ["none", "speed", "trim"] as const),
    ratio: typeof o.ratio === "number" ? o.ratio : null,
    arrangement: pick("arrangement", ["single", "parallel", "series"] as const),
    dutyPumps: num(o, "dutyPumps"),
    standbyPumps: num(o, "standbyPumps"),
    motorRating: num(o, "motorRating"),
    serviceFactor: num(o, "serviceFactor"),
    ieClass: IE_CLASSES.includes(o.ieClass as Adjustment["ieClass"]) ? (o.ieClass as Adjustment["ieClass"]) : DEFAULT_IE_CLASS,
  };
}
