// searchOnLiquid (pure): the index searched per speed at that speed's equivalent water duty (ANSI/HI 9.6.7, from memory,
// engine `equivalentWaterDuty`, whose hand values are in app/engine/viscous.test.ts), the rows turned into the liquid's
// figures and ranked together. Check values: the engine's own search run by hand on each speed's sets, and the stated
// conversions (head × C_H, efficiency × C_η, shaft power ρ·g·Q·H/η); B by hand for a slowed pump; the curves are made
// up (fictional).
import { describe, expect, test } from "vitest";
import { equivalentWaterDuty, G0, prepareSearchIndex, searchDuty, type CurveSet } from "~/engine";
import { searchScore } from "~/engine/search";
import { onWaterFigures, searchOnLiquid } from "./search-liquid";

const M3H = 1 / 3600;
/** H = h_b·(1.3 − 0.3·x²), η = 0.78·x·(2 − x), x = Q/Q_b (fictional). */
const set = (id: string, speed: number | undefined, qb: number, hb: number): CurveSet => ({
  id, label: id,
  curve: { speed, points: [0, 0.25, 0.5, 0.75, 1, 1.25, 1.5, 1.75].map((x) => ({ flow: x * qb * M3H, head: hb * (1.3 - 0.3 * x * x), efficiency: x === 0 ? undefined : 0.78 * x * (2 - x) })) },
});
const sets = [
  set("a2900", 2900, 110, 34), set("b2900", 2900, 130, 36), set("c1450", 1450, 112, 36), set("d1450", 1450, 95, 31), set("e-none", undefined, 100, 31),
];
const index = prepareSearchIndex(sets);
const duty = { flow: 100 * M3H, head: 30 };
const oil = { name: "oil", kinematicViscosity: 200e-6, density: 900 };
const options = { density: 900, limit: 50 };

describe("searchOnLiquid", () => {
  test("each speed searched at its own water duty, sets naming no speed at the duty itself, rows on the liquid ranked together", () => {
    const { result, plan } = searchOnLiquid(index, duty, oil, options);
    expect(plan.groups.map((g) => [g.speed, g.sets, g.status])).toEqual([[2900, 2, "corrected"], [1450, 2, "corrected"], [null, 1, "no-speed"]]);
    const byId = new Map(result.candidates.map((c) => [c.id, c]));
    const rows = [];
    for (const [speed, ids] of [[2900, ["a2900", "b2900"]], [1450, ["c1450", "d1450"]]] as const) {
      const w = equivalentWaterDuty({ ...duty, kinematicViscosity: oil.kinematicViscosity, speed });
      expect(plan.groups.find((g) => g.speed === speed)!.waterDuty).toEqual({ flow: w.flow, head: w.head });
      // By hand: the engine's search of those sets alone at the water duty, then the liquid's figures.
      for (const c of searchDuty(prepareSearchIndex(sets.filter((s) => (ids as readonly string[]).includes(s.id))), w, options).candidates) {
        const got = byId.get(c.id)!;
        expect(got.method).toBe(c.method);
        expect(got.ratio).toBe(c.ratio);
        expect(got.headAtDuty).toBeCloseTo(c.headAtDuty * w.factors!.head, 12);
        expect(got.efficiency!).toBeCloseTo(c.efficiency! * w.factors!.efficiency, 12);
        expect(got.shaftPower!).toBeCloseTo((900 * G0 * duty.flow * got.headAtDuty) / got.efficiency!, 6);
        expect(got.bepRatio).toBe(c.bepRatio);
        rows.push(got);
      }
    }
    expect(rows.map((c) => c.id).sort()).toEqual(["a2900", "b2900", "c1450"]); // each speed's search found some (d1450 is too small)
    const none = searchDuty(prepareSearchIndex(sets.filter((s) => s.id === "e-none")), duty, options).candidates;
    expect(none).toHaveLength(1);
    for (const c of none) expect(byId.get(c.id)!.efficiency).toBe(c.efficiency); // the water curve's figures at the duty itself
    expect(result.candidates).toHaveLength(rows.length + 1);
    // Scored together (the least shaft power among all rows) and sorted by score, the row on water figures last whatever its score.
    const minPower = Math.min(...result.candidates.map((c) => c.shaftPower!));
    for (const c of result.candidates) expect(c.score).toBeCloseTo(searchScore(c.efficiency, c.bepRatio, c.npshMargin, c.shaftPower, minPower, 1.1), 12);
    const onLiquid = result.candidates.slice(0, -1);
    expect(onLiquid.map((c) => c.score)).toEqual(onLiquid.map((c) => c.score).sort((a, b) => b - a));
    const last = result.candidates.at(-1)!;
    expect(last.id).toBe("e-none");
    expect(last.score).toBeGreaterThan(onLiquid[0].score); // water efficiency 78 % against C_η × … on the liquid: not comparable, so last
    expect(onWaterFigures(last)).toBe(true);
    expect(onLiquid.some(onWaterFigures)).toBe(false);
    expect(last.warnings.at(-1)!.message).toMatch(/names no speed, so B cannot be computed\): ranked after the pumps whose figures are estimated on the liquid/);
    expect(result.stats.searched).toBe(5);
    expect(result.stats.matched).toBe(result.candidates.length);
  });

  test("B ≤ 1 everywhere (a thin liquid): the engine's search at the duty itself, unchanged", () => {
    const thin = { ...oil, kinematicViscosity: 1e-6 };
    const { result, plan } = searchOnLiquid(index, duty, thin, options);
    expect(plan.ranksOnLiquid).toBe(false);
    expect(plan.groups.filter((g) => g.speed !== null).every((g) => g.status === "no-correction")).toBe(true);
    expect(result).toEqual(searchDuty(index, duty, options));
  });

  test("a pump slowed down takes B at the speed it runs at: its ratio solves the water duty of that speed's B (was the curve's 2900 rpm)", () => {
    // s2900 must be slowed to meet the oil duty. At the curve's 2900 rpm, B = 6.97 and the water duty solves to 72.12 %;
    // slowed to about 2108 rpm, B is larger, the water head higher, and the ratio a little higher: the fixed point.
    const one = prepareSearchIndex([set("s2900", 2900, 170, 60)]);
    const opts = { density: 900, minSpeedRatio: 0.3 };
    const row = searchOnLiquid(one, duty, oil, opts).result.candidates[0];
    expect(row.method).toBe("speed");
    const atOwn = equivalentWaterDuty({ ...duty, kinematicViscosity: oil.kinematicViscosity, speed: 2900 });
    const ownRatio = searchDuty(one, atOwn, opts).candidates[0].ratio;
    expect(ownRatio).toBeCloseTo(0.7212, 4); // the old estimate, B at 2900 rpm
    const w = equivalentWaterDuty({ ...duty, kinematicViscosity: oil.kinematicViscosity, speed: 2900 * row.ratio });
    // Hand (ANSI/HI 9.6.7's B, from memory; US units): 26.6 · 200^0.5 · 98.425 ft^0.0625 / (440.29 gpm^0.375 · (2900 · 0.72680 rpm)^0.25)
    // = 376.18 · 1.3322 / (9.8038 · 6.7757) = 7.544.
    expect(row.ratio).toBeCloseTo(0.7268, 4);
    expect(w.b).toBeCloseTo(7.544, 3);
    const again = searchDuty(one, w, { ...opts, methods: ["speed"] }).candidates[0];
    expect(again.ratio).toBeCloseTo(row.ratio, 9); // self-consistent: that B's water duty solves to the row's own ratio
    expect(row.efficiency!).toBeCloseTo(again.efficiency! * w.factors!.efficiency, 12); // C_η at B = 7.54, not at 6.97
    expect(row.shaftPower!).toBeCloseTo((900 * G0 * duty.flow * again.headAtDuty * w.factors!.head) / row.efficiency!, 6);
  });

  test("the engine's score is searchScore (the two cannot drift apart)", () => {
    const r = searchDuty(index, duty, { ...options, requiredNpshMargin: 1.1 });
    const minPower = Math.min(...r.candidates.map((c) => c.shaftPower!)); // every match is among the rows here (5 sets)
    expect(r.candidates.length).toBe(r.stats.matched);
    for (const c of r.candidates) expect(c.score).toBe(searchScore(c.efficiency, c.bepRatio, c.npshMargin, c.shaftPower, minPower, 1.1));
  });
});
