// Per-cent limits of the services that decide a verdict or a refusal: judged to 1 part in 10⁸ of the limit (engine
// LIMIT_ROUNDING), so a value called past prints apart from the limit beside it (decision "pctlimit"). Check values: the
// duty check's 3 % (our rule, duty-check.ts); the life-cycle rates' ranges, escalation −50 % to 100 %, discount 0 % to 100 %
// a year (our rules, lcc-ranges.ts); the default system (system-input.ts). Values past a limit are limit × (1 ± k·10⁻⁸).
import * as v from "valibot";
import { describe, expect, it } from "vitest";
import { inSI } from "~/engine/quantityText";
import { DEFAULT_ENERGY_SETTINGS, EnergySettingsSchema } from "./energy";
import { readEnergyForm } from "./energy-form";
import { defaultSystemInput, evaluateSystem } from "./hydraulics";
import { DISCOUNT_RANGE, ESCALATION_RANGE, type RateRange } from "./lcc-ranges";

/** The number a per-cent text says ("−" read as a sign, thin spaces of groups dropped). */
const said = (t: string) => Number(t.replace("−", "-").replace(/[\s\u202f]/g, "").replace(/^\+/, ""));

describe("the duty check's 3 %: judged to 1 part in 10⁸, the difference printed apart from 3 %", () => {
  const base = defaultSystemInput();
  const G = evaluateSystem(base).dutyCheck!.governingHead;
  const check = (difference: number) => evaluateSystem({ ...base, duty: { ...base.duty!, head: G * (1 + difference) } }).dutyCheck!;
  for (const side of [1, -1]) {
    it(`${side > 0 ? "+" : "−"}3 %: agrees at 3 % and within the allowance; differs just past, its words apart`, () => {
      expect(check(side * 0.03 * (1 - 1e-6)).differs).toBe(false);
      expect(check(side * 0.03).differs).toBe(false);
      expect(check(side * 0.03 * (1 + 5e-9)).differs).toBe(false); // was "differs by +3.000000 % … More than 3 % apart" (1e-9 allowance)
      expect(check(side * 0.03 * (1 + 0.99e-8)).differs).toBe(false);
      for (const k of [1.01e-8, 2e-8, 1e-7, 1e-6]) {
        const c = check(side * 0.03 * (1 + k));
        expect(c.differs, `${k}`).toBe(true);
        const m = /differs by ([−+]?[\d.]+) %/.exec(inSI(c.message))!;
        expect(Math.abs(said(m[1])), `${k}: ${m[0]}`).toBeGreaterThan(3); // 2e-8 read "+3.000000 %"
        expect(Math.sign(said(m[1])), m[0]).toBe(side);
      }
    });
  }
});

describe("the life-cycle rates' ends: taken to 1 part in 10⁸ (as the end), refused past it with the rate apart from the end", () => {
  const schema = (r: RateRange, x: number) => v.safeParse(EnergySettingsSchema, { ...DEFAULT_ENERGY_SETTINGS, [r === ESCALATION_RANGE ? "escalation" : "discountRate"]: x });
  const form = (r: RateRange, pct: string) => {
    const m = new Map(Object.entries({ "energy.control": "fixed-speed", "energy.profileKind": "common-practice", "energy.years": "20", "energy.escalation": "2", "energy.discount": "5", [r === ESCALATION_RANGE ? "energy.escalation" : "energy.discount"]: pct }));
    const errors: Record<string, string> = {};
    const out = readEnergyForm({ get: (k) => m.get(k) ?? null }, errors);
    return { out: r === ESCALATION_RANGE ? out.escalation : out.discountRate, error: Object.values(errors)[0] };
  };
  const ENDS: [string, RateRange, number, 1 | -1][] = [["escalation 100 %", ESCALATION_RANGE, 1, 1], ["escalation −50 %", ESCALATION_RANGE, -0.5, -1], ["discount 100 %", DISCOUNT_RANGE, 1, 1]];
  for (const [name, r, end, side] of ENDS) {
    it(`${name}: the end and within the allowance taken as the end; past it refused, "not …" apart from the end`, () => {
      for (const x of [end, end + side * Math.abs(end) * 1e-12, end + side * Math.abs(end) * 0.99e-8]) {
        const p = schema(r, x);
        expect(p.success, `${x}`).toBe(true); // 1 + 1e-12 was refused "not 100.000000 %"
        expect(p.success && (r === ESCALATION_RANGE ? p.output.escalation : p.output.discountRate)).toBe(end);
      }
      for (const k of [1.01e-8, 2e-8, 1e-7]) {
        const x = end + side * Math.abs(end) * k;
        const p = schema(r, x);
        expect(p.success, `${x}`).toBe(false);
        const m = /, not ([−\d.\u202f]+) %; check/.exec(p.issues![0].message)!;
        expect(Math.sign(said(m[1]) - end * 100), `${k}: ${m[0]}`).toBe(side);
      }
      // The form, typed in per cent: the same ends.
      const typed = (end * 100 + side * Math.abs(end * 100) * 0.5e-8).toFixed(12);
      expect(form(r, typed)).toEqual({ out: end, error: undefined });
      const past = form(r, (end * 100 + side * Math.abs(end * 100) * 2e-8).toFixed(12));
      expect(past.error).toMatch(/, not [−\d.\u202f]+ %; check/);
      expect(Math.sign(said(/, not ([−\d.\u202f]+) %/.exec(past.error!)![1]) - end * 100), past.error).toBe(side);
    });
  }
  it("discount 0 %: 0 taken, −1e-12 refused and printed apart from zero ('not −1.00e-10 %')", () => {
    expect(schema(DISCOUNT_RANGE, 0).success).toBe(true);
    const p = schema(DISCOUNT_RANGE, -1e-12);
    expect(p.issues?.[0].message).toBe("Discount rate is too low: it takes from 0 % to 100 % a year, not −1.00e-10 %; check the value.");
  });
});
