// The system editor's fields as typed in a save the server refused (helper "typedback"). Without JavaScript the page is
// rendered again from the loader after the post; the refused save answers the posted text beside its errors, and the
// editor shows it over the stored values, so every field reads as the engineer typed it, the refused ones included.
// Pure: nothing here is stored or validated (readSystemForm does that); a save that goes through, or a page loaded
// without a post, shows the stored values as before.
import { MAX_PROFILE_STEPS } from "./energy";
import { defaultSystemInput, MAX_RUNS, newRun } from "./hydraulics";
import { EDITOR_FITTINGS, systemFormValues, type FormLike } from "./system-form";
import type { UnitChoice } from "../shared/units";

type Stored = ReturnType<typeof systemFormValues>;
/** A run's values: fitting counts as stored (numbers) or as typed (text). */
type RunValues = Omit<Stored["runs"][number], "fittings"> & { fittings: Record<string, number | string> };
/** What the editor shows: the stored values with the typed ones over them, and which runs were ticked "remove on save". */
export type TypedValues = Omit<Stored, "runs"> & { runs: RunValues[]; removeRun: boolean[] };

/** The posted text of the editor's own fields, by field name. */
export type TypedFields = Record<string, string>;

/** Longest text kept of one posted field: longer than any field the editor reads (a system's name is cut to 160). */
export const TYPED_MAX_CHARS = 200;

const TOP = ["name", "runCount", "addRun", "fluidKind", "fluidName", "density", "viscosity", "vaporPressure", "temperature", "mode", "staticLow", "staticHigh", "pressureDifference", "controlHead", "suctionSurfacePressure", "suctionStaticHead", "dutyFlow", "dutyHead", "flowMax", "hoursPerYear", "tariffPerKWh", "npshMargin", "tolMinus", "tolPlus"] as const;
const RUN = ["side", "name", "table", "nominal", "diameter", "material", "materialShown", "roughness", "agedRoughness", "length", "extraK", "remove", ...EDITOR_FITTINGS.map(([id]) => `fit.${id}`)] as const;
const ENERGY = ["energy.control", "energy.profileKind", "energy.years", "energy.escalation", "energy.discount"];

/** The editor's field names a post may carry back: its top-level fields, each run's (`run.N.*`) and the duty cycle's (`energy.*`). */
function editorFieldNames(): string[] {
  const names: string[] = [...TOP, ...ENERGY];
  for (let i = 0; i < MAX_PROFILE_STEPS; i++) names.push(`energy.step.${i}.pct`, `energy.step.${i}.hours`);
  for (let i = 0; i < MAX_RUNS; i++) for (const k of RUN) names.push(`run.${i}.${k}`);
  return names;
}

/** The posted text fields of the editor's form (its own names only; strings only, each cut to TYPED_MAX_CHARS). */
export function typedFields(form: FormLike): TypedFields {
  const out: TypedFields = {};
  for (const name of editorFieldNames()) {
    const x = form.get(name);
    if (typeof x === "string") out[name] = x.slice(0, TYPED_MAX_CHARS);
  }
  return out;
}

/** A run the stored document does not hold at this position (the posted run count is above the stored): blank fields. */
const blankRun = (side: string): RunValues => ({
  side: side === "suction" ? "suction" : "discharge",
  name: "",
  table: "",
  nominal: "",
  stored: null,
  diameter: "",
  diameterShown: "",
  material: "",
  materialShown: "",
  roughness: "",
  agedRoughness: "",
  length: "",
  extraK: "",
  fittings: {},
});

/**
 * The editor's values with each field posted in `typed` in place of the stored one; runs as many as posted, and the run
 * its "+ suction run" / "+ discharge run" button added (`addRun`, as readSystemForm adds it: newRun, shown in `sys`).
 * `typed` absent: `f` itself.
 */
export function typedOver(f: Stored, typed: TypedFields | null | undefined, sys: UnitChoice): TypedValues {
  if (!typed) return { ...f, removeRun: f.runs.map(() => false) };
  const out = { ...f } as Record<string, unknown>;
  for (const k of TOP) if (k !== "name" && k !== "runCount" && typed[k] !== undefined) out[k] = typed[k];
  const count = /^\d+$/.test(typed.runCount ?? "") ? Math.min(Number(typed.runCount), MAX_RUNS) : f.runs.length;
  const runs: RunValues[] = [];
  const removeRun: boolean[] = [];
  for (let i = 0; i < count; i++) {
    const p = `run.${i}.`;
    const base = f.runs[i] ?? blankRun(typed[`${p}side`] ?? "");
    const r = { ...base, fittings: { ...base.fittings } } as RunValues & Record<string, unknown>;
    for (const k of RUN) {
      const x = typed[`${p}${k}`];
      if (x === undefined || k === "remove") continue;
      if (k.startsWith("fit.")) r.fittings[k.slice(4)] = x;
      else if (k === "side") r.side = x === "suction" ? "suction" : "discharge";
      else r[k] = x;
    }
    runs.push(r);
    removeRun.push(typed[`${p}remove`] !== undefined);
  }
  // The refused post's added run (it was lost: the page showed the runs posted and not the one the button added).
  const add = typed.addRun;
  if ((add === "suction" || add === "discharge") && runs.length < MAX_RUNS) {
    runs.push(systemFormValues({ ...defaultSystemInput(), runs: [newRun(add, add === "suction" ? "Suction run" : "Discharge run")] }, sys).runs[0]);
    removeRun.push(false);
  }
  return { ...(out as Stored), runs, removeRun };
}

/** The adjust form's fields (AdjustForm) and the price form's (CandidateCycle), as a refused post carries them back. */
export const ADJUST_FIELDS = ["method", "ratio", "arrangement", "dutyPumps", "standbyPumps", "motorRating", "serviceFactor", "ieClass"] as const;
export const PRICE_FIELDS = ["purchasePrice"] as const;

/** One candidate form's fields as posted in a refused post, under the key its error is under (`adj.<id>`, `price.<id>`). */
export type TypedForm = { key: string; fields: TypedFields };

/** The posted text of `names` (strings only, each cut to TYPED_MAX_CHARS), for the form whose error is under `key`. */
export function typedCandidateForm(form: FormLike, key: string, names: readonly string[]): TypedForm {
  const fields: TypedFields = {};
  for (const name of names) {
    const x = form.get(name);
    if (typeof x === "string") fields[name] = x.slice(0, TYPED_MAX_CHARS);
  }
  return { key, fields };
}

/** The typed fields for the form under `key` after a refused post of that form, or undefined (its stored values stand). */
export const typedFor = (t: TypedForm | null | undefined, key: string): TypedFields | undefined => (t?.key === key ? t.fields : undefined);
