// Issue 14: a big upload is never decoded, parsed or validated on the main thread — not for the
// mapping page, not for the import, not for the API's report. The import core is wrapped with
// counters here (vi.mock): the worker thread loads its own copy, so any call counted below ran on this
// thread. A small file (under OFF_THREAD_BYTES) is analysed here on purpose, which shows the counters
// see what they should. How long the loop stalls is measured by `npm run bench` (no timed assertions).
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, expect, test, vi } from "vitest";
import { closeDb } from "@db/client.server";
import { makeBigCsv } from "../../fixtures/csv/make-big";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createLibrary, importUpload, storeUpload, type Viewer } from "~/lib/libraries";
import { OFF_THREAD_BYTES, stopAnalysisWorker } from "~/lib/libraries/upload-analysis.server";
import * as uploadPage from "~/routes/libraries.$id.uploads.$uploadId";
import * as apiUpload from "~/routes/api.v1.libraries.$id.upload";
import { call, makeMember, type TestMember } from "./harness";

const seen = vi.hoisted(() => ({ analyse: [] as number[], decode: [] as number[] }));
vi.mock("~/lib/import", async (importOriginal) => {
  const real = await importOriginal<typeof import("~/lib/import")>();
  return {
    ...real,
    analyseCsv: (text: string, ...rest: unknown[]) => (seen.analyse.push(text.length), (real.analyseCsv as (...a: unknown[]) => unknown)(text, ...rest)),
    decodeBytes: (bytes: Uint8Array, ...rest: unknown[]) => (seen.decode.push(bytes.length), (real.decodeBytes as (...a: unknown[]) => unknown)(bytes, ...rest)),
  };
});

let m: TestMember;
let viewer: Viewer;
let token = "";
const POINTS = 30_000; // about 1.7 MB: well over OFF_THREAD_BYTES
const big = makeBigCsv({ points: POINTS });

beforeAll(async () => {
  m = await makeMember("distributor");
  viewer = { userId: m.userId, workspace: { id: m.workspaceId, name: "W", slug: "w", plan: "free" }, role: "distributor" };
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "w", scope: "write" })).token;
});
afterAll(async () => {
  await stopAnalysisWorker();
  await closeDb();
});

const onThisThread = () => [...seen.analyse, ...seen.decode].filter((n) => n > OFF_THREAD_BYTES / 2);
const reset = () => ((seen.analyse.length = 0), (seen.decode.length = 0));

test("mapping page, import and API report of a big upload: no decode, parse or validation on the main thread", async () => {
  expect(big.length).toBeGreaterThan(OFF_THREAD_BYTES * 4);
  const lib = await createLibrary(viewer, { name: "Off thread", description: "" });
  const upload = await storeUpload(viewer, lib, new File([big], "big.csv", { type: "text/csv" }));
  reset();
  const params = { id: String(lib), uploadId: String(upload) };
  const page = await call(uploadPage.loader as never, { path: `/libraries/${lib}/uploads/${upload}`, cookie: m.cookie, params });
  expect(page.status).toBe(200);
  const summary = page.body as { stats: { pointsAccepted: number; curveSets: number }; mapping: unknown; preview: unknown[] };
  expect(summary.stats.pointsAccepted).toBe(POINTS);
  expect(summary).not.toHaveProperty("curveSets"); // the page carries counts, not a list of every curve
  const r = await importUpload(viewer, lib, upload, summary.mapping, "off thread");
  expect(r.points).toBe(POINTS);
  const fd = new FormData();
  fd.append("file", new File([big], "big.csv", { type: "text/csv" }));
  fd.append("import", "1");
  const api = await call(apiUpload.action as never, { path: `/api/v1/libraries/${lib}/upload`, params: { id: String(lib) }, method: "POST", body: fd, headers: { authorization: `Bearer ${token}` } });
  expect(api.status).toBe(201);
  const body = api.body as { report: { stats: { pointsAccepted: number } }; revision: { points: number; number: number } };
  expect(body.report.stats.pointsAccepted).toBe(POINTS);
  expect(body.revision).toMatchObject({ points: POINTS, number: 2 });
  expect(onThisThread()).toEqual([]);
});

test("control: a small upload is analysed on this thread, and the counters see it", async () => {
  const lib = await createLibrary(viewer, { name: "Small", description: "" });
  const csv = readFileSync("fixtures/csv/long-si.csv");
  expect(csv.length).toBeLessThan(OFF_THREAD_BYTES);
  const upload = await storeUpload(viewer, lib, new File([csv], "small.csv", { type: "text/csv" }));
  reset();
  const fd = new FormData();
  fd.append("file", new File([csv], "small.csv", { type: "text/csv" }));
  const api = await call(apiUpload.action as never, { path: `/api/v1/libraries/${lib}/upload`, params: { id: String(lib) }, method: "POST", body: fd, headers: { authorization: `Bearer ${token}` } });
  expect(api.status).toBe(201);
  expect(upload).toBeGreaterThan(0);
  expect(seen.analyse.length).toBeGreaterThan(0);
  expect(seen.decode).toContain(csv.length);
});
