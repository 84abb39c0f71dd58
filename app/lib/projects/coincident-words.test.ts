// A candidate whose curve runs together with the system curve over a stretch (engine status `coincident`), through
// evaluateCandidate (pure): no operating point, the reason in the candidate's own words with the rule (heads within
// 1 part in 10⁸ of the head over 1 % of the published flows or more; 36–72 m³/h of 0–108 is 33.3 %) and the stretch's flows and head; the flip 1e-6 of the head either side, where the curves cross.
// Check values: geometry of an invented curve (m³/h, m) — 40 m at shut-off falling to a 30 m stretch from 36 to 72 m³/h
// (published points at equal heads interpolate flat: Fritsch & Carlson 1980), 20 m at 108 m³/h; a system with no pipe
// runs is flat at its static head. The reading is common practice, from memory: a duty point needs the curves to cross.
import { describe, expect, it } from "vitest";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate } from "./hydraulics";
import { inSI } from "~/engine/quantityText";

const M3H = 1 / 3600;
const set = {
  points: [[0, 40], [36, 30], [54, 30], [72, 30], [108, 20]].map(([q, h]) => ({ flow: q * M3H, head: h, efficiency: null, power: null, npshr: null })),
  speed: 2900,
  impellerDiameter: 0.2,
};
const at = (staticHead: number) =>
  evaluateCandidate({ ...defaultSystemInput(), staticLow: staticHead, staticHigh: staticHead, runs: [], duty: { flow: 50 * M3H, head: staticHead } }, set, DEFAULT_ADJUSTMENT);

describe("curves that run together over a stretch: no operating point, said with the rule and the stretch", () => {
  it("30 m static against the 30 m stretch: every edge without a point, the reason naming 36–72 m³/h at 30 m", () => {
    const r = at(30);
    expect(r.band.every((b) => b.flow === null && b.head === null)).toBe(true);
    expect(r.verdict!.status).toBe("no-operating-point");
    // old code: the engine's message, "The pump and system curves coincide from 36.0 m³/h to 72.0 m³/h at 30.0 m: the operating point is undefined — …"
    expect(inSI(r.band[0].reason!)).toBe("the pump and system curves run together from 36.0 m³/h to 72.0 m³/h at 30.0 m (their heads within 1 part in 10⁸ of the pump's head over 33.3 % of the published flows; coincident from 1 %), so the pump has no single operating point: it may run anywhere on that stretch and drift along it; change the system or the pump so the curves cross");
    expect(inSI(r.verdict!.reasons[0])).toBe(`At ${r.band[0].edge}: ${inSI(r.band[0].reason!)}.`);
  });
  it("the flip: 1e-6 of the head below, a point past the stretch's end; above, one before its start", () => {
    const below = at(30 * (1 - 1e-6)), above = at(30 * (1 + 1e-6));
    expect(below.band.every((b) => b.flow! > 72 * M3H && b.flow! < 73 * M3H)).toBe(true);
    expect(above.band.every((b) => b.flow! < 36 * M3H && b.flow! > 35 * M3H)).toBe(true);
    expect(below.verdict!.status).not.toBe("no-operating-point");
    expect(above.verdict!.status).not.toBe("no-operating-point");
  });
});
