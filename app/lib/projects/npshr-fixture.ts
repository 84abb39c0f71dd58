// Tests only: the invented pump of the NPSHr-reach tests (npshr-reach.test.ts, npshr-end-rounding.test.ts) — a head curve
// 24 m − 84979 s²/m⁵ · Q², efficiency peaking at 75 % at 0.010 m³/s, NPSHr 2.5 m published only at the flows a filter takes.

/** The published flows, m³/s. */
const FLOWS = [0, 0.004, 0.008, 0.012, 0.016];

/** The invented pump with NPSHr 2.5 m published at the flows `keep` takes, blank at the others. */
export const npshrPump = (keep: (q: number) => boolean) => ({
  points: FLOWS.map((q) => ({ flow: q, head: 24 - 84979 * q * q, efficiency: q === 0 ? 0 : 0.75 * (1 - ((q - 0.01) / 0.01) ** 2), power: null, npshr: keep(q) ? 2.5 : null })),
  speed: 2900, impellerDiameter: null,
});
/** NPSHr published up to `end` (m³/s) / from `start` on. */
export const upTo = (end: number) => (q: number) => q <= end;
export const from = (start: number) => (q: number) => q >= start;
