/**
 * Per-cent limits that decide a verdict: a value judged past its limit by more than 1 part in 10⁸ (LIMIT_ROUNDING) prints
 * apart from the limit beside it, and one within it is judged as the limit (decision "pctlimit"). Check values: the
 * preferred operating region 70–120 % of BEP flow (ANSI/HI 9.6.3, from memory; pumpCurve.ts POR_FRACTION); the
 * escalation's plausibility ±15 %/year (common practice, from memory; lifeCycleCost.ts); the other thresholds as named
 * beside them in their files; the 10 % light load (dutyCycle.ts MOTOR_PART_LOAD, its table's first entry). Values past a limit are made up: limit × (1 ± k·10⁻⁸).
 */
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy, fluidAt, lifeCycleCost, operatingFigures } from "./index.ts";
import { fmtPctExact, fmtPctLimit, fmtPctSignedExact } from "./quantityText.ts";
import { knotCycle, samplePoints } from "./test/curves.ts";

/** The number a per-cent text says (the true minus read as a sign; "—" none). */
const said = (t: string) => Number(t.replace("−", "-").replace(/\s*%.*$/, "").replace(/^\+/, ""));

/** Every per-cent threshold a verdict or a refusal judges against, with the file that judges it (fractions). */
const LIMITS: [string, number][] = [
  ["duty check 3 % (lib/projects/duty-check.ts)", 0.03],
  ["motor light load 10 % (dutyCycle.ts)", 0.1],
  ["escalation ±15 %/year (lifeCycleCost.ts)", 0.15],
  ["a step below 50 % of BEP flow (stepPor.ts)", 0.5],
  ["POR 70 % (pumpCurve.ts)", 0.7],
  ["POR 120 %", 1.2],
  ["a rate's 100 % (lcc-ranges.ts), a motor's rating", 1],
  ["a service factor 115 % (typed)", 1.15],
  ["a step's 150 % (energy.ts)", 1.5],
  ["escalation −50 % (lcc-ranges.ts)", 0.5],
  ["ISO 9906 grade 2B ±8 % flow, +4 % power, −3 % efficiency (fieldCheck.ts, power-grade.ts)", 0.08],
  ["a grade's +4 %", 0.04],
  ["a trim of 25 % (affinity.ts)", 0.25],
];
/** Leading digits and decades: every limit from 0.001 % to 999 %. */
const SWEPT: number[] = [];
for (let e = -5; e <= 0; e++) for (let m = 1; m < 10; m += 0.37) SWEPT.push(Number((m * 10 ** e).toPrecision(4)));
/** How far past, in parts of the limit: just past the allowance (1.01e-8) out to 1e-6. */
const PAST = [1.01e-8, 1.5e-8, 2e-8, 5e-8, 1e-7, 1e-6];

describe("a per-cent value judged past its limit prints apart from the limit, on the judged side", () => {
  it("every threshold named, both sides, 0 and 1 decimals at the least (3.00000006 % beside 3 %, not 3.000000 %)", () => {
    const wrong: string[] = [];
    for (const [name, limit] of [...LIMITS, ...SWEPT.map((l): [string, number] => [`swept ${l}`, l])]) {
      const shownLimit = said(fmtPctLimit(limit));
      for (const k of PAST) for (const side of [1, -1]) for (const digits of [0, 1]) {
        const x = limit * (1 + side * k);
        const t = fmtPctExact(x, [limit], digits);
        const s = fmtPctSignedExact(-x, [limit]);
        if (Math.sign(said(t) - shownLimit) !== side) wrong.push(`${name}: ${x} → "${t}" beside "${fmtPctLimit(limit)}"`);
        if (Math.sign(-said(s) - shownLimit) !== side) wrong.push(`${name} signed: ${-x} → "${s}" beside "−${fmtPctLimit(limit)}"`);
      }
    }
    expect(wrong.slice(0, 5), `${wrong.length} read as their limit or past it on the wrong side`).toEqual([]);
  });
  it("a limit prints with the digits a value beside it gets (9 significant: 123.456789 %, not 123.456789 rounded to 6 decimals)", () => {
    expect(fmtPctLimit(1.23456789)).toBe("123.456789 %");
    expect(fmtPctLimit(0.0123456789)).toBe("1.23456789 %"); // was "1.234568 %": a value at 1.23456790 % read below it
    expect(fmtPctLimit(0.03)).toBe("3 %");
    expect(fmtPctLimit(1.155)).toBe("115.5 %");
    const x = 0.0123456789 * (1 + 2e-8);
    expect(said(fmtPctExact(x, [0.0123456789]))).toBeGreaterThan(said(fmtPctLimit(0.0123456789)));
  });
});

describe("a per-cent value too small for the decimals: one rule, exponent form, never a bound in words", () => {
  it("'2.50e-7 %', '−1.00e-7 %' signed: never '−under 0.000001 %'", () => {
    expect(fmtPctExact(2.5e-9, [0.7, 1.2], 0)).toBe("2.50e-7 %");
    expect(fmtPctSignedExact(-1e-9, [0])).toBe("−1.00e-7 %"); // was "−under 0.000001 %"
    expect(fmtPctSignedExact(1e-9, [0.03], true)).toBe("+0.0000001 %"); // beside 3 %, 8 decimals: was "+under 0.000001 %"
    expect(fmtPctSignedExact(1e-12, [0.03], true)).toBe("+1.00e-10 %");
    expect(fmtPctExact(-1e-12)).toBe("−1.00e-10 %");
    expect(fmtPctExact(3e-8, [0.7, 1.2], 0)).toBe("0.000003 %");
    for (const x of [1e-9, -1e-9, 4.9e-9, -1e-15]) expect(fmtPctSignedExact(x, [0.03], true)).not.toMatch(/under|less/);
  });
});

describe("POR 70–120 % of BEP flow (operatingFigures): judged to 1 part in 10⁸, its words apart from the ends", () => {
  const water = fluidAt({ kind: "water" }, 20);
  const curve = createPumpCurve({ points: samplePoints() });
  const bep = curve.bep!.flow;
  const at = (ratio: number) => operatingFigures({ curve, flow: ratio * bep, fluid: water });
  for (const [end, side] of [[0.7, -1], [1.2, 1]] as const) {
    it(`${end * 100} %: inside just within, at the end and within the allowance; outside past it, the words apart`, () => {
      expect(at(end * (1 - side * 1e-6)).inPor).toBe(true);
      expect(at(end).inPor).toBe(true);
      expect(at(end * (1 + side * 1e-12)).inPor).toBe(true); // was outside, "operating at 120.000000 % of BEP flow" (70.000000 %)
      expect(at(end * (1 + side * 0.99e-8)).inPor).toBe(true);
      for (const k of [1.01e-8, 2e-8, 1e-6]) {
        const f = at(end * (1 + side * k));
        expect(f.inPor, `${k}`).toBe(false);
        const m = /operating at ([\d.]+) % of BEP flow/.exec(f.warnings.find((w) => w.code === "outside-por")!.message)!;
        expect(Math.sign(Number(m[1]) - end * 100), `${k}: ${m[0]}`).toBe(side);
      }
    });
  }
});

describe("the escalation's plausibility, ±15 %/year (lifeCycleCost.ts): judged to 1 part in 10⁸, its words apart", () => {
  const warned = (escalation: number) => lifeCycleCost({ purchasePrice: 0, annualEnergyKWh: 1000, tariffPerKWh: 0.2, years: 2, escalation, discountRate: 0 }).warnings ?? [];
  for (const side of [1, -1]) {
    it(`${side > 0 ? "+" : "−"}15 %: not warned at it nor within the allowance; warned just past, the rate printed apart`, () => {
      expect(warned(side * 0.15)).toEqual([]);
      expect(warned(side * 0.15 * (1 + 0.99e-8))).toEqual([]);
      for (const k of [1.01e-8, 2e-8, 5e-8]) { // was not warned below 1e-7 of the rate
        const w = warned(side * 0.15 * (1 + k));
        expect(w.map((x) => x.code), `${k}`).toEqual(["implausible-escalation"]);
        const m = /tariff escalation ([−\d.]+) %\/year/.exec(w[0].message)!;
        expect(Math.abs(said(m[1])), `${k}: ${m[0]}`).toBeGreaterThan(15);
      }
    });
  }
});

describe("a motor below 10 % load at a duty-cycle step (dutyCycle.ts): judged to 1 part in 10⁸, its load printed apart", () => {
  const base = knotCycle();
  const cycle = (rating: number) => dutyCycleEnergy({ ...base, mode: "system-curve", driveEfficiency: 0.97, motor: { ...base.motor, rating }, profile: [{ flowFraction: 0.5, hours: 3000 }] });
  const shaft = cycle(750).steps[0].shaftPower!; // 75 W at half speed (the knot cycle's hand calculation, dutyCycle.test.ts)
  const light = (load: number) => cycle(shaft / load).warnings.filter((w) => w.code === "motor-very-light-load");
  it("at 10 % and within the allowance: no warning; just below it: warned, the load apart from 10 %", () => {
    for (const load of [0.1, 0.1 * (1 - 5e-9), 0.1 * (1 - 0.99e-8), 0.1 * (1 + 1e-6)]) expect(light(load), `${load}`).toEqual([]); // 1 − 5e-9 was warned as "10.000000 % load"
    for (const k of [1.01e-8, 2e-8, 1e-7]) {
      const w = light(0.1 * (1 - k));
      expect(w, `${k}`).toHaveLength(1);
      const m = /runs at ([\d.]+) % load/.exec(w[0].message)!;
      expect(Number(m[1]), `${k}: ${m[0]}`).toBeLessThan(10);
    }
  });
});
