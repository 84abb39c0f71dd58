/**
 * A synthetic sample for the preview and tests (SI): three pumps with quadratic head curves,
 * parabolic efficiency, power from P = ρ·g·Q·H/η, a system curve H = Hs + K·Q² with a band.
 * Numbers are made up for drawing; they describe no real pump.
 */
import { UNIT_SYSTEMS } from "../../engine/units.ts";
import type { DutyChartProps, Pt, PumpSeries } from "./types.ts";

const RHO = 998.2; // kg/m³, water at 20 °C
const G = 9.80665;

function sample(f: (q: number) => number, qMax: number, n = 33): Pt[] {
  return Array.from({ length: n }, (_, i) => {
    const q = (qMax * i) / (n - 1);
    return { flow: q, y: f(q) };
  });
}

function pump(
  id: string,
  label: string,
  h0: number,
  k: number,
  qBep: number,
  etaMax: number,
  qMax: number,
  hs: number,
  ks: number,
  npsh0: number,
  npshK: number,
  extra: Partial<PumpSeries> = {},
): PumpSeries {
  const head = (q: number) => h0 - k * q * q;
  const eta = (q: number) => Math.max(0, etaMax * (1 - ((q - qBep) / qBep) ** 2));
  const power = (q: number) => (q === 0 ? RHO * G * 0.02 * h0 / 0.3 : (RHO * G * q * head(q)) / Math.max(eta(q), 0.05));
  const npshr = (q: number) => npsh0 + npshK * q * q;
  const qOp = Math.sqrt((h0 - hs) / (k + ks));
  return {
    id,
    label,
    head: sample(head, qMax),
    efficiency: sample(eta, qMax),
    power: sample(power, qMax).slice(1),
    npshr: sample(npshr, qMax).slice(4),
    bep: { flow: qBep, head: head(qBep) },
    por: { minFlow: 0.7 * qBep, maxFlow: 1.2 * qBep },
    operating: { flow: qOp, head: head(qOp), efficiency: eta(qOp), power: power(qOp), npshr: npshr(qOp) },
    ...extra,
  };
}

/** Sample chart props: duty 0.1 m³/s at 30 m, system Hs = 12 m, K = 1800 s²/m⁵. */
export function sampleProps(units: "SI" | "US" = "SI"): DutyChartProps {
  const unitSystem = UNIT_SYSTEMS[units];
  const hs = 12;
  const ks = 1800;
  return {
    unitSystem,
    title: "Candidates for system CW-2 at the duty point",
    description:
      "Head against flow for three candidate pumps over the system curve band, with efficiency, shaft power and NPSH panels below.",
    system: {
      design: sample((q) => hs + ks * q * q, 0.16),
      low: sample((q) => 9 + ks * 0.85 * q * q, 0.16),
      high: sample((q) => 14 + ks * 1.15 * q * q, 0.16),
    },
    pumps: [
      pump("a", "Kestrel 80-250 · 1450 rpm", 45, 1500, 0.105, 0.8, 0.165, hs, ks, 1.6, 210),
      pump("b", "Harrow 100-200 · 1480 rpm", 50, 1800, 0.11, 0.77, 0.155, hs, ks, 2.4, 330),
      pump("c", "Kestrel 80-250 · trim 238 mm", 40, 1300, 0.1, 0.78, 0.16, hs, ks, 1.4, 190, { adjusted: true }),
    ],
    npsha: sample((q) => 9.5 - 120 * q * q, 0.16),
    duty: { flow: 0.1, head: 30 },
    flowMax: 0.16,
  };
}
