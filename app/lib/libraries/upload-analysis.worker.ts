// Worker thread: decodes and analyses uploads off the main thread (see upload-analysis.server.ts):
// the mapping page's summary and the import plan (app/lib/libraries/analysis-jobs.ts). Bundled to
// build/server/upload-analysis-worker.mjs by react-router.config.ts (buildEnd); run through tsx
// from source in development and tests.
// With an upload id instead of bytes, the worker reads the stored bytes itself (its own small pool),
// so a big blob never passes through the main thread. After an import plan it sends the points'
// LOAD DATA lines in a second message (the main thread is writing models and curve sets meanwhile).
import { parentPort } from "node:worker_threads";
import { getPool } from "../../../db/client.server";
import { runJob, transferablesOf, type AnalysisJob } from "./analysis-jobs";
import { pointLines, setLines } from "./import-plan";

async function storedBytes(uploadId: number): Promise<Uint8Array> {
  const rows = (await getPool().query("SELECT content FROM uploads WHERE id = ?", [uploadId])) as { content: Uint8Array }[];
  if (!rows[0]) throw new Error("The upload is gone.");
  return rows[0].content;
}

parentPort?.on("message", async ({ id, job, uploadId }: { id: number; job: AnalysisJob; uploadId?: number }) => {
  try {
    if (uploadId !== undefined) job = { ...job, bytes: await storedBytes(uploadId) };
    const out = runJob(job);
    // an import plan's arrays move to the main thread: keep what its LOAD DATA lines are made from
    const p = "plan" in out && out.plan ? out.plan : null;
    const keep = p && { starts: p.starts.slice(), values: p.values.slice(), setSpeed: p.setSpeed.slice(), setImpeller: p.setImpeller.slice(), setMinFlow: p.setMinFlow.slice() };
    parentPort!.postMessage({ id, ok: true, out }, transferablesOf(out));
    // made while the main thread's transaction writes what comes before them (import-plan.ts Lines)
    if (keep)
      for (const [part, make] of [["sets", setLines], ["points", pointLines]] as const) {
        let lines = null;
        try {
          lines = make(keep);
        } catch {
          /* the writer makes them itself, a piece at a time */
        }
        parentPort!.postMessage({ id, part, lines }, lines ? [lines.bytes.buffer as ArrayBuffer, lines.ends.buffer as ArrayBuffer] : []);
      }
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
