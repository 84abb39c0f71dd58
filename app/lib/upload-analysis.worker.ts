// Worker thread: decodes and analyses an upload off the main thread (see upload-analysis.server.ts).
// Bundled to build/server/upload-analysis-worker.mjs by react-router.config.ts (buildEnd); run
// through tsx from source in development and tests.
import { parentPort } from "node:worker_threads";
import { analyseStored, summarise } from "./upload-analysis";

type Job = { id: number; bytes: Uint8Array; mappingJson: string | null; mapping?: unknown };

parentPort?.on("message", (job: Job) => {
  try {
    parentPort!.postMessage({ id: job.id, ok: true, summary: summarise(analyseStored(job.bytes, { mappingJson: job.mappingJson }, job.mapping)) });
  } catch (e) {
    const err = e as Error & { issues?: { message: string }[] };
    parentPort!.postMessage({ id: job.id, ok: false, name: err?.name ?? "Error", message: err?.message ?? String(e), issues: err?.issues?.map((i) => ({ message: i.message })) });
  }
});
