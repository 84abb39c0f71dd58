// The mapping page's form, read back (pure): the base mapping the page was served with (JSON), the
// user's field and unit per column, layout, defaults, fill-down, run-out policy and encoding; and the
// fix grid's edited cells. Anything unreadable is an error message, never an exception.
import * as v from "valibot";
import { decimalField } from "../shared/decimal";
import { parseStrictJson } from "../shared/strict-json";
import { DIAMETER_UNITS, encodingNamed, headerUnitRefusal, MappingSchema, NUMERIC_FIELDS, UNITS_BY_FIELD, type CellEdit, type Encoding, type Mapping, type NumericField } from "../import";

/** The unit of the default impeller field: the reader's diameter unit where the importer knows it, else mm. */
export const impellerUnitOf = (x: unknown): (typeof DIAMETER_UNITS)[number] => DIAMETER_UNITS.find((u) => u === x) ?? "mm";

/** The encoding the user chose, if it is one we decode. */
export function encodingFromForm(form: FormData): Encoding | undefined {
  return encodingNamed(form.get("encoding"));
}

/**
 * True when the page must ask for this column's unit instead of offering one: its header names a unit word
 * the field does not take (head in kPa, speed in Hz) and the user has not chosen the unit. The unit select
 * then starts on "choose…" (an empty value), so only a unit picked there counts as the user's.
 */
export function unitToChoose(c: Pick<Mapping["columns"][number], "header" | "field" | "unitSource">): boolean {
  return c.unitSource !== "user" && headerUnitRefusal(c.header, c.field) !== null;
}

/**
 * The mapping the page was served with (its hidden `base` field), read strictly: a name twice in one object is refused
 * (parseStrictJson, with its JSON Pointer) as every other JSON we read, where JSON.parse kept the last silently.
 */
export function baseMappingOf(form: FormData): { mapping: Mapping; error?: undefined } | { mapping?: undefined; error: string } {
  const json = parseStrictJson(String(form.get("base") ?? ""));
  if (!json.ok) return { error: `The mapping could not be read (the page's base mapping ${json.problem}); reload the page.` };
  const parsed = v.safeParse(MappingSchema, json.value);
  return parsed.success ? { mapping: parsed.output } : { error: "The mapping could not be read; reload the page." };
}

/** Rebuilds a mapping from the form: the base mapping (JSON) with the user's field/unit choices. */
export function mappingFromForm(form: FormData): { mapping?: Mapping; error?: string } {
  const base = baseMappingOf(form);
  if (!base.mapping) return { error: base.error };
  const m: Mapping = structuredClone(base.mapping);
  const layout = form.get("layout");
  if (layout === "long" || layout === "wide") m.layout = layout;
  m.columns = m.columns.map((c) => {
    const field = String(form.get(`field.${c.index}`) ?? c.field) as Mapping["columns"][number]["field"];
    const unitRaw = String(form.get(`unit.${c.index}`) ?? "");
    const numeric = (NUMERIC_FIELDS as readonly string[]).includes(field);
    const allowed = numeric ? (UNITS_BY_FIELD[field as NumericField] as readonly string[]) : [];
    const picked = allowed.includes(unitRaw);
    // Nothing picked ("choose…", or no unit field sent): the served unit while the field stays, else the field's first unit.
    const kept = field === c.field && c.unit !== null && allowed.includes(c.unit) ? c.unit : allowed[0];
    const unit = numeric ? ((picked ? unitRaw : kept) as Mapping["columns"][number]["unit"]) : null;
    // A unit picked for a column whose header names a unit the field does not take is the user's answer, even when it is the default.
    const changed = field !== c.field || unit !== c.unit || (picked && unitToChoose({ ...c, field }));
    return { ...c, field, unit, unitSource: changed ? "user" : c.unitSource, block: m.layout === "wide" ? c.block : null };
  });
  const model = String(form.get("defaultModel") ?? "").trim();
  // Default speed and impeller: blank is none; anything else is a number above 0 (the forms' strict reader, shared/decimal.ts).
  const errors: Record<string, string> = {};
  const positive = (key: string, label: string) => {
    const x = decimalField(form.get(key), key, `the ${label}`, errors);
    if (x !== null && !(x > 0)) errors[key] ??= `The ${label} must be above 0 (blank: none).`;
    return x !== null && x > 0 ? x : undefined;
  };
  const speed = positive("defaultSpeed", "default speed");
  const impeller = positive("defaultImpeller", "default impeller");
  if (Object.keys(errors).length) return { error: Object.values(errors).join(" ") };
  const fluid = String(form.get("fluid") ?? "").trim().slice(0, 120);
  m.defaults = {
    model: model || undefined,
    speed,
    ...(impeller !== undefined ? { impeller, impellerUnit: impellerUnitOf(form.get("defaultImpellerUnit")) } : {}),
    fluid: fluid || undefined,
  };
  m.fillDownModel = form.get("fillDownModel") === "on";
  m.fillDownKeys = form.get("fillDownKeys") === "on";
  const policy = form.get("policy");
  m.policy = policy === "drop-points" ? "drop-points" : "skip-curves";
  const encoding = encodingFromForm(form);
  if (encoding) m.encoding = encoding;
  const check = v.safeParse(MappingSchema, m);
  if (!check.success) return { error: `This mapping cannot work: ${check.issues.map((i) => i.message).join("; ")}.` };
  return { mapping: check.output };
}

/** The grid's cells ("cell.<line>.<index>") as edits; the service keeps only those that differ from the file. */
export function editsFromForm(form: FormData): CellEdit[] {
  const edits: CellEdit[] = [];
  for (const [k, value] of form) {
    const m = /^cell\.(\d{1,9})\.(\d{1,4})$/.exec(k);
    if (m && typeof value === "string") edits.push({ line: Number(m[1]), index: Number(m[2]), value });
  }
  return edits;
}
