/**
 * Every pipe table at its ends and beyond (pipes.ts, pipesDN.ts, pipe-table.ts): the smallest and largest size of each,
 * sizes a table does not list, and a row whose wall leaves no bore. Check values: the tables' own printed rows
 * (ID = OD − 2·wall − 2·lining, common practice) and geometry (a wall of half the OD or more leaves no bore).
 */
import { describe, expect, it } from "vitest";
import { EngineInputError, innerDiameter, PIPE_TABLES } from "./index.ts";
import { buildPipeTable } from "./pipe-table.ts";
import { prng } from "../../fixtures/prng";

const meta = { id: "t", name: "Test table", standard: "none", material: "steel", source: "invented" };

describe("every catalogue table, inch and DN", () => {
  it("smallest and largest size read back through innerDiameter; bores positive and rising with the OD; wall below half the OD", () => {
    for (const t of PIPE_TABLES) {
      const [first, last] = [t.sizes[0], t.sizes[t.sizes.length - 1]];
      expect(innerDiameter(t.id, first.nominal), t.id).toBe(first.innerDiameter);
      expect(innerDiameter(t.id, last.nominal), t.id).toBe(last.innerDiameter);
      t.sizes.forEach((s, i) => {
        expect(s.innerDiameter, `${t.id} ${s.nominal}`).toBeGreaterThan(0);
        expect(2 * s.wall, `${t.id} ${s.nominal}`).toBeLessThan(s.outsideDiameter);
        if (i > 0) expect(s.outsideDiameter, `${t.id} ${s.nominal}`).toBeGreaterThan(t.sizes[i - 1].outsideDiameter);
        if (i > 0) expect(s.innerDiameter, `${t.id} ${s.nominal}`).toBeGreaterThan(t.sizes[i - 1].innerDiameter);
      });
    }
  });
  it("a size a table does not list is refused by name (every other table's labels, and 300 generated labels), never guessed", () => {
    const r = prng(3);
    const labels = new Set(PIPE_TABLES.flatMap((t) => t.sizes.map((s) => s.nominal)));
    for (let i = 0; i < 300; i++) labels.add([`DN${Math.floor(r() * 1200)}`, `d${Math.floor(r() * 800)}`, `${Math.floor(r() * 60)}`, ` ${Math.floor(r() * 30)}`][i % 4]);
    let refused = 0;
    for (const t of PIPE_TABLES) {
      for (const n of labels) {
        if (t.sizes.some((s) => s.nominal === n)) continue;
        expect(() => innerDiameter(t.id, n), `${t.id} "${n}"`).toThrow(EngineInputError);
        expect(() => innerDiameter(t.id, n)).toThrow(`${t.name} has no size "${n}"`);
        refused++;
      }
    }
    expect(refused).toBeGreaterThan(PIPE_TABLES.length * 200); // the generated labels repeat some: about 270 distinct per table
  });
});

describe("buildPipeTable: a row whose wall leaves no bore", () => {
  it("a wall of half the OD or more (or with the lining) is refused naming the table and size; just below half is a bore", () => {
    // Before: 10 mm OD with a 6 mm wall gave an inner diameter of −2 mm, silently.
    for (const od of [10, 21.3, 114.3, 842]) {
      for (const share of [0.5, 0.5 + 1e-9, 0.51, 0.75, 1, 3]) {
        expect(() => buildPipeTable(meta, [["X", od, od * share]], 1e-3), `${od} × ${share}`).toThrow(/Test table X: .* leave no bore/);
      }
      const thin = buildPipeTable(meta, [["X", od, od * (0.5 - 1e-6)]], 1e-3);
      expect(thin.sizes[0].innerDiameter).toBeGreaterThan(0);
      expect(() => buildPipeTable(meta, [["X", od, od * 0.45]], 1e-3, () => od * 0.05)).toThrow(EngineInputError);
      expect(() => buildPipeTable(meta, [["X", od, 0]], 1e-3)).toThrow(EngineInputError);
    }
  });
});
