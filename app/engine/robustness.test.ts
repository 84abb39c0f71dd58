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
import * as E from "./index.ts";
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

/**
 * Sweep of the public face: every function exported by index.ts has an entry below with its
 * numeric parameters; each refuses NaN, +Infinity and −Infinity (and the listed out-of-domain
 * values) in each of them with an EngineInputError naming a parameter, and every mode/kind/enum
 * parameter refuses an unknown value. A new export without an entry fails the first test.
 */
describe("public face sweep: non-finite, out-of-domain and unknown values are refused", () => {
  const water = fluidAt({ kind: "water" }, 20);
  const curve = createPumpCurve({ points: samplePoints({ power: true }), speed: 2900, impellerDiameter: 0.2 });
  const sys = { fluid: water, staticHead: 10, discharge: [{ length: 100, diameter: 0.1, roughness: 4.5e-5 }] };
  const cubic = E.monotoneCubic([0, 1, 2], [3, 2, 0]);
  const gauge = (p: number) => ({ pressure: p, elevation: 0, pipeDiameter: 0.1 });
  type Arg = (x: number) => unknown;
  /** name → [call with the probed number, ordinary value, out-of-domain values] per numeric parameter. */
  const qd = 50 / 3600;
  const dc = (o: Partial<E.DutyCycleInput>): E.DutyCycleInput => ({ curve, systemHead: (q) => 28 * (q / qd) ** 2, designFlow: qd, mode: "system-curve",
    profile: [{ flowFraction: 1, hours: 500 }, { flowFraction: 0.5, hours: 2000 }], density: 998, motor: { rating: 5500, efficiency: 0.9 }, driveEfficiency: 0.97, ...o });
  const sdc = (o: Partial<E.StagedDutyCycleInput>): E.StagedDutyCycleInput => {
    const { curve: pumpCurve, motor: _m, ...rest } = dc({});
    return { ...rest, pumpCurve, dutyPumps: 2, motor: { rating: 2750, efficiency: 0.9 }, ...o };
  };
  const lcc = (o: Partial<E.LifeCycleInput>): E.LifeCycleInput => ({ purchasePrice: 1000, annualEnergyKWh: 1e4, tariffPerKWh: 0.2, years: 10, escalation: 0.03, discountRate: 0.05, ...o });
  const numeric: Record<string, [Arg, number, number[]][]> = {
    colebrook: [[(x) => E.colebrook(x, 1e-4), 1e5, [0, -1]], [(x) => E.colebrook(1e5, x), 1e-4, [-1e-4]]],
    colebrookResidual: [[(x) => E.colebrookResidual(x, 1e5, 1e-4), 0.02, [0, -0.02]], [(x) => E.colebrookResidual(0.02, x, 1e-4), 1e5, [0]]],
    swameeJain: [[(x) => E.swameeJain(x, 1e-4), 1e5, [0, -1]], [(x) => E.swameeJain(1e5, x), 1e-4, [-1]]],
    haaland: [[(x) => E.haaland(x, 1e-4), 1e5, [0, -1]], [(x) => E.haaland(1e5, x), 1e-4, [-1]]],
    churchill: [[(x) => E.churchill(x, 1e-4), 1e5, [0, -1]], [(x) => E.churchill(1e5, x), 1e-4, [-1]]],
    laminar: [[(x) => E.laminar(x), 1000, [0, -1]]],
    hazenWilliamsHeadLoss: [[(x) => E.hazenWilliamsHeadLoss(x, 0.1, 100, 120), 0.01, [-0.01]], [(x) => E.hazenWilliamsHeadLoss(0.01, x, 100, 120), 0.1, [0, -0.1]],
      [(x) => E.hazenWilliamsHeadLoss(0.01, 0.1, x, 120), 100, [-1]], [(x) => E.hazenWilliamsHeadLoss(0.01, 0.1, 100, x), 120, [0, -120]]],
    fullyRoughFrictionFactor: [[(x) => E.fullyRoughFrictionFactor(x), 0.1, [0, -0.1]], [(x) => E.fullyRoughFrictionFactor(0.1, x), 4.5e-5, [0, -1, 0.5]]],
    gradeWithinUncertainty: [[(x) => E.gradeWithinUncertainty(curve, { flow: [x, 0.02], head: [15, 25] }, E.TOLERANCE_GRADES[0]), 0.01, [0.03]],
      [(x) => E.gradeWithinUncertainty(curve, { flow: [0.01, x], head: [15, 25] }, E.TOLERANCE_GRADES[0]), 0.02, [0.005]],
      [(x) => E.gradeWithinUncertainty(curve, { flow: [0.01, 0.02], head: [x, 25] }, E.TOLERANCE_GRADES[0]), 15, [30]],
      [(x) => E.gradeWithinUncertainty(curve, { flow: [0.01, 0.02], head: [15, x] }, E.TOLERANCE_GRADES[0]), 25, [10]]],
    flowPerPump: [[(x) => E.flowPerPump(x, { mode: "parallel", duty: 2 }), 0.01, [-0.01]], [(x) => E.flowPerPump(0.01, { mode: "parallel", duty: x }), 2, [0, 1.5, 101, 2 ** 53]],
      [(x) => E.flowPerPump(x, { mode: "parallel", duty: 2 }, { points: samplePoints() }), 0.01, [-0.01]]],
    evalCubic: [[(x) => E.evalCubic(cubic, x), 1, []]],
    monotoneCubic: [[(x) => E.monotoneCubic([0, x, 2], [3, 2, 0]), 1, [0, 3]], [(x) => E.monotoneCubic([0, 1, 2], [3, x, 0]), 2, []]],
    regimeOf: [[(x) => E.regimeOf(x), 1e5, [-1]]],
    frictionFactor: [[(x) => E.frictionFactor(x, 1e-4), 1e5, [0, -1]], [(x) => E.frictionFactor(1e5, x), 1e-4, [-1]]],
    frictionFactorDetailed: [[(x) => E.frictionFactorDetailed(x, 1e-4), 1e5, [0]], [(x) => E.frictionFactorDetailed(1e5, x), 1e-4, [-1]]],
    pipeHeadLoss: [[(x) => E.pipeHeadLoss({ flow: x, diameter: 0.1, length: 10, roughness: 1e-5, kinematicViscosity: 1e-6 }), 0.01, [-1]],
      [(x) => E.pipeHeadLoss({ flow: 0.01, diameter: x, length: 10, roughness: 1e-5, kinematicViscosity: 1e-6 }), 0.1, [0]]],
    fittingFrictionFactor: [[(x) => E.fittingFrictionFactor(x), 0.1, [0, -1]]],
    fittingK: [[(x) => E.fittingK("butterfly-valve-open", x), 0.1, [0, -1]]],
    fittingKDetailed: [[(x) => E.fittingKDetailed("tee-branch", x), 0.1, [0, -1]]],
    sumK: [[(x) => E.sumK([{ id: "elbow-90-standard" }], x), 0.1, [0]], [(x) => E.sumK([{ k: x }], 0.1), 1, [-1]], [(x) => E.sumK([{ k: 1, count: x }], 0.1), 2, [-1, 0.5]]],
    sumKDetailed: [[(x) => E.sumKDetailed([{ id: "exit" }], x), 0.1, [0]]],
    suddenEnlargementK: [[(x) => E.suddenEnlargementK(x, 0.2), 0.1, [0, 0.3]]],
    suddenContractionK: [[(x) => E.suddenContractionK(0.2, x), 0.1, [0, 0.3]]],
    if97Region1Density: [[(x) => E.if97Region1Density(x, 101325), 300, [0, 200, 700]], [(x) => E.if97Region1Density(300, x), 101325, [0, -1]]],
    if97SaturationPressure: [[(x) => E.if97SaturationPressure(x), 300, [0, 700]]],
    iapwsViscosity: [[(x) => E.iapwsViscosity(x, 998), 300, [0]], [(x) => E.iapwsViscosity(300, x), 998, [0, -1]]],
    waterProperties: [[(x) => E.waterProperties(x), 20, [-10, 120]]],
    fluidAt: [[(x) => E.fluidAt({ kind: "water" }, x), 20, [120]]],
    customFluid: [[(x) => E.customFluid("oil", x, 1e-3, 2000), 900, [0, -1]], [(x) => E.customFluid("oil", 900, x, 2000), 1e-3, [0]]],
    checkFluid: [[(x) => E.checkFluid({ ...water, density: x }), 998, [0]]],
    typedDiameter: [[(x) => E.typedDiameter(x), 0.1, [0, -1]]],
    innerDiameter: [[(x) => E.innerDiameter("steel-sch40", String(x)), 4, [3.3]]],
    createPumpCurve: [[(x) => E.createPumpCurve({ points: [{ flow: 0, head: 20 }, { flow: x, head: 10 }] }), 0.01, [0, -1]]],
    ensurePumpCurve: [[(x) => E.ensurePumpCurve({ points: [{ flow: 0, head: x }, { flow: 0.01, head: 10 }] }), 20, [-1]]],
    headAt: [[(x) => E.headAt(curve, x), 0.01, []]],
    efficiencyAt: [[(x) => E.efficiencyAt(curve, x), 0.01, []]],
    shaftPowerAt: [[(x) => E.shaftPowerAt(curve, x, 1000), 0.01, []], [(x) => E.shaftPowerAt(curve, 0.01, x), 1000, [0]]],
    npshrAt: [[(x) => E.npshrAt(curve, x), 0.01, []]],
    flowsAtHead: [[(x) => E.flowsAtHead(curve, x), 20, []]],
    sampleCurve: [[(x) => E.sampleCurve(curve, x), 61, [1, 1e6]]],
    solveOperatingPoint: [[(x) => E.solveOperatingPoint(curve, () => x), 10, []], [(x) => E.solveOperatingPoint(curve, () => 10, { subdivisions: x }), 8, [0, 2.5, 10_001, 1e7]],
      // maxIterations as subdivisions: a whole number 1–10 000 (engine bound); against a system above the pump (no root to
      // solve) NaN and Infinity were taken without a word, and 0 or 2.5 were rounded.
      [(x) => E.solveOperatingPoint(curve, () => 1000, { maxIterations: x }), 100, [0, 2.5, 10_001, 1e7]],
      [(x) => E.solveOperatingPoint(curve, () => 10, { maxIterations: x }), 100, [0, 2.5, 10_001]]],
    crossingFromRest: [[(x) => E.crossingFromRest(x, [-1]), 1, []], [(x) => E.crossingFromRest(1, [x]), -1, []]],
    lastPointGap: [[(x) => E.lastPointGap(x, 30), 30, []], [(x) => E.lastPointGap(30, x), 30, []]],
    firstPointGap: [[(x) => E.firstPointGap(x, 30), 30, []], [(x) => E.firstPointGap(30, x), 30, []]],
    operatingPointInSystem: [[(x) => E.operatingPointInSystem(curve, { ...sys, staticHead: x }), 10, []]],
    operatingPoint: [[(x) => E.operatingPoint(samplePoints(), { staticHead: x, segments: [], temperatureC: 20 }), 10, []]],
    prepareSystem: [[(x) => E.prepareSystem({ ...sys, staticHead: x }), 10, []]],
    systemHead: [[(x) => E.systemHead(sys, x), 0.01, [-0.01]]],
    systemHeadFunction: [[(x) => E.systemHeadFunction(sys)(x), 0.01, [-0.01]]],
    systemCurve: [[(x) => E.systemCurve(sys, { flowMax: x }), 0.05, [0, -1]]],
    suctionLoss: [[(x) => E.suctionLoss(sys, x), 0.01, [-0.01]]],
    scaleBySpeed: [[(x) => E.scaleBySpeed(curve, x), 0.9, [0, -1, 1e-200, 1e103]]],
    scaleByTrim: [[(x) => E.scaleByTrim(curve, x), 0.9, [0, -1, 1e-200, 1e103]]],
    speedForDuty: [[(x) => E.speedForDuty(curve, { flow: x, head: 20 }), 0.01, [0, -1]]],
    trimForDuty: [[(x) => E.trimForDuty(curve, { flow: 0.01, head: x }), 20, [0, -1]]],
    affinityPoint: [[(x) => E.affinityPoint({ flow: 1, head: 1 }, x), 0.9, [0, -1]]],
    combinePumps: [[(x) => E.combinePumps(curve, { mode: "parallel", duty: x }), 2, [0, 1.5, 101, 2 ** 53, 1e300]],
      [(x) => E.combinePumps(curve, { mode: "parallel", duty: 2, standby: x }), 1, [-1, 0.5, 101, 1e9]]],
    npshAvailable: [[(x) => E.npshAvailable({ surfacePressure: x, vaporPressure: 2339, density: 998, staticSuctionHead: 1, suctionLoss: 1 }), 101325, [-1]]],
    maxShaftPower: [[(x) => E.maxShaftPower(curve, x), 1000, [0]]],
    operatingFigures: [[(x) => E.operatingFigures({ curve, fluid: water, flow: x }), 0.01, [-1]]],
    gaugeTdh: [[(x) => E.gaugeTdh(gauge(0), gauge(x), 0.01, 998), 2e5, []], [(x) => E.gaugeTdh(gauge(0), gauge(2e5), x, 998), 0.01, [-1]]],
    withinGrade: [[(x) => E.withinGrade(curve, x, 20, E.TOLERANCE_GRADES[0]), 0.01, [-1]], [(x) => E.withinGrade(curve, 0.01, x, E.TOLERANCE_GRADES[0]), 20, [0, -1]]],
    gradeCross: [[(x) => E.gradeCross(curve, x, 20, E.TOLERANCE_GRADES[0]), 0.01, [-1]], [(x) => E.gradeCross(curve, 0.01, x, E.TOLERANCE_GRADES[0]), 20, [0, -1]]],
    flowBandHalfWidthText: [[(x) => E.flowBandHalfWidthText(x, 0.012, 0.01), 0.008, [-1, 0.02]], [(x) => E.flowBandHalfWidthText(0.008, x, 0.01), 0.012, [-1, 0.007]], [(x) => E.flowBandHalfWidthText(0.008, 0.012, x), 0.01, [0, -1]]],
    fieldCheck: [[(x) => E.fieldCheck({ curve, fluid: water, suction: gauge(0), discharge: gauge(2e5), measuredFlow: x }), 0.01, [-1]]],
    gradePower: [[(x) => E.gradePower(curve, x, 20, 998, 3000, E.TOLERANCE_GRADES[0]), 0.01, [-1]], [(x) => E.gradePower(curve, 0.01, x, 998, 3000, E.TOLERANCE_GRADES[0]), 20, []],
      [(x) => E.gradePower(curve, 0.01, 20, x, 3000, E.TOLERANCE_GRADES[0]), 998, [0, -1]], [(x) => E.gradePower(curve, 0.01, 20, 998, x, E.TOLERANCE_GRADES[0]), 3000, [0, -1]],
      [(x) => E.gradePower(curve, 0.01, 20, 998, 3000, { ...E.TOLERANCE_GRADES[0], powerAbove: x }), 0.04, [-0.1, 1.5]],
      [(x) => E.gradePower(curve, 0.01, 20, 998, 3000, { ...E.TOLERANCE_GRADES[0], efficiencyBelow: x }), 0.03, [-0.1, 1.5]]],
    gradePowerWithinAccuracy: [[(x) => E.gradePowerWithinAccuracy(curve, x, 20, 998, 3000, E.TOLERANCE_GRADES[0], 0.02), 0.01, [-1]],
      [(x) => E.gradePowerWithinAccuracy(curve, 0.01, 20, 998, x, E.TOLERANCE_GRADES[0], 0.02), 3000, [0, -1]],
      [(x) => E.gradePowerWithinAccuracy(curve, 0.01, 20, 998, 3000, E.TOLERANCE_GRADES[0], x), 0.02, [-0.1, 1, 1.5]]],
    prepareSearchIndex: [[(x) => E.prepareSearchIndex([{ id: "a", curve: { points: samplePoints(), speed: x } }]).rejected.length === 1 ? (() => { throw new EngineInputError("speed", "rejected"); })() : 0, 2900, [0, -1]]],
    searchDuty: [[(x) => E.searchDuty([{ id: "a", curve }], { flow: x, head: 10 }), 0.01, [0, -1]]],
    joinSearchIndexes: [[(x) => E.joinSearchIndexes([E.prepareSearchIndex([{ id: "a", curve }, { id: "b", curve }])], [[x]]), 1, [-1, 0.5, 2]]],
    brent: [[(x) => E.brent((t) => t - 1, x, 2), 0, []], [(x) => E.brent((t) => t - 1, 0, 2, x), 1e-9, [-1]]],
    bisection: [[(x) => E.bisection((t) => t - 1, x, 2, 1e-9), 0, []]],
    explainRanks: [[(x) => E.explainRanks([], x, 1.1), 10, [-1, 2.5]], [(x) => E.explainRanks([], 10, x), 1.1, [0, -1]]],
    overloadCheck: [[(x) => E.overloadCheck(null, x), 1000, [0, -1]]],
    npshMarginRatio: [[(x) => E.npshMarginRatio(x, 2.5), 3, []], [(x) => E.npshMarginRatio(3, x), 2.5, []]],
    npshStatus: [[(x) => E.npshStatus(x, 1.1), 1.2, []], [(x) => E.npshStatus(1.2, x), 1.1, [0, -1]]],
    catalogueReasons: [[(x) => E.catalogueReasons({ diameter: x, minDiameter: 0.15 }), 0.16, [0, -1]], [(x) => E.catalogueReasons({ diameter: 0.16, minDiameter: x }), 0.15, [0, -1]],
      [(x) => E.catalogueReasons({ speed: x, ratedSpeed: 2900 }), 1450, [0, -1]], [(x) => E.catalogueReasons({ speedRatio: x }), 0.8, [0, -1]], [(x) => E.catalogueReasons({ trimRatio: x }), 0.9, [0, -1]]],
    judgeCandidate: [[(x) => E.judgeCandidate({ dutyFlow: x, edges: [{ name: "a", flow: 0.01, head: 10 }] }), 0.01, [0, -1]],
      [(x) => E.judgeCandidate({ dutyFlow: 0.01, edges: [{ name: "a", flow: x, head: 10 }] }), 0.01, [-1]],
      [(x) => E.judgeCandidate({ dutyFlow: 0.01, edges: [{ name: "a", flow: 0.01, head: x }] }), 10, [-5]],
      [(x) => E.judgeCandidate({ dutyFlow: 0.01, powerNow: x, edges: [{ name: "a", flow: 0.02, head: 10 }] }), 5000, [-1]],
      [(x) => E.judgeCandidate({ dutyFlow: 0.01, powerNow: 5000, savings: [{ means: "speed", power: x, how: "s" }], edges: [{ name: "a", flow: 0.02, head: 10 }] }), 4000, [-1]],
      [(x) => E.judgeCandidate({ dutyFlow: 0.01, tolerance: { minus: x, plus: 0.1 }, edges: [{ name: "a", flow: 0.01, head: 10 }] }), 0, [-0.1, 1]],
      [(x) => E.judgeCandidate({ dutyFlow: 0.01, tolerance: { minus: 0, plus: x }, edges: [{ name: "a", flow: 0.01, head: 10 }] }), 0.1, [-0.1]],
      [(x) => E.judgeCandidate({ dutyFlow: 0.01, viscosity: { b: x, corrected: true }, edges: [{ name: "a", flow: 0.01, head: 10 }] }), 16.4, [0, -1, 41]],
      [(x) => E.judgeCandidate({ dutyFlow: 0.01, viscosity: { b: x, corrected: false }, edges: [{ name: "a", flow: 0.01, head: 10 }] }), 44, [0, -1]]],
    viscosityCorrectionText: [[(x) => E.viscosityCorrectionText(x), 16.4, [0, -1]]],
    nextStandardRating: [[(x) => E.nextStandardRating(x), 5000, [-1]]],
    limitCovers: [[(x) => E.limitCovers(x, 1000), 1000, [0, -1]], [(x) => E.limitCovers(1000, x), 500, [-1]]],
    motorLimit: [[(x) => E.motorLimit(x, 1.15), 11000, [0, -1]], [(x) => E.motorLimit(11000, x), 1.15, [0, -1]]],
    suggestMotor: [[(x) => E.suggestMotor({ dutyPower: x, maxCurvePower: null }), 5000, [-1]], [(x) => E.suggestMotor({ dutyPower: 5000, maxCurvePower: x }), 6000, [-1]],
      [(x) => E.suggestMotor({ dutyPower: 5000, maxCurvePower: null, serviceFactor: x }), 1.15, [0, 0.5, 2]],
      [(x) => E.suggestMotor({ dutyPower: 5000, maxCurvePower: 6000, maxCurvePowerFrom: x }), 0.001, [-1]]],
    motorEfficiency: [[(x) => E.motorEfficiency(x), 7500, [0, -1, 2e6]]],
    polesForSpeed: [[(x) => E.polesForSpeed(x), 2900, [0, -1]]],
    annualEnergy: [[(x) => E.annualEnergy({ shaftPower: x, motorEfficiency: 0.9, driveEfficiency: null, hoursPerYear: 4000, tariffPerKWh: 0.2 }), 5000, [-1]],
      [(x) => E.annualEnergy({ shaftPower: 5000, motorEfficiency: x, driveEfficiency: null, hoursPerYear: 4000, tariffPerKWh: 0.2 }), 0.9, [0, 1.5]],
      [(x) => E.annualEnergy({ shaftPower: 5000, motorEfficiency: 0.9, driveEfficiency: x, hoursPerYear: 4000, tariffPerKWh: 0.2 }), 0.97, [0, 1.5]],
      [(x) => E.annualEnergy({ shaftPower: 5000, motorEfficiency: 0.9, driveEfficiency: null, hoursPerYear: x, tariffPerKWh: 0.2 }), 4000, [-1, 9000]],
      [(x) => E.annualEnergy({ shaftPower: 5000, motorEfficiency: 0.9, driveEfficiency: null, hoursPerYear: 4000, tariffPerKWh: x }), 0.2, [-1]]],
    dutyCycleEnergy: [[(x) => E.dutyCycleEnergy(dc({ designFlow: x })), 50 / 3600, [0, -1]],
      [(x) => E.dutyCycleEnergy(dc({ profile: [{ flowFraction: x, hours: 1000 }] })), 0.5, [-1e-9, -1, 2]],
      [(x) => E.dutyCycleEnergy(dc({ profile: [{ flowFraction: 0.5, hours: x }] })), 1000, [-1, 9000]],
      [(x) => E.dutyCycleEnergy(dc({ motor: { rating: x, efficiency: 0.9 } })), 5500, [0, -1]],
      [(x) => E.dutyCycleEnergy(dc({ motor: { rating: 5500, efficiency: x } })), 0.9, [0, 1.5]],
      [(x) => E.dutyCycleEnergy(dc({ motor: { rating: 5500, efficiency: 0.9, serviceFactor: x } })), 1.15, [0, 0.9, 1.6]],
      [(x) => E.dutyCycleEnergy(dc({ driveEfficiency: x })), 0.97, [0, 1.5]],
      [(x) => E.dutyCycleEnergy(dc({ density: x })), 998, [0, -1]],
      [(x) => E.dutyCycleEnergy(dc({ minSpeedRatio: x })), 0.3, [0, 1]]],
    stagedDutyCycleEnergy: [[(x) => E.stagedDutyCycleEnergy(sdc({ dutyPumps: x })), 2, [0, 1.5, 101]],
      [(x) => E.stagedDutyCycleEnergy(sdc({ motor: { rating: x, efficiency: 0.9 } })), 2750, [0, -1]],
      [(x) => E.stagedDutyCycleEnergy(sdc({ motor: { rating: 2750, efficiency: x } })), 0.9, [0, 1.5]],
      [(x) => E.stagedDutyCycleEnergy(sdc({ designFlow: x })), 50 / 3600, [0, -1]],
      [(x) => E.stagedDutyCycleEnergy(sdc({ profile: [{ flowFraction: x, hours: 1000 }] })), 0.5, [-1e-9, -1, 2]]],
    defaultCirculatorProfile: [[(x) => E.defaultCirculatorProfile(x), 4000, [-1, 9000]]],
    lifeCycleCost: [[(x) => E.lifeCycleCost(lcc({ purchasePrice: x })), 1000, [-1]], [(x) => E.lifeCycleCost(lcc({ annualEnergyKWh: x })), 1e4, [-1]],
      [(x) => E.lifeCycleCost(lcc({ tariffPerKWh: x })), 0.2, [-1]], [(x) => E.lifeCycleCost(lcc({ years: x })), 10, [0, 2.5, 51]],
      [(x) => E.lifeCycleCost(lcc({ escalation: x })), 0.03, [-0.6, 1.5]], [(x) => E.lifeCycleCost(lcc({ discountRate: x })), 0.05, [-0.01, 1.5]]],
    viscosityParameterB: [[(x) => E.viscosityParameterB({ kinematicViscosity: x, bepFlow: 0.011, bepHead: 27, speed: 2900 }), 5e-4, [0, -1]],
      [(x) => E.viscosityParameterB({ kinematicViscosity: 5e-4, bepFlow: x, bepHead: 27, speed: 2900 }), 0.011, [0, -1]],
      [(x) => E.viscosityParameterB({ kinematicViscosity: 5e-4, bepFlow: 0.011, bepHead: x, speed: 2900 }), 27, [0, -1]],
      [(x) => E.viscosityParameterB({ kinematicViscosity: 5e-4, bepFlow: 0.011, bepHead: 27, speed: x }), 2900, [0, -1]]],
    viscosityFactors: [[(x) => E.viscosityFactors(x), 16.4, [0, -1]]],
    equivalentWaterDuty: [[(x) => E.equivalentWaterDuty({ flow: x, head: 30, kinematicViscosity: 2e-4, speed: 2900 }), 0.028, [0, -1]],
      [(x) => E.equivalentWaterDuty({ flow: 0.028, head: x, kinematicViscosity: 2e-4, speed: 2900 }), 30, [0, -1]],
      [(x) => E.equivalentWaterDuty({ flow: 0.028, head: 30, kinematicViscosity: x, speed: 2900 }), 2e-4, [0, -1]],
      [(x) => E.equivalentWaterDuty({ flow: 0.028, head: 30, kinematicViscosity: 2e-4, speed: x }), 2900, [0, -1]]],
    correctCurveForViscosity: [[(x) => E.correctCurveForViscosity(curve, { kinematicViscosity: x, speed: 2900 }), 2e-4, [0, -1]],
      [(x) => E.correctCurveForViscosity(curve, { kinematicViscosity: 2e-4, speed: x }), 2900, [0, -1]]],
    toSI: [[(x) => E.toSI("flow", "m3/h", x), 1, []]],
    fromSI: [[(x) => E.fromSI("flow", "m3/h", x), 1, []]],
    convert: [[(x) => E.convert("flow", x, "m3/h", "gpm"), 1, []]],
  };
  /** Functions without numeric parameters: lookups by id/name (each refuses an unknown one). */
  const lookups: Record<string, () => unknown> = {
    fitting: () => E.fitting("butterfly"),
    pipeTable: () => E.pipeTable("steel"),
    material: () => E.material("unobtanium"),
    unitDef: () => E.unitDef("flow", "m3/hr"),
    unitLabel: () => E.unitLabel("flow", "m3/hr"),
    verdictLabel: () => E.verdictLabel("Meets" as never),
    checkGrade: () => E.checkGrade({ id: "x", flow: [0.05, 1.5], head: [0.03, 0.03] } as never),
    fluidTemperatureRangeC: () => E.fluidTemperatureRangeC({ kind: "Water" } as never),
  };
  /** Every mode/kind/enum parameter with an unknown value. */
  const enums: [string, () => unknown][] = [
    ["judgeCandidate viscosity.corrected", () => E.judgeCandidate({ dutyFlow: 0.01, viscosity: { b: 16.4, corrected: "yes" as never }, edges: [{ name: "a", flow: 0.01, head: 10 }] })],
    ["judgeCandidate savings means", () => E.judgeCandidate({ dutyFlow: 0.01, savings: [{ means: "Speed" as never, power: 1, how: "s" }], edges: [{ name: "a", flow: 0.02, head: 10 }] })],
    ["flowPerPump mode 'Parallel'", () => E.flowPerPump(0.01, { mode: "Parallel" as never, duty: 2 })],
    ["combinePumps mode", () => E.combinePumps(curve, { mode: "tandem" as never, duty: 2 })],
    ["systemHead level", () => E.systemHead(sys, 0.01, { level: "Max" as never })],
    ["systemHead roughness", () => E.systemHead(sys, 0.01, { roughness: "Aged" as never })],
    ["systemHeadFunction level", () => E.systemHeadFunction(sys, { level: "high" as never })],
    ["systemCurve design", () => E.systemCurve(sys, { flowMax: 0.05, design: { roughness: "old" as never } })],
    ["suctionLoss roughness", () => E.suctionLoss(sys, 0.01, "Aged" as never)],
    ["operatingPointInSystem level", () => E.operatingPointInSystem(curve, sys, { level: "x" as never })],
    ["prepareSystem mode", () => E.prepareSystem({ ...sys, mode: "closed" as never })],
    ["prepareSystem lossModel", () => E.prepareSystem({ ...sys, lossModel: "hw" as never })],
    ["prepareSystem frictionMethod", () => E.prepareSystem({ ...sys, frictionMethod: "moody" as never })],
    ["frictionFactor method", () => E.frictionFactor(1e5, 1e-4, "moody" as never)],
    ["frictionFactorDetailed method", () => E.frictionFactorDetailed(1e5, 1e-4, "hazen-williams" as never)],
    ["pipeHeadLoss model.type", () => E.pipeHeadLoss({ flow: 0.01, diameter: 0.1, length: 10, roughness: 1e-5, kinematicViscosity: 1e-6, model: { type: "Darcy" } as never })],
    ["pipeHeadLoss model.method", () => E.pipeHeadLoss({ flow: 0.01, diameter: 0.1, length: 10, roughness: 1e-5, kinematicViscosity: 1e-6, model: { type: "darcy", method: "x" } as never })],
    ["fluidAt kind", () => E.fluidAt({ kind: "Water" } as never, 20)],
    ["scaleByTrim law", () => E.scaleByTrim(curve, 0.9, "cubic" as never)],
    ["trimForDuty law", () => E.trimForDuty(curve, { flow: 0.01, head: 20 }, { law: "cubic" as never })],
    ["searchDuty methods", () => E.searchDuty([{ id: "a", curve }], { flow: 0.01, head: 10 }, { methods: ["Direct" as never] })],
    ["searchDuty trimLaw", () => E.searchDuty([{ id: "a", curve }], { flow: 0.01, head: 10 }, { trimLaw: "cubic" as never })],
    ["withinGrade grade", () => E.withinGrade(curve, 0.01, 20, { id: "x" } as never)],
    ["gradeWithinUncertainty grade", () => E.gradeWithinUncertainty(curve, { flow: [0.01, 0.02], head: [15, 25] }, { id: "x" } as never)],
    ["gradeCross grade", () => E.gradeCross(curve, 0.01, 20, { id: "x", flow: [0.1, 2], head: [0, 0.1] } as never)],
    ["fieldCheck grades", () => E.fieldCheck({ curve, fluid: water, suction: gauge(0), discharge: gauge(2e5), measuredFlow: 0.01, grades: [{ id: "x" } as never] })],
    ["fieldCheck grades powerAbove", () => E.fieldCheck({ curve, fluid: water, suction: gauge(0), discharge: gauge(2e5), measuredFlow: 0.01, grades: [{ ...E.TOLERANCE_GRADES[0], powerAbove: 4 }] })],
    ["motorEfficiency ieClass", () => E.motorEfficiency(7500, "IE5" as never)],
    ["motorEfficiency poles", () => E.motorEfficiency(7500, "IE3", 6 as never)],
    ["dutyCycleEnergy mode", () => E.dutyCycleEnergy(dc({ mode: "vfd" as never }))],
    ["dutyCycleEnergy arrangement (the BEP note's words)", () => E.dutyCycleEnergy(dc({ arrangement: "tandem" as never }))],
    ["dutyCycleEnergy VFD mode without a drive", () => E.dutyCycleEnergy(dc({ mode: "constant-pressure", driveEfficiency: null }))],
    ["toSI quantity", () => E.toSI("Flow" as never, "m3/h", 1)],
    ["toSI unit", () => E.toSI("flow", "m3/hr", 1)],
  ];
  const exported = Object.entries(E).filter(([, v]) => typeof v === "function" && !/^[A-Z]/.test(String((v as { name?: string }).name ?? "")))
    .map(([k]) => k).filter((k) => k !== "findCorrelation"); // findCorrelation: a lookup documented to return undefined for an unknown id

  function refuses(label: string, fn: () => unknown) {
    let err: unknown = null, out: unknown;
    try { out = fn(); } catch (e) { err = e; }
    expect(err, `${label} returned ${JSON.stringify(out)?.slice(0, 60)}`).toBeInstanceOf(EngineInputError);
    expect((err as EngineInputError).parameter.length, label).toBeGreaterThan(0);
  }

  it("every exported function has a sweep entry", () => {
    const covered = new Set([...Object.keys(numeric), ...Object.keys(lookups)]);
    expect(exported.filter((k) => !covered.has(k))).toEqual([]);
  });
  it("each numeric parameter: the ordinary value works; NaN, ±Infinity and out-of-domain values throw EngineInputError", () => {
    let probes = 0;
    for (const [name, params] of Object.entries(numeric)) {
      params.forEach(([call, ok, domain], i) => {
        expect(() => call(ok), `${name} #${i} with ${ok}`).not.toThrow();
        for (const x of [NaN, Infinity, -Infinity, ...domain]) { refuses(`${name} #${i} with ${x}`, () => call(x)); probes++; }
      });
    }
    expect(probes).toBeGreaterThan(300);
  });
  it("lookups refuse unknown ids", () => {
    for (const [name, fn] of Object.entries(lookups)) refuses(name, fn);
  });
  it("every mode/kind parameter refuses an unknown value (flowPerPump no longer treats 'Parallel' as series)", () => {
    for (const [label, fn] of enums) refuses(label, fn);
    expect(E.flowPerPump(0.02, { mode: "parallel", duty: 2 })).toBe(0.01); // Q/n, common practice
    expect(E.flowPerPump(0.02, { mode: "series", duty: 2 })).toBe(0.02);
  });
});
