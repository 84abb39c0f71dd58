/**
 * Product rule (DEVELOPERS.md, "What the product concludes at the edges"): a quantity printed beside a
 * verdict never reads as the limit it was judged against, in whatever unit the reader chose, and reads on
 * the side of the limit its verdict says. Sweeps: several limits × values just inside and outside (relative
 * offsets down to 2 × 10⁻⁶, above the verdicts' round-off allowance of 10⁻⁶) × SI, US and other flow units.
 * "Reads as" is the fmtPctExact sweep's test: the printed number equals the limit rounded to as many decimals.
 * Limits: duty flow tolerance (common practice −0 %/+10 %, and made-up ones), NPSHa against NPSHr and the
 * margin ratio against 1 and the wanted ratio (ANSI/HI 9.6.1 range 1.1–2.5, from memory), the standard motor
 * ratings (IEC 60034-1 / IEC 60072-1 series, from memory) × service factor. Curves are made up.
 */
import { describe, expect, it } from "vitest";
import { catalogueReasons, createPumpCurve, explainRanks, judgeCandidate, operatingFigures, scaleByTrim, solveOperatingPoint, suggestMotor, IEC_MOTOR_RATINGS_KW, type Candidate } from "./index.ts";
import { fmtNum, renderQuantities } from "./quantityText.ts";
import { fromSI, UNIT_SYSTEMS, type Quantity, type UnitPreset } from "./units.ts";

const M3H = 1 / 3600;
const GPM = 3.785411784e-3 / 60; // US gallon 3.785411784 L (NIST SP 811)
const SI = UNIT_SYSTEMS.SI, US = UNIT_SYSTEMS.US;
const CHOICES: Record<string, UnitPreset> = {
  SI, US, "L/s": { ...SI, flow: "L/s" }, "m³/s": { ...SI, flow: "m3/s" }, "L/min": { ...SI, flow: "L/min" },
};
const OFFSETS = [-1e-3, -1e-4, -1e-5, -2e-6, 2e-6, 1e-5, 1e-4, 1e-3];
const NUM = String.raw`(-?\d+(?:\.\d+)?(?:e[-+]?\d+)?)`;

const decimals = (shown: string) => (shown.includes("e") ? 20 : (shown.split(".")[1]?.length ?? 0));
/**
 * A printed value stays apart from its limit (display units): not the limit rounded to the value's decimals, on
 * the side of it that the true values are; and where the limit is printed too, not the same number and on its
 * right side. `limit.shown` undefined: the text does not print the limit.
 */
function expectApart(value: { shown: string; true: number }, limit: { shown?: string; true: number }, what: string) {
  const v = Number(value.shown), rounded = Number(limit.true.toFixed(decimals(value.shown)));
  expect(Number.isNaN(v), `${what}: number parsed`).toBe(false);
  expect(v, `${what}: ${value.shown} reads as the limit ${limit.true}`).not.toBe(rounded);
  expect(Math.sign(v - rounded), `${what}: ${value.shown} on the wrong side of ${limit.true}`).toBe(Math.sign(value.true - limit.true));
  if (limit.shown === undefined) return;
  const l = Number(limit.shown);
  expect(v, `${what}: ${value.shown} printed as the limit ${limit.shown}`).not.toBe(l);
  expect(Math.sign(v - l), `${what}: ${value.shown} on the wrong side of ${limit.shown}`).toBe(Math.sign(value.true - limit.true));
}
const shownIn = (u: UnitPreset, q: Quantity, si: number) => fromSI(q, u[q], si);

describe("a short or oversized flow never reads as the duty or the tolerance limit, in any flow unit", () => {
  const duties = [100 * M3H, 500 * GPM, 36 * M3H, 12.5e-3, 0.9 * M3H, 2500 * M3H, 7e-3];
  const tolerances = [{ minus: 0, plus: 0.1 }, { minus: 0.025, plus: 0.011 }, { minus: 0.05, plus: 0.05 }];
  it("sweep: duties × tolerances × both limits × values just outside × 5 unit choices", () => {
    let judged = 0;
    for (const qd of duties) for (const tolerance of tolerances) for (const limit of [qd * (1 - tolerance.minus), qd * (1 + tolerance.plus)]) for (const off of OFFSETS) {
      const q = limit * (1 + off);
      const v = judgeCandidate({ dutyFlow: qd, tolerance, edges: [{ name: "most lift, aged pipe", flow: q, head: 20 }] })!;
      if (v.status === "meets") continue;
      judged++;
      const bound = v.status === "short" ? qd * (1 - tolerance.minus) : qd * (1 + tolerance.plus);
      for (const [name, u] of Object.entries(CHOICES)) {
        const what = `${v.status} ${qd / M3H} m³/h × (1 ${off}) in ${name}`;
        const reason = renderQuantities(v.reasons[0], u), rule = renderQuantities(v.rule, u);
        const r = new RegExp(`^Delivers ${NUM} \\S+ at .*against a duty of ${NUM} \\S+: `).exec(reason);
        const l = new RegExp(`= ${NUM} \\S+, to 1 part in 10⁶ \\(solver round-off\\)$`).exec(rule); // the allowance said since "verdictaudit"
        expect(r && l, `${what}: ${reason} | ${rule}`).toBeTruthy();
        const flow = { shown: r![1], true: shownIn(u, "flow", q) };
        expectApart(flow, { shown: l![1], true: shownIn(u, "flow", bound) }, `${what}, rule`);
        expectApart(flow, { shown: r![2], true: shownIn(u, "flow", qd) }, `${what}, duty`);
      }
    }
    expect(judged).toBe(duties.length * tolerances.length * 2 * 4); // every offset outside its limit was judged short or oversized
  });
});

describe("NPSH beside its status: NPSHa never reads as NPSHr, the margin ratio never as the wanted one", () => {
  // A made-up curve: NPSHr 3 m at 50 m³/h, 4 m at 100 m³/h (knots) and in between.
  const curve = createPumpCurve({ points: [
    { flow: 0, head: 30, efficiency: 0.01, npshr: 2 }, { flow: 50 * M3H, head: 28, efficiency: 0.6, npshr: 3 },
    { flow: 100 * M3H, head: 24, efficiency: 0.75, npshr: 4 }, { flow: 150 * M3H, head: 16, efficiency: 0.7, npshr: 6 }] });
  const fluid = { name: "water 20 °C", density: 998.2, vaporPressure: 2339, dynamicViscosity: 1.0016e-3, kinematicViscosity: 1.0034e-6 }; // water at 20 °C (IAPWS, from memory)
  const figures = (flow: number, staticSuctionHead: number, requiredMargin: number) =>
    operatingFigures({ curve, flow, fluid, requiredMargin, suction: { surfacePressure: 101325, staticSuctionHead, suctionLoss: 0 } });
  it("sweep: 3 flows × NPSHa just below NPSHr and just below the wanted ratio (1.05, 1.1, 1.3) × SI and US", () => {
    const seen = { cavitation: 0, low: 0 };
    for (const flow of [50 * M3H, 80 * M3H, 100 * M3H]) for (const requiredMargin of [1.05, 1.1, 1.3]) for (const target of [1, requiredMargin]) for (const off of OFFSETS) {
      const base = figures(flow, 0, requiredMargin).npsh!;
      const wanted = base.required! * target * (1 + off);
      const f = figures(flow, wanted - base.available, requiredMargin).npsh!;
      for (const [name, u] of Object.entries({ SI, US })) {
        const what = `${flow / M3H} m³/h, NPSHa ${target} × NPSHr × (1 ${off}), wanted ${requiredMargin}, ${name}`;
        const messages = figures(flow, wanted - base.available, requiredMargin).warnings.map((w) => renderQuantities(w.message, u));
        if (f.status === "cavitation-risk") {
          seen.cavitation++;
          const m = messages.map((t) => new RegExp(`^NPSHa ${NUM} \\S+ is below NPSHr ${NUM} \\S+: cavitation risk$`).exec(t)).find(Boolean);
          expect(m, `${what}: ${messages.join(" | ")}`).toBeTruthy();
          expectApart({ shown: m![1], true: shownIn(u, "head", f.available) }, { shown: m![2], true: shownIn(u, "head", f.required!) }, what);
        } else if (f.status === "low-margin") {
          seen.low++;
          const m = messages.map((t) => new RegExp(`^NPSH margin ratio ${NUM} is below the required ${NUM}$`).exec(t)).find(Boolean);
          expect(m, `${what}: ${messages.join(" | ")}`).toBeTruthy();
          expectApart({ shown: m![1], true: f.marginRatio! }, { shown: m![2], true: requiredMargin }, what);
          expect(Number(m![1]), `${what}: a low margin reads below 1`).toBeGreaterThanOrEqual(1);
        }
      }
    }
    expect(seen.cavitation).toBeGreaterThan(20);
    expect(seen.low).toBeGreaterThan(20);
  });
});

describe("the motor basis: the power covered never reads as the rating × service factor that fell short of it", () => {
  it("sweep: every standard rating × service factor 1, 1.15 × the power just above it × kW and hp", () => {
    const series = IEC_MOTOR_RATINGS_KW.map((kw) => kw * 1000);
    for (const sf of [1, 1.15]) for (let i = 0; i < series.length; i++) for (const off of [1e-3, 1e-4, 1e-5, 2e-6]) {
      const power = series[i] * sf * (1 + off);
      const s = suggestMotor({ dutyPower: power * 0.9, maxCurvePower: power, serviceFactor: sf });
      expect(s.rating, `${power} W`).toBe(i + 1 < series.length ? series[i + 1] : null);
      for (const [name, u] of Object.entries({ SI, US })) {
        const basis = renderQuantities(s.basis, u);
        const m = new RegExp(`largest power on the curve to its end ${NUM} \\S+ \\(duty`).exec(basis);
        expect(m, basis).toBeTruthy();
        expectApart({ shown: m![1], true: shownIn(u, "power", power) }, { true: shownIn(u, "power", series[i] * sf) }, `${series[i]} W × ${sf} × (1 + ${off}), ${name}: ${basis}`);
      }
    }
  });
});

describe("no operating point: the pump's head never reads as the system's beside 'below'", () => {
  it("sweep: static head just above the shutoff head × SI and US", () => {
    const curve = createPumpCurve({ points: [{ flow: 0, head: 20 }, { flow: 50 * M3H, head: 18 }, { flow: 100 * M3H, head: 12 }] });
    for (const shutoff of [20]) for (const off of [1e-3, 1e-4, 1e-5, 1e-6]) {
      const stat = shutoff * (1 + off);
      const op = solveOperatingPoint(curve, (q) => stat + 1000 * q * q);
      expect(op.status).toBe("no-intersection-shutoff-below-static");
      for (const [name, u] of Object.entries({ SI, US })) {
        const t = renderQuantities(op.message, u);
        const m = new RegExp(`^Shutoff head ${NUM} \\S+ is below the system head ${NUM} \\S+ at zero flow`).exec(t);
        expect(m, t).toBeTruthy();
        expectApart({ shown: m![1], true: shownIn(u, "head", shutoff) }, { shown: m![2], true: shownIn(u, "head", stat) }, `${off}, ${name}: ${t}`);
      }
    }
  });
});

describe("impeller diameters beside the published smallest and largest (the model's own data; 20 % trim, common practice)", () => {
  it("sweep: diameters just outside 175, 195, 203.2 mm × mm and inches, in the verdict's reason and the trim's warnings", () => {
    const curve = createPumpCurve({ points: [{ flow: 0, head: 20 }, { flow: 50 * M3H, head: 18 }, { flow: 100 * M3H, head: 12 }], impellerDiameter: 0.2 });
    for (const limit of [0.175, 0.195, 0.2032]) for (const off of [-1e-3, -1e-4, -2e-6, 2e-6, 1e-4, 1e-3]) for (const [name, u] of Object.entries({ SI, US })) {
      const d = limit * (1 + off), below = off < 0;
      const [reason] = catalogueReasons(below ? { diameter: d, minDiameter: limit } : { diameter: d, maxDiameter: limit });
      const r = new RegExp(`^impeller Ø${NUM} \\S+ is (below the smallest|above the largest) the model publishes \\(Ø${NUM} \\S+\\)`).exec(renderQuantities(reason ?? "", u));
      expect(r, `${d} against ${limit}: ${reason}`).toBeTruthy();
      expectApart({ shown: r![1], true: shownIn(u, "diameter", d) }, { shown: r![3], true: shownIn(u, "diameter", limit) }, `${name}: ${r![0]}`);
      const warnings = scaleByTrim({ ...curve, minDiameter: below ? limit : null, maxDiameter: below ? null : limit }, d / 0.2).warnings.map((w) => renderQuantities(w.message, u));
      const w = warnings.map((t) => new RegExp(`diameter ${NUM} \\S+ is (below the model's minimum|above the model's maximum) ${NUM} \\S+$`).exec(t)).find(Boolean);
      expect(w, warnings.join(" | ")).toBeTruthy();
      expectApart({ shown: w![1], true: shownIn(u, "diameter", d) }, { shown: w![3], true: shownIn(u, "diameter", limit) }, `${name}: ${w![0]}`);
    }
    for (const off of [1e-3, 1e-4, 1e-5]) {
      const trim = 0.2 * (1 + off);
      const t = scaleByTrim(curve, 1 - trim).warnings.map((x) => x.message).find((m) => m.startsWith("trim of"));
      const m = new RegExp(`^trim of ${NUM} % exceeds ${NUM} %`).exec(t ?? "");
      expect(m, t).toBeTruthy();
      expectApart({ shown: m![1], true: trim * 100 }, { shown: m![2], true: 20 }, t!);
    }
  });
});

describe("the search's reasons: NPSH margin and BEP position beside 'below' and 'outside POR'", () => {
  const row = (npshMargin: number, bepRatio: number): Candidate => ({ id: "x", label: "P", method: "direct", ratio: 1, diameter: null, speed: null, headAtDuty: 20, direct: { flow: 0.01, head: 20, headHigh: 21, publishedHead: 20 },
    efficiency: 0.7, bepRatio, inPor: bepRatio >= 0.7 && bepRatio <= 1.2, npshr: 3, npshMargin, shaftPower: 5000, score: 0.5, rank: 0, reason: "", warnings: [] });
  it("sweep: margins just below 1.1 and 1.3, BEP ratios just outside 70 % and 120 % (POR, ANSI/HI 9.6.3 from memory)", () => {
    for (const req of [1.1, 1.3]) for (const off of [-1e-3, -1e-4, -1e-5]) for (const bep of [0.7 * (1 + off), 1.2 * (1 - off)]) {
      const [c] = explainRanks([row(req * (1 + off), bep)], 1, req);
      const m = new RegExp(`NPSH margin at duty ${NUM} \\(below ${NUM}\\)`).exec(c.reason);
      expect(m, c.reason).toBeTruthy();
      expectApart({ shown: m![1], true: req * (1 + off) }, { shown: m![2], true: req }, c.reason);
      const b = new RegExp(`${NUM} % of BEP flow \\(outside POR`).exec(c.reason);
      expect(b, c.reason).toBeTruthy();
      const limit = bep < 1 ? 70 : 120;
      expectApart({ shown: b![1], true: bep * 100 }, { shown: String(limit), true: limit }, c.reason);
    }
  });
});

describe("search reasons against the row above: BEP positions and scores apart at their printed digits", () => {
  const row = (bepRatio: number, score: number): Candidate => ({ id: String(score), label: "P", method: "direct", ratio: 1, speed: null, diameter: null, headAtDuty: 30, direct: { flow: 0.01, head: 30, headHigh: 31.5, publishedHead: 30 },
    efficiency: 0.7, bepRatio, inPor: true, npshr: 3, npshMargin: 2, shaftPower: 5000, score, rank: 0, reason: "", warnings: [] });
  it("a row 0.5 % from BEP below one at BEP reads 99.5 % against 100 %, not 100 % against 100 % (hand-written case)", () => {
    const [, b] = explainRanks([row(1, 0.6), row(0.995, 0.59)], 2, 1.1);
    const m = new RegExp(`further from BEP \\(${NUM} % against ${NUM} %\\)`).exec(b.reason);
    expect(m, b.reason).toBeTruthy();
    expectApart({ shown: m![1], true: 99.5 }, { shown: m![2], true: 100 }, b.reason);
  });
  it("sweep: scores a little apart never print equal beside 'below … on score'", () => {
    for (const top of [0.5, 0.6691, 0.12345]) for (const off of [1e-4, 1e-5, 2e-6]) {
      const [, b] = explainRanks([row(1, top), row(1, top - off)], 2, 1.1);
      const m = new RegExp(`on score ${NUM} against ${NUM}`).exec(b.reason);
      expect(m, b.reason).toBeTruthy();
      expect(Number(m![1]), b.reason).toBeLessThan(Number(m![2]));
    }
  });
});

describe("fmtNum: no false zero, no negative zero", () => {
  it("a tiny non-zero value shows significant digits; a rounded zero has no sign (hand-written cases)", () => {
    // 4e-7 m³/s = 0.0004 L/s: the magnitude rule's 3 decimals would print "0.000 L/s".
    expect(renderQuantities(`⟦flow|4e-7⟧`, CHOICES["L/s"])).toBe("0.000400 L/s");
    expect(renderQuantities(`⟦head|-0.0001⟧`, SI)).toBe("−0.000100 m"); // true minus (helper "numtext")
    expect(fmtNum(4e-10)).toBe("4.00e-10");
    expect(fmtNum(-0)).toBe("0.000");
    expect(fmtNum(-0.0004, 3)).toBe("0.000"); // decimals asked for: a rounded zero, unsigned
    expect(fmtNum(0)).toBe("0.000");
    expect(fmtNum(0.0123)).toBe("0.012"); // unchanged where the decimals show the value
  });
});
