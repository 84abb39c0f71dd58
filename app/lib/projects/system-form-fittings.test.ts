// Every fitting the engine knows is one the system editor offers, so a run's fittings go through the editor's form and
// back unchanged: a run with a 180° return bend, an angle valve or a lift check (Crane TP-410 K = n·fT, engine
// fittings.ts) was read back without them — the form had fields for 13 of the engine's 20 — and saving dropped them unsaid.
// Check values: the engine's own fitting list (identity) and the counts typed in this test.
import { describe, expect, it } from "vitest";
import { FITTINGS } from "~/engine";
import { SI_UNITS, US_UNITS } from "~/lib/shared/units";
import { defaultSystemInput, type SystemInput } from "./hydraulics";
import { EDITOR_FITTINGS, readSystemForm, systemFormValues } from "./system-form";

/** The form a browser without JavaScript posts for `input` as the editor shows it (the fields' names as RunsFieldset writes them). */
function posted(input: SystemInput, sys = SI_UNITS): Map<string, string> {
  const v = systemFormValues(input, sys);
  const m = new Map<string, string>([["name", "Loop"]]);
  for (const [k, x] of Object.entries(v)) if (typeof x === "string" || typeof x === "number") m.set(k, String(x));
  m.set("runCount", String(v.runs.length));
  v.runs.forEach((r, i) => {
    for (const key of ["side", "name", "table", "nominal", "diameter", "material", "roughness", "agedRoughness", "length", "extraK"] as const) {
      m.set(`run.${i}.${key === "table" ? "pipeTable" : key}`, String(r[key] ?? ""));
    }
    for (const [id, n] of Object.entries(r.fittings)) m.set(`run.${i}.fit.${id}`, String(n));
  });
  return m;
}

describe("the editor's fittings", () => {
  it("offers every fitting of the engine's catalogue, once each", () => {
    const offered = EDITOR_FITTINGS.map(([id]) => id);
    expect(new Set(offered).size).toBe(offered.length);
    expect([...offered].sort()).toEqual(FITTINGS.map((f) => f.id).sort());
  });

  for (const sys of [SI_UNITS, US_UNITS]) {
    it(`a run holding one of each, counts 1 to ${FITTINGS.length}, reads back unchanged (${sys === SI_UNITS ? "SI" : "US"} units)`, () => {
      const base = defaultSystemInput();
      const fittings = FITTINGS.map((f, i) => ({ id: f.id, count: i + 1 }));
      const input: SystemInput = { ...base, runs: [{ ...base.runs[0], fittings }, ...base.runs.slice(1)] };
      const m = posted(input, sys);
      const back = readSystemForm({ get: (k: string) => m.get(k) ?? null }, sys, input);
      expect(back.errors).toEqual({});
      expect([...back.input!.runs[0].fittings].sort((a, b) => a.id.localeCompare(b.id))).toEqual([...fittings].sort((a, b) => a.id.localeCompare(b.id)));
    });
  }
});
