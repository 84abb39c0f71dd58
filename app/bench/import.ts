/**
 * Import benchmark: 100 000 curve points (fixtures/csv/make-big.ts, invented "Nordquay" data, long
 * SI layout, 10 points per curve → 10 000 curve sets of 2 500 models), on one connection pool:
 *   (a) the service import, as the mapping page's button runs it: importUpload (the analysis worker
 *       reads the upload, decodes, parses, validates and plans; then one transaction: revision,
 *       models, curve sets and points by LOAD DATA LOCAL INFILE streamed from the plan, commit; the
 *       `imports` row with its progress). The upload was stored and its mapping page analysed
 *       (worker started) before the clock starts, as in the app.
 *   (c) MariaDB's own LOAD DATA LOCAL INFILE of the same 100 000 point rows from a file, into the
 *       same table (curve_points: same indexes, rows of curve sets that exist, foreign-key checks
 *       off as the import's loads have them), in one transaction, committed. Only the points: the
 *       import also writes the models and curve sets and analyses the file.
 *   (c') the same LOAD DATA into a new empty copy of the table (CREATE TABLE … LIKE: same columns
 *       and indexes, no foreign key) — the baseline this bench used before; shown for comparison.
 * (a) and (c) run back to back, their order swapped every run (the machine is shared: load drifts);
 * no rows are deleted until the end (a purge running under the next measurement would slow it). The
 * ratio is (c) time / (a) time per run, i.e. (a)'s rows/s over (c)'s. The server's CPU time
 * (mariadbd's, from /proc, when the server is local) and this process's (all threads) are shown
 * beside the wall times: on a shared machine the wall time is mostly waiting for a core.
 * Also: parse + validate alone (analyseCsv, wall and CPU time), the worker's job in this thread, and
 * once at the end the older ways to write points (multi-row INSERTs, conn.batch).
 *
 *   DATABASE_URL=… npx tsx app/bench/import.ts [points] [--runs N]
 *
 * Cleans up after itself and closes the pool. No assertion: it prints a table; the goals are
 * (a) ≥ 0.6× (c) and parse + validate ≥ 1 000 000 rows/s.
 */
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { performance } from "node:perf_hooks";
import { fileURLToPath } from "node:url";
import { eq } from "drizzle-orm";
import type { PoolConnection } from "mariadb";
import { closeDb, db, getPool } from "@db/client.server";
import { libraries, users, workspaces } from "@db/schema";
import { makeBigCsv } from "../../fixtures/csv/make-big";
import { analyseCsv } from "~/lib/import";
import { createLibrary, getUpload, importUpload, insertPoints, storeUpload, type Viewer } from "~/lib/libraries";
import { runJob } from "~/lib/libraries/analysis-jobs";
import { workspacesOf } from "~/lib/auth/guards.server";
import { stopAnalysisWorker, summariseUpload } from "~/lib/libraries/upload-analysis.server";
import { makeMember } from "~/test/harness";
import { cpuMs, median } from "./measure";

export interface BenchRow {
  label: string;
  rows: number;
  seconds: number;
  /** mariadbd's CPU time during the step (s), when measured. */
  serverCpu?: number;
  /** This process's CPU time during the step (s): every thread, the analysis worker's included. */
  clientCpu?: number;
}

const SCRATCH = "bench_curve_points_scratch";
const COLUMNS = "(curve_set_id, seq, flow, head, efficiency, power, npshr)";

/** CPU time (s) the local MariaDB server has used so far, or null (remote server, no /proc). */
async function serverCpuReader(): Promise<() => number | null> {
  try {
    const [{ f }] = (await getPool().query("SELECT @@pid_file AS f")) as { f: string }[];
    const pid = readFileSync(f, "utf8").trim();
    const read = () => cpuMs(pid) / 1000;
    read();
    return () => read();
  } catch {
    return () => null;
  }
}

async function time<T>(fn: () => Promise<T> | T, serverCpu?: () => number | null): Promise<{ out: T; seconds: number; serverCpu?: number; clientCpu: number }> {
  const s0 = serverCpu?.() ?? null;
  const c0 = process.cpuUsage();
  const t0 = performance.now();
  const out = await fn();
  const seconds = (performance.now() - t0) / 1000;
  const c = process.cpuUsage(c0);
  const s1 = serverCpu?.() ?? null;
  return { out, seconds, serverCpu: s0 !== null && s1 !== null ? s1 - s0 : undefined, clientCpu: (c.user + c.system) / 1e6 };
}

const cpuSeconds = (fn: () => unknown) => {
  const c0 = process.cpuUsage();
  fn();
  const c = process.cpuUsage(c0);
  return (c.user + c.system) / 1e6;
};

/** LOAD DATA LOCAL INFILE of `file` into `table` on `conn`, foreign-key checks off, in one transaction, committed. */
async function loadFile(conn: PoolConnection, table: string, file: string, expected: number) {
  await conn.query("SET SESSION foreign_key_checks = 0");
  try {
    await conn.beginTransaction();
    const r = (await conn.query(`LOAD DATA LOCAL INFILE ? INTO TABLE ${table} FIELDS TERMINATED BY '\\t' LINES TERMINATED BY '\\n' ${COLUMNS}`, [file])) as {
      affectedRows: number;
    };
    await conn.commit();
    if (r.affectedRows !== expected) throw new Error(`LOAD DATA loaded ${r.affectedRows} rows, expected ${expected}`);
  } finally {
    await conn.query("SET SESSION foreign_key_checks = 1");
  }
}

export async function runImportBench(points = 100_000, runs = 1): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const member = await makeMember("distributor");
  const ws = (await workspacesOf(member.userId)).find((w) => w.id === member.workspaceId)!;
  const viewer: Viewer = { userId: member.userId, workspace: { id: ws.id, name: ws.name, slug: ws.slug, plan: ws.plan }, role: member.role };
  const tmp = mkdtempSync(path.join(os.tmpdir(), "dutymark-bench-"));
  const pool = getPool();
  const serverCpu = await serverCpuReader();
  const libs: number[] = [];
  const conn = await pool.getConnection();
  try {
    const csv = makeBigCsv({ points });
    const bytes = new TextEncoder().encode(csv);
    const file = new File([csv], "big.csv", { type: "text/csv" });

    /** A library with the file uploaded and its mapping page analysed (in the worker, as the page does); returns what the page posts. */
    const prepared = async (name: string) => {
      const libId = await createLibrary(viewer, { name: `${name} ${Date.now()}`, description: "benchmark, deleted afterwards" });
      libs.push(libId);
      const uploadId = await storeUpload(viewer, libId, file);
      const { lib, upload } = await getUpload(viewer, libId, uploadId);
      const summary = await summariseUpload(upload, "stored", lib.mappingJson);
      return { libId, uploadId, mapping: summary.mapping };
    };

    // One import first (not timed): its curve sets are the ones (c) loads points for, with seq shifted.
    const base = await prepared("Bench import (sets for LOAD DATA)");
    const baseImport = await importUpload(viewer, base.libId, base.uploadId, base.mapping, "bench");
    const sets: { id: number }[] = await pool.query("SELECT id FROM curve_sets WHERE revision_id = ? ORDER BY id", [baseImport.revisionId]);
    const parsed = analyseCsv(csv).result.curveSets;
    if (sets.length !== parsed.length) throw new Error("curve set count differs from the parse");
    const flat = (seq0: number) => {
      const out: (number | null)[][] = [];
      // importUpload inserts curve sets in file order (ascending id)
      parsed.forEach((c, i) => c.points.forEach((p, k) => out.push([sets[i].id, seq0 + k, p.flow, p.head, p.efficiency ?? null, p.power ?? null, p.npshr ?? null])));
      return out;
    };
    const fileFor = (seq0: number) => {
      const f = path.join(tmp, `points-${seq0}.tsv`);
      writeFileSync(f, flat(seq0).map((r) => r.map((x) => (x === null ? "\\N" : String(x))).join("\t")).join("\n") + "\n");
      return f;
    };

    for (let run = 1; run <= runs; run++) {
      const tag = runs > 1 ? ` #${run}` : "";
      // parse + validate alone (the fast path), wall and CPU time
      const parse = await time(() => analyseCsv(csv));
      rows.push({ label: `parse+validate only (analyseCsv, first call)${tag}`, rows: parse.out.result.stats.pointsAccepted, seconds: parse.seconds });
      const warm = await time(() => analyseCsv(csv));
      rows.push({ label: `parse+validate only (analyseCsv, again)${tag}`, rows: warm.out.result.stats.pointsAccepted, seconds: warm.seconds });
      rows.push({ label: `parse+validate only, CPU time (analyseCsv)${tag}`, rows: points, seconds: cpuSeconds(() => analyseCsv(csv)) });
      const mapping = warm.out.mapping;
      rows.push({ label: `worker's job here: decode+parse+validate+plan, CPU${tag}`, rows: points, seconds: cpuSeconds(() => runJob({ kind: "import", bytes, mappingJson: null, mapping })) });
      if (run === 1) {
        const full = await time(() => analyseCsv(csv, undefined, { fast: false }));
        rows.push({ label: `parse+validate, full path (no fast path)${tag}`, rows: full.out.result.stats.pointsAccepted, seconds: full.seconds });
      }

      const next = await prepared("Bench import");
      const infile = fileFor(1000 * run);
      const a = async () => {
        const imp = await time(() => importUpload(viewer, next.libId, next.uploadId, next.mapping, "bench"), serverCpu);
        if (imp.out.points !== points) throw new Error(`imported ${imp.out.points} points, expected ${points}`);
        rows.push({ label: `(a) service importUpload${tag}`, rows: imp.out.points, seconds: imp.seconds, serverCpu: imp.serverCpu, clientCpu: imp.clientCpu });
      };
      const c = async () => {
        const load = await time(() => loadFile(conn, "curve_points", infile, points), serverCpu);
        rows.push({ label: `(c) LOAD DATA LOCAL INFILE → curve_points${tag}`, rows: points, seconds: load.seconds, serverCpu: load.serverCpu, clientCpu: load.clientCpu });
      };
      if (run % 2) {
        await c();
        await a();
      } else {
        await a();
        await c();
      }
      await conn.query(`CREATE TABLE ${SCRATCH} LIKE curve_points`); // MariaDB copies columns and indexes, not foreign keys
      const scratch = await time(() => loadFile(conn, SCRATCH, infile, points), serverCpu);
      rows.push({ label: `(c') LOAD DATA → new empty copy (no FK)${tag}`, rows: points, seconds: scratch.seconds, serverCpu: scratch.serverCpu, clientCpu: scratch.clientCpu });
      await conn.query(`DROP TABLE ${SCRATCH}`);
      rmSync(infile);
    }

    // Older ways to write points, once: multi-row INSERTs (insertPoints, 5 000 rows each) and conn.batch.
    {
      const rowsB = flat(500_000);
      const b = await time(async () => {
        await conn.beginTransaction();
        await insertPoints(conn, rowsB);
        await conn.commit();
      }, serverCpu);
      rows.push({ label: "(b) insertPoints (multi-row INSERTs) → curve_points", rows: rowsB.length, seconds: b.seconds, serverCpu: b.serverCpu, clientCpu: b.clientCpu });
      const rowsB2 = flat(600_000);
      const b2 = await time(async () => {
        await conn.beginTransaction();
        await conn.batch(`INSERT INTO curve_points ${COLUMNS} VALUES (?,?,?,?,?,?,?)`, rowsB2);
        await conn.commit();
      }, serverCpu);
      rows.push({ label: "(b') conn.batch → curve_points", rows: rowsB2.length, seconds: b2.seconds, serverCpu: b2.serverCpu, clientCpu: b2.clientCpu });
    }
  } finally {
    await conn.query(`DROP TABLE IF EXISTS ${SCRATCH}`).catch(() => {});
    await conn.release();
    rmSync(tmp, { recursive: true, force: true });
    for (const id of libs) await db().delete(libraries).where(eq(libraries.id, id)).catch((e) => console.error(`cleanup (library): ${e}`)); // cascades to uploads, revisions, models, sets, points
    await db().delete(users).where(eq(users.id, member.userId)).catch((e) => console.error(`cleanup (user): ${e}`));
    await db().delete(workspaces).where(eq(workspaces.id, member.workspaceId)).catch((e) => console.error(`cleanup (workspace): ${e}`));
  }
  return rows;
}

export function formatTable(rows: BenchRow[]): string {
  // ratio against the LOAD DATA → curve_points row of the same run (rows of a run share the " #n" suffix)
  const runOf = (label: string) => /#\d+$/.exec(label)?.[0] ?? "";
  const loadRate = new Map(rows.filter((r) => r.label.startsWith("(c)")).map((r) => [runOf(r.label), r.rows / r.seconds]));
  const middle = median([...loadRate.values()]);
  const out = [["", "rows", "ms", "server CPU ms", "client CPU ms", "rows/s", "vs (c)"]];
  for (const r of rows) {
    const rate = r.rows / r.seconds;
    const base = loadRate.get(runOf(r.label)) ?? middle;
    out.push([
      r.label,
      String(r.rows),
      (r.seconds * 1000).toFixed(0),
      r.serverCpu === undefined ? "" : (r.serverCpu * 1000).toFixed(0),
      r.clientCpu === undefined ? "" : (r.clientCpu * 1000).toFixed(0),
      Math.round(rate).toLocaleString("en-GB"),
      `${(rate / base).toFixed(2)}×`,
    ]);
  }
  const w = out[0].map((_, c) => Math.max(...out.map((r) => r[c].length)));
  return out.map((r) => r.map((x, c) => (c === 0 ? x.padEnd(w[c]) : x.padStart(w[c]))).join("  ")).join("\n");
}

/** The closing lines: per run import ms, LOAD DATA ms, ratio; the median; parse rates; the load average. */
export function summary(rows: BenchRow[], points: number, loadBefore: number[]): string {
  const pick = (prefix: string) => rows.filter((r) => r.label.startsWith(prefix));
  const a = pick("(a)"), c = pick("(c)"), c2 = pick("(c')");
  const ms = (r: BenchRow) => `${Math.round(r.seconds * 1000)} ms`;
  const ratios = a.map((r, i) => c[i].seconds / r.seconds);
  const rate = (r: BenchRow) => Math.round(r.rows / r.seconds).toLocaleString("en-GB");
  const cpuRatio = a.every((r, i) => r.serverCpu !== undefined && c[i].serverCpu !== undefined) ? a.map((r, i) => c[i].serverCpu! / r.serverCpu!) : [];
  const fmtLoad = (l: number[]) => l.map((x) => x.toFixed(1)).join(" ");
  const cpuMedianMs = (rs: BenchRow[], k: "serverCpu" | "clientCpu") => (rs.every((r) => r[k] !== undefined) ? Math.round(median(rs.map((r) => r[k]!)) * 1000) : "?");
  return [
    `import of ${points.toLocaleString("en-GB")} points (a) vs LOAD DATA LOCAL INFILE of the same rows into curve_points (c), per run:`,
    ...a.map((r, i) => `  run ${i + 1}: import ${ms(r)}, LOAD DATA ${ms(c[i])} (into an empty copy: ${ms(c2[i])}) → ratio ${ratios[i].toFixed(2)}× (goal ≥ 0.60×)`),
    `  median ratio ${median(ratios).toFixed(2)}×` +
      (cpuRatio.length ? ` · by the server's CPU time: median ${median(cpuRatio).toFixed(2)}× (LOAD DATA's server CPU / the import's)` : "") +
      ` · against the empty copy: median ${median(a.map((r, i) => c2[i].seconds / r.seconds)).toFixed(2)}×`,
    `CPU time, medians: the import ${cpuMedianMs(a, "serverCpu")} ms of the server's and ${cpuMedianMs(a, "clientCpu")} ms of this process's; ` +
      `LOAD DATA ${cpuMedianMs(c, "serverCpu")} ms and ${cpuMedianMs(c, "clientCpu")} ms`,
    `parse+validate (analyseCsv, warm): ${pick("parse+validate only (analyseCsv, again)").map(rate).join(", ")} rows/s wall; ` +
      `${pick("parse+validate only, CPU time").map(rate).join(", ")} rows/s of CPU time (goal ≥ 1 000 000); ` +
      `the worker's whole job (decode+parse+validate+plan): ${pick("worker's job").map(rate).join(", ")} rows/s of CPU time`,
    `load average (1, 5, 15 min): ${fmtLoad(loadBefore)} at the start, ${fmtLoad(os.loadavg())} at the end (${os.cpus().length} cores, shared with other work)`,
  ].join("\n");
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  const args = process.argv.slice(2);
  const runsAt = args.indexOf("--runs");
  const runs = runsAt >= 0 ? Number(args[runsAt + 1]) : 5; // the machine is shared: five runs, the median ratio
  const points = Number(args.find((a, i) => /^\d+$/.test(a) && i !== runsAt + 1) ?? 100_000);
  const loadBefore = os.loadavg();
  runImportBench(points, runs)
    .then(async (rows) => {
      console.log(`import benchmark, ${points.toLocaleString("en-GB")} points (goal: (a) ≥ 0.60× (c) LOAD DATA; parse+validate ≥ 1 000 000 rows/s)\n`);
      console.log(formatTable(rows));
      console.log(`\n${summary(rows, points, loadBefore)}`);
      await stopAnalysisWorker();
      await closeDb();
    })
    .catch(async (err) => {
      console.error(err);
      await stopAnalysisWorker().catch(() => {});
      await closeDb().catch(() => {});
      process.exit(1);
    });
}
