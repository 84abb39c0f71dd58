/**
 * The one registry of correlations: pipe losses, and the pump's viscosity correction. Method choices in the UI,
 * validity warnings and the docs all come from here. To add a correlation: write the formula in friction.ts (a loss)
 * or its own module (viscous.ts) with its citation, add an entry below (id, name, formula, validity, reference, units),
 * and add a check against a published or reference value in a test (see README.md).
 */
import { churchill, colebrook, haaland, hazenWilliamsHeadLoss, laminar, swameeJain } from "./friction.ts";
import { HI_VISCOSITY_SOURCE, VISCOSITY_B_MAX, VISCOSITY_B_NO_CORRECTION, viscosityFactors } from "./viscous.ts";
import type { EngineWarning } from "./errors.ts";
import { fmtExpExact } from "./quantityText.ts";

/** Ids of Darcy friction-factor methods. */
export type FrictionMethod = "colebrook" | "swamee-jain" | "haaland" | "churchill";

/** A closed interval [min, max] of a parameter. */
export type Range = readonly [number, number];

interface BaseCorrelation {
  /** Stable id. */
  id: string;
  /** Display name. */
  name: string;
  /** Formula as text. */
  formula: string;
  /** Published source. */
  reference: string;
  /** Units of inputs and result. */
  units: string;
  /** Accuracy statement, with its source. */
  accuracy: string;
}

/** A Darcy friction-factor correlation f(Re, ε/D). */
export interface DarcyCorrelation extends BaseCorrelation {
  kind: "darcy-friction";
  /** Which flow regime(s) it is meant for. */
  regimes: readonly ("laminar" | "transition" | "turbulent")[];
  /** Parameter ranges inside which it is stated valid. */
  validity: { reynolds: Range; relativeRoughness: Range };
  /** f(Re, ε/D), both dimensionless. */
  fn: (reynolds: number, relativeRoughness: number) => number;
}

/** A head-loss formula hf(Q, D, L, C). */
export interface HeadLossCorrelation extends BaseCorrelation {
  kind: "head-loss";
  validity: { velocity: Range; diameter: Range; kinematicViscosity: Range };
  /** hf in m from Q m³/s, D m, L m, C (dimensionless). */
  fn: (flow: number, diameter: number, length: number, c: number) => number;
}

/** A pump's correction factors from water to a viscous liquid, as functions of a parameter B. */
export interface PumpViscosityCorrelation extends BaseCorrelation {
  kind: "pump-viscosity";
  /** The range of B the method covers (below its lower end no correction is needed; above its upper end none is made). */
  validity: { b: Range };
  /** C_Q, C_BEP-H, C_η (dimensionless) from B (dimensionless). */
  fn: (b: number) => { flow: number; head: number; efficiency: number };
}

export type Correlation = DarcyCorrelation | HeadLossCorrelation | PumpViscosityCorrelation;

/** The registry. */
export const CORRELATIONS: readonly Correlation[] = [
  {
    id: "colebrook",
    kind: "darcy-friction",
    name: "Colebrook (solved exactly)",
    formula: "1/√f = −2·log10(ε/(3.7D) + 2.51/(Re·√f))",
    regimes: ["transition", "turbulent"],
    validity: { reynolds: [4000, 1e8], relativeRoughness: [0, 0.05] },
    reference:
      "C. F. Colebrook, J. Inst. Civ. Eng. 11 (1939) 133–156; solved by D. Clamond, Ind. Eng. Chem. Res. 48 (2009) 3665–3671",
    units: "Re, ε/D dimensionless → Darcy f dimensionless",
    accuracy: "machine precision solution of the equation (relative error < 1e-12 vs python3-fluids Colebrook, tol=0)",
    fn: colebrook,
  },
  {
    id: "swamee-jain",
    kind: "darcy-friction",
    name: "Swamee-Jain (1976)",
    formula: "f = 0.25 / [log10(ε/(3.7D) + 5.74/Re^0.9)]²",
    regimes: ["turbulent"],
    validity: { reynolds: [5000, 1e8], relativeRoughness: [1e-6, 1e-2] },
    reference: "P. K. Swamee and A. K. Jain, J. Hydraul. Div. ASCE 102(5) (1976) 657–664",
    units: "Re, ε/D dimensionless → Darcy f dimensionless",
    accuracy: "about 1 % from Colebrook over most of its range (Swamee & Jain 1976); up to 2.8 % at Re 5e3, ε/D 1e-2 (our check, friction.test.ts)",
    fn: swameeJain,
  },
  {
    id: "haaland",
    kind: "darcy-friction",
    name: "Haaland (1983)",
    formula: "1/√f = −1.8·log10[(ε/(3.7D))^1.11 + 6.9/Re]",
    regimes: ["turbulent"],
    validity: { reynolds: [4000, 1e8], relativeRoughness: [1e-6, 0.05] },
    reference: "S. E. Haaland, J. Fluids Eng. 105 (1983) 89–90",
    units: "Re, ε/D dimensionless → Darcy f dimensionless",
    accuracy: "within about 1.5 % of Colebrook in its range (Haaland 1983; 1.3 % max in our check)",
    fn: haaland,
  },
  {
    id: "churchill",
    kind: "darcy-friction",
    name: "Churchill (1977), all regimes",
    formula: "f = 8[(8/Re)^12 + (A+B)^−1.5]^(1/12)",
    regimes: ["laminar", "transition", "turbulent"],
    validity: { reynolds: [1e-3, 1e8], relativeRoughness: [0, 0.05] },
    reference: "S. W. Churchill, Chem. Eng. 84(24) (1977) 91–92",
    units: "Re, ε/D dimensionless → Darcy f dimensionless",
    accuracy: "reproduces 64/Re when laminar (0.1 %) and Colebrook within 3 % when turbulent (our check); transition is an interpolation",
    fn: churchill,
  },
  {
    id: "laminar",
    kind: "darcy-friction",
    name: "Laminar, 64/Re",
    formula: "f = 64/Re",
    regimes: ["laminar"],
    validity: { reynolds: [0, 2000], relativeRoughness: [0, 1] },
    reference: "Hagen-Poiseuille law for fully developed laminar pipe flow",
    units: "Re dimensionless → Darcy f dimensionless",
    accuracy: "exact for fully developed laminar flow",
    fn: (re: number) => laminar(re),
  },
  {
    id: "hazen-williams",
    kind: "head-loss",
    name: "Hazen-Williams (water)",
    formula: "hf = 10.67·L·Q^1.852 / (C^1.852·D^4.87)",
    validity: { velocity: [0, 3], diameter: [0.05, 2], kinematicViscosity: [0.8e-6, 1.6e-6] },
    reference: "Hazen-Williams formula, SI form (common practice); C values from memory",
    units: "Q m³/s, D m, L m, C dimensionless → hf m",
    accuracy: "empirical; for water at ordinary temperatures (about 5–30 °C) in turbulent flow",
    fn: hazenWilliamsHeadLoss,
  },
  {
    id: "hi-viscosity",
    kind: "pump-viscosity",
    name: "ANSI/HI 9.6.7 viscosity correction of a water pump curve",
    formula: "B = 26.6·ν^0.5·H^0.0625/(Q^0.375·N^0.25); C_Q = C_BEP-H = 2.71^(−0.165·(log10 B)^3.15); C_H = 1 − (1 − C_BEP-H)·(Q_W/Q_BEP-W)^0.75; C_η = B^(−0.0547·B^0.69)",
    validity: { b: [VISCOSITY_B_NO_CORRECTION, VISCOSITY_B_MAX] },
    reference: HI_VISCOSITY_SOURCE,
    units: "ν cSt, H ft (per stage), Q US gpm at the water BEP, N rpm → B and the factors dimensionless",
    accuracy: "the standard's empirical fit to tests of radial centrifugal pumps on Newtonian liquids; factors from memory, checked by hand (viscous.test.ts)",
    fn: (b: number) => viscosityFactors(b),
  },
];

/**
 * Finds a correlation by id; undefined if none.
 * @param id correlation id (unitless id)
 */
export function findCorrelation(id: string): Correlation | undefined {
  return BY_ID.get(id);
}

const BY_ID = new Map<string, Correlation>(CORRELATIONS.map((c) => [c.id, c]));

/** Darcy methods selectable as the turbulent friction model. */
export const FRICTION_METHODS: readonly FrictionMethod[] = ["colebrook", "swamee-jain", "haaland", "churchill"];

/** A value or range end in a validity warning: zero as "0" (a range starting at 0 read "0.00e+0"), very large, small or whole values in powers of ten. */
function fmt(x: number): string {
  if (x === 0) return "0";
  return Number.isInteger(x) || Math.abs(x) >= 1e4 || Math.abs(x) < 1e-3 ? x.toExponential(2) : String(x);
}

/** As {@link fmt}, a value outside a range never reading as its end ("Re = 1.00000001e+8 is outside … 1.00e+8", not "1.00e+8"). */
function fmtApart(x: number, range: Range): string {
  const shown = fmt(x);
  return shown.includes("e") && range.some((end) => end !== x && Number(shown) === Number(fmt(end))) ? fmtExpExact(x, range.map((end) => Number(fmt(end)))) : shown;
}

/**
 * Warnings for a value outside a correlation's stated range.
 * @param correlation the correlation (unitless descriptor)
 * @param parameter name of the parameter (unitless label)
 * @param value the value (same unit as the range)
 * @param range the stated range (same unit as the value)
 */
export function rangeWarning(
  correlation: Correlation,
  parameter: string,
  value: number,
  range: Range,
): EngineWarning | null {
  if (value >= range[0] && value <= range[1]) return null;
  return {
    code: "outside-validity",
    parameter,
    message: `${correlation.name}: ${parameter} = ${fmtApart(value, range)} is outside its stated range ${fmt(range[0])}–${fmt(range[1])}; result given, use with care`,
  };
}
