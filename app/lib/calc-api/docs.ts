// The /api page's field tables, generated from the request schemas themselves (schemas.ts) and the
// engine's correlation registry, so a limit on the page cannot drift from the limit enforced.
// Pure: runs wherever the page renders.
import type * as v from "valibot";
import { DROOP_MAX, PEAK_BY, RISE_TOLERANCE_DEFAULT, ROUGHNESS_MAX_OF_DIAMETER, findCorrelation, type DarcyCorrelation } from "~/engine";
import { DEFAULT_TEMPERATURE_C, OperatingPointRequest, PipeLossRequest, SystemCurveRequest } from "./schemas";

/** Unit by field-name suffix: the API's one convention (every quantity carries its unit in its name). */
export const UNIT_SUFFIXES: readonly { suffix: string; unit: string; what: string }[] = [
  { suffix: "_m3s", unit: "m³/s", what: "volumetric flow" },
  { suffix: "_m2s", unit: "m²/s", what: "kinematic viscosity" },
  { suffix: "_kgm3", unit: "kg/m³", what: "density" },
  { suffix: "_ms", unit: "m/s", what: "mean velocity" },
  { suffix: "_pa", unit: "Pa", what: "pressure, pressure difference" },
  { suffix: "_c", unit: "°C", what: "temperature" },
  { suffix: "_m", unit: "m", what: "length, diameter, roughness, head" },
];

export const unitOfField = (name: string): string | null => {
  const leaf = name.replace(/.*[.\]]/, "");
  return UNIT_SUFFIXES.find((u) => leaf.endsWith(u.suffix))?.unit ?? null;
};

/** What each field means (by its last name part); the bounds come from the schema. */
const MEANING: Record<string, string> = {
  flow_m3s: "flow",
  diameter_m: "inner diameter",
  length_m: "pipe length",
  roughness_m: `absolute roughness ε; must also be below ${ROUGHNESS_MAX_OF_DIAMETER} × diameter_m (half the bore: more would close it)`,
  minor_k: "sum of fitting loss coefficients ΣK (default 0)",
  temperature_c: `water temperature; fluid properties from IAPWS formulations (default ${DEFAULT_TEMPERATURE_C})`,
  kinematic_viscosity_m2s: "replaces water's viscosity, for other liquids",
  static_head_m: "discharge level minus suction level",
  segments: "pipe segments in series",
  flows_m3s: "the flows at which to give the system head",
  pump: "the pump curve",
  points: "published points, flows strictly increasing; the head's shape as under “Pump head shape”",
  head_m: "pump head",
  efficiency: "a fraction 0–1 (0.75, not 75)",
  system: "the system the pump works in",
};

/** One documented request field: its path, whether required, and the bounds the schema enforces. */
export type FieldDoc = {
  field: string;
  required: boolean;
  kind: "number" | "list" | "object";
  unit: string | null;
  /** Inclusive lower bound. */
  min?: number;
  /** Exclusive lower bound. */
  above?: number;
  max?: number;
  minItems?: number;
  maxItems?: number;
  meaning: string;
  /** The rule in words, built from the fields above. */
  rule: string;
};

type AnySchema = v.GenericSchema & {
  type: string;
  wrapped?: AnySchema;
  entries?: Record<string, AnySchema>;
  item?: AnySchema;
  pipe?: readonly { type: string; requirement?: unknown }[];
};

const fmt = (x: number) => (Math.abs(x) >= 1e4 ? x.toLocaleString("en-GB").replace(/,/g, " ") : String(x));

function ruleOf(d: Omit<FieldDoc, "rule">): string {
  const u = d.unit ? ` ${d.unit}` : "";
  const parts = [d.required ? "required" : "optional"];
  if (d.kind === "number") {
    if (d.above !== undefined && d.max !== undefined) parts.push(`above ${fmt(d.above)}, at most ${fmt(d.max)}${u}`);
    else if (d.min !== undefined && d.max !== undefined) parts.push(`${d.min < 0 ? "−" + fmt(-d.min) : fmt(d.min)} to ${fmt(d.max)}${u}`);
    else if (d.max !== undefined) parts.push(`at most ${fmt(d.max)}${u}`);
  }
  if (d.kind === "list") parts.push(`${fmt(d.minItems ?? 0)} to ${fmt(d.maxItems ?? Infinity)} items`);
  return `${parts.join(", ")}${d.meaning ? ` — ${d.meaning}` : ""}`;
}

function bounds(s: AnySchema) {
  const out: { min?: number; above?: number; max?: number; minItems?: number; maxItems?: number } = {};
  for (const a of s.pipe ?? []) {
    if (a.type === "min_value") out.min = a.requirement as number;
    if (a.type === "gt_value") out.above = a.requirement as number;
    if (a.type === "max_value") out.max = a.requirement as number;
    if (a.type === "min_length") out.minItems = a.requirement as number;
    if (a.type === "max_length") out.maxItems = a.requirement as number;
  }
  return out;
}

/** Every field of a request schema, depth first (`segments[].length_m` for list items). */
export function describeRequest(schema: v.GenericSchema, prefix = ""): FieldDoc[] {
  const out: FieldDoc[] = [];
  const entries = (schema as AnySchema).entries ?? {};
  for (const [key, raw] of Object.entries(entries)) {
    const required = raw.type !== "optional";
    const s = (required ? raw : raw.wrapped) as AnySchema;
    const field = `${prefix}${key}`;
    const meaning = MEANING[key] ?? "";
    const unit = unitOfField(key);
    if (s.type === "number") {
      const d = { field, required, kind: "number" as const, unit, ...bounds(s), meaning };
      out.push({ ...d, rule: ruleOf(d) });
    } else if (s.type === "array") {
      const d = { field, required, kind: "list" as const, unit, ...bounds(s), meaning };
      out.push({ ...d, rule: ruleOf(d) });
      const item = s.item as AnySchema;
      if (item.type === "strict_object" || item.type === "object") out.push(...describeRequest(item, `${field}[].`));
      else if (item.type === "number") {
        const e = { field: `${field}[]`, required: true, kind: "number" as const, unit, ...bounds(item), meaning: "each item" };
        out.push({ ...e, rule: ruleOf(e) });
      }
    } else if (s.type === "strict_object" || s.type === "object") {
      const d = { field, required, kind: "object" as const, unit: null, meaning };
      out.push({ ...d, rule: ruleOf(d) });
      out.push(...describeRequest(s, `${field}.`));
    } else {
      throw new Error(`describeRequest: ${field} has a schema of type ${s.type} the docs do not know how to describe`);
    }
  }
  return out;
}

export const REQUEST_SCHEMAS = {
  "pipe-loss": PipeLossRequest,
  "system-curve": SystemCurveRequest,
  "operating-point": OperatingPointRequest,
} as const;

/** The correlations the calculators use, as the registry states them (formula, validity, source). */
export function calculatorCorrelations(): { name: string; formula: string; reynolds: readonly [number, number]; relativeRoughness: readonly [number, number]; reference: string }[] {
  return ["colebrook", "laminar"].map((id) => {
    const c = findCorrelation(id) as DarcyCorrelation | undefined;
    if (!c || c.kind !== "darcy-friction") throw new Error(`the registry has no Darcy correlation ${id}`);
    return { name: c.name, formula: c.formula, reynolds: c.validity.reynolds, relativeRoughness: c.validity.relativeRoughness, reference: c.reference };
  });
}

const pct = (x: number) => `${Math.round(x * 1000) / 10} %`;

/**
 * The pump head shape the operating-point calculator takes, warns of and refuses (engine headShape.ts, at the default
 * rise allowance the API's curves are built with, pumpCurve.ts RISE_TOLERANCE_DEFAULT), its numbers from the engine's
 * constants so the page cannot drift from the rule (docs.test.ts proves each at the API, both sides).
 */
export const PUMP_HEAD_SHAPE = {
  /** A rise above the lowest head before it taken as rounding, fraction of the first point's head. */
  allowance: RISE_TOLERANCE_DEFAULT,
  /** A drooping curve's peak at most this far above the first point's head (fraction). */
  droopMax: DROOP_MAX,
  /** The peak reached by this fraction of the published flows (first to last flow). */
  peakBy: PEAK_BY,
  rules: [
    `Falling: from the first point on, a head may rise above the lowest head before it by no more than ${pct(RISE_TOLERANCE_DEFAULT)} of the first point's head (rounding of published values); a hump within that is taken wherever it lies.`,
    `Drooping: the head may rise from the first point to one peak at most ${pct(DROOP_MAX)} above the first point's head, reached by ${pct(PEAK_BY)} of the way from the first published flow to the last (the first half), then fall, rising again by no more than the ${pct(RISE_TOLERANCE_DEFAULT)} above the lowest head since.`,
    `A curve whose head lies above its first point's anywhere, however little, is answered with the warning drooping-curve: the pump cannot start against a system head above its first head, and a system curve may cross it twice (status multiple or no_intersection).`,
    `Refused (400, at pump.points[i].head_m): a head more than ${pct(DROOP_MAX)} above the first point's head; a second rise of more than ${pct(RISE_TOLERANCE_DEFAULT)} after falling; a head rising more than ${pct(RISE_TOLERANCE_DEFAULT)} above the first point's whose highest point lies past the first half of the flows (a system curve, or columns swapped). Each limit is judged to 1 part in 10⁸ of it.`,
  ],
} as const;
