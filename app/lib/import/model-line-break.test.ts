// A model cell written on two lines ("Pump⏎X", quoted): the old importer kept the line break in the name, so the library held
// a model "Pump\nX" (and "Pump X" elsewhere in the file was another model). A model name is one line: each line break, with
// the blanks around it, is read as one space, and a warning names the curve's first such row, the cell and the rule. A
// default model from the mapping page (MappingSchema) is folded the same way. Hand-written cases, invented pumps.
import * as v from "valibot";
import { describe, expect, it } from "vitest";
import { analyseCsv, MappingSchema } from "./index";

const H = "Model,Speed (rpm),Flow (m3/h),Head (m)";
const rows = (model: string) => [0, 10, 20, 30].map((q, i) => `${model},2900,${q},${30 - i * 3}`);
const file = (...r: string[]) => [H, ...r].join("\n") + "\n";

describe("a model name on more than one line", () => {
  it("“Pump⏎X” quoted on every row: read “Pump X”, one warning at line 2 (old code: the model kept “Pump\\nX”, no word)", () => {
    const r = analyseCsv(file(...rows('"Pump\nX"'))).result;
    expect(r.curveSets.map((c) => [c.model, c.ok])).toEqual([["Pump X", true]]);
    expect(r.problems.filter((p) => p.code === "model-line-break").map((p) => [p.row, p.column, p.severity])).toEqual([[2, "Model", "warning"]]);
    expect(r.problems.find((p) => p.code === "model-line-break")!.reason).toBe(
      "model “Pump⏎X” is written on more than one line; a model name is one line, so it is read “Pump X” (each line break a space), here and on this curve's other rows",
    );
  });
  it("CRLF and blanks around the break fold to one space; the same model written on one line is the same curve", () => {
    const r = analyseCsv(file('"Pump \r\n X",2900,0,30', "Pump X,2900,10,27", "Pump X,2900,20,24")).result;
    expect(r.curveSets.map((c) => [c.model, c.points.length, c.ok])).toEqual([["Pump X", 3, true]]);
    expect(r.problems.filter((p) => p.code === "model-line-break").map((p) => p.row)).toEqual([2]);
  });
  it("a model on one line: no warning (the other side)", () => {
    const r = analyseCsv(file(...rows('"Pump X"'))).result;
    expect(r.problems.filter((p) => p.code === "model-line-break")).toEqual([]);
    expect(r.curveSets[0].model).toBe("Pump X");
  });
  it("the mapping page's default model: folded onto one line by MappingSchema", () => {
    const m = analyseCsv(file(...rows("A"))).suggestedMapping;
    expect(v.parse(MappingSchema, { ...m, defaults: { ...m.defaults, model: "Pump\nX" } }).defaults.model).toBe("Pump X");
  });
});
