// NPSH over the band's four corners (least/most lift × new/aged pipe) and NPSHa at or below zero. Check values: the
// definition NPSHa = (p_surface − p_vapour)/(ρ g) + z_suction − h_f (common practice, ANSI/HI 9.6.1 from memory), the
// engine's own operating-point solve and suction loss for the corner (identities by construction), and the rule
// "NPSHa / NPSHr below 1, or NPSHa ≤ 0: cavitation risk" (common practice). Curves and systems are invented.
import { describe, expect, it } from "vitest";
import { createPumpCurve, npshAvailable, npshrAt, prepareSystem, solveOperatingPoint, suctionLoss, systemHeadFunction } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, evaluateSystem, systemSpec, type SystemInput } from "./hydraulics";
import { npshCorners, npshOverBand, type NpshPoint } from "./candidate-judgement";
import { selectionCsv } from "./selection-export.server";
import type { FrozenSelection } from "./selections.server";
import { npshLowestText, npshPointsText } from "~/components/candidate-figures";
import { SI_UNITS } from "~/lib/shared/units";
import Papa from "papaparse";

// A flat NPSHr of 2.5 m on a falling curve (invented), 5–6 m static lift.
const curvePoints = (npshr: number | null) => [0, 0.005, 0.01, 0.015, 0.02, 0.025].map((q) => ({ flow: q, head: 14 - 10000 * q * q, efficiency: q === 0 ? 0 : 0.8 * (1 - ((q - 0.015) / 0.015) ** 2), power: null, npshr }));
/** 300 m × 0.1 m suction run, 0.045 mm new and `aged` m aged roughness, flooded `z` m (the edge hunt's case). */
function system(aged: number, z = 0.4): SystemInput {
  const base = defaultSystemInput();
  return { ...base, suctionStaticHead: z, staticLow: 5, staticHigh: 6, runs: [
    { ...base.runs[0], length: 300, diameter: 0.1, roughness: 0.045e-3, agedRoughness: aged },
    { ...base.runs[1], length: 10, roughness: 0.045e-3, agedRoughness: 0.045e-3 },
  ] };
}
const evaluate = (input: SystemInput, npshr: number | null = 2.5) => evaluateCandidate(input, { points: curvePoints(npshr), speed: 2900, impellerDiameter: null }, DEFAULT_ADJUSTMENT);

/** NPSHa / NPSHr at least lift, aged pipe, straight from the engine (operating point, suction loss, NPSHa). */
function leastLiftAged(input: SystemInput): { flow: number; ratio: number } {
  const prep = prepareSystem(systemSpec(input));
  const curve = createPumpCurve({ points: curvePoints(2.5).map(({ flow, head, efficiency, npshr }) => ({ flow, head, efficiency, npshr: npshr! })) });
  const flow = solveOperatingPoint(curve, systemHeadFunction(prep, { level: "min", roughness: "aged" })).flow!;
  const na = npshAvailable({ surfacePressure: input.suctionSurfacePressure, vaporPressure: prep.fluid.vaporPressure, density: prep.fluid.density, staticSuctionHead: input.suctionStaticHead, suctionLoss: suctionLoss(prep, flow, "aged").headLoss });
  return { flow, ratio: na / npshrAt(curve, flow)! };
}

describe("NPSH at every corner of the band: least lift through an aged suction is judged", () => {
  it("the edge hunt's case: both band edges and the design point above the wanted 1.1, least lift + aged pipe below 1", () => {
    const r = evaluate(system(3e-3));
    const corner = leastLiftAged(system(3e-3));
    expect(corner.ratio).toBeLessThan(1); // about 0.958 (edge hunt)
    for (const b of r.band) expect(b.npshMarginRatio!).toBeGreaterThan(1.1); // the edges alone read ok
    expect(r.figures!.npshMarginRatio!).toBeGreaterThan(1.1);
    expect(r.npsh).toMatchObject({ status: "cavitation-risk", at: "least lift, aged pipe" });
    expect(r.npsh.marginRatio).toBeCloseTo(corner.ratio, 9);
    expect(r.npsh.judgedAt!.map((p) => p.at)).toEqual(["design point", ...npshCorners("open").map((c) => c.name)]);
    expect(r.npsh.rule).toContain("at the design point and at each corner of the band (least lift, new pipe; least lift, aged pipe; most lift, new pipe; most lift, aged pipe)");
    expect(npshLowestText(SI_UNITS, r.npsh)).toBe("lowest 0.96 at least lift, aged pipe");
    expect(npshPointsText(SI_UNITS, r.npsh)).toContain("least lift, aged pipe 0.96");
    expect(r.warnings).toContain("NPSH at least lift, aged pipe: margin ratio 0.96, NPSHa below NPSHr: cavitation risk");
  });

  it("the flow verdict needs only the edges: every corner's flow lies between them (system head rises with level and roughness)", () => {
    const r = evaluate(system(3e-3));
    const [lo, hi] = [Math.min(...r.band.map((b) => b.flow!)), Math.max(...r.band.map((b) => b.flow!))];
    for (const p of r.npsh.judgedAt!) { expect(p.flow!).toBeGreaterThanOrEqual(lo); expect(p.flow!).toBeLessThanOrEqual(hi); }
  });

  it("the status flips where the corner's ratio crosses 1: found by bisection on the aged roughness", () => {
    // The corner's ratio falls as the aged roughness grows: bisect (m) for ratio = 1, straight from the engine.
    let lo = 0.045e-3, hi = 3e-3;
    for (let i = 0; i < 60; i++) { const mid = (lo + hi) / 2; if (leastLiftAged(system(mid)).ratio < 1) hi = mid; else lo = mid; }
    const below = evaluate(system(hi * (1 + 1e-6))), above = evaluate(system(lo * (1 - 1e-6)));
    expect(below.npsh).toMatchObject({ status: "cavitation-risk", at: "least lift, aged pipe" });
    expect(above.npsh).toMatchObject({ status: "low-margin", at: "least lift, aged pipe" }); // just above 1, below the wanted 1.1
    expect(below.npsh.marginRatio!).toBeLessThan(1);
    expect(above.npsh.marginRatio!).toBeGreaterThanOrEqual(1);
  });

  it("closed loop: the corners are the band's two edges (no level to vary)", () => {
    expect(npshCorners("closed-loop").map((c) => c.name)).toEqual(["new pipe", "aged pipe"]);
  });
});

describe("NPSHa at or below zero: a cavitation risk whatever the pump, NPSHr known or not", () => {
  const point = (available: number): NpshPoint => ({ at: "design point", flow: 0.01, available, required: null, marginRatio: null });
  it("npshOverBand without NPSHr flips at NPSHa = 0 (unknown just above, cavitation risk at and below)", () => {
    expect(npshOverBand(point(1e-9), [], 1.1).status).toBe("unknown");
    expect(npshOverBand(point(0), [], 1.1)).toMatchObject({ status: "cavitation-risk", at: "design point", available: 0, marginRatio: null });
    expect(npshOverBand(point(-1e-9), [], 1.1).status).toBe("cavitation-risk");
    // A ratio known elsewhere and ok does not hide NPSHa ≤ 0 at a point without NPSHr.
    const ok: NpshPoint = { at: "least lift, new pipe", flow: 0.012, available: 5, required: 2, marginRatio: 2.5 };
    expect(npshOverBand(ok, [{ ...point(-0.5), at: "least lift, aged pipe" }], 1.1)).toMatchObject({ status: "cavitation-risk", at: "least lift, aged pipe", available: -0.5 });
  });

  it("a suction lift past the barometric head on a curve without NPSHr: cavitation risk, found by bisection on the suction head", () => {
    const lift = (z: number) => evaluate({ ...defaultSystemInput(), suctionStaticHead: z }, null);
    // The lowest NPSHa over the band grows with the suction static head: bisect (m) for it = 0.
    const lowestNa = (z: number) => Math.min(...lift(z).npsh.judgedAt!.map((p) => p.available!));
    let lo = -15, hi = 0;
    for (let i = 0; i < 60; i++) { const mid = (lo + hi) / 2; if (lowestNa(mid) <= 0) lo = mid; else hi = mid; }
    const r = lift(lo - 1e-6);
    expect(r.npsh).toMatchObject({ status: "cavitation-risk", marginRatio: null });
    expect(r.npsh.available!).toBeLessThanOrEqual(0);
    expect(lift(hi + 1e-6).npsh.status).toBe("unknown");
    const deep = lift(-11);
    expect(deep.npsh.status).toBe("cavitation-risk");
    expect(npshLowestText(SI_UNITS, deep.npsh)).toMatch(/^NPSHa −1\.\d+ m at (least|most) lift, (new|aged) pipe$/);
    expect(deep.warnings.some((w) => /^NPSH at .*: NPSHa −1\.\d+ m is not above zero: cavitation risk whatever the pump's NPSHr$/.test(inSI(w)))).toBe(true);
  });

  it("the system warns when NPSHa at zero flow is ≤ 0 (p_surface − p_vapour ≤ −ρ g z): flips at the suction head that makes it 0", () => {
    const base = defaultSystemInput();
    const fluid = evaluateSystem(base).fluid;
    const zStar = -(base.suctionSurfacePressure - fluid.vaporPressure) / (fluid.density * 9.80665); // NPSHa(0) = 0 by its definition
    const warned = (z: number) => evaluateSystem({ ...base, suctionStaticHead: z }).warnings.filter((w) => w.startsWith("NPSH available is"));
    expect(warned(zStar + 1e-6)).toEqual([]);
    const [w] = warned(zStar - 1e-6);
    const m = /^NPSH available is (below 0) m already at zero flow, not above zero: the surface pressure 101 kPa less the vapour pressure 2\.34 kPa is ([\d.]+) kPa, not above −ρ g z_suction ([\d.]+) kPa for the suction static head −10\.\d m\./.exec(inSI(w));
    expect(m, inSI(w)).toBeTruthy();
    expect(Number(m![2])).toBeLessThan(Number(m![3])); // the pair reads apart, in the order of its values
    // A liquid whose vapour pressure is above the surface pressure, flooded 2 m: the system says so.
    const volatile = evaluateSystem({ ...base, suctionStaticHead: 2, fluid: { kind: "custom", name: "volatile", density: 700, dynamicViscosity: 0.0005, vaporPressure: 200000 } });
    expect(volatile.warnings.map(inSI).find((x) => x.startsWith("NPSH available"))).toMatch(/^NPSH available is −12\.\d+ m already at zero flow, not above zero: the surface pressure 101 kPa less the vapour pressure 200 kPa is −98\.7 kPa, not above −ρ g z_suction −13\.7 kPa/);
  });
});

describe("the selection export carries the corners and the status", () => {
  /** A frozen selection of `input` as far as the CSV reads it (the rest of a stored one left out). */
  const frozenOf = (input: SystemInput) =>
    ({ result: evaluate(input), system: { input }, systemCurve: null, adjustment: DEFAULT_ADJUSTMENT, pump: { library: { name: "L", revision: 1 }, model: "M" }, energy: null }) as unknown as FrozenSelection;
  it("npsh section rows for the design point and each corner; the status over the band and where", () => {
    const csv = selectionCsv(1, "t", frozenOf(system(3e-3)));
    expect(csv).toContain("section,at,flow_m3s,npsha_m,npshr_m,npsh_margin_ratio");
    for (const c of ["design point", ...npshCorners("open").map((x) => x.name)]) expect(csv).toMatch(new RegExp(`^npsh,"?${c}"?,`, "m"));
    expect(csv).toMatch(/^figures,npsh_status_over_band,cavitation-risk,/m);
    expect(csv).toMatch(/^figures,npsh_lowest_at,"?least lift, aged pipe"?,/m);
  });

  it("NPSHa ≤ 0 (a 11 m suction lift, NPSHr 2.5 m): the band, npsh and figure ratios are blank with NPSHa beside them, never a negative ratio", () => {
    const rows = Papa.parse<string[]>(selectionCsv(1, "t", frozenOf({ ...defaultSystemInput(), suctionStaticHead: -11 })).trim()).data;
    const section = (name: string) => {
      const header = rows.find((r) => r[0] === "section" && rows[rows.indexOf(r) + 1]?.[0] === name)!;
      return rows.filter((r) => r[0] === name).map((r) => Object.fromEntries(header.map((h, i) => [h, r[i]])));
    };
    const npsh = section("npsh"), band = section("band");
    expect(npsh.length).toBe(5); // the design point and the four corners
    expect(band.length).toBe(2); // the band's two edges
    for (const r of [...npsh, ...band]) {
      expect(Number(r.npsha_m), JSON.stringify(r)).toBeLessThanOrEqual(0); // −11 m of lift: below the ~10.1 m barometric head at 20 °C (common practice)
      expect(r.npsh_margin_ratio, JSON.stringify(r)).toBe(""); // old code: a negative ratio, e.g. -0.4
    }
    const fig = rows.filter((r) => r[0] === "figures");
    expect(Number(fig.find((r) => r[1] === "npsh_available")![2])).toBeLessThanOrEqual(0);
    expect(fig.find((r) => r[1] === "npsh_margin_ratio")![2]).toBe("");
    expect(fig.find((r) => r[1] === "npsh_status_over_band")![2]).toBe("cavitation-risk");
  });

  it("the flip: flooded 0.4 m, NPSHa above zero everywhere: the ratios are written", () => {
    const rows = Papa.parse<string[]>(selectionCsv(1, "t", frozenOf(system(3e-3))).trim()).data.filter((r) => r[0] === "npsh");
    for (const r of rows) { expect(Number(r[3])).toBeGreaterThan(0); expect(Number(r[5])).toBeCloseTo(Number(r[3]) / Number(r[4]), 9); } // the ratio's definition
  });
});
