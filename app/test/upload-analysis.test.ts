// The mapping page's analysis runs in a worker thread and is computed once per upload and mapping
// (issue 14: a 200 000-row file blocked the server for about 2 s on every view). Speed itself is
// measured by `npm run bench` (app/bench/mapping-page.ts); here: same answer as the in-thread
// analysis, a repeat view never reads the file again, and a bad mapping is a clean message.
import { readFileSync } from "node:fs";
import { afterAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createLibrary, storeUpload } from "~/lib/libraries";
import { analyseStored, summarise } from "~/lib/libraries/upload-analysis";
import { analysisCacheSize, stopAnalysisWorker, summariseUpload } from "~/lib/libraries/upload-analysis.server";
import * as uploadPage from "~/routes/libraries.$id.uploads.$uploadId";
import { call, makeMember } from "./harness";

afterAll(async () => {
  await stopAnalysisWorker();
  await closeDb();
});

test("the worker's summary equals the in-thread analysis; a second view reads no bytes", async () => {
  const csv = readFileSync("fixtures/csv/long-si.csv", "utf8");
  let reads = 0;
  const bytes = async () => (reads++, new TextEncoder().encode(csv));
  const upload = { id: -1, sha256: `test-${Date.now()}` };
  const a = await summariseUpload(upload, bytes, null);
  expect(a).toEqual(JSON.parse(JSON.stringify(summarise(analyseStored(csv, { mappingJson: null })))));
  const size = analysisCacheSize();
  const b = await summariseUpload(upload, bytes, null);
  expect(b).toEqual(a);
  expect(reads).toBe(1);
  expect(analysisCacheSize()).toBe(size);
});

test("the mapping page loads through the worker; a mapping that cannot work is a message, not a 500", async () => {
  const m = await makeMember("distributor");
  const viewer = { userId: m.userId, workspace: { id: m.workspaceId, name: "W", slug: "w", plan: "free" as const }, role: "distributor" as const };
  const lib = await createLibrary(viewer, { name: "Worker page", description: "" });
  const upload = await storeUpload(viewer, lib, new File([readFileSync("fixtures/csv/long-si.csv")], "a.csv", { type: "text/csv" }));
  const params = { id: String(lib), uploadId: String(upload) };
  const page = await call(uploadPage.loader as never, { path: `/libraries/${lib}/uploads/${upload}`, cookie: m.cookie, params });
  expect(page.status).toBe(200);
  const body = page.body as { stats: { curveSets: number }; mapping: unknown };
  expect(body.stats.curveSets).toBeGreaterThan(0);
  const bad = await call(uploadPage.action as never, { path: `/libraries/${lib}/uploads/${upload}`, cookie: m.cookie, params, form: { base: "{}", intent: "check" } });
  expect(bad.status).toBeLessThan(500);
});
