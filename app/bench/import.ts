/**
 * Import benchmark: 100 000 curve points (fixtures/csv/make-big.ts, invented "Nordquay" data,
 * long SI layout, 10 points per curve → 10 000 curve sets of 2 500 models) through
 *   (a) the full service path importUpload (parse + validate in the analysis worker, then one
 *       transaction: revision, models, curve sets and points by LOAD DATA LOCAL INFILE, commit),
 *   (b) the pure point insert alone (insertPoints on one connection, in a transaction, commit),
 *       into curve_points (with its FK) and into a scratch copy without FK,
 *   (c) MariaDB's own LOAD DATA LOCAL INFILE of the same 100 000 rows into the scratch copy
 *       (CREATE TABLE … LIKE curve_points: same columns and indexes, no foreign key).
 * Also times the parse alone (analyseCsv) so the service path can be split into its parts.
 *
 *   DATABASE_URL=… npx tsx app/bench/import.ts [points] [--runs N]
 *
 * Cleans up after itself (scratch table, temp file, its library, workspace and user) and closes
 * the pool. No assertion: it prints a table; the goal is service import ≥ 0.6× LOAD DATA rows/s.
 */
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { performance } from "node:perf_hooks";
import { fileURLToPath } from "node:url";
import { eq } from "drizzle-orm";
import { closeDb, db, getPool } from "@db/client.server";
import { libraries, users, workspaces } from "@db/schema";
import { makeBigCsv } from "../../fixtures/csv/make-big";
import { analyseCsv } from "~/lib/import";
import { analyseStored, createLibrary, getUpload, importUpload, insertPoints, storeUpload, type Viewer } from "~/lib/libraries";
import { workspacesOf } from "~/lib/auth/guards.server";
import { stopAnalysisWorker } from "~/lib/libraries/upload-analysis.server";
import { makeMember } from "~/test/harness";

export interface BenchRow {
  label: string;
  rows: number;
  seconds: number;
}

const SCRATCH = "bench_curve_points_scratch";

async function time<T>(fn: () => Promise<T> | T): Promise<{ out: T; seconds: number }> {
  const t0 = performance.now();
  const out = await fn();
  return { out, seconds: (performance.now() - t0) / 1000 };
}

export async function runImportBench(points = 100_000, runs = 1): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const member = await makeMember("distributor");
  const ws = (await workspacesOf(member.userId)).find((w) => w.id === member.workspaceId)!;
  const viewer: Viewer = { userId: member.userId, workspace: { id: ws.id, name: ws.name, slug: ws.slug, plan: ws.plan }, role: member.role };
  const tmp = mkdtempSync(path.join(os.tmpdir(), "dutymark-bench-"));
  const pool = getPool();
  try {
    const csv = makeBigCsv({ points });
    const file = new File([csv], "big.csv", { type: "text/csv" });

    for (let run = 1; run <= runs; run++) {
      const tag = runs > 1 ? ` #${run}` : "";
      // parse alone
      const parse = await time(() => analyseCsv(csv));
      rows.push({ label: `parse+validate only (analyseCsv, first call)${tag}`, rows: parse.out.result.stats.pointsAccepted, seconds: parse.seconds });
      const warm = await time(() => analyseCsv(csv));
      rows.push({ label: `parse+validate only (analyseCsv, again)${tag}`, rows: warm.out.result.stats.pointsAccepted, seconds: warm.seconds });
      // CPU time of this thread's process for a warm parse+validate (the machine is shared: wall time includes waiting)
      const c0 = process.cpuUsage();
      const cpuParse = analyseCsv(csv);
      const c1 = process.cpuUsage(c0);
      rows.push({ label: `parse+validate only, CPU time (analyseCsv)${tag}`, rows: cpuParse.result.stats.pointsAccepted, seconds: (c1.user + c1.system) / 1e6 });
      const full = await time(() => analyseCsv(csv, undefined, { fast: false }));
      rows.push({ label: `parse+validate, full path (no fast path)${tag}`, rows: full.out.result.stats.pointsAccepted, seconds: full.seconds });

      // (a) full service path
      const libId = await createLibrary(viewer, { name: `Bench import ${Date.now()}`, description: "benchmark, deleted afterwards" });
      const stored = await time(() => storeUpload(viewer, libId, file));
      const { text, lib } = await getUpload(viewer, libId, stored.out);
      const mapping = analyseStored(text, lib).mapping;
      const prof = profileQueries(pool);
      const imp = await time(() => importUpload(viewer, libId, stored.out, mapping, "bench"));
      prof.stop();
      if (imp.out.points !== points) throw new Error(`imported ${imp.out.points} points, expected ${points}`);
      rows.push({ label: `(a) service importUpload${tag}`, rows: imp.out.points, seconds: imp.seconds });
      for (const [what, p] of prof.byKind)
        rows.push({ label: `    in (a): ${p.count} × ${what}${tag}`, rows: what === "INSERT curve_points" ? imp.out.points : 0, seconds: p.seconds });

      // point rows as importUpload builds them, on the curve sets just imported (seq shifted, so no clash)
      const sets: { id: number }[] = await pool.query("SELECT id FROM curve_sets WHERE revision_id = ? ORDER BY id", [imp.out.revisionId]);
      const flat: (number | null)[][] = [];
      // importUpload inserts curve sets model by model; make-big writes each model's curves together, so file order = id order
      parse.out.result.curveSets.forEach((c, i) => {
        c.points.forEach((p, k) => flat.push([sets[i].id, 1000 + k, p.flow, p.head, p.efficiency ?? null, p.power ?? null, p.npshr ?? null]));
      });
      if (sets.length !== parse.out.result.curveSets.length) throw new Error("curve set count differs from the parse");

      // (b) insertPoints alone into curve_points (FK checked), one transaction, committed
      {
        const conn = await pool.getConnection();
        try {
          const t = await time(async () => {
            await conn.beginTransaction();
            await insertPoints(conn, flat);
            await conn.commit();
          });
          rows.push({ label: `(b) insertPoints → curve_points${tag}`, rows: flat.length, seconds: t.seconds });
          await conn.query("DELETE FROM curve_points WHERE curve_set_id IN (SELECT id FROM curve_sets WHERE revision_id = ?) AND seq >= 1000", [imp.out.revisionId]);
        } finally {
          await conn.release();
        }
      }

      // scratch copy without FK; (b') the same multi-row INSERTs into it; (c) LOAD DATA LOCAL INFILE
      {
        const conn = await pool.getConnection();
        try {
          await conn.query(`DROP TABLE IF EXISTS ${SCRATCH}`);
          await conn.query(`CREATE TABLE ${SCRATCH} LIKE curve_points`); // MariaDB copies columns and indexes, not foreign keys
          const sql = (s: string) => s.replaceAll("curve_points", SCRATCH);
          const b2 = await time(async () => {
            await conn.beginTransaction();
            const BATCH = 5000; // same as libraries.server.ts POINT_BATCH
            for (let j = 0; j < flat.length; j += BATCH) {
              const chunk = flat.slice(j, j + BATCH);
              await conn.query(sql(`INSERT INTO curve_points (curve_set_id, seq, flow, head, efficiency, power, npshr) VALUES ${chunk.map(() => "(?,?,?,?,?,?,?)").join(",")}`), chunk.flat());
            }
            await conn.commit();
          });
          rows.push({ label: `(b') same INSERTs → scratch (no FK)${tag}`, rows: flat.length, seconds: b2.seconds });
          await conn.query(`TRUNCATE TABLE ${SCRATCH}`);
          const b3 = await time(async () => {
            await conn.beginTransaction();
            await conn.batch(`INSERT INTO ${SCRATCH} (curve_set_id, seq, flow, head, efficiency, power, npshr) VALUES (?,?,?,?,?,?,?)`, flat);
            await conn.commit();
          });
          rows.push({ label: `(b'') conn.batch → scratch (no FK)${tag}`, rows: flat.length, seconds: b3.seconds });
          await conn.query(`TRUNCATE TABLE ${SCRATCH}`);

          const infile = path.join(tmp, "points.csv");
          writeFileSync(infile, flat.map((r) => r.map((x) => (x === null ? "\\N" : String(x))).join(",")).join("\n") + "\n");
          const load = await time(async () => {
            await conn.beginTransaction();
            const r = await conn.query(
              `LOAD DATA LOCAL INFILE ? INTO TABLE ${SCRATCH} FIELDS TERMINATED BY ',' LINES TERMINATED BY '\\n' (curve_set_id, seq, flow, head, efficiency, power, npshr)`,
              [infile],
            );
            await conn.commit();
            return r as { affectedRows: number };
          });
          if (load.out.affectedRows !== flat.length) throw new Error(`LOAD DATA loaded ${load.out.affectedRows} rows, expected ${flat.length}`);
          rows.push({ label: `(c) LOAD DATA LOCAL INFILE → scratch${tag}`, rows: load.out.affectedRows, seconds: load.seconds });
        } finally {
          await conn.query(`DROP TABLE IF EXISTS ${SCRATCH}`).catch(() => {});
          await conn.release();
        }
      }
      await db().delete(libraries).where(eq(libraries.id, libId)); // cascades to uploads, revisions, models, sets, points
    }
  } finally {
    rmSync(tmp, { recursive: true, force: true });
    await db().delete(users).where(eq(users.id, member.userId)).catch((e) => console.error(`cleanup (user): ${e}`));
    await db().delete(workspaces).where(eq(workspaces.id, member.workspaceId)).catch((e) => console.error(`cleanup (workspace): ${e}`));
  }
  return rows;
}

/** Times every query on connections taken from the pool until stop(), grouped by statement kind. */
function profileQueries(pool: ReturnType<typeof getPool>) {
  const byKind = new Map<string, { count: number; seconds: number }>();
  const original = pool.getConnection.bind(pool);
  const kind = (sql: string) => {
    const m = /^\s*(insert\s+into|select|update|delete|begin|commit|start)\s*`?(\w*)/i.exec(sql);
    return m ? `${m[1].toUpperCase().replace(/\s+INTO/, "")} ${m[2]}`.trim() : sql.slice(0, 20);
  };
  pool.getConnection = async () => {
    const conn = await original();
    const q = conn.query.bind(conn);
    conn.query = (async (sql: unknown, values?: unknown) => {
      const text = typeof sql === "string" ? sql : (sql as { sql: string }).sql;
      const t0 = performance.now();
      try {
        return await q(sql as string, values);
      } finally {
        const k = kind(text);
        const e = byKind.get(k) ?? { count: 0, seconds: 0 };
        e.count++;
        e.seconds += (performance.now() - t0) / 1000;
        byKind.set(k, e);
      }
    }) as typeof conn.query;
    const release = conn.release.bind(conn);
    conn.release = async () => {
      conn.query = q as typeof conn.query; // pooled connections are reused: unwrap
      conn.release = release;
      return release();
    };
    return conn;
  };
  return { byKind, stop: () => void (pool.getConnection = original) };
}

export function formatTable(rows: BenchRow[]): string {
  // ratio against the LOAD DATA row of the same run (rows of a run share the " #n" suffix)
  const runOf = (label: string) => /#\d+$/.exec(label)?.[0] ?? "";
  const loadRate = new Map(rows.filter((r) => r.label.startsWith("(c)")).map((r) => [runOf(r.label), r.rows / r.seconds]));
  const out = [["", "rows", "seconds", "rows/s", "vs LOAD DATA"]];
  for (const r of rows) {
    const rate = r.rows / r.seconds;
    const base = loadRate.get(runOf(r.label)) ?? NaN;
    if (r.rows === 0) out.push([r.label, "", r.seconds.toFixed(3), "", ""]);
    else out.push([r.label, String(r.rows), r.seconds.toFixed(3), Math.round(rate).toLocaleString("en-GB"), `${(rate / base).toFixed(2)}×`]);
  }
  const w = out[0].map((_, c) => Math.max(...out.map((r) => r[c].length)));
  return out.map((r) => r.map((x, c) => (c === 0 ? x.padEnd(w[c]) : x.padStart(w[c]))).join("  ")).join("\n");
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  const args = process.argv.slice(2);
  const runsAt = args.indexOf("--runs");
  const runs = runsAt >= 0 ? Number(args[runsAt + 1]) : 3; // the machine is shared: three runs, the median ratio
  const points = Number(args.find((a, i) => /^\d+$/.test(a) && i !== runsAt + 1) ?? 100_000);
  runImportBench(points, runs)
    .then(async (rows) => {
      console.log(`import benchmark, ${points.toLocaleString("en-GB")} points (goal: (a) ≥ 0.60× LOAD DATA; parse+validate ≥ 1 000 000 rows/s)\n`);
      console.log(formatTable(rows));
      const rate = (prefix: string) => rows.filter((r) => r.label.startsWith(prefix)).map((r) => r.rows / r.seconds);
      const a = rate("(a)"), c = rate("(c)"), warm = rate("parse+validate only (analyseCsv, again)"), cpu = rate("parse+validate only, CPU time");
      const ratios = a.map((x, i) => x / c[i]).sort((x, y) => x - y);
      console.log(
        `\nratio (a) service import / (c) LOAD DATA LOCAL INFILE: ${a.map((x, i) => `${(x / c[i]).toFixed(2)}×`).join(", ")} (goal ≥ 0.60×)` +
          ` · median ${ratios[ratios.length >> 1].toFixed(2)}×` +
          ` · parse+validate (warm): ${warm.map((x) => `${Math.round(x).toLocaleString("en-GB")} rows/s`).join(", ")} wall, ${cpu.map((x) => `${Math.round(x).toLocaleString("en-GB")} rows/s`).join(", ")} CPU (goal ≥ 1 000 000)`,
      );
      await stopAnalysisWorker();
      await closeDb();
    })
    .catch(async (err) => {
      console.error(err);
      await closeDb().catch(() => {});
      process.exit(1);
    });
}
