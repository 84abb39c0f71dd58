// The editor's fields as typed in a refused save (typed-back.ts): only the form's own names are carried back, cut in
// size; laid over the stored values they replace each field posted, runs as many as posted; with nothing posted (a page
// load, a save that went through) the stored values stand. Values are the test's own typing (no source needed).
import { describe, expect, test } from "vitest";
import { defaultSystemInput } from "./hydraulics";
import { systemFormValues } from "./system-form";
import { TYPED_MAX_CHARS, typedFields, typedOver } from "./typed-back";
import { SI_UNITS } from "../shared/units";

const stored = () => systemFormValues(defaultSystemInput(), SI_UNITS);
const form = (o: Record<string, string | Blob>) => {
  const fd = new FormData();
  for (const [k, v] of Object.entries(o)) fd.append(k, v);
  return fd;
};

describe("typedFields", () => {
  test("keeps the editor's own text fields and drops every other name, files and overlong text", () => {
    const t = typedFields(form({ dutyFlow: "-5", "run.1.length": "75", "run.0.fit.exit": "2", "energy.step.3.pct": "40", "energy.years": "12", intent: "save", junk: "x", "run.99.length": "1", name: "n".repeat(5000), density: new Blob(["9"]) }));
    expect(t).toEqual({ dutyFlow: "-5", "run.1.length": "75", "run.0.fit.exit": "2", "energy.step.3.pct": "40", "energy.years": "12", name: "n".repeat(TYPED_MAX_CHARS) });
  });
});

describe("typedOver", () => {
  test("nothing posted (a page load, a save that went through): the stored values, no run ticked for removal", () => {
    const f = stored();
    const shown = typedOver(f, undefined, SI_UNITS);
    expect([shown.dutyFlow, shown.runs, shown.removeRun]).toEqual([f.dutyFlow, f.runs, [false, false]]);
  });

  test("a refused post: the bad value and the good edits as typed, fields not posted as stored", () => {
    const f = stored();
    const shown = typedOver(f, { dutyFlow: "-5", tolPlus: "12", runCount: "2", "run.1.length": "75", "run.1.fit.exit": "abc", "run.0.remove": "on", "run.0.side": "discharge" }, SI_UNITS);
    expect(f.dutyFlow).not.toBe("-5");
    expect([shown.dutyFlow, shown.tolPlus, shown.dutyHead]).toEqual(["-5", "12", f.dutyHead]);
    expect([shown.runs[1].length, shown.runs[1].fittings.exit, shown.runs[1].fittings["swing-check"], shown.runs[0].length]).toEqual(["75", "abc", 1, f.runs[0].length]);
    expect([shown.runs[0].side, shown.removeRun]).toEqual(["discharge", [true, false]]);
  });

  test("the run count as posted: fewer runs than stored shows fewer, more shows the extra run from its posted fields", () => {
    const f = stored();
    expect(typedOver(f, { runCount: "1" }, SI_UNITS).runs.map((r) => r.name)).toEqual([f.runs[0].name]);
    const three = typedOver(f, { runCount: "3", "run.2.side": "suction", "run.2.name": "New run", "run.2.length": "4" }, SI_UNITS);
    expect(three.runs.map((r) => [r.side, r.name, r.length])).toEqual([...f.runs.map((r) => [r.side, r.name, r.length]), ["suction", "New run", "4"]]);
    expect(typedOver(f, { runCount: "0x10" }, SI_UNITS).runs).toHaveLength(f.runs.length); // a run count that is not one: the stored runs
  });

  test("a refused post that also pressed \"+ suction run\" (addRun): the run it added is shown after the posted ones, as a new run of that side", async () => {
    const f = stored();
    const shown = typedOver(f, { runCount: "2", addRun: "suction", dutyFlow: "-5" }, SI_UNITS);
    expect(shown.runs.map((r) => [r.side, r.name])).toEqual([...f.runs.map((r) => [r.side, r.name]), ["suction", "Suction run"]]); // readSystemForm's newRun names
    expect(shown.removeRun).toEqual([false, false, false]);
    expect(typedFields(form({ addRun: "discharge" }))).toEqual({ addRun: "discharge" });
    expect(typedOver(f, { runCount: "2", addRun: "sideways" }, SI_UNITS).runs).toHaveLength(2); // not one of the buttons: nothing added
  });
});
