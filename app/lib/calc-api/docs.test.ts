// The /api page is generated from the request schemas (docs.ts): these checks make sure what the page
// says is what the API enforces, field by field, and that the page's examples are real answers.
// Expected values: the page's own examples (our own, computed by the engine and rounded to about five
// significant digits when written); bounds: the schemas' own limits.
import { describe, expect, test } from "vitest";
import * as v from "valibot";
import { runCalc } from "./calculations";
import { PUMP_HEAD_SHAPE, REQUEST_SCHEMAS, calculatorCorrelations, describeRequest, unitOfField, type FieldDoc } from "./docs";
import { CALC_ENDPOINT_DOCS } from "./examples";
import { CALC_ENDPOINTS, CALC_LIMITS, type CalcEndpoint } from "./schemas";

type Json = null | boolean | number | string | Json[] | { [k: string]: Json };

/** Sets the first occurrence of a documented field (`a.b[].c`) in a copy of `body`. */
function setField(body: Json, field: string, value: Json): Json | null {
  const copy = structuredClone(body);
  const parts = field.replace(/\[\]/g, ".[]").split(".").filter(Boolean);
  let at: Json = copy;
  for (let i = 0; i < parts.length; i++) {
    const last = i === parts.length - 1;
    const p = parts[i];
    if (p === "[]") {
      if (!Array.isArray(at) || at.length === 0) return null;
      if (last) at[0] = value;
      else at = at[0];
    } else {
      if (at === null || typeof at !== "object" || Array.isArray(at)) return null;
      if (last) at[p] = value;
      else {
        if (!(p in at)) return null;
        at = at[p];
      }
    }
  }
  return copy;
}

const apiField = (doc: string) => doc.replace(/\[\]/g, "[0]");
const example = (id: CalcEndpoint) => JSON.parse(CALC_ENDPOINT_DOCS.find((e) => e.id === id)!.request) as Json;

describe("generated field tables", () => {
  test("every endpoint is documented, once", () => {
    expect(CALC_ENDPOINT_DOCS.map((e) => e.id).sort()).toEqual([...CALC_ENDPOINTS].sort());
  });

  test.each(CALC_ENDPOINTS)("%s: every field has words, and a unit when its name carries one", (id) => {
    const docs = describeRequest(REQUEST_SCHEMAS[id]);
    expect(docs.length).toBeGreaterThan(2);
    for (const d of docs) {
      expect(d.meaning, d.field).not.toBe("");
      expect(d.rule.startsWith(d.required ? "required" : "optional"), d.field).toBe(true);
      if (d.kind === "number" && /_(m|m3s|c|m2s)$/.test(d.field)) expect(d.unit, d.field).not.toBeNull();
    }
  });

  test("the page states the limits the API enforces (a spot check against CALC_LIMITS)", () => {
    const pipe = describeRequest(REQUEST_SCHEMAS["pipe-loss"]);
    expect(pipe.find((d) => d.field === "flow_m3s")).toMatchObject({ min: 0, max: CALC_LIMITS.flowMax, unit: "m³/s" });
    expect(pipe.find((d) => d.field === "diameter_m")).toMatchObject({ above: 0, max: CALC_LIMITS.diameterMax });
    const op = describeRequest(REQUEST_SCHEMAS["operating-point"]);
    expect(op.find((d) => d.field === "pump.points")).toMatchObject({ minItems: 2, maxItems: CALC_LIMITS.pumpPoints });
    expect(op.find((d) => d.field === "pump.points[].efficiency")).toMatchObject({ required: false, min: 0, max: 1 });
    expect(unitOfField("system.segments[].kinematic_viscosity_m2s")).toBe("m²/s");
  });
});

describe("each documented bound holds at the API: at the bound accepted by the schema, past it refused by name", () => {
  const rows: [CalcEndpoint, FieldDoc][] = CALC_ENDPOINTS.flatMap((id) => describeRequest(REQUEST_SCHEMAS[id]).map((d) => [id, d] as [CalcEndpoint, FieldDoc]));
  const checked = new Set<string>();

  test.each(rows.filter(([, d]) => d.kind === "number").map(([id, d]) => [id, d.field, d] as const))("%s %s", (id, _f, d) => {
    const base = example(id);
    const probes: { value: number; ok: boolean }[] = [];
    if (d.max !== undefined) probes.push({ value: d.max, ok: true }, { value: d.max + Math.max(1e-9, Math.abs(d.max) * 1e-9), ok: false });
    if (d.min !== undefined) probes.push({ value: d.min, ok: true }, { value: d.min - Math.max(1e-9, Math.abs(d.min) * 1e-9), ok: false });
    if (d.above !== undefined) probes.push({ value: d.above, ok: false });
    for (const p of probes) {
      const body = setField(base, d.field, p.value);
      if (body === null) continue; // the example has no such list item to change
      const parsed = v.safeParse(REQUEST_SCHEMAS[id], body);
      const out = runCalc(id, body);
      if (p.ok) expect(parsed.success, `${d.field} = ${p.value}`).toBe(true);
      else {
        expect(out.ok, `${d.field} = ${p.value}`).toBe(false);
        if (!out.ok) expect(out.errors.map((e) => e.field), `${d.field} = ${p.value}`).toContain(apiField(d.field));
      }
      checked.add(`${id} ${d.field}`);
    }
  });

  test.each(rows.filter(([, d]) => d.kind === "list" && d.maxItems !== undefined).map(([id, d]) => [id, d.field, d] as const))("%s %s: one item too many", (id, _f, d) => {
    const body = structuredClone(example(id));
    const current = d.field.split(".").reduce<Json>((at, k) => (at as Record<string, Json>)[k], body) as Json[];
    const filler = current.length ? current[current.length - 1] : 0;
    const tooMany = Array.from({ length: d.maxItems! + 1 }, () => structuredClone(filler));
    const out = runCalc(id, setField(body, d.field, tooMany));
    expect(out.ok).toBe(false);
    if (!out.ok) expect(out.errors.map((e) => e.field)).toContain(d.field);
  });

  test("the sweep reached most numeric fields (an example that stops covering them fails here)", () => {
    const numeric = rows.filter(([, d]) => d.kind === "number" && (d.max !== undefined || d.min !== undefined || d.above !== undefined)).length;
    expect(checked.size).toBeGreaterThanOrEqual(Math.floor(numeric * 0.8));
  });
});

describe("the page's examples are real answers", () => {
  function close(actual: unknown, expected: Json, path: string): void {
    if (typeof expected === "number") {
      expect(typeof actual, path).toBe("number");
      expect(Math.abs((actual as number) - expected), `${path}: ${actual} vs ${expected}`).toBeLessThanOrEqual(Math.abs(expected) * 6e-4 + 1e-12);
    } else if (Array.isArray(expected)) {
      expect(Array.isArray(actual), path).toBe(true);
      expect((actual as unknown[]).length, path).toBe(expected.length);
      expected.forEach((e, i) => close((actual as unknown[])[i], e, `${path}[${i}]`));
    } else if (expected !== null && typeof expected === "object") {
      for (const [k, e] of Object.entries(expected)) close((actual as Record<string, unknown>)[k], e, `${path}.${k}`);
    } else expect(actual, path).toEqual(expected);
  }
  test.each(CALC_ENDPOINT_DOCS.map((e) => [e.id, e] as const))("%s", (id, e) => {
    const out = runCalc(id, JSON.parse(e.request));
    expect(out.ok).toBe(true);
    if (out.ok) close(out.body, JSON.parse(e.response) as Json, id);
  });
});

describe("correlations shown come from the engine's registry", () => {
  test("Colebrook and laminar, with their stated ranges", () => {
    const c = calculatorCorrelations();
    expect(c.map((x) => x.name)).toHaveLength(2);
    expect(c[0].reynolds[0]).toBe(4000); // Colebrook's turbulent range starts at Re 4000 (registry.ts; common practice)
    expect(c[1].reynolds[1]).toBe(2000); // laminar up to Re 2000 (registry.ts; common practice)
  });
});

describe("the pump head shape the page states holds at the API, both sides of each bound", () => {
  // Invented curves (not any maker's): 40 m at shut-off over 0–0.08 m³/s; the example's system (static 10 m).
  // Bounds: engine headShape.ts DROOP_MAX 25 %, PEAK_BY 50 %, pumpCurve.ts RISE_TOLERANCE_DEFAULT 10 % (ours).
  const call = (pts: [number, number][]) => {
    const body = example("operating-point") as { pump: { points: Json[] } };
    body.pump.points = pts.map(([q, h]) => ({ flow_m3s: q, head_m: h }));
    return runCalc("operating-point", body);
  };
  const refusedAt = (pts: [number, number][]) => {
    const out = call(pts);
    return out.ok ? null : out.errors.map((e) => e.field);
  };
  const drooping = (pts: [number, number][]) => {
    const out = call(pts);
    expect(out.ok).toBe(true);
    return out.ok && (out.body as { warnings: { code: string }[] }).warnings.some((w) => w.code === "drooping-curve");
  };

  test("the page states the numbers it is built from", () => {
    const text = PUMP_HEAD_SHAPE.rules.join(" ");
    expect([PUMP_HEAD_SHAPE.droopMax, PUMP_HEAD_SHAPE.peakBy, PUMP_HEAD_SHAPE.allowance]).toEqual([0.25, 0.5, 0.1]);
    for (const words of ["25 % above the first point's head", "50 % of the way from the first published flow to the last", "above its first point's anywhere, however little, is answered with the warning drooping-curve", "by no more than 10 %", "Refused (400, at pump.points[i].head_m)"]) expect(text).toContain(words);
  });

  test("a peak 25 % above the first head: taken, with drooping-curve; 1e-6 relative past: refused at its point", () => {
    expect(drooping([[0, 40], [0.02, 50], [0.04, 45], [0.06, 35], [0.08, 20]])).toBe(true);
    expect(refusedAt([[0, 40], [0.02, 50 * (1 + 1e-6)], [0.04, 45], [0.06, 35], [0.08, 20]])).toEqual(["pump.points[1].head_m"]);
  });

  test("a peak (15 %) at the middle of the flows: taken; its flow 1e-6 relative past the middle: refused at the peak", () => {
    expect(drooping([[0, 40], [0.02, 44], [0.04, 46], [0.06, 35], [0.08, 20]])).toBe(true);
    expect(refusedAt([[0, 40], [0.02, 44], [0.04 * (1 + 1e-6), 46], [0.06, 35], [0.08, 20]])).toEqual(["pump.points[2].head_m"]);
  });

  test("the warning for any head above the first: level at 40 m, none; 40 m × (1 + 1e-6), warned; a 2 m hump (5 %), warned", () => {
    expect(drooping([[0, 40], [0.02, 40], [0.04, 38], [0.06, 30], [0.08, 20]])).toBe(false);
    expect(drooping([[0, 40], [0.02, 40 * (1 + 1e-6)], [0.04, 38], [0.06, 30], [0.08, 20]])).toBe(true);
    expect(drooping([[0, 40], [0.02, 42], [0.04, 38], [0.06, 30], [0.08, 20]])).toBe(true);
  });

  test("a second rise after falling: 10 % of 40 m = 4 m above the lowest since, taken; 1e-6 relative more, refused", () => {
    expect(refusedAt([[0, 40], [0.02, 46], [0.04, 30], [0.06, 34], [0.08, 20]])).toBeNull();
    expect(refusedAt([[0, 40], [0.02, 46], [0.04, 30], [0.06, 30 + 4 * (1 + 1e-6)], [0.08, 20]])).toEqual(["pump.points[3].head_m"]);
  });
});
