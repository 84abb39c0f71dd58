// The form codec (system-form.ts) on a stored run naming a table or size the catalogue does not list now (old data): the
// editor's values carry it as stored with the system warning's words and its bore; read back, the form keeps it as stored
// (table, size name, bore to the last digit) while the size stays as stored, takes a bore typed over it, and still refuses
// an unlisted size the stored runs it is read against do not hold. Check values: the engine's catalogue (Steel, Schedule 40: 1/2 to 24, no
// "30"; 4 at 102.26 mm; no table "steel-sch30"), the warning's words (system-input.ts `sizeNotInCatalogue`); bores invented.
import { describe, expect, it } from "vitest";
import { PIPE_TABLES } from "~/engine";
import { readSystemForm, systemFormValues } from "./system-form";
import { defaultSystemInput, runInputWarnings, storedSizeNote, tableRun, type PipeRunInput } from "./hydraulics";
import { renderUnits, SI_UNITS, US_UNITS } from "~/lib/shared/units";

const base: Record<string, string> = {
  name: "Old main", fluidKind: "water", temperature: "20", mode: "open", staticLow: "10", staticHigh: "10", suctionSurfacePressure: "101.325",
  suctionStaticHead: "2", runCount: "1", "run.0.side": "discharge", "run.0.length": "120", "run.0.material": "steel", "run.0.materialShown": "steel",
  dutyFlow: "10", dutyHead: "20", npshMargin: "1.1",
};
const unlisted: PipeRunInput = { ...tableRun("discharge", "Main", "steel-sch40", "4", "steel", 120), nominal: "30", diameter: 0.70123456789 };
const gone: PipeRunInput = { ...tableRun("discharge", "Main", "steel-sch40", "4", "steel", 120), pipeTable: "steel-sch30", diameter: 0.1023 };

/** The run's fields as the editor posts them unchanged (its values for the run, and the stored marks when it carries them). */
function postedRun(r: PipeRunInput, units = SI_UNITS): Record<string, string> {
  const v = systemFormValues({ ...defaultSystemInput(), runs: [r] }, units).runs[0];
  return {
    "run.0.table": v.table, "run.0.nominal": v.nominal, "run.0.diameter": v.diameter, "run.0.name": v.name,
  };
}
/** The form read against the stored runs (the server's from the database, the page's from its loader). */
const read = (o: Record<string, string>, units = SI_UNITS, storedRuns: PipeRunInput[] = [unlisted]) => {
  const m = new Map(Object.entries({ ...base, ...(units === US_UNITS ? { temperature: "68", suctionSurfacePressure: "14.696" } : {}), ...o }));
  return readSystemForm({ get: (k: string) => m.get(k) ?? null }, units, { runs: storedRuns });
};

describe("a stored run on a table or size the catalogue does not list now", () => {
  it("the editor's values: the table and size as stored, the warning's words, the stored bore in the field", () => {
    for (const r of [unlisted, gone]) {
      const v = systemFormValues({ ...defaultSystemInput(), runs: [r] }, SI_UNITS).runs[0];
      const warning = runInputWarnings({ ...defaultSystemInput(), runs: [r] }).find((w) => w.includes("is used"))!;
      expect([v.table, v.nominal]).toEqual([r.pipeTable, r.nominal]);
      expect(v.stored).toEqual({ table: r.pipeTable, nominal: r.nominal, note: renderUnits(warning, SI_UNITS) });
      expect(v.diameter).not.toBe(""); // old code: "" beside a size shown as "—"
    }
  });
  it("saved unchanged, in SI and US units: kept as stored, the bore to the last digit (was: 'Enter the inner diameter.')", () => {
    for (const units of [SI_UNITS, US_UNITS]) {
      for (const r of [unlisted, gone]) {
        const got = read(postedRun(r, units), units, [r]);
        expect(got.errors).toEqual({});
        expect(got.input!.runs[0]).toMatchObject({ pipeTable: r.pipeTable, nominal: r.nominal, diameter: r.diameter });
      }
    }
  });
  it("a bore typed over the stored one is kept with the stored size (the warning then names it); off by 1e-4 of the bore it is the stored one", () => {
    // The field shows five significant digits (show()): within SHOWN_PRECISION (1e-4) of the stored bore is read as unchanged.
    const p = postedRun(unlisted);
    expect(read({ ...p, "run.0.diameter": "650" }).input!.runs[0]).toMatchObject({ nominal: "30", diameter: 0.65 });
    expect(read({ ...p, "run.0.diameter": String(701.23456789 * (1 + 0.9e-4)) }).input!.runs[0].diameter).toBe(unlisted.diameter);
    expect(read({ ...p, "run.0.diameter": String(701.23456789 * (1 + 1.1e-4)) }).input!.runs[0].diameter).toBeCloseTo(0.70123456789 * (1 + 1.1e-4), 12);
    expect(read({ ...p, "run.0.diameter": "" }).errors).toEqual({ "run.0.diameter": "Enter the inner diameter; it takes from 6.2 mm to 5\u202f000 mm (the smallest bore a pipe table of the catalogue lists: Steel tube EN 10255, medium (M) DN6)." }); // blank: said at the field, with the range
  });
  it("an unlisted size the stored document does not hold on this run is refused, as before", () => {
    const p = postedRun(unlisted);
    expect(read(p, SI_UNITS, []).errors).toEqual({ "run.0.nominal": "Pick a size from this pipe table." }); // no stored runs given
    expect(read(p, SI_UNITS, [{ ...unlisted, nominal: "32" }]).errors).toEqual({ "run.0.nominal": "Pick a size from this pipe table." });
    expect(read({ ...p, "run.0.nominal": "32" }).errors).toEqual({ "run.0.nominal": "Pick a size from this pipe table." });
    expect(read({ ...p, "run.0.table": "steel-sch80" }).errors).toEqual({ "run.0.nominal": "Pick a size from this pipe table." });
  });
  it("a listed size (every size of every table, and one saved with another bore): nothing stored, the table's bore taken", () => {
    for (const t of PIPE_TABLES) {
      for (const s of t.sizes) expect(storedSizeNote(tableRun("discharge", "Main", t.id, s.nominal, t.material, 100)), `${t.id} ${s.nominal}`).toBeNull();
    }
    const other = { ...tableRun("discharge", "Main", "steel-sch40", "4", "steel", 120), diameter: 0.1 };
    expect(systemFormValues({ ...defaultSystemInput(), runs: [other] }, SI_UNITS).runs[0].stored).toBeNull();
    expect(read(postedRun(other), SI_UNITS, [other]).input!.runs[0].diameter).toBe(PIPE_TABLES.find((t) => t.id === "steel-sch40")!.sizes.find((s) => s.nominal === "4")!.innerDiameter);
  });
});
