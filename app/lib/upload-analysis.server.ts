// Analysis of stored uploads off the main thread: a worker thread decodes, parses and validates (a
// 200 000-row file takes seconds: it must not stall every other request). The mapping page's summary
// is kept per process by (file hash, saved mapping, mapping asked for), so looking at the page again
// costs nothing; imports and the API's report get an import plan (app/lib/libraries/analysis-jobs.ts)
// from the worker for files over OFF_THREAD_BYTES, and analyse small files in the calling thread.
// The bytes are copied once and moved (transferred) to the worker; the plan's typed arrays are moved
// back. Each app process keeps its own worker and small cache.
import { existsSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import type { UploadSummary } from "./upload-analysis";
import { runJob, type AnalysisJob, type AnalysisOutput, type ImportAnalysis } from "./libraries/analysis-jobs";

/** Files up to this size are analysed for imports in the calling thread (tens of milliseconds at most). */
export const OFF_THREAD_BYTES = 256 * 1024;

export class AnalysisFailed extends Error {
  constructor(
    message: string,
    public readonly issues: { message: string; path?: string[] }[] = [],
    /** "ValiError" when the mapping itself was refused. */
    public readonly errorName: string = "Error",
  ) {
    super(message);
    this.name = "AnalysisFailed";
  }
  get mappingRefused() {
    return this.errorName === "ValiError";
  }
}

const CACHE_ENTRIES = 16;
const cache = new Map<string, Promise<UploadSummary>>();

let worker: Worker | null = null;
let seq = 0;
const pending = new Map<number, { resolve: (s: AnalysisOutput) => void; reject: (e: Error) => void }>();

/** The bundled worker next to the server build, else the TypeScript source through tsx's loader (development, tests). */
function startWorker(): Worker {
  const here = path.dirname(fileURLToPath(import.meta.url));
  const bundled = path.join(here, "upload-analysis-worker.mjs");
  if (existsSync(bundled)) return new Worker(bundled);
  const source = pathToFileURL(path.join(here, "upload-analysis.worker.ts")).href;
  return new Worker(`import("tsx/esm/api").then((t) => { t.register(); return import(${JSON.stringify(source)}); });`, { eval: true });
}

function getWorker(): Worker {
  if (worker) return worker;
  const w = startWorker();
  w.unref(); // never keeps a process alive
  w.on("message", (m: { id: number; ok: boolean; out?: AnalysisOutput; name?: string; message?: string; issues?: { message: string; path?: string[] }[] }) => {
    const p = pending.get(m.id);
    if (!p) return;
    pending.delete(m.id);
    if (m.ok) p.resolve(m.out!);
    else p.reject(new AnalysisFailed(m.message ?? "The file could not be analysed.", m.issues, m.name));
  });
  const fail = (err: unknown) => {
    worker = null;
    for (const [id, p] of pending) {
      pending.delete(id);
      p.reject(err instanceof Error ? err : new Error(String(err)));
    }
  };
  w.on("error", fail);
  w.on("exit", (code) => fail(new Error(`analysis worker stopped (${code})`)));
  worker = w;
  return w;
}

/** Runs `job` in the worker. The bytes are copied once into a buffer of their own, which is moved, not cloned. */
function inWorker(job: AnalysisJob): Promise<AnalysisOutput> {
  return new Promise((resolve, reject) => {
    const id = ++seq;
    pending.set(id, { resolve, reject });
    const bytes = new Uint8Array(job.bytes);
    getWorker().postMessage({ id, job: { ...job, bytes } }, [bytes.buffer]);
  });
}

/**
 * The import plan (and, when asked, the API's report) of an upload's bytes: in the worker for files
 * over OFF_THREAD_BYTES, else here. Failures are AnalysisFailed either way.
 */
export async function analyseForImport(job: Omit<Extract<AnalysisJob, { kind: "import" }>, "kind">): Promise<ImportAnalysis> {
  const full = { kind: "import" as const, ...job };
  if (job.bytes.length > OFF_THREAD_BYTES) return (await inWorker(full)) as ImportAnalysis;
  try {
    return runJob(full) as ImportAnalysis;
  } catch (e) {
    const err = e as Error & { issues?: { message: string; path?: { key: unknown }[] }[] };
    throw new AnalysisFailed(err?.message ?? String(e), err?.issues?.map((i) => ({ message: i.message, path: (i.path ?? []).map((p) => String(p.key)) })), err?.name);
  }
}

/**
 * Summary of an upload's analysis. `upload.sha256` identifies the bytes; `bytes()` fetches them
 * only when the summary is not cached (the blob is never read for a repeat view). Rejects with
 * AnalysisFailed on a mapping that cannot work.
 */
export function summariseUpload(upload: { id: number; sha256: string }, bytes: () => Promise<Uint8Array>, mappingJson: string | null, mapping?: unknown): Promise<UploadSummary> {
  const k = `${upload.id}|${upload.sha256}|${mappingJson ?? ""}|${mapping === undefined ? "" : JSON.stringify(mapping)}`;
  const hit = cache.get(k);
  if (hit) {
    cache.delete(k);
    cache.set(k, hit); // most recently used last
    return hit;
  }
  const p = bytes().then(async (b) => ((await inWorker({ kind: "summary", bytes: b, mappingJson, mapping })) as { summary: UploadSummary }).summary);
  p.catch(() => cache.delete(k));
  cache.set(k, p);
  while (cache.size > CACHE_ENTRIES) cache.delete(cache.keys().next().value!);
  return p;
}

export const analysisCacheSize = () => cache.size;

/** Ends the worker (scripts and tests that want their process to exit at once). */
export async function stopAnalysisWorker(): Promise<void> {
  const w = worker;
  worker = null;
  if (w) await w.terminate();
}
