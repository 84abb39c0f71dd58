// The search's kept path (revisions held compactly, their prepared indexes joined; search.server.ts and
// revision-curves.server.ts) against the plain engine over the demo libraries: the same curve sets, the
// same candidates, and a new revision or a plan change seen on the next search. Against the real
// MariaDB with the demo libraries (npm test seeds them); the check values are the plain path's own
// answers (`curvesOfRevisions` → `prepareSearchIndex` → `searchDuty`, the reference) and the demo file.
import { readFileSync } from "node:fs";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "@db/client.server";
import { workspaces } from "@db/schema";
import { prepareSearchIndex, searchDuty } from "~/engine";
import { analyseStored, createLibrary, curvesOfRevisions, getUpload, importUpload, searchableRevisions, storeUpload, updateLibrary, type LibraryCurveSet, type Viewer } from "../libraries";
import { createProject, createSystem, getSystem } from "./projects.server";
import { clearSearchCaches, preparedSearch, searchForSystem, searchOptionsFor, toEngineSet, type SearchFilters } from "./search.server";
import { curveSetAt, keptRevisions, readRevisionCurves } from "./revision-curves.server";
import { defaultSystemInput, evaluateSystem, type SystemInput } from "./hydraulics";
import { makeMember } from "~/test/harness";
import { workspacesOf } from "../auth/guards.server";

afterAll(() => closeDb());

const M3H = 1 / 3600;
let userId: string;
let systemId: number;
let libId: number;
const csv = readFileSync("fixtures/demo/nordquay.csv", "utf8");

/** The viewer as the guards build it on each request (the plan read from the database). */
async function viewer(): Promise<Viewer> {
  const ws = (await workspacesOf(userId))[0];
  return { userId, workspace: { id: ws.id, name: ws.name, slug: ws.slug, plan: ws.plan }, role: "admin" };
}
async function importText(text: string) {
  const v = await viewer();
  const uploadId = await storeUpload(v, libId, new File([text], "n.csv", { type: "text/csv" }));
  const u = await getUpload(v, libId, uploadId);
  await importUpload(v, libId, uploadId, analyseStored(u.text, u.lib).mapping);
}
const strip = (r: Awaited<ReturnType<typeof searchForSystem>>) => JSON.stringify({ results: r.results, stats: r.stats, hidden: r.hidden, locked: r.locked.map((l) => l.id) });

/** The plain engine over the open revisions' sets as `curvesOfRevisions` reads them, against the kept path's index. */
async function engineBothWays(filters: SearchFilters) {
  const v = await viewer();
  const { open } = await searchableRevisions(v);
  const system = await getSystem(v, systemId);
  const options = searchOptionsFor(system.input, evaluateSystem(system.input), filters);
  const sets: LibraryCurveSet[] = [];
  for (const o of open) for (const s of await curvesOfRevisions([o.revisionId])) sets.push(s);
  const kept = (s: LibraryCurveSet) =>
    (!filters.type || s.type.toLowerCase().includes(filters.type.toLowerCase())) && (!filters.speed || (s.speed != null && Math.abs(s.speed - filters.speed) / filters.speed < 0.1));
  const plain = searchDuty(prepareSearchIndex(sets.filter(kept).map(toEngineSet)), system.input.duty!, { ...options, limit: 10_000 });
  const fast = searchDuty((await preparedSearch(open, filters)).index, system.input.duty!, { ...options, limit: 10_000 });
  return { plain, fast, open };
}

beforeAll(async () => {
  const m = await makeMember("admin");
  userId = m.userId;
  await db().update(workspaces).set({ plan: "network" }).where(eq(workspaces.id, m.workspaceId));
  const v = await viewer();
  libId = await createLibrary(v, { name: "Kept path check", description: "" });
  const lines = csv.split("\n");
  await importText(lines.slice(0, Math.floor(lines.length * 0.5)).join("\n")); // first revision: half the demo file
  await updateLibrary(v, libId, { name: "Kept path check", description: "", visibility: "workspace" });
  const input: SystemInput = { ...defaultSystemInput(), staticLow: 12, staticHigh: 12, duty: { flow: 108 * M3H, head: 28 } };
  input.runs = input.runs.map((r) => ({ ...r, diameter: 0.15 }));
  systemId = await createSystem(v, await createProject(v, { name: "Kept search", site: "", description: "" }), "Main", input);
});

describe("kept revisions", () => {
  test("a kept revision gives back every curve set exactly as curvesOfRevisions reads it, in the same order", async () => {
    const { open } = await searchableRevisions(await viewer());
    expect(open.length).toBeGreaterThan(1); // the shared demo libraries and ours
    for (const o of open) {
      const r = await readRevisionCurves(o.revisionId);
      const plain = await curvesOfRevisions([o.revisionId]);
      expect(r.count).toBe(plain.length);
      expect(Array.from({ length: r.count }, (_, i) => curveSetAt(r, i))).toEqual(plain);
    }
  });

  test("the kept path's index finds the same candidates as the plain engine over the demo data, with and without set filters", async () => {
    clearSearchCaches();
    for (const f of [{}, { type: "END" }, { speed: 2900 }] as SearchFilters[]) {
      const { plain, fast } = await engineBothWays(f);
      expect(plain.candidates.length).toBeGreaterThan(0);
      expect(JSON.stringify(fast)).toBe(JSON.stringify(plain));
    }
    const v = await viewer();
    expect(strip(await searchForSystem(v, systemId))).toBe(strip(await searchForSystem(v, systemId, {}, { uncached: true })));
  });

  test("a new revision is searched on the next request: the kept path still equals the plain engine", async () => {
    const v = await viewer();
    const before = await searchForSystem(v, systemId);
    await importText(csv); // the whole file: a new revision with more curves
    const { plain, fast, open } = await engineBothWays({});
    expect(JSON.stringify(fast)).toBe(JSON.stringify(plain));
    expect(keptRevisions()).toEqual(expect.arrayContaining(open.map((o) => o.revisionId)));
    const after = await searchForSystem(v, systemId);
    expect(after.stats!.searched).toBeGreaterThan(before.stats!.searched);
    expect(strip(after)).toBe(strip(await searchForSystem(v, systemId, {}, { uncached: true })));
  });

  test("a plan change shows at once: shared libraries drop out on the free plan and come back on the paid one", async () => {
    const paid = await searchForSystem(await viewer(), systemId);
    await db().update(workspaces).set({ plan: "free" }).where(eq(workspaces.id, (await viewer()).workspace.id));
    const v = await viewer();
    const free = await searchForSystem(v, systemId);
    expect(free.locked.length).toBeGreaterThan(0);
    expect(free.stats!.searched).toBeLessThan(paid.stats!.searched);
    expect(free.results.length).toBeGreaterThan(0);
    expect(free.results.every((r) => r.library === "Kept path check")).toBe(true);
    expect(strip(free)).toBe(strip(await searchForSystem(v, systemId, {}, { uncached: true })));
    const { plain, fast } = await engineBothWays({});
    expect(JSON.stringify(fast)).toBe(JSON.stringify(plain));
    await db().update(workspaces).set({ plan: "network" }).where(eq(workspaces.id, v.workspace.id));
    expect(strip(await searchForSystem(await viewer(), systemId))).toBe(strip(paid));
  });
});
