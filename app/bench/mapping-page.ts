/**
 * Mapping page of a big upload: 200 000 curve points (fixtures/csv/make-big.ts, invented data),
 * stored once, then the page's loader called twice as a signed-in distributor. The analysis runs in
 * a worker thread (app/lib/libraries/upload-analysis.server.ts); this prints the longest event-loop stall
 * seen during each view (perf_hooks.monitorEventLoopDelay, 10 ms resolution, and a 5 ms interval
 * probe) and the view's time; then imports the upload the same way (parse and validation in the
 * worker, the writes from this thread). Goal (issue 14): no stall over 100 ms.
 *
 *   DATABASE_URL=… npx tsx app/bench/mapping-page.ts [points]
 */
import { monitorEventLoopDelay, performance } from "node:perf_hooks";
import { closeDb } from "@db/client.server";
import { makeBigCsv } from "../../fixtures/csv/make-big";
import { createLibrary, importUpload, storeUpload } from "~/lib/libraries";
import { call, makeMember } from "~/test/harness";
import * as uploadPage from "~/routes/libraries.$id.uploads.$uploadId";
import { stopAnalysisWorker } from "~/lib/libraries/upload-analysis.server";

const points = Number(process.argv[2] ?? 200_000);
const m = await makeMember("distributor");
const viewer = { userId: m.userId, workspace: { id: m.workspaceId, name: "Bench", slug: "bench", plan: "free" as const }, role: "distributor" as const };
const lib = await createLibrary(viewer, { name: "Mapping page bench", description: "" });
const csv = makeBigCsv({ points });
const upload = await storeUpload(viewer, lib, new File([csv], "big.csv", { type: "text/csv" }));
console.log(`${points.toLocaleString("en")} points, ${(csv.length / 1048576).toFixed(1)} MB`);
console.log("step         | ms total | longest event-loop stall (ms) | status");
/** Runs `fn` while watching the event loop (histogram, 10 ms resolution) and a 5 ms interval probe; prints the longer of the two. */
async function watched(label: string, fn: () => Promise<string>) {
  const h = monitorEventLoopDelay({ resolution: 10 });
  h.enable();
  let last = performance.now();
  let worst = 0;
  const probe = setInterval(() => {
    const now = performance.now();
    worst = Math.max(worst, now - last);
    last = now;
  }, 5);
  const t0 = performance.now();
  const status = await fn();
  const ms = performance.now() - t0;
  clearInterval(probe);
  h.disable();
  console.log(`${label.padEnd(12)} | ${ms.toFixed(0).padStart(8)} | ${Math.max(h.max / 1e6, worst).toFixed(0).padStart(29)} | ${status}`);
}
let mapping: unknown;
for (const view of ["first view", "second view"]) {
  await watched(view, async () => {
    const r = await call(uploadPage.loader as never, { path: `/libraries/${lib}/uploads/${upload}`, cookie: m.cookie, params: { id: String(lib), uploadId: String(upload) } });
    mapping = (r.body as { mapping: unknown }).mapping;
    return String(r.status);
  });
}
await watched("import", async () => `${(await importUpload(viewer, lib, upload, mapping, "bench")).points} points`);
await stopAnalysisWorker();
await closeDb();
