// The search's prepared indexes and verdicts kept per process (app/lib/projects/search.server.ts):
// the cached path gives exactly what a fresh build gives, and a new library revision is seen at once.
// Against the real MariaDB with the demo libraries (npm test seeds them); check values come from the
// uncached path itself (the reference) and from the demo file's own rows.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "@db/client.server";
import { libraries } from "@db/schema";
import type { Viewer } from "../libraries";
import { saveSystem, getSystem } from "./projects.server";
import { clearSearchCaches, preparedCacheStats, searchForSystem } from "./search.server";
import type { SystemInput } from "./hydraulics";
import { importCsvText, searchFixture } from "./test-kit";

afterAll(() => closeDb());

let eng: Viewer;
let systemId: number;
let libId: number;
let csv: string;
const importText = (text: string) => importCsvText(eng, libId, text);

const strip = (r: Awaited<ReturnType<typeof searchForSystem>>) => JSON.stringify({ results: r.results, stats: r.stats, hidden: r.hidden });

beforeAll(async () => {
  // First revision: the demo file without its last third of rows.
  ({ viewer: eng, systemId, libId, csv } = await searchFixture({ demoFile: "tallowmere.csv", library: "Cache check", project: "Search cache", fraction: 0.66 }));
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
