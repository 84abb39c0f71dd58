// Analysis of stored uploads off the main thread: a worker thread decodes, parses and validates (a
// 200 000-row file takes seconds: it must not stall every other request). The mapping page's summary
// is kept per process by (file hash, saved mapping, mapping asked for), so looking at the page again
// costs nothing; imports and the API's report get an import plan (app/lib/libraries/analysis-jobs.ts)
// from the worker for files over OFF_THREAD_BYTES, and analyse small files in the calling thread.
// The bytes are copied once and moved (transferred) to the worker; the plan's typed arrays are moved
// back, and then the LOAD DATA lines of its curve sets and points (import-plan.ts Lines), which the
// worker makes while the import's transaction starts (plan.lines: never rejected, null when missing). Each app process keeps its own worker and small cache.
import { existsSync } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { Worker } from "node:worker_threads";
import { eq } from "drizzle-orm";
import { db } from "@db/client.server";
import { uploads } from "@db/schema";
import type { UploadSummary } from "./upload-analysis";
import { runJob, type AnalysisJob, type AnalysisOutput, type ImportAnalysis } from "./analysis-jobs";
import type { Lines } from "./import-plan";
import { promiseCache } from "../shared/promise-cache";

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

/** Summaries kept per process: the 16 most recently viewed (a failed analysis is not kept). */
const cache = promiseCache<string, UploadSummary>({ max: 16 });

let worker: Worker | null = null;
let seq = 0;
const pending = new Map<number, { resolve: (s: AnalysisOutput) => void; reject: (e: Error) => void }>();
/** Import plans whose LOAD DATA lines the worker is still making (one message per part after the plan's; null when it cannot). */
type Part = "sets" | "points";
const pendingLines = new Map<number, Record<Part, (lines: Lines | null) => void>>();

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
  type Message = { id: number; ok: boolean; out?: AnalysisOutput; name?: string; message?: string; issues?: { message: string; path?: string[] }[]; part?: Part; lines?: Lines | null };
  w.on("message", (m: Message) => {
    if (m.part) {
      pendingLines.get(m.id)?.[m.part](m.lines ?? null);
      if (m.part === "points") pendingLines.delete(m.id);
      return;
    }
    const p = pending.get(m.id);
    if (!p) {
      // a failure after the plan was sent: its lines will not come
      pendingLines.get(m.id)?.sets(null);
      pendingLines.get(m.id)?.points(null);
      pendingLines.delete(m.id);
      return;
    }
    pending.delete(m.id);
    const plan = m.ok && m.out && "plan" in m.out ? m.out.plan : null;
    if (plan) {
      // never rejected: null, and the writer makes the same lines itself (import-write.server.ts linesHere)
      const waiting = {} as Record<Part, (lines: Lines | null) => void>;
      plan.lines = { sets: new Promise((r) => (waiting.sets = r)), points: new Promise((r) => (waiting.points = r)) };
      pendingLines.set(m.id, waiting);
    }
    if (m.ok) p.resolve(m.out!);
    else p.reject(new AnalysisFailed(m.message ?? "The file could not be analysed.", m.issues, m.name));
  });
  const fail = (err: unknown) => {
    worker = null;
    for (const [id, p] of pending) {
      pending.delete(id);
      p.reject(err instanceof Error ? err : new Error(String(err)));
    }
    for (const [id, waiting] of pendingLines) {
      pendingLines.delete(id);
      waiting.sets(null);
      waiting.points(null);
    }
  };
  w.on("error", fail);
  w.on("exit", (code) => fail(new Error(`analysis worker stopped (${code})`)));
  worker = w;
  return w;
}

type JobWithoutBytes = { [K in AnalysisJob["kind"]]: Omit<Extract<AnalysisJob, { kind: K }>, "bytes"> }[AnalysisJob["kind"]];

/**
 * Runs `job` in the worker on `source`: bytes (copied once into a buffer of their own, which is
 * moved, not cloned), or a stored upload's id, whose bytes the worker reads from the database itself
 * (so an 11 MB blob never passes through this thread). The caller has checked access to the upload.
 */
function inWorker(job: JobWithoutBytes, source: Uint8Array | { uploadId: number }): Promise<AnalysisOutput> {
  return new Promise((resolve, reject) => {
    const id = ++seq;
    pending.set(id, { resolve, reject });
    if (source instanceof Uint8Array) {
      const bytes = new Uint8Array(source);
      getWorker().postMessage({ id, job: { ...job, bytes } }, [bytes.buffer]);
    } else getWorker().postMessage({ id, job, uploadId: source.uploadId });
  });
}

/**
 * The import plan (and, when asked, the API's report) of a stored upload: in the worker (which reads
 * the bytes itself) for files over OFF_THREAD_BYTES, else here. Failures are AnalysisFailed either way.
 * The caller has checked that the viewer may use the upload.
 */
export async function analyseForImport(
  upload: { id: number; sizeBytes: number },
  job: Omit<Extract<AnalysisJob, { kind: "import" }>, "kind" | "bytes">,
): Promise<ImportAnalysis> {
  if (upload.sizeBytes > OFF_THREAD_BYTES) return (await inWorker({ kind: "import", ...job }, { uploadId: upload.id })) as ImportAnalysis;
  const [row] = await db().select({ content: uploads.content }).from(uploads).where(eq(uploads.id, upload.id));
  try {
    return runJob({ kind: "import", ...job, bytes: row?.content ?? new Uint8Array() }) as ImportAnalysis;
  } catch (e) {
    const err = e as Error & { issues?: { message: string; path?: { key: unknown }[] }[] };
    throw new AnalysisFailed(err?.message ?? String(e), err?.issues?.map((i) => ({ message: i.message, path: (i.path ?? []).map((p) => String(p.key)) })), err?.name);
  }
}

/**
 * Summary of an upload's analysis. `upload.sha256` identifies the bytes; they are fetched only when
 * the summary is not cached (the blob is never read for a repeat view): by `bytes()`, or with
 * "stored" by the worker from the database (never through this thread). Rejects with
 * AnalysisFailed on a mapping that cannot work.
 */
export function summariseUpload(upload: { id: number; sha256: string }, bytes: (() => Promise<Uint8Array>) | "stored", mappingJson: string | null, mapping?: unknown, minFlowPage?: number | null): Promise<UploadSummary> {
  const k = `${upload.id}|${upload.sha256}|${mappingJson ?? ""}|${mapping === undefined ? "" : JSON.stringify(mapping)}|${minFlowPage ?? 1}`;
  const job = { kind: "summary" as const, mappingJson, mapping, minFlowPage };
  return cache.get(k, () => (bytes === "stored" ? inWorker(job, { uploadId: upload.id }) : bytes().then((b) => inWorker(job, b))).then((out) => (out as { summary: UploadSummary }).summary));
}

export const analysisCacheSize = () => cache.size;

/** Ends the worker (scripts and tests that want their process to exit at once). */
export async function stopAnalysisWorker(): Promise<void> {
  const w = worker;
  worker = null;
  if (w) await w.terminate();
}
