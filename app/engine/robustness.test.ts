/**
 * Tier 3 — limits: no NaN (or ±Infinity) in any result, and bad input only ever throws a
 * typed EngineInputError naming the parameter. Inputs are drawn at random (fixed seed)
 * from ordinary values mixed with hostile ones.
 */
import { describe, expect, it } from "vitest";
import {
  createPumpCurve, EngineInputError, fieldCheck, fluidAt, frictionFactorDetailed, operatingFigures, operatingPoint,
  pipeHeadLoss, prepareSearchIndex, searchDuty, speedForDuty, systemCurve, systemHead, trimForDuty, waterProperties,
  scaleBySpeed, combinePumps, toSI,
} from "./index.ts";
import { rng, makeCurve } from "./test/curveSets.ts";
import { samplePoints } from "./test/curves.ts";

function findNonFinite(v: unknown, path = "result", seen = new Set<unknown>()): string | null {
  if (typeof v === "number") return Number.isFinite(v) ? null : `${path} = ${v}`;
  if (v === null || typeof v !== "object" || seen.has(v)) return null;
  seen.add(v);
  if (ArrayBuffer.isView(v)) {
    const arr = v as unknown as ArrayLike<number>;
    for (let i = 0; i < arr.length; i++) if (!Number.isFinite(arr[i])) return `${path}[${i}] = ${arr[i]}`;
    return null;
  }
  for (const [k, x] of Object.entries(v as Record<string, unknown>)) {
    const r = findNonFinite(x, `${path}.${k}`, seen);
    if (r) return r;
  }
  return null;
}

const r = rng(2024);
const hostile = [0, -1, NaN, Infinity, -Infinity, 1e308, 1e-308, -0];
function num(lo: number, hi: number, hostileRate = 0.15): number {
  if (r() < hostileRate) return hostile[Math.floor(r() * hostile.length)];
  return lo + (hi - lo) * r();
}

function check(label: string, fn: () => unknown) {
  let out: unknown;
  try {
    out = fn();
  } catch (e) {
    if (!(e instanceof EngineInputError)) throw new Error(`${label}: threw ${(e as Error)?.name}: ${(e as Error)?.message}`, { cause: e });
    expect(e.parameter.length, label).toBeGreaterThan(0);
    expect(e.reason.length, label).toBeGreaterThan(0);
    return "threw";
  }
  const bad = findNonFinite(out);
  if (bad) throw new Error(`${label}: non-finite ${bad}`);
  return "ok";
}

describe("random inputs: finite results or typed errors", () => {
  const water = fluidAt({ kind: "water" }, 20);
  const curve = createPumpCurve({ points: samplePoints({ power: true }), speed: 2900, impellerDiameter: 0.2, minDiameter: 0.16 });

  it("friction and pipe loss (2000 draws)", () => {
    const outcomes = new Set<string>();
    for (let i = 0; i < 2000; i++) {
      outcomes.add(check("frictionFactorDetailed", () => frictionFactorDetailed(num(1, 1e9), num(0, 0.1))));
      outcomes.add(check("pipeHeadLoss", () => pipeHeadLoss({ flow: num(0, 2), diameter: num(0.005, 2), length: num(0, 5000),
        roughness: num(0, 0.01), minorK: num(0, 50), kinematicViscosity: num(1e-7, 1e-3) })));
    }
    expect(outcomes).toEqual(new Set(["ok", "threw"]));
  });

  it("water, units and system head (1000 draws)", () => {
    for (let i = 0; i < 1000; i++) {
      check("waterProperties", () => waterProperties(num(-10, 110)));
      check("toSI", () => toSI("pressure", "psi", num(-1e6, 1e6)));
      check("systemHead", () => systemHead({ fluid: water, staticHead: num(-20, 100), pressureDifference: num(-1e5, 1e6),
        discharge: [{ length: num(0, 1000), diameter: num(0.01, 1), roughness: num(0, 1e-3), minorK: num(0, 20) }] }, num(0, 1)));
    }
    check("systemCurve", () => systemCurve({ fluid: water, staticHead: 10, discharge: [{ length: 100, diameter: 0.1, roughness: 1e-4 }] }, { flowMax: 0.05 }));
  });

  it("pump curves, operating point, affinity, figures (500 draws)", () => {
    const outcomes = new Set<string>();
    for (let i = 0; i < 500; i++) {
      const pts = makeCurve(num(1, 200, 0.05), num(1e-4, 1, 0.05), num(0.3, 0.9, 0.05));
      outcomes.add(check("operatingPoint", () => operatingPoint(pts, { staticHead: num(0, 150), temperatureC: num(0, 100, 0.05),
        segments: [{ length: num(1, 2000), diameter: num(0.02, 1), roughness: num(0, 1e-3), minorK: num(0, 30) }] })));
      outcomes.add(check("speedForDuty", () => speedForDuty(pts.length ? { points: pts } : curve, { flow: num(1e-4, 1), head: num(1, 200) })));
      outcomes.add(check("trimForDuty", () => trimForDuty(curve, { flow: num(1e-4, 0.03), head: num(1, 40) })));
      outcomes.add(check("scaleBySpeed", () => scaleBySpeed(curve, num(0.1, 2))));
      outcomes.add(check("combinePumps", () => combinePumps(curve, { mode: r() < 0.5 ? "parallel" : "series", duty: Math.round(num(0, 5)) })));
      outcomes.add(check("operatingFigures", () => operatingFigures({ curve, fluid: water, flow: num(0, 0.03),
        suction: { surfacePressure: num(0, 3e5), staticSuctionHead: num(-8, 10), suctionLoss: num(0, 3) },
        motor: { rating: num(100, 2e4) }, energy: { hoursPerYear: num(0, 8760), tariffPerKWh: num(0, 1) } })));
      outcomes.add(check("fieldCheck", () => fieldCheck({ curve, fluid: water,
        suction: { pressure: num(-9e4, 3e5), elevation: num(-2, 2), pipeDiameter: num(0.02, 0.3), accuracy: num(0, 1e4) },
        discharge: { pressure: num(0, 8e5), elevation: num(-2, 2), pipeDiameter: num(0.02, 0.3), accuracy: num(0, 1e4) },
        measuredFlow: r() < 0.5 ? undefined : num(0, 0.03) })));
    }
    expect(outcomes.has("ok")).toBe(true);
    expect(outcomes.has("threw")).toBe(true);
  });

  it("search over random sets including hostile ones (200 draws)", () => {
    const sets = Array.from({ length: 200 }, (_, i) => ({ id: String(i), curve: { points: makeCurve(num(1, 200), num(1e-4, 0.2), num(0.3, 0.9)) } }));
    const idx = prepareSearchIndex(sets);
    for (let i = 0; i < 200; i++) check("searchDuty", () => searchDuty(idx, { flow: num(1e-4, 0.2), head: num(1, 200) }, { npshAvailable: r() < 0.5 ? undefined : num(0, 20) }));
  });
});

describe("bad input throws EngineInputError naming the parameter", () => {
  const cases: [string, () => unknown, string][] = [
    ["non-finite Reynolds", () => frictionFactorDetailed(NaN, 0), "reynolds"],
    ["zero Reynolds", () => frictionFactorDetailed(0, 0), "reynolds"],
    ["negative roughness", () => frictionFactorDetailed(1e5, -1e-4), "relativeRoughness"],
    ["zero diameter", () => pipeHeadLoss({ flow: 0.01, diameter: 0, length: 1, roughness: 0, kinematicViscosity: 1e-6 }), "diameter"],
    ["negative flow", () => pipeHeadLoss({ flow: -0.01, diameter: 0.1, length: 1, roughness: 0, kinematicViscosity: 1e-6 }), "flow"],
    ["missing viscosity", () => pipeHeadLoss({ flow: 0.01, diameter: 0.1, length: 1, roughness: 0 } as never), "kinematicViscosity"],
    ["water at 120 °C", () => waterProperties(120), "temperatureC"],
    ["empty curve", () => operatingPoint([], { staticHead: 1, segments: [], temperatureC: 20 }), "points"],
    ["duplicate flows", () => operatingPoint([{ flow: 0, head: 10 }, { flow: 0, head: 9 }], { staticHead: 1, segments: [], temperatureC: 20 }), "points[1].flow"],
    ["bad segment", () => operatingPoint(samplePoints(), { staticHead: 1, segments: [{ length: 1, diameter: -1, roughness: 0 }], temperatureC: 20 }), "discharge[0].diameter"],
    ["bad static", () => operatingPoint(samplePoints(), { staticHead: NaN, segments: [], temperatureC: 20 }), "staticHead"],
  ];
  for (const [label, fn, parameter] of cases) {
    it(label, () => {
      let err: unknown;
      try { fn(); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(EngineInputError);
      expect((err as EngineInputError).parameter).toBe(parameter);
      expect((err as EngineInputError).message).toContain(parameter);
    });
  }
});
