// Worker thread: decodes and analyses uploads off the main thread (see upload-analysis.server.ts):
// the mapping page's summary and the import plan (app/lib/libraries/analysis-jobs.ts). Bundled to
// build/server/upload-analysis-worker.mjs by react-router.config.ts (buildEnd); run through tsx
// from source in development and tests.
import { parentPort } from "node:worker_threads";
import { runJob, transferablesOf, type AnalysisJob } from "./libraries/analysis-jobs";

parentPort?.on("message", ({ id, job }: { id: number; job: AnalysisJob }) => {
  try {
    const out = runJob(job);
    parentPort!.postMessage({ id, ok: true, out }, transferablesOf(out));
  } catch (e) {
    const err = e as Error & { issues?: { message: string; path?: { key: unknown }[] }[] };
    parentPort!.postMessage({
      id,
      ok: false,
      name: err?.name ?? "Error",
      message: err?.message ?? String(e),
      issues: err?.issues?.map((i) => ({ message: i.message, path: (i.path ?? []).map((p) => String(p.key)) })),
    });
  }
});
