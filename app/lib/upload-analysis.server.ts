// The mapping page's analysis of a stored upload, off the main thread and computed once: a worker
// thread does the parse/validate (a 200 000-row file takes seconds: it must not stall every other
// request), and the summary is kept per process by (file hash, saved mapping, mapping asked for),
// so looking at the page again costs nothing. Each app process keeps its own small cache.
import { existsSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import type { UploadSummary } from "./upload-analysis";

export class AnalysisFailed extends Error {
  constructor(
    message: string,
    public readonly issues: { message: string }[] = [],
  ) {
    super(message);
    this.name = "AnalysisFailed";
  }
}

const CACHE_ENTRIES = 16;
const cache = new Map<string, Promise<UploadSummary>>();

let worker: Worker | null = null;
let seq = 0;
const pending = new Map<number, { resolve: (s: UploadSummary) => void; reject: (e: Error) => void }>();

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
  w.on("message", (m: { id: number; ok: boolean; summary?: UploadSummary; message?: string; issues?: { message: string }[] }) => {
    const p = pending.get(m.id);
    if (!p) return;
    pending.delete(m.id);
    if (m.ok) p.resolve(m.summary!);
    else p.reject(new AnalysisFailed(m.message ?? "The file could not be analysed.", m.issues));
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

function inWorker(bytes: Uint8Array, mappingJson: string | null, mapping?: unknown): Promise<UploadSummary> {
  return new Promise((resolve, reject) => {
    const id = ++seq;
    pending.set(id, { resolve, reject });
    getWorker().postMessage({ id, bytes, mappingJson, mapping });
  });
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
  const p = bytes().then((b) => inWorker(b, mappingJson, mapping));
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
