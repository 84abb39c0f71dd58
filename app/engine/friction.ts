/**
 * Darcy friction factor correlations and the Hazen-Williams loss formula: pure formulas.
 * Each refuses non-finite or out-of-domain arguments with EngineInputError (one cheap
 * comparison); validity-range warnings come from {@link ./headLoss.ts} and the registry.
 * Darcy f is dimensionless; Re and ε/D are dimensionless.
 */
import { EngineInputError } from "./errors.ts";

/** Throws unless Re is finite and > 0 and ε/D finite and ≥ 0 (one branch on the happy path). */
function checkReRr(reynolds: number, relativeRoughness: number): void {
  if (reynolds > 0 && reynolds < Infinity && relativeRoughness >= 0 && relativeRoughness < Infinity) return;
  if (!(reynolds > 0 && reynolds < Infinity)) throw new EngineInputError("reynolds", `must be a finite number > 0 (got ${reynolds})`);
  throw new EngineInputError("relativeRoughness", `must be a finite number ≥ 0 (got ${relativeRoughness})`);
}

/** Throws unless v is finite and > 0 (or ≥ 0 when zeroOk). */
function checkArg(name: string, v: number, zeroOk = false): void {
  if ((zeroOk ? v >= 0 : v > 0) && v < Infinity) return;
  throw new EngineInputError(name, `must be a finite number ${zeroOk ? "≥" : ">"} 0 (got ${v})`);
}

// The constants keep Clamond's 40 published digits on purpose (the nearest double is what runs).
/* eslint-disable no-loss-of-precision */
/** ln(10)/18.574 to 40 digits (Clamond 2009). */
const CL_X1 = 0.1239681863354175460160858261654858382699;
/** ln(ln(10)/5.02) (Clamond 2009). */
const CL_X2 = 0.7793974884556819406441139701653776731705;
/** (ln(10)/2)² (Clamond 2009). */
const CL_F = 1.325474527619599502640416597148504422899;
/* eslint-enable no-loss-of-precision */

// Natural logarithm for the Colebrook solver: x = 2^k·m, m ∈ [1, 2); ln m = ln c_j + ln(1 + r)
// with c_j the centre of one of 128 mantissa cells, r = m/c_j − 1 (|r| < 1/256) and ln(1 + r)
// from its Taylor series to r⁷ (truncation < 1e-20). Absolute error ≤ 2.3e-16 against
// Math.log over 1e-2..1e20 (checked in friction.test.ts); ~2× faster than Math.log here.
const F64 = new Float64Array(1);
const U32 = new Uint32Array(F64.buffer);
const HI = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1 ? 1 : 0; // high word index (endianness)
const LN_INVC = new Float64Array(128);
const LN_LOGC = new Float64Array(128);
for (let j = 0; j < 128; j++) {
  LN_INVC[j] = 1 / (1 + (j + 0.5) / 128);
  LN_LOGC[j] = -Math.log(LN_INVC[j]);
}
const LN_POW2 = new Float64Array(2048); // 2^−(e−1023) for biased exponent e
for (let e = 1; e < 2047; e++) LN_POW2[e] = Math.pow(2, 1023 - e);
const LN2_HI = 0.6931471803691238; // ln 2 split hi + lo (fdlibm constants)
const LN2_LO = 1.9082149292705877e-10;

/**
 * Natural logarithm, table + series (see above); falls back to Math.log outside normal
 * positive numbers.
 * @param x argument (dimensionless, > 0)
 */
export function lnFast(x: number): number {
  if (!(x >= 2.2250738585072014e-308 && x < Infinity)) return Math.log(x);
  F64[0] = x;
  const hi = U32[HI];
  const e = hi >>> 20;
  const j = (hi >>> 13) & 127;
  const r = x * LN_POW2[e] * LN_INVC[j] - 1;
  const r2 = r * r;
  const p = r + r2 * ((-0.5 + r * (1 / 3)) + r2 * ((-0.25 + r * 0.2) + r2 * (-1 / 6 + r * (1 / 7))));
  const k = e - 1023;
  return k * LN2_HI + (LN_LOGC[j] + (p + k * LN2_LO));
}

/** ln x to about 8e-6 absolute (table cell + first-order term); Math.log outside normal positives. */
function lnRough(x: number): number {
  if (!(x >= 2.2250738585072014e-308 && x < Infinity)) return Math.log(x);
  F64[0] = x;
  const hi = U32[HI];
  const e = hi >>> 20;
  const j = (hi >>> 13) & 127;
  return (e - 1023) * 0.6931471805599453 + LN_LOGC[j] + (x * LN_POW2[e] * LN_INVC[j] - 1);
}

/**
 * Colebrook (1939) equation 1/√f = −2·log10(ε/(3.7D) + 2.51/(Re·√f)), solved to machine
 * precision with D. Clamond's algorithm (Ind. Eng. Chem. Res. 48 (2009) 3665–3671: two
 * fourth-order iterations on F + ln(X1 + F) = X2). Source of the equation: C. F.
 * Colebrook, J. Inst. Civ. Eng. 11 (1939) 133–156. Turbulent flow, Re ≳ 4000; the
 * algorithm itself works for Re > ~10 and any ε/D ≥ 0. Relative error < 1e-14 against the
 * equation solved at 40 digits (reference.test.ts).
 * @param reynolds Reynolds number (dimensionless)
 * @param relativeRoughness ε/D (dimensionless)
 */
export function colebrook(reynolds: number, relativeRoughness: number): number {
  checkReRr(reynolds, relativeRoughness);
  const X1 = relativeRoughness * reynolds * CL_X1;
  // Starting point: Clamond's F0 = X2 − 0.2, but with ln(Re) taken from the exponent and
  // leading mantissa bits (error < 0.06), so the first ln(X1 + F0) need not wait for the
  // exact ln(Re). Each iteration is Clamond's with E = N/D substituted (one division):
  // F ← F − (D + E/2)·E·X1F/(D + E(1 + E/3)) = F − (D² + N/2)·N·X1F/(D³ + N·D + N²/3).
  let F: number;
  if (reynolds >= 2.2250738585072014e-308 && reynolds < Infinity) {
    F64[0] = reynolds;
    const hi = U32[HI];
    F = ((hi >>> 20) - 1023 + (hi & 0xfffff) * (1 / 1048576)) * 0.6931471805599453 - CL_X2 - 0.2;
  } else {
    F = Math.log(reynolds) - CL_X2 - 0.2;
  }
  const X2 = lnFast(reynolds) - CL_X2;
  let X1F = X1 + F;
  let D = 1 + X1F;
  // First iteration: ln(X1F) to first order in r only (|error| < r²/2 < 8e-6); the second,
  // fourth-order iteration with the full logarithm removes that error (result checked to
  // < 1e-14 against the equation solved at 40 digits, reference.test.ts).
  let N = lnRough(X1F) + F - X2;
  F -= ((D * D + 0.5 * N) * N * X1F) / (D * D * D + N * D + N * N * (1 / 3));
  X1F = X1 + F;
  D = 1 + X1F;
  N = lnFast(X1F) + F - X2;
  const A = (D * D + 0.5 * N) * N * X1F;
  const B = D * D * D + N * D + N * N * (1 / 3);
  const invF = B / (B * F - A);
  return CL_F * invF * invF;
}

/**
 * Residual of the Colebrook equation, 1/√f + 2·log10(ε/(3.7D) + 2.51/(Re√f)); zero at the
 * solution. Used by tests and for diagnostics.
 * @param f Darcy friction factor (dimensionless)
 * @param reynolds Reynolds number (dimensionless)
 * @param relativeRoughness ε/D (dimensionless)
 */
export function colebrookResidual(f: number, reynolds: number, relativeRoughness: number): number {
  checkArg("f", f);
  checkReRr(reynolds, relativeRoughness);
  const s = 1 / Math.sqrt(f);
  return s + 2 * Math.log10(relativeRoughness / 3.7 + (2.51 / reynolds) * s);
}

/**
 * Swamee & Jain (1976), J. Hydraul. Div. ASCE 102(5): f = 0.25/[log10(ε/(3.7D) + 5.74/Re^0.9)]².
 * Stated validity 5000 ≤ Re ≤ 1e8, 1e-6 ≤ ε/D ≤ 1e-2 (within ~1 % of Colebrook).
 * @param reynolds Reynolds number (dimensionless)
 * @param relativeRoughness ε/D (dimensionless)
 */
export function swameeJain(reynolds: number, relativeRoughness: number): number {
  checkReRr(reynolds, relativeRoughness);
  const l = Math.log10(relativeRoughness / 3.7 + 5.74 / Math.pow(reynolds, 0.9));
  return 0.25 / (l * l);
}

/**
 * Haaland (1983), J. Fluids Eng. 105: 89–90: 1/√f = −1.8·log10[(ε/(3.7D))^1.11 + 6.9/Re].
 * Stated validity 4000 ≤ Re ≤ 1e8, 1e-6 ≤ ε/D ≤ 0.05 (within ~2 % of Colebrook).
 * @param reynolds Reynolds number (dimensionless)
 * @param relativeRoughness ε/D (dimensionless)
 */
export function haaland(reynolds: number, relativeRoughness: number): number {
  checkReRr(reynolds, relativeRoughness);
  const x = -1.8 * Math.log10(Math.pow(relativeRoughness / 3.7, 1.11) + 6.9 / reynolds);
  return 1 / (x * x);
}

/**
 * Churchill (1977), Chem. Eng. 84(24): 91–92, one formula for laminar, transition and
 * turbulent flow: f = 8[(8/Re)^12 + (A+B)^−1.5]^(1/12), A = [2.457 ln(1/((7/Re)^0.9 +
 * 0.27 ε/D))]^16, B = (37530/Re)^16. All Re > 0; ε/D up to ~0.05.
 * @param reynolds Reynolds number (dimensionless)
 * @param relativeRoughness ε/D (dimensionless)
 */
export function churchill(reynolds: number, relativeRoughness: number): number {
  checkReRr(reynolds, relativeRoughness);
  const a = 2.457 * Math.log(Math.pow(7 / reynolds, 0.9) + 0.27 * relativeRoughness);
  const a2 = a * a, a4 = a2 * a2, a8 = a4 * a4;
  const A = a8 * a8;
  const b = 37530 / reynolds;
  const b2 = b * b, b4 = b2 * b2, b8 = b4 * b4;
  const B = b8 * b8;
  const c = 8 / reynolds;
  const c2 = c * c, c4 = c2 * c2;
  const C = c4 * c4 * c4;
  return 8 * Math.pow(C + 1 / Math.pow(A + B, 1.5), 1 / 12);
}

/**
 * Laminar (Hagen-Poiseuille) Darcy friction factor f = 64/Re, for Re ≲ 2000.
 * @param reynolds Reynolds number (dimensionless)
 */
export function laminar(reynolds: number): number {
  checkArg("reynolds", reynolds);
  return 64 / reynolds;
}

/**
 * Hazen-Williams head loss, SI form (common practice): hf = 10.67·L·Q^1.852/(C^1.852·D^4.87).
 * Empirical, for water at ordinary temperatures in turbulent flow.
 * @param flow volumetric flow, m³/s
 * @param diameter inner diameter, m
 * @param length pipe length, m
 * @param c Hazen-Williams roughness coefficient C (dimensionless in this SI form)
 * @returns head loss, m
 */
export function hazenWilliamsHeadLoss(flow: number, diameter: number, length: number, c: number): number {
  checkArg("flow", flow, true);
  checkArg("diameter", diameter);
  checkArg("length", length, true);
  checkArg("c", c);
  return (10.67 * length * Math.pow(flow, 1.852)) / (Math.pow(c, 1.852) * Math.pow(diameter, 4.87));
}

/**
 * Fully turbulent (fully rough) Darcy f from the rough-pipe limit of Colebrook,
 * f = 0.25/[log10(ε/(3.7D))]² — the basis of the fT column in Crane TP-410 (clean
 * commercial steel, ε = 0.045 mm). Agrees with the fT values printed there to about 3 %.
 * @param diameter inner diameter, m
 * @param roughness absolute roughness, m (default 0.045 mm, commercial steel)
 */
export function fullyRoughFrictionFactor(diameter: number, roughness = 0.045e-3): number {
  checkArg("diameter", diameter);
  checkArg("roughness", roughness);
  // ε/(3.7D) ≥ 1 makes the logarithm ≥ 0: the formula has no meaning there (roughness ≥ 3.7·D).
  if (!(roughness < 3.7 * diameter)) throw new EngineInputError("roughness", "must be below 3.7 × the diameter");
  const l = Math.log10(roughness / diameter / 3.7);
  return 0.25 / (l * l);
}
