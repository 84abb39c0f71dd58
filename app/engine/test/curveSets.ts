// Synthetic curve sets for search tests and the bench (deterministic; made up, not vendor data).
import type { CurveSet, PumpPoint } from "../index.ts";
import { prng as rng } from "../../../fixtures/prng";
export { rng };


/** One curve: shutoff h0 (m), runout qr (m³/s), BEP at a fraction of runout, peak efficiency. */
export function makeCurve(h0: number, qr: number, etaMax: number, bepFrac = 0.6, n = 8): PumpPoint[] {
  const qb = bepFrac * qr;
  const pts: PumpPoint[] = [];
  for (let i = 0; i < n; i++) {
    const q = (qr * i) / (n - 1);
    const x = q / qb;
    const eta = i === 0 ? 0 : Math.max(0.05, etaMax * x * (2 - x));
    pts.push({ flow: q, head: h0 * (1 - 0.8 * (q / qr) ** 2), efficiency: eta, npshr: i === 0 ? undefined : 1 + 4 * (q / qr) ** 2 });
  }
  return pts;
}

/** n curve sets spread over 1–500 m³/h and 5–150 m. */
export function generateCurveSets(n: number, seed = 42): CurveSet[] {
  const r = rng(seed);
  const out: CurveSet[] = [];
  for (let i = 0; i < n; i++) {
    const qr = (1 + r() * 499) / 3600;
    const h0 = 5 + r() * 145;
    const eta = 0.45 + r() * 0.4;
    const d = 0.12 + r() * 0.3;
    out.push({ id: `set-${i}`, label: `Generated ${i}`, curve: {
      points: makeCurve(h0, qr, eta, 0.5 + r() * 0.2), speed: r() < 0.5 ? 1450 : 2900,
      impellerDiameter: d, minDiameter: d * 0.75, maxDiameter: d,
    } });
  }
  return out;
}
