// Property sweep (helper "verdictaudit"): every demo curve set as published, on a system drawn about its BEP, judged with
// the duty put so that the band's demanding edge (least flow) lies exactly at, a rounding error inside, and just past each
// end of the flow tolerance: the verdict flips there (verdict.ts: below duty × (1 − minus) or above duty × (1 + plus) by
// more than 1 part in 10⁶, LIMIT_ROUNDOFF), states its rule with that allowance, names the edge it judged, and a short or
// oversized verdict names the flow apart from the limit. The system curve does not depend on the duty (checked: the band's
// flows are the same for every duty). Check values: the rules (−0 %/+10 % default and −5 %/+20 %, common practice); the
// demo data is invented (fixtures/demo/generate.ts).
import { describe, expect, it } from "vitest";
import { demoCurves, demoCurveSI } from "~/test/demo-curves";
import { LIMIT_ROUNDOFF } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type SystemInput } from "./hydraulics";

const M3H = 1 / 3600; // m³/s per m³/h
const num = (t: string) => Number(t.replace(/\u202f/g, "").replace(/,/g, ""));

describe("every demo curve set: the flow verdict at both ends of the tolerance", () => {
  it(`${demoCurves.length} curve sets × 2 tolerances × 8 duties`, () => {
    const wrong: string[] = [];
    let judged = 0;
    for (const d of demoCurves) {
      const s = demoCurveSI(d);
      const bep = s.points.reduce((a, b) => ((b.efficiency ?? 0) > (a.efficiency ?? 0) ? b : a));
      // 0.8 of the BEP head static at least lift, 0.9 of it at most, and the default runs scaled to the pump (bore ∝ √flow at 2 m/s).
      const bore = Math.sqrt((4 * bep.flow) / (Math.PI * 2));
      const runs = defaultSystemInput().runs.map((r) => ({ ...r, diameter: bore }));
      const base: SystemInput = { ...defaultSystemInput(), runs, staticLow: bep.head * 0.8, staticHigh: bep.head * 0.9, duty: { flow: bep.flow, head: bep.head } };
      const first = evaluateCandidate(base, s, DEFAULT_ADJUSTMENT);
      const flows = first.band.map((b) => b.flow);
      if (flows.some((q) => q == null || q <= 0)) continue; // no point at an edge: another rule decides
      const qw = Math.min(...(flows as number[]));
      for (const tol of [{ minus: 0, plus: 0.1 }, { minus: 0.05, plus: 0.2 }]) {
        // Duty so that the least band flow qw is: at duty×(1−minus); 1e-9 under it; past the allowance under it; the same at (1+plus).
        const cases: [number, string][] = [
          [qw / (1 - tol.minus), "meets"], [(qw * (1 + 1e-9)) / (1 - tol.minus), "meets"], [(qw * (1 + 2 * LIMIT_ROUNDOFF)) / (1 - tol.minus), "short"],
          [qw / (1 + tol.plus), "meets"], [(qw * (1 - 1e-9)) / (1 + tol.plus), "meets"], [(qw * (1 - 2 * LIMIT_ROUNDOFF)) / (1 + tol.plus), "oversized"],
          [(qw / (1 - tol.minus)) * (1 - 1e-9), "meets"], [(qw / (1 + tol.plus)) * (1 + 1e-9), "meets"],
        ];
        for (const [duty, status] of cases) {
          const where = `${d.model} ${d.speed} rpm Ø${d.impellerMm}, −${tol.minus}/+${tol.plus}, duty ${(duty / M3H).toPrecision(12)} m³/h`;
          const e = evaluateCandidate({ ...base, flowTolerance: tol, duty: { flow: duty, head: bep.head } }, s, DEFAULT_ADJUSTMENT);
          const v = e.verdict!;
          judged++;
          if (e.band.some((b, i) => b.flow !== flows[i])) wrong.push(`${where}: the band moved with the duty`);
          if (v.status !== status) { wrong.push(`${where}: ${v.status}, not ${status}`); continue; }
          if (!v.rule.startsWith(`${status}: `) || !v.rule.endsWith("to 1 part in 10⁶ (solver round-off)")) wrong.push(`${where}: rule ${v.rule}`);
          if (v.edge !== "most lift, aged pipe") wrong.push(`${where}: judged at ${v.edge}`);
          if (status === "meets") continue;
          const m = /^Delivers ([\d.,\u202f]+) m³\/h at most lift, aged pipe.* against a duty of ([\d.,\u202f]+) m³\/h: ([\d.]+) % of the duty/.exec(inSI(v.reasons[0]));
          const lim = /= ([\d.,\u202f]+) m³\/h, to 1 part/.exec(inSI(v.rule));
          if (!m || !lim) { wrong.push(`${where}: unread ${inSI(v.reasons[0])} | ${inSI(v.rule)}`); continue; }
          if (num(m[1]) === num(lim[1]) || num(m[1]) === num(m[2])) wrong.push(`${where}: the flow reads as its limit: ${inSI(v.reasons[0])} | ${inSI(v.rule)}`);
        }
      }
    }
    expect(wrong).toEqual([]);
    expect(judged).toBeGreaterThan(demoCurves.length * 8); // control: most demo sets reach a point at both edges
  });
});
