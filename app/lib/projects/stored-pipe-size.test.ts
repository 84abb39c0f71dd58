// A stored system naming a pipe size the catalogue no longer gives as stored (old data): the run is computed with its
// stored inner diameter, and runInputWarnings (system-input.ts) says so with the numbers. Swept over every table's sizes.
// Check values: the engine's catalogue (pipes.ts, pipesDN.ts) — the bores the tables give today.
import { describe, expect, test } from "vitest";
import { PIPE_TABLES } from "~/engine";
import { defaultSystemInput, evaluateSystem, runInputWarnings, systemSpec, tableRun, type PipeRunInput } from "./hydraulics";

const withRuns = (runs: PipeRunInput[]) => ({ ...defaultSystemInput(), runs });
const sizeWarnings = (r: PipeRunInput) => runInputWarnings(withRuns([r])).filter((w) => !w.includes("material is"));

describe("a stored run's catalogue size", () => {
  test("every size of every table, as the table gives it (to 1e-12 of its bore): nothing said", () => {
    for (const t of PIPE_TABLES) {
      for (const s of t.sizes) {
        const r = tableRun("discharge", "Main", t.id, s.nominal, t.material, 100);
        expect(sizeWarnings(r), `${t.id} ${s.nominal}`).toEqual([]);
        expect(sizeWarnings({ ...r, diameter: s.innerDiameter * (1 + 1e-12) }), `${t.id} ${s.nominal}`).toEqual([]);
      }
    }
  });
  test("a size the table does not list (old data): said, naming it, the table's sizes and the bore used; computed with that bore", () => {
    // Before: nothing said — a stored "30" of Schedule 40 (sizes 1/2 to 24) was computed with its stored 0.7 m silently.
    for (const t of PIPE_TABLES) {
      const r = { ...tableRun("discharge", "Main", t.id, t.sizes[0].nominal, t.material, 100), nominal: "30", diameter: 0.7 };
      if (t.sizes.some((s) => s.nominal === "30")) continue;
      const [first, last] = [t.sizes[0].nominal, t.sizes[t.sizes.length - 1].nominal];
      expect(sizeWarnings(r), t.id).toEqual([
        `Main: ${t.name} lists no size "30" (its sizes run ${first} to ${last}); the stored inner diameter ⟦diameter|0.7⟧ is used as it was saved. Check the bore, then pick a size of the table or type the inner diameter.`,
      ]);
      expect(systemSpec(withRuns([r])).discharge![0].diameter).toBe(0.7);
    }
    const gone = { ...tableRun("discharge", "Main", "steel-sch40", "4", "steel", 100), pipeTable: "steel-sch30", diameter: 0.1 };
    expect(sizeWarnings(gone)).toEqual([
      `Main: the pipe table "steel-sch30" is not in the catalogue any more; the stored inner diameter ⟦diameter|0.1⟧ is used as it was saved. Check the bore, then pick a table size or type the inner diameter.`,
    ]);
  });
  test("a listed size saved with another bore (a table corrected since): said with both bores at 1e-6 apart, not at 1e-12", () => {
    for (const t of PIPE_TABLES) {
      const s = t.sizes[t.sizes.length - 1];
      const r = tableRun("discharge", "Main", t.id, s.nominal, t.material, 100);
      for (const k of [1 + 1e-6, 1 - 1e-6, 1.05, 0.9]) {
        const w = sizeWarnings({ ...r, diameter: s.innerDiameter * k });
        expect(w, `${t.id} × ${k}`).toHaveLength(1);
        expect(w[0]).toMatch(new RegExp(`^Main: .* ${s.nominal.replace(/[()]/g, "\\$&")} has an inner diameter of ⟦diameter\\|${s.innerDiameter}[^⟧]*⟧ in the catalogue now, but the run was saved with ⟦diameter\\|${s.innerDiameter * k}[^⟧]*⟧, which is used\\. Save the run again to take the table's bore\\.$`));
      }
    }
  });
  test("the system's warnings carry it once; a typed inner diameter or a table without a size says nothing", () => {
    const r = { ...tableRun("discharge", "Main", "steel-sch40", "4", "steel", 100), nominal: "40" };
    const w = evaluateSystem(withRuns([r]), { points: 3 }).warnings;
    expect(w.filter((x) => x.startsWith(`Main: Steel, Schedule 40 lists no size "40"`))).toHaveLength(1);
    expect(sizeWarnings({ ...r, nominal: "" })).toEqual([]);
    expect(sizeWarnings({ ...r, pipeTable: "", nominal: "" })).toEqual([]);
  });
});
