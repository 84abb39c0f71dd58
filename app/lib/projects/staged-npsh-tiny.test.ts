// A duty-cycle step of pumps in parallel staged by demand, one of 2 running, judges one pump's NPSHr at its share
// (staging-npsh.ts) by the rule of the operating point's (engine figures.ts `npshMarginRatio`, `npshStatus`; common
// practice): NPSHa at or below zero, a cavitation risk whatever the pump; NPSHr with no finite ratio beside NPSHa above
// zero (5e-324 m, a cell the importer takes with a warning), not judged, said with the NPSHr. Before: NPSHa / 5e-324 =
// Infinity reached `npshStatus`, which threw, and the whole candidate's energy with it. And the ratio at the wanted 1.1
// to 1 part in 10⁸ (engine npshRatio.ts): a step a rounding error short of it is no low margin. Check values: the rule's
// arithmetic; 5e-324 is Number.MIN_VALUE (IEEE 754). The pump is invented.
import { describe, expect, it } from "vitest";
import { inSI } from "~/engine/quantityText";
import { candidateEnergy } from "./energy";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, fluidOf, systemSpec, type Adjustment, type SystemInput } from "./hydraulics";

const M3H = 1 / 3600;
const ROWS = [[0, 22, null], [5, 21.8, 0.3], [10, 21.5, 0.45], [20, 20, 0.62], [30, 17.5, 0.72], [36, 15.5, 0.74], [45, 12, 0.7], [55, 7, 0.6]] as const;
const setWith = (npshr: number) => ({ points: ROWS.map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e, power: null, npshr: q === 0 ? null : npshr })), speed: 2900, impellerDiameter: 0.2 });
const base = defaultSystemInput();
const input = (suctionStaticHead: number, npshMargin = 1.1): SystemInput => ({ ...base, suctionStaticHead, npshMargin, duty: { flow: 72 * M3H, head: 12 }, energy: { ...base.energy!, control: "fixed-speed", profile: [{ flowFraction: 0.4, hours: 1000 }] } });
const adjustment: Adjustment = { ...DEFAULT_ADJUSTMENT, method: "none", motorRating: 3000, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 };
const stepWarnings = (npshr: number, suctionStaticHead: number, npshMargin = 1.1) => {
  const inp = input(suctionStaticHead, npshMargin);
  const e = candidateEnergy(inp, systemSpec(inp), fluidOf(inp).density, { adjustment, result: evaluateCandidate(inp, setWith(npshr), adjustment) }, null);
  expect([e.cycle!.steps[0].pumpsRunning, e.cycle!.steps[0].dutyPumps]).toEqual([1, 2]); // control: one of 2 runs
  return e.cycle!.warnings.filter((w) => w.code.startsWith("staged-npsh") && w.parameter === "profile[0]").map((w) => ({ code: w.code, message: inSI(w.message), raw: w.message }));
};
/** NPSHa as the step's words carry it, unrounded (the quantity token's SI value, m). */
const npshaOf = (raw: string) => Number(/NPSHa ⟦head\|([^|⟧]+)/.exec(raw)![1]);

describe("a staged step beside an NPSHr of 5e-324 m", () => {
  it("NPSHa above zero: not judged, with the NPSHr named (threw: 'marginRatio … Infinity')", () => {
    const w = stepWarnings(Number.MIN_VALUE, 0);
    expect(w.map((x) => x.code)).toEqual(["staged-npsh-not-judged"]);
    expect(w[0].message).toContain("not judged: one pump's NPSHr at its share, 4.94e-324 m, is too small to judge NPSHa against");
  });
  it("NPSHa below zero: a cavitation risk whatever the pump", () => {
    const w = stepWarnings(Number.MIN_VALUE, -30);
    expect(w.map((x) => x.code)).toEqual(["staged-npsh"]);
    expect(w[0].message).toContain("at or below zero: cavitation risk whatever the pump");
  });
});

describe("a staged step at the wanted ratio", () => {
  it("NPSHa = 1.1 × NPSHr as the division rounds it: no low margin; 2 parts in 10⁸ short: a low margin printed apart", () => {
    // NPSHr 2 m flat at fixed speed (the share's NPSHr is 2 m); NPSHa at 0 m suction head read off the not-judged words of a 5e-324 m twin (same suction, same flow).
    const na0 = npshaOf(stepWarnings(Number.MIN_VALUE, 0)[0].raw);
    expect(na0).toBeGreaterThan(2.2); // control: the static head below moves NPSHa down to 1.1 × 2 m
    const at = stepWarnings(2, 2.2 - na0);
    expect(at).toEqual([]);
    const short = stepWarnings(2, 2.2 * (1 - 2e-8) - na0);
    expect(short.map((x) => x.code)).toEqual(["staged-npsh"]);
    const printed = Number(/ = ([0-9.]+), below the wanted 1\.1/.exec(short[0].message)![1]);
    expect(printed).toBeLessThan(1.1);
  });
});
