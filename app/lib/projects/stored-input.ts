// A system's stored input read honestly. The document (input_json) is checked against SystemInputSchema
// on every read; one that no longer passes (stored under an older or looser schema, edited in the database,
// text that is not JSON) is never replaced by the default system. The services refuse to compute with it
// (`getSystem`: 409), lists mark it "needs review", and the system page names each problem in plain words
// and offers the editor filled with the stored values (`editorInput`) so it can be fixed and saved. Pure.
import { CONTROL_MODES, DEFAULT_FLOW_TOLERANCE, type Quantity } from "~/engine";
import { DEFAULT_ENERGY_SETTINGS } from "./energy";
import { SystemInputSchema, type SystemInput } from "./system-input";
import { fieldFor } from "./system-form";
import { docPathLabel, readStoredDoc, type DocProblem, type DocWords } from "./stored-doc";

export { MAX_PROBLEMS_LISTED, problemLine, problemPlaces } from "./stored-doc";

/** One thing wrong with a stored input: where (`path`, dotted, and `label`, in words), what (`message`) and the value stored there. */
export type InputProblem = DocProblem;
export type StoredInput = { ok: true; input: SystemInput } | { ok: false; raw: unknown; problems: InputProblem[] };

/** The system input's keys in words. */
export const INPUT_LABELS: Record<string, string> = {
  fluid: "fluid", kind: "kind", name: "name", density: "density", dynamicViscosity: "viscosity", vaporPressure: "vapour pressure",
  temperatureC: "temperature", mode: "system kind (open or closed loop)", staticLow: "static head (low level)", staticHigh: "static head (high level)",
  pressureDifference: "pressure difference", controlHead: "control head", suctionSurfacePressure: "suction surface pressure",
  suctionStaticHead: "suction surface above the pump", runs: "pipe runs", duty: "duty point", flow: "flow", head: "head",
  flowMax: "largest flow drawn", hoursPerYear: "operating hours per year", tariffPerKWh: "energy tariff", npshMargin: "NPSH margin ratio",
  flowTolerance: "duty flow tolerance", minus: "below the duty", plus: "above the duty", energy: "load profile and life-cycle cost",
  control: "control", profile: "load profile", years: "years", escalation: "tariff escalation", discountRate: "discount rate",
  flowFraction: "flow fraction", hours: "hours", side: "side", pipeTable: "pipe table", nominal: "nominal size", diameter: "inner diameter",
  material: "material", roughness: "roughness", agedRoughness: "aged roughness", length: "length", fittings: "fittings", id: "fitting id",
  count: "count", extraK: "extra K",
};
/** A list's item in words: `runs` 1 → "pipe run 2". */
export const INPUT_ITEMS: Record<string, string> = { runs: "pipe run", fittings: "fitting", profile: "step" };
/** The quantity of a number stored under this key (its unit on the page); others are plain numbers. */
export const INPUT_QUANTITIES: Record<string, Quantity> = {
  temperatureC: "temperature", staticLow: "head", staticHigh: "head", controlHead: "head", suctionStaticHead: "head", head: "head",
  pressureDifference: "pressure", suctionSurfacePressure: "pressure", vaporPressure: "pressure", flow: "flow", flowMax: "flow",
  diameter: "diameter", roughness: "roughness", agedRoughness: "roughness", length: "length", density: "density", dynamicViscosity: "dynamicViscosity",
};
const WORDS: DocWords = { whole: "the stored document", labels: INPUT_LABELS, items: INPUT_ITEMS, quantities: INPUT_QUANTITIES };

/** The stored document: its input when it passes the schema, else what is wrong with it (never a default in its place). */
export function readStoredInput(json: string): StoredInput {
  const r = readStoredDoc(json, SystemInputSchema, WORDS);
  return r.ok ? { ok: true, input: r.value } : { ok: false, raw: r.raw, problems: r.problems };
}

/** Where in the document, in words: ["runs", 1, "diameter"] → "pipe run 2, inner diameter". */
export const pathLabel = (keys: readonly (string | number)[]): string => docPathLabel(keys, WORDS);

/** The problems as the editor's field errors, each under the form field of its path (as `readSystemForm` places its own). */
export function problemFieldErrors(problems: readonly InputProblem[]): Record<string, string> {
  const out: Record<string, string> = {};
  for (const p of problems) out[fieldFor(p.keys)] ??= `${p.message}${p.stored ? ` Stored: ${p.stored}.` : ""}`;
  return out;
}

// ── The stored values for the editor ─────────────────────────────────────────────────────────
type Obj = Record<string, unknown>;
const obj = (x: unknown): Obj => (x && typeof x === "object" && !Array.isArray(x) ? (x as Obj) : {});
/** A number as stored (out of range too, so its field shows what is wrong); anything else NaN (a blank field). */
const num = (o: Obj, k: string) => (typeof o[k] === "number" ? (o[k] as number) : NaN);
const str = (o: Obj, k: string, max: number) => (typeof o[k] === "string" ? (o[k] as string).slice(0, max) : "");

/**
 * A document that does not pass the schema, as far as the editor can show it: every number as stored (a
 * field out of range shows its stored value, refused again on save until fixed), a missing value or one that
 * is not a number blank (a required field then asks for it), a choice that is none of the options the
 * editor's first (its problem is listed beside the form). Never computed with: the page computes nothing
 * until the fixed inputs are saved. A part the schema itself defaults when absent from a document (flow tolerance, energy)
 * takes that default; from text that is not JSON (`raw` undefined) nothing is read, so nothing is filled in.
 */
export function editorInput(raw: unknown): SystemInput {
  const d = obj(raw);
  const absent = (k: string) => d[k] === undefined && raw !== undefined; // absent from a document read (not from unreadable text)
  const f = obj(d.fluid);
  const runs = Array.isArray(d.runs) ? d.runs.slice(0, 40) : [];
  const duty = d.duty == null ? null : obj(d.duty);
  const tol = obj(d.flowTolerance);
  const e = obj(d.energy);
  const steps = Array.isArray(e.profile) ? e.profile.slice(0, 8).map(obj) : null;
  return {
    fluid: f.kind === "custom" ? { kind: "custom", name: str(f, "name", 60), density: num(f, "density"), dynamicViscosity: num(f, "dynamicViscosity"), vaporPressure: num(f, "vaporPressure") } : { kind: "water" },
    temperatureC: num(d, "temperatureC"),
    mode: d.mode === "closed-loop" ? "closed-loop" : "open",
    staticLow: num(d, "staticLow"),
    staticHigh: num(d, "staticHigh"),
    pressureDifference: num(d, "pressureDifference"),
    controlHead: num(d, "controlHead"),
    suctionSurfacePressure: num(d, "suctionSurfacePressure"),
    suctionStaticHead: num(d, "suctionStaticHead"),
    runs: runs.map((x) => {
      const r = obj(x);
      return {
        side: r.side === "suction" ? "suction" : "discharge",
        name: str(r, "name", 80),
        pipeTable: str(r, "pipeTable", 40),
        nominal: str(r, "nominal", 20),
        diameter: num(r, "diameter"),
        material: str(r, "material", 40) || "steel",
        roughness: num(r, "roughness"),
        agedRoughness: num(r, "agedRoughness"),
        length: num(r, "length"),
        fittings: (Array.isArray(r.fittings) ? r.fittings.map(obj) : []).filter((x) => typeof x.id === "string" && typeof x.count === "number").map((x) => ({ id: x.id as string, count: x.count as number })),
        extraK: num(r, "extraK"),
      };
    }),
    duty: duty ? { flow: num(duty, "flow"), head: num(duty, "head") } : null,
    flowMax: num(d, "flowMax"),
    hoursPerYear: num(d, "hoursPerYear"),
    tariffPerKWh: num(d, "tariffPerKWh"),
    npshMargin: num(d, "npshMargin"),
    flowTolerance: absent("flowTolerance") ? { ...DEFAULT_FLOW_TOLERANCE } : { minus: num(tol, "minus"), plus: num(tol, "plus") },
    energy:
      absent("energy")
        ? { ...DEFAULT_ENERGY_SETTINGS }
        : {
            control: CONTROL_MODES.find((m) => m.id === e.control)?.id ?? "fixed-speed",
            profile: steps ? steps.map((s) => ({ flowFraction: num(s, "flowFraction"), hours: num(s, "hours") })) : null,
            years: num(e, "years"),
            escalation: num(e, "escalation"),
            discountRate: num(e, "discountRate"),
          },
  };
}
