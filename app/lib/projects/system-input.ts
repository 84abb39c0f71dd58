// The engineer's system as stored and edited: one JSON document per system (SI units), its valibot
// schema, the defaults of a new system and run, and what the engine needs from it (fluid, system
// spec, the flow range to draw). Pure.
import * as v from "valibot";
import { fluidAt, innerDiameter, material as materialOf, MATERIALS, PIPE_TABLES, ROUGHNESS_MAX_OF_DIAMETER, STANDARD_ATMOSPHERE, DEFAULT_FLOW_TOLERANCE, type Fluid, type PipeRunSpec, type SystemSpec } from "~/engine";
import { DEFAULT_ENERGY_SETTINGS, EnergySettingsSchema } from "./energy";
import { LIMIT_ROUNDING, qt, qtPair } from "~/engine/quantityText";
import { MAX_MAGNITUDE } from "../shared/decimal";
import { AGED_ROUGHNESS_RANGE, BORE_RANGE, boreTaken, EXTRA_K_RANGE, LENGTH_RANGE, outOfRange, ROUGHNESS_RANGE, type NumberRange } from "./run-ranges";
import { dutyRangeProblems } from "./duty-ranges";
import { LIQUID_TEMPERATURE_RANGE, waterTemperatureProblem } from "./temperature-range";
import { HOURS_IN_YEAR, yearHoursRefusal } from "./year-hours";

// Largest magnitude of any number in a system, SI, as of any number typed (shared/decimal.ts).
export { MAX_MAGNITUDE };
const num = (label: string) =>
  v.pipe(v.number(`${label} must be a number.`), v.finite(`${label} must be a finite number.`), v.check((x) => Math.abs(x) <= MAX_MAGNITUDE, `${label} is far outside any pump system: check the unit.`));
const nonNeg = (label: string) => v.pipe(num(label), v.minValue(0, `${label} cannot be negative.`));
const pos = (label: string) => v.pipe(num(label), v.gtValue(0, `${label} must be greater than zero.`));
/**
 * A number within `r` (above zero instead of from `r.min` where `aboveZero`), every refusal in the words naming the field and
 * its range (run-ranges.ts). Value actions, not `check`: the editor sets aside a run's checks against a bore it could not read.
 * Each end to 1 part in 10⁸ (`LIMIT_ROUNDING`), as `inside`: an end printed in another unit and typed back is taken (decision "inputedge").
 */
const ranged = (r: NumberRange, aboveZero = false) => {
  const words = (i: { input: unknown }) => outOfRange(r, typeof i.input === "number" ? i.input : null);
  return v.pipe(v.number(words), v.finite(words), aboveZero ? v.gtValue(0, words) : v.minValue(r.min - LIMIT_ROUNDING * Math.abs(r.min), words), v.maxValue(r.max + LIMIT_ROUNDING * Math.abs(r.max), words));
};
/** A text field of a run: one message for the wrong type and for the length, with the limit. */
const text = (max: number, words: string) => v.pipe(v.string(words), v.maxLength(max, words));

/** Most fittings of one kind in one run, and most pipe runs in a system (the editor's fields read up to these). */
export const MAX_FITTING_COUNT = 500;
export const MAX_RUNS = 40;

const FITTING_COUNT_WORDS = `A fitting's count is a whole number from 0 to ${MAX_FITTING_COUNT}.`;
export const FittingUseSchema = v.object(
  {
    id: text(60, "A fitting's id is text of at most 60 characters: a fitting of the catalogue."),
    count: v.pipe(v.number(FITTING_COUNT_WORDS), v.integer(FITTING_COUNT_WORDS), v.minValue(0, FITTING_COUNT_WORDS), v.maxValue(MAX_FITTING_COUNT, FITTING_COUNT_WORDS)),
  },
  "A fitting is an object with id and count.",
);

/**
 * Roughness (new or aged) must stay below half the run's inner diameter (the engine's ROUGHNESS_MAX_OF_DIAMETER, system.ts):
 * bumps that high would close the bore. The words of the schema and the editor's field, with both numbers.
 */
export const roughnessNotBelowRadius = (label: string, roughness: number, diameter: number) =>
  `${label} ${qt("roughness", roughness)} is not below half the inner diameter ${qt("diameter", diameter)} (${qt("roughness", diameter * ROUGHNESS_MAX_OF_DIAMETER)}): wall roughness that high would close the bore, which is physically meaningless. Check the unit of each.`;
/** Whether a roughness is below half an inner diameter (the rule of {@link roughnessNotBelowRadius}). */
export const roughnessFits = (roughness: number, diameter: number) => roughness < diameter * ROUGHNESS_MAX_OF_DIAMETER;
const belowDiameter = (key: "roughness" | "agedRoughness", label: string) =>
  v.forward(
    v.check<PipeRunShape, (i: v.CheckIssue<PipeRunShape>) => string>(
      (r) => roughnessFits(r[key], r.diameter),
      (i) => roughnessNotBelowRadius(label, i.input[key], i.input.diameter),
    ),
    [key],
  );
/** The rule selections were frozen under before helper "systexts": roughness below the whole inner diameter. */
const belowWholeDiameter = (key: "roughness" | "agedRoughness", label: string) =>
  v.forward(
    v.check<PipeRunShape, (i: v.CheckIssue<PipeRunShape>) => string>(
      (r) => r[key] < r.diameter,
      (i) => `${label} ${qt("roughness", i.input[key])} is not below the inner diameter ${qt("diameter", i.input.diameter)}: wall roughness that high would close the bore, which is physically meaningless.`,
    ),
    [key],
  );
type PipeRunShape = v.InferOutput<typeof PipeRunObject>;

const PipeRunObject = v.object(
  {
    side: v.picklist(["suction", "discharge"], 'A run\'s side is "suction" or "discharge".'),
    name: text(80, "A run's name is text of at most 80 characters."),
    /** Catalogue table and nominal size; empty when the inner diameter is typed. */
    pipeTable: text(40, 'Pipe table is text of at most 40 characters: a table of the catalogue, or "" for a typed inner diameter.'),
    nominal: text(20, 'Nominal size is text of at most 20 characters: a size of the pipe table, or "" for a typed inner diameter.'),
    /** Inner diameter, m: above 0 as stored; an entered run from the catalogue's smallest bore (`SystemInputEntrySchema`). */
    diameter: ranged(BORE_RANGE, true),
    material: text(40, "Material is text of at most 40 characters: a material of the catalogue."),
    /** Absolute roughness new and aged, m. */
    roughness: ranged(ROUGHNESS_RANGE),
    agedRoughness: ranged(AGED_ROUGHNESS_RANGE),
    /** Length, m. */
    length: ranged(LENGTH_RANGE),
    fittings: v.pipe(v.array(FittingUseSchema, "Fittings are a list of { id, count }."), v.maxLength(40, "At most 40 kinds of fitting in a run.")),
    /** Extra ΣK (dimensionless): entrance, exit, equipment given as K. */
    extraK: ranged(EXTRA_K_RANGE),
  },
  "A pipe run is an object with side, name, pipeTable, nominal, diameter, material, roughness, agedRoughness, length, fittings and extraK.",
);

export const PipeRunSchema = v.pipe(PipeRunObject, belowDiameter("roughness", "Roughness"), belowDiameter("agedRoughness", "Aged roughness"));
/** A frozen selection's run: the rules it was frozen under (roughness below the whole bore), never a rule added since. */
const FrozenPipeRunSchema = v.pipe(PipeRunObject, belowWholeDiameter("roughness", "Roughness"), belowWholeDiameter("agedRoughness", "Aged roughness"));

/**
 * The words for a static head at high level below the one at low level (high is the most lift, low the least), with both
 * values: the editor's field and the API's input (`SystemInputEntrySchema`) say the same.
 */
export function staticHighBelowLow(high: number, low: number): string {
  const [h, l] = qtPair("head", high, low);
  return `The static head at high level, ${h}, is below the one at low level, ${l}: high level is the most lift and low level the least, so high must be at least low. Swap them, or type the same value in both for one level.`;
}

/** The system input's fields with `run` as each pipe run's schema (the live rules, or those a selection was frozen under). */
const systemInputObject = <R extends typeof PipeRunSchema | typeof FrozenPipeRunSchema>(run: R) => v.object({
  fluid: v.variant("kind", [
    v.object({ kind: v.literal("water") }),
    v.object({
      kind: v.literal("custom"),
      name: v.pipe(v.string(), v.maxLength(60)),
      density: pos("Density"), // kg/m³
      dynamicViscosity: pos("Viscosity"), // Pa·s
      vaporPressure: nonNeg("Vapour pressure"), // Pa
    }),
  ]),
  temperatureC: ranged(LIQUID_TEMPERATURE_RANGE), // °C; water 0 to 100 where entered (temperature-range.ts)
  mode: v.picklist(["open", "closed-loop"]),
  /** Discharge surface minus suction surface elevation, least and most lift, m. */
  staticLow: num("Static head (low level)"),
  staticHigh: num("Static head (high level)"),
  /** Discharge surface pressure minus suction surface pressure (gauge), Pa. */
  pressureDifference: num("Pressure difference"),
  /** Closed loop: head held at the control point, m. */
  controlHead: nonNeg("Control head"),
  /** Absolute pressure on the suction surface, Pa (atmospheric for an open tank). */
  suctionSurfacePressure: pos("Suction surface pressure"),
  /** Suction liquid surface above the pump centreline, m (negative: suction lift). */
  suctionStaticHead: num("Suction static head"),
  runs: v.pipe(v.array(run), v.maxLength(MAX_RUNS, `At most ${MAX_RUNS} pipe runs.`)),
  duty: v.nullable(v.object({ flow: pos("Duty flow"), head: pos("Duty head") })),
  /** Largest flow drawn, m³/s (0: from the duty). */
  flowMax: nonNeg("Largest flow"),
  hoursPerYear: v.pipe(num("Operating hours"), v.check((x) => x >= 0 && x <= HOURS_IN_YEAR, (i) => yearHoursRefusal("Operating hours", i.input))),
  tariffPerKWh: nonNeg("Energy tariff"),
  /** Required NPSH margin ratio NPSHa/NPSHr (dimensionless). */
  npshMargin: v.pipe(num("NPSH margin"), v.minValue(1, "The NPSH margin ratio is at least 1.")),
  /** Duty flow tolerance, fractions of the duty flow (default −0/+0.10; documents stored before it parse with the default). */
  flowTolerance: v.optional(
    v.object({
      minus: v.pipe(nonNeg("Flow tolerance below"), v.maxValue(0.5, "Flow tolerance below the duty: at most 50 %.")),
      plus: v.pipe(nonNeg("Flow tolerance above"), v.maxValue(1, "Flow tolerance above the duty: at most 100 %.")),
    }),
    { ...DEFAULT_FLOW_TOLERANCE },
  ),
  /** Load profile, control mode and life-cycle cost settings (documents stored before them parse with the defaults). */
  energy: v.optional(EnergySettingsSchema, () => ({ ...DEFAULT_ENERGY_SETTINGS })),
});

/**
 * A system's stored input (`input_json`), read on every use: today's rules, so a stored input that breaks one needs review
 * before anything is computed from it (stored-input.ts). Not the order of the static heads: a document stored with high
 * below low still reads, least to most (`systemSpec`).
 */
export const SystemInputSchema = systemInputObject(PipeRunSchema);

/** A valibot issue's path to `keys` inside `root` (each key's input and value), for a check that adds issues by hand. */
function issuePath(root: unknown, keys: readonly (string | number)[]): [v.IssuePathItem, ...v.IssuePathItem[]] {
  let input = root as Record<string | number, unknown>;
  return keys.map((key) => {
    const value = input[key];
    const item = { type: typeof key === "number" ? "array" : "object", origin: "value", input, key, value } as v.IssuePathItem;
    input = value as Record<string | number, unknown>;
    return item;
  }) as [v.IssuePathItem, ...v.IssuePathItem[]];
}

/**
 * A system input entered now (the editor's save, the preview API): the stored rules; the static heads and the duty within
 * their ranges (duty-ranges.ts, common practice), and the static head at high level not below the one at low level in an
 * open system (`staticHighBelowLow`, at `staticHigh`); each run's bore from the catalogue's smallest. A new rule on what is
 * typed goes here or into `SystemInputSchema`; a frozen selection reads with `FrozenSystemInputSchema`.
 */
export const SystemInputEntrySchema = v.pipe(
  SystemInputSchema,
  v.rawCheck(({ dataset, addIssue }) => {
    if (!dataset.typed) return;
    for (const p of dutyRangeProblems(dataset.value)) addIssue({ message: p.message, path: issuePath(dataset.value, p.keys) });
    const water = waterTemperatureProblem(dataset.value.fluid.kind, dataset.value.temperatureC); // at the field, as the editor
    if (water) addIssue({ message: water, path: issuePath(dataset.value, ["temperatureC"]) });
  }),
  v.forward(
    v.check<SystemInput, (i: v.CheckIssue<SystemInput>) => string>(
      (s) => s.mode !== "open" || s.staticHigh >= s.staticLow,
      (i) => staticHighBelowLow(i.input.staticHigh, i.input.staticLow),
    ),
    ["staticHigh"],
  ),
  // Each run's bore from the catalogue's smallest (run-ranges.ts `boreTaken`): the stored rule is only above zero.
  v.rawCheck(({ dataset, addIssue }) => {
    if (!dataset.typed) return;
    dataset.value.runs.forEach((r, i) => {
      if (!boreTaken(r.diameter)) addIssue({ message: outOfRange(BORE_RANGE, r.diameter), path: issuePath(dataset.value, ["runs", i, "diameter"]) });
    });
  }),
);

/**
 * A frozen selection's system input (stored-selection.ts): the rules it was frozen under, so what was signed always reads
 * back. Today's rules less those added after selections were first frozen: roughness below the whole inner diameter, not
 * half of it (helper "systexts"). A rule added to the input later stays out of this schema (it goes into the run's checks or
 * `SystemInputEntrySchema`, never into the shared fields); nothing recomputes a frozen selection, so it never meets the engine's
 * newer checks.
 */
export const FrozenSystemInputSchema = systemInputObject(FrozenPipeRunSchema);

export type SystemInput = v.InferOutput<typeof SystemInputSchema>;
export type PipeRunInput = v.InferOutput<typeof PipeRunSchema>;

/** A run of a catalogue size: inner diameter from the pipe table, new and aged roughness from the material (both as the engine's tables give them). */
export function tableRun(side: "suction" | "discharge", name: string, pipeTable: string, nominal: string, materialId: string, length: number, fittings: PipeRunInput["fittings"] = [], extraK = 0): PipeRunInput {
  const m = materialOf(materialId);
  return { side, name, pipeTable, nominal, diameter: innerDiameter(pipeTable, nominal), material: materialId, roughness: m.roughnessNew, agedRoughness: m.roughnessAged, length, fittings, extraK };
}

export function newRun(side: "suction" | "discharge", name: string): PipeRunInput {
  const m = materialOf("steel");
  return {
    side,
    name,
    pipeTable: "",
    nominal: "",
    diameter: 0.1,
    material: "steel",
    roughness: m.roughnessNew,
    agedRoughness: m.roughnessAged,
    length: 10,
    fittings: [],
    extraK: 0,
  };
}

export function defaultSystemInput(): SystemInput {
  return {
    fluid: { kind: "water" },
    temperatureC: 20,
    mode: "open",
    staticLow: 10,
    staticHigh: 12,
    pressureDifference: 0,
    controlHead: 0,
    suctionSurfacePressure: STANDARD_ATMOSPHERE,
    suctionStaticHead: 2,
    runs: [
      { ...newRun("suction", "Suction line"), length: 5, fittings: [{ id: "entrance-sharp", count: 1 }, { id: "gate-valve-open", count: 1 }] },
      { ...newRun("discharge", "Rising main"), length: 60, fittings: [{ id: "elbow-90-standard", count: 4 }, { id: "swing-check", count: 1 }, { id: "gate-valve-open", count: 1 }, { id: "exit", count: 1 }] },
    ],
    duty: { flow: 0.01, head: 15 },
    flowMax: 0,
    hoursPerYear: 4000,
    tariffPerKWh: 0.2,
    npshMargin: 1.1,
    flowTolerance: { ...DEFAULT_FLOW_TOLERANCE },
    energy: { ...DEFAULT_ENERGY_SETTINGS },
  };
}

export function fluidOf(input: SystemInput): Fluid {
  return input.fluid.kind === "water"
    ? fluidAt({ kind: "water" }, input.temperatureC)
    : fluidAt(
        { kind: "custom", name: input.fluid.name || "Custom fluid", density: input.fluid.density, dynamicViscosity: input.fluid.dynamicViscosity, vaporPressure: input.fluid.vaporPressure },
        input.temperatureC,
      );
}

/** The material of a catalogue pipe table (engine PipeTable.material), or null for a typed inner diameter or a table not in the catalogue. */
export const tableMaterial = (pipeTable: string): string | null => PIPE_TABLES.find((t) => t.id === pipeTable)?.material ?? null;

/**
 * A stored run's catalogue size that the catalogue no longer gives as stored (old data: a table or size since removed,
 * or a size whose dimensions were corrected since): the stored inner diameter is what the system is computed with, said
 * with its number and the table's; null when the run names no size or the table gives the stored bore (to `LIMIT_ROUNDING`,
 * 1 part in 10⁸, as preview-input.ts: a bore further off prints apart from the table's).
 */
function sizeNotInCatalogue(r: PipeRunInput, name: string): string | null {
  if (!r.pipeTable || !r.nominal) return null;
  const table = PIPE_TABLES.find((t) => t.id === r.pipeTable);
  const used = `the stored inner diameter ${qt("diameter", r.diameter)} is used as it was saved`;
  if (!table) return `${name}: the pipe table "${r.pipeTable}" is not in the catalogue any more; ${used}. Check the bore, then pick a table size or type the inner diameter.`;
  const size = table.sizes.find((s) => s.nominal === r.nominal);
  if (!size) {
    const [first, last] = [table.sizes[0].nominal, table.sizes[table.sizes.length - 1].nominal];
    return `${name}: ${table.name} lists no size "${r.nominal}" (its sizes run ${first} to ${last}); ${used}. Check the bore, then pick a size of the table or type the inner diameter.`;
  }
  if (Math.abs(size.innerDiameter - r.diameter) <= LIMIT_ROUNDING * size.innerDiameter) return null;
  const [stored, now] = qtPair("diameter", r.diameter, size.innerDiameter);
  return `${name}: ${table.name} ${r.nominal} has an inner diameter of ${now} in the catalogue now, but the run was saved with ${stored}, which is used. Save the run again to take the table's bore.`;
}

/** A run's name in the warnings: its own, or its side's ("A suction run"). */
const runLabel = (r: PipeRunInput) => r.name || `A ${r.side} run`;

/**
 * A stored run naming a table or size the catalogue does not list now (old data), in the system warning's words (the
 * stored bore used), for the editor to show beside the run as stored; null for a listed size or a typed inner diameter.
 * (A listed size saved with another bore is not one: the editor shows the size, and saving takes the table's bore.)
 */
export function storedSizeNote(r: PipeRunInput): string | null {
  if (!r.pipeTable || !r.nominal) return null;
  return sizeListed(r.pipeTable, r.nominal) ? null : sizeNotInCatalogue(r, runLabel(r));
}

/** Whether the catalogue lists this pipe table and nominal size now (the one check: `storedSizeNote`, stored-sizes.ts). */
export const sizeListed = (table: string, nominal: string): boolean => !!PIPE_TABLES.find((t) => t.id === table)?.sizes.some((s) => s.nominal === nominal);

/**
 * What the runs as stored say beyond the engine's own warnings, each naming the run and its numbers: a run whose
 * material is not its pipe table's (its roughness is another material's), and an aged roughness below the new one
 * (aged pipe is then computed with the new value, `runSpec`; the editor refuses it, stored documents keep it).
 */
export function runInputWarnings(input: SystemInput): string[] {
  const out: string[] = [];
  input.runs.forEach((r) => {
    const name = runLabel(r);
    const table = PIPE_TABLES.find((t) => t.id === r.pipeTable);
    const sizeWords = sizeNotInCatalogue(r, name);
    if (sizeWords) out.push(sizeWords);
    if (table && table.material !== r.material) {
      const tm = MATERIALS.find((m) => m.id === table.material);
      const rm = MATERIALS.find((m) => m.id === r.material);
      const own = tm ? ` (${qt("roughness", tm.roughnessNew)} new, ${qt("roughness", tm.roughnessAged)} aged)` : "";
      out.push(
        `${name}: the pipe ${table.name}${table.name.includes(table.standard) ? "" : ` (${table.standard})`} is ${tm?.name ?? table.material}${own}, but the run's material is ${rm?.name ?? r.material}, so its roughness is ${qt("roughness", r.roughness)} new and ${qt("roughness", r.agedRoughness)} aged. Check the run's material.`,
      );
    }
    if (r.agedRoughness < r.roughness) {
      const [aged, fresh] = qtPair("roughness", r.agedRoughness, r.roughness);
      out.push(`${name}: the aged roughness ${aged} is below the new ${fresh}; pipe cannot be smoother aged than new, so the aged pipe is computed with the new ${fresh}. Check the aged roughness.`);
    }
  });
  return out;
}

/** The engine's run: aged roughness never below new (a stored aged value below it is used as the new one, with `runInputWarnings`). */
function runSpec(r: PipeRunInput): PipeRunSpec {
  return {
    name: r.name,
    length: r.length,
    diameter: r.diameter,
    roughness: r.roughness,
    agedRoughness: Math.max(r.agedRoughness, r.roughness),
    minorK: r.extraK,
    fittings: r.fittings.filter((f) => f.count > 0),
    nominal: r.pipeTable.startsWith("steel") ? r.nominal : undefined,
  };
}

export function systemSpec(input: SystemInput): SystemSpec {
  // The editor refuses a high level below the low one (system-form.ts); a document stored before that is read least to most.
  const lo = Math.min(input.staticLow, input.staticHigh);
  const hi = Math.max(input.staticLow, input.staticHigh);
  return {
    fluid: fluidOf(input),
    suction: input.runs.filter((r) => r.side === "suction").map(runSpec),
    discharge: input.runs.filter((r) => r.side === "discharge").map(runSpec),
    mode: input.mode,
    staticHead: input.mode === "open" ? { min: lo, max: hi, nominal: (lo + hi) / 2 } : 0,
    pressureDifference: input.mode === "open" ? input.pressureDifference : 0,
    controlHead: input.mode === "closed-loop" ? input.controlHead : undefined,
  };
}

// How far a chart's flow axis reaches (flow-extent.ts), where callers have always found it.
export { candidateFlowEnd, candidatesFlowMax, flowMaxOf, resultFlowMax } from "./flow-extent";
