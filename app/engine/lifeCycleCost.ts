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
 *
 * Plausibility (a warning, the cost is still computed): an escalation held over the whole period compounds, and at
 * the accepted extremes it decides the result alone (+100 %/year over 50 years: year 50's tariff 2^49 ≈ 5.6e14 ×
 * year 1's). Rule, common practice (from memory: life-cycle cost studies assume energy-price escalation of a few
 * per cent a year, which over decades compounds to a few times year 1's tariff, not orders of magnitude): beyond
 * ±15 %/year (`ESCALATION_PLAUSIBLE.rate`), or a tariff in the last year more than 10× year 1's or below a tenth of
 * it (`ESCALATION_PLAUSIBLE.growth`), the escalation is called implausible, with its numbers. (A 5× bound would flag
 * 3.5 %/year over 50 years, about the pace of nominal tariffs over past decades; 10× is first crossed at 4.8 %/year
 * over 50 years, 17.9 %/year over 15.)
 */
import { EngineInputError, requireFinite, requireInteger, requireNonNegative, type EngineWarning } from "./errors.ts";
import { fmtNumExact, fmtPctLimit, fmtPctSignedExact, pastAbove, pastBelow } from "./quantityText.ts";

export const LCC_SOURCE = "present-value method (ISO 15686-5, from memory; common practice for pump life-cycle cost): LCC = purchase + Σ C₁(1+e)^(t−1)/(1+d)^t, end-of-year costs; maintenance and disposal not included";

/** Bounds of a plausible tariff escalation (common practice, from memory; module comment): the yearly rate, and the last year's tariff over year 1's. */
export const ESCALATION_PLAUSIBLE = { rate: 0.15, growth: 10 } as const;

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
  /** The tariff escalation and discount rate it was computed with (fractions per year). Absent in selections frozen before 2026-12-03. */
  escalation?: number;
  discountRate?: number;
  /** Plausibility warnings (`implausible-escalation`), each with its rule and numbers. Absent in selections frozen before 2026-12-03. */
  warnings?: EngineWarning[];
}

/** A growth factor as read beside its limits: "5.6e14", "7.07", "0.19" (far from 1: powers of ten). */
function factorText(g: number): string {
  if (g >= 1000 || g < 0.001) return g.toExponential(1).replace("e+", "e");
  // Apart from the nearer bound only: beside 10 as well, 0.1 × (1 − 1.01e-8) read "0.1000000" (7 decimals, 10's digits).
  return fmtNumExact(g, [g >= 1 ? ESCALATION_PLAUSIBLE.growth : 1 / ESCALATION_PLAUSIBLE.growth]);
}

/**
 * The escalation's plausibility over the period (rule in the module comment): none for a single year, where it
 * changes nothing. The message names the rate, the last year's tariff as a multiple of year 1's and the bound crossed.
 */
function escalationWarnings(escalation: number, years: number): EngineWarning[] {
  if (years < 2) return [];
  const { rate, growth } = ESCALATION_PLAUSIBLE;
  const g = (1 + escalation) ** (years - 1);
  // A value within print rounding of its bound is the bound (1 part in 10⁸ of it, LIMIT_ROUNDING: fmtPctExact and
  // fmtNumExact show 9 significant digits beside it), so a value called beyond it prints apart. The growth's 1e-9 called
  // 10 × (1 + 5e-9) "more than 10× year 1's" as "10.0000001 ×"'s neighbour (helper "numtext").
  const rateOut = pastAbove(Math.abs(escalation), rate);
  const growthOut = pastAbove(g, growth) || pastBelow(g, 1 / growth);
  if (!rateOut && !growthOut) return [];
  // A falling tariff's rate with the true minus "−", as its bound beside it (fmtPctSignedExact).
  const crossed = [
    rateOut ? `${escalation > 0 ? "above" : "below"} ${escalation > 0 ? "" : "−"}${fmtPctLimit(rate)}/year` : "",
    growthOut ? (g > growth ? `more than ${growth}× year 1's` : `less than 1/${growth} of year 1's`) : "",
  ].filter(Boolean).join("; ");
  return [{
    code: "implausible-escalation",
    parameter: "escalation",
    message: `tariff escalation ${fmtPctSignedExact(escalation, [rate])}/year makes year ${years}'s energy cost ${factorText(g)} × year 1's (${crossed}): implausible as a forecast (rule, common practice from memory: within ±${fmtPctLimit(rate)}/year and year ${years}'s tariff within 1/${growth}–${growth}× year 1's); the life-cycle cost's energy part rests on it — check the escalation`,
  }];
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
  if (years > 50) throw new EngineInputError("years", `is at most 50 (got ${years})`);
  const e = requireFinite("escalation", input.escalation);
  // Each refusal with the rate refused (its per cent apart from the bound crossed), as the form's words (lib/projects/lcc-ranges.ts).
  if (e < -0.5 || e > 1) throw new EngineInputError("escalation", `must be between −50 % and +100 % per year (got ${fmtPctSignedExact(e, [e < 0 ? 0.5 : 1], true)})`);
  const d = requireFinite("discountRate", input.discountRate);
  if (d < 0 || d > 1) throw new EngineInputError("discountRate", `must be between 0 and 100 % per year (got ${fmtPctSignedExact(d, [d < 0 ? 0 : 1], true)})`);
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
  return { purchase, purchaseGiven, yearly, energyPresentValue: pv, total: purchase + pv, cumulative, source: LCC_SOURCE, escalation: e, discountRate: d, warnings: escalationWarnings(e, years) };
}
