// Shared test data: synthetic pump curves made up for the tests (not any vendor's data).
import { createPumpCurve, type DutyCycleInput, type PumpCurve, type PumpPoint } from "../index.ts";

export const M3H = 1 / 3600;

/** A made-up 50 m³/h × 28 m end-suction style curve: [m³/h, m, efficiency, NPSHr m]. */
export const SAMPLE_ROWS: [number, number, number, number][] = [
  [0, 36, 0, 1.2], [10, 35.5, 0.35, 1.5], [20, 34.5, 0.55, 2.0], [30, 33, 0.68, 2.3], [40, 31, 0.75, 2.7],
  [50, 28, 0.78, 3.2], [60, 24.5, 0.76, 4.0], [70, 20, 0.7, 5.0], [80, 14.5, 0.6, 6.3],
];

export function samplePoints(opts: { efficiency?: boolean; power?: boolean; npshr?: boolean } = {}): PumpPoint[] {
  const { efficiency = true, power = false, npshr = true } = opts;
  return SAMPLE_ROWS.map(([q, h, e, n]) => {
    const p: PumpPoint = { flow: q * M3H, head: h };
    if (efficiency) p.efficiency = e;
    if (power && q > 0) p.power = (1000 * 9.80665 * q * M3H * h) / e;
    if (npshr && q > 0) p.npshr = n;
    return p;
  });
}

/** Quadratic pump curve H = h0·(1 − (Q/qr)²) sampled at n points, with a parabolic efficiency. */
export function quadraticPoints(h0: number, qr: number, n = 9, etaMax = 0.8, qBep = 0.6 * qr): PumpPoint[] {
  const pts: PumpPoint[] = [];
  for (let i = 0; i < n; i++) {
    const q = (qr * i) / (n - 1);
    const x = q / qBep;
    pts.push({ flow: q, head: h0 * (1 - (q / qr) ** 2), efficiency: Math.max(0, etaMax * x * (2 - x)) || (i === 0 ? 0 : 0.05) });
  }
  return pts;
}

/**
 * A made-up small pump (not any vendor's): knots every 5 m³/h, H = 20 − 0.02·Q² (Q in m³/h), shaft power given at the
 * knots (W, at 1000 kg/m³, the curve's power density). Steps on knots need no interpolation in a hand calculation.
 */
export function knotCurve(): PumpCurve {
  return createPumpCurve({
    points: [
      { flow: 0, head: 20, power: 300 },
      { flow: 5 * M3H, head: 19.5, power: 450 },
      { flow: 10 * M3H, head: 18, power: 600 },
      { flow: 15 * M3H, head: 15.5, power: 720 },
      { flow: 20 * M3H, head: 12, power: 800 },
    ],
    powerDensity: 1000,
  });
}

/** The knot curve's design flow, m³/s (10 m³/h: 18 m and 600 W there). */
export const KNOT_DESIGN_FLOW = 10 * M3H;

/**
 * The duty-cycle tests' base (made up): the knot curve on a closed loop through its design knot, H = 18 m × (Q / 10 m³/h)²
 * (no static head), fixed speed, 1000 h at full and 3000 h at half flow, a 750 W motor at 80 %, no drive, 1000 kg/m³.
 */
export function knotCycle(): DutyCycleInput {
  return {
    curve: knotCurve(),
    systemHead: (q: number) => 18 * (q / KNOT_DESIGN_FLOW) ** 2,
    designFlow: KNOT_DESIGN_FLOW,
    mode: "fixed-speed",
    profile: [{ flowFraction: 1, hours: 1000 }, { flowFraction: 0.5, hours: 3000 }],
    density: 1000,
    motor: { rating: 750, efficiency: 0.8 },
    driveEfficiency: null,
  };
}
