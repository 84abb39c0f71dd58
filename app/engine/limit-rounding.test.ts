// The engine's other judged limits whose words print a value beside its limit (qtExact / qtLimit / qtPair, up to 9
// significant digits) allow the same rounding as the NPSHr ends and the maker's minimum flow (quantityText.ts
// `LIMIT_ROUNDING`, 1 part in 10⁸): a duty-cycle step's pump head below the system's at fixed speed, and a control curve's
// below it (dutyCycle.ts), a motor rating below the IEC 60034-30-1 table or between two of its entries, and a shaft power
// above motor rating × service factor (motor.ts `motorEfficiency`, `COVERS_SLACK`: the overload and the suggestion). At the
// old 1 part in 10⁹ a pump 5 parts in 10⁹ under the system's head was "not met" and a head 2 parts in 10⁹ under 20 m read
// "gives 20.0000000 m, … below the system's 20.0 m"; a 0.12 kW motor 2 parts in 10⁹ under "motor 0.120000000 kW is below
// the IEC 60034-30-1 table, which starts at 0.120 kW". Check values: the rules as each module states them; the IEC 60034-30-1 table's
// entries as the engine lists them (motor.ts); the pump is the engine's made-up sample curve; conversions by the unit table.
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy, headAt, limitCovers, motorEfficiency, UNITS, type Quantity } from "./index.ts";
import { IE_TABLE_KW } from "./motor.ts";
import { LIMIT_ROUNDING, qtPair, renderQuantities } from "./quantityText.ts";
import { boundInward, END_SLACK } from "./limitText.ts";
import { M3H, samplePoints } from "./test/curves.ts";

const curve = createPumpCurve({ points: samplePoints({ npshr: false }) });
const QB = 50 * M3H; // the sample curve's BEP flow
const MOTOR = { rating: 7500, efficiency: 0.9 };
const step = (mode: "fixed-speed" | "constant-pressure", systemHead: (q: number) => number) =>
  dutyCycleEnergy({ curve, systemHead, designFlow: QB, mode, profile: [{ flowFraction: 0.5, hours: 3000 }], density: 1000, motor: MOTOR, driveEfficiency: mode === "fixed-speed" ? null : 0.97 }).steps[0];
const codes = (kw: number) => motorEfficiency(kw * 1000).warnings.map((w) => w.code);
// Old code (1e-9): 5e-9 and 0.99e-8 past were judged past.
const EDGE = [[1e-12, false], [5e-9, false], [0.99e-8, false], [1.01e-8, true], [1e-6, true]] as const;

describe("a duty-cycle step: the pump's head, or the control curve's, a rounding error under the system's meets it", () => {
  for (const [k, past] of EDGE) {
    it(`system's head = the pump's ÷ (1 − ${k}): ${past ? "not met" : "met"}, at fixed speed and on a constant-pressure control curve`, () => {
      const fixed = step("fixed-speed", (q) => headAt(curve, q)! / (1 - k)).status;
      const control = step("constant-pressure", (q) => (q === QB ? 20 : 20 / (1 - k))).status;
      expect([fixed === "beyond-curve", control === "control-below-system"]).toEqual([past, past]);
    });
  }
});

describe("a motor rating a rounding error off an IEC 60034-30-1 table entry is at it", () => {
  for (const [k, past] of EDGE) {
    it(`0.12 kW × (1 − ${k}) ${past ? "below" : "at"} the table; 5.5 kW × (1 + ${k}) ${past ? "between" : "at"} 5.5 kW and 7.5 kW`, () => {
      expect([codes(0.12 * (1 - k)).includes("motor-below-table"), codes(5.5 * (1 + k)).includes("motor-between-table")]).toEqual([past, past]);
    });
  }
});

describe("a shaft power a rounding error above motor rating × service factor is covered by it (overload, suggestion)", () => {
  for (const [k, past] of EDGE) {
    it(`1.1 kW × 1.0 and 12.65 kW (11 kW × 1.15), the power × (1 + ${k}): ${past ? "not covered" : "covered"}`, () => {
      expect([1100, 12650].map((limit) => !limitCovers(limit, limit * (1 + k)))).toEqual([past, past]);
    });
  }
});

describe("the words print a value just past LIMIT_ROUNDING apart from its limit, in every unit of head and power", () => {
  const num = (t: string) => Number(t.split(" ")[0].replace(/,/g, ""));
  const ends: number[] = [...IE_TABLE_KW.map((kw) => kw * 1000), 20];
  for (let e = -3; e <= 6; e++) for (let lead = 100; lead < 1000; lead += 7) ends.push((lead / 100) * 10 ** e);
  for (let e = -3; e <= 6; e++) for (const k of [1, 3, 7, 12]) ends.push(10 ** e * (1 - k * 1e-9), 10 ** e * (1 + k * 1e-9));
  for (const q of ["head", "power"] as Quantity[]) for (const u of UNITS[q]) {
    it(`${q} in ${u.id}: a value 1 part in 10⁸ (and 1e-15) past its limit, either side, reads another number`, () => {
      const alike: string[] = [];
      for (const shown of ends) for (const end of [shown, shown * u.factor]) for (const sign of [1, -1]) {
        const x = end * (1 + sign * LIMIT_ROUNDING * (1 + 1e-7));
        const [a, b] = qtPair(q, x, end).map((t) => renderQuantities(t, { [q]: u.id } as never));
        if (num(a) === num(b)) alike.push(`${a} beside ${b}`);
      }
      expect(alike).toEqual([]);
    });
  }
  it("control: 2 parts in 10⁹ under, judged past by the old allowance, reads as the limit", () => {
    const [a, b] = qtPair("head", 20 * (1 - 2e-9), 20).map((t) => renderQuantities(t, { head: "m" } as never));
    const [c, d] = qtPair("power", 120 * (1 - 2e-9), 120).map((t) => renderQuantities(t, { power: "kW" } as never));
    expect([a, b, c, d]).toEqual(["20.0000000 m", "20.0 m", "0.120000000 kW", "0.120 kW"]);
  });
});

describe("a range's end printed inward and the reader's allowance at it are one allowance", () => {
  // An end printed a hair outside its range that the reader takes back (within LIMIT_ROUNDING) is not rounded inward;
  // one further out is (limitText.ts `boundInward`, rounding the printed end at its own decimals).
  it("an upper end printed 0.5e-8 outside stays; 2e-8 outside is rounded down", () => {
    expect(END_SLACK).toBe(LIMIT_ROUNDING);
    expect(boundInward("100.000001", 100.0000005, "max")).toBe("100.000001");
    expect(boundInward("100.000003", 100.000001, "max")).toBe("100.000001");
  });
});
