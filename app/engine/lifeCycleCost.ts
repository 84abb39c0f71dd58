/**
 * Life-cycle cost of a pump: purchase price plus the present value of its energy cost over N years.
 *
 * Present value of a yearly cost that escalates at rate e and is discounted at rate d, each year's
 * cost counted at the end of its year (end-of-year convention):
 *   PV_energy = Σ_{t=1..N} C₁ · (1 + e)^(t−1) / (1 + d)^t,   C₁ = kWh per year × tariff (year 1)
 *   LCC = purchase + PV_energy
 * Source: the present-value method of ISO 15686-5 (life-cycle costing; from memory) and the pump
 * life-cycle-cost guides' LCC = initial cost + energy + … (common practice). Maintenance, downtime and
 * disposal are left out here. Validity: N 1–50 years, e −50…+100 %/year, d 0…100 %/year; money in the
 * workspace's currency (any one currency: the formula is unit-free).
 */
import { EngineInputError, requireFinite, requireInteger, requireNonNegative } from "./errors.ts";

export const LCC_SOURCE = "present-value method (ISO 15686-5, from memory; common practice for pump life-cycle cost): LCC = purchase + Σ C₁(1+e)^(t−1)/(1+d)^t, end-of-year costs; maintenance and disposal not included";

export interface LifeCycleInput {
  /** Purchase price (currency), null when not given (counted as 0, said in the result). */
  purchasePrice: number | null;
  /** Energy per year, kWh. */
  annualEnergyKWh: number;
  /** Tariff in year 1, currency per kWh. */
  tariffPerKWh: number;
  /** Years (whole, 1–50). */
  years: number;
  /** Tariff escalation per year, fraction (−0.5…1). */
  escalation: number;
  /** Discount rate per year, fraction (0…1). */
  discountRate: number;
}

export interface LifeCycleResult {
  purchase: number;
  purchaseGiven: boolean;
  /** Energy cost of each year, nominal and present value (currency). */
  yearly: { year: number; energyCost: number; presentValue: number }[];
  energyPresentValue: number;
  /** purchase + energyPresentValue. */
  total: number;
  /** Cumulative present-value cost at the end of year 0…N (year 0: the purchase). */
  cumulative: number[];
  source: string;
}

/**
 * Life-cycle cost in present value (see module comment for the formula and its source).
 * @param input purchase (currency), energy (kWh/year), tariff (currency/kWh), years, escalation and discount (fractions per year)
 */
export function lifeCycleCost(input: LifeCycleInput): LifeCycleResult {
  if (!input || typeof input !== "object") throw new EngineInputError("input", "is required");
  const purchaseGiven = input.purchasePrice !== null && input.purchasePrice !== undefined;
  const purchase = purchaseGiven ? requireNonNegative("purchasePrice", input.purchasePrice) : 0;
  const kwh = requireNonNegative("annualEnergyKWh", input.annualEnergyKWh);
  const tariff = requireNonNegative("tariffPerKWh", input.tariffPerKWh);
  const years = requireInteger("years", input.years, 1);
  if (years > 50) throw new EngineInputError("years", "is at most 50");
  const e = requireFinite("escalation", input.escalation);
  if (e < -0.5 || e > 1) throw new EngineInputError("escalation", "must be between −50 % and +100 % per year");
  const d = requireFinite("discountRate", input.discountRate);
  if (d < 0 || d > 1) throw new EngineInputError("discountRate", "must be between 0 and 100 % per year");
  const c1 = kwh * tariff;
  const yearly: LifeCycleResult["yearly"] = [];
  const cumulative = [purchase];
  let pv = 0;
  for (let t = 1; t <= years; t++) {
    const energyCost = c1 * (1 + e) ** (t - 1);
    const presentValue = energyCost / (1 + d) ** t;
    pv += presentValue;
    yearly.push({ year: t, energyCost, presentValue });
    cumulative.push(purchase + pv);
  }
  return { purchase, purchaseGiven, yearly, energyPresentValue: pv, total: purchase + pv, cumulative, source: LCC_SOURCE };
}
