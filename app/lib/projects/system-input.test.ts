// The stored runs' own warnings (system-input.ts runInputWarnings) and the system's warnings as evaluated: a pipe table
// whose material is not the run's, an aged roughness below the new one, each warning once. Check values: the engine's
// catalogue (pipes.ts: ISO 4427 PE100 tables are "pvc", plastics 0.0015 mm new, 0.01 mm aged; steel 0.045 / 0.5 mm).
import { describe, expect, test } from "vitest";
import { defaultSystemInput, evaluateSystem, runInputWarnings, systemSpec, tableRun, type PipeRunInput } from "./hydraulics";

const withRuns = (runs: PipeRunInput[]) => ({ ...defaultSystemInput(), runs });
const pe = (material: string) => ({ ...tableRun("discharge", "PE main", "iso4427-pe100-sdr11", "d110", "pvc", 1000), material });

describe("runInputWarnings", () => {
  test("a pipe table's material and the run's disagree: said naming the run, both materials and both roughnesses", () => {
    const steelRoughness = { roughness: 0.045e-3, agedRoughness: 0.5e-3 };
    const w = runInputWarnings(withRuns([{ ...pe("steel"), ...steelRoughness }]));
    expect(w).toEqual([
      "PE main: the pipe PE100 SDR 11 (ISO 4427) is PVC / plastics (⟦roughness|0.0000015⟧ new, ⟦roughness|0.00001⟧ aged), but the run's material is Commercial steel, so its roughness is ⟦roughness|0.000045⟧ new and ⟦roughness|0.0005⟧ aged. Check the run's material.",
    ]);
    expect(runInputWarnings(withRuns([pe("pvc")]))).toEqual([]); // agree: nothing
    expect(runInputWarnings(defaultSystemInput())).toEqual([]); // typed diameters: no table to disagree with
  });
  test("an aged roughness below the new one: said with both values and the one used (the new), naming the run", () => {
    const runs = defaultSystemInput().runs.map((r) => ({ ...r }));
    runs[0] = { ...runs[0], roughness: 0.1e-3, agedRoughness: 0.001e-3 }; // the hunt's case: 0.1 mm new, 0.001 mm aged
    expect(runInputWarnings(withRuns(runs))).toEqual([
      "Suction line: the aged roughness ⟦roughness|0.000001|0.0001⟧ is below the new ⟦roughness|0.0001|limit:0.000001⟧; pipe cannot be smoother aged than new, so the aged pipe is computed with the new ⟦roughness|0.0001|limit:0.000001⟧. Check the aged roughness.",
    ]);
    // The clamp stays for stored documents: the engine gets the new value as aged.
    expect(systemSpec(withRuns(runs)).suction![0].agedRoughness).toBe(0.1e-3);
  });
});

describe("evaluateSystem warnings", () => {
  test("carry the runs' own warnings, and each engine warning once (a fitting's was listed twice)", () => {
    const runs = defaultSystemInput().runs.map((r) => ({ ...r }));
    runs[0] = { ...runs[0], roughness: 0.1e-3, agedRoughness: 0.001e-3, pipeTable: "steel-sch40", nominal: "40" }; // 40 in: past Crane's fT table (½–24 in)
    runs.push({ ...pe("steel"), roughness: 0.045e-3, agedRoughness: 0.5e-3 });
    const w = evaluateSystem(withRuns(runs), { points: 3 }).warnings;
    expect(w.filter((x) => x.startsWith("Suction line: the aged roughness"))).toHaveLength(1);
    expect(w.filter((x) => x.startsWith("PE main: the pipe PE100 SDR 11"))).toHaveLength(1);
    expect(w.some((x) => /^Suction line: .*outside Crane's fT table/.test(x))).toBe(true);
    expect(new Set(w).size).toBe(w.length);
  });
});
