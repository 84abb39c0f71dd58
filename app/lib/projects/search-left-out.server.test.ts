// Curve sets the engine refuses to index (stored before the importer applied the engine's point rules)
// are counted and named by the search, on the kept and the freshly built path alike, never dropped
// without a word. Against the real MariaDB; one stored point is set to NPSHr 0 by hand to stand for such
// an older import (the importer itself now drops a zero NPSHr at shutoff with a warning).
// Sources: fixtures/demo/nordquay.csv (invented); the rule is app/engine/pumpCurve.ts checkPumpPoints (NPSHr > 0).
import { and, asc, eq, inArray } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "@db/client.server";
import { curvePoints, curveSets, libraryRevisions, pumpModels } from "@db/schema";
import { clearSearchCaches, searchForSystem } from "./search.server";
import { systemSearchView } from "./systems-api.server";
import { searchFixture, viewerOfUser } from "./test-kit";
import { call, makeMember } from "~/test/harness";
import * as searchPage from "~/routes/systems.$id.search";

afterAll(() => closeDb());

let userId: string;
let systemId: number;
let libId: number;
const viewer = () => viewerOfUser(userId);

beforeAll(async () => {
  ({ userId, systemId, libId } = await searchFixture({ demoFile: "nordquay.csv", library: "Left-out check", project: "Left-out search", fraction: 0.5 }));
});

describe("sets the engine refuses are counted and named", () => {
  test("none left out on clean data; one stored NPSHr of 0 makes one, on both paths, with its model and reason", async () => {
    clearSearchCaches();
    const v = await viewer();
    const before = await searchForSystem(v, systemId);
    expect(before.leftOut).toEqual({ count: 0, examples: [] }); // source: the demo data meets the engine's rules

    const revs = await db().select({ id: libraryRevisions.id }).from(libraryRevisions).where(eq(libraryRevisions.libraryId, libId));
    const [set] = await db()
      .select({ id: curveSets.id, model: pumpModels.name, speed: curveSets.speed, type: pumpModels.type })
      .from(curveSets).innerJoin(pumpModels, eq(pumpModels.id, curveSets.modelId))
      .where(inArray(curveSets.revisionId, revs.map((r) => r.id))).orderBy(asc(curveSets.id)).limit(1);
    const [first] = await db().select({ id: curvePoints.id }).from(curvePoints).where(eq(curvePoints.curveSetId, set.id)).orderBy(asc(curvePoints.seq)).limit(1);
    await db().update(curvePoints).set({ npshr: 0 }).where(and(eq(curvePoints.id, first.id)));
    clearSearchCaches(); // revisions never change in the app: this stands for a revision stored that way

    const kept = await searchForSystem(v, systemId);
    const fresh = await searchForSystem(v, systemId, {}, { uncached: true });
    for (const r of [kept, fresh]) {
      expect(r.leftOut.count).toBe(1); // source: construction (one set broken)
      expect(r.leftOut.examples).toHaveLength(1);
      expect(r.leftOut.examples[0]).toContain(`${set.model} · ${set.speed} rpm: point 1 npshr`); // source: the set and the point changed above
      expect(r.stats!.searched).toBe(before.stats!.searched - 1); // source: the engine leaves the set out of its index
    }
    // A filter that leaves the set out of the search anyway does not count it; one that keeps it does.
    expect((await searchForSystem(v, systemId, { type: "no such type" })).leftOut.count).toBe(0); // source: filter keeps no set
    expect((await searchForSystem(v, systemId, { type: set.type })).leftOut.count).toBe(1); // source: the set's own type
    // The read API and the search page say it too.
    expect((await systemSearchView(v, systemId)).leftOut.count).toBe(1); // source: construction
    const engineer = await makeMember("engineer", v.workspace.id);
    const page = await call(searchPage.loader as never, { path: `/systems/${systemId}/search`, cookie: engineer.cookie, params: { id: String(systemId) } });
    expect(page.status).toBe(200);
    expect((page.body as { leftOut: { count: number; examples: string[] } }).leftOut.examples[0]).toContain(set.model); // source: construction
  });
});
