/**
 * Verdict rules: each status flips exactly where its threshold is crossed.
 * Thresholds checked: duty flow tolerance −0 %/+10 % (common practice), published impeller
 * range (the model's own data), speed 30–100 % of rated (common practice).
 */
import { describe, expect, it } from "vitest";
import { catalogueReasons, EngineInputError, judgeCandidate, type BandEdge } from "./index.ts";
import { fmtPctExact, fmtPctLimit, inSI, renderQuantities } from "./quantityText.ts";
import { UNIT_SYSTEMS } from "./units.ts";

const M3H = 1 / 3600;
const QD = 100 * M3H; // duty flow (made-up)
const edge = (q: number | null, name = "most lift, aged pipe"): BandEdge => ({ name, flow: q, head: q === null ? null : 20 });
const judge = (q: number, extra: Partial<Parameters<typeof judgeCandidate>[0]> = {}) =>
  judgeCandidate({ dutyFlow: QD, edges: [edge(q)], ...extra })!;

describe("flow against the duty (tolerance −0 %/+10 %, common practice)", () => {
  it("0.999 × duty is short, 1.001 × duty meets", () => {
    expect(judge(0.999 * QD).status).toBe("short");
    expect(judge(1.001 * QD).status).toBe("meets");
  });
  it("exactly the duty meets; 1.099 meets; 1.101 × duty is oversized", () => {
    expect(judge(QD).status).toBe("meets");
    expect(judge(1.099 * QD).status).toBe("meets");
    expect(judge(1.101 * QD).status).toBe("oversized");
  });
  it("a user tolerance −5 %/+20 % moves both thresholds", () => {
    const tolerance = { minus: 0.05, plus: 0.2 };
    expect(judge(0.949 * QD, { tolerance }).status).toBe("short");
    expect(judge(0.951 * QD, { tolerance }).status).toBe("meets");
    expect(judge(1.199 * QD, { tolerance }).status).toBe("meets");
    expect(judge(1.201 * QD, { tolerance }).status).toBe("oversized");
  });
  it("the verdict states its rule and the numbers", () => {
    const v = judge(0.91 * QD);
    expect(v.rule).toMatch(/short: operating flow at the demanding edge below duty flow/);
    // Quantities are tokens, rendered in the reader's units: 91 m³/h = 400.7 US gpm (1 gal = 3.785411784 L, NIST SP 811).
    expect(inSI(v.reasons[0])).toContain("91.0 m³/h");
    expect(inSI(v.reasons[0])).toContain("100 m³/h");
    expect(renderQuantities(v.reasons[0], UNIT_SYSTEMS.US)).toContain("401 gpm");
    expect(v.reasons[0]).toContain("91.0 %");
  });
  it("oversized says what throttling, trim or speed would save", () => {
    const v = judge(1.2 * QD, { powerNow: 8000, savings: [
      { means: "speed", power: 5200, how: "speed 88.0 %" },
      { means: "throttling", power: 7400, how: "valve closed to the duty" },
    ] });
    expect(v.status).toBe("oversized");
    expect(inSI(v.reasons.join(" "))).toContain("Speed to the duty (speed 88.0 %): 5.20 kW shaft instead of 8.00 kW now, saving 2.80 kW (35 %)");
    expect(v.reasons.join(" ")).toContain("Throttling to the duty");
  });
  it("a saving never reads as 0 % nor its powers as equal (43 W of 100 kW is 0.043 %; made-up powers)", () => {
    const v = judge(1.2 * QD, { powerNow: 100_000, savings: [{ means: "throttling", power: 100_000 - 43, how: "valve closed to the duty" }] });
    expect(inSI(v.reasons.join(" "))).toContain("99.96 kW shaft instead of 100.00 kW now, saving 0.043 kW (0.04 %)");
  });
  it("bad input is refused", () => {
    expect(() => judgeCandidate({ dutyFlow: QD, edges: [] })).toThrow(EngineInputError);
    expect(() => judgeCandidate({ dutyFlow: NaN, edges: [edge(QD)] })).toThrow(EngineInputError);
    expect(() => judgeCandidate({ dutyFlow: QD, edges: [edge(QD)], tolerance: { minus: 1, plus: 0.1 } })).toThrow(EngineInputError);
    expect(() => judgeCandidate({ dutyFlow: QD, edges: [{ name: "x", flow: Infinity, head: 1 }] })).toThrow(EngineInputError);
  });
});

describe("worst edge of the band decides", () => {
  it("meets at one edge but short at the other is short, judged at the least-flow edge", () => {
    const v = judgeCandidate({ dutyFlow: QD, edges: [edge(1.05 * QD, "least lift, new pipe"), edge(0.97 * QD, "most lift, aged pipe")] })!;
    expect(v.status).toBe("short");
    expect(v.edge).toBe("most lift, aged pipe");
    expect(inSI(v.reasons[0])).toContain("105 m³/h at least lift, new pipe");
  });
  it("wide band: the least-flow edge within tolerance meets even when the other edge runs far above", () => {
    const v = judgeCandidate({ dutyFlow: QD, edges: [edge(1.3 * QD, "least lift, new pipe"), edge(1.02 * QD, "most lift, aged pipe")] })!;
    expect(v.status).toBe("meets");
  });
  it("no intersection at any edge is no-operating-point, with the reason in words", () => {
    const v = judgeCandidate({ dutyFlow: QD, edges: [edge(1.05 * QD, "least lift, new pipe"), { name: "most lift, aged pipe", flow: null, head: null, noPointReason: "shut-off head 18.0 m is below the system's 20.0 m at zero flow" }] })!;
    expect(v.status).toBe("no-operating-point");
    expect(v.reasons[0]).toBe("At most lift, aged pipe: shut-off head 18.0 m is below the system's 20.0 m at zero flow.");
  });
  it("without a duty: null unless something else is wrong", () => {
    expect(judgeCandidate({ dutyFlow: null, edges: [edge(QD)] })).toBeNull();
    expect(judgeCandidate({ dutyFlow: null, edges: [edge(null)] })!.status).toBe("no-operating-point");
  });
});

describe("numbers beside a verdict never read as the limit they were judged against (product rule)", () => {
  it("fmtPctExact adds decimals only while a value would read as a threshold (or zero) it is not; fmtPctLimit shows a limit as typed", () => {
    expect(fmtPctExact(0.9996, [1])).toBe("99.96 %");
    expect(fmtPctExact(1, [1])).toBe("100.0 %"); // the limit itself reads as itself
    expect(fmtPctExact(0.97, [1])).toBe("97.0 %");
    expect(fmtPctExact(0.2999, [0.3, 1])).toBe("29.99 %");
    expect(fmtPctExact(0.69996, [0.7, 1.2], 0)).toBe("69.996 %");
    expect(fmtPctExact(-0.00004)).toBe("−0.004 %"); // not "−0.0 %" (the true minus since helper "routeedges")
    expect(fmtPctExact(NaN)).toBe("—");
    expect(fmtPctLimit(0.025)).toBe("2.5 %");
    expect(fmtPctLimit(0.011000000000000001)).toBe("1.1 %");
    expect(fmtPctLimit(0.1)).toBe("10 %");
  });
  it("sweep: a short or oversized verdict's percentage of the duty never reads as a limit of its tolerance", () => {
    for (const tolerance of [{ minus: 0, plus: 0.1 }, { minus: 0.025, plus: 0.011 }, { minus: 0.05, plus: 0.05 }]) {
      for (const limit of [1 - tolerance.minus, 1 + tolerance.plus]) {
        for (const off of [-1e-3, -1e-4, -2e-6, 2e-6, 1e-4, 1e-3]) {
          const v = judge(QD * limit * (1 + off), { tolerance });
          if (v.status === "meets") continue;
          const shown = /: ([\d.]+) % of the duty/.exec(v.reasons[0])![1];
          expect(Number(shown), `${v.status} at ${limit} × (1 ${off})`).not.toBe(Number((limit * 100).toFixed(shown.split(".")[1]?.length ?? 0)));
          expect(inSI(v.rule)).not.toMatch(/\d\.\d{6,}/); // no raw float such as 0.011000000000000001
        }
      }
    }
  });
});

describe("catalogue limits (the model's published impellers; speed 30–100 % of rated, common practice)", () => {
  const cat = { minDiameter: 0.175, maxDiameter: 0.195 };
  it("trim 1 mm below the smallest published impeller is outside; at it and 1 mm above is inside", () => {
    expect(judge(QD, { catalogue: { ...cat, diameter: 0.174 } }).status).toBe("outside-catalogue");
    expect(judge(QD, { catalogue: { ...cat, diameter: 0.175 } }).status).toBe("meets");
    expect(judge(QD, { catalogue: { ...cat, diameter: 0.176 } }).status).toBe("meets");
  });
  it("1 mm above the largest is outside; the largest itself is inside", () => {
    expect(judge(QD, { catalogue: { ...cat, diameter: 0.196 } }).status).toBe("outside-catalogue");
    expect(judge(QD, { catalogue: { ...cat, diameter: 0.195 } }).status).toBe("meets");
    expect(inSI(catalogueReasons({ ...cat, diameter: 0.196 })[0])).toBe("impeller Ø196 mm is above the largest the model publishes (Ø195 mm): 100.5 % of it");
  });
  it("speed 29 % of rated is outside, 30 % is inside; 100 % inside, 101 % outside", () => {
    const at = (f: number) => judge(QD, { catalogue: { speed: 2900 * f, ratedSpeed: 2900 } }).status;
    expect(at(0.29)).toBe("outside-catalogue");
    expect(at(0.3)).toBe("meets");
    expect(at(1)).toBe("meets");
    expect(at(1.01)).toBe("outside-catalogue");
  });
  it("a model's own speed range replaces the default; a ratio stands in when no rpm is known", () => {
    expect(judge(QD, { catalogue: { speed: 1160, ratedSpeed: 2900, speedRange: { min: 0.5, max: 1 } } }).status).toBe("outside-catalogue");
    expect(judge(QD, { catalogue: { speedRatio: 0.29 } }).status).toBe("outside-catalogue");
    expect(judge(QD, { catalogue: { speedRatio: 0.3 } }).status).toBe("meets");
  });
  it("no published diameters: a trim of 20 % is inside, a hair more is outside; an impeller above the published one is outside (MAX_TRIM_FRACTION, common practice)", () => {
    const at = (t: number, more = {}) => judge(QD, { catalogue: { trimRatio: t, ...more } }).status;
    expect(at(0.8)).toBe("meets");
    expect(at(0.8 * (1 - 2e-6))).toBe("outside-catalogue"); // past the 1e-6 round-off allowance
    expect(at(1)).toBe("meets");
    expect(at(1.00001)).toBe("outside-catalogue");
    expect(at(0.5, { diameter: 0.1 })).toBe("outside-catalogue"); // a diameter but no published range: the ratio decides
    // With the published range known the diameters decide, not the ratio: a 30 % trim inside the range stands.
    expect(at(0.7, { diameter: 0.14, minDiameter: 0.13, maxDiameter: 0.2 })).toBe("meets");
    const v = judge(QD, { catalogue: { trimRatio: 0.528 } });
    expect(inSI(v.reasons[0])).toBe("The impeller trimmed to 52.8 % of the published one is a trim of more than 20 %, and the model publishes no impeller diameters to back it: no published curve backs this pump.");
    expect(v.rule).toContain("a trim of at most 20 % where none are published");
  });
  it("outside-catalogue wins over every flow verdict and names the published limit", () => {
    const v = judge(0.5 * QD, { catalogue: { ...cat, diameter: 0.165 } });
    expect(v.status).toBe("outside-catalogue");
    expect(inSI(v.reasons[0])).toContain("Ø165 mm is below the smallest the model publishes (Ø175 mm)");
  });
});
