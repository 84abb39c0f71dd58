// A pipe run's material and roughness through the editor's form (system-form.ts): the material follows the chosen pipe
// table unless the engineer picked one, an aged roughness below the new one and a roughness not below the inner
// diameter are refused at their fields. Check values: the engine's catalogue (pipes.ts, pipesDN.ts: ISO 4427 PE100 tables
// are "pvc", PVC / plastics 0.0015 mm new and 0.01 mm aged; commercial steel 0.045 mm and 0.5 mm; PE100 SDR 11 d110
// has a 90 mm bore, 110 − 2 × 10 mm).
import { describe, expect, it } from "vitest";
import { materialForTable, materialShownFor, readSystemForm, roughnessHints, systemFormValues } from "./system-form";
import { defaultSystemInput, tableRun } from "./hydraulics";
import { SI_UNITS } from "~/lib/shared/units";

// The edge hunt's form (form.ts): one 1000 m discharge run of PE100 SDR 11 d110, SI units (roughness in mm).
const base: Record<string, string> = {
  name: "PE main", fluidKind: "water", temperature: "20", mode: "open", staticLow: "10", staticHigh: "10", suctionSurfacePressure: "101.325",
  suctionStaticHead: "2", runCount: "1", "run.0.side": "discharge", "run.0.table": "iso4427-pe100-sdr11", "run.0.nominal": "d110", "run.0.length": "1000",
  "run.0.material": "steel", "run.0.materialShown": "steel", dutyFlow: "10", dutyHead: "20", npshMargin: "1.1",
};
const read = (o: Record<string, string | null>) => {
  const m = new Map(Object.entries({ ...base, ...o }));
  return readSystemForm({ get: (k: string) => m.get(k) ?? null }, SI_UNITS);
};

describe("a run's material and its pipe table", () => {
  it("a table chosen with the material left as shown (or not sent) takes the table's material and its roughness", () => {
    for (const over of [{}, { "run.0.material": null, "run.0.materialShown": null }] as Record<string, string | null>[]) {
      const r = read(over);
      expect(r.errors).toEqual({});
      expect(r.input!.runs[0]).toMatchObject({ material: "pvc", roughness: 0.0015e-3, agedRoughness: 0.01e-3, diameter: 0.09 });
    }
  });
  it("a material the engineer picked stays, whatever the table (the system then warns: system-input.test.ts)", () => {
    expect(read({ "run.0.materialShown": "" }).input!.runs[0]).toMatchObject({ material: "steel", roughness: 0.045e-3, agedRoughness: 0.5e-3 });
    expect(read({ "run.0.material": "copper" }).input!.runs[0].material).toBe("copper"); // changed from the shown steel
    expect(read({ "run.0.table": "", "run.0.diameter": "90" }).input!.runs[0].material).toBe("steel"); // no table: as sent
  });
  it("the editor's rule is the form's: what it shows as the default, and where the material goes as the table changes", () => {
    expect(materialForTable("steel", "steel", "en545-ductile")).toBe("ductile-iron-lined");
    expect(materialForTable("pvc", "pvc", "")).toBe("pvc"); // back to a typed diameter: stays
    expect(materialForTable("steel", "", "iso4427-pe100-sdr17")).toBe("steel"); // picked: stays
    expect(materialShownFor({ pipeTable: "", material: "steel" })).toBe("steel"); // a new run's default
    expect(materialShownFor({ pipeTable: "iso4427-pe100-sdr11", material: "pvc" })).toBe("pvc"); // the table's own
    expect(materialShownFor({ pipeTable: "iso4427-pe100-sdr11", material: "steel" })).toBe(""); // chosen against the table: kept
    expect(materialShownFor({ pipeTable: "", material: "copper" })).toBe("");
    const f = systemFormValues({ ...defaultSystemInput(), runs: [tableRun("discharge", "PE main", "iso4427-pe100-sdr11", "d110", "pvc", 1000)] }, SI_UNITS);
    expect(f.runs[0].materialShown).toBe("pvc");
  });
  it("the roughness hints are the material's at once, with a note when it is not the table's", () => {
    expect(roughnessHints("pvc", "iso4427-pe100-sdr11", SI_UNITS)).toEqual({ roughness: "0.0015", aged: "0.01", mismatch: null });
    expect(roughnessHints("steel", "iso4427-pe100-sdr11", SI_UNITS)).toEqual({
      roughness: "0.045",
      aged: "0.5",
      mismatch: "PE100 SDR 11 (ISO 4427) is PVC / plastics (0.0015 mm new); this run's roughness is Commercial steel's.",
    });
    expect(roughnessHints("steel", "", SI_UNITS).mismatch).toBeNull();
  });
});

describe("roughness refused at its field", () => {
  it("an aged roughness typed below the new one (the hunt's 0.001 mm against 0.1 mm), never replaced by the new silently", () => {
    const r = read({ "run.0.roughness": "0.1", "run.0.agedRoughness": "0.001" });
    expect(r.input).toBeNull();
    expect(r.errors).toEqual({ "run.0.agedRoughness": "The aged roughness 0.001 mm is below the new 0.100 mm: pipe roughens with age. Type at least 0.100 mm." });
    expect(read({ "run.0.roughness": "0.1", "run.0.agedRoughness": "0.1" }).errors).toEqual({}); // equal: taken
    // Equal at a field's five significant digits (cast iron's 0.26 mm shown as 0.010236 in, read back 0.2599944 mm): read as equal, not refused.
    const inch = read({ "run.0.roughness": "0.26", "run.0.agedRoughness": "0.2599944" });
    expect(inch.errors).toEqual({});
    expect(inch.input!.runs[0].agedRoughness).toBe(inch.input!.runs[0].roughness);
    expect(read({ "run.0.roughness": "0.26", "run.0.agedRoughness": "0.2599" }).errors["run.0.agedRoughness"]).toMatch(/^The aged roughness 0.2599 mm is below the new 0.260 mm: pipe roughens with age\. Type at least 0\.260 mm\.$/);
  });
  it("a blank aged roughness whose material value is below the new one typed: said, with the material's value", () => {
    const r = read({ "run.0.roughness": "0.1" }); // plastics aged 0.01 mm
    expect(r.errors["run.0.agedRoughness"]).toBe("Left blank, the aged roughness is PVC / plastics's 0.010 mm, below the new 0.100 mm typed: type an aged roughness of at least 0.100 mm.");
  });
  it("a roughness not below half the inner diameter (ε ≥ D/2: the bore closed) is said at the run's field, not thrown as ε/D", () => {
    // A 10 mm bore (the 1 mm bore this test used is below the smallest the editor takes now, 6.2 mm: system-form-ranges.test.ts).
    const typed = { "run.0.table": "", "run.0.diameter": "10", "run.0.material": "steel" };
    const r = read({ ...typed, "run.0.agedRoughness": "5" });
    expect(r.input).toBeNull();
    expect(r.errors).toEqual({ "run.0.agedRoughness": "Aged roughness 5.00 mm is not below half the inner diameter 10.0 mm (5.00 mm): wall roughness that high would close the bore, which is physically meaningless. Check the unit of each." });
    expect(read({ ...typed, "run.0.roughness": "5", "run.0.agedRoughness": "6" }).errors["run.0.roughness"]).toBe("Roughness 5.00 mm is not below half the inner diameter 10.0 mm (5.00 mm): wall roughness that high would close the bore, which is physically meaningless. Check the unit of each.");
    expect(read({ ...typed, "run.0.agedRoughness": "4.9" }).errors).toEqual({});
  });
});

// Runs carry no id of their own (system-input.ts PipeRunObject: a list; the editor names each run by its position in the
// form as sent, `run.N.…`). A run ticked "remove on save" is left out of the document before the schema checks it, so the
// document's run K is not the form's run K after it: a schema refusal must be placed on the run it came from.
describe("schema refusals placed on the run they came from", () => {
  // Three typed-bore runs; the third's 6000 mm bore is read (6 m) and refused only by the schema (Inner diameter at most 5 m:
  // system-input.ts, our product rule).
  const three: Record<string, string> = {
    runCount: "3",
    ...Object.fromEntries([0, 1, 2].flatMap((i) => [[`run.${i}.side`, "discharge"], [`run.${i}.table`, ""], [`run.${i}.nominal`, ""], [`run.${i}.diameter`, "100"], [`run.${i}.length`, "10"], [`run.${i}.material`, "steel"], [`run.${i}.materialShown`, "steel"]])),
    "run.2.diameter": "6000",
  };
  // In the reader's units (SI: mm for diameters), the range's words (run-ranges.ts).
  const SCHEMA_SAYS = "Inner diameter is too high: it takes from 6.2 mm to 5\u202f000 mm (the smallest bore a pipe table of the catalogue lists: Steel tube EN 10255, medium (M) DN6), not 6\u202f000 mm; check the value and its unit.";
  it("control: nothing removed, the third run's bore is refused at the third run", () => {
    expect(read(three).errors).toEqual({ "run.2.diameter": SCHEMA_SAYS });
  });
  it("the first run removed: still at the third run's field (was at the second's, whose 100 mm bore is sound)", () => {
    expect(read({ ...three, "run.0.remove": "on" }).errors).toEqual({ "run.2.diameter": SCHEMA_SAYS });
    expect(read({ ...three, "run.1.remove": "on" }).errors).toEqual({ "run.2.diameter": SCHEMA_SAYS });
  });
});
