// The system editor's form codec: SystemInput (SI) ⇄ form fields in the user's units.
// Pure, so the server reads the posted form and the browser reads the same form while typing.
import * as v from "valibot";
import { DEFAULT_FLOW_TOLERANCE, fromSI, innerDiameter, material as materialOf, MATERIALS, PIPE_TABLES, toSI, type Quantity } from "~/engine";
import { boundInward, qtPair } from "~/engine/quantityText";
import { countField, decimalField, decimalMessage, readDecimal } from "../shared/decimal";
import { fmtNum, labelOf, renderDeep, renderUnits, unitOf, type UnitChoice } from "../shared/units";
import { groupThousands } from "../shared/format";
import { energyField, readEnergyForm } from "./energy-form";
import type { EnergySettings } from "./energy";
import { MAX_FITTING_COUNT, MAX_MAGNITUDE, MAX_RUNS, newRun, roughnessFits, roughnessNotBelowRadius, staticHighBelowLow, storedSizeNote, SystemInputSchema, tableMaterial, type PipeRunInput, type SystemInput } from "./hydraulics";
import { AGED_ROUGHNESS_RANGE, BORE_RANGE, boreTaken, EXTRA_K_RANGE, LENGTH_RANGE, outOfRange, rangeText, ROUGHNESS_RANGE, SHOWN_PRECISION, type NumberRange } from "./run-ranges";
import { DUTY_FLOW_RANGE, DUTY_HEAD_RANGE, inside, STATIC_HIGH_RANGE, STATIC_LOW_RANGE } from "./duty-ranges";
import { storedBoreOr, storedSizesKept } from "./stored-sizes";
import { waterTemperatureProblem } from "./temperature-range";

/** Fittings offered in the editor: every fitting of app/engine/fittings.ts (system-form-fittings.test.ts), so none is lost on a save. */
export const EDITOR_FITTINGS = [
  ["elbow-90-standard", "90° elbows"],
  ["elbow-90-long-radius", "90° long bends"],
  ["elbow-45-standard", "45° elbows"],
  ["return-bend", "180° return bends"],
  ["tee-run", "Tees (run)"],
  ["tee-branch", "Tees (branch)"],
  ["gate-valve-open", "Gate valves"],
  ["ball-valve-open", "Ball valves"],
  ["butterfly-valve-open", "Butterfly valves"],
  ["globe-valve-open", "Globe valves"],
  ["angle-valve-open", "Angle valves"],
  ["plug-valve-open", "Plug valves"],
  ["swing-check", "Swing checks"],
  ["lift-check", "Lift checks"],
  ["foot-valve-strainer", "Foot valve + strainer"],
  ["foot-valve-poppet", "Foot valve + strainer (poppet)"],
  ["entrance-sharp", "Entrance (sharp)"],
  ["entrance-projecting", "Entrance (projecting)"],
  ["entrance-rounded", "Entrance (rounded)"],
  ["exit", "Exit into tank"],
] as const;

/** SI → display number, rounded to a sensible number of significant digits for a form field. */
export function show(sys: UnitChoice, q: Quantity, si: number, digits = 5): string {
  if (!Number.isFinite(si)) return ""; // a stored value that is missing or not a number (stored-input.ts `editorInput`): blank
  const x = fromSI(q, unitOf(sys, q), si);
  if (!Number.isFinite(x)) return "";
  if (x === 0) return "0";
  return String(Number(x.toPrecision(digits)));
}

export type FormErrors = Record<string, string>;

function readNumber(f: FormLike, key: string, errors: FormErrors, opts: { optional?: boolean; label: string; unit?: { sys: UnitChoice; q: Quantity } }): number | null {
  const n = decimalField(f.get(key), key, opts.label, errors, !opts.optional); // the forms' strict reader (shared/decimal.ts)
  if (n === null) return null;
  // Typed values past the schema's bound would overflow on the way to SI (1e308 kPa): refused here, by field, with the
  // bound in the unit typed (the schema's MAX_MAGNITUDE is SI: 10¹² m is 3280839895013 ft).
  const u = opts.unit;
  const si = u ? typedToSI(u.q, unitOf(u.sys, u.q), n) : n;
  if (!(Math.abs(si) <= MAX_MAGNITUDE)) {
    // Grouped by spaces and rounded down (checked exactly), so the bound typed back is taken: "3 280 839 895 013 ft".
    const end = u ? Math.abs(fromSI(u.q, unitOf(u.sys, u.q), MAX_MAGNITUDE)) : MAX_MAGNITUDE;
    // Whole digits even from 1e9 up (engine quantityText.ts `LARGE_FROM` is for readings, not a bound typed back).
    const bound = `${groupThousands(boundInward(fmtNum(end, end >= 100 ? 0 : undefined), end, "max", 0))}${u ? ` ${labelOf(u.sys, u.q)}` : ""}`;
    errors[key] ??= `${opts.label[0].toUpperCase()}${opts.label.slice(1)} is far outside any pump system: the form takes nothing beyond ±${bound}; check the value${u ? " and its unit" : ""}.`;
    return null;
  }
  return n;
}

/** A typed value in SI; ±Infinity where the conversion overflows a double (1e308 psi), which the engine refuses by throwing. */
function typedToSI(q: Quantity, unit: string, n: number): number {
  try {
    return toSI(q, unit, n);
  } catch {
    return n < 0 ? -Infinity : Infinity;
  }
}

export type FormLike = { get(name: string): FormDataEntryValue | null };

/** A new run's material (newRun): the one a run has until the engineer or its pipe table gives another. */
export const DEFAULT_MATERIAL = "steel";

/**
 * A run's material as sent: the pipe table's own (engine PipeTable.material) when a table is chosen and the material
 * was left as the page showed it by default (`shown`: the editor's hidden `run.N.materialShown`, blank once the
 * engineer picks a material) or not sent at all; otherwise the material picked. The editor applies the same rule as the
 * table changes, so the roughness hints follow at once. Unknown materials are refused by the form.
 */
export function materialForTable(posted: string | null, shown: string | null, pipeTable: string): string {
  const own = tableMaterial(pipeTable);
  const leftAsShown = !posted || (!!shown && posted === shown);
  return own && leftAsShown ? own : posted || DEFAULT_MATERIAL;
}

/** The material shown by default for a run (see materialForTable): its table's own, or the default without a table; blank when the engineer chose it. */
export function materialShownFor(r: Pick<PipeRunInput, "pipeTable" | "material">): string {
  return r.material === (tableMaterial(r.pipeTable) ?? DEFAULT_MATERIAL) ? r.material : "";
}

/** What of the system's stored document a post is read against (the document as the editor shows it: `SystemInput`). */
export type StoredForForm = { runs: readonly PipeRunInput[]; energy?: EnergySettings };

/**
 * Reads the editor form into a SystemInput. Display units → SI here; the schema then checks
 * ranges. Returns the errors keyed by field name (for messages next to the fields), in the user's units.
 * `stored`: the system's stored document as the editor shows it (`editorInput` for one needing review) — the server reads
 * it from the database, the page from its loader. Its runs: only a table or size the catalogue does not list now that a
 * stored run holds may be posted back, on one run each (stored-sizes.ts; decision "storedattack"); without them, none may.
 * Its energy settings: kept as stored when the post carries no energy fields (an older page, a script, a section posted
 * alone; `readEnergyForm`), never the defaults in their place (helper "formkeep").
 */
export function readSystemForm(f: FormLike, sys: UnitChoice, stored: StoredForForm = { runs: [] }): { input: SystemInput | null; name: string; errors: FormErrors } {
  const errors: FormErrors = {};
  const si = (q: Quantity, key: string, label: string, optional = false) => {
    // Temperature is held to its own range below (an offset unit has no symmetric bound); every other quantity in its unit.
    const n = readNumber(f, key, errors, { label, optional, unit: q === "temperature" ? undefined : { sys, q } });
    return n == null ? null : toSI(q, unitOf(sys, q), n);
  };
  /**
   * A pipe run's number within its range (run-ranges.ts), SI: every refusal names the field and the range in the unit typed.
   * Here: blank, not a number, and past the form's magnitude; the range's ends are the schema's, in the same words.
   */
  const inRange = (r: NumberRange, key: string, optional = false): number | null => {
    const d = readDecimal(f.get(key));
    if (d.kind === "blank") {
      if (!optional) errors[key] ??= `Enter the ${r.label.toLowerCase()}; it takes ${rangeText(r)}.`;
      return null;
    }
    if (d.kind === "ambiguous") errors[key] ??= decimalMessage(d, r.label);
    if (d.kind !== "number") {
      errors[key] ??= outOfRange(r, null);
      return null;
    }
    const x = r.q ? typedToSI(r.q, unitOf(sys, r.q), d.value) : d.value;
    if (!(Math.abs(x) <= MAX_MAGNITUDE)) {
      errors[key] ??= outOfRange(r, d.value < 0 ? -Number.MAX_VALUE : Number.MAX_VALUE); // too low or high, not "not a number"
      return null;
    }
    return x;
  };
  // A static head or the duty within its range (duty-ranges.ts, common practice; the stored schema has none), in the same words.
  const ranged = (r: NumberRange, key: string, optional = false): number | null => {
    const x = inRange(r, key, optional);
    if (x == null || inside(r, x)) return x;
    errors[key] ??= outOfRange(r, x);
    return null;
  };
  // An entered bore from the catalogue's smallest (run-ranges.ts boreTaken; the schema's own rule is only above zero).
  const bore = (key: string, d: number | null): number | null => {
    if (d != null && d < BORE_RANGE.max && !boreTaken(d)) {
      errors[key] ??= outOfRange(BORE_RANGE, d);
      return null;
    }
    return d;
  };
  const name = (f.get("name") ?? "").toString().trim().slice(0, 160);
  if (!name) errors.name = "Give the system a name.";
  const fluidKind = f.get("fluidKind") === "custom" ? "custom" : "water";
  const temperatureC = si("temperature", "temperature", "the fluid temperature") ?? 20;
  const fluid =
    fluidKind === "custom"
      ? {
          kind: "custom" as const,
          name: (f.get("fluidName") ?? "").toString().slice(0, 60),
          density: si("density", "density", "the density") ?? 0,
          dynamicViscosity: si("dynamicViscosity", "viscosity", "the viscosity") ?? 0,
          vaporPressure: si("pressure", "vaporPressure", "the vapour pressure") ?? 0,
        }
      : { kind: "water" as const };
  // Counts are read as digits only (shared/decimal.ts countField): Number() took 0x10 as 16 runs or fittings, 2.5 as 3,
  // and junk as none at all. The run count is the editor's own hidden field: a bad one drops no run silently.
  const runCount = countField(f.get("runCount"), "runCount", "the number of pipe runs", errors, MAX_RUNS) ?? 0;
  const kept = storedSizesKept(f, runCount, stored.runs); // the stored run whose unlisted size each posted run keeps
  const runs: PipeRunInput[] = [];
  // The form position (`run.N.`) each run of the document was read from: runs carry no id, and one ticked "remove on
  // save" is left out, so the document's run K is not the form's run K after it (fieldFor places refusals by this).
  const formRun: number[] = [];
  // Runs (document positions) whose inner diameter could not be read (a size not in its table, a bad number): their
  // field already says why, so the schema's checks against the stand-in 0 (diameter > 0, roughness below it) are not.
  const noDiameter = new Set<number>();
  const formStep: number[] = []; // the form row of each load-profile step (energy-form.ts)
  for (let i = 0; i < runCount; i++) {
    const p = `run.${i}.`;
    if (f.get(`${p}remove`) != null) continue;
    formRun.push(i);
    const side = f.get(`${p}side`) === "suction" ? "suction" : "discharge";
    const pipeTable = (f.get(`${p}table`) ?? "").toString();
    const nominal = (f.get(`${p}nominal`) ?? "").toString();
    let diameter: number | null = null;
    let sized = !!(pipeTable && nominal); // the run keeps the table and size posted (not where the size is refused)
    if (pipeTable && nominal) {
      try {
        diameter = innerDiameter(pipeTable, nominal);
      } catch {
        // A table or size the catalogue does not list now, as a stored run holds it (old data: the editor shows it with the
        // system warning's words): kept as stored, on the bore in the inner diameter field (the stored one where the field
        // still shows it). The stored document decides, never a posted field; any other unlisted size is refused.
        const own = kept.get(i);
        if (own) diameter = bore(`${p}diameter`, storedBoreOr(own.diameter, inRange(BORE_RANGE, `${p}diameter`)));
        else {
          errors[`${p}nominal`] = "Pick a size from this pipe table.";
          sized = false;
        }
      }
    } else diameter = bore(`${p}diameter`, inRange(BORE_RANGE, `${p}diameter`));
    const mat = materialForTable(f.get(`${p}material`)?.toString() ?? null, f.get(`${p}materialShown`)?.toString() ?? null, pipeTable);
    let m: ReturnType<typeof materialOf> | null = null;
    try {
      m = materialOf(mat);
    } catch {
      errors[`${p}material`] = "Pick a material.";
    }
    const typedAged = inRange(AGED_ROUGHNESS_RANGE, `${p}agedRoughness`, true);
    const roughness = inRange(ROUGHNESS_RANGE, `${p}roughness`, true) ?? m?.roughnessNew ?? 0;
    let agedRoughness = typedAged ?? m?.roughnessAged ?? roughness;
    // Equal at the five significant digits a field shows (show()): an aged value stored equal to the new one comes back
    // a hair below it through other units (0.26 mm as 0.010236 in), and is read as equal.
    if (agedRoughness < roughness && agedRoughness >= roughness * (1 - SHOWN_PRECISION)) agedRoughness = roughness;
    // Pipe does not get smoother with age: an aged roughness below the new one is refused here (stored ones are computed
    // with the new value, with a warning: system-input.ts runInputWarnings).
    if (agedRoughness < roughness) {
      const [aged, fresh] = qtPair("roughness", agedRoughness, roughness);
      errors[`${p}agedRoughness`] ??= typedAged != null
        ? `The aged roughness ${aged} is below the new ${fresh}: pipe roughens with age. Type at least ${fresh}.`
        : `Left blank, the aged roughness is ${m?.name ?? "the material"}'s ${aged}, below the new ${fresh} typed: type an aged roughness of at least ${fresh}.`;
    }
    for (const [key, label, e] of [["roughness", "Roughness", roughness], ["agedRoughness", "Aged roughness", agedRoughness]] as const) {
      if (diameter != null && diameter > 0 && !roughnessFits(e, diameter)) errors[`${p}${key}`] ??= roughnessNotBelowRadius(label, e, diameter);
    }
    if (diameter == null) noDiameter.add(runs.length);
    const fittings = EDITOR_FITTINGS.map(([id, label]) => ({ id, count: countField(f.get(`${p}fit.${id}`), `${p}fit.${id}`, `the number of ${label.toLowerCase()}`, errors, MAX_FITTING_COUNT) ?? 0 })).filter((x) => x.count > 0);
    runs.push({
      side,
      name: (f.get(`${p}name`) ?? "").toString().slice(0, 80) || `${side === "suction" ? "Suction" : "Discharge"} run ${i + 1}`,
      pipeTable: sized ? pipeTable : "",
      nominal: sized ? nominal : "",
      diameter: diameter ?? 0,
      material: mat,
      roughness,
      agedRoughness,
      length: inRange(LENGTH_RANGE, `${p}length`) ?? 0,
      fittings,
      extraK: inRange(EXTRA_K_RANGE, `${p}extraK`, true) ?? 0,
    });
  }
  const add = f.get("addRun");
  if (add === "suction" || add === "discharge") runs.push(newRun(add, add === "suction" ? "Suction run" : "Discharge run"));
  const dutyFlow = ranged(DUTY_FLOW_RANGE, "dutyFlow", true);
  const dutyHead = ranged(DUTY_HEAD_RANGE, "dutyHead", true);
  // A field that already has its own message (text that is not a number) keeps it.
  if ((dutyFlow == null) !== (dutyHead == null)) errors[dutyFlow == null ? "dutyFlow" : "dutyHead"] ??= "Give both duty flow and head, or neither.";
  const staticLow = ranged(STATIC_LOW_RANGE, "staticLow");
  const staticHigh = ranged(STATIC_HIGH_RANGE, "staticHigh");
  const mode = f.get("mode") === "closed-loop" ? "closed-loop" : "open";
  // Low level is the least lift, high level the most (the fields' hints; the engine refuses a band whose top is below its
  // bottom, system.ts prepareSystem): a pair typed the other way round is refused at the field, never swapped unsaid.
  if (mode === "open" && staticLow != null && staticHigh != null && staticHigh < staticLow) {
    errors.staticHigh ??= staticHighBelowLow(staticHigh, staticLow);
  }
  const raw = {
    fluid,
    temperatureC,
    mode,
    staticLow: staticLow ?? 0,
    staticHigh: staticHigh ?? 0,
    pressureDifference: si("pressure", "pressureDifference", "the pressure difference", true) ?? 0,
    controlHead: si("head", "controlHead", "the control head", true) ?? 0,
    suctionSurfacePressure: si("pressure", "suctionSurfacePressure", "the suction surface pressure") ?? 101325,
    suctionStaticHead: si("head", "suctionStaticHead", "the suction static head", true) ?? 0,
    runs,
    duty: dutyFlow != null && dutyHead != null ? { flow: dutyFlow, head: dutyHead } : null,
    flowMax: si("flow", "flowMax", "the largest flow", true) ?? 0,
    hoursPerYear: readNumber(f, "hoursPerYear", errors, { label: "operating hours", optional: true }) ?? 0,
    tariffPerKWh: readNumber(f, "tariffPerKWh", errors, { label: "the tariff", optional: true }) ?? 0,
    npshMargin: readNumber(f, "npshMargin", errors, { label: "the NPSH margin ratio", optional: true }) ?? 1.1,
    // Duty flow tolerance in % (blank: −0 % / +10 %).
    flowTolerance: {
      minus: (readNumber(f, "tolMinus", errors, { label: "the flow tolerance below the duty", optional: true }) ?? DEFAULT_FLOW_TOLERANCE.minus * 100) / 100,
      plus: (readNumber(f, "tolPlus", errors, { label: "the flow tolerance above the duty", optional: true }) ?? DEFAULT_FLOW_TOLERANCE.plus * 100) / 100,
    },
    energy: readEnergyForm(f, errors, stored.energy, formStep), // no energy fields posted: the stored settings
  };
  // Water's properties are computed for 0–100 °C (engine: fluids.ts): said at the field when the form is sent, not as an
  // evaluation error after it is saved — in the words the preview API and every save refuse it in (temperature-range.ts).
  // (Not in the stored schema: a stored system that no longer parsed would need review before anything is computed from it.)
  const water = waterTemperatureProblem(raw.fluid.kind, temperatureC);
  if (water) errors.temperature ??= water;
  const r = v.safeParse(SystemInputSchema, raw);
  if (!r.success) {
    for (const issue of r.issues) {
      const path = (issue.path ?? []).map((x) => x.key);
      if (path[0] === "runs" && noDiameter.has(path[1] as number) && (path[2] === "diameter" || issue.type === "check")) continue;
      errors[fieldFor(path, (k) => formRun[k], (k) => formStep[k])] ??= issue.message;
    }
  }
  return { input: r.success && Object.keys(errors).length === 0 ? r.output : null, name, errors: renderDeep(errors, sys) };
}

/**
 * Maps a schema issue path to the form field that holds it. Pipe runs have no id of their own (the document stores a list,
 * the editor names each run by its position in the form, `run.N.`), so a run's issue is placed by position: `formRun` gives
 * the form position of the document's run K (the form read leaves out runs ticked for removal; a stored document's run K is
 * the editor's run K, as `editorInput` keeps every run at its index). A run with no form position (one being added) is the
 * runs' as a whole.
 */
export function fieldFor(path: unknown[], formRun: (k: number) => number | undefined = (k) => k, formStep?: (k: number) => number | undefined): string {
  const [a, b, c] = path;
  if (a === "runs" && typeof b === "number") {
    const i = formRun(b);
    if (i === undefined) return "runs";
    const map: Record<string, string> = { diameter: "diameter", roughness: "roughness", agedRoughness: "agedRoughness", length: "length", extraK: "extraK" };
    return `run.${i}.${map[String(c)] ?? String(c)}`;
  }
  if (a === "duty") return b === "head" ? "dutyHead" : "dutyFlow";
  if (a === "fluid") return b === "dynamicViscosity" ? "viscosity" : String(b);
  if (a === "temperatureC") return "temperature";
  if (a === "flowTolerance") return b === "minus" ? "tolMinus" : "tolPlus";
  if (a === "energy") return energyField(path.slice(1), formStep);
  return String(a ?? "_form");
}

/**
 * The roughness hints of a run in the editor, in the user's units: its material's new and aged values (the blank
 * fields' values), and a note when the material is not its pipe table's (the system's warning says the same on save).
 */
export function roughnessHints(materialId: string, pipeTable: string, sys: UnitChoice): { roughness: string; aged: string; mismatch: string | null } {
  const m = MATERIALS.find((x) => x.id === materialId);
  const own = tableMaterial(pipeTable);
  const t = own && own !== materialId ? MATERIALS.find((x) => x.id === own) : null;
  const tableName = PIPE_TABLES.find((x) => x.id === pipeTable)?.name;
  return {
    roughness: m ? show(sys, "roughness", m.roughnessNew) : "",
    aged: m ? show(sys, "roughness", m.roughnessAged) : "",
    mismatch: t ? `${tableName} is ${t.name} (${show(sys, "roughness", t.roughnessNew)} ${labelOf(sys, "roughness")} new); this run's roughness is ${m?.name ?? materialId}'s.` : null,
  };
}

/** A plain number for a field; blank for NaN (a stored value that is missing or not a number, stored-input.ts `editorInput`). */
const plain = (x: number) => (Number.isFinite(x) ? String(x) : "");

/** Field values for the editor in display units (strings, as typed). */
export function systemFormValues(input: SystemInput, sys: UnitChoice) {
  return {
    fluidKind: input.fluid.kind,
    fluidName: input.fluid.kind === "custom" ? input.fluid.name : "",
    density: input.fluid.kind === "custom" ? show(sys, "density", input.fluid.density) : "",
    viscosity: input.fluid.kind === "custom" ? show(sys, "dynamicViscosity", input.fluid.dynamicViscosity) : "",
    vaporPressure: input.fluid.kind === "custom" ? show(sys, "pressure", input.fluid.vaporPressure) : "",
    temperature: show(sys, "temperature", input.temperatureC, 4),
    mode: input.mode,
    staticLow: show(sys, "head", input.staticLow),
    staticHigh: show(sys, "head", input.staticHigh),
    pressureDifference: show(sys, "pressure", input.pressureDifference),
    controlHead: show(sys, "head", input.controlHead),
    suctionSurfacePressure: show(sys, "pressure", input.suctionSurfacePressure, 6),
    suctionStaticHead: show(sys, "head", input.suctionStaticHead),
    dutyFlow: input.duty ? show(sys, "flow", input.duty.flow) : "",
    dutyHead: input.duty ? show(sys, "head", input.duty.head) : "",
    flowMax: input.flowMax > 0 ? show(sys, "flow", input.flowMax) : "",
    hoursPerYear: plain(input.hoursPerYear),
    tariffPerKWh: plain(input.tariffPerKWh),
    npshMargin: plain(input.npshMargin),
    tolMinus: plain(+((input.flowTolerance ?? DEFAULT_FLOW_TOLERANCE).minus * 100).toFixed(4)),
    tolPlus: plain(+((input.flowTolerance ?? DEFAULT_FLOW_TOLERANCE).plus * 100).toFixed(4)),
    runs: input.runs.map((r) => {
      let mat: ReturnType<typeof materialOf> | null = null;
      try {
        mat = materialOf(r.material);
      } catch {}
      // A table or size the catalogue does not list now (old data): shown as stored, with the system warning's words, its
      // stored bore in the inner diameter field (used while the size stays as stored: readSystemForm).
      const note = storedSizeNote(r);
      return {
        side: r.side,
        name: r.name,
        table: r.pipeTable,
        nominal: r.nominal,
        stored: note ? { table: r.pipeTable, nominal: r.nominal, note: renderUnits(note, sys) } : null,
        diameter: r.pipeTable && !note ? "" : show(sys, "diameter", r.diameter),
        diameterShown: show(sys, "diameter", r.diameter),
        material: r.material,
        materialShown: materialShownFor(r),
        // Blank when equal to the material's value, so changing the material changes it.
        roughness: mat && Math.abs(mat.roughnessNew - r.roughness) < 1e-12 ? "" : show(sys, "roughness", r.roughness),
        agedRoughness: mat && Math.abs(mat.roughnessAged - r.agedRoughness) < 1e-12 ? "" : show(sys, "roughness", r.agedRoughness),
        length: show(sys, "length", r.length),
        extraK: plain(r.extraK),
        fittings: Object.fromEntries(r.fittings.map((x) => [x.id, x.count])) as Record<string, number>,
      };
    }),
  };
}

export const PIPE_TABLE_OPTIONS = PIPE_TABLES.map((t) => ({ id: t.id, name: t.name, sizes: t.sizes.map((s) => s.nominal), material: t.material }));
export const MATERIAL_OPTIONS = MATERIALS.map((m) => ({ id: m.id, name: m.name }));
