/**
 * Mapping page of a big upload: 200 000 curve points (fixtures/csv/make-big.ts, invented data),
 * stored once, then the page's loader called twice as a signed-in distributor. The analysis runs in
 * a worker thread (app/lib/upload-analysis.server.ts); this prints the longest event-loop stall
 * seen during each view (perf_hooks.monitorEventLoopDelay, 10 ms resolution) and the view's time.
 * Goal (issue 14): no stall over 100 ms; the second view served from the per-process cache.
 *
 *   DATABASE_URL=… npx tsx app/bench/mapping-page.ts [points]
 */
import { monitorEventLoopDelay, performance } from "node:perf_hooks";
import { closeDb } from "@db/client.server";
import { makeBigCsv } from "../../fixtures/csv/make-big";
import { createLibrary, storeUpload } from "~/lib/libraries.server";
import { call, makeMember } from "~/test/harness";
import * as uploadPage from "~/routes/libraries.$id.uploads.$uploadId";
import { stopAnalysisWorker } from "~/lib/upload-analysis.server";

const points = Number(process.argv[2] ?? 200_000);
const m = await makeMember("distributor");
const viewer = { userId: m.userId, workspace: { id: m.workspaceId, name: "Bench", slug: "bench", plan: "free" as const }, role: "distributor" as const };
const lib = await createLibrary(viewer, { name: "Mapping page bench", description: "" });
const csv = makeBigCsv({ points });
const upload = await storeUpload(viewer, lib, new File([csv], "big.csv", { type: "text/csv" }));
console.log(`${points.toLocaleString("en")} points, ${(csv.length / 1048576).toFixed(1)} MB`);
console.log("view   | ms total | longest event-loop stall (ms) | status");
for (const view of ["first", "second"]) {
  const h = monitorEventLoopDelay({ resolution: 10 });
  h.enable();
  const t0 = performance.now();
  const r = await call(uploadPage.loader as never, { path: `/libraries/${lib}/uploads/${upload}`, cookie: m.cookie, params: { id: String(lib), uploadId: String(upload) } });
  const ms = performance.now() - t0;
  h.disable();
  console.log(`${view.padEnd(6)} | ${ms.toFixed(0).padStart(8)} | ${(h.max / 1e6).toFixed(0).padStart(29)} | ${r.status}`);
}
await stopAnalysisWorker();
await closeDb();
