// NPSH over the band with points that cannot be judged: a corner where the pump has no operating point, or a flow past
// the published NPSHr. "ok" over part of the band is no conclusion for the rest (common practice: NPSH is judged wherever
// the pump runs); the rule "NPSHa / NPSHr below 1: cavitation risk" (common practice) still decides where a judged point
// shows it. Curves are the invented demo libraries (fixtures/demo/generate.ts).
import { describe, expect, it } from "vitest";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type Adjustment, type SystemInput } from "./hydraulics";
import { npshOverBand, type NpshPoint } from "./candidate-judgement";
import { npshUnjudgedText } from "~/components/candidate-figures";
import { demoCurves, demoCurveSI } from "~/test/demo-curves";

const M3H = 1 / 3600;
const pt = (at: string, flow: number | null, ratio: number | null): NpshPoint => ({ at, flow, available: flow == null ? null : 5, required: ratio == null ? null : 5 / ratio, marginRatio: ratio });

describe("npshOverBand: a point not judged leaves the status unknown unless a judged one cavitates", () => {
  const design = pt("design point", 0.01, 2);
  const judged = [pt("least lift, new pipe", 0.012, 1.5), pt("most lift, aged pipe", 0.009, 2.5)];
  it("every point judged at ≥ 1.1: ok, nothing unjudged", () => {
    expect(npshOverBand(design, judged, 1.1)).toMatchObject({ status: "ok", unjudged: [] });
  });
  it("a corner with no operating point: unknown, the corner named with why; the lowest judged still given", () => {
    const n = npshOverBand(design, [...judged, pt("least lift, aged pipe", null, null)], 1.1);
    expect(n).toMatchObject({ status: "unknown", marginRatio: 1.5, at: "least lift, new pipe", unjudged: [{ at: "least lift, aged pipe", why: "no operating point" }] });
    expect(npshUnjudgedText(n)).toBe("not judged at least lift, aged pipe (no operating point)");
  });
  it("a corner past the NPSHr curve (an operating point, no NPSHr): unknown, why named", () => {
    expect(npshOverBand(design, [...judged, pt("least lift, aged pipe", 0.014, null)], 1.1).unjudged).toEqual([{ at: "least lift, aged pipe", why: "no NPSHr at that flow" }]);
  });
  it("no design operating point: the design point is named as not judged", () => {
    expect(npshOverBand(null, judged, 1.1)).toMatchObject({ status: "unknown", unjudged: [{ at: "design point", why: "no operating point" }] });
  });
  it("flips at the threshold: a judged corner just below 1 is a cavitation risk whatever is unjudged; at 1 it is unknown", () => {
    const gap = pt("least lift, aged pipe", null, null);
    // Below 1 by more than the one allowance at a judged limit, 1 part in 10⁸ (engine npshRatio.ts, decision "npshzero"):
    // within it the ratio is at 1 (1 − 1e-9 was a cavitation risk before the allowance).
    expect(npshOverBand(design, [pt("least lift, new pipe", 0.012, 1 - 1.01e-8), gap], 1.1).status).toBe("cavitation-risk");
    expect(npshOverBand(design, [pt("least lift, new pipe", 0.012, 1 - 0.99e-8), gap], 1.1).status).toBe("unknown");
    expect(npshOverBand(design, [pt("least lift, new pipe", 0.012, 1), gap], 1.1).status).toBe("unknown");
  });
  it("the rule says so", () => expect(npshOverBand(design, judged, 1.1).rule).toContain("a point with no operating point or no NPSHr leaves it unknown"));
});

// The booster of lib/projects/test-kit.ts (boosterInput): 26–30 m static, duty 40 m³/h at 38 m.
const booster = (): SystemInput => ({ ...defaultSystemInput(), staticLow: 26, staticHigh: 30, duty: { flow: 40 * M3H, head: 38 } });
const methods: Adjustment["method"][] = ["none", "trim", "speed"];

describe("the edge hunt's case and a sweep over every demo curve on the booster", () => {
  it("Meregate 80 Ø195 trimmed: no operating point at least lift, new pipe, so its NPSH over the band is not 'ok' (it read ok, lowest 3.88)", () => {
    const c = demoCurves.find((d) => d.model.includes("Meregate 80") && d.impellerMm === 195);
    expect(c).toBeDefined();
    const r = evaluateCandidate(booster(), demoCurveSI(c!), { ...DEFAULT_ADJUSTMENT, method: "trim" });
    expect(r.band?.some((b) => b.flow == null)).toBe(true);
    expect(r.npsh.status).toBe("unknown");
    expect(npshUnjudgedText(r.npsh)).toMatch(/^not judged at .*\(no operating point\)/);
  });
  it("every demo curve × method: ok or low margin only when every point of the rule was judged", () => {
    let sawUnknownWithGap = 0, sawOk = 0;
    for (const c of demoCurves) for (const method of methods) {
      let r;
      try {
        r = evaluateCandidate(booster(), demoCurveSI(c), { ...DEFAULT_ADJUSTMENT, method });
      } catch {
        continue; // a pump the method cannot set for this duty: nothing judged
      }
      const n = r.npsh;
      const points = n.judgedAt ?? [];
      const allJudged = n.unjudged!.length === 0 && points.length === 5 && points.every((p) => p.marginRatio != null);
      if (n.status === "ok" || n.status === "low-margin") {
        expect(allJudged, `${c.model} Ø${c.impellerMm} ${method}`).toBe(true);
        sawOk++;
      }
      if (n.status === "unknown" && n.unjudged!.length) sawUnknownWithGap++;
    }
    expect(sawOk).toBeGreaterThan(0);
    expect(sawUnknownWithGap).toBeGreaterThan(0);
  });
});
