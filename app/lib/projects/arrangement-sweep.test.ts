// Property sweep: every demo curve set run as 2 in parallel (+1 standby), 3 in parallel and 2 in series, as
// published and on speed, against systems drawn around the arrangement's own duty. What must hold whatever the case:
// only the engine's typed refusal is thrown; a "meets" delivers the duty at every band edge; the operating point lies
// on the arrangement's curve (parallel: n × one pump's flow at its head; series: n × one pump's head at its flow);
// NPSH is judged per pump at the design point and each band corner. Check values: common practice (identical pumps in
// parallel add flow at equal head, in series add head at equal flow), our rules (app/engine/verdict.ts), the demo data
// (invented, fixtures/demo/generate.ts).
import { describe, expect, it } from "vitest";
import { demoCurves, demoCurveSI } from "~/test/demo-curves";
import { createPumpCurve, EngineInputError, headAt } from "~/engine";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, toPumpPoints, type Adjustment, type SystemInput } from "./hydraulics";

const si = demoCurveSI;
const sets = demoCurves;
const ARRANGEMENTS: Pick<Adjustment, "arrangement" | "dutyPumps" | "standbyPumps">[] = [
  { arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 },
  { arrangement: "parallel", dutyPumps: 3, standbyPumps: 0 },
  { arrangement: "series", dutyPumps: 2, standbyPumps: 0 },
];

describe("property: demo curves in parallel and in series", () => {
  it(`sweeps ${sets.length} curve sets × ${ARRANGEMENTS.length} arrangements × 3 duties × 2 methods`, () => {
    let judged = 0, meets = 0, onCurve = 0;
    for (const c of sets) {
      const s = si(c);
      const one = createPumpCurve({ points: toPumpPoints(s.points), speed: s.speed, impellerDiameter: s.impellerDiameter, riseTolerance: 1 });
      const bep = s.points.reduce((a, b) => ((b.efficiency ?? 0) > (a.efficiency ?? 0) ? b : a));
      for (const arr of ARRANGEMENTS) {
        const n = arr.dutyPumps;
        for (const hf of [0.85, 1, 1.15]) {
          // The arrangement's duty at one pump's BEP: parallel n × its flow at its head, series its flow at n × its head.
          const duty = arr.arrangement === "parallel" ? { flow: n * bep.flow, head: bep.head * hf } : { flow: bep.flow, head: n * bep.head * hf };
          const input: SystemInput = { ...defaultSystemInput(), staticLow: duty.head * 0.5, staticHigh: duty.head * 0.6, duty };
          for (const method of ["none", "speed"] as const) {
            const adj: Adjustment = { ...DEFAULT_ADJUSTMENT, ...arr, method };
            const where = `${c.model} ${c.speed} rpm Ø${c.impellerMm} · ${arr.arrangement} ${n}+${arr.standbyPumps} · head ×${hf} · ${method}`;
            let r;
            try {
              r = evaluateCandidate(input, s, adj);
            } catch (e) {
              expect(e, where).toBeInstanceOf(EngineInputError);
              continue;
            }
            if (method === "none" && r.operating) {
              // As published, the arrangement's point is n pumps' worth of one pump's curve.
              const perPump = arr.arrangement === "parallel" ? r.operating.flow / n : r.operating.flow;
              const h1 = headAt(one, perPump);
              if (h1 !== null) {
                const expected = arr.arrangement === "parallel" ? h1 : n * h1;
                expect(Math.abs(r.operating.head - expected), where).toBeLessThan(1e-6 * Math.max(1, expected));
                onCurve++;
              }
            }
            expect(r.npsh.judgedAt?.length ?? 0, where).toBeGreaterThan(0);
            if (!r.verdict) continue;
            judged++;
            if (r.verdict.status !== "meets") continue;
            meets++;
            for (const b of r.band) expect(b.flow!, where).toBeGreaterThanOrEqual(duty.flow * (1 - 1e-6));
          }
        }
      }
    }
    // The sweep reaches what it claims (else it proves nothing).
    expect(judged).toBeGreaterThan(sets.length * ARRANGEMENTS.length * 4);
    expect(meets).toBeGreaterThan(50);
    expect(onCurve).toBeGreaterThan(sets.length * ARRANGEMENTS.length);
  });
});
