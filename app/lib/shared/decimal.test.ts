// The forms' number reader, rule by rule. Every expected value is the product's own rule (decimal.ts,
// "Product rules"), not a measurement; each refusal sits beside the nearest text that is accepted.
import { describe, expect, it } from "vitest";
import { countField, decimalField, decimalMessage, decimalOrNaN, readDecimal } from "./decimal";
import { parseNumber } from "../import/numbers";

const value = (s: unknown) => {
  const r = readDecimal(s);
  return r.kind === "number" ? r.value : r.kind;
};

describe("readDecimal: accepted (product rules)", () => {
  it.each([
    ["12", 12],
    ["12.5", 12.5],
    ["12,5", 12.5], // decimal comma, as written in much of Europe
    ["1,5", 1.5],
    ["12,50", 12.5], // a comma with two digits is a decimal
    ["1,50", 1.5], // the flip of 1,500 (refused below)
    ["1,5000", 1.5], // four digits: not a thousands group
    ["0,500", 0.5], // no one groups thousands after a lone 0
    [".5", 0.5],
    [",5", 0.5],
    ["5.", 5],
    ["+3", 3],
    ["-3", -3],
    ["\u22123", -3], // the minus sign U+2212
    ["1.5e3", 1500], // the flip of 1e309 (refused below)
    ["1,5e3", 1500],
    ["2E-3", 0.002],
    ["  42\t", 42], // whitespace around is trimmed
    ["\u00a042\u00a0", 42],
    ["1.500", 1.5], // a point with three digits stays a decimal point (1.125 in)
    ["1.7976931348623157e308", 1.7976931348623157e308], // the largest finite double
  ])("%j → %s", (text, n) => expect(value(text)).toBe(n));
  it("reads -0 as 0", () => expect(Object.is(value("-0"), 0)).toBe(true));
});

describe("readDecimal: refused (product rules)", () => {
  it.each([
    ["1,500", "ambiguous"], // thousands or decimal comma?
    ["12,000", "ambiguous"],
    ["-1,500", "ambiguous"],
    ["1234,500", "ambiguous"], // a comma then exactly three digits and nothing else
    ["0x10", "bad"], // hex: Number("0x10") is 16
    ["0b11", "bad"], // binary: Number("0b11") is 3
    ["0o17", "bad"], // octal
    ["Infinity", "bad"],
    ["-Infinity", "bad"],
    ["NaN", "bad"],
    ["1,500.5", "bad"], // more than one separator
    ["1.500,5", "bad"],
    ["1.2.3", "bad"],
    ["1,2,3", "bad"],
    ["1 50", "bad"], // a space inside, not a group of three (space groups are taken: decision "inputedge")
    ["1_000", "bad"],
    ["12 m", "bad"],
    ["e3", "bad"],
    [".", "bad"],
    ["--1", "bad"],
    ["1e309", "range"], // overflows to Infinity
    ["-1e309", "range"],
    ["1e-400", "range"], // underflows to 0: a number typed is never silently 0
    ["", "blank"],
    ["   ", "blank"],
  ])("%j → %s", (text, kind) => expect(value(text)).toBe(kind));
  it("a missing field is blank; a file is bad text", () => {
    expect(value(null)).toBe("blank");
    expect(value(undefined)).toBe("blank");
    expect(value(new Blob(["1"]))).toBe("bad");
  });
});

describe("readDecimal: thousands grouped by spaces, in every field (decision \"inputedge\"; the purchase price took them first)", () => {
  const grouped = (t: string) => {
    const r = readDecimal(t, { spaceGroups: true });
    return r.kind === "number" ? r.value : r.kind;
  };
  it.each([
    ["2 450,50", 2450.5],
    ["12 500", 12500],
    ["1\u202f234\u202f567.5", 1234567.5],
    ["1,5", 1.5],
    ["12,500", "ambiguous"],
    ["1 23", "bad"], // groups are threes
    ["1 234,567,8", "bad"],
  ])("%j → %s", (text, n) => expect(grouped(text)).toBe(n));
  it("every field takes them (was refused without the purchase price's option); the option off refuses them", () => {
    expect(value("12 500")).toBe(12500);
    expect(value("3\u202f280\u202f839")).toBe(3280839); // a limit as a refusal prints it (engine limitText.ts)
    const off = readDecimal("12 500", { spaceGroups: false });
    expect(off.kind).toBe("bad");
  });
});

describe("messages", () => {
  it("says why 1,500 is refused, names both readings and how to write each (never one guessed)", () => {
    // source: the reader's rule above (a comma and exactly three digits is either separator; a point with three is a decimal)
    expect(decimalMessage(readDecimal("1,500"), "the duty flow")).toBe("The duty flow “1,500” is ambiguous: 1500 (a thousands comma) or 1.500 (a decimal comma)? Write 1500 or 1 500 for the first, 1.500 or 1.5 for the second.");
    // "1,000" was "write 1000, or 1.": the second reading now named as typed, 1.000, beside its shortest form
    expect(decimalMessage(readDecimal("1,000"), "the flow reading")).toBe("The flow reading “1,000” is ambiguous: 1000 (a thousands comma) or 1.000 (a decimal comma)? Write 1000 or 1 000 for the first, 1.000 or 1 for the second.");
    expect(decimalMessage(readDecimal("12,000"), "the length")).toMatch(/Write 12000 or 12 000 for the first, 12\.000 or 12 for the second\.$/);
    expect(decimalMessage(readDecimal("-1,250"), "the head")).toMatch(/Write -1250 or -1 250 for the first, -1\.250 or -1\.25 for the second\.$/);
    expect(decimalMessage(readDecimal("1,125"), "the head")).toMatch(/Write 1125 or 1 125 for the first, 1\.125 for the second\.$/);
    // each way written as suggested reads back as that reading
    for (const [typed, value] of [["1000", 1000], ["1 000", 1000], ["1.000", 1], ["1", 1], ["-1 250", -1250], ["-1.250", -1.25]] as const) expect(readDecimal(typed)).toEqual({ kind: "number", value });
    // 1,5 is not ambiguous: a decimal comma (no one writes a thousands comma before fewer than three digits)
    expect(readDecimal("1,5")).toEqual({ kind: "number", value: 1.5 });
  });
  it("a number out of range keeps 'must be a number'; thousands separators are named", () => {
    expect(decimalMessage(readDecimal("1e309"), "the duty flow")).toBe("The duty flow must be a number: “1e309” is out of range.");
    expect(decimalMessage(readDecimal("abc"), "the duty flow")).toBe("The duty flow must be a number.");
    expect(decimalMessage(readDecimal("1,500.5"), "the duty flow")).toBe("The duty flow must be a number with one decimal point or comma, its thousands grouped by spaces in threes or not at all (like 1 500.5 or 1500.5), never by commas or points.");
    expect(decimalMessage(readDecimal("3,280,840"), "the duty flow")).toMatch(/grouped by spaces in threes or not at all/);
    expect(decimalMessage(readDecimal(""), "the duty flow")).toBe("Enter the duty flow.");
  });
  it("decimalField: blank is null (an error only when required); an error already on the field is kept", () => {
    const errors: Record<string, string> = {};
    expect(decimalField("", "a", "a", errors)).toBeNull();
    expect(errors).toEqual({});
    expect(decimalField("", "a", "the flow", errors, true)).toBeNull();
    expect(errors.a).toBe("Enter the flow.");
    expect(decimalField("x", "a", "the flow", errors)).toBeNull();
    expect(errors.a).toBe("Enter the flow.");
    expect(decimalField(" 7,25 ", "b", "the head", errors)).toBe(7.25);
    expect(errors.b).toBeUndefined();
  });
  it("countField: digits 0..max only; blank or missing is the blank value; anything else an error naming the field, kept if already set", () => {
    const errors: Record<string, string> = {};
    expect(countField(" 12 ", "n", "the count", errors, 20)).toBe(12);
    expect(countField("20", "n", "the count", errors, 20)).toBe(20);
    expect(countField("", "n", "the count", errors, 20, 7)).toBe(7);
    expect(countField(null, "n", "the count", errors, 20)).toBe(0);
    expect(errors).toEqual({});
    expect(countField("21", "n", "the count", errors, 20)).toBeNull(); // past max
    // Past max in digits: said as too many, with the range — it read "written in digits: “21” is not", a reason it is not (audit "lccedges").
    expect(errors.n).toBe("The count must be at most 20 (a whole number from 0 to 20): “21” is too many.");
    expect(countField("0x10", "n", "the count", errors, 20)).toBeNull();
    expect(errors.n).toMatch(/“21”/); // the first message stays
    expect(countField(new Blob(["3"]), "f", "the count", errors, 20)).toBeNull(); // a file is no count
    expect(errors.f).toBe("The count must be a whole number from 0 to 20, written in digits.");
  });
  it("countField with a minimum (duty pumps 1 to 8): below it says so with the range; the range is named in every other message; blank is still the blank value", () => {
    const errors: Record<string, string> = {};
    expect(countField("1", "d", "the number of duty pumps", errors, 8, 1, 1)).toBe(1);
    expect(countField("", "d", "the number of duty pumps", errors, 8, 1, 1)).toBe(1);
    expect(errors).toEqual({});
    expect(countField("0", "d", "the number of duty pumps", errors, 8, 1, 1)).toBeNull();
    expect(errors.d).toBe("The number of duty pumps must be at least 1 (a whole number from 1 to 8): “0” is too few.");
    expect(countField("1e0", "e", "the number of duty pumps", errors, 8, 1, 1)).toBeNull();
    expect(errors.e).toBe("The number of duty pumps must be a whole number from 1 to 8, written in digits: “1e0” is not.");
  });
  it("decimalOrNaN (filters: junk means no filter): 1,500 is NaN, never 1.5", () => {
    expect(decimalOrNaN("1,500")).toBeNaN();
    expect(decimalOrNaN("0x10")).toBeNaN();
    expect(decimalOrNaN("")).toBeNaN();
    expect(decimalOrNaN("7,5")).toBe(7.5);
  });
});

describe("the CSV importer's cells are read as before (its grammar is shared, its rules are its own)", () => {
  // Thousands groups and a per-file decimal comma are the importer's rules (import/numbers.ts), not the forms'.
  it.each([
    ["1,450", false, 1450],
    ["1.450", true, 1450],
    ["1.450,25", true, 1450.25],
    ["12,5", true, 12.5],
    ["12.5", false, 12.5],
    ["1 450", false, 1450],
    ["0x10", false, NaN],
  ] as const)("%j (decimal comma %s) → %s", (cell, comma, n) => expect(parseNumber(cell, comma)).toBe(n));
});
