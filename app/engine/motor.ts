/**
 * Motor and energy.
 * - Motor ratings: the standard series of rated outputs for low-voltage induction motors
 *   (IEC 60034-1 / IEC 60072-1 preferred outputs, kW; from memory — check the standard).
 * - Suggested rating: the smallest standard rating whose rating × service factor covers the
 *   largest shaft power anywhere on the pump curve up to its last published point
 *   (non-overloading selection, common practice), and never less than the duty power.
 * - Motor efficiency: nominal efficiency by IE class at 50 Hz, 2- and 4-pole, from the
 *   IEC 60034-30-1:2014 tables (from memory; check the standard for a contract). Valid
 *   0.12–1000 kW, the standard's range; below 0.12 kW (outside it) the 0.12 kW value is used
 *   with a warning; 200 kW and above use the 200 kW value (the standard's values stay constant
 *   there). A rating between two table entries takes the lower entry's efficiency, with a
 *   warning (the standard interpolates intermediate outputs; that formula is not applied here).
 *   Full-load values are used at every load (part-load efficiency is lower: the energy is
 *   slightly understated below about 50 % load).
 * - Drive (VFD) losses when a speed is set: drive efficiency 97 % (common practice for
 *   low-voltage PWM drives at rated load, from memory).
 * - Electrical input P_el = P_shaft / (η_motor · η_drive); energy per year = P_el × hours;
 *   cost = kWh × tariff in the workspace's currency.
 */
import { EngineInputError, requireNonNegative, requirePositive, type EngineWarning } from "./errors.ts";
import { LIMIT_ROUNDING, qt, qtExact, qtLimit } from "./quantityText.ts";

/** Standard rated outputs, kW (IEC 60034-1 / IEC 60072-1 series, from memory). */
export const IEC_MOTOR_RATINGS_KW: readonly number[] = [
  0.06, 0.09, 0.12, 0.18, 0.25, 0.37, 0.55, 0.75, 1.1, 1.5, 2.2, 3, 4, 5.5, 7.5, 11, 15, 18.5, 22, 30, 37, 45, 55, 75, 90,
  110, 132, 160, 200, 250, 315, 355, 400, 450, 500, 560, 630, 710, 800, 900, 1000,
];

export const MOTOR_RATINGS_SOURCE = "IEC 60034-1 / IEC 60072-1 standard rated outputs (from memory)";

export type IeClass = "IE2" | "IE3" | "IE4";
export const IE_CLASSES: readonly IeClass[] = ["IE2", "IE3", "IE4"];
export const DEFAULT_IE_CLASS: IeClass = "IE3";

/** Typical drive (VFD) efficiency at rated load, fraction (common practice, from memory). */
export const DEFAULT_DRIVE_EFFICIENCY = 0.97;

export const MOTOR_EFFICIENCY_SOURCE = "IEC 60034-30-1:2014 nominal efficiencies, 50 Hz (from memory)";

/**
 * Rated outputs of the efficiency table, kW: the standard's from 0.12 kW (0.20 and 0.40 kW are in its tables though not in
 * IEC_MOTOR_RATINGS_KW) to 200 kW (its values stay constant from 200 to 1000 kW).
 */
export const IE_TABLE_KW: readonly number[] = [0.12, 0.18, 0.2, 0.25, 0.37, 0.4, 0.55, 0.75, 1.1, 1.5, 2.2, 3, 4, 5.5, 7.5, 11, 15, 18.5, 22, 30, 37, 45, 55, 75, 90, 110, 132, 160, 200];
/**
 * Nominal efficiencies in %, by poles and class, one per IE_TABLE_KW entry: IEC 60034-30-1:2014, the 50 Hz tables for IE2,
 * IE3 and IE4 (from memory — verify against the standard; Tables 3, 5 and 7 by a numbering remembered unsurely).
 * 0.12–0.55 kW (the first seven values of each row), from memory — verify against the standard: IE2 and IE3, 2- and 4-pole,
 * remembered with confidence; IE4 at 0.12–0.55 kW, 2- and 4-pole, less surely (check those first). 0.75 kW up as before.
 */
export const IE_EFFICIENCY_TABLE: Record<2 | 4, Record<IeClass, readonly number[]>> = {
  2: {
    IE2: [53.6, 60.4, 61.9, 64.8, 69.5, 70.4, 74.1, 77.4, 79.6, 81.3, 83.2, 84.6, 85.8, 87.0, 88.1, 89.4, 90.3, 90.9, 91.3, 92.0, 92.5, 92.9, 93.2, 93.8, 94.1, 94.3, 94.6, 94.8, 95.0],
    IE3: [60.8, 65.9, 67.2, 69.7, 73.8, 74.6, 77.8, 80.7, 82.7, 84.2, 85.9, 87.1, 88.1, 89.2, 90.1, 91.2, 91.9, 92.4, 92.7, 93.3, 93.7, 94.0, 94.3, 94.7, 95.0, 95.2, 95.4, 95.6, 95.8],
    IE4: [66.5, 70.8, 71.9, 74.3, 78.1, 78.9, 81.5, 83.5, 85.2, 86.5, 88.0, 89.1, 90.0, 90.9, 91.7, 92.6, 93.3, 93.7, 94.0, 94.5, 94.8, 95.0, 95.3, 95.6, 95.8, 96.0, 96.2, 96.3, 96.5],
  },
  4: {
    IE2: [59.1, 64.7, 65.9, 68.5, 72.7, 73.5, 77.1, 79.6, 81.4, 82.8, 84.3, 85.5, 86.6, 87.7, 88.7, 89.8, 90.6, 91.2, 91.6, 92.3, 92.7, 93.1, 93.5, 94.0, 94.2, 94.5, 94.7, 94.9, 95.1],
    IE3: [64.8, 69.9, 71.1, 73.5, 77.3, 78.0, 80.8, 82.5, 84.1, 85.3, 86.7, 87.7, 88.6, 89.6, 90.4, 91.4, 92.1, 92.6, 93.0, 93.6, 93.9, 94.2, 94.6, 95.0, 95.2, 95.4, 95.6, 95.8, 96.0],
    IE4: [69.8, 74.7, 75.8, 77.9, 81.1, 81.7, 83.9, 85.7, 87.2, 88.2, 89.5, 90.4, 91.1, 91.9, 92.6, 93.3, 93.9, 94.2, 94.5, 94.9, 95.2, 95.4, 95.7, 96.0, 96.1, 96.3, 96.4, 96.6, 96.7],
  },
};

const LARGEST_RATING = IEC_MOTOR_RATINGS_KW[IEC_MOTOR_RATINGS_KW.length - 1] * 1000;

/**
 * Relative slack in "a motor limit covers a power" (dimensionless): rounding only. 11 kW × service factor 1.15
 * computes as 12 649.999… W, and a largest power of 12 650 W is covered by it, as 12 650 W / 1.15 picks 11 kW. The app's
 * allowance at a judged limit (quantityText.ts `LIMIT_ROUNDING`, 1 part in 10⁸): a power further above prints apart from
 * the limit in the overload's words (at 1 part in 10⁹, 2 parts above 1.1 kW read "one pump takes 1.10000000 kW, above
 * motor rating × service factor 1.10 kW").
 */
export const COVERS_SLACK = LIMIT_ROUNDING;

/**
 * A motor's limit, rating × service factor, W, without floating-point noise: 11 kW × 1.15 is 12 650 W, not 12 649.999… W
 * (which would show as "12.6 kW" beside a largest power of "12.7 kW" it covers).
 * @param rating motor rated output, W
 * @param serviceFactor service factor (dimensionless)
 */
export function motorLimit(rating: number, serviceFactor: number): number {
  return Number((requirePositive("rating", rating) * requirePositive("serviceFactor", serviceFactor)).toPrecision(12));
}

/**
 * Whether a motor limit covers a power: the one rule of the suggestion and of the overload check, so a suggested motor is
 * never judged to overload on the power it was suggested for.
 * @param limit motor rating × service factor, W
 * @param power shaft power, W
 */
export function limitCovers(limit: number, power: number): boolean {
  return requireNonNegative("power", power) <= requirePositive("limit", limit) * (1 + COVERS_SLACK);
}
/** The standard rating below one of the series, W (0 below the smallest). */
const previousRating = (rating: number) => (IEC_MOTOR_RATINGS_KW.filter((r) => r * 1000 < rating * (1 - 1e-9)).pop() ?? 0) * 1000;

/**
 * The smallest standard rating ≥ a power, W (null above the largest in the series).
 * @param power power to cover, W
 */
export function nextStandardRating(power: number): number | null {
  return ratingCovering(requireNonNegative("power", power), 1);
}

/** The smallest standard rating, W, whose rating × service factor covers a power, W (`limitCovers`); null above the series. */
function ratingCovering(power: number, sf: number): number | null {
  for (const r of IEC_MOTOR_RATINGS_KW) if (limitCovers(motorLimit(r * 1000, sf), power)) return r * 1000;
  return null;
}

export interface MotorSuggestion {
  /** Suggested rating, W (null when above the series). */
  rating: number | null;
  /** Power the rating × service factor must cover, W (the larger of duty and curve maximum). */
  covers: number;
  serviceFactor: number;
  /** Why, in words with the numbers. */
  basis: string;
  source: string;
}

/**
 * Suggests a motor rating from the standard series (non-overloading over the whole curve).
 * @param input.dutyPower shaft power at the duty, W
 * @param input.maxCurvePower largest shaft power anywhere on the curve up to its end, W (null: unknown)
 * @param input.maxCurvePowerUpTo flow up to which that largest power is known, m³/s, when the power data stops before the curve's end (null or absent: to the end)
 * @param input.maxCurvePowerFrom flow from which that largest power is known, m³/s, when the power data starts after the curve's first flow (null or absent: from its start)
 * @param input.serviceFactor service factor (dimensionless, 1.0–1.5; default 1.0)
 */
export function suggestMotor(input: { dutyPower: number; maxCurvePower: number | null; maxCurvePowerUpTo?: number | null; maxCurvePowerFrom?: number | null; serviceFactor?: number }): MotorSuggestion {
  if (!input || typeof input !== "object") throw new EngineInputError("input", "is required");
  const duty = requireNonNegative("dutyPower", input.dutyPower);
  const max = input.maxCurvePower == null ? null : requireNonNegative("maxCurvePower", input.maxCurvePower);
  const sf = requirePositive("serviceFactor", input.serviceFactor ?? 1);
  if (sf < 1 || sf > 1.5) throw new EngineInputError("serviceFactor", "must be between 1.0 and 1.5");
  const covers = Math.max(duty, max ?? 0);
  const rating = ratingCovering(covers, sf);
  const upTo = input.maxCurvePowerUpTo == null ? null : requirePositive("maxCurvePowerUpTo", input.maxCurvePowerUpTo);
  const from = input.maxCurvePowerFrom == null ? null : requireNonNegative("maxCurvePowerFrom", input.maxCurvePowerFrom);
  const reach = from === null
    ? upTo === null ? "to its end" : `up to ${qt("flow", upTo)} (power known no further: not checked to the curve's end)`
    : upTo === null ? `from ${qt("flow", from)} to its end (power not known below ${qt("flow", from)}: not checked there)`
    : `from ${qt("flow", from)} up to ${qt("flow", upTo)} (power known only there: not checked below it or to the curve's end)`;
  // The power covered never reads as the rating × service factor that fell short of it (7500.4 W is not "7.50 kW" beside an 11 kW pick).
  const lower = rating === null ? motorLimit(LARGEST_RATING, sf) : previousRating(rating) * sf;
  const covered = (p: number) => qtExact("power", p, [lower]);
  const what = max !== null && max > duty
    ? `largest power on the curve ${reach} ${covered(max)} (duty ${qt("power", duty)})`
    : `duty power ${covered(duty)}${max === null ? " (curve maximum unknown: not checked for overload)" : ""}`;
  const basis = rating === null
    ? `${what} is above the largest standard rating (${sf === 1 ? qtLimit("power", LARGEST_RATING, [covers]) : `${qt("power", LARGEST_RATING)} × service factor ${sf} = ${qtLimit("power", lower, [covers])}`})`
    : `${qt("power", rating)} is the smallest standard rating whose rating × service factor ${sf} = ${qt("power", motorLimit(rating, sf))} covers the ${what}`;
  return { rating, covers, serviceFactor: sf, basis, source: MOTOR_RATINGS_SOURCE };
}

/**
 * Nominal motor efficiency by IE class (fraction), IEC 60034-30-1 table (from memory).
 * @param rating motor rated output, W
 * @param ieClass efficiency class "IE2" | "IE3" | "IE4" (unitless)
 * @param poles 2 or 4 (count)
 */
export function motorEfficiency(rating: number, ieClass: IeClass = DEFAULT_IE_CLASS, poles: 2 | 4 = 4): { efficiency: number; warnings: EngineWarning[] } {
  const kw = requirePositive("rating", rating) / 1000;
  if (!IE_CLASSES.includes(ieClass)) throw new EngineInputError("ieClass", `must be one of ${IE_CLASSES.join(", ")}`);
  if (poles !== 2 && poles !== 4) throw new EngineInputError("poles", "must be 2 or 4");
  const row = IE_EFFICIENCY_TABLE[poles][ieClass];
  const warnings: EngineWarning[] = [];
  if (kw > 1000) throw new EngineInputError("rating", `is above ${qt("power", 1e6)}, the end of the IEC 60034-30-1 table`);
  const pct = (j: number) => `${row[j].toFixed(1)} %`;
  // The rating and the table's entries beside it read apart in any unit ("7.38 hp lies between 7.38 hp and 10.1 hp" was
  // a typed 7.38 hp, 5503 W, beside the 5.5 kW entry).
  const w = kw * 1000;
  const entry = (j: number) => qtLimit("power", IE_TABLE_KW[j] * 1000, [w]);
  const at = (j: number) => `${entry(j)} (${pct(j)})`;
  // Outside the standard's range (below 0.12 kW): its smallest entry, which overstates a smaller motor's efficiency.
  // A rating within LIMIT_ROUNDING (1 part in 10⁸, the words' digits) of an entry is at it; further off, it prints apart from it.
  if (kw < IE_TABLE_KW[0] * (1 - LIMIT_ROUNDING)) warnings.push({ code: "motor-below-table", parameter: "rating", message: `motor ${qtExact("power", w, [IE_TABLE_KW[0] * 1000])} is below the IEC 60034-30-1 table, which starts at ${entry(0)}: its ${pct(0)} is used (a smaller motor's efficiency is lower: energy understated)` });
  // The table's own step: a rating between two entries takes the lower entry (the standard interpolates; this is conservative).
  let i = 0;
  while (i + 1 < IE_TABLE_KW.length && IE_TABLE_KW[i + 1] <= kw * (1 + LIMIT_ROUNDING)) i++;
  const between = kw > IE_TABLE_KW[i] * (1 + LIMIT_ROUNDING) && i + 1 < IE_TABLE_KW.length;
  if (between) warnings.push({ code: "motor-between-table", parameter: "rating", message: `motor ${qtExact("power", w, [IE_TABLE_KW[i] * 1000, IE_TABLE_KW[i + 1] * 1000])} lies between the IEC 60034-30-1 table's ${at(i)} and ${at(i + 1)}: the lower entry's ${pct(i)} is used (conservative; the standard's interpolation for intermediate outputs is not applied)` });
  return { efficiency: row[i] / 100, warnings };
}

/**
 * Poles for a pump speed on a 50 Hz supply: 2-pole above 2 200 rpm, else 4-pole (common practice).
 * @param speed pump speed, rpm (null: 4-pole assumed)
 */
export function polesForSpeed(speed: number | null): 2 | 4 {
  if (speed === null) return 4;
  return requirePositive("speed", speed) > 2200 ? 2 : 4;
}

export interface EnergyFigures {
  /** Electrical input, W. */
  electricalPower: number;
  motorEfficiency: number;
  /** Null without a drive. */
  driveEfficiency: number | null;
  /** kWh per year. */
  annualEnergyKWh: number;
  /** Currency per year. */
  annualCost: number;
}

/**
 * Energy and cost per year from the electrical input.
 * @param input.shaftPower shaft power, W
 * @param input.motorEfficiency motor efficiency, fraction
 * @param input.driveEfficiency drive efficiency, fraction (null: no drive)
 * @param input.hoursPerYear running hours per year, h
 * @param input.tariffPerKWh tariff, currency per kWh
 */
export function annualEnergy(input: { shaftPower: number; motorEfficiency: number; driveEfficiency: number | null; hoursPerYear: number; tariffPerKWh: number }): EnergyFigures {
  if (!input || typeof input !== "object") throw new EngineInputError("input", "is required");
  const p = requireNonNegative("shaftPower", input.shaftPower);
  const me = requirePositive("motorEfficiency", input.motorEfficiency);
  const de = input.driveEfficiency === null ? null : requirePositive("driveEfficiency", input.driveEfficiency);
  if (me > 1) throw new EngineInputError("motorEfficiency", "is a fraction 0–1");
  if (de !== null && de > 1) throw new EngineInputError("driveEfficiency", "is a fraction 0–1");
  const hours = requireNonNegative("hoursPerYear", input.hoursPerYear);
  if (hours > 8784) throw new EngineInputError("hoursPerYear", "cannot exceed 8784 h");
  const tariff = requireNonNegative("tariffPerKWh", input.tariffPerKWh);
  const electricalPower = p / (me * (de ?? 1));
  const annualEnergyKWh = (electricalPower * hours) / 1000;
  return { electricalPower, motorEfficiency: me, driveEfficiency: de, annualEnergyKWh, annualCost: annualEnergyKWh * tariff };
}
