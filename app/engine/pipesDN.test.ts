import { describe, expect, it } from "vitest";
import { DN_TABLES } from "./pipesDN.ts";
import { EngineInputError, innerDiameter, material, PIPE_TABLES, pipeTable } from "./index.ts";

describe("DN pipe tables (EN 10255, EN 10217 / ISO 4200, EN 1057, ISO 4427, EN 545)", () => {
  it("every DN table is in the catalogue, names its standard and source, and says 'from memory' where recalled", () => {
    for (const t of DN_TABLES) {
      expect(PIPE_TABLES).toContain(t);
      expect(t.standard).toMatch(/^(EN|ISO)/);
      expect(t.source).toMatch(/from memory/);
      expect(() => material(t.material)).not.toThrow();
    }
    expect(new Set(PIPE_TABLES.map((t) => t.id)).size).toBe(PIPE_TABLES.length);
  });

  it("each table's inner diameters increase monotonically with size, and OD > ID > 0", () => {
    for (const t of DN_TABLES) {
      expect(t.sizes.length).toBeGreaterThan(5);
      for (let i = 0; i < t.sizes.length; i++) {
        const s = t.sizes[i];
        expect(s.innerDiameter, `${t.id} ${s.nominal}`).toBeGreaterThan(0);
        expect(s.outsideDiameter, `${t.id} ${s.nominal}`).toBeGreaterThan(s.innerDiameter);
        if (i > 0) expect(s.innerDiameter, `${t.id} ${s.nominal}`).toBeGreaterThan(t.sizes[i - 1].innerDiameter);
      }
    }
  });

  it("inner diameter = OD − 2·wall (− 2·lining), hand-checked from the tables' own numbers", () => {
    // EN 10255 M, DN50: 60.3 − 2 × 3.6 = 53.1 mm (table values from memory).
    expect(innerDiameter("en10255-medium", "DN50")).toBeCloseTo(0.0531, 10);
    // EN 1057 22 × 0.9: 22 − 1.8 = 20.2 mm (from memory).
    expect(innerDiameter("en1057-copper", "22 × 0.9")).toBeCloseTo(0.0202, 10);
    // ISO 4427 PE100 SDR 11 d110: 110 − 2 × 10.0 = 90.0 mm; SDR 17 d110: 110 − 2 × 6.6 = 96.8 mm (from memory).
    expect(innerDiameter("iso4427-pe100-sdr11", "d110")).toBeCloseTo(0.09, 10);
    expect(innerDiameter("iso4427-pe100-sdr17", "d110")).toBeCloseTo(0.0968, 10);
    // EN 545 DN150: 170 − 2 × 4.5 − 2 × 3 (lining) = 155 mm; DN400: 429 − 2 × 6.5 − 2 × 5 = 406 mm (from memory).
    expect(innerDiameter("en545-ductile", "DN150")).toBeCloseTo(0.155, 10);
    expect(innerDiameter("en545-ductile", "DN400")).toBeCloseTo(0.406, 10);
    // EN 10217 / ISO 4200 DN100: 114.3 − 2 × 3.6 = 107.1 mm (from memory).
    expect(innerDiameter("en10217-steel", "DN100")).toBeCloseTo(0.1071, 10);
    // SDR: a thinner wall for the same OD gives a larger bore (definition of SDR = OD / wall).
    expect(innerDiameter("iso4427-pe100-sdr17", "d250")).toBeGreaterThan(innerDiameter("iso4427-pe100-sdr11", "d250"));
  });

  it("sizes outside a table are refused, never guessed", () => {
    expect(() => innerDiameter("en10255-medium", "DN200")).toThrow(EngineInputError); // EN 10255 ends at DN150
    expect(() => innerDiameter("en545-ductile", "DN50")).toThrow(EngineInputError); // below the table
    expect(() => innerDiameter("iso4427-pe100-sdr17", "d20")).toThrow(EngineInputError); // SDR 17 starts at d40 here
    expect(() => innerDiameter("en1057-copper", "")).toThrow(EngineInputError);
    expect(() => innerDiameter("en1057-copper", "22")).toThrow(/has no size "22"/);
    expect(() => pipeTable("en-unknown")).toThrow(EngineInputError);
  });
});
