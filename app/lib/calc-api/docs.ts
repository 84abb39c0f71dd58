// The /api page's field tables, generated from the request schemas themselves (schemas.ts) and the
// engine's correlation registry, so a limit on the page cannot drift from the limit enforced.
// Pure: runs wherever the page renders.
import type * as v from "valibot";
import { ROUGHNESS_MAX_OF_DIAMETER, findCorrelation, type DarcyCorrelation } from "~/engine";
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
  points: "published points, flows strictly increasing",
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
