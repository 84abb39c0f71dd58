// The mapping page's form read back: edges of every field (bad JSON, an unknown field or unit, NaN,
// zero and negative defaults, an unknown encoding or policy) and the grid's cell names. Expected
// values are the product's own rules (mapping-form.ts, MappingSchema), not measurements.
import { describe, expect, it } from "vitest";
import { checkMapping, suggestMapping } from "../import";
import { editsFromForm, encodingFromForm, mappingFromForm, unitToChoose } from "./mapping-form";
import { formOf } from "~/test/form-data";

const base = suggestMapping(["Model", "Speed", "Q [m3/h]", "H [m]"], [], false);
const form = (o: Record<string, string>) => formOf({ base: JSON.stringify(base), ...o });

describe("mappingFromForm", () => {
  it("keeps the served mapping when nothing was changed", () => {
    const r = mappingFromForm(form({}));
    expect(r.error).toBeUndefined();
    expect(r.mapping!.columns.map((c) => [c.field, c.unit])).toEqual(base.columns.map((c) => [c.field, c.unit]));
    expect(r.mapping!.policy).toBe("skip-curves");
  });
  it("refuses a base that is not JSON or not a mapping, with a message", () => {
    const f = form({});
    f.set("base", "{not json");
    expect(mappingFromForm(f).error).toMatch(/^The mapping could not be read \(the page.s base mapping is not valid JSON .*\); reload the page\.$/);
    f.set("base", JSON.stringify({ version: 2 }));
    expect(mappingFromForm(f).error).toMatch(/could not be read/);
  });
  it("takes the user's unit only when the field allows it; else the field's first unit, marked as the user's", () => {
    const q = base.columns.findIndex((c) => c.field === "flow");
    expect(mappingFromForm(form({ [`unit.${q}`]: "gpm" })).mapping!.columns[q]).toMatchObject({ unit: "gpm", unitSource: "user" });
    const bogus = mappingFromForm(form({ [`unit.${q}`]: "furlongs" })).mapping!.columns[q];
    expect(bogus.unit).not.toBe("furlongs");
  });
  it("refuses an unknown field name for a column", () => {
    expect(mappingFromForm(form({ "field.0": "colour" })).error).toMatch(/cannot work/);
  });
  it("reads defaults with a decimal comma; blank is none; NaN, zero, negative, ambiguous and junk are errors naming the field (product rule: never a silent default)", () => {
    const m = mappingFromForm(form({ defaultModel: "  KX-80 ", defaultSpeed: "2900,5", defaultImpeller: "190" })).mapping!;
    expect(m.defaults).toMatchObject({ model: "KX-80", speed: 2900.5, impeller: 190, impellerUnit: "mm" });
    const none = mappingFromForm(form({ defaultSpeed: " ", defaultImpeller: "" })).mapping!.defaults;
    expect(none.speed).toBeUndefined();
    expect(none.impeller).toBeUndefined();
    for (const bad of ["NaN", "0", "-5", "Infinity", "abc", "0x10"]) {
      const r = mappingFromForm(form({ defaultSpeed: bad, defaultImpeller: bad }));
      expect(r.mapping, bad).toBeUndefined();
      expect(r.error, bad).toMatch(/^The default speed .*\. The default impeller .*\.$/);
    }
    expect(mappingFromForm(form({ defaultSpeed: "1,450" })).error).toBe("The default speed “1,450” is ambiguous: 1450 (a thousands comma) or 1.450 (a decimal comma)? Write 1450 or 1 450 for the first, 1.450 or 1.45 for the second.");
    expect(mappingFromForm(form({ defaultSpeed: "1450" })).mapping!.defaults.speed).toBe(1450);
  });
  it("policy and encoding: only the known values", () => {
    expect(mappingFromForm(form({ policy: "drop-points" })).mapping!.policy).toBe("drop-points");
    expect(mappingFromForm(form({ policy: "drop-everything" })).mapping!.policy).toBe("skip-curves");
    expect(mappingFromForm(form({ encoding: "windows-1252" })).mapping!.encoding).toBe("windows-1252");
    expect(mappingFromForm(form({ encoding: "ebcdic" })).mapping!.encoding).toBeUndefined();
    expect(encodingFromForm(form({ encoding: "utf-16le" }))).toBe("utf-16le");
    expect(encodingFromForm(form({}))).toBeUndefined();
  });
});

describe("a column whose header names a unit its field does not take (Head (kPa), Speed (Hz))", () => {
  const headers = ["Model", "Speed (Hz)", "Q [m3/h]", "Head (kPa)"];
  const served = suggestMapping(headers, [], false);
  const post = (o: Record<string, string>) => mappingFromForm(formOf({ base: JSON.stringify(served), ...o })).mapping!;
  const errorsOf = (m: typeof served) => checkMapping(m, headers, 1).map((p) => p.column);
  it("the page asks for its unit: the select starts on “choose…”", () => {
    expect(served.columns.map(unitToChoose)).toEqual([false, true, false, true]); // source: importer rule (Hz, kPa refused)
    expect(errorsOf(served)).toEqual(["Speed (Hz)", "Head (kPa)"]); // source: importer rule (mapping errors until chosen)
  });
  it("“choose…” left as it is (or no unit sent) keeps the error: the default is not the user's answer", () => {
    for (const m of [post({ "unit.1": "", "unit.3": "" }), post({})]) {
      expect(m.columns[3]).toMatchObject({ unit: "m", unitSource: "default" }); // source: mapping-form rule (nothing picked)
      expect(errorsOf(m)).toEqual(["Speed (Hz)", "Head (kPa)"]); // source: importer rule
    }
  });
  it("a unit picked, even the default one, is the user's answer and clears that column's error", () => {
    const m = post({ "unit.1": "", "unit.3": "m" });
    expect(m.columns[3]).toMatchObject({ unit: "m", unitSource: "user" }); // source: mapping-form rule (picked from “choose…”)
    expect(errorsOf(m)).toEqual(["Speed (Hz)"]); // source: importer rule
    expect(unitToChoose(m.columns[3])).toBe(false); // source: the select shows the user's unit from now on
  });
});

describe("the page's base mapping (helper \"formedges\")", () => {
  const served = suggestMapping(["Model", "Q [m3/h]", "Head [m]"], [], false);
  const text = JSON.stringify(served);
  it("a name twice in one object is refused with the name and the object's JSON Pointer, where JSON.parse kept the last", () => {
    // source: RFC 8259 §4 (names SHOULD be unique), RFC 7493 §2.3 (I-JSON: MUST NOT), RFC 6901 (JSON Pointer); strict-json.ts
    const top = '{"layout":"wide",' + text.slice(1); // JSON.parse: the served layout, a valid mapping
    const inColumn = text.replace('{"index":1,', '{"index":2,"index":1,'); // the second column's index given twice
    expect(inColumn).not.toBe(text);
    for (const [base, at] of [[top, /top object/], [inColumn, /"\/columns\/1"|\/columns\/1 /]] as const) {
      const r = mappingFromForm(formOf({ base }));
      expect(r.mapping).toBeUndefined();
      expect(r.error).toMatch(/twice/);
      expect(r.error).toMatch(at);
    }
    expect(mappingFromForm(formOf({ base: text })).mapping?.columns).toHaveLength(3); // the same mapping once: read
  });
});

describe("editsFromForm", () => {
  it("reads cell.<line>.<index> fields and nothing else", () => {
    const f = formOf({ "cell.12.3": "1,5", "cell.0.0": "", "cell.x.1": "no", "cell.1234567890.1": "line number too long", "cell.1.12345": "index too long", note: "kept out" });
    expect(editsFromForm(f)).toEqual([
      { line: 12, index: 3, value: "1,5" },
      { line: 0, index: 0, value: "" },
    ]);
  });
});
