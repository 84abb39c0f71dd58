// What the tracer's peak texts (lib/tracer/peak.ts) say of the best-efficiency point is what the engine does with the
// tracer's own CSV: one invented chart (a head curve clicked along H = 50 − 0.003·Q², closed rectangular 70 % and 74 %
// contours), a span between two crossings, a curve that ends inside the 74 % contour and one that starts inside it, each
// with the box ticked and unticked; then the 74 % contour alone, crossed twice or once. The claims are read from the
// words; the facts from createPumpCurve on analyseCsv.
import { describe, expect, it } from "vitest";
import { createPumpCurve, efficiencyAt, shaftPowerAt } from "~/engine";
import { analyseCsv } from "~/lib/import";
import { peakBoxLabel, peakWarning } from "~/lib/tracer/peak";
import { paper } from "~/lib/tracer/test-chart";
import { calibrations, csvOf, initialState, unreadPeaks, type Curve, type TracerState } from "./model";

const ref = (q: number, h: number, value: number) => ({ u: paper(q, h)[0], v: paper(q, h)[1], value });
const px = (q: number, h: number) => ({ u: paper(q, h)[0], v: paper(q, h)[1] });
const headOf = (q: number) => 50 - 0.003 * q * q; // invented
/** The head curve clicked at every m³/h from q0 to q1. */
const head = (q0: number, q1: number, taken: boolean): Curve => ({
  id: 1, panelId: 1, kind: "curve", impellerMm: 200, speedRpm: 2900, level: 0, peakAtMidpoint: taken,
  points: Array.from({ length: q1 - q0 + 1 }, (_, i) => px(q0 + i, headOf(q0 + i))),
});
/** A closed contour: the rectangle from flow a to b over heads 5–60 m, so the head curve crosses it at a and b (invented). */
const box = (id: number, level: number, a: number, b: number): Curve => ({
  id, panelId: 1, kind: "contour", impellerMm: NaN, speedRpm: 2900, level, closed: true, points: [px(a, 5), px(b, 5), px(b, 60), px(a, 60)],
});
const state = (q0: number, q1: number, taken: boolean, alone = false): TracerState => ({
  ...initialState(), model: "Invented 50-200", xRefs: [ref(10, 0, 10), ref(90, 0, 90)],
  panels: [{ id: 1, quantity: "head", unit: "m", scale: "linear", refs: [ref(0, 10, 10), ref(0, 50, 50)] }],
  curves: [head(q0, q1, taken), ...(alone ? [] : [box(2, 70, 20, 80)]), box(3, 74, 30, 60)],
});
/** The one span's warning and label, and the engine's curve from the page's CSV (flows back in m³/h). */
function read(s: TracerState) {
  const cals = calibrations(s);
  const ps = unreadPeaks(s, cals);
  expect(ps).toHaveLength(1);
  const [set] = analyseCsv(csvOf(s, cals)).result.curveSets;
  const curve = createPumpCurve({ points: set.points });
  const effRows = set.points.filter((p) => p.efficiency !== undefined).map((p) => p.flow * 3600);
  return { p: ps[0], text: peakWarning(ps[0], "m3/h"), label: peakBoxLabel(ps[0], "m3/h"), curve, effRows, points: set.points };
}
const num = (m: RegExpMatchArray | null) => (m ? Number(m[1]) : NaN);
const power = (curve: ReturnType<typeof createPumpCurve>, q: number) => shaftPowerAt(curve, q / 3600, 1000);

// Interior span 30–60 m³/h (crossings 70 % at 20, 74 % at 30 and 60, 70 % at 80); end inside: clicked 0–45 (74 % crossed
// at 30, end 45); start inside: clicked 40–95 (start 40, 74 % crossed at 60). Middles 45, 37.5 and 50 m³/h (construction).
const cases = [
  { name: "span between two crossings", edge: [false, false], q0: 0, q1: 95, from: 30, to: 60, mid: 45 },
  { name: "curve that ends inside the 74 % contour", edge: [true, false], q0: 0, q1: 45, from: 30, to: 45, mid: 37.5 },
  { name: "curve that starts inside the 74 % contour", edge: [false, true], q0: 40, q1: 95, from: 40, to: 60, mid: 50 },
];

describe("the peak warning's word on the best-efficiency point is the engine's", () => {
  for (const c of cases) {
    for (const taken of [false, true]) {
      it(`${c.name}, box ${taken ? "ticked" : "unticked"}`, () => {
        const { p, text, curve, effRows } = read(state(c.q0, c.q1, taken));
        expect([p.toEnd === true, p.fromStart === true]).toEqual(c.edge);
        // The span the page names (within 0.05 m³/h of the construction: pixel rounding through the calibration).
        expect(Math.abs(p.from - c.from)).toBeLessThan(0.05);
        expect(Math.abs(p.to - c.to)).toBeLessThan(0.05);
        expect(Math.abs(p.midpoint - c.mid)).toBeLessThan(0.05);
        // What the words claim: no BEP; a BEP at the middle taken; a BEP outside the contour.
        const none = /No best-efficiency point is known for this curve/.test(text);
        const atMiddle = num(text.match(/middle of that span, ([\d.]+) m³\/h, is written at [\d.]+ % and taken as the best-efficiency point/));
        const outside = /puts the best-efficiency point (outside|before|after) the contour/.test(text);
        expect([none, Number.isFinite(atMiddle), outside].filter(Boolean)).toHaveLength(1);
        expect(curve.bep === null).toBe(none);
        expect(curve.warnings.some((w) => w.code === "bep-not-published")).toBe(none);
        if (Number.isFinite(atMiddle)) expect(Math.abs(curve.bep!.flow * 3600 - atMiddle)).toBeLessThanOrEqual(0.05); // the text's 0.1 m³/h
        if (outside) expect(curve.bep!.flow * 3600 <= p.from || curve.bep!.flow * 3600 >= p.to).toBe(true);
        // Where the words say the efficiency (and shaft power) is written up to, or from.
        const upTo = num(text.match(/efficiency is written up to ([\d.]+) m³\/h/)), from = num(text.match(/efficiency is written from ([\d.]+) m³\/h/));
        const rowBefore = num(text.match(/written up to its last row before ([\d.]+) m³\/h/)), rowPast = num(text.match(/written from its first row past ([\d.]+) m³\/h/));
        if (Number.isFinite(upTo)) expect(Math.abs(effRows.at(-1)! - upTo)).toBeLessThanOrEqual(0.05);
        if (Number.isFinite(from)) expect(Math.abs(effRows[0] - from)).toBeLessThanOrEqual(0.05);
        if (Number.isFinite(rowBefore)) expect(effRows.at(-1)!).toBeLessThan(rowBefore);
        if (Number.isFinite(rowPast)) expect(effRows[0]).toBeGreaterThan(rowPast);
        const stop = Number.isFinite(upTo) ? upTo : rowBefore, begin = Number.isFinite(from) ? from : rowPast;
        if (Number.isFinite(stop)) expect([power(curve, effRows.at(-1)!) !== null, power(curve, stop + 1)]).toEqual([true, null]);
        if (Number.isFinite(begin)) expect([power(curve, effRows[0]) !== null, power(curve, begin - 1)]).toEqual([true, null]);
        expect(p.toEnd || p.fromStart ? [stop, begin].filter(Number.isFinite) : []).toHaveLength(p.toEnd || p.fromStart ? 1 : 0);
      });
    }
  }
});

describe("the box's label says what ticking it does to the best-efficiency point", () => {
  for (const c of cases) {
    it(c.name, () => {
      const label = read(state(c.q0, c.q1, false)).label ?? ""; // every span here has a box: "" fails the next check
      const ticked = read(state(c.q0, c.q1, true));
      const takesBep = /as Curve 1’s best-efficiency point$/.test(label);
      expect(takesBep || /no best-efficiency point either way$/.test(label)).toBe(true);
      expect(ticked.curve.bep !== null).toBe(takesBep);
      if (takesBep) expect(Math.abs(ticked.curve.bep!.flow * 3600 - c.mid)).toBeLessThan(0.05);
      // An edge span's label: the efficiency (and shaft power) up to, or from, the middle once ticked.
      const upTo = num(label.match(/shaft power up to ([\d.]+) m³\/h/)), from = num(label.match(/shaft power from ([\d.]+) m³\/h/));
      if (Number.isFinite(upTo)) expect(Math.abs(ticked.effRows.at(-1)! - upTo)).toBeLessThanOrEqual(0.05);
      if (Number.isFinite(from)) expect(Math.abs(ticked.effRows[0] - from)).toBeLessThanOrEqual(0.05);
      expect([upTo, from].filter(Number.isFinite)).toHaveLength(c.edge.includes(true) ? 1 : 0);
    });
  }
});

// The 74 % contour alone (construction): crossed at 30 and 60 m³/h by the curve clicked 0–95, at 30 only by the one
// clicked 0–45 (it ends inside), at 60 only by the one clicked 40–95 (it starts inside).
const alone = [
  { name: "crossed twice", q0: 0, q1: 95, at: [30, 60] },
  { name: "crossed once, the curve ending inside it", q0: 0, q1: 45, at: [30] },
  { name: "crossed once, the curve starting inside it", q0: 40, q1: 95, at: [60] },
];

describe("a curve that crosses one contour only: the warning's word on its efficiency is the engine's", () => {
  for (const c of alone) {
    for (const taken of [false, true]) {
      it(`${c.name}, box ${taken ? "ticked" : "unticked"}`, () => {
        const { text, curve, effRows } = read(state(c.q0, c.q1, taken, true));
        // The claims: no efficiency written at all; a BEP outside the contour; a BEP at the middle.
        const noneWritten = /the CSV writes no efficiency for this curve/.test(text);
        const outside = /puts the best-efficiency point (outside|before|after) the contour/.test(text);
        const atMiddle = /is written at [\d.]+ % and taken as the best-efficiency point/.test(text);
        expect(effRows.length === 0).toBe(noneWritten);
        expect(curve.bep !== null).toBe(outside || atMiddle);
        if (noneWritten) {
          expect([curve.efficiency, curve.bep, power(curve, 45)]).toEqual([null, null, null]);
          expect(curve.warnings.map((w) => w.code)).toContain("no-efficiency");
        }
        // The crossings the words name are the construction's (the text's 0.1 m³/h).
        const m = text.match(/the 74 % contour, (?:once, at ([\d.]+)|twice, at ([\d.]+) and ([\d.]+)) m³\/h/);
        const named = (m ? m.slice(1) : []).filter((x) => x !== undefined).map(Number);
        expect(named).toHaveLength(c.at.length);
        named.forEach((q, i) => expect(Math.abs(q - c.at[i])).toBeLessThanOrEqual(0.05));
      });
    }
  }

  it("crossed twice: the middle at the level would be the one efficiency row (no curve, no BEP); with the crossings too, a flat line (no BEP)", () => {
    const { text, label, points } = read(state(0, 95, false, true));
    expect(text).toMatch(/would be the curve's only efficiency row/);
    expect(text).toMatch(/written at 74 % too, the line would be flat: still no best-efficiency point/);
    expect(label).toBeNull();
    // The CSV's rows with 74 % put at the middle (45) alone, then at the two crossings (30, 60) too, through the engine.
    const at = (qs: number[]) => createPumpCurve({ points: [...points.filter((p) => !qs.includes(Math.round(p.flow * 3600))),
      ...qs.map((q) => ({ ...points.find((p) => p.flow * 3600 > q - 4)!, flow: q / 3600, head: headOf(q), efficiency: 0.74 }))].sort((a, b) => a.flow - b.flow) });
    const one = at([45]);
    expect([one.efficiency, one.bep]).toEqual([null, null]);
    const flat = at([30, 45, 60]);
    expect(flat.efficiency).not.toBeNull();
    expect(flat.bep).toBeNull();
    expect(flat.warnings.map((w) => w.code)).toContain("bep-not-published");
  });
});

describe("the box is offered only where ticking it changes what the engine reads from the page's CSV", () => {
  const all = [...cases.map((c) => ({ ...c, alone: false })), ...alone.map((c) => ({ ...c, alone: true }))];
  /** The engine's BEP, and its efficiency and shaft power at every m³/h of the clicked span. */
  const reading = (s: TracerState) => {
    const { curve } = read(s);
    return [curve.bep, ...Array.from({ length: 96 }, (_, q) => [efficiencyAt(curve, q / 3600), power(curve, q)])];
  };
  for (const c of all) {
    it(`${c.alone ? "the 74 % contour alone, " : ""}${c.name}`, () => {
      const un = state(c.q0, c.q1, false, c.alone), ti = state(c.q0, c.q1, true, c.alone);
      const changes = JSON.stringify(reading(un)) !== JSON.stringify(reading(ti));
      expect(read(un).label !== null).toBe(changes);
    });
  }
});

// Two islands of 74 % (rectangles 20–40 and 60–80 m³/h) inside the 70 % one (10–90) (construction). The curve clicked 0–95
// crosses 74 % at 20, 40, 60 and 80: inside 20–40 and 60–80, outside 40–60, where the efficiency dips below 74 %. Clicked
// 25–95 it starts inside the first island (inside 25–40); clicked 0–75 it ends inside the second (inside 60–75).
const islands = (q0: number, q1: number, taken: boolean): TracerState =>
  ({ ...state(q0, q1, taken), curves: [head(q0, q1, taken), box(2, 70, 10, 90), box(3, 74, 20, 40), box(4, 74, 60, 80)] });
const twoIslands = [
  { name: "both islands crossed", q0: 0, q1: 95, inside: [[20, 40], [60, 80]] },
  { name: "starting inside the first island", q0: 25, q1: 95, inside: [[25, 40], [60, 80]] },
  { name: "ending inside the second island", q0: 0, q1: 75, inside: [[20, 40], [60, 75]] },
];
/** Every warning of the page's one curve, and the engine's curve from its CSV. */
function readAll(s: TracerState) {
  const cals = calibrations(s);
  const ps = unreadPeaks(s, cals);
  const [set] = analyseCsv(csvOf(s, cals)).result.curveSets;
  const curve = createPumpCurve({ points: set.points });
  const eff = set.points.filter((p) => p.efficiency !== undefined).map((p) => ({ q: p.flow * 3600, e: p.efficiency! }));
  return { ps, texts: ps.map((p) => peakWarning(p, "m3/h")), labels: ps.map((p) => peakBoxLabel(p, "m3/h")), curve, eff };
}
const near = (a: number, b: number) => Math.abs(a - b) <= 0.05; // the text's 0.1 m³/h; pixel rounding through the calibration

describe("a curve that leaves a contour and comes back in: inside and outside alternate along it", () => {
  for (const c of twoIslands) {
    for (const taken of [false, true]) {
      it(`two 74 % islands, ${c.name}, box ${taken ? "ticked" : "unticked"}`, () => {
        const { ps, texts, labels, curve, eff } = readAll(islands(c.q0, c.q1, taken));
        const spans = (f: (p: (typeof ps)[number]) => boolean) => ps.filter(f).map((p) => [p.from, p.to]);
        // Outside 40–60 (the dip), inside the two islands' spans: nothing else is named.
        expect(spans((p) => p.valley === true).flat().map((q, i) => near(q, [40, 60][i]))).toEqual([true, true]);
        expect(spans((p) => !p.valley).flat().map((q, i) => near(q, c.inside.flat()[i]))).toEqual([true, true, true, true]);
        const bep = curve.bep ? curve.bep.flow * 3600 : null;
        const inIsland = (q: number) => ps.some((s) => !s.valley && q > s.from && q < s.to);
        const ticked = readAll(islands(c.q0, c.q1, true)).curve.bep;
        ps.forEach((p, i) => {
          const text = texts[i];
          if (p.valley) {
            // The words: below 74 % there, left blank, read across from the rows either side, no BEP in it; no box.
            expect(text).toMatch(/outside the 74 % contour: it leaves it at [\d.]+ m³\/h and comes back in at/);
            expect(labels[i]).toBeNull();
            expect(eff.filter((r) => r.q > p.from && r.q < p.to)).toEqual([]); // no row in the dip, ticked or not (its middle is no peak)
            const before = eff.filter((r) => r.q <= p.from).at(-1), after = eff.find((r) => r.q >= p.to);
            if (before && after) {
              const mid = efficiencyAt(curve, p.midpoint / 3600)!;
              expect(mid).toBeGreaterThanOrEqual(Math.min(before.e, after.e) - 1e-12);
              expect(mid).toBeLessThanOrEqual(Math.max(before.e, after.e) + 1e-12);
              expect(power(curve, p.midpoint)).not.toBeNull();
            }
            expect(bep !== null && bep > p.from && bep < p.to).toBe(false);
            return;
          }
          // An island's span: its BEP claim is the engine's.
          const here = num(text.match(/the engine takes the first of those equal rows, this one, ([\d.]+) m³\/h, as the best-efficiency point/));
          const other = num(text.match(/the engine takes the first of those equal rows, ([\d.]+) m³\/h, as the best-efficiency point, not this one/));
          const none = /no best-efficiency point is known for this curve/.test(text);
          const outside = /puts the best-efficiency point, if it gives one, outside the 74 % contours/.test(text);
          expect([Number.isFinite(here), Number.isFinite(other), none, outside].filter(Boolean)).toHaveLength(1);
          if (Number.isFinite(here)) expect([near(bep ?? NaN, here), near(here, p.midpoint)]).toEqual([true, true]);
          if (Number.isFinite(other)) expect([near(bep ?? NaN, other), near(other, p.midpoint)]).toEqual([true, false]);
          if (none) expect(bep).toBeNull();
          if (outside) expect(bep !== null && inIsland(bep)).toBe(false);
          // Ticked, the middles are rows at 74 %, and the box's label names the BEP ticking gives.
          if (taken) expect(eff.some((r) => near(r.q, p.midpoint) && r.e === 0.74)).toBe(true);
          const named = num((labels[i] ?? "").match(/the first, ([\d.]+) m³\/h, is taken as its best-efficiency point$/));
          const noneLabel = /the first is its first efficiency row, no best-efficiency point either way$/.test(labels[i] ?? "");
          expect([Number.isFinite(named), noneLabel].filter(Boolean)).toHaveLength(1);
          expect(ticked === null).toBe(noneLabel);
          if (Number.isFinite(named)) expect(near(ticked!.flow * 3600, named)).toBe(true);
        });
      });
    }
  }
});

describe("a head curve that crosses none of its panel's contours", () => {
  it("is named, and its words (no efficiency, shaft power or BEP) are the engine's", () => {
    // The 74 % contour over 30–60 m³/h at heads 55–60 m, above the curve (50 m at shutoff): construction.
    const s: TracerState = { ...state(0, 95, false), curves: [head(0, 95, false), { ...box(3, 74, 30, 60), points: [px(30, 55), px(60, 55), px(60, 60), px(30, 60)] }] };
    const { ps, texts, labels, curve, eff } = readAll(s);
    expect(ps).toHaveLength(1);
    expect(texts[0]).toMatch(/^Curve 1 \(200 mm, 2900 rpm\): the efficiency is not read\. The curve crosses none of the contours on its panel \(74 %\)/);
    expect(texts[0]).toMatch(/the CSV writes no efficiency for this curve, and the engine has no efficiency, shaft power or best-efficiency point for it from this chart/);
    expect(labels[0]).toBeNull();
    expect(eff).toEqual([]);
    expect([curve.efficiency, curve.bep, power(curve, 45)]).toEqual([null, null, null]);
    expect(curve.warnings.map((w) => w.code)).toContain("no-efficiency");
  });
});

describe("a curve that crosses contours of one level only, three times or more", () => {
  for (const taken of [false, true]) {
    it(`the two 74 % islands alone, crossed at 20, 40, 60 and 80 m³/h (construction), box ${taken ? "ticked" : "unticked"}: none written, as the words say`, () => {
      const s: TracerState = { ...state(0, 95, taken), curves: [head(0, 95, taken), box(3, 74, 20, 40), box(4, 74, 60, 80)] };
      const { ps, texts, labels, curve, eff } = readAll(s);
      expect(ps).toHaveLength(1);
      const m = texts[0].match(/crosses contours of one level only, 74 %, 4 times, at ([\d.]+), ([\d.]+), ([\d.]+) and ([\d.]+) m³\/h/);
      expect((m ?? []).slice(1).map((q, i) => near(Number(q), [20, 40, 60, 80][i]))).toEqual([true, true, true, true]);
      expect(texts[0]).toMatch(/the CSV writes no efficiency for this curve: the engine has no efficiency, shaft power or best-efficiency point for it/);
      expect(labels[0]).toBeNull();
      expect(eff).toEqual([]);
      expect([curve.efficiency, curve.bep, power(curve, 50)]).toEqual([null, null, null]);
    });
  }
});

// A closed 74 % contour whose lowest vertex sits on the head curve at flow t (a triangle up to 60 m over t ± 5 m³/h): the
// curve touches it there and stays below it, outside (construction: H'' < 0 and the triangle's sides climb 2.375 m per m³/h).
const touching = (id: number, t: number): Curve => ({ ...box(id, 74, t - 5, t + 5), points: [px(t - 5, 60), px(t + 5, 60), px(t, headOf(t))] });

describe("a curve that touches a contour without crossing it: the touch is no crossing", () => {
  for (const taken of [false, true]) {
    it(`touching a 74 % contour at 25 m³/h, then crossing another 74 % contour at 40 and 60 and the 70 % one at 90, box ${taken ? "ticked" : "unticked"}`, () => {
      // 70 % over 10–90, the touched 74 % triangle at 25, a 74 % rectangle over 40–60 (construction): outside 74 % from the
      // touch to 40 (a dip, unread), inside 40–60 (the one peak span); the old count flipped at 25 (inside 25–40, outside 40–60).
      const s: TracerState = { ...state(0, 95, taken), curves: [head(0, 95, taken), box(2, 70, 10, 90), touching(3, 25), box(4, 74, 40, 60)] };
      const { ps, texts, curve, eff } = readAll(s);
      const spans = (f: (p: (typeof ps)[number]) => boolean) => ps.filter(f).map((p) => [p.from, p.to]);
      expect(spans((p) => p.valley === true).flat().map((q, i) => near(q, [25, 40][i]))).toEqual([true, true]);
      expect(spans((p) => !p.valley).flat().map((q, i) => near(q, [40, 60][i]))).toEqual([true, true]);
      const valley = texts[ps.findIndex((p) => p.valley)];
      expect(valley).toMatch(/outside the 74 % contour: it touches it at 25\.0 m³\/h without going in and comes back in at 40\.0 m³\/h/);
      // The peak span's words are the engine's: unticked, the BEP outside 40–60; ticked, at its middle, 50 m³/h.
      const text = texts[ps.findIndex((p) => !p.valley)];
      const bep = curve.bep ? curve.bep.flow * 3600 : NaN;
      if (taken) {
        expect(num(text.match(/the middle of that span, ([\d.]+) m³\/h, is written at 74 % and taken as the best-efficiency point/))).toBeCloseTo(50, 1);
        expect(near(bep, 50)).toBe(true);
      } else {
        expect(text).toMatch(/puts the best-efficiency point outside the contour/);
        expect(bep > 40 && bep < 60).toBe(false);
      }
      // No row in the dip; before it the rows read up to 74 %, the touch's level, at most (old: the dip's middle, 32.5, at 74 %, ticked).
      expect(eff.filter((r) => r.q > 25.05 && r.q < 39.95)).toEqual([]);
      expect(eff.filter((r) => r.q <= 25.05).every((r) => r.e <= 0.74)).toBe(true);
    });
  }

  for (const taken of [false, true]) {
    it(`crossing the 70 % contour at 20 m³/h, touching a 74 % contour at 40 and ending at 60, box ${taken ? "ticked" : "unticked"}`, () => {
      // The old count made 74 % crossed once: the curve "ended inside" it from 40 to 60 and, ticked, 50 m³/h was written at 74 %.
      const s: TracerState = { ...state(0, 60, taken), curves: [head(0, 60, taken), box(2, 70, 20, 80), touching(3, 40)] };
      const { ps, curve, eff } = readAll(s);
      expect(ps).toEqual([]); // nothing unread inside a contour: the curve is never inside 74 %
      // The CSV's efficiency rises from 70 % at the crossing towards 74 % at the touch and stops there, ticked or not (old, ticked:
      // a row at 50 m³/h at 74 %); the engine reads none past it.
      expect(eff.length).toBeGreaterThanOrEqual(2);
      expect(eff.every((r, i) => r.q >= 20 - 0.05 && r.q <= 40 + 0.05 && r.e <= 0.74 && (i === 0 || r.e > eff[i - 1].e))).toBe(true);
      expect(efficiencyAt(curve, 50 / 3600)).toBeNull();
    });
  }
});
