// The search's prepared indexes and verdicts kept per process (app/lib/projects/search.server.ts):
// the cached path gives exactly what a fresh build gives, and a new library revision is seen at once.
// Against the real MariaDB with the demo libraries (npm test seeds them); check values come from the
// uncached path itself (the reference) and from the demo file's own rows.
import { readFileSync } from "node:fs";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "@db/client.server";
import { libraries, workspaces } from "@db/schema";
import { analyseStored, createLibrary, getUpload, importUpload, storeUpload, updateLibrary, type Viewer } from "../libraries";
import { createProject, createSystem, saveSystem, getSystem } from "./projects.server";
import { clearSearchCaches, preparedCacheStats, searchForSystem } from "./search.server";
import { defaultSystemInput, type SystemInput } from "./hydraulics";
import { makeMember } from "~/test/harness";
import { workspacesOf } from "../auth/guards.server";

afterAll(() => closeDb());

const M3H = 1 / 3600;
let eng: Viewer;
let systemId: number;
let libId: number;
const csv = readFileSync("fixtures/demo/tallowmere.csv", "utf8");

async function importText(text: string) {
  const uploadId = await storeUpload(eng, libId, new File([text], "t.csv", { type: "text/csv" }));
  const u = await getUpload(eng, libId, uploadId);
  await importUpload(eng, libId, uploadId, analyseStored(u.text, u.lib).mapping);
}
const strip = (r: Awaited<ReturnType<typeof searchForSystem>>) => JSON.stringify({ results: r.results, stats: r.stats, hidden: r.hidden });

beforeAll(async () => {
  const m = await makeMember("admin");
  await db().update(workspaces).set({ plan: "network" }).where(eq(workspaces.id, m.workspaceId));
  const ws = (await workspacesOf(m.userId))[0];
  eng = { userId: m.userId, workspace: { id: ws.id, name: ws.name, slug: ws.slug, plan: ws.plan }, role: "admin" };
  libId = await createLibrary(eng, { name: "Cache check", description: "" });
  // First revision: the demo file without its last third of rows.
  const lines = csv.split("\n");
  await importText(lines.slice(0, Math.floor(lines.length * 0.66)).join("\n"));
  await updateLibrary(eng, libId, { name: "Cache check", description: "", visibility: "workspace" });
  const input: SystemInput = { ...defaultSystemInput(), staticLow: 12, staticHigh: 12, duty: { flow: 108 * M3H, head: 28 } };
  input.runs = input.runs.map((r) => ({ ...r, diameter: 0.15 }));
  systemId = await createSystem(eng, await createProject(eng, { name: "Search cache", site: "", description: "" }), "Main", input);
});

describe("search caches", () => {
  test("cached results equal the uncached path, on the first and on a repeat view, with and without filters", async () => {
    clearSearchCaches();
    const fresh = await searchForSystem(eng, systemId, {}, { uncached: true });
    expect(fresh.results.length).toBeGreaterThan(0);
    const first = await searchForSystem(eng, systemId);
    const again = await searchForSystem(eng, systemId);
    expect(strip(first)).toBe(strip(fresh));
    expect(strip(again)).toBe(strip(fresh));
    const f = { type: "end", allowBeyondCatalogue: true };
    expect(strip(await searchForSystem(eng, systemId, f))).toBe(strip(await searchForSystem(eng, systemId, f, { uncached: true })));
  });

  test("a new revision of an open library is searched at once (a new key), and still equals the uncached path", async () => {
    const before = await searchForSystem(eng, systemId);
    const rev1 = (await db().select({ r: libraries.currentRevisionId }).from(libraries).where(eq(libraries.id, libId)))[0].r!;
    expect(preparedCacheStats().keys.some((k) => JSON.parse(k)[0].includes(rev1))).toBe(true);
    await importText(csv); // the whole file: a new revision with more curves
    const rev2 = (await db().select({ r: libraries.currentRevisionId }).from(libraries).where(eq(libraries.id, libId)))[0].r!;
    expect(rev2).not.toBe(rev1);
    const after = await searchForSystem(eng, systemId);
    expect(preparedCacheStats().keys.some((k) => JSON.parse(k)[0].includes(rev2))).toBe(true);
    expect(strip(after)).toBe(strip(await searchForSystem(eng, systemId, {}, { uncached: true })));
    expect(after.stats!.searched).toBeGreaterThan(before.stats!.searched); // more curve sets in the new revision
  });

  test("a saved change to the system gives verdicts of the new inputs (the verdict cache is keyed by the inputs)", async () => {
    const s = await getSystem(eng, systemId);
    const changed: SystemInput = { ...s.input, flowTolerance: { minus: 0, plus: 0 } };
    await searchForSystem(eng, systemId); // warm the old inputs' verdicts
    await saveSystem(eng, systemId, s.name, changed);
    const r = await searchForSystem(eng, systemId, { allowBeyondCatalogue: true });
    expect(strip(r)).toBe(strip(await searchForSystem(eng, systemId, { allowBeyondCatalogue: true }, { uncached: true })));
    await saveSystem(eng, systemId, s.name, s.input);
  });
});
