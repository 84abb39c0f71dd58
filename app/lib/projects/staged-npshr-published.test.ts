// A duty-cycle step of pumps in parallel staged by demand, where fewer run, judges one pump's NPSHr at its share (staging-
// npsh.ts). Under a drive that NPSHr is the published curve moved to the step's speed by the affinity laws, NPSHr ∝ N² at
// Q ∝ N: NPSHr(step) = s² · NPSHr_published(share / s) (common practice). It was read off the curve the cycle rebuilds from
// the result's 41 samples, a monotone cubic through samples of the published monotone cubic, which is not the published
// curve: beside an NPSHa a hair below it the step printed "NPSHr 0.8230 m … = 0.9997" where the published points give
// 0.8239 m and 0.9990 (3 parts in 10⁴, past the digits printed). Now read off the published points as run
// (cycle-curve.ts `withPublishedNpshr`). Check values, by hand: the step placed (bisecting its flow) where one pump's share
// over the step's speed is a published flow, 20, 30 or 36 m³/h, so the published NPSHr there is the published figure
// itself, 1.5, 1.9 or 2.6 m (the invented pump below), and NPSHr at the step = s² × that (affinity laws, common practice);
// the ratio NPSHa / NPSHr from those two numbers (arithmetic). The pump and its U-shaped NPSHr column are invented.
import { describe, expect, it } from "vitest";
import { fmtNumExact } from "~/engine/quantityText";
import { candidateEnergy } from "./energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type Adjustment, type SystemInput } from "./hydraulics";

const M3H = 1 / 3600;
/** Flow m³/h, head m, efficiency, NPSHr m (invented: NPSHr rising at part load and steeply towards runout). */
const ROWS = [[0, 22, null, null], [5, 21.8, 0.3, 2.0], [10, 21.5, 0.45, 1.6], [20, 20, 0.62, 1.5], [30, 17.5, 0.72, 1.9], [36, 15.5, 0.74, 2.6], [45, 12, 0.7, 4.5], [55, 7, 0.6, 9.0]] as const;
const SET = { points: ROWS.map(([q, h, e, n]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: n })), speed: 2900, impellerDiameter: 0.2 };
const base = defaultSystemInput();
/** 2 duty pumps + 1 standby on a drive following the system curve (72 m³/h at 12 m), one step at `f` of the duty flow. */
const input = (f: number, suctionStaticHead: number): SystemInput => ({ ...base, suctionStaticHead, duty: { flow: 72 * M3H, head: 12 }, energy: { ...base.energy!, control: "system-curve", profile: [{ flowFraction: f, hours: 1000 }] } });
const adjustment = (method: "none" | "speed"): Adjustment => ({ ...DEFAULT_ADJUSTMENT, method, motorRating: 3000, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 });
const step = (f: number, sh: number, method: "none" | "speed") => {
  const inp = input(f, sh), adj = adjustment(method);
  const e = candidateEnergy(inp, systemSpec(inp), fluidOf(inp).density, { adjustment: adj, result: evaluateCandidate(inp, SET, adj) }, null);
  return { step: e.cycle!.steps[0], warning: e.cycle!.warnings.find((w) => w.code === "staged-npsh" && w.parameter === "profile[0]") };
};
const token = (message: string, what: "NPSHa" | "NPSHr") => Number(new RegExp(`${what} ⟦head\\|([^|⟧]+)`).exec(message)![1]);

describe("a staged step under a drive reads NPSHr off the published points moved by the affinity laws", () => {
  for (const method of ["none", "speed"] as const)
    for (const [q, published] of [[20, 1.5], [30, 1.9], [36, 2.6]] as const) {
      it(`${method === "speed" ? "slowed down to the duty, " : ""}one of 2 running where its share over the step's speed is ${q} m³/h: NPSHr = s² × ${published} m, and the ratio printed from it`, () => {
        // The step's flow bisected so that share / s = q (share = the step's whole flow: one pump runs; s its speed ratio).
        const off = (f: number) => { const s = step(f, 0, method).step; return (s.flow / s.pumpsRunning!) / s.speedRatio! - q * M3H; };
        let lo = 0.05, hi = 0.5;
        expect([off(lo) < 0, off(hi) > 0]).toEqual([true, true]); // control: the bracket holds it
        for (let i = 0; i < 70; i++) { const mid = (lo + hi) / 2; if (off(mid) < 0) lo = mid; else hi = mid; }
        const f = (lo + hi) / 2;
        const at = step(f, 0, method).step;
        expect([at.pumpsRunning, at.dutyPumps]).toEqual([1, 2]); // control: one pump alone
        const s = at.speedRatio!;
        expect(s).toBeLessThan(0.95); // control: the drive runs it slowed down
        const hand = s * s * published; // affinity laws: NPSHr ∝ N² at Q ∝ N
        // NPSHa set a hair below the hand NPSHr (ratio 0.999): a cavitation-risk warning whose numbers print extra digits.
        const na0 = token(step(f, -30, method).warning!.message, "NPSHa"); // NPSHa at −30 m (below zero: its message names it)
        const w = step(f, -30 + (0.999 * hand - na0), method).warning!;
        const nr = token(w.message, "NPSHr"), na = token(w.message, "NPSHa");
        expect(Math.abs(nr / hand - 1)).toBeLessThan(1e-9);
        expect(w.message).toContain(`= ${fmtNumExact(na / hand, [1, 1.1], 2)}, below 1`);
      });
    }
});
