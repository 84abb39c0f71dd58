// Property sweep: every demo curve set on viscous liquids from a light oil to past the ANSI/HI 9.6.7 method's range
// (B from below 1 to above 40), duties around each curve's BEP, three adjustments. What must hold whatever the case:
// the evaluation throws nothing but the engine's typed refusal; a curve the method corrects is judged on it and the
// verdict says so; one it cannot correct never "meets"; a "meets" delivers the duty at every band edge on the liquid.
// Check values: our rules (app/engine/verdict.ts, viscous.ts: B ≤ 1 no correction, 1 < B ≤ 40 corrected, above 40
// outside the method), the demo data (invented, fixtures/demo/generate.ts).
import { describe, expect, it } from "vitest";
import { demoCurves, demoCurveSI } from "~/test/demo-curves";
import { EngineInputError } from "~/engine";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type SystemInput } from "./hydraulics";

const si = demoCurveSI;
const sets = demoCurves;
const RHO = 880; // kg/m³, an invented oil
/** Kinematic viscosities swept, cSt: B from below 1 to above 40 on the demo pumps (B ∝ √ν). */
const CST = [3, 40, 400, 3000, 20000];

/**
 * What each liquid and duty reaches at least (observed: 108 no-correction and 315 corrected at 3 cSt, 423 corrected at
 * 40 and 400, 216 corrected and 207 outside the method at 3000, 423 outside at 20 000 cSt, per duty fraction): one test
 * per liquid and duty, each well inside the 20 s timeout under load, where the single sweep took 12.5 s to 29.4 s (its one
 * evaluation each, ≈ 2.7 ms, is the cost; no evaluation is repeated). Together they ask more than the one sweep asked
 * (> 20 no-correction, > 100 corrected, > 20 outside the method, > 10 meetings on a corrected curve).
 */
const REACHES: Record<string, Partial<Record<"no-correction" | "corrected" | "outside-method" | "meetsCorrected", number>>> = {
  "3 0.6": { "no-correction": 20, corrected: 100, meetsCorrected: 10 }, "3 0.9": { "no-correction": 20, corrected: 100, meetsCorrected: 10 },
  "40 0.6": { corrected: 100, meetsCorrected: 10 }, "40 0.9": { corrected: 100, meetsCorrected: 10 },
  "400 0.6": { corrected: 100, meetsCorrected: 10 }, "400 0.9": { corrected: 100 },
  "3000 0.6": { corrected: 50, "outside-method": 20 }, "3000 0.9": { corrected: 50, "outside-method": 20 },
  "20000 0.6": { "outside-method": 100 }, "20000 0.9": { "outside-method": 100 },
};
const CASES = CST.flatMap((cst) => [0.6, 0.9].map((qf) => [cst, qf] as const));

describe(`property: demo curves on viscous liquids (${sets.length} curve sets × ${CST.length} liquids × 2 duties × 3 adjustments)`, () => {
  it.each(CASES)("%s cSt, duty at %s of BEP flow: every curve set × 3 adjustments", (cst, qf) => {
    const seen = { "no-correction": 0, corrected: 0, "outside-method": 0, meetsCorrected: 0, refused: 0 } as Record<string, number>;
    for (const c of sets) {
      const s = si(c);
      const bep = s.points.reduce((a, b) => ((b.efficiency ?? 0) > (a.efficiency ?? 0) ? b : a));
      const qd = bep.flow * qf;
      const hp = s.points.find((p) => p.flow >= qd)!.head * 0.85; // what the oil leaves of the water head, about
      const input: SystemInput = {
        ...defaultSystemInput(),
        fluid: { kind: "custom", name: "Sweep oil", density: RHO, dynamicViscosity: cst * 1e-6 * RHO, vaporPressure: 100 },
        staticLow: hp * 0.5,
        staticHigh: hp * 0.6,
        duty: { flow: qd, head: hp },
      };
      for (const adj of [DEFAULT_ADJUSTMENT, { ...DEFAULT_ADJUSTMENT, method: "speed" as const }, { ...DEFAULT_ADJUSTMENT, method: "trim" as const }]) {
        const where = `${c.model} ${c.speed} rpm Ø${c.impellerMm} · ${cst} cSt · ${qf} BEP · ${adj.method}`;
        let r;
        try {
          r = evaluateCandidate(input, s, adj);
        } catch (e) {
          expect(e, where).toBeInstanceOf(EngineInputError); // refused in words, never a crash
          seen.refused++;
          continue;
        }
        const status = r.viscosity?.status;
        if (status) seen[status] = (seen[status] ?? 0) + 1;
        const v = r.verdict;
        if (!v) continue;
        if (status === "corrected") {
          expect(v.status, where).not.toBe("viscosity-uncorrected");
          if (v.status !== "outside-catalogue") expect(v.rule, where).toContain("corrected for viscosity per ANSI/HI 9.6.7");
          expect(r.viscosityB!, where).toBeGreaterThan(1);
          expect(r.viscosityB!, where).toBeLessThanOrEqual(40);
        }
        if (status === "outside-method") {
          expect(r.viscosityB!, where).toBeGreaterThan(40);
          expect(v.status, where).not.toBe("meets");
          expect(v.status, where).not.toBe("oversized");
        }
        if (v.status === "meets") {
          if (status === "corrected") seen.meetsCorrected++;
          for (const b of r.band) expect(b.flow!, where).toBeGreaterThanOrEqual(qd * (1 - 1e-6));
        }
      }
    }
    // Each liquid and duty reaches the cases it claims to (else it proves nothing).
    for (const [k, least] of Object.entries(REACHES[`${cst} ${qf}`])) expect(seen[k], `${k} at ${cst} cSt, ${qf} of BEP flow`).toBeGreaterThan(least);
  });
});
