// The verdict's headline qualified by starting pumps in parallel one after another (pure): evaluateCandidate keeps the
// staged starts that leave the duty unmet, and the note, the chart's label and its short form say so. Check values: the
// rule is common practice, from memory — a pump in parallel started while others run starts against the head they hold
// and cannot open its check valve when that head is above its shut-off head; duty/standby pumps are started one after
// another. The drooping A1 curve is invented (its 40 m shut-off, 44 m peak); heads and flows quoted are read off it.
import { describe, expect, it } from "vitest";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type Adjustment, type SystemInput } from "./hydraulics";
import { verdictStartNote, verdictStartShort } from "./verdict-start";
import { candidateSeries } from "~/components/workbench";
import { inSI } from "~/engine/quantityText";
import { SI_UNITS } from "~/lib/shared/units";

const M3H = 1 / 3600;
const A1 = [[0, 40], [0.005, 43], [0.01, 44], [0.015, 42], [0.02, 37], [0.025, 30]].map(([flow, head]) => ({ flow, head, efficiency: null, power: null, npshr: null }));
const parallel: Adjustment = { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2 };
const at = (low: number, high: number, duty: number, o: Partial<SystemInput> = {}) =>
  evaluateCandidate({ ...defaultSystemInput(), staticLow: low, staticHigh: high, duty: { flow: duty * M3H, head: 42 }, ...o }, { points: A1, speed: null, impellerDiameter: null }, parallel);
const note = (e: ReturnType<typeof at>) => { const n = verdictStartNote(e.verdict, e.stagedStart); return n ? inSI(n) : null; };
const label = (e: ReturnType<typeof at>) => inSI(candidateSeries({ id: 1, curveSetId: 1, label: "P", library: "L", adjustment: parallel, result: e, error: null, energy: null }, 0, SI_UNITS)!.label);

describe("two A1 pumps in parallel, 36–39 m static, duty 54 m³/h at 42 m", () => {
  const e = at(36, 39, 54);
  it("the verdict 'meets' (both started together) is qualified on its line: started one after another, only 1 delivers 49.0 m³/h at most lift", () => {
    expect(e.verdict?.status).toBe("meets"); // control: "Delivers 54.2 m³/h at most lift…"
    expect(e.warnings.map(inSI).some((w) => /^At both edges of the band, with 1 pump running in parallel the system holds .* and 42\.9 m at [\d.]+ m³\/h \(most lift, aged pipe\)/.test(w))).toBe(true); // control: the Notes' warning (both edges fail, said once)
    expect(note(e)).toBe("but started one after another (duty/standby staging) the duty is not met: at most lift, aged pipe pump 2 of 2 cannot open its check valve against the 42.9 m pump 1 holds (above its shut-off head 40.0 m), so only 1 delivers, 49.0 m³/h, below the duty 54.0 m³/h; the verdict assumes the 2 started together");
  });
  it("the chart's label says it too", () => {
    expect(label(e)).toBe("P (2 in parallel) — meets the duty, but NPSH not checked, but not met if started one after another"); // old code: "P (2 in parallel) — meets the duty"; A1 publishes no NPSHr (decision "npshzero")
  });
  it("the flip on flow: 36–37 m static, pump 2 still cannot start but pump 1 alone gives 54.7 m³/h ≥ 54: nothing against its verdict", () => {
    const ok = at(36, 37, 54);
    expect(ok.warnings.join(" ")).toMatch(/cannot open its check valve/); // control: pump 2 still dead-heads (the Notes say so)
    expect(note(ok)).toBeNull();
    expect(ok.verdict?.status).toBe("oversized"); // control: two together give more than 110 % of the duty at 37 m
    expect(label(ok)).toBe("P (2 in parallel) — oversized, and NPSH not checked"); // nothing of the start; A1 publishes no NPSHr (decision "npshzero")
  });
  it("a minus tolerance of 10 %: 49.0 m³/h is above 54 × 0.9 = 48.6 m³/h, nothing against the verdict", () => {
    expect(note(at(36, 39, 54, { flowTolerance: { minus: 0.1, plus: 0.1 } }))).toBeNull();
  });
});

describe("the flip where one pump's held head crosses its 40 m shut-off head (duty 75 m³/h)", () => {
  it("30–33.5 m static: pump 1 holds below 40 m at most lift, pump 2 starts: nothing against 'meets'", () => {
    const e = at(30, 33.5, 75);
    expect(e.verdict?.status).toBe("meets"); // control
    expect(e.warnings.join(" ")).not.toMatch(/cannot open its check valve/);
    expect(note(e)).toBeNull();
  });
  it("30–33.8 m static: pump 1 holds 40.1 m, above 40 m — pump 2 cannot start, 62.2 m³/h below the 75 m³/h duty", () => {
    const e = at(30, 33.8, 75);
    expect(e.verdict?.status).toBe("meets"); // control
    expect(note(e)).toMatch(/^but started one after another \(duty\/standby staging\) the duty is not met: at most lift, aged pipe pump 2 of 2 cannot open its check valve against the 40\.1 m pump 1 holds \(above its shut-off head 40\.0 m\), so only 1 delivers, 62\.2 m³\/h, below the duty 75\.0 m³\/h/);
  });
});

describe("frozen or other verdicts", () => {
  it("a selection frozen before it was kept (no stagedStart) and no verdict say nothing; after another verdict it reads 'and'", () => {
    const e = at(36, 39, 54);
    expect(verdictStartNote(e.verdict, undefined)).toBeNull();
    expect(verdictStartNote(null, e.stagedStart)).toBeNull();
    expect(verdictStartNote({ status: "oversized" }, e.stagedStart)).toMatch(/^and started one after another/);
    expect(verdictStartShort({ status: "short" }, e.stagedStart)).toBe(", and not met if started one after another");
  });
});
