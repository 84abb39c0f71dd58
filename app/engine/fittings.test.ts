/** Fittings by size: Crane TP-410 (2009 edition, from memory; python3-fluids implements the same tables). */
import { describe, expect, it } from "vitest";
import { CRANE_FT, EngineInputError, fittingK, fittingKDetailed, fluidAt, innerDiameter, prepareSystem, sumKDetailed, TEE_BRANCH_K_2009 } from "./index.ts";

const k = (id: string, nominal: string) => fittingKDetailed(id, innerDiameter("steel-sch40", nominal), nominal);

describe("butterfly valve (centric), Crane TP-410 2009: 45·fT 2–8 in, 35·fT 10–14 in, 25·fT 16–24 in", () => {
  it("n by nominal size at the band edges", () => {
    for (const [nominal, n] of [["2", 45], ["4", 45], ["8", 45], ["10", 35], ["12", 35], ["14", 35], ["16", 25], ["20", 25], ["24", 25]] as const) {
      const r = k("butterfly-valve-open", nominal);
      expect(r.k / CRANE_FT[nominal], nominal).toBeCloseTo(n, 12);
      expect(r.warnings, nominal).toEqual([]);
    }
  });
  it("12 in: K = 35 × 0.013 = 0.455, not 45 × 0.013 = 0.585 (the old value, 29 % high)", () => {
    expect(k("butterfly-valve-open", "12").k).toBeCloseTo(0.455, 12);
  });
  it("a size outside 2–24 in warns (nominal 1 in; 30 in also outside the fT table)", () => {
    const small = fittingKDetailed("butterfly-valve-open", innerDiameter("steel-sch40", "1"), "1");
    expect(small.warnings.map((w) => w.code)).toEqual(["fitting-size-outside-range"]);
    expect(small.warnings[0].message).toContain("1 in");
    const big = fittingKDetailed("butterfly-valve-open", 0.74, "30");
    expect(big.warnings.map((w) => w.code)).toEqual(["fitting-size-outside-range", "ft-outside-table"]);
    expect(big.k / 25).toBeGreaterThan(0); // 25·fT band, fT from the rough-pipe limit
  });
  it("by bore when the nominal size is unknown: 2 in Sch 80 bore (1.939 in) is inside the range (10 % slack), 1 in bore is not", () => {
    expect(fittingKDetailed("butterfly-valve-open", innerDiameter("steel-sch80", "2")).warnings).toEqual([]);
    expect(fittingKDetailed("butterfly-valve-open", 0.0254).warnings.map((w) => w.code)).toContain("fitting-size-outside-range");
  });
});

describe("tee through the branch: Crane TP-410 2009 diverging tee, all flow through the branch, equal bore, 90° → K = 1.69", () => {
  it("1.69 at every tabled size (60·fT of earlier editions is 0.72–1.62, lower: the conservative value governs)", () => {
    expect(TEE_BRANCH_K_2009).toBe(1.69);
    for (const nominal of Object.keys(CRANE_FT)) {
      expect(60 * CRANE_FT[nominal]).toBeLessThan(1.69);
      expect(fittingK("tee-branch", innerDiameter("steel-sch40", nominal), nominal)).toBe(1.69);
    }
  });
  it("below the table, 60·fT from the rough-pipe limit wins when larger (¼ in bore: fT ≈ 0.034 → 2.0)", () => {
    const r = fittingKDetailed("tee-branch", 0.00635);
    expect(r.k).toBeGreaterThan(1.69);
    expect(r.warnings.map((w) => w.code)).toEqual(["ft-outside-table"]);
  });
});

describe("ΣK of a run carries the size warnings into the system", () => {
  it("a 30 in run with a butterfly valve warns once; an unused (count 0) fitting does not", () => {
    expect(sumKDetailed([{ id: "butterfly-valve-open", count: 2 }, { id: "butterfly-valve-open" }], 0.74, "30").warnings).toHaveLength(2);
    expect(sumKDetailed([{ id: "butterfly-valve-open", count: 0 }], 0.0254, "1").warnings).toEqual([]);
    const sys = prepareSystem({ fluid: fluidAt({ kind: "water" }, 20), staticHead: 5,
      discharge: [{ name: "Header", length: 10, diameter: 0.0266, roughness: 4.5e-5, nominal: "1", fittings: [{ id: "butterfly-valve-open" }] }] });
    expect(sys.warnings.map((w) => w.message).join(" ")).toContain("Header: Butterfly valve, open (2–24 in): nominal size 1 in is outside");
  });
  it("refuses a fitting list that is not an array and unknown fitting ids", () => {
    expect(() => sumKDetailed("x" as never, 0.1)).toThrow(EngineInputError);
    expect(() => fittingK("butterfly", 0.1)).toThrow(EngineInputError);
  });
});
