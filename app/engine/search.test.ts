/** Tier 3 — duty-point search: correctness, agreement with affinity/trim, ranking reasons. */
import { describe, expect, it } from "vitest";
import { createPumpCurve, EngineInputError, headAt, joinSearchIndexes, prepareSearchIndex, scaleBySpeed, scaleByTrim, searchDuty, type CurveSet } from "./index.ts";
import { generateCurveSets, makeCurve, rng } from "./test/curveSets.ts";
import { bestMatches } from "./search.ts";

const M3H = 1 / 3600;
const duty = { flow: 50 * M3H, head: 30 };

// Hand-made sets around the duty (made-up data).
const sets: CurveSet[] = [
  // H(50 m³/h) ≈ 30.6 m: meets directly (within +5 %).
  { id: "direct", curve: { points: makeCurve(38.25, 100 * M3H, 0.8), impellerDiameter: 0.2, minDiameter: 0.16 } },
  // Much more head: needs a trim or slower speed.
  { id: "big", curve: { points: makeCurve(40, 110 * M3H, 0.72), impellerDiameter: 0.22, minDiameter: 0.15, speed: 2900 } },
  // Too small: rejected by envelope (max head 20 m).
  { id: "small", curve: { points: makeCurve(20, 100 * M3H, 0.85) } },
  // Too little flow: rejected (runout 40 m³/h).
  { id: "narrow", curve: { points: makeCurve(60, 40 * M3H, 0.85) } },
  // Bad curve (duplicate flow) is reported, not thrown.
  { id: "broken", curve: { points: [{ flow: 0, head: 10 }, { flow: 0, head: 9 }] } },
];

describe("searchDuty", () => {
  const index = prepareSearchIndex(sets);
  const res = searchDuty(index, duty);

  it("invalid sets are listed with the reason", () => {
    expect(index.rejected.map((r) => r.id)).toEqual(["broken"]);
    expect(index.rejected[0].reason).toMatch(/duplicate flow/);
  });
  it("envelope prefilter rejects sets that cannot reach the duty", () => {
    expect(res.stats.rejectedByEnvelope).toBe(2);
    expect(res.candidates.map((c) => c.id).sort()).toEqual(["big", "direct"]);
  });
  it("direct fit is classified direct; the large pump is trimmed (first feasible method)", () => {
    const d = res.candidates.find((c) => c.id === "direct")!;
    const b = res.candidates.find((c) => c.id === "big")!;
    expect(d.method).toBe("direct");
    expect(d.headAtDuty).toBeGreaterThanOrEqual(30);
    expect(d.headAtDuty).toBeLessThanOrEqual(31.5);
    expect(b.method).toBe("trim");
  });
  it("the trim found by search is the one scaleByTrim confirms (curve through the duty)", () => {
    const b = res.candidates.find((c) => c.id === "big")!;
    const trimmed = scaleByTrim(createPumpCurve(sets[1].curve as never), b.ratio).curve;
    expect(headAt(trimmed, duty.flow)!).toBeCloseTo(30, 8);
    expect(b.diameter!).toBeCloseTo(0.22 * b.ratio, 12);
  });
  it("speed-only search: the slowed curve passes through the duty", () => {
    const s = searchDuty(index, duty, { methods: ["speed"] }).candidates.find((c) => c.id === "big")!;
    expect(s.method).toBe("speed");
    expect(headAt(scaleBySpeed(createPumpCurve(sets[1].curve as never), s.ratio).curve, duty.flow)!).toBeCloseTo(30, 8);
    expect(s.speed!).toBeCloseTo(2900 * s.ratio, 9);
  });
  it("ranks by efficiency at duty and says why", () => {
    expect(res.candidates[0].id).toBe("direct");
    expect(res.candidates[0].rank).toBe(1);
    expect(res.candidates[0].reason).toMatch(/#1 of 2: reaches the duty point as published/);
    expect(res.candidates[0].reason).toMatch(/highest score/);
    // Row 2 names row 1 and the figures in which it falls behind it (made-up curves above).
    expect(res.candidates[1].reason).toMatch(/below #1 because: .*points less efficient/);
    const gap = ((res.candidates[0].efficiency! - res.candidates[1].efficiency!) * 100).toFixed(1);
    expect(res.candidates[1].reason).toContain(`${gap} points less efficient`);
    expect(res.candidates[0].score).toBeGreaterThan(res.candidates[1].score);
  });
  it("NPSH available below NPSHr removes a candidate; a thin margin is reported", () => {
    const r = searchDuty(index, duty, { npshAvailable: 2.0 }); // NPSHr at duty ≈ 2.0 for "direct", 1.8 for "big"
    for (const c of r.candidates) expect(c.npshMargin!).toBeGreaterThanOrEqual(1);
    const none = searchDuty(index, duty, { npshAvailable: 0.5 });
    expect(none.candidates.length).toBe(0);
    expect(none.stats.rejectedByNpsh).toBe(2); // both reach the duty; each left out for NPSH, and counted
    expect(res.stats.rejectedByNpsh).toBe(0); // no NPSHa given: nothing judged
  });
  it("the NPSH count flips where NPSHa crosses a pump's NPSHr at the duty", () => {
    const r = searchDuty(index, duty);
    const npshr = Math.max(...r.candidates.map((c) => c.npshr!)); // the hungrier of the two (makeCurve, made-up data)
    expect(searchDuty(index, duty, { npshAvailable: npshr * 1.001 }).stats.rejectedByNpsh).toBe(0);
    const below = searchDuty(index, duty, { npshAvailable: npshr * 0.999 });
    expect(below.stats.rejectedByNpsh).toBe(1);
    expect(below.stats.matched).toBe(1);
  });
  it("bad duty is a typed error", () => {
    expect(() => searchDuty(index, { flow: 0, head: 30 })).toThrow(EngineInputError);
    expect(() => searchDuty(index, { flow: 0.01, head: NaN })).toThrow(EngineInputError);
  });
});

describe("index built from raw inputs equals index built from prepared curves", () => {
  it("same candidates, methods, ratios and scores; power-only curves get an efficiency", () => {
    const gen = generateCurveSets(300, 11);
    // Every third set gives power instead of efficiency (P = ρ·g₀·Q·H/η, ρ = 1000).
    gen.forEach((s, i) => {
      if (i % 3 === 0) (s.curve as { points: { flow: number; head: number; efficiency?: number; power?: number }[] }).points.forEach((p) => {
        if (p.flow > 0) p.power = (1000 * 9.80665 * p.flow * p.head) / p.efficiency!;
        delete p.efficiency;
      });
    });
    const raw = searchDuty(prepareSearchIndex(gen), { flow: 100 * M3H, head: 40 }, { limit: 1000 });
    const prepared = searchDuty(prepareSearchIndex(gen.map((s) => ({ ...s, curve: createPumpCurve(s.curve as never) }))), { flow: 100 * M3H, head: 40 }, { limit: 1000 });
    expect(raw.candidates.length).toBeGreaterThan(3);
    expect(raw.candidates.map((c) => [c.id, c.method])).toEqual(prepared.candidates.map((c) => [c.id, c.method]));
    raw.candidates.forEach((c, i) => {
      expect(c.ratio).toBeCloseTo(prepared.candidates[i].ratio, 12);
      expect(c.score).toBeCloseTo(prepared.candidates[i].score, 12);
    });
    expect(raw.candidates.filter((c) => Number(c.id.split("-")[1]) % 3 === 0).every((c) => c.efficiency !== null)).toBe(true);
  });
});

describe("joined indexes search like one index prepared over the same sets", () => {
  const gen = generateCurveSets(900, 5);
  gen[17] = { id: "broken", curve: { points: [{ flow: 0, head: 10 }, { flow: 0, head: 9 }] } }; // rejected in its part
  const parts = [gen.slice(0, 300), gen.slice(300, 650), gen.slice(650)].map((p) => prepareSearchIndex(p));
  const d = { flow: 100 * M3H, head: 40 };
  const strip = (r: ReturnType<typeof searchDuty>) => JSON.stringify(r);
  it("every set of every part: the same candidates, figures, reasons and counts as one index", () => {
    const whole = searchDuty(prepareSearchIndex(gen), d, { limit: 1000 });
    const joined = joinSearchIndexes(parts);
    expect(joined.count).toBe(899);
    expect(joined.rejected.map((r) => r.id)).toEqual(["broken"]);
    expect(whole.candidates.length).toBeGreaterThan(10);
    expect(strip(searchDuty(joined, d, { limit: 1000 }))).toBe(strip(whole));
  });
  it("picked sets (some parts filtered, one empty) search like those sets prepared on their own", () => {
    const keep = (i: number) => i % 3 !== 1;
    const picks = parts.map((p, k) => (k === 1 ? [] : p.ids.flatMap((id, j) => (keep(Number(id.split("-")[1])) ? [j] : []))));
    const chosen = gen.filter((s, i) => i < 300 || i >= 650 ? s.id !== "broken" && keep(Number(s.id.split("-")[1])) : false);
    const joined = joinSearchIndexes(parts, picks);
    expect(joined.count).toBe(chosen.length);
    expect(joined.rejected).toEqual([]);
    expect(strip(searchDuty(joined, d, { limit: 1000, methods: ["speed", "direct"] }))).toBe(strip(searchDuty(prepareSearchIndex(chosen), d, { limit: 1000, methods: ["speed", "direct"] })));
  });
  it("a position outside a part is a typed error naming it", () => {
    expect(() => joinSearchIndexes(parts, [[300]])).toThrow(/picks\[0\]\[0\]/);
    expect(() => joinSearchIndexes([{ count: 1 } as never])).toThrow(EngineInputError);
  });
});

describe("searchDuty over 10 000 generated curve sets (size check; timing is in app/bench/engine.ts)", () => {
  it("every candidate's (modified) curve meets the duty", () => {
    const gen = generateCurveSets(10_000, 7);
    const idx = prepareSearchIndex(gen);
    expect(idx.count).toBe(10_000);
    const r = searchDuty(idx, { flow: 120 * M3H, head: 45 }, { limit: 10_000 });
    expect(r.stats.searched).toBe(10_000);
    expect(r.candidates.length).toBeGreaterThan(10);
    const byId = new Map(gen.map((s) => [s.id, s]));
    for (const c of r.candidates.slice(0, 200)) {
      const base = createPumpCurve(byId.get(c.id)!.curve as never);
      const cur = c.method === "speed" ? scaleBySpeed(base, c.ratio).curve : c.method === "trim" ? scaleByTrim(base, c.ratio).curve : base;
      const h = headAt(cur, 120 * M3H)!;
      expect(h).toBeGreaterThanOrEqual(45 * (1 - 1e-9));
      expect(h).toBeLessThanOrEqual(45 * 1.05 * (1 + 1e-9));
    }
    for (let i = 1; i < r.candidates.length; i++) expect(r.candidates[i].score).toBeLessThanOrEqual(r.candidates[i - 1].score);
  });
});

describe("bestMatches: the first `limit` of a full sort, without sorting every match", () => {
  // Property sweep (seeded): scores with many ties (a few distinct values, ±0 among them), ids in random order.
  it("equals sorting all and keeping the first `limit`, for every size and limit tried", () => {
    const r = rng(17);
    for (let trial = 0; trial < 300; trial++) {
      const n = Math.floor(r() * 60);
      const levels = 1 + Math.floor(r() * 6);
      const score = Float64Array.from({ length: n }, () => (r() < 0.1 ? (r() < 0.5 ? -0 : 0) : Math.floor(r() * levels) / levels));
      const ids = Array.from({ length: n }, (_, j) => `id-${Math.floor(r() * 1000)}-${j}`);
      const order = (a: number, b: number) => score[b] - score[a] || (ids[a] < ids[b] ? -1 : ids[a] > ids[b] ? 1 : 0);
      for (const limit of [1, 2, 5, n - 1, n, n + 3].filter((x) => x >= 1)) {
        const full = Array.from({ length: n }, (_, j) => j).sort(order).slice(0, limit);
        expect(bestMatches(score, limit, order)).toEqual(full); // source: definition (the reference is the full sort)
      }
    }
  });

  it("keeps every tie at the cut before choosing by id", () => {
    const score = Float64Array.from([0.5, 0.9, 0.5, 0.5, 0.1]);
    const ids = ["c", "a", "b", "a2", "z"];
    const order = (a: number, b: number) => score[b] - score[a] || (ids[a] < ids[b] ? -1 : ids[a] > ids[b] ? 1 : 0);
    expect(bestMatches(score, 2, order)).toEqual([1, 3]); // 0.9 first, then the tie at 0.5 broken by id: "a2" < "b" < "c" (hand-worked case)
    expect(bestMatches(score, 4, order)).toEqual([1, 3, 2, 0]); // hand-worked case
  });

  it("a NaN score (none is made today) does not lose matches: all are sorted as before", () => {
    const score = Float64Array.from([NaN, NaN, 0.3, 0.7]);
    const order = (a: number, b: number) => (score[b] - score[a]) || a - b;
    expect(bestMatches(score, 1, order).length).toBe(1); // source: definition (one row asked, one row given)
    expect(bestMatches(score, 4, order).sort()).toEqual([0, 1, 2, 3]); // source: definition (no match dropped)
  });
});
