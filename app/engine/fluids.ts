/**
 * Fluid properties.
 *
 * Water (liquid, 0–100 °C, at 101.325 kPa — or at saturation pressure where that is higher,
 * i.e. above 99.97 °C, so the state is always liquid):
 * - density: IAPWS-IF97 Region 1 basic equation (IAPWS R7-97(2012), eq. 7, 34 terms; valid
 *   273.15–623.15 K, p ≥ p_sat up to 100 MPa). Closed form in (p, T). Its density agrees
 *   with IAPWS-95 (IAPWS R6-95(2018), the scientific formulation) within 2e-5 relative over
 *   0–100 °C here — checked in fluids.test.ts against python3-iapws' IAPWS95.
 * - dynamic viscosity: IAPWS R12-08 (2008 formulation for the viscosity of ordinary water,
 *   eqs. 10–12; Pa·s; valid for the stable liquid well beyond 0–100 °C) with the critical
 *   enhancement μ₂ = 1 (negligible away from the critical point, per R12-08), fed with the
 *   density above. Agrees with python3-iapws IAPWS95.mu within 5e-5 relative over 0–100 °C
 *   (observed 2.2e-5, from the density difference).
 * - vapour pressure: IAPWS-IF97 Region 4 saturation-pressure equation (R7-97, eq. 30),
 *   closed form, Pa, valid 273.15–647.096 K. Matches python3-iapws `_PSat_T` to ~1e-15;
 *   differs from IAPWS-95's own saturation line by up to 7e-5 relative over 1–100 °C.
 * Density in kg/m³; observed max difference from IAPWS-95 over 0–100 °C: 1.5e-5.
 */
import { requireFinite, requireInRange, requirePositive, requireNonNegative, EngineInputError } from "./errors.ts";
import { STANDARD_ATMOSPHERE } from "./units.ts";
import { qt, qtBound, qtExact } from "./quantityText.ts";

/** A fluid state at one temperature, SI units. */
export interface Fluid {
  /** Display name, e.g. "Water 20 °C". */
  name: string;
  /** Density, kg/m³. */
  density: number;
  /** Dynamic viscosity, Pa·s. */
  dynamicViscosity: number;
  /** Kinematic viscosity, m²/s. */
  kinematicViscosity: number;
  /** Vapour pressure (absolute), Pa. */
  vaporPressure: number;
}

/** Water properties at one temperature (SI). */
export interface WaterProperties {
  /** kg/m³ */
  density: number;
  /** Pa·s */
  dynamicViscosity: number;
  /** m²/s */
  kinematicViscosity: number;
  /** Pa (absolute, saturation) */
  vaporPressure: number;
  /** Pressure the liquid properties were evaluated at, Pa (absolute). */
  pressure: number;
}

// IAPWS-IF97 specific gas constant, J/(kg·K) (R7-97 eq. 1).
const R_IF97 = 461.526;

// IAPWS-IF97 Region 1 coefficients (R7-97(2012), Table 2).
const R1_I = [0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 4, 4, 4, 5, 8, 8, 21, 23, 29, 30, 31, 32];
const R1_J = [-2, -1, 0, 1, 2, 3, 4, 5, -9, -7, -1, 0, 1, 3, -3, 0, 1, 3, 17, -4, 0, 6, -5, -2, 10, -8, -11, -6, -29, -31, -38, -39, -40, -41];
const R1_N = [
  0.14632971213167, -0.84548187169114, -0.3756360367204e1, 0.33855169168385e1, -0.95791963387872,
  0.15772038513228, -0.16616417199501e-1, 0.81214629983568e-3, 0.28319080123804e-3,
  -0.60706301565874e-3, -0.18990068218419e-1, -0.32529748770505e-1, -0.21841717175414e-1,
  -0.5283835796993e-4, -0.47184321073267e-3, -0.30001780793026e-3, 0.47661393906987e-4,
  -0.44141845330846e-5, -0.72694996297594e-15, -0.31679644845054e-4, -0.28270797985312e-5,
  -0.85205128120103e-9, -0.22425281908e-5, -0.65171222895601e-6, -0.14341729937924e-12,
  -0.40516996860117e-6, -0.12734301741641e-8, -0.17424871230634e-9, -0.68762131295531e-18,
  0.14478307828521e-19, 0.26335781662795e-22, -0.11947622640071e-22, 0.18228094581404e-23,
  -0.93537087292458e-25,
];

/**
 * Liquid water density from IAPWS-IF97 Region 1 (R7-97 eq. 7: v = π·γ_π·R·T/p).
 * @param temperatureK temperature, K (273.15–623.15)
 * @param pressurePa absolute pressure, Pa (≥ saturation pressure)
 */
export function if97Region1Density(temperatureK: number, pressurePa: number): number {
  requireInRange("temperatureK", temperatureK, 273.15, 623.15);
  requirePositive("pressurePa", pressurePa);
  const pi = pressurePa / 16.53e6;
  const tau = 1386 / temperatureK;
  const a = 7.1 - pi;
  const b = tau - 1.222;
  let gammaPi = 0;
  for (let k = 0; k < 34; k++) {
    const I = R1_I[k];
    if (I === 0) continue;
    gammaPi -= R1_N[k] * I * Math.pow(a, I - 1) * Math.pow(b, R1_J[k]);
  }
  const v = (pi * gammaPi * R_IF97 * temperatureK) / pressurePa;
  return 1 / v;
}

// IAPWS-IF97 Region 4 coefficients n1..n10 (R7-97(2012), Table 34).
const N4 = [
  0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.1202082470247e5,
  -0.32325550322333e7, 0.1491510861353e2, -0.48232657361591e4, 0.40511340542057e6,
  -0.23855557567849, 0.65017534844798e3,
];

/**
 * Saturation (vapour) pressure of water, IAPWS-IF97 Region 4 (R7-97 eq. 30).
 * Valid 273.15–647.096 K.
 * @param temperatureK temperature, K
 */
export function if97SaturationPressure(temperatureK: number): number {
  requireInRange("temperatureK", temperatureK, 273.15, 647.096);
  const T = temperatureK;
  const theta = T + N4[8] / (T - N4[9]);
  const A = theta * theta + N4[0] * theta + N4[1];
  const B = N4[2] * theta * theta + N4[3] * theta + N4[4];
  const C = N4[5] * theta * theta + N4[6] * theta + N4[7];
  const x = (2 * C) / (-B + Math.sqrt(B * B - 4 * A * C));
  return x * x * x * x * 1e6; // MPa → Pa
}

// IAPWS R12-08 viscosity coefficients (Tables 1 and 2).
const T_CRIT = 647.096; // K
const RHO_CRIT = 322; // kg/m³
const H0 = [1.67752, 2.20462, 0.6366564, -0.241605];
const H1_I = [0, 1, 2, 3, 0, 1, 2, 3, 5, 0, 1, 2, 3, 4, 0, 1, 0, 3, 4, 3, 5];
const H1_J = [0, 0, 0, 0, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 4, 4, 5, 6, 6];
const H1 = [
  0.520094, 0.0850895, -1.08374, -0.289555, 0.222531, 0.999115, 1.88797, 1.26613, 0.120573,
  -0.281378, -0.906851, -0.772479, -0.489837, -0.25704, 0.161913, 0.257399, -0.0325372,
  0.0698452, 0.00872102, -0.00435673, -0.000593264,
];

/**
 * Water dynamic viscosity, IAPWS R12-08 eqs. 10–12 with μ₂ = 1 (no critical enhancement).
 * @param temperatureK temperature, K
 * @param density density, kg/m³
 */
export function iapwsViscosity(temperatureK: number, density: number): number {
  requirePositive("temperatureK", temperatureK);
  requirePositive("density", density);
  const Tr = temperatureK / T_CRIT;
  const rr = density / RHO_CRIT;
  let s0 = 0;
  for (let i = 0; i < 4; i++) s0 += H0[i] / Math.pow(Tr, i);
  const mu0 = (100 * Math.sqrt(Tr)) / s0;
  const x = 1 / Tr - 1;
  const y = rr - 1;
  let s1 = 0;
  for (let k = 0; k < H1.length; k++) s1 += H1[k] * Math.pow(x, H1_I[k]) * Math.pow(y, H1_J[k]);
  const mu1 = Math.exp(rr * s1);
  return 1e-6 * mu0 * mu1;
}

/** Lowest and highest water temperature accepted, °C. Results above 100 °C carry no fixture check. */
export const WATER_RANGE_C = { min: 0, max: 100 } as const;

/**
 * Liquid water properties at 101.325 kPa (or at saturation pressure above 99.97 °C).
 * Sources: IAPWS-IF97 Region 1 (density), IAPWS R12-08 (viscosity), IAPWS-IF97 Region 4
 * (vapour pressure); see the module comment for accuracy vs IAPWS-95.
 * @param temperatureC temperature, °C (0–100)
 */
export function waterProperties(temperatureC: number): WaterProperties {
  requireFinite("temperatureC", temperatureC);
  if (temperatureC < WATER_RANGE_C.min || temperatureC > WATER_RANGE_C.max) {
    throw new EngineInputError(
      "temperatureC",
      `water properties cover ${qtBound("temperature", WATER_RANGE_C.min, [temperatureC], "min")}–${qtBound("temperature", WATER_RANGE_C.max, [temperatureC], "max")} (got ${qtExact("temperature", temperatureC, [WATER_RANGE_C.min, WATER_RANGE_C.max])}); use a user-defined fluid`, // the value read apart from the ends it is outside (100.04 °C never "100 °C")
    );
  }
  const T = temperatureC + 273.15;
  const vaporPressure = if97SaturationPressure(T);
  const pressure = Math.max(STANDARD_ATMOSPHERE, vaporPressure);
  const density = if97Region1Density(T, pressure);
  const dynamicViscosity = iapwsViscosity(T, density);
  return {
    density,
    dynamicViscosity,
    kinematicViscosity: dynamicViscosity / density,
    vaporPressure,
    pressure,
  };
}

/** How a fluid is chosen: water by temperature, or user-defined constant properties. */
export type FluidSpec =
  | { kind: "water" }
  | {
      kind: "custom";
      /** Display name. */
      name: string;
      /** kg/m³ */
      density: number;
      /** Pa·s */
      dynamicViscosity: number;
      /** Pa (absolute) */
      vaporPressure: number;
    };

/**
 * Fluid state at a temperature: water from IAPWS formulations, or a user-defined fluid
 * (its properties are taken as given, independent of temperature).
 * @param spec fluid choice (unitless descriptor; custom values in kg/m³, Pa·s, Pa)
 * @param temperatureC temperature, °C (used for water; recorded in the name otherwise)
 */
export function fluidAt(spec: FluidSpec, temperatureC: number): Fluid {
  requireFinite("temperatureC", temperatureC);
  if (spec.kind === "water") {
    const w = waterProperties(temperatureC);
    return {
      name: `Water ${qt("temperature", temperatureC)}`,
      density: w.density,
      dynamicViscosity: w.dynamicViscosity,
      kinematicViscosity: w.kinematicViscosity,
      vaporPressure: w.vaporPressure,
    };
  }
  if (spec.kind !== "custom") throw new EngineInputError("spec.kind", "must be 'water' or 'custom'");
  return customFluid(spec.name, spec.density, spec.dynamicViscosity, spec.vaporPressure);
}

/**
 * The liquid temperatures a fluid's properties are computed for, °C: for water the range of its property
 * formulations ({@link WATER_RANGE_C}, the one source every form's limit reads); null for a user-defined fluid,
 * whose properties are taken as given whatever the temperature.
 * @param spec fluid choice (unitless descriptor: only its kind is read)
 */
export function fluidTemperatureRangeC(spec: { kind: FluidSpec["kind"] }): { min: number; max: number } | null {
  if (spec?.kind === "water") return { min: WATER_RANGE_C.min, max: WATER_RANGE_C.max };
  if (spec?.kind === "custom") return null;
  throw new EngineInputError("spec.kind", "must be 'water' or 'custom'");
}

/**
 * Builds a user-defined fluid.
 * @param name display name (unitless text)
 * @param density density, kg/m³
 * @param dynamicViscosity dynamic viscosity, Pa·s
 * @param vaporPressure vapour pressure (absolute), Pa
 */
export function customFluid(
  name: string,
  density: number,
  dynamicViscosity: number,
  vaporPressure: number,
): Fluid {
  requirePositive("density", density);
  requirePositive("dynamicViscosity", dynamicViscosity);
  requireNonNegative("vaporPressure", vaporPressure);
  return {
    name: String(name || "User fluid"),
    density,
    dynamicViscosity,
    kinematicViscosity: dynamicViscosity / density,
    vaporPressure,
  };
}

/**
 * Validates a {@link Fluid} object (e.g. one built by the UI) and returns it.
 * @param fluid fluid with SI properties (kg/m³, Pa·s, m²/s, Pa)
 */
export function checkFluid(fluid: Fluid): Fluid {
  if (!fluid || typeof fluid !== "object") throw new EngineInputError("fluid", "is required");
  requirePositive("fluid.density", fluid.density);
  requirePositive("fluid.dynamicViscosity", fluid.dynamicViscosity);
  requirePositive("fluid.kinematicViscosity", fluid.kinematicViscosity);
  requireNonNegative("fluid.vaporPressure", fluid.vaporPressure);
  return fluid;
}
