// Reading a stored system input honestly (stored-input.ts): a document that fails the schema is described in plain
// words, never replaced by the default system; the editor gets the stored values. Check values: the schema's own limits
// and messages (system-input.ts), our wording rules (stored-input.ts).
import { describe, expect, test } from "vitest";
import { defaultSystemInput } from "./hydraulics";
import { editorInput, pathLabel, problemFieldErrors, problemPlaces, readStoredInput } from "./stored-input";

const doc = (over: Record<string, unknown>) => JSON.stringify({ ...defaultSystemInput(), ...over });
const problems = (json: string) => {
  const r = readStoredInput(json);
  if (r.ok) throw new Error("expected problems");
  return r.problems;
};

describe("readStoredInput", () => {
  test("a document that passes is read as stored; one saved before the flow tolerance existed takes the schema's own default (−0/+10 %, system-input.ts)", () => {
    const { flowTolerance: _t, ...old } = { ...defaultSystemInput(), staticLow: 7 };
    const r = readStoredInput(JSON.stringify(old));
    expect(r.ok && r.input.staticLow).toBe(7);
    expect(r.ok && r.input.flowTolerance).toEqual({ minus: 0, plus: 0.1 });
  });
  test("valibot's own messages are rewritten in plain words: a choice, a limit, a type; missing values say so", () => {
    expect(problems(doc({ mode: "sideways" }))[0]).toMatchObject({ path: "mode", label: "system kind (open or closed loop)", message: 'Should be "open" or "closed-loop".', stored: '"sideways"' });
    const runs = defaultSystemInput().runs.map((r) => ({ ...r }));
    runs[1].fittings = [{ id: "exit", count: -2 }];
    expect(problems(doc({ runs }))[0]).toMatchObject({ label: "pipe run 2, fitting 1, count", message: "A fitting's count is a whole number from 0 to 500.", stored: "-2" }); // FittingUseSchema: its own words, with the range
    expect(problems(doc({ duty: "40 m3/h" }))[0]).toMatchObject({ label: "duty point", message: "Should be a group of values.", stored: '"40 m3/h"' });
    const { npshMargin: _n, ...noMargin } = defaultSystemInput();
    expect(problems(JSON.stringify(noMargin))[0]).toMatchObject({ label: "NPSH margin ratio", message: "Missing from the stored document.", stored: null });
  });
  test("the schema's own sentences are kept, the stored number as a quantity token (rendered in the reader's units)", () => {
    expect(problems(doc({ temperatureC: 350 }))[0]).toMatchObject({ label: "temperature", message: "Temperature is too high: it takes from ⟦temperature|-50|bound-min:350⟧ to ⟦temperature|300|bound-max:350⟧, not ⟦temperature|350|sent:300⟧; check the value and its unit.", stored: "⟦temperature|350⟧" }); // schema: at most 300 °C
  });
  test("a roughness not below half its run's inner diameter (ε ≥ D/2, the bore closed: engine system.ts) is named at the run and field, with the value stored there", () => {
    const runs = defaultSystemInput().runs.map((r) => ({ ...r }));
    runs[1] = { ...runs[1], diameter: 0.001, agedRoughness: 0.005 }; // the hunt's case: ε/D = 5
    const p = problems(doc({ runs }));
    expect(p).toHaveLength(1);
    expect(p[0]).toMatchObject({ path: "runs.1.agedRoughness", label: "pipe run 2, aged roughness", stored: "⟦roughness|0.005⟧" });
    expect(p[0].message).toBe("Aged roughness ⟦roughness|0.005⟧ is not below half the inner diameter ⟦diameter|0.001⟧ (⟦roughness|0.0005⟧): wall roughness that high would close the bore, which is physically meaningless. Check the unit of each.");
    expect(problemFieldErrors(p)).toEqual({ "run.1.agedRoughness": `${p[0].message} Stored: ⟦roughness|0.005⟧.` });
    runs[1] = { ...runs[1], roughness: 0.001 }; // equal to the diameter: ε/D = 1, refused too
    expect(problems(doc({ runs })).map((x) => x.path)).toEqual(["runs.1.roughness", "runs.1.agedRoughness"]);
  });
  test("text that is not JSON, and JSON that is not a document, are problems too (never a default, never a throw)", () => {
    expect(problems("{\"fluid\": ")[0]).toMatchObject({ label: "the stored document", stored: null });
    expect(problems("{\"fluid\": ")[0].message).toMatch(/^Is not valid JSON/);
    expect(problems("null")[0]).toMatchObject({ label: "the stored document", message: "Should be a group of values.", stored: "empty (null)" });
  });
});

test("pathLabel and problemPlaces: list items counted from 1, long lists end with how many more", () => {
  expect(pathLabel(["runs", 1, "fittings", 0, "count"])).toBe("pipe run 2, fitting 1, count");
  expect(pathLabel(["energy", "profile", 2, "hours"])).toBe("load profile and life-cycle cost, step 3, hours");
  expect(pathLabel([])).toBe("the stored document");
  const all = problems("{}"); // every required key missing: 15 of them (SystemInputSchema)
  expect(all).toHaveLength(15);
  expect(problemPlaces(all)).toMatch(/; pressure difference and 9 more$/);
});

test("editorInput: numbers as stored (out of range too), anything else blank (NaN), runs kept at their index; problems placed on the editor's fields", () => {
  const runs = ["not a run", { ...defaultSystemInput().runs[1], diameter: "DN100" }];
  const raw = JSON.parse(doc({ temperatureC: 350, staticLow: "26 m", runs, mode: "sideways" }));
  const e = editorInput(raw);
  expect(e.temperatureC).toBe(350);
  expect(e.staticLow).toBeNaN();
  expect(e.staticHigh).toBe(12); // as stored (the default document's own value here, not filled in)
  expect(e.mode).toBe("open"); // a choice that is none of the options: the editor's first, its problem listed
  expect(e.runs).toHaveLength(2);
  expect(e.runs[0].length).toBeNaN();
  expect(e.runs[1].diameter).toBeNaN();
  expect(e.runs[1].length).toBe(60);
  const unreadable = editorInput(undefined); // text that was not JSON: nothing read, nothing filled in (not even the schema's defaults)
  expect([unreadable.temperatureC, unreadable.energy.years, unreadable.flowTolerance.plus, unreadable.runs.length, unreadable.duty]).toEqual([NaN, NaN, NaN, 0, null]);
  const fields = problemFieldErrors(problems(JSON.stringify(raw)));
  expect(fields.temperature).toBe("Temperature is too high: it takes from ⟦temperature|-50|bound-min:350⟧ to ⟦temperature|300|bound-max:350⟧, not ⟦temperature|350|sent:300⟧; check the value and its unit. Stored: ⟦temperature|350⟧.");
  expect(fields["run.1.diameter"]).toBe('Inner diameter must be a number; it takes from ⟦diameter|0.0062|bound-min:⟧ to ⟦diameter|5|bound-max:⟧ (the smallest bore a pipe table of the catalogue lists: Steel tube EN 10255, medium (M) DN6). Stored: "DN100".');
  expect(Object.keys(fields)).toContain("staticLow");
});
