// The search's kept path (revisions held compactly, their prepared indexes joined; search.server.ts and
// revision-curves.server.ts) against the plain engine over the demo libraries: the same curve sets, the
// same candidates, and a new revision or a plan change seen on the next search. Against the real
// MariaDB with the demo libraries (npm test seeds them); the check values are the plain path's own
// answers (`curvesOfRevisions` → `prepareSearchIndex` → `searchDuty`, the reference) and the demo file.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "@db/client.server";
import { workspaces } from "@db/schema";
import { prepareSearchIndex, searchDuty } from "~/engine";
import { curvesOfRevisions, searchableRevisions, type LibraryCurveSet } from "../libraries";
import { getSystem } from "./projects.server";
import { clearSearchCaches, preparedSearch, searchForSystem, searchOptionsFor, type SearchFilters } from "./search.server";
import { curveSetAt, keptRevisions, readRevisionCurves, toEngineSet } from "./revision-curves.server";
import { evaluateSystem } from "./hydraulics";
import { importCsvText, searchFixture, viewerOfUser } from "./test-kit";

afterAll(() => closeDb());

let userId: string;
let systemId: number;
let libId: number;
let csv: string;
const viewer = () => viewerOfUser(userId);
const importText = async (text: string) => importCsvText(await viewer(), libId, text, "n.csv");
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
  // First revision: half the demo file.
  ({ userId, systemId, libId, csv } = await searchFixture({ demoFile: "nordquay.csv", library: "Kept path check", project: "Kept search", fraction: 0.5 }));
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
