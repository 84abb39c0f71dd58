// Calc API contract: route modules called the way React Router calls them, against the real
// MariaDB for credentials and the per-address rate limit. Each check value names its source.
import { afterAll, describe, expect, test } from "vitest";
import { like } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { rateLimits } from "@db/schema";
import { createApiToken } from "../auth/api-tokens.server";
import { ANON_RATE_LIMIT, CALC_LIMITS, calcAction, calcPipeLoss, runCalc } from ".";
import { windowStartOf } from "../shared/ratelimit.server";
import { call, makeMember, type CallResult } from "~/test/harness";
import * as pipeLossRoute from "~/routes/api.v1.calc.pipe-loss";
import * as systemCurveRoute from "~/routes/api.v1.calc.system-curve";
import * as operatingPointRoute from "~/routes/api.v1.calc.operating-point";
import { G0 } from "~/engine";

const ROUTES = {
  "pipe-loss": pipeLossRoute,
  "system-curve": systemCurveRoute,
  "operating-point": operatingPointRoute,
} as const;
type Endpoint = keyof typeof ROUTES;

// Each test caller gets its own address, so contract tests never share a rate-limit window.
const RUN = `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`;
let seq = 0;
const newIp = () => `test-${RUN}-${seq++}`;

afterAll(async () => {
  await db().delete(rateLimits).where(like(rateLimits.bucket, `calc:test-${RUN}-%`));
  await closeDb();
});

type PostOpts = { ip?: string; auth?: string; contentType?: string | null; raw?: string; method?: string };

function post(endpoint: Endpoint, body: unknown, o: PostOpts = {}): Promise<CallResult> {
  const headers: Record<string, string> = { "x-dutymark-client-ip": o.ip ?? newIp() };
  if (o.contentType !== null) headers["content-type"] = o.contentType ?? "application/json";
  if (o.auth) headers.authorization = o.auth;
  const method = o.method ?? "POST";
  const fn = method === "GET" || method === "HEAD" ? ROUTES[endpoint].loader : ROUTES[endpoint].action;
  const hasBody = method !== "GET" && method !== "HEAD";
  return call(fn as never, {
    path: `/api/v1/calc/${endpoint}`,
    method,
    headers,
    body: hasBody ? (o.raw ?? JSON.stringify(body)) : undefined,
  });
}

type Problem = { type: string; title: string; status: number; detail: string; errors?: { field: string; message: string }[] };

function expectProblem(r: CallResult, status: number, field?: string) {
  expect(r.status).toBe(status);
  expect(r.headers.get("content-type")).toBe("application/problem+json"); // RFC 9457 media type
  const p = r.body as Problem;
  expect(p.status).toBe(status);
  expect(typeof p.title).toBe("string");
  expect(typeof p.type).toBe("string");
  expect(typeof p.detail).toBe("string");
  if (field !== undefined) expect(p.errors?.map((e) => e.field)).toContain(field);
  return p;
}

// ── common practice, worked example: water at 15.6 °C (ν = 1.12e-6 m²/s), 0.1 m³/s through
//    100 m of 200 mm cast iron, ε = 0.26 mm.
const WORKED = {
  flow_m3s: 0.1,
  diameter_m: 0.2,
  length_m: 100,
  roughness_m: 0.26e-3,
  temperature_c: 15.6,
  kinematic_viscosity_m2s: 1.12e-6,
};

// An invented pump for the operating-point contract (our own numbers, not a real product).
const PUMP = {
  points: [
    { flow_m3s: 0, head_m: 40, efficiency: 0 },
    { flow_m3s: 0.02, head_m: 38, efficiency: 0.55 },
    { flow_m3s: 0.04, head_m: 34, efficiency: 0.72 },
    { flow_m3s: 0.06, head_m: 27, efficiency: 0.75 },
    { flow_m3s: 0.08, head_m: 17, efficiency: 0.65 },
  ],
};
const SEGMENT = { length_m: 200, diameter_m: 0.15, roughness_m: 0.045e-3, minor_k: 5 };

describe("POST /api/v1/calc/pipe-loss", () => {
  test("common practice, worked example: 0.1 m³/s, 100 m of 200 mm cast iron, ν 1.12e-6", async () => {
    const r = await post("pipe-loss", WORKED);
    expect(r.status).toBe(200);
    expect(r.headers.get("content-type")).toBe("application/json");
    const b = r.body as Record<string, number | string | unknown[]> & { fluid: { density_kgm3: number } };
    expect(b.velocity_ms).toBeCloseTo(3.18, 2); // common practice, worked example: V = Q/(πD²/4) = 3.18 m/s
    expect(b.reynolds as number).toBeGreaterThan(5.6e5); // common practice, worked example: Re = VD/ν ≈ 5.7e5
    expect(b.reynolds as number).toBeLessThan(5.8e5);
    expect(b.relative_roughness).toBeCloseTo(0.0013, 6); // common practice, worked example: ε/D = 0.26/200
    expect(b.friction_factor).toBeCloseTo(0.0214, 4); // common practice, worked example: Colebrook f ≈ 0.0214
    expect(b.regime).toBe("turbulent"); // common practice: Re ≥ 4000
    // common practice, worked example: hf ≈ 5.4–5.5 m. With the example's own f = 0.0214,
    // f·(L/D)·V²/2g = 0.0214 · 500 · 0.5166 = 5.53 m, so the band is widened to 5.6 m.
    expect(b.head_loss_m as number).toBeGreaterThanOrEqual(5.4);
    expect(b.head_loss_m as number).toBeLessThanOrEqual(5.6);
    // Darcy-Weisbach (definition): hf = f·(L/D)·V²/(2g₀)
    expect(b.head_loss_m).toBeCloseTo(((b.friction_factor as number) * (100 / 0.2) * (b.velocity_ms as number) ** 2) / (2 * G0), 9);
    // definition: Δp = ρ·g₀·hf, ρ of water at 15.6 °C ≈ 999.0 kg/m³ (IAPWS-IF97, from memory)
    expect(b.fluid.density_kgm3).toBeCloseTo(999.0, 1);
    expect(b.pressure_drop_pa).toBeCloseTo(b.fluid.density_kgm3 * G0 * (b.head_loss_m as number), 6);
    expect(b.warnings).toEqual([]);
  });

  test("default fluid is water at 20 °C (ν ≈ 1.0034e-6 m²/s)", async () => {
    const { kinematic_viscosity_m2s: _nu, temperature_c: _t, ...rest } = WORKED;
    const r = await post("pipe-loss", rest);
    expect(r.status).toBe(200);
    const b = r.body as { fluid: { temperature_c: number; kinematic_viscosity_m2s: number }; reynolds: number };
    expect(b.fluid.temperature_c).toBe(20); // our documented default
    expect(b.fluid.kinematic_viscosity_m2s).toBeCloseTo(1.0034e-6, 9); // IAPWS R12-08 μ 1.0016 mPa·s / ρ 998.21 kg/m³ at 20 °C
    expect(b.reynolds).toBeCloseTo((3.1831 * 0.2) / 1.0034e-6, -3); // definition Re = VD/ν
  });

  test("laminar flow gives f = 64/Re; minor losses add ΣK·V²/2g; zero flow loses nothing", async () => {
    const lam = await post("pipe-loss", { flow_m3s: 1e-5, diameter_m: 0.05, length_m: 10, roughness_m: 0, minor_k: 2, kinematic_viscosity_m2s: 1e-6 });
    const b = lam.body as { reynolds: number; friction_factor: number; regime: string; minor_loss_m: number; velocity_head_m: number; head_loss_m: number; friction_loss_m: number };
    expect(b.regime).toBe("laminar"); // common practice: Re ≤ 2000
    expect(b.friction_factor).toBeCloseTo(64 / b.reynolds, 12); // Hagen-Poiseuille (textbook)
    expect(b.minor_loss_m).toBeCloseTo(2 * b.velocity_head_m, 15); // definition: ΣK·V²/2g
    expect(b.head_loss_m).toBeCloseTo(b.friction_loss_m + b.minor_loss_m, 15);
    const zero = await post("pipe-loss", { ...WORKED, flow_m3s: 0 });
    expect(zero.body).toMatchObject({ head_loss_m: 0, pressure_drop_pa: 0, regime: "no_flow" }); // definition: no flow, no loss
  });

  test("the pure function gives the same answer as the route (benchmarks call it directly)", async () => {
    const direct = calcPipeLoss(WORKED);
    const viaRoute = await post("pipe-loss", WORKED);
    expect(direct.ok).toBe(true);
    if (direct.ok) expect(viaRoute.body).toEqual(JSON.parse(JSON.stringify(direct.body)));
  });
});

describe("POST /api/v1/calc/system-curve", () => {
  test("head at zero flow is the static head; pressure is ρ·g₀·H; head rises with flow", async () => {
    const r = await post("system-curve", { static_head_m: 12.5, segments: [SEGMENT, { length_m: 30, diameter_m: 0.1, roughness_m: 0.15e-3 }], flows_m3s: [0, 0.01, 0.02, 0.04] });
    expect(r.status).toBe(200);
    const b = r.body as { points: { flow_m3s: number; head_m: number; pressure_pa: number }[]; fluid: { density_kgm3: number } };
    expect(b.points).toHaveLength(4);
    expect(b.points[0]).toMatchObject({ flow_m3s: 0, head_m: 12.5 }); // definition: no flow → no loss → static head
    for (const p of b.points) expect(p.pressure_pa).toBeCloseTo(b.fluid.density_kgm3 * G0 * p.head_m, 6); // definition Δp = ρ·g₀·H
    for (let i = 1; i < b.points.length; i++) expect(b.points[i].head_m).toBeGreaterThan(b.points[i - 1].head_m); // losses grow with flow
  });

  test("one segment at the worked-example flow: static head + the pipe-loss answer", async () => {
    const seg = { length_m: 100, diameter_m: 0.2, roughness_m: 0.26e-3 };
    const r = await post("system-curve", { static_head_m: 3, segments: [seg], kinematic_viscosity_m2s: 1.12e-6, temperature_c: 15.6, flows_m3s: [0.1] });
    const pl = await post("pipe-loss", WORKED);
    const head = (r.body as { points: { head_m: number }[] }).points[0].head_m;
    expect(head).toBeCloseTo(3 + (pl.body as { head_loss_m: number }).head_loss_m, 9); // definition: H = Hs + Σ hf
  });
});

describe("POST /api/v1/calc/operating-point", () => {
  test("an invented pump on a simple system: ok, where pump head equals system head", async () => {
    const system = { static_head_m: 10, segments: [SEGMENT] };
    const r = await post("operating-point", { pump: PUMP, system });
    expect(r.status).toBe(200);
    const b = r.body as { status: string; flow_m3s: number; head_m: number; efficiency: number; message: string; intersections: unknown[] };
    expect(b.status).toBe("ok");
    expect(b.intersections).toHaveLength(1);
    // Hand estimate (common practice): system head at 0.06 m³/s ≈ 25.7 m < pump 27 m; at 0.08 the
    // system is above the pump's 17 m — so the crossing lies between 0.06 and 0.08 m³/s.
    expect(b.flow_m3s).toBeGreaterThan(0.06);
    expect(b.flow_m3s).toBeLessThan(0.08);
    expect(b.head_m).toBeGreaterThan(17);
    expect(b.head_m).toBeLessThan(27);
    // definition of the operating point: the system curve passes through it
    const sc = await post("system-curve", { ...system, flows_m3s: [b.flow_m3s] });
    expect((sc.body as { points: { head_m: number }[] }).points[0].head_m).toBeCloseTo(b.head_m, 6);
    // efficiency between its neighbouring points' 0.75 and 0.65 (monotone interpolation, Fritsch & Carlson 1980)
    expect(b.efficiency).toBeGreaterThanOrEqual(0.65);
    expect(b.efficiency).toBeLessThanOrEqual(0.75);
    expect(typeof b.message).toBe("string");
  });

  test("shutoff head below the static head: no_intersection, no flow", async () => {
    const r = await post("operating-point", { pump: PUMP, system: { static_head_m: 50, segments: [SEGMENT] } });
    expect(r.status).toBe(200);
    // definition: 40 m shutoff < 50 m static head → the curves cannot meet
    expect(r.body).toMatchObject({ status: "no_intersection", flow_m3s: null, head_m: null, intersections: [] });
    expect((r.body as { message: string }).message).toMatch(/shutoff/i);
  });

  test("a drooping curve crossing twice above its shut-off head: no_intersection (it cannot start), both crossings listed; just below the shut-off it starts", async () => {
    const drooping = { points: [{ flow_m3s: 0, head_m: 30 }, { flow_m3s: 0.02, head_m: 33 }, { flow_m3s: 0.04, head_m: 30 }, { flow_m3s: 0.06, head_m: 20 }] };
    const r = await post("operating-point", { pump: drooping, system: { static_head_m: 31.5, segments: [] } });
    const b = r.body as { status: string; flow_m3s: number | null; message: string; intersections: { flow_m3s: number; head_m: number }[] };
    // Common practice (from memory): a 30 m shut-off head cannot open a check valve against 31.5 m, whatever crossings lie further out.
    expect(b.status).toBe("no_intersection");
    expect(b.flow_m3s).toBeNull();
    expect(b.intersections).toHaveLength(2); // a flat 31.5 m system cuts a 30→33→30 m hump twice (geometry)
    for (const x of b.intersections) expect(x.head_m).toBeCloseTo(31.5, 6); // flat system: every crossing at the static head
    expect(b.message).toMatch(/^Shutoff head 30\.0 m is below the system head 31\.5 m at zero flow: the pump cannot open its check valve; the curves cross at .*which it never reaches from rest; the first is unstable/);
    const started = (await post("operating-point", { pump: drooping, system: { static_head_m: 29.9, segments: [] } })).body as { status: string; flow_m3s: number };
    expect(started.status).toBe("ok"); // 30 m > 29.9 m at zero flow: it starts and crosses once, on the falling part (geometry)
    expect(started.flow_m3s).toBeGreaterThan(0.04);
  });

  test("curves running together over a stretch: coincident, no flow, the stretch's flows and head in stretch and in words; 1e-6 of the head either side, a point", async () => {
    // Geometry: an invented curve, 40 m at shut-off falling to a flat 30 m from 0.01 to 0.02 m³/s (equal published heads
    // interpolate flat, Fritsch & Carlson 1980), against a flat 30 m system (no segments, no friction).
    const flat = { points: [[0, 40], [0.01, 30], [0.015, 30], [0.02, 30], [0.03, 20]].map(([q, h]) => ({ flow_m3s: q, head_m: h })) };
    const r = await post("operating-point", { pump: flat, system: { static_head_m: 30, segments: [] } });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ status: "coincident", flow_m3s: null, head_m: null, stretch: { flow_from_m3s: 0.01, flow_to_m3s: 0.02, head_m: 30 } }); // old code: no stretch
    // old code: the engine's words, "The pump and system curves coincide from 36.0 m³/h to 72.0 m³/h at 30.0 m: the operating point is undefined — …"
    expect((r.body as { message: string }).message).toBe("No single operating point: the pump and system curves run together from 36.0 m³/h to 72.0 m³/h at 30.0 m (their heads within 1 part in 10⁸ of the pump's head over 33.3 % of the published flows; coincident from 1 %; the stretch in stretch), so the pump may run anywhere on it and drift along it; change the system or the pump so the curves cross");
    for (const [h, lo, hi] of [[30 * (1 - 1e-6), 0.02, 0.0201], [30 * (1 + 1e-6), 0.0099, 0.01]]) {
      const b = (await post("operating-point", { pump: flat, system: { static_head_m: h, segments: [] } })).body as { status: string; flow_m3s: number; stretch?: unknown };
      expect(b.status).toBe("ok");
      expect(b.flow_m3s).toBeGreaterThan(lo);
      expect(b.flow_m3s).toBeLessThan(hi);
      expect(b.stretch).toBeUndefined();
    }
  });

  test("pump head above the system head at its last point: beyond_curve", async () => {
    const r = await post("operating-point", { pump: PUMP, system: { static_head_m: 0, segments: [{ length_m: 1, diameter_m: 0.3, roughness_m: 0 }] } });
    expect(r.body).toMatchObject({ status: "beyond_curve", flow_m3s: null }); // definition: 17 m at the last point ≫ system head
  });
});

describe("roughness refused from half the bore, as the system editor and engine refuse it (ROUGHNESS_MAX_OF_DIAMETER)", () => {
  // The limit is ours (system.ts: roughness of half the inner diameter would close the bore); 0.2 m bore → 0.1 m.
  test("pipe-loss: ε 0.1 m in a 0.2 m bore → 400 naming roughness_m with both numbers; 0.0999 m is answered", async () => {
    const p = expectProblem(await post("pipe-loss", { ...WORKED, roughness_m: 0.1 }), 400, "roughness_m"); // old code: 200
    const msg = p.errors!.find((e) => e.field === "roughness_m")!.message;
    expect(msg).toContain("diameter_m 0.2 m, 0.1 m (got 0.1 m, ε/D = 0.5)");
    expect((await post("pipe-loss", { ...WORKED, roughness_m: 0.0999 })).status).toBe(200);
  });
  test("system-curve and operating-point: a segment's ε at half its bore is refused by its field, before the engine", async () => {
    const seg = { ...SEGMENT, roughness_m: 0.075 }; // 0.15 m bore
    const a = expectProblem(await post("system-curve", { static_head_m: 1, segments: [SEGMENT, seg], flows_m3s: [0.01] }), 400, "segments[1].roughness_m");
    expect(a.errors!.find((e) => e.field === "segments[1].roughness_m")!.message).toContain("diameter_m 0.15 m, 0.075 m (got 0.075 m");
    expectProblem(await post("operating-point", { pump: PUMP, system: { static_head_m: 1, segments: [seg] } }), 400, "system.segments[0].roughness_m");
  });
});

describe("methods", () => {
  test.each(Object.keys(ROUTES) as Endpoint[])("GET and PUT on %s → 405 problem+json with Allow: POST, OPTIONS", async (ep) => {
    for (const method of ["GET", "PUT", "DELETE"]) {
      const r = await post(ep, {}, { method });
      expectProblem(r, 405); // RFC 9110 §15.5.6
      expect(r.headers.get("allow")).toBe("POST, OPTIONS"); // RFC 9110 §10.2.1: OPTIONS is answered on every route
    }
  });
});

describe("bad input → 400/413/415 problem+json naming the field, never 500", () => {
  const big = (n: number, make: (i: number) => unknown) => Array.from({ length: n }, (_, i) => make(i));
  const { diameter_m: _d, ...noDiameter } = WORKED;
  const cases: [string, Endpoint, unknown, string, PostOpts?, number?][] = [
    ["missing field", "pipe-loss", noDiameter, "diameter_m"],
    ["negative length", "pipe-loss", { ...WORKED, length_m: -1 }, "length_m"],
    ["zero diameter", "pipe-loss", { ...WORKED, diameter_m: 0 }, "diameter_m"],
    ["number as a string", "pipe-loss", { ...WORKED, flow_m3s: "0.1" }, "flow_m3s"],
    ["NaN as a string", "pipe-loss", { ...WORKED, flow_m3s: "NaN" }, "flow_m3s"],
    ["NaN literal (not JSON)", "pipe-loss", null, "(body)", { raw: '{"flow_m3s": NaN, "diameter_m": 0.2, "length_m": 1, "roughness_m": 0}' }],
    ["overflowing number 1e999", "pipe-loss", null, "flow_m3s", { raw: '{"flow_m3s": 1e999, "diameter_m": 0.2, "length_m": 1, "roughness_m": 0}' }],
    ["null value", "pipe-loss", { ...WORKED, roughness_m: null }, "roughness_m"],
    ["roughness not below the diameter", "pipe-loss", { ...WORKED, roughness_m: 0.3 }, "roughness_m"],
    ["water outside 0–100 °C", "pipe-loss", { ...WORKED, temperature_c: 150 }, "temperature_c"],
    ["negative viscosity", "pipe-loss", { ...WORKED, kinematic_viscosity_m2s: -1e-6 }, "kinematic_viscosity_m2s"],
    ["unknown field (unit missing from the name)", "pipe-loss", { ...WORKED, flow: 0.1 }, "flow"],
    ["body is an array", "pipe-loss", [WORKED], "(body)"],
    ["body is null", "pipe-loss", null, "(body)"],
    ["body is not JSON", "pipe-loss", null, "(body)", { raw: "flow=0.1&diameter=0.2" }],
    ["empty body", "pipe-loss", null, "(body)", { raw: "" }],
    ["segment diameter zero", "system-curve", { static_head_m: 1, segments: [SEGMENT, { ...SEGMENT, diameter_m: 0 }], flows_m3s: [0.01] }, "segments[1].diameter_m"],
    ["segment missing length", "system-curve", { static_head_m: 1, segments: [{ diameter_m: 0.1, roughness_m: 0 }], flows_m3s: [0.01] }, "segments[0].length_m"],
    ["negative flow in the list", "system-curve", { static_head_m: 1, segments: [], flows_m3s: [0.01, -0.02] }, "flows_m3s[1]"],
    ["flows not an array", "system-curve", { static_head_m: 1, segments: [], flows_m3s: 0.01 }, "flows_m3s"],
    ["no flows", "system-curve", { static_head_m: 1, segments: [], flows_m3s: [] }, "flows_m3s"],
    [`${CALC_LIMITS.flows + 1} flows`, "system-curve", { static_head_m: 1, segments: [], flows_m3s: big(CALC_LIMITS.flows + 1, (i) => i * 1e-4) }, "flows_m3s"],
    ["10 000 flows", "system-curve", { static_head_m: 1, segments: [], flows_m3s: big(10_000, (i) => i * 1e-5) }, "flows_m3s"],
    [`${CALC_LIMITS.segments + 1} segments`, "system-curve", { static_head_m: 1, segments: big(CALC_LIMITS.segments + 1, () => SEGMENT), flows_m3s: [0.01] }, "segments"],
    ["10 000 segments", "system-curve", { static_head_m: 1, segments: big(10_000, () => ({ length_m: 1, diameter_m: 0.1, roughness_m: 0 })), flows_m3s: [0.01] }, "segments"],
    ["static head as a string", "system-curve", { static_head_m: "10 m", segments: [], flows_m3s: [0.01] }, "static_head_m"],
    [`${CALC_LIMITS.pumpPoints + 1} pump points`, "operating-point", { pump: { points: big(CALC_LIMITS.pumpPoints + 1, (i) => ({ flow_m3s: i * 1e-4, head_m: 40 - i * 0.01 })) }, system: { static_head_m: 1, segments: [] } }, "pump.points"],
    ["10 000 pump points", "operating-point", { pump: { points: big(10_000, (i) => ({ flow_m3s: i * 1e-5, head_m: 40 })) }, system: { static_head_m: 1, segments: [] } }, "pump.points"],
    ["one pump point", "operating-point", { pump: { points: [PUMP.points[0]] }, system: { static_head_m: 1, segments: [] } }, "pump.points"],
    ["pump flows not increasing (engine check)", "operating-point", { pump: { points: [PUMP.points[0], PUMP.points[2], PUMP.points[1]] }, system: { static_head_m: 1, segments: [] } }, "pump.points[2].flow_m3s"],
    ["pump head rising with flow (engine check)", "operating-point", { pump: { points: [{ flow_m3s: 0, head_m: 10 }, { flow_m3s: 0.01, head_m: 20 }] }, system: { static_head_m: 1, segments: [] } }, "pump.points[1].head_m"],
    ["efficiency in per cent", "operating-point", { pump: { points: [PUMP.points[0], { ...PUMP.points[1], efficiency: 55 }] }, system: { static_head_m: 1, segments: [] } }, "pump.points[1].efficiency"],
    ["system segment roughness a string", "operating-point", { pump: PUMP, system: { static_head_m: 1, segments: [{ ...SEGMENT, roughness_m: "0.045 mm" }] } }, "system.segments[0].roughness_m"],
    ["system missing", "operating-point", { pump: PUMP }, "system"],
    ["system temperature out of range", "operating-point", { pump: PUMP, system: { static_head_m: 1, segments: [], temperature_c: -5 } }, "system.temperature_c"],
  ];

  test.each(cases)("%s (%s) → 400 naming %s", async (_name, ep, body, field, opts) => {
    const r = await post(ep, body, opts);
    const p = expectProblem(r, 400, field);
    expect(p.detail).toContain(field === "(body)" ? "(body)" : field.split("[")[0]);
  });

  test.each([
    ["text/plain", "text/plain"],
    ["form-encoded", "application/x-www-form-urlencoded"],
    ["none", null],
  ] as const)("Content-Type %s → 415", async (_n, ct) => {
    const r = await post("pipe-loss", WORKED, { contentType: ct });
    expectProblem(r, 415, "(body)"); // RFC 9110 §15.5.16
  });

  test("Content-Type with a charset parameter is accepted", async () => {
    const r = await post("pipe-loss", WORKED, { contentType: "application/json; charset=utf-8" });
    expect(r.status).toBe(200);
  });

  test("a body over the size limit → 413", async () => {
    const raw = JSON.stringify({ ...WORKED, pad: "x".repeat(CALC_LIMITS.bodyBytes) });
    const r = await post("pipe-loss", null, { raw });
    expectProblem(r, 413);
  });

  test("the pure functions never throw on junk input", () => {
    const junk: unknown[] = [undefined, null, 0, "x", [], {}, { flow_m3s: {} }, { segments: "x" }, { pump: [] }, { pump: { points: "x" } }];
    for (const ep of ["pipe-loss", "system-curve", "operating-point"] as const) {
      for (const j of junk) expect(runCalc(ep, j).ok).toBe(false);
    }
  });
});

describe("access: anonymous per-address limit, tokens unlimited", () => {
  // A fixed instant 20.5 s into a minute: the 429's Retry-After is then 40 s (60 − 20.5, rounded up).
  const fixedNow = () => new Date(windowStartOf(new Date(), 60).getTime() + 20_500);
  const req = (ip: string, auth?: string) =>
    new Request("http://127.0.0.1:3999/api/v1/calc/pipe-loss", {
      method: "POST",
      headers: { "content-type": "application/json", "x-dutymark-client-ip": ip, ...(auth ? { authorization: auth } : {}) },
      body: JSON.stringify(WORKED),
    });

  test(`an anonymous address gets ${ANON_RATE_LIMIT.limit} calls a minute, then 429 with Retry-After`, async () => {
    const ip = newIp();
    const now = fixedNow();
    for (let i = 1; i <= ANON_RATE_LIMIT.limit; i++) {
      const r = await calcAction(req(ip), "pipe-loss", { now });
      expect(r.status).toBe(200);
      expect(r.headers.get("ratelimit-remaining")).toBe(String(ANON_RATE_LIMIT.limit - i)); // our product rule: 60/min per address
    }
    const over = await calcAction(req(ip), "pipe-loss", { now });
    expect(over.status).toBe(429); // RFC 6585 §4
    expect(over.headers.get("content-type")).toBe("application/problem+json");
    expect(over.headers.get("retry-after")).toBe("40"); // seconds to the end of the fixed window
    const p = (await over.json()) as Problem & { retry_after_s: number };
    expect(p).toMatchObject({ status: 429, title: "Too Many Requests", retry_after_s: 40 });
    // another address is unaffected
    expect((await calcAction(req(newIp()), "pipe-loss", { now })).status).toBe(200);
  });

  test("through the route module: an address whose window is full gets 429", async () => {
    const ip = newIp();
    const t = Date.now();
    // fill this window and the next, so a minute boundary during the test changes nothing
    for (const at of [t, t + 60_000]) {
      await db().insert(rateLimits).values({ bucket: `calc:${ip}`, windowStart: windowStartOf(new Date(at), 60), hits: ANON_RATE_LIMIT.limit });
    }
    const r = await post("operating-point", { pump: PUMP, system: { static_head_m: 10, segments: [SEGMENT] } }, { ip });
    expectProblem(r, 429);
    expect(Number(r.headers.get("retry-after"))).toBeGreaterThanOrEqual(1);
  });

  test("a valid token is not limited, even from an address over the limit (read scope suffices)", async () => {
    const m = await makeMember("viewer");
    const { token } = await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "calc", scope: "read" });
    const ip = newIp();
    const now = fixedNow();
    for (let i = 0; i <= ANON_RATE_LIMIT.limit; i++) await calcAction(req(ip), "pipe-loss", { now });
    expect((await calcAction(req(ip), "pipe-loss", { now })).status).toBe(429);
    for (let i = 0; i < 3; i++) {
      const r = await calcAction(req(ip, `Bearer ${token}`), "pipe-loss", { now });
      expect(r.status).toBe(200);
      expect(r.headers.get("ratelimit-limit")).toBeNull(); // not counted
    }
    const viaRoute = await post("system-curve", { static_head_m: 1, segments: [], flows_m3s: [0] }, { ip, auth: `Bearer ${token}` });
    expect(viaRoute.status).toBe(200);
  });

  test("an invalid or malformed token → 401, never an anonymous fallback", async () => {
    const unknown = await post("pipe-loss", WORKED, { auth: "Bearer dmk_this-token-does-not-exist-0000" });
    expectProblem(unknown, 401);
    expect(unknown.headers.get("www-authenticate")).toMatch(/^Bearer/); // RFC 6750 §3
    expectProblem(await post("pipe-loss", WORKED, { auth: "Basic dXNlcjpwYXNz" }), 401);
    expectProblem(await post("pipe-loss", WORKED, { auth: "Bearer" }), 401);
  });
});
