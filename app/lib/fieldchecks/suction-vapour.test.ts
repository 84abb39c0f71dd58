// A suction reading at or below the liquid's vapour pressure (suction-vapour.ts, evaluate.ts): the liquid at the tap would
// boil, so the reading is wrong or the pump cavitating, and no tolerance verdict rests on it — said with both pressures. Was:
// a vacuum of −99.0 kPa gauge on 20 °C water (2.3 kPa absolute, its vapour pressure 2.34 kPa) judged "within tolerance"
// without a word. Check values: water's vapour pressure from the engine's IAPWS-IF97 saturation line (fluids.ts; 2.339 kPa
// at 20 °C, 47.4 kPa at 80 °C, IAPWS tables from memory); the standard atmosphere 101.325 kPa (ISO 2533); the fixture curve
// is invented (H = 40 − 1000·Q: 28 m at 12 L/s, app/test/fieldcheck-fixture.ts); ISO 9906:2012 grade 2B, from memory.
import { describe, expect, test } from "vitest";
import { fluidAt, G0, STANDARD_ATMOSPHERE } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { fieldsForHead, frozenFixture } from "~/test/fieldcheck-fixture";
import { evaluateCheck, parseCheckFields, verdictNote, type CheckResult } from "./index";

const water = (c: number) => fluidAt({ kind: "water" }, c);
const PV20 = water(20).vaporPressure;

/** Readings of 28 m (× `headRatio`) at 12 L/s whose suction reads `suctionPa` Pa on `ref`, the discharge that much higher. */
function check(suctionPa: number, ref: "gauge" | "absolute", opts: { headRatio?: number; flow?: string; temperature?: number } = {}): CheckResult {
  const t = opts.temperature ?? 20;
  const rho = water(t).density;
  const rise = 28 * (opts.headRatio ?? 1) * rho * G0; // Pa
  const p = parseCheckFields(
    fieldsForHead(0, rho, { pressureUnit: "Pa", sRef: ref, dRef: ref, sPressure: String(suctionPa), dPressure: String(suctionPa + rise), flow: opts.flow ?? "0.012", temperature: String(t) }),
    { kind: "water" },
  );
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return evaluateCheck(frozenFixture(), p.readings, "2B");
}
const noted = (r: CheckResult) => r.warnings.map(inSI).find((w) => /the liquid's vapour pressure/.test(w)) ?? null;

describe("a gauge reading made absolute against the standard atmosphere, either side of 20 °C water's vapour pressure", () => {
  test("a millionth above: judged as before (within tolerance), nothing said; a millionth below: no tolerance verdict, both pressures said", () => {
    const above = check(PV20 * (1 + 1e-6) - STANDARD_ATMOSPHERE, "gauge");
    const below = check(PV20 * (1 - 1e-6) - STANDARD_ATMOSPHERE, "gauge");
    // Was: "pass" both sides, the second without a word of the vapour pressure.
    expect([above.verdict, below.verdict]).toEqual(["pass", "unknown"]);
    expect(noted(above)).toBeNull();
    expect(noted(below)).toMatch(/^No tolerance verdict: the suction reading \(−99\.0 kPa gauge, 2\.339212 kPa absolute against the standard atmosphere 101 kPa\) is below the liquid's vapour pressure 2\.339215 kPa at 20\.0 °C: the liquid at the suction tap would boil\. Either the reading is wrong .* or the pump is cavitating;/);
    expect(below.message).toBe("Delivered point not judged against grade 2B: the suction reading is at or below the liquid's vapour pressure, so it is misread or the pump is cavitating (see the warnings)");
    expect(verdictNote(below)).toBe(below.warnings.find((w) => w.startsWith("No tolerance verdict:"))); // the lists, the CSV and the e-mail say it
  });
  test("a reading 40 % short of the curve below the vapour pressure: no verdict either (was: a fail on an impossible reading)", () => {
    expect(check(PV20 * (1 - 1e-6) - STANDARD_ATMOSPHERE, "gauge", { headRatio: 0.6 }).verdict).toBe("unknown");
    expect(check(PV20 * (1 + 1e-6) - STANDARD_ATMOSPHERE, "gauge", { headRatio: 0.6 }).verdict).toBe("fail");
  });
});

describe("an absolute reading", () => {
  test("exactly at the vapour pressure: 'at', no verdict; a millionth above: judged", () => {
    const at = check(PV20, "absolute");
    expect(at.verdict).toBe("unknown");
    expect(noted(at)).toMatch(/^No tolerance verdict: the suction reading \(2\.34 kPa absolute\) is at the liquid's vapour pressure 2\.34 kPa at 20\.0 °C/);
    expect(check(PV20 * (1 + 1e-6), "absolute").verdict).toBe("pass");
  });
  test("hot water, 80 °C (47.4 kPa): 47.3 kPa absolute is below it, 47.5 kPa is not", () => {
    const pv80 = water(80).vaporPressure;
    expect(pv80).toBeGreaterThan(47_300);
    expect(pv80).toBeLessThan(47_500);
    expect(check(47_300, "absolute", { temperature: 80 }).verdict).toBe("unknown");
    expect(check(47_500, "absolute", { temperature: 80 }).verdict).toBe("pass");
  });
});

test("without a flow meter (no verdict anyway) the same words are a note of their own", () => {
  const r = check(PV20 * (1 - 1e-6) - STANDARD_ATMOSPHERE, "gauge", { flow: "" });
  expect(r.verdict).toBe("unknown");
  expect(noted(r)).toMatch(/^The suction reading \(−99\.0 kPa gauge, .*\) is below the liquid's vapour pressure/);
});
