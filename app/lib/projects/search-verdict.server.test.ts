// Search against the real MariaDB with the demo libraries (npm test seeds them): one row per
// distinct curve, outside-catalogue rows only on request, each rank explained against the row
// above. Check values: the demo data's own published impeller range (pump_models) and the
// product's rules (app/engine/verdict.ts); the duty is the example (108 m³/h at 28 m).
import { readFileSync } from "node:fs";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "@db/client.server";
import { workspaces } from "@db/schema";
import { createLibrary, listLibraries, updateLibrary, type Viewer } from "../libraries";
import { createProject, createSystem } from "./projects.server";
import { searchForSystem } from "./search.server";
import { defaultSystemInput, type SystemInput } from "./hydraulics";
import { makeMember } from "~/test/harness";
import { inSI } from "~/engine/quantityText";
import { importCsvText, M3H, viewerOfUser } from "./test-kit";

afterAll(() => closeDb());

const OWN = "Own copy of Tallowmere";
let eng: Viewer;
let systemId: number;

beforeAll(async () => {
  // A workspace on the paid plan (every shared demo library open) that also keeps its own copy of
  // one distributor's file: the same curves reached through two libraries.
  const m = await makeMember("admin");
  await db().update(workspaces).set({ plan: "network" }).where(eq(workspaces.id, m.workspaceId));
  eng = await viewerOfUser(m.userId);
  const libId = await createLibrary(eng, { name: OWN, description: "" });
  await importCsvText(eng, libId, readFileSync("fixtures/demo/tallowmere.csv", "utf8"));
  await updateLibrary(eng, libId, { name: OWN, description: "", visibility: "workspace" });
  const input: SystemInput = { ...defaultSystemInput(), staticLow: 12, staticHigh: 12, duty: { flow: 108 * M3H, head: 28 } };
  input.runs = input.runs.map((r) => ({ ...r, diameter: 0.15 }));
  systemId = await createSystem(eng, await createProject(eng, { name: "Search verdicts", site: "", description: "" }), "Main", input);
});

describe("search: one row per distinct curve, the libraries named", () => {
  test("the demo Tallowmere library and the workspace's copy give one row per curve, naming both", async () => {
    const libs = await listLibraries(eng);
    expect(libs.some((l) => l.name === "Tallowmere process and utility pumps" && l.access === "open")).toBe(true); // demo seed
    const r = await searchForSystem(eng, systemId, { allowBeyondCatalogue: true });
    expect(r.hidden.duplicates).toBeGreaterThan(0);
    const keys = r.results.map((x) => `${x.model}|${x.setSpeed}|${x.setDiameter}`);
    expect(new Set(keys).size).toBe(keys.length);
    const tfs = r.results.filter((x) => x.model.startsWith("TFS "));
    expect(tfs.length).toBeGreaterThan(0);
    for (const x of tfs) {
      // Identical scores: the workspace's own copy is the row kept, the shared library named beside it.
      expect(x.library).toBe(OWN);
      expect(x.alsoIn).toEqual(["Tallowmere process and utility pumps"]);
    }
  });
});

describe("search: outside the catalogue only when asked", () => {
  test("a trim below the model's smallest published impeller is hidden by default and shown, labelled, when allowed", async () => {
    const plain = await searchForSystem(eng, systemId);
    const beyond = await searchForSystem(eng, systemId, { allowBeyondCatalogue: true });
    for (const x of plain.results) expect(x.verdict?.status).not.toBe("outside-catalogue");
    const outside = beyond.results.filter((x) => x.verdict?.status === "outside-catalogue");
    expect(outside.length).toBeGreaterThan(0);
    expect(plain.hidden.outsideCatalogue).toBe(outside.length);
    // The case: TFS Meregate 150 trimmed to Ø165 mm while its smallest published impeller is Ø175 mm (demo data).
    const meregate = outside.find((x) => x.model === "TFS Meregate 150" && x.method === "trim")!;
    expect(meregate.diameter! * 1000).toBeLessThan(175);
    expect(inSI(meregate.verdict!.reasons[0])).toMatch(/below the smallest the model publishes \(Ø175 mm\)/);
    expect(plain.results.some((x) => x.model === "TFS Meregate 150" && x.method === "trim")).toBe(false);
  });

  test("ranks are consecutive and each reason compares with the row above", async () => {
    const r = await searchForSystem(eng, systemId);
    expect(r.results.map((x) => x.rank)).toEqual(r.results.map((_, i) => i + 1));
    expect(r.results[0].reason).toMatch(/^#1 of \d+: .*highest score/);
    for (const x of r.results.slice(1)) expect(x.reason).toMatch(new RegExp(`^#${x.rank} of \\d+: .*below #${x.rank - 1}`));
  });
});
