// The flow verdict's allowance is said in its rule (helper "verdictaudit"). The verdict compares the operating flow with
// duty × (1 − minus) and duty × (1 + plus) to 1 part in 10⁶ (LIMIT_ROUNDOFF, affinity.ts: solver round-off), and the
// catalogue's limits likewise; before, no rule said so: a flow 0.5 parts in 10⁶ under a 100 m³/h duty with tolerance −0 %
// was "meets: operating flow at the demanding edge within 100 m³/h–110 m³/h", though it is under 100 m³/h. Check values:
// the rules (verdict.ts: −0 %/+10 % default, common practice; 30–100 % of rated speed, common practice); the duty and
// diameters are invented. Each side of every threshold: exactly at it, within the allowance, just past it.
import { describe, expect, it } from "vitest";
import { judgeCandidate, LIMIT_ROUNDOFF } from "./index.ts";

const M3H = 1 / 3600; // m³/s per m³/h
const QD = 100 * M3H; // duty (invented)
const judge = (q: number, extra: Partial<Parameters<typeof judgeCandidate>[0]> = {}) =>
  judgeCandidate({ dutyFlow: QD, edges: [{ name: "most lift, aged pipe", flow: q, head: 20 }], ...extra })!;
const SAID = "to 1 part in 10⁶ (solver round-off)";

describe("the flow verdict flips at duty × (1 − minus) and duty × (1 + plus) to 1 part in 10⁶, and its rule says so", () => {
  for (const tolerance of [{ minus: 0, plus: 0.1 }, { minus: 0.05, plus: 0.2 }]) {
    const lo = QD * (1 - tolerance.minus), hi = QD * (1 + tolerance.plus);
    const cases: [number, string][] = [
      [lo, "meets"], [lo * (1 - 1e-9), "meets"], [lo * (1 - 0.5 * LIMIT_ROUNDOFF), "meets"], [lo * (1 - 2 * LIMIT_ROUNDOFF), "short"],
      [hi, "meets"], [hi * (1 + 1e-9), "meets"], [hi * (1 + 0.5 * LIMIT_ROUNDOFF), "meets"], [hi * (1 + 2 * LIMIT_ROUNDOFF), "oversized"],
    ];
    for (const [q, status] of cases)
      it(`tolerance −${tolerance.minus * 100} %/+${tolerance.plus * 100} %: ${(q / QD).toPrecision(12)} × duty is ${status}, its rule naming the allowance`, () => {
        const v = judge(q, { tolerance });
        expect(v.status).toBe(status);
        expect(v.rule).toContain(SAID); // old code: no allowance named
      });
  }
});

describe("the catalogue's limits: the same allowance, said", () => {
  const cat = { minDiameter: 0.175, maxDiameter: 0.195 };
  it("an impeller 0.5 parts in 10⁶ under the smallest is inside, 2 parts outside, and the outside rule says to what", () => {
    expect(judge(QD, { catalogue: { ...cat, diameter: 0.175 * (1 - 0.5 * LIMIT_ROUNDOFF) } }).status).toBe("meets");
    const v = judge(QD, { catalogue: { ...cat, diameter: 0.175 * (1 - 2 * LIMIT_ROUNDOFF) } });
    expect(v.status).toBe("outside-catalogue");
    expect(v.rule).toContain(SAID);
  });
  it("a speed 0.5 parts in 10⁶ over the rated is inside, 2 parts outside, said", () => {
    expect(judge(QD, { catalogue: { speed: 2900 * (1 + 0.5 * LIMIT_ROUNDOFF), ratedSpeed: 2900 } }).status).toBe("meets");
    const v = judge(QD, { catalogue: { speed: 2900 * (1 + 2 * LIMIT_ROUNDOFF), ratedSpeed: 2900 } });
    expect(v.status).toBe("outside-catalogue");
    expect(v.rule).toContain(SAID);
  });
});
