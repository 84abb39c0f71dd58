// What the importer concludes from header words and units rows, over analyseCsv as the upload page calls it (review of
// 2026-12-03: a motor's output, P_w, Förderleistung, per-unit power and units rows with a unit no field knows). Files are
// hand-written; values are invented.
import { describe, expect, it } from "vitest";
import { analyseCsv, headerPowerKind, powerKindNote } from "./index";
import type { Mapping } from "./mapping";
import { relClose } from "./test-helpers";

/** A long file of one curve: model A at 2900 rpm, then the given columns. */
const file = (header: string, rows: string[]) => `Model,Speed rpm,${header}\n${rows.map((r) => `A,2900,${r}`).join("\n")}\n`;
const warnings = (a: ReturnType<typeof analyseCsv>) => a.result.problems.filter((p) => p.code === "mapping" && p.severity === "warning");
const errors = (a: ReturnType<typeof analyseCsv>) => a.result.problems.filter((p) => p.severity === "error");
const fields = (a: ReturnType<typeof analyseCsv>) => a.mapping.columns.map((c) => c.field);
/** The suggestion with column `index` set by hand, as the mapping page posts it. */
const byHand = (text: string, index: number, col: Partial<Mapping["columns"][number]>): Mapping => {
  const m = analyseCsv(text).suggestedMapping;
  return { ...m, columns: m.columns.map((c) => (c.index === index ? { ...c, ...col, unitSource: "user" as const } : c)) };
};

// A motor's output is what its shaft gives the pump's shaft: the pump's shaft power P2 (definition); P1 is the motor's
// electrical input. "Motor output kW" was left out with the P1 warning.
describe("a motor's output is shaft power (P2)", () => {
  it.each([
    ["Motor output kW", "kW", "header"], // source: definition (a motor's output is its shaft power)
    ["motor output power", "kW", "default"], // source: same; no unit word, so the power field's default kW, shown as assumed
  ])("“%s” is mapped to power in %s (%s)", (header, unit, source) => {
    const a = analyseCsv(file(`Flow m3/h,Head m,${header}`, ["0,20,1.0", "10,19,1.2", "20,17,1.4"]));
    expect(a.mapping.columns[4]).toMatchObject({ field: "power", unit, unitSource: source }); // source: see the row (was: ignore, P1)
    expect(a.result.problems).toEqual([]); // source: hand-written clean file (no P1 warning any more)
    expect(a.result.curveSets[0].points.map((p) => p.power)).toEqual([1000, 1200, 1400]); // source: 1.0, 1.2, 1.4 kW (SI prefixes)
  });

  it("“Motor output (hp)” is shaft power in hp, beside a P1 column that stays out", () => {
    const a = analyseCsv(file("Flow m3/h,Head m,P1 kW,Motor output (hp)", ["0,20,1.5,1.0", "10,19,1.8,1.2", "20,17,2.1,1.4"]));
    expect(fields(a).slice(4)).toEqual(["ignore", "power"]); // source: common practice (P1 is the electrical input) and definition (motor output is P2)
    expect(a.mapping.columns[5].unit).toBe("hp"); // source: the header's unit word
    expect(relClose(a.result.curveSets[0].points[1].power!, 1.2 * 550 * 0.3048 * 4.4482216152605)).toBe(true); // source: NIST SP 811 (hp = 550 ft·lbf/s; ft = 0.3048 m; lbf = 4.448 221 615 260 5 N)
    expect(a.result.problems).toEqual([]); // source: P2 is mapped, so the left-out P1 column needs no warning (importer rule)
  });

  it("a rated motor output is the motor's size, not the power at each point: never mapped to shaft power", () => {
    const a = analyseCsv(file("Flow m3/h,Head m,Rated motor output (kW)", ["0,20,7.5", "10,19,7.5", "20,17,7.5"]));
    expect(a.mapping.columns[4].field).toBe("ignore"); // source: common practice (a rated output is the nameplate figure, one for every point)
    expect(a.result.curveSets[0].points.every((p) => p.power === undefined)).toBe(true); // source: no power column mapped
  });

  // A rated output was left out with the P1 ("electrical input") wording, which does not describe it.
  it.each(["Rated motor output kW", "Nennleistung Motor", "Motor rated power (kW)", "Nominal motor power", "Motornennleistung kW"])(
    "“%s” is left out as the motor's rated output (its size), not as P1",
    (header) => {
      const a = analyseCsv(file(`Flow m3/h,Head m,${header}`, ["0,20,7.5", "10,19,7.5", "20,17,7.5"]));
      expect(a.mapping.columns[4].field).toBe("ignore"); // source: common practice (a rating is the nameplate figure, one for every point)
      expect(headerPowerKind(header)).toBe("rated-motor"); // source: power-kinds.ts
      expect(warnings(a).map((p) => [p.row, p.column])).toEqual([[1, header]]); // source: importer rule (one warning on the header line when no power column is mapped)
      const reason = warnings(a)[0].reason;
      expect(reason).toContain(`“${header}” is left unmapped: its header names the motor's rated output (its size)`); // source: importer rule (names the header)
      expect(reason).toContain("one figure for all points, not a power at each point"); // source: common practice (nameplate rating)
      expect(reason).not.toMatch(/P1|electrical input/); // source: the old wording (P1) does not describe a rating
      expect(powerKindNote("rated-motor", "ignore")).toBe("the motor's rated output (its size, one figure for all points), not the shaft power (P2) at each point: left out"); // source: importer rule
    },
  );

  it.each([
    ["Motor kW", "motor"], // source: vendor catalogues' motor kW is the rating (common practice); was "input" (P1), see below
    ["Rated input power P1 (kW)", "input"], // source: P1 named
    ["Rated electrical power motor", "input"], // source: electrical named
    ["Motor output kW", null], // source: definition (a motor's output is the pump's shaft power)
  ])("“%s” keeps its kind (%s)", (header, kind) => {
    expect(headerPowerKind(header)).toBe(kind); // source: see the row
  });
});

// Vendor catalogues write the motor's rated output (nameplate kW) under "Motor power"/"Motor kW" (common practice), and a
// "rated" power is a nameplate figure too. "Motor kW" was read as the motor's electrical input (P1); "Rated power kW" was mapped
// to shaft power, so a 7.5 kW rating became 7.5 kW at every point of the curve (review of 2026-12-03).
describe("a motor's power and a rated power are ratings, assumed", () => {
  const rating = ["0,20,7.5", "10,19,7.5", "20,17,7.5"]; // invented: one 7.5 kW figure on every row, as a rating is written

  it.each(["Motor power", "Motor kW", "Motor power kW", "Motor power (hp)", "Motorleistung", "Puissance moteur"])(
    "“%s” is left out as the motor's rated output, assumed, with the other readings (was: P1)",
    (header) => {
      const a = analyseCsv(file(`Flow m3/h,Head m,${header}`, rating));
      expect(headerPowerKind(header)).toBe("motor"); // source: common practice (catalogues' motor kW is the nameplate rating); was "input"
      expect(a.mapping.columns[4].field).toBe("ignore"); // source: a rating is not the shaft power at each point (common practice)
      expect(warnings(a).map((p) => [p.row, p.column])).toEqual([[1, header]]); // source: importer rule (one warning on the header line when no power column is mapped)
      const reason = warnings(a)[0].reason;
      expect(reason).toContain(`“${header}” is left unmapped, assumed: the motor's rated output (its nameplate size, one figure for all points)`); // source: rated-power.ts (names the header and what is assumed)
      expect(reason).toContain("Rule: a power header with a motor word (motor, Motor…, moteur) and no word for the input (P1, input, electrical)"); // source: importer rule (states its rule)
      expect(reason).toContain("a 7.5 kW motor reads 7.5 at shutoff and at the last point"); // source: a rating is one figure for all points (common practice)
      expect(reason).toContain("It may also be the motor's electrical input power (P1) at each point"); // source: the other reading (P1 is not shaft power either)
      expect(reason).toContain("then choose “Shaft power” for the column"); // source: importer rule (what to do to change it)
      expect(reason).not.toContain("its header names the motor's electrical input power (P1)"); // source: the old conclusion (P1) is no longer stated as fact
      expect(a.result.curveSets[0].points.every((p) => p.power === undefined)).toBe(true); // source: no power column mapped
    },
  );

  it.each(["Rated power kW", "Rated power", "Nominal power (kW)", "Nennleistung", "Nameplate kW", "Rated output kW"])(
    "“%s” is left out as a rating, assumed (was: shaft power, or hydraulic for “Rated output”)",
    (header) => {
      const a = analyseCsv(file(`Flow m3/h,Head m,${header}`, rating));
      expect(headerPowerKind(header)).toBe("rated"); // source: a rated power is a nameplate figure (common practice); was null (shaft power)
      expect(a.mapping.columns[4].field).toBe("ignore"); // source: same
      const reason = warnings(a)[0].reason;
      expect(reason).toContain(`“${header}” is left unmapped, assumed: a rating (a nameplate figure, one for all points`); // source: rated-power.ts
      expect(reason).toContain("Rule: a power header with rated, nominal, nameplate, Nenn… or Bemessung… and no word for the input"); // source: importer rule (states its rule)
      expect(reason).toContain("without the rating word (“P2”, “Shaft power”) the header is the pump's shaft power at each point"); // source: same (how to change it in the file)
      expect(reason).toContain("It may also be the pump's shaft power (P2) at each point, if the values change along the curve: then choose “Shaft power”"); // source: the other reading
      expect(a.result.curveSets[0].points.every((p) => p.power === undefined)).toBe(true); // source: no power column mapped (was 7500 W at every point)
    },
  );

  it("beside a pump efficiency column, a rated power no longer makes the curve's power 7.5 kW at every point", () => {
    // Invented points: η 0, 55, 70 % at Q 0, 10, 20 m³/h and H 20, 19, 17 m; “Rated power kW” 7.5 on each row.
    const a = analyseCsv(file("Flow m3/h,Head m,Eff %,Rated power kW", ["0,20,0,7.5", "10,19,55,7.5", "20,17,70,7.5"]));
    expect(fields(a).slice(2)).toEqual(["flow", "head", "efficiency", "ignore"]); // source: a rating is not the shaft power at each point (common practice)
    expect(a.result.curveSets[0].points.map((p) => p.power)).toEqual([undefined, undefined, undefined]); // source: was 7500 W at each point (7.5 kW, SI prefixes)
    expect(a.result.problems.filter((p) => p.code === "inconsistent")).toEqual([]); // source: was an η-vs-ρgQH/P warning on the points with flow (7.5 kW against 0.52 kW hydraulic)
    expect(warnings(a)[0].reason).toContain("worked out from the pump efficiency column “Eff %” instead"); // source: definition of pump efficiency (P2 = ρgQH/η)
  });

  it("mapped to shaft power by hand, a rated power is read as the user says, with a warning that says how to undo it", () => {
    const text = file("Flow m3/h,Head m,Rated power kW", rating);
    const a = analyseCsv(text, byHand(text, 4, { field: "power", unit: "kW" }));
    expect(warnings(a).map((p) => p.column)).toEqual(["Rated power kW"]); // source: importer rule (a hand-made or saved mapping is warned too)
    const reason = warnings(a)[0].reason;
    expect(reason).toContain("“Rated power kW” is mapped to shaft power, but its header reads as a rating"); // source: rated-power.ts
    expect(reason).toContain("If its values are the same at every point of a curve, they are a rating: set the column to “— ignore —”"); // source: same
    expect(a.result.curveSets[0].points[1].power).toBe(7500); // source: the user's mapping (7.5 kW)
  });

  it.each<[string, string | null, string]>([
    ["Motor rating kW", "rated-motor", "ignore"], // source: “rating” beside a motor word names the rating (was "input", P1)
    ["Motor size kW", "rated-motor", "ignore"], // source: same (was "input")
    ["Motor power input", "input", "ignore"], // source: input named: P1 (common practice)
    ["Motor power P1", "input", "ignore"], // source: P1 named
    ["Motor electrical power", "input", "ignore"], // source: electrical named
    ["Rated input power P1 (kW)", "input", "ignore"], // source: P1 named, as before
    ["Rated power P2", "rated", "ignore"], // source: a rated P2 is the shaft power at one duty, a nameplate figure (common practice); was shaft power
    ["Rated absorbed power", "rated", "ignore"], // source: same (absorbed power is shaft power in pump data, common practice); was shaft power
    ["Motor output kW", null, "power"], // source: a motor's output is the pump's shaft power (definition), as before
  ])("“%s”: kind %s, field %s", (header, kind, field) => {
    expect(headerPowerKind(header)).toBe(kind); // source: see the row
    expect(analyseCsv(file(`Flow m3/h,Head m,${header}`, ["0,20,1.0", "10,19,1.2", "20,17,1.4"])).mapping.columns[4].field).toBe(field); // source: see the row
  });

  // A rating is not a curve reading, whatever power it rates: "Rated power P2", "Rated shaft power", "P2 rated" were mapped as the
  // shaft power at every point (a 7.5 kW rating became 7.5 kW at shutoff and at run-out), while "Rated power kW" was left out.
  it.each(["Rated power P2", "Rated shaft power", "P2 rated", "Nameplate power", "Rated absorbed power", "P2 nominal (kW)", "Nenn-Wellenleistung", "Rated BHP"])(
    "“%s” is a rating, left out as “Rated power kW” is, assumed, with the rule and the other readings",
    (header) => {
      const a = analyseCsv(file(`Flow m3/h,Head m,${header}`, rating));
      expect([headerPowerKind(header), a.mapping.columns[4].field]).toEqual(["rated", "ignore"]); // source: a rated power is one nameplate figure (common practice)
      expect(warnings(a).map((p) => [p.row, p.column])).toEqual([[1, header]]); // source: importer rule (one warning on the header line, no power column mapped)
      const reason = warnings(a)[0].reason;
      expect(reason).toContain(`“${header}” is left unmapped, assumed: a rating`); // source: rated-power.ts (says what is assumed)
      expect(reason).toContain("Rule: a power header with rated, nominal, nameplate, Nenn… or Bemessung… and no word for the input (P1, input, electrical) is read as a rating, also beside P2, shaft, brake or absorbed"); // source: importer rule (states it)
      expect(reason).toContain("It may also be the pump's shaft power (P2) at each point, if the values change along the curve: then choose “Shaft power”"); // source: the other reading
      expect(a.result.curveSets[0].points.map((p) => p.power)).toEqual([undefined, undefined, undefined]); // source: no power column mapped (was 7500 W at every point)
    },
  );

  it.each<[string, string | null, string]>([
    ["P2", null, "power"], // source: P2 is the shaft power at each point (common practice)
    ["P2 kW", null, "power"], // source: same
    ["Shaft power", null, "power"], // source: shaft named, no rating word
    ["Brake power kW", null, "power"], // source: brake power is shaft power (common practice)
    ["Shaft power at rated speed kW", null, "power"], // source: “at rated speed” is the curve's condition, not a rating
    ["Power at rated speed", null, "power"], // source: same (was left out as a rating)
    ["Power input P1", "input", "ignore"], // source: P1 is the motor's electrical input (common practice), as before
  ])("“%s” is a reading at each point: kind %s, field %s", (header, kind, field) => {
    const a = analyseCsv(file(`Flow m3/h,Head m,${header}`, ["0,20,1.0", "10,19,1.2", "20,17,1.4"]));
    expect([headerPowerKind(header), a.mapping.columns[4].field]).toEqual([kind, field]); // source: see the row
    if (field === "power") expect(a.result.curveSets[0].points.map((p) => p.power)).toEqual([1000, 1200, 1400]); // source: 1.0, 1.2, 1.4 in kW (assumed or read), SI prefixes
    if (field === "power") expect(a.result.problems.filter((p) => p.code === "mapping")).toEqual([]); // source: importer rule (a reading needs no warning)
  });

  it("a P2 column beside “Motor kW” is the power column, and the motor column needs no warning", () => {
    const a = analyseCsv(file("Flow m3/h,Head m,Motor kW,P2 kW", ["0,20,7.5,4.0", "10,19,7.5,5.0", "20,17,7.5,6.0"]));
    expect(fields(a).slice(4)).toEqual(["ignore", "power"]); // source: common practice (P2 is shaft power)
    expect(a.result.problems).toEqual([]); // source: importer rule (P2 mapped: nothing to say of the left-out column)
  });

  it("the mapping page's notes say what was assumed and what to choose instead", () => {
    expect(powerKindNote("motor", "ignore")).toBe("assumed: the motor's rated output (its size, one figure for all points), not the shaft power (P2) at each point; if it is the shaft power at each point, choose “Shaft power”: left out"); // source: rated-power.ts
    expect(powerKindNote("rated", "power")).toBe("assumed: a rating (one figure for all points), not the shaft power (P2) at each point; if it is the shaft power at each point, choose “Shaft power”: see the problems below"); // source: same
  });
});

// In pump literature P_w is the water (hydraulic) power ρ·g·Q·H (common practice); "P_w" may also be "P" with its unit W.
// Normalising made "P_w" the "p w" of "P (W)": it was read as shaft power in W. The importer does not guess between them.
describe("P_w / Pw: water power or watts", () => {
  // invented shaft powers in W above ρgQH (0.518 kW at 10 m³/h and 19 m, 0.926 kW at 20 m³/h and 17 m; ρ = 1000 kg/m³, python3)
  const rows = ["0,20,1000", "10,19,1200", "20,17,1400"];
  it.each(["P_w", "Pw", "PW"])("“%s” alone is left unmapped with a warning that names both readings and the rule", (header) => {
    const a = analyseCsv(file(`Flow m3/h,Head m,${header}`, rows));
    expect(a.mapping.columns[4].field).toBe("ignore"); // source: ambiguous-power.ts (was: power in W for P_w, hydraulic for Pw)
    expect(warnings(a).map((p) => [p.row, p.column])).toEqual([[1, header]]); // source: importer rule (one warning on the header line)
    const reason = warnings(a)[0].reason;
    expect(reason).toContain(`“${header}” is left unmapped: “P_w” can be read two ways`); // source: importer rule (names the header)
    expect(reason).toContain("the water (hydraulic) power P_w = ρ·g·Q·H"); // source: common practice (water power)
    expect(reason).toContain("or a power in W: if the values are the pump's shaft power in watts, choose “Shaft power” and the unit W"); // source: the other reading
    expect(reason).toContain("Rule: “P_w” or “Pw” is read as the water power only with a unit word written apart"); // source: importer rule (states its rule)
    expect(a.result.curveSets[0].points.every((p) => p.power === undefined)).toBe(true); // source: no power column mapped
  });

  it.each(["P_w (kW)", "Pw [W]"])("“%s”: the unit written apart settles it as the water power, left out with the hydraulic power's warning", (header) => {
    const a = analyseCsv(file(`Flow m3/h,Head m,Eff %,${header}`, ["0,20,0,0", "10,19,55,0.517", "20,17,70,0.925"]));
    expect(a.mapping.columns[5].field).toBe("ignore"); // source: common practice (P_w is the water power; was: power in kW for “P_w (kW)”)
    expect(warnings(a).map((p) => p.column)).toEqual([header]); // source: importer rule
    expect(warnings(a)[0].reason).toContain(`“${header}” is left unmapped: its header names the hydraulic power`); // source: HYDRAULIC_POWER
    expect(warnings(a)[0].reason).toContain("worked out from the pump efficiency column “Eff %” instead"); // source: definition of pump efficiency
  });

  it("“PW” beside another field's word is not the symbol: “Type PW” stays the pump type", () => {
    const a = analyseCsv(file("Type PW,Flow m3/h,Head m", ["inline,0,20", "inline,10,19", "inline,20,17"]));
    expect(a.mapping.columns[2].field).toBe("type"); // source: FIELD_RULES (type names the pump type)
    expect(a.result.problems).toEqual([]); // source: hand-written clean file
  });

  it("“P (W)” is a power in watts, not the symbol: still shaft power in W", () => {
    const a = analyseCsv(file("Flow m3/h,Head m,P (W)", rows));
    expect(a.mapping.columns[4]).toMatchObject({ field: "power", unit: "W", unitSource: "header" }); // source: hand-written (brackets hold a unit)
    expect(a.result.problems).toEqual([]); // source: hand-written clean file
  });

  it("mapped by hand to shaft power in W, “P_w” is read so without a warning (the user chose a reading)", () => {
    const text = file("Flow m3/h,Head m,P_w", rows);
    const a = analyseCsv(text, byHand(text, 4, { field: "power", unit: "W" }));
    expect(a.result.problems).toEqual([]); // source: ambiguous-power.ts (shaft power is one of its readings)
    expect(a.result.curveSets[0].points.map((p) => p.power)).toEqual([1000, 1200, 1400]); // source: the user's unit, W
  });
});

// "Förderleistung" is the flow capacity or the useful (hydraulic) output power in German pump usage (from memory); it was
// mapped to shaft power in the default kW.
describe("Förderleistung: flow or useful power", () => {
  it("alone beside a flow column: left unmapped, the warning names both readings and the rule", () => {
    const a = analyseCsv(file("Flow m3/h,Head m,Förderleistung", ["0,20,0", "10,19,0.5", "20,17,0.9"]));
    expect(a.mapping.columns[4].field).toBe("ignore"); // source: ambiguous-power.ts (was: power, kW assumed)
    expect(warnings(a).map((p) => p.column)).toEqual(["Förderleistung"]); // source: importer rule
    const reason = warnings(a)[0].reason;
    expect(reason).toContain("“Förderleistung” is left unmapped: “Förderleistung” can be read two ways"); // source: importer rule
    expect(reason).toContain("the flow capacity (Förderstrom): then choose “Flow” and its unit"); // source: German usage (from memory)
    expect(reason).toContain("or the useful hydraulic output power ρ·g·Q·H, which is not the pump's shaft power"); // source: same
    expect(reason).toContain("Rule: “Förderleistung” is read as flow only with a flow unit in the header"); // source: importer rule (states its rule)
    expect(reason).toContain("no shaft power (P2) or pump efficiency column"); // source: engine (shaft power needs power or efficiency)
    expect(a.result.curveSets[0].points.every((p) => p.power === undefined)).toBe(true); // source: no power column mapped
  });

  it("alone beside a P2 column and no flow column: named all the same (it may be the flow)", () => {
    const a = analyseCsv(file("Head m,Förderleistung,P2 kW", ["20,0,0.5", "19,10,0.8", "17,20,1.0"]));
    expect(fields(a).slice(2)).toEqual(["head", "ignore", "power"]); // source: ambiguous-power.ts (was: Förderleistung as power, P2 left out)
    expect(warnings(a).map((p) => p.column)).toEqual(["Förderleistung"]); // source: importer rule (a flow reading and no flow column)
    expect(warnings(a)[0].reason).not.toContain("Until you choose"); // source: P2 is mapped, so nothing to say of shaft power
  });

  it("with a flow unit (m³/h) it is the flow, read in that unit", () => {
    const a = analyseCsv(file("Förderleistung m³/h,Head m", ["0,20", "10,19", "20,17"]));
    expect(a.mapping.columns[2]).toMatchObject({ field: "flow", unit: "m3/h", unitSource: "header" }); // source: ambiguous-power.ts (a flow unit settles it)
    expect(a.result.problems).toEqual([]); // source: hand-written clean file
    expect(relClose(a.result.curveSets[0].points[1].flow, 10 / 3600)).toBe(true); // source: SI definitions (1 h = 3600 s)
  });

  it("with a power unit (kW) it is the useful hydraulic power: left out with the hydraulic power's warning", () => {
    const a = analyseCsv(file("Flow m3/h,Head m,Förderleistung [kW]", ["0,20,0", "10,19,0.517", "20,17,0.925"]));
    expect(a.mapping.columns[4].field).toBe("ignore"); // source: ambiguous-power.ts (was: power in kW)
    expect(warnings(a)[0].reason).toContain("“Förderleistung [kW]” is left unmapped: its header names the hydraulic power"); // source: HYDRAULIC_POWER
  });

  it("mapped to shaft power by hand: a warning, since neither reading is shaft power", () => {
    const text = file("Flow m3/h,Head m,Förderleistung", ["0,20,0.4", "10,19,0.8", "20,17,1.3"]); // invented, above ρgQH (0.518, 0.926 kW)
    const a = analyseCsv(text, byHand(text, 4, { field: "power", unit: "kW" }));
    expect(warnings(a).map((p) => p.column)).toEqual(["Förderleistung"]); // source: importer rule (a hand-made or saved mapping is warned too)
    expect(warnings(a)[0].reason).toContain("“Förderleistung” is mapped to shaft power, but “Förderleistung” is either the flow capacity"); // source: same
    expect(a.result.curveSets[0].points[1].power).toBe(800); // source: the user's mapping (0.8 kW)
  });
});

// "p.u." (per unit) is a ratio to a base quantity (common practice); a power column in p.u. was read in kW (0.8 as 800 W).
describe("per-unit power", () => {
  it.each(["P.U.", "Power (p.u.)", "P per unit"])("“%s” is left unmapped, and the warning says why", (header) => {
    const a = analyseCsv(file(`Flow m3/h,Head m,${header}`, ["0,20,0.5", "10,19,0.8", "20,17,1.0"]));
    expect(a.mapping.columns[4].field).toBe("ignore"); // source: per-unit.ts (was: power, kW assumed)
    expect(warnings(a).map((p) => [p.row, p.column])).toEqual([[1, header]]); // source: importer rule
    expect(warnings(a)[0].reason).toContain(`“${header}” is left unmapped: its header names a per-unit value (p.u.: a ratio to a base power), not a power`); // source: same
    expect(warnings(a)[0].reason).toContain("0.8 p.u. would become 800 W of shaft power whatever the base"); // source: 0.8 × 1000 W (the default kW)
    expect(a.result.curveSets[0].points.every((p) => p.power === undefined)).toBe(true); // source: no power column mapped
  });

  it("mapped to shaft power by hand: read as the user says, with a warning", () => {
    const text = file("Flow m3/h,Head m,P.U.", ["0,20,0.5", "10,19,0.8", "20,17,1.0"]);
    const a = analyseCsv(text, byHand(text, 4, { field: "power", unit: "kW" }));
    expect(warnings(a)[0].reason).toContain("“P.U.” is mapped to shaft power, but its header names a per-unit value"); // source: importer rule
    expect(a.result.curveSets[0].points[1].power).toBe(800); // source: the user's mapping (0.8 kW)
  });

  it("an efficiency in p.u. is still the fraction 0..1, in the header or in a units row", () => {
    const a = analyseCsv(file("Flow m3/h,Head m,Eff p.u.", ["0,20,0", "10,19,0.55", "20,17,0.7"]));
    expect(a.mapping.columns[4]).toMatchObject({ field: "efficiency", unit: "fraction", unitSource: "header" }); // source: per unit of 1 is the fraction
    const b = analyseCsv("Model,Speed,Flow,Head,Eff\n,rpm,m3/h,m,p.u.\nA,2900,0,20,0\nA,2900,10,19,0.55\nA,2900,20,17,0.7\n");
    expect(b.sniff.headers).toEqual(["Model", "Speed rpm", "Flow m3/h", "Head m", "Eff p.u."]); // source: units row (was: taken for the header)
    expect(b.result.problems).toEqual([]); // source: hand-written clean file
    expect(b.result.curveSets[0].points[2].efficiency).toBe(0.7); // source: a fraction
  });
});

// A units row holding a unit no field knows ("°C", "V") was taken for the header: every point then failed ("head is empty").
describe("a units row with a unit no field knows", () => {
  it("“°C” under Temp: the row is the units row, the columns get their units, and the unknown cell is named", () => {
    const a = analyseCsv("Model,Speed,Flow,Head,Temp\n,rpm,m3/h,m,°C\nA,2900,0,20,20\nA,2900,10,19,20\nA,2900,20,17,20\n");
    expect(a.sniff.headers).toEqual(["Model", "Speed rpm", "Flow m3/h", "Head m", "Temp °C"]); // source: importer rule (names + units)
    expect([a.sniff.headerLine, a.sniff.dataStartLine]).toEqual([1, 3]); // source: hand-written file (units on line 2)
    expect(fields(a)).toEqual(["model", "speed", "flow", "head", "ignore"]); // source: temperature is no curve field
    expect(errors(a)).toEqual([]); // source: hand-written clean file (was: “head is empty” on every row)
    expect(warnings(a).map((p) => [p.row, p.column])).toEqual([[2, "Temp °C"]]); // source: importer rule (the units row's line, the column)
    const reason = warnings(a)[0].reason;
    expect(reason).toContain("“°C” in the units row (line 2, under “Temp”) is not a unit the importer reads or refuses for any field"); // source: importer rule
    expect(reason).toContain("3 of its 4 filled cells are units it knows"); // source: rpm, m3/h, m known; °C not
    expect(reason).toContain("rule: the row under the names is a units row when each filled cell is a unit and the known units outnumber the unknown ones"); // source: units-row.ts
    expect(reason).toContain("so the column is named “Temp °C” and is left unmapped"); // source: importer rule
    expect(a.result.curveSets.map((c) => c.ok)).toEqual([true]); // source: hand-written clean file
  });

  it("“V” and an unknown head unit: both named, the head read in its assumed unit until the user chooses one", () => {
    const text = "Model,Speed,Flow,Head,Eff,Supply\n,rpm,l/s,mFS,%,V\nA,2900,0,20,0,400\nA,2900,5,19,60,400\nA,2900,10,17,70,400\n";
    const a = analyseCsv(text);
    expect(a.sniff.headers).toEqual(["Model", "Speed rpm", "Flow l/s", "Head mFS", "Eff %", "Supply V"]); // source: importer rule
    expect(warnings(a).map((p) => [p.row, p.column])).toEqual([[2, "Head mFS"], [2, "Supply V"]]); // source: mFS (German “Meter Flüssigkeitssäule”, from memory) and V are in no unit list
    expect(warnings(a)[0].reason).toContain("so the column is named “Head mFS” and is read as head in m, assumed: check that unit"); // source: DEFAULT_UNIT (head m)
    expect(warnings(a)[1].reason).toContain("3 of its 5 filled cells are units it knows"); // source: rpm, l/s, % known; mFS, V not
    expect(relClose(a.result.curveSets[0].points[1].flow, 5e-3)).toBe(true); // source: SI definitions (5 l/s = 5e-3 m³/s)
    const chosen = analyseCsv(text, byHand(text, 3, { unit: "m" }));
    expect(warnings(chosen).map((p) => p.column)).toEqual(["Supply V"]); // source: importer rule (a unit the user chose answers the warning)
  });

  it("known units must outnumber unknown ones: a row of mostly unknown words is not a units row", () => {
    const a = analyseCsv("Model,Flow,Temp,Supply,Current\n,m3/h,°C,V,A\nA,0,20,400,5\nA,10,20,400,6\nA,20,20,400,7\n");
    expect(a.sniff.headerLine).toBe(2); // source: units-row.ts (1 known against 3 unknown: not a units row, as before)
  });
});
