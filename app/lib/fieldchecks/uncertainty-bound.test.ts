// "At the tolerance limit" only while the readings' uncertainty is no wider than the grade's own tolerance (decision
// "gaugebound", uncertainty-bound.ts): wider, no tolerance verdict, with both numbers and the instruments that would judge.
// Was: ±1000 kPa gauges (±144 m of head) made a pump 40 % short of its 28 m duty "at the tolerance limit". Pure (no database).
// Check values: ISO 9906:2012 grade 2B as in TOLERANCE_GRADES, from memory (flow ±8 %, head ±5 %); water at 20 °C from the
// engine (IAPWS); the fixture curve is invented (H = 40 − 1000·Q: 28 m at 12 L/s, app/test/fieldcheck-fixture.ts), so 2B's
// head tolerance at 12 L/s is ±1.4 m (hand calculation); head uncertainty √(a² + a²)/(ρ·g) (common practice, quadrature).
import { describe, expect, test } from "vitest";
import { fluidAt, G0 } from "~/engine";
import { fieldsForHead, frozenFixture, oneCheckCsv } from "~/test/fieldcheck-fixture";
import { checkOnPhone } from "~/components/field/local-check";
import { renderUnits, unitsOf } from "~/lib/shared/units";
import { crossSummary, deliveredSentence, evaluateCheck, parseCheckFields, verdictNote } from "./index";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const f = frozenFixture();
const TOL = 28 * 0.05; // m, 2B's head tolerance at the curve's 28 m
const kPaFor = (dH: number) => String((dH * RHO20 * G0) / Math.SQRT2 / 1000); // each gauge's ± kPa giving dH in quadrature
const SI = unitsOf("SI");

function fields(head: number, extra: Record<string, string>) {
  return fieldsForHead(head, RHO20, { flow: "0.012", ...extra });
}
function check(head: number, extra: Record<string, string>) {
  const p = parseCheckFields(fields(head, extra), { kind: "water" });
  if (!p.ok) throw new Error(JSON.stringify(p.errors));
  return { r: evaluateCheck(f, p.readings, "2B"), readings: p.readings };
}

describe("±1000 kPa gauges on a pump 40 % short of its 28 m (±144 m of head against 2B's ±1.4 m)", () => {
  const { r, readings } = check(28 * 0.6, { sAccuracy: "1000", dAccuracy: "1000" });
  test("no tolerance verdict, said with both numbers on the verdict's sentence (was: marginal, 'at the tolerance limit')", () => {
    expect(r.gauges.headUncertainty).toBeCloseTo(144.47, 2); // √2 × 1 MPa / (998.2 × 9.807) (hand calculation)
    expect(r.verdict).toBe("unknown");
    expect(renderUnits(r.message, SI)).toBe("Delivered point not judged against grade 2B: the readings' uncertainty is wider than the grade's tolerance (head ±144 m against ±1.40 m), so they cannot tell a pass from a fail; use finer instruments (see the warnings)");
    expect(r.warnings.some((w) => w.startsWith("At the tolerance limit"))).toBe(false);
  });
  test("the note every surface reads (lists, CSV, e-mail, phone) names the tolerance, what it is of, and the gauges that would judge", () => {
    const note = renderUnits(verdictNote(r) ?? "(no note)", SI);
    expect(note).toMatch(/^No tolerance verdict: the readings' uncertainty is wider than the grade's own tolerance — in head ±144 m \(the two gauges' accuracies in quadrature over ρ·g\) against grade 2B's ±1\.40 m \(5 % of the curve's 28\.0 m at the measured flow\)/);
    expect(note).toMatch(/Check again with gauges within about ±9\.69 kPa each \(equal gauges, for the head within ±1\.40 m\), or finer\.$/);
    expect(crossSummary(r)).toBeNull(); // no "Tolerance cross … not met" beside a check not judged
    expect(renderUnits(deliveredSentence(r), SI)).toContain("Judged against grade 2B: no tolerance verdict.");
    const { header, row } = oneCheckCsv(readings, r);
    expect(row[header.indexOf("verdict")]).toBe("unknown");
    expect(row.join(",")).toContain(`"No tolerance verdict: the readings' uncertainty is wider than the grade's own tolerance — in head ±144 m (the two gauges'`); // the note's cell, quoted (SI display units)
    const phone = checkOnPhone(fields(28 * 0.6, { sAccuracy: "1000", dAccuracy: "1000" }), f, SI);
    expect(phone.ok && phone.local).toMatchObject({ verdict: "unknown", cross: null, note: verdictNote(r) });
  });
});

describe("the bound in head: uncertainty against 2B's ±1.4 m at 28 m, a millionth either side", () => {
  // 30.1 m read: +7.5 %, misses +5 % (29.4 m) as read; 0.7 m lower, inside a box of ±1.4 m, meets it.
  const at = (dH: number) => check(28 * 1.05 + 0.7, { sAccuracy: kPaFor(dH), dAccuracy: kPaFor(dH) }).r;
  test("±1.4 m × (1 − 1e-6): marginal, as before; × (1 + 1e-6): not judged, the two numbers printed apart", () => {
    const inside = at(TOL * (1 - 1e-6));
    const outside = at(TOL * (1 + 1e-6));
    expect([inside.verdict, outside.verdict]).toEqual(["marginal", "unknown"]);
    expect(inside.warnings.some((w) => w.startsWith("At the tolerance limit"))).toBe(true);
    expect(renderUnits(outside.message, SI)).toContain("(head ±1.400001 m against ±1.40 m)");
  });
});

describe("the bound in flow: the meter's accuracy against 2B's ±8 %, a millionth either side", () => {
  // 30.24 m at 12 L/s: head +8 % and flow +23 % miss as read; at 11.04 L/s (−8 %) the curve's 28.96 m puts it +4.4 %, met.
  const at = (acc: number) => check(28 * 1.08, { flowAccuracy: String(acc * 100) }).r;
  test("±8 % × (1 − 1e-6): marginal; × (1 + 1e-6): not judged, with a flow meter within ±8 % suggested", () => {
    const inside = at(0.08 * (1 - 1e-6));
    const outside = at(0.08 * (1 + 1e-6));
    expect([inside.verdict, outside.verdict]).toEqual(["marginal", "unknown"]);
    expect(outside.message).toContain("(flow ±8.000008 % against ±8 %)"); // as typed (pctAsTyped), apart from ±8 %
    expect(verdictNote(outside)).toMatch(/in flow the meter's ±8\.000008 % against grade 2B's ±8 % — .* Check again with a flow meter within ±8 %, or finer\.$/);
  });
});
