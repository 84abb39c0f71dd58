// A curve that publishes neither efficiency nor power: the candidate says so once (the curve's own warning and the figures'
// at the operating point used two wordings of one fact, "has neither" and "gives neither", and the notes and the CSV's
// warning_N carried both). Check values: an invented curve (head only), the product's own words.
import { expect, test } from "vitest";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type CurvePointsIn } from "./hydraulics";

const M3H = 1 / 3600;
const headOnly: CurvePointsIn = [0, 10, 20, 30, 40].map((q) => ({ flow: q * M3H, head: 30 - 0.008 * q * q, efficiency: null, power: null, npshr: null }));

test("no efficiency or power on the curve: one warning saying so, and the figures say they are unavailable", () => {
  const r = evaluateCandidate({ ...defaultSystemInput(), staticLow: 19, staticHigh: 20, duty: { flow: 30 * M3H, head: 20.5 } }, { points: headOnly, speed: 2900, impellerDiameter: 0.2 }, DEFAULT_ADJUSTMENT);
  expect(r.operating).not.toBeNull();
  const said = r.warnings.filter((w) => /neither efficiency nor power/.test(w));
  expect(said).toEqual(["curve gives neither efficiency nor power: power figures unavailable"]);
  expect(r.figures?.shaftPower ?? null).toBeNull();
});
