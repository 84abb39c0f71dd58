/**
 * Small motors (0.12–0.55 kW, the building-services circulator range) in the IE efficiency table, the rating below the
 * table (0.12 kW, the standard's smallest) and a rating between two entries (lower entry, warned).
 * Check values: IEC 60034-30-1:2014 nominal efficiencies, 50 Hz, from memory — verify against the standard (IE4 at
 * 0.12–0.55 kW remembered less surely than IE2 and IE3); electrical input P_el = P_shaft / η_motor / η_drive and energy
 * = P_el × hours (common practice), worked by hand in the comments.
 */
import { describe, expect, it } from "vitest";
import { annualEnergy, IE_CLASSES, IE_EFFICIENCY_TABLE, IE_TABLE_KW, motorEfficiency, suggestMotor, type IeClass } from "./index.ts";
import { inSI } from "./quantityText.ts";

const SMALL_KW = [0.12, 0.18, 0.2, 0.25, 0.37, 0.4, 0.55];
/** IEC 60034-30-1:2014, 50 Hz, % at 0.12, 0.18, 0.20, 0.25, 0.37, 0.40, 0.55 kW (from memory — verify against the standard). */
const SMALL: Record<2 | 4, Record<IeClass, number[]>> = {
  2: {
    IE2: [53.6, 60.4, 61.9, 64.8, 69.5, 70.4, 74.1],
    IE3: [60.8, 65.9, 67.2, 69.7, 73.8, 74.6, 77.8],
    IE4: [66.5, 70.8, 71.9, 74.3, 78.1, 78.9, 81.5],
  },
  4: {
    IE2: [59.1, 64.7, 65.9, 68.5, 72.7, 73.5, 77.1],
    IE3: [64.8, 69.9, 71.1, 73.5, 77.3, 78.0, 80.8],
    IE4: [69.8, 74.7, 75.8, 77.9, 81.1, 81.7, 83.9],
  },
};

describe("small motors at the table's points (IEC 60034-30-1:2014, 50 Hz, from memory — verify against the standard)", () => {
  it("IE3 4-pole: 64.8 % at 0.12 kW … 80.8 % at 0.55 kW, each with no warning", () => {
    SMALL_KW.forEach((kw, j) => {
      const r = motorEfficiency(kw * 1000, "IE3", 4);
      expect(r.efficiency, `${kw} kW`).toBeCloseTo(SMALL[4].IE3[j] / 100, 9);
      expect(r.warnings, `${kw} kW`).toEqual([]);
    });
  });
  it("every class and pole count held (IE2–IE4, 2- and 4-pole) at every small rating", () => {
    for (const poles of [2, 4] as const) for (const ie of IE_CLASSES) SMALL_KW.forEach((kw, j) => {
      expect(motorEfficiency(kw * 1000, ie, poles).efficiency, `${ie} ${poles}-pole ${kw} kW`).toBeCloseTo(SMALL[poles][ie][j] / 100, 9);
    });
  });
  it("0.75 kW as before this change: 2-pole 77.4 / 80.7 / 83.5 %, 4-pole 79.6 / 82.5 / 85.7 % (IE2 / IE3 / IE4, from memory)", () => {
    const was = { 2: [77.4, 80.7, 83.5], 4: [79.6, 82.5, 85.7] };
    for (const poles of [2, 4] as const) IE_CLASSES.forEach((ie, k) => {
      const r = motorEfficiency(750, ie, poles);
      expect(r.efficiency, `${ie} ${poles}-pole`).toBeCloseTo(was[poles][k] / 100, 9);
      expect(r.warnings).toEqual([]);
    });
  });
  it("the table is whole: one value per rating, rising with the rating, IE2 < IE3 < IE4 at each (the classes' order, by definition)", () => {
    expect(IE_TABLE_KW.slice(0, 8)).toEqual([...SMALL_KW, 0.75]);
    for (const poles of [2, 4] as const) {
      for (const ie of IE_CLASSES) {
        const row = IE_EFFICIENCY_TABLE[poles][ie];
        expect(row.length).toBe(IE_TABLE_KW.length);
        for (let j = 1; j < row.length; j++) expect(row[j], `${ie} ${poles}-pole at ${IE_TABLE_KW[j]} kW`).toBeGreaterThanOrEqual(row[j - 1]);
      }
      IE_TABLE_KW.forEach((kw, j) => {
        const [a, b, c] = IE_CLASSES.map((ie) => IE_EFFICIENCY_TABLE[poles][ie][j]);
        expect(a < b && b < c, `${poles}-pole ${kw} kW: ${a} / ${b} / ${c}`).toBe(true);
      });
    }
  });
});

describe("the flips at the table's edges (IEC 60034-30-1:2014 IE3 4-pole, from memory)", () => {
  it("0.75 kW: 749.9 W takes 0.55 kW's 80.8 % (lower entry, warned with both entries); 750 W takes 82.5 %", () => {
    const below = motorEfficiency(749.9, "IE3", 4);
    expect(below.efficiency).toBeCloseTo(0.808, 9);
    expect(below.warnings.map((w) => w.code)).toEqual(["motor-between-table"]);
    // The rating reads apart from the 0.750 kW entry it is below (it read "motor 0.750 kW lies between … and 0.750 kW").
    expect(inSI(below.warnings[0].message)).toBe("motor 0.7499 kW lies between the IEC 60034-30-1 table's 0.550 kW (80.8 %) and 0.750 kW (82.5 %): the lower entry's 80.8 % is used (conservative; the standard's interpolation for intermediate outputs is not applied)");
    expect(motorEfficiency(750, "IE3", 4).efficiency).toBeCloseTo(0.825, 9);
  });
  it("0.55 kW: 549.9 W takes 0.40 kW's 78.0 %; 550 W takes 80.8 %", () => {
    expect(motorEfficiency(549.9, "IE3", 4).efficiency).toBeCloseTo(0.78, 9);
    expect(motorEfficiency(550, "IE3", 4).efficiency).toBeCloseTo(0.808, 9);
  });
  it("between two entries: 0.30 kW takes 0.25 kW's 73.5 %, the rule and both entries in the warning", () => {
    const r = motorEfficiency(300, "IE3", 4);
    expect(r.efficiency).toBeCloseTo(0.735, 9);
    expect(inSI(r.warnings[0].message)).toBe("motor 0.300 kW lies between the IEC 60034-30-1 table's 0.250 kW (73.5 %) and 0.370 kW (77.3 %): the lower entry's 73.5 % is used (conservative; the standard's interpolation for intermediate outputs is not applied)");
  });
  it("below the standard (0.12 kW): 0.09 kW takes 0.12 kW's 64.8 %, warned with both numbers; 0.12 kW is not warned", () => {
    const r = motorEfficiency(90, "IE3", 4);
    expect(r.efficiency).toBeCloseTo(0.648, 9);
    expect(r.warnings.map((w) => w.code)).toEqual(["motor-below-table"]);
    expect(inSI(r.warnings[0].message)).toBe("motor 0.090 kW is below the IEC 60034-30-1 table, which starts at 0.120 kW: its 64.8 % is used (a smaller motor's efficiency is lower: energy understated)");
    expect(motorEfficiency(120, "IE3", 4).warnings).toEqual([]);
  });
  it("200 kW to 1000 kW: the 200 kW value, not warned (the standard's values stay constant there)", () => {
    const r = motorEfficiency(315000, "IE3", 4);
    expect(r.efficiency).toBeCloseTo(0.96, 9);
    expect(r.warnings).toEqual([]);
  });
});

describe("a 0.25 kW circulator's electrical input and energy (P_el = P_shaft / η_motor / η_drive, common practice)", () => {
  it("200 W shaft, curve maximum 230 W → 0.25 kW; IE3 4-pole 73.5 %, drive 97 %, 5000 h, 0.20 per kWh", () => {
    const s = suggestMotor({ dutyPower: 200, maxCurvePower: 230 });
    expect(s.rating).toBe(250); // 0.25 kW is the smallest rating ≥ 230 W (IEC 60072-1 series, from memory)
    const eta = motorEfficiency(s.rating!, "IE3", 4).efficiency;
    const e = annualEnergy({ shaftPower: 200, motorEfficiency: eta, driveEfficiency: 0.97, hoursPerYear: 5000, tariffPerKWh: 0.2 });
    // By hand: 0.735 × 0.97 = 0.71295; 200 W / 0.71295 = 280.52 W; × 5000 h = 1402.62 kWh; × 0.20 = 280.52 per year.
    // (With the 0.75 kW value this change replaces: 200 / (0.825 × 0.97) = 249.92 W — 11 % low.)
    expect(e.electricalPower).toBeCloseTo(280.5246, 3);
    expect(e.annualEnergyKWh).toBeCloseTo(1402.623, 2);
    expect(e.annualCost).toBeCloseTo(280.5246, 3);
  });
});
