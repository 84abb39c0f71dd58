// A number's ends in text, one form whichever token wrote it (helper "numtext"): a value too small for its decimals reads
// in the significant-digit form ("1.00e-15 m") whether written with qt or qtExact (qtExact wrote "0.000000000000001 m");
// from 1e6 to 1e9 in the unit shown whole digits grouped in threes by a narrow no-break space ("1 234 567 m", was
// "1234567 m"), as a range's end is (SI Brochure 9th ed. 5.4.4: digits grouped in threes). Values are made up; units
// are the engine's table (NIST SP 811 factors).
import { describe, expect, it } from "vitest";
import { fromSI, UNIT_SYSTEMS, UNITS, type Quantity } from "./units";
import { fmtNum, fmtNumExact, GROUPED_FROM, inSI, LARGE_FROM, qt, qtExact, qtLimit, renderQuantities, THOUSANDS_SPACE } from "./quantityText";

const G = THOUSANDS_SPACE;

describe("item 5: a tiny value reads the same from qt and qtExact", () => {
  it("1e-15 m: '1.00e-15 m' from qt, qtExact beside zero and beside a limit (old qtExact: '0.000000000000001 m')", () => {
    expect(inSI(qt("head", 1e-15))).toBe("1.00e-15 m");
    expect(inSI(qtExact("head", 1e-15, [0]))).toBe("1.00e-15 m");
    expect(inSI(qtExact("head", 1e-15, [1]))).toBe("1.00e-15 m");
    expect(inSI(qtExact("head", -2.5e-12, [0]))).toBe("−2.50e-12 m");
  });
  it("a tiny value beside a tiny limit it would read as gets more significant digits, in order", () => {
    const [r, l] = [qtExact("head", 1.0004e-12, [1e-12]), qtLimit("head", 1e-12, [1.0004e-12])];
    expect([inSI(r), inSI(l)]).toEqual(["1.0004e-12 m", "1.0000e-12 m"]);
    expect(fmtNumExact(0.0004, [0.00041])).toBe("0.000400"); // fmtNum's "0.000400", not the decimals' "0.00040"
  });
  it("a value its decimals show is unchanged: 0.0105 beside 0.01 reads 0.011, 0.01004 beside 0.01 0.01004 (unchanged)", () => {
    expect(fmtNumExact(0.0105, [0.01])).toBe("0.011");
    expect(fmtNumExact(0.01004, [0.01])).toBe("0.01004");
    expect(fmtNumExact(0.01, [0.01004], undefined, true)).toBe("0.010");
  });
});

describe("item 6: from 1e6 to 1e9 whole digits grouped", () => {
  it("fmtNum and a token: '1 234 567', '-9 876 543'; 999 999 and 1e9 keep their forms", () => {
    expect(fmtNum(1234567.3)).toBe(`1${G}234${G}567`); // old "1234567"
    expect(fmtNum(-9876543)).toBe(`-9${G}876${G}543`);
    expect(fmtNum(999999)).toBe("999999");
    expect(fmtNum(1e9)).toBe("1.00e+9");
    expect(inSI(qt("head", 1234567))).toBe(`1${G}234${G}570 m`); // the token's 6 significant digits, the 7th its rounding
    expect(inSI(qtExact("head", 1234567.3, [1234567]))).toBe(`1${G}234${G}567.3 m`); // old "1234567.3 m"
    expect(inSI(qtLimit("head", 1234567, [1234567.3]))).toBe(`1${G}234${G}567 m`);
  });
  it("digits asked for stay plain (a form's default value, CSV-like uses)", () => {
    expect(fmtNum(1234567.3, 1)).toBe("1234567.3");
  });
});

describe("sweep: every quantity × every unit × tiny, large and negative values", () => {
  const VALUES = [1e-15, -3.3e-13, 4.56e-9, 1.5e6, -2.75e7, 3.21e8, 1e13];
  for (const q of Object.keys(UNITS) as Quantity[])
    it(`${q}: no run of zeros, grouped 1e6–1e9, qt and qtExact in one form`, () => {
      for (const u of UNITS[q]) {
        const units = { ...UNIT_SYSTEMS.SI, [q]: u.id };
        for (const si of VALUES) {
          let v: number;
          try {
            v = fromSI(q, u.id, si);
          } catch {
            continue; // outside what the unit takes (a temperature below absolute zero)
          }
          if (!Number.isFinite(v)) continue;
          const plain = renderQuantities(qt(q, si), units);
          const exact = renderQuantities(qtExact(q, si, [0]), units);
          const far = renderQuantities(qtExact(q, si, [si * 3 + 1]), units);
          for (const t of [plain, exact, far]) {
            expect(t, `${q} ${u.id} ${si}`).not.toMatch(/0\.0{6,}/);
            const a = Math.abs(Number(t.split(" ")[0].replaceAll(G, "")));
            if (a >= GROUPED_FROM && a < LARGE_FROM) expect(t, `${q} ${u.id} ${si}`).toMatch(new RegExp(`^-?\\d{1,3}(${G}\\d{3})+(\\.\\d+)? `));
          }
          if (Math.abs(v) < 0.0005 && v !== 0) expect(exact, `${q} ${u.id} ${si}`).toBe(plain); // one tiny form
        }
      }
    });
});
