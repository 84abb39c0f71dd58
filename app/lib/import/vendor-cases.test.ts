// Vendor files as they come (issue 16): title-line metadata, encodings, run-out points and the
// drop-points policy, blank key cells, P/η/Q/H consistency, curve names. Fixtures are our own
// invented data in fixtures/csv/ (see the README table there).
import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyseCsv, curveName, curveNameOfKey, decodeBytes, type Mapping } from "./index";
import { inSI, renderQuantities } from "~/engine/quantityText";
import { UNIT_SYSTEMS } from "~/engine";
import { fixture } from "./test-helpers";

const bytes = (name: string) => new Uint8Array(readFileSync(new URL(`../../../fixtures/csv/${name}`, import.meta.url)));

describe("title-line metadata", () => {
  it("a wide file whose model and speed stand only in the title is proposed both as defaults, and imports", () => {
    const a = analyseCsv(fixture("title-line-wide.csv"));
    expect(a.title.model).toBe("FW-3x2-8"); // source: title-line-wide.csv line 2 "Model FW-3x2-8 - 3500 rpm"
    expect(a.title.speed).toBe(3500); // source: same line
    expect(a.title.fluid).toBe("clean water 20 °C"); // source: same line
    expect(a.mapping.defaults).toMatchObject({ model: "FW-3x2-8", speed: 3500 }); // proposed (the page shows them to confirm)
    expect(a.result.problems.filter((p) => p.severity === "error")).toEqual([]);
    expect(a.result.curveSets.map((c) => c.key)).toEqual(["FW-3x2-8|3500|190", "FW-3x2-8|3500|175"]); // source: blocks Head 190mm, Head 175mm
  });
  it("without the title reader the same file is refused as before (no model)", () => {
    const m: Mapping = { ...analyseCsv(fixture("title-line-wide.csv")).mapping, defaults: {} };
    const a = analyseCsv(fixture("title-line-wide.csv"), m);
    expect(a.result.problems.map((p) => p.reason)).toContain("no column is mapped to model and no default model is set"); // source: mapping.ts checkMapping
  });
  it("model, speed in 1/min, impeller Ø in mm and the medium from a long file's title", () => {
    const a = analyseCsv(fixture("title-line-long.csv"));
    expect(a.title).toMatchObject({ model: "LH 40-160", speed: 2900, impeller: 162, impellerUnit: "mm", fluid: "water 40 °C" }); // source: title-line-long.csv line 2
    expect(a.result.curveSets).toHaveLength(1);
    expect(a.result.curveSets[0]).toMatchObject({ model: "LH 40-160", speed: 2900, impellerDiameter: 0.162, ok: true }); // source: 162 mm = 0.162 m
  });
  it("a column wins over the title: defaults are only proposed for what no column holds", () => {
    const text = "Data sheet, Model ZZ-9 - 1450 rpm\nModel,Speed (rpm),Flow (m3/h),Head (m)\nA,2900,0,10\nA,2900,1,9.9\nA,2900,2,9.5\n";
    const a = analyseCsv(text);
    expect(a.title).toMatchObject({ model: "ZZ-9", speed: 1450 }); // source: construction
    expect(a.mapping.defaults.model).toBeUndefined(); // a model column exists
    expect(a.mapping.defaults.speed).toBeUndefined(); // a speed column exists
  });
});

describe("encodings", () => {
  const expected = "Förderhöhe m"; // source: the fixtures' fifth header, written with Python's cp1252 / utf-16 codecs
  it("UTF-8 BOM followed by Windows-1252 bytes: no debris in the first header, umlauts right", () => {
    const d = decodeBytes(bytes("bom-then-1252.csv"));
    expect(d).toMatchObject({ encoding: "windows-1252", bom: true, how: "fallback" });
    const a = analyseCsv(d.text);
    expect(a.sniff.headers[0]).toBe("Modell"); // not "ï»¿Modell"
    expect(a.sniff.headers[4]).toBe(expected);
    expect(a.result.curveSets[0].model).toBe("Grauwald GW-Ö1");
  });
  it("Windows-1252 without BOM falls back the same way", () => {
    const d = decodeBytes(bytes("windows-1252.csv"));
    expect(d).toMatchObject({ encoding: "windows-1252", bom: false, how: "fallback" });
    expect(analyseCsv(d.text).sniff.headers[4]).toBe(expected);
  });
  it("UTF-16 LE and BE with BOM", () => {
    for (const [f, enc] of [["utf16le-bom.csv", "utf-16le"], ["utf16be-bom.csv", "utf-16be"]] as const) {
      const d = decodeBytes(bytes(f));
      expect(d).toMatchObject({ encoding: enc, bom: true, how: "bom" });
      const a = analyseCsv(d.text);
      expect(a.sniff.headers[4]).toBe(expected);
      expect(a.result.curveSets.map((c) => [c.model, c.points.length, c.ok])).toEqual([["Grauwald GW-Ö1", 5, true]]); // source: 5 rows in the fixture
    }
  });
  it("UTF-8 with and without BOM; a chosen encoding overrides the guess", () => {
    const u = new TextEncoder().encode("Modell;Förderhöhe m\n");
    expect(decodeBytes(u)).toMatchObject({ encoding: "utf-8", bom: false, text: "Modell;Förderhöhe m\n" });
    expect(decodeBytes(new Uint8Array([0xef, 0xbb, 0xbf, ...u]))).toMatchObject({ encoding: "utf-8", bom: true, text: "Modell;Förderhöhe m\n" });
    expect(decodeBytes(u, "windows-1252").text).toBe("Modell;FÃ¶rderhÃ¶he m\n"); // source: UTF-8 bytes C3 B6 read as 1252 "Ã¶" (common practice: the classic mojibake)
  });
});

describe("run-out points and the policy", () => {
  it("points past zero head at the high-flow end are dropped with a warning; both curves are kept", () => {
    const a = analyseCsv(fixture("run-out.csv"));
    expect(a.result.problems.map((p) => [p.row, p.code, p.severity])).toEqual([
      [8, "run-out", "warning"],
      [15, "run-out", "warning"],
    ]); // source: run-out.csv lines 8 and 15 have head −3.20 m and −0.80 m
    expect(a.result.curveSets.map((c) => [c.key, c.points.length, c.ok])).toEqual([
      ["Quillmere QM-65|2900|200", 6, true],
      ["Quillmere QM-65|1450|200", 6, true],
    ]); // source: 7 rows per curve, the last one dropped
  });
  it("a negative head followed by ordinary points is still an error (not a run-out)", () => {
    const t = "Model,Speed (rpm),Flow (m3/h),Head (m)\nA,2900,0,10\nA,2900,1,-1\nA,2900,2,9\nA,2900,3,8\n";
    const a = analyseCsv(t);
    expect(a.result.problems.map((p) => [p.row, p.code])).toEqual([[3, "negative"]]); // source: construction
    expect(a.result.curveSets[0].ok).toBe(false);
  });
  it("skip-curves (default) keeps a curve with a bad point out; drop-points imports it with the good points", () => {
    const t = fixture("bad.csv");
    const skip = analyseCsv(t);
    const drop = analyseCsv(t, { ...skip.mapping, policy: "drop-points" });
    expect(skip.result.curveSets.filter((c) => c.ok).map((c) => c.key)).toEqual(["Brindle BR-40K|1450|160"]); // source: validate.test.ts (only clean curve)
    const ok = drop.result.curveSets.filter((c) => c.ok).map((c) => c.key);
    // source: bad.csv — BR-40G has 2 points (too few) and stays out; every other curve keeps ≥ 3 good points
    expect(ok).not.toContain("Brindle BR-40G|2900|160");
    expect(ok).toContain("Brindle BR-40B|2900|160");
    expect(drop.result.curveSets.find((c) => c.key === "Brindle BR-40B|2900|160")!.points).toHaveLength(3); // source: bad.csv lines 7, 8, 10
    expect(drop.result.problems).toEqual(skip.result.problems); // the same list names what was dropped
  });
});

describe("blank key cells", () => {
  it("a blank speed cell is one error on its row, charged to the curve above (the curve is not split)", () => {
    const a = analyseCsv(fixture("blank-speed.csv"));
    expect(a.result.problems.map((p) => [p.row, p.column, p.code, p.curveKey])).toEqual([[4, "Speed (rpm)", "missing-value", "Ashgrove AG-32|2900|140"]]); // source: blank-speed.csv line 4
    expect(a.result.curveSets).toHaveLength(1);
  });
  it("ticking fill-down fills it from the row above; a speed for blank cells fills it too", () => {
    const base = analyseCsv(fixture("blank-speed.csv")).mapping;
    const filled = analyseCsv(fixture("blank-speed.csv"), { ...base, fillDownKeys: true });
    expect(filled.result.problems).toEqual([]);
    expect(filled.result.curveSets.map((c) => [c.key, c.points.length, c.ok])).toEqual([["Ashgrove AG-32|2900|140", 5, true]]); // source: 5 rows
    const byDefault = analyseCsv(fixture("blank-speed.csv"), { ...base, defaults: { speed: 2900 } });
    expect(byDefault.result.curveSets.map((c) => [c.key, c.points.length])).toEqual([["Ashgrove AG-32|2900|140", 5]]);
  });
});

describe("P, η, Q, H consistency (η = ρgQH/P)", () => {
  it("flags the one row whose power is 30 % high, with both efficiencies", () => {
    const a = analyseCsv(fixture("consistency.csv"));
    expect(a.result.problems.map((p) => [p.row, p.code, p.severity])).toEqual([[6, "inconsistent", "warning"]]); // source: consistency.csv line 6 (power × 1.3)
    // source: definition η = ρgQH/P, 1000 × 9.80665 × (40/3600) × 20.4 / 4242 W = 0.5240 (ρ: the engine's DEFAULT_POWER_DENSITY)
    expect(a.result.problems[0].reason).toContain("68 %");
    expect(a.result.problems[0].reason).toContain("52.4");
    expect(a.result.curveSets[0].ok).toBe(true); // a warning does not keep the curve out
  });
  it("flips at 3 points of efficiency", () => {
    // row: Q 36 m³/h = 0.01 m³/s, H 10 m, P 1020 W → ρgQH/P = 1000 × 9.80665 × 0.01 × 10 / 1020 = 0.96144 (definition; ρ the engine's, 1000)
    const t = (eff: string) => `Model,Speed (rpm),Flow (m3/h),Head (m),Efficiency (%),Power (kW)\nA,2900,0,12,0,0.5\nA,2900,36,10,${eff},1.02\nA,2900,40,9,,\n`;
    const codes = (eff: string) => analyseCsv(t(eff)).result.problems.map((p) => p.code);
    expect(codes("93.2")).toEqual([]); // 96.144 − 93.2 = 2.94 points: within 3
    expect(codes("93.1")).toEqual(["inconsistent"]); // 3.04 points: over 3
  });
});

describe("curve names for people", () => {
  it('"Model · 2900 rpm · Ø190 mm"', () => {
    // The diameter is a quantity token, shown in the reader's units: SI here; 190 mm = 7.48 in (1 in = 25.4 mm, NIST SP 811).
    expect(inSI(curveName("Brackenfell BX-80", 2900, 0.19))).toBe("Brackenfell BX-80 · 2900 rpm · Ø190 mm"); // source: issue 16 wording
    expect(renderQuantities(curveName("Brackenfell BX-80", 2900, 0.19), UNIT_SYSTEMS.US)).toBe("Brackenfell BX-80 · 2900 rpm · Ø7.48 in");
    expect(inSI(curveNameOfKey("Brackenfell BX-80||190"))).toBe("Brackenfell BX-80 · Ø190 mm"); // no speed
    expect(curveNameOfKey("A|B|1450|")).toBe("A|B · 1450 rpm"); // a "|" inside the model name survives
  });
});
