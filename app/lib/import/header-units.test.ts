// Whole files whose headers name a unit the field does not take: a mapping error the distributor sees, never a
// default unit with ok curves (edge hunt of 2026-12-03, item 2). Files are hand-written; values are invented.
import { describe, expect, it } from "vitest";
import { analyseCsv } from "./index";
import type { Mapping } from "./mapping";
import { relClose } from "./test-helpers";

const file = (header: string, speed: string, rows: string[]) => `Model,${header}\n${rows.map((r) => `A,${speed},${r}`).join("\n")}\n`;

describe("header units in whole files", () => {
  it.each([
    ["Speed (Hz),Flow m3/h,Head m", "Speed (Hz)", "Hz", "50"], // source: hunt item 2 (50 Hz was imported as 50 rpm)
    ["Speed rpm,Flow m3/h,Head (kPa)", "Head (kPa)", "kPa", "2900"], // source: hunt item 2 (200 kPa was imported as 200 m)
    ["Speed rpm,Flow m3/h,Head (in)", "Head (in)", "in", "2900"], // source: hunt item 2 (inches imported as m)
    ["Speed rpm,Flow (cfm),Head m", "Flow (cfm)", "cfm", "2900"], // source: importer rule (cubic feet not read)
    ["Speed rpm,Flow m3/h,Head m,Power (PS)", "Power (PS)", "PS", "2900"], // source: hunt item 2 (PS imported as kW)
    ["Speed rpm,Flow m3/h,Head m,Power [MW]", "Power [MW]", "MW", "2900"], // source: hunt item 2 (MW imported as kW)
  ])("%s: a mapping error naming “%s” and “%s”; nothing imported", (header, column, word, speed) => {
    const extra = header.split(",").length > 3 ? ",3" : "";
    const a = analyseCsv(file(header, speed, [`0,20${extra}`, `10,19${extra}`, `20,17${extra}`, `30,14${extra}`]));
    const errors = a.result.problems.filter((p) => p.severity === "error");
    expect(errors.map((p) => [p.row, p.code, p.column])).toEqual([[1, "mapping", column]]); // source: importer rule (one error on the header line)
    expect(errors[0].reason).toContain(`“${column}” gives the unit “${word}”`); // source: importer rule (names header and word)
    expect(a.result.curveSets.filter((c) => c.ok)).toEqual([]); // source: README (nothing is imported under a mapping error)
  });

  it("Flow GPM (Imp): imperial gallons, not US (100 Igpm = 100 × 4.54609 L / 60 s)", () => {
    const a = analyseCsv(file("Speed rpm,Flow GPM (Imp),Head ft", "1450", ["0,100", "100,95", "200,80", "300,55"]));
    expect(a.result.problems).toEqual([]); // source: hand-written clean file
    const q = a.result.curveSets[0].points[1].flow;
    expect(relClose(q, (100 * 4.54609e-3) / 60)).toBe(true); // source: UK Weights and Measures Act 1985 (1 imperial gallon = 4.54609 L exactly)
    expect(relClose(q, (100 * 3.785411784e-3) / 60)).toBe(false); // source: NIST SP 811 (the US gallon, 3.785411784 L: the old reading, 16.7 % low)
  });

  it("Flow (L/h): 500 L/h is 0.5 m³/h, not 500 m³/h", () => {
    const a = analyseCsv(file("Speed rpm,Flow (L/h),Head m", "2900", ["0,20", "500,19", "1000,17", "1500,14"]));
    expect(a.result.problems).toEqual([]); // source: hand-written clean file
    expect(relClose(a.result.curveSets[0].points[1].flow, 0.5 / 3600)).toBe(true); // source: SI definitions (1 L = 1e-3 m³, 1 h = 3600 s)
  });

  it("NPSHa and motor efficiency columns are left unmapped, so they never become NPSHr or the pump's efficiency", () => {
    const a = analyseCsv(file("Speed rpm,Flow m3/h,Head m,NPSHa m,Motor efficiency %", "2900", ["0,20,9,0", "10,19,9,85", "20,17,9,88"]));
    expect(a.mapping.columns.map((c) => c.field)).toEqual(["model", "speed", "flow", "head", "ignore", "ignore"]); // source: definitions (NPSHa is the system's; motor η is not the pump's)
    expect(a.result.curveSets[0].points.every((p) => p.npshr === undefined && p.efficiency === undefined)).toBe(true); // source: same
  });

  // P1 is the motor's electrical input and P2 the pump's shaft power (common practice in pump data sheets); the importer's
  // power is shaft power, so a P1 column is never read as it (edge hunt of 2026-12-03: "P1 kW" became shaft power).
  const mappingWarnings = (a: ReturnType<typeof analyseCsv>) => a.result.problems.filter((p) => p.code === "mapping" && p.severity === "warning");
  it("a P1-only file imports with no power column and a warning naming the header", () => {
    const a = analyseCsv(file("Speed rpm,Flow m3/h,Head m,P1 kW", "2900", ["0,20,1.0", "10,19,1.2", "20,17,1.4"]));
    expect(a.mapping.columns.map((c) => c.field)).toEqual(["model", "speed", "flow", "head", "ignore"]); // source: common practice (P1 is not shaft power)
    expect(mappingWarnings(a).map((p) => [p.row, p.column])).toEqual([[1, "P1 kW"]]); // source: importer rule (one warning on the header line)
    expect(mappingWarnings(a)[0].reason).toContain("“P1 kW” is left unmapped: its header names the motor's electrical input power (P1)"); // source: importer rule (names the header)
    expect(mappingWarnings(a)[0].reason).toContain("Dutymark's power is the pump's shaft power (P2)"); // source: importer rule (says what power means)
    expect(mappingWarnings(a)[0].reason).toContain("no shaft power (P2) or pump efficiency column"); // source: engine (shaftPowerAt needs power or efficiency)
    expect(a.result.problems.filter((p) => p.severity === "error")).toEqual([]); // source: a warning, not an error: the curves import
    expect(a.result.curveSets.map((c) => c.ok)).toEqual([true]); // source: hand-written clean file
    expect(a.result.curveSets[0].points.every((p) => p.power === undefined)).toBe(true); // source: no power column mapped
  });

  it("with a pump efficiency column, the warning says shaft power comes from it", () => {
    const a = analyseCsv(file("Speed rpm,Flow m3/h,Head m,Eff %,Input power (kW)", "2900", ["0,20,0,1.0", "10,19,55,1.2", "20,17,70,1.4"]));
    expect(a.mapping.columns[5].field).toBe("ignore"); // source: common practice (input power is P1)
    expect(mappingWarnings(a).map((p) => p.column)).toEqual(["Input power (kW)"]); // source: importer rule
    expect(mappingWarnings(a)[0].reason).toContain("worked out from the pump efficiency column “Eff %” instead (P2 = ρ·g·Q·H / η)"); // source: definition of pump efficiency
  });

  it.each([
    ["P1 kW,P2 kW", "P2 kW"], // source: common practice (P2 is shaft power)
    ["P2 kW,P1 kW", "P2 kW"], // source: same, other order
    ["Input power (kW),Shaft power (kW)", "Shaft power (kW)"], // source: same (was: the first, the input power, mapped)
    ["Motor kW,Absorbed power (kW)", "Absorbed power (kW)"], // source: common practice (absorbed power is P2)
  ])("%s: the shaft power column “%s” is mapped, the input power column left out without a warning", (powers, shaft) => {
    // Input power 0.7/1.0/1.6 kW and shaft power 0.5/0.8/1.3 kW (invented; above ρgQH, 0.518 and 0.926 kW at 10 and 20 m³/h), in the header's order.
    const rows = [["0,20", "0.7", "0.5"], ["10,19", "1.0", "0.8"], ["20,17", "1.6", "1.3"]];
    const a = analyseCsv(file(`Speed rpm,Flow m3/h,Head m,${powers}`, "2900", rows.map(([qh, p1, p2]) => (powers.startsWith(shaft) ? `${qh},${p2},${p1}` : `${qh},${p1},${p2}`))));
    expect(a.mapping.columns.filter((c) => c.field === "power").map((c) => c.header)).toEqual([shaft]); // source: see the row
    expect(a.result.problems).toEqual([]); // source: hand-written clean file (P2 given, so nothing to warn about)
    expect(a.result.curveSets[0].points.map((p) => p.power)).toEqual([500, 800, 1300]); // source: the P2 column's 0.5, 0.8, 1.3 kW (SI prefixes)
  });

  it("a P1 column mapped to power by hand is read as the user says, with a warning", () => {
    const text = file("Speed rpm,Flow m3/h,Head m,P1 kW", "2900", ["0,20,1.0", "10,19,1.2", "20,17,1.4"]);
    const m = analyseCsv(text).suggestedMapping;
    const byHand: Mapping = { ...m, columns: m.columns.map((c) => (c.index === 4 ? { ...c, field: "power" as const, unit: "kW" as const, unitSource: "user" as const } : c)) };
    const a = analyseCsv(text, byHand);
    expect(mappingWarnings(a).map((p) => p.column)).toEqual(["P1 kW"]); // source: importer rule (a saved or hand-made mapping is warned too)
    expect(mappingWarnings(a)[0].reason).toContain("“P1 kW” is mapped to shaft power, but its header names the motor's electrical input power (P1)"); // source: same
    expect(a.result.curveSets[0].points[1].power).toBe(1200); // source: the user's mapping (1.2 kW)
  });

  // Hydraulic power P_hyd = ρ·g·Q·H and shaft power P2 = P_hyd / η (common practice): read as P2 it understates shaft power by the
  // pump efficiency. A power factor is a ratio (0.85 read in the default kW was 850 W). bkW is brake kW, shaft power (edge hunt of 2026-12-03).
  it("a hydraulic power column is left unmapped with a warning naming it; it never becomes shaft power", () => {
    // Invented points: P_hyd = 998.2 × 9.80665 × Q × H at Q = 0, 10, 20 m³/h and H = 20, 19, 17 m (0, 0.517, 0.925 kW).
    const a = analyseCsv(file("Speed rpm,Flow m3/h,Head m,Hydraulic power (kW)", "2900", ["0,20,0", "10,19,0.517", "20,17,0.925"]));
    expect(a.mapping.columns.map((c) => c.field)).toEqual(["model", "speed", "flow", "head", "ignore"]); // source: common practice (hydraulic power is not P2)
    expect(mappingWarnings(a).map((p) => [p.row, p.column])).toEqual([[1, "Hydraulic power (kW)"]]); // source: importer rule (one warning on the header line)
    expect(mappingWarnings(a)[0].reason).toContain("“Hydraulic power (kW)” is left unmapped: its header names the hydraulic power (the power given to the liquid, P_hyd = ρ·g·Q·H)"); // source: importer rule (names the header)
    expect(mappingWarnings(a)[0].reason).toContain("P2 = P_hyd / η"); // source: definition of pump efficiency
    expect(mappingWarnings(a)[0].reason).toContain("no shaft power (P2) or pump efficiency column"); // source: engine (shaftPowerAt needs power or efficiency)
    expect(a.result.curveSets.map((c) => c.ok)).toEqual([true]); // source: a warning, not an error
    expect(a.result.curveSets[0].points.every((p) => p.power === undefined)).toBe(true); // source: no power column mapped (was 517 W read as shaft power)
  });

  it.each([
    ["Phyd [kW]", "Eff %"], // source: common practice (P_hyd symbol)
    ["Pw (kW)", "Eff %"], // source: same (water power)
    ["Output power", "Eff %"], // source: same (the pump's power output is the power given to the liquid)
  ])("“%s” beside “%s”: left out, and shaft power comes from the efficiency column", (hyd, eff) => {
    const a = analyseCsv(file(`Speed rpm,Flow m3/h,Head m,${eff},${hyd}`, "2900", ["0,20,0,0", "10,19,55,0.517", "20,17,70,0.925"]));
    expect(a.mapping.columns[5].field).toBe("ignore"); // source: common practice (hydraulic power is not P2)
    expect(mappingWarnings(a).map((p) => p.column)).toEqual([hyd]); // source: importer rule
    expect(mappingWarnings(a)[0].reason).toContain(`worked out from the pump efficiency column “${eff}” instead (P2 = ρ·g·Q·H / η)`); // source: definition of pump efficiency
    expect(a.result.curveSets[0].points.every((p) => p.power === undefined)).toBe(true); // source: no power column mapped
  });

  it("Hydraulic power beside P2: P2 is the power column, the hydraulic one left out without a warning", () => {
    const a = analyseCsv(file("Speed rpm,Flow m3/h,Head m,Hydraulic power (kW),P2 kW", "2900", ["0,20,0,0.5", "10,19,0.517,0.8", "20,17,0.925,1.3"]));
    expect(a.mapping.columns.filter((c) => c.field === "power").map((c) => c.header)).toEqual(["P2 kW"]); // source: common practice (P2 is shaft power; was: the first, the hydraulic power)
    expect(a.result.problems).toEqual([]); // source: hand-written clean file (P2 given)
    expect(a.result.curveSets[0].points.map((p) => p.power)).toEqual([500, 800, 1300]); // source: the P2 column's 0.5, 0.8, 1.3 kW (SI prefixes)
  });

  it("a hydraulic power column mapped to power by hand is read as the user says, with a warning", () => {
    // values above ρgQH at ρ = 1000 kg/m³ (0.518, 0.926 kW): the exact hydraulic power, mapped as shaft power, implies η 100.2 % and is refused (power-hydraulic.test.ts)
    const text = file("Speed rpm,Flow m3/h,Head m,Phyd kW", "2900", ["0,20,0.1", "10,19,0.6", "20,17,1.0"]);
    const m = analyseCsv(text).suggestedMapping;
    const byHand: Mapping = { ...m, columns: m.columns.map((c) => (c.index === 4 ? { ...c, field: "power" as const, unit: "kW" as const, unitSource: "user" as const } : c)) };
    const a = analyseCsv(text, byHand);
    expect(mappingWarnings(a).map((p) => p.column)).toEqual(["Phyd kW"]); // source: importer rule (a saved or hand-made mapping is warned too)
    expect(mappingWarnings(a)[0].reason).toContain("“Phyd kW” is mapped to shaft power, but its header names the hydraulic power"); // source: same
    expect(a.result.curveSets[0].points[1].power).toBe(600); // source: the user's mapping (0.6 kW)
  });

  it.each([
    ["Power factor,P2 kW"], // source: definition (power factor P/S is a ratio; it was mapped to power before P2)
    ["cos φ (-),P2 kW"], // source: same
    ["PF,Shaft power (kW)"], // source: same
  ])("%s: the power factor is never power; the shaft power column is", (powers) => {
    const a = analyseCsv(file(`Speed rpm,Flow m3/h,Head m,${powers}`, "2900", ["0,20,0.80,0.5", "10,19,0.85,0.8", "20,17,0.86,1.3"]));
    expect(a.mapping.columns[4].field).toBe("ignore"); // source: see the row
    expect(a.result.problems).toEqual([]); // source: hand-written clean file (no warning needed for a power factor)
    expect(a.result.curveSets[0].points.map((p) => p.power)).toEqual([500, 800, 1300]); // source: the shaft power column (was 800, 850, 860 W from the power factor)
  });

  it("bkW is brake kW: the column is shaft power in kW, read from the header", () => {
    const a = analyseCsv(file("Speed rpm,Flow m3/h,Head m,bkW", "2900", ["0,20,0.5", "10,19,0.8", "20,17,1.3"]));
    expect(a.mapping.columns[4]).toMatchObject({ field: "power", unit: "kW", unitSource: "header" }); // source: common practice (brake kW = shaft kW; was unmapped)
    expect(a.result.problems).toEqual([]); // source: hand-written clean file
    expect(a.result.curveSets[0].points.map((p) => p.power)).toEqual([500, 800, 1300]); // source: 0.5, 0.8, 1.3 kW (SI prefixes)
  });

  // A units row directly under the names ("Model,Speed,Flow,Head" over ",rpm,l/h,m") had been taken for the header
  // when one of its words was not in the sniffer's short list: every point then failed with "head is empty".
  it("a units row under the names gives the columns their units (header text + unit)", () => {
    const a = analyseCsv("Model,Speed,Flow,Head\n,rpm,l/h,m\nA,2900,0,20\nA,2900,500,19\nA,2900,1000,17\n");
    expect(a.sniff.headers).toEqual(["Model", "Speed rpm", "Flow l/h", "Head m"]); // source: importer rule (names row + units row)
    expect([a.sniff.headerLine, a.sniff.dataStartLine]).toEqual([1, 3]); // source: hand-written file (units on line 2)
    expect(a.mapping.columns.map((c) => [c.field, c.unit, c.unitSource ?? null])).toEqual([
      ["model", null, null], ["speed", "rpm", "header"], ["flow", "l/h", "header"], ["head", "m", "header"],
    ]); // source: units read from the units row
    expect(a.result.problems).toEqual([]); // source: hand-written clean file
    expect(relClose(a.result.curveSets[0].points[1].flow, 0.5 / 3600)).toBe(true); // source: SI definitions (500 L/h = 0.5 m³/h)
  });

  it("a units row of imperial gallons, feet, % and bkW: each read as written", () => {
    const a = analyseCsv("Model,Speed,Flow,Head,Eff,Power\n,1/min,Imp. gpm,(ft),%,bkW\nA,1450,0,100,0,1.0\nA,1450,100,95,60,3.6\nA,1450,200,80,72,5.0\n");
    expect(a.sniff.headers).toEqual(["Model", "Speed 1/min", "Flow Imp. gpm", "Head (ft)", "Eff %", "Power bkW"]); // source: importer rule
    expect(a.mapping.columns.slice(1).map((c) => c.unit)).toEqual(["rpm", "imp gpm", "ft", "%", "kW"]); // source: see the row
    expect(a.result.problems.filter((p) => p.severity === "error")).toEqual([]); // source: hand-written file
    const pt = a.result.curveSets[0].points[1];
    expect(relClose(pt.flow, (100 * 4.54609e-3) / 60)).toBe(true); // source: UK Weights and Measures Act 1985 (imperial gallon 4.54609 L)
    expect(relClose(pt.head, 95 * 0.3048)).toBe(true); // source: NIST SP 811 (foot = 0.3048 m)
    expect(pt.power).toBe(3600); // source: 3.6 bkW (SI prefixes; invented above ρgQH, 2.15 kW at 100 Imp. gpm and 95 ft, python3)
  });

  it("a units row with a word the field does not take is named as such (a mapping error), not a missing value on every row", () => {
    const a = analyseCsv("Model,Speed,Flow,Head\n,rpm,m3/h,kPa\nA,2900,0,200\nA,2900,10,190\nA,2900,20,170\n");
    const errors = a.result.problems.filter((p) => p.severity === "error");
    expect(errors.map((p) => [p.row, p.code, p.column])).toEqual([[1, "mapping", "Head kPa"]]); // source: importer rule (one error on the header line)
    expect(errors[0].reason).toContain("“Head kPa” gives the unit “kPa”"); // source: importer rule (H = Δp/(ρg) needs a density)
    expect(a.result.curveSets.filter((c) => c.ok)).toEqual([]); // source: README (nothing is imported under a mapping error)
  });

  it("a unit the user chose clears the error; a default unit or one chosen for another header does not", () => {
    const text = file("Speed rpm,Flow m3/h,Head (kPa)", "2900", ["0,20", "10,19", "20,17"]);
    const m = analyseCsv(text).suggestedMapping;
    expect(m.columns[3]).toMatchObject({ field: "head", unit: "m", unitSource: "default" }); // source: DEFAULT_UNIT (only a placeholder: refused below)
    const chosen: Mapping = { ...m, columns: m.columns.map((c) => (c.index === 3 ? { ...c, unitSource: "user" as const } : c)) };
    const ok = analyseCsv(text, chosen).result;
    expect(ok.problems).toEqual([]); // source: importer rule (the user answered for the column)
    expect(ok.curveSets[0].points[1].head).toBe(19); // source: the user's unit, m
    const asApi: Mapping = { ...m, columns: m.columns.map((c) => (c.index === 3 ? { ...c, unitSource: undefined } : c)) };
    expect(analyseCsv(text, asApi).result.problems.map((p) => p.code)).toEqual(["mapping"]); // source: importer rule (only "user" answers)
    const saved = analyseCsv(text.replace("Head (kPa)", "Head m")).suggestedMapping;
    const fromOther: Mapping = { ...saved, columns: saved.columns.map((c) => (c.index === 3 ? { ...c, unitSource: "user" as const } : c)) };
    const p = analyseCsv(text, fromOther).result.problems;
    expect(p.map((x) => [x.code, x.severity, x.column])).toEqual([["header-changed", "warning", "Head (kPa)"], ["mapping", "error", "Head (kPa)"]]); // source: importer rule (the choice was for “Head m”)
  });

  it("of two columns for one field, the one whose unit can be read is mapped and the refused one left unmapped", () => {
    const a = analyseCsv("Model,Speed (Hz),Speed rpm,Flow m3/h,Head (kPa),Head m\nA,50,2900,0,200,20\nA,50,2900,10,190,19\nA,50,2900,20,170,17\n");
    expect(a.mapping.columns.map((c) => c.field)).toEqual(["model", "ignore", "speed", "flow", "ignore", "head"]); // source: importer rule (readable unit first)
    expect(a.result.problems).toEqual([]); // source: hand-written clean file once mapped so
    expect(a.result.curveSets.map((c) => [c.key, c.ok])).toEqual([["A|2900|", true]]); // source: hand-written file (2900 rpm)
  });

  it("wide blocks by frequency (Q@50Hz, H@50Hz) are refused, not read as impellers of 50 and 60 mm", () => {
    const a = analyseCsv("Model,Q@50Hz,H@50Hz,Q@60Hz,H@60Hz\nA,0,20,0,29\nA,10,19,12,27\nA,20,17,24,24\n");
    expect(a.mapping.columns.some((c) => c.block)).toBe(false); // source: a frequency is neither a speed in rpm nor a diameter
    const refused = a.result.problems.filter((p) => p.code === "mapping" && /gives the unit “\d\dHz”/.test(p.reason));
    expect(refused.map((p) => p.column)).toEqual(["Q@50Hz", "H@50Hz"]); // source: importer rule (the later two columns are left unmapped as repeats)
    expect(a.result.curveSets.filter((c) => c.ok)).toEqual([]); // source: README (nothing is imported under a mapping error)
  });
});
