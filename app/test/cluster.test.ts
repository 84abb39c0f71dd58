// What a MariaDB Galera cluster needs of Dutymark, checked on a real three-node cluster.
// Runs under `npm run test:cluster` (db/cli.mjs starts the cluster and sets CLUSTER_NODE_URLS to
// one URL per node); plain `npm test` leaves the file out (vite.config.ts), and here fewer than two nodes is a failure.
import { spawn } from "node:child_process";
import { mkdtempSync, readdirSync, readFileSync, statSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { like } from "drizzle-orm";
import { closeDb, db, getPool } from "@db/client.server";
import { outbox } from "@db/schema";
import { startMailbox, type RunningMailbox } from "../../fixtures/smtp/server";

const nodeUrls: string[] = process.env.CLUSTER_NODE_URLS ? JSON.parse(process.env.CLUSTER_NODE_URLS) : [];
const ROOT = path.resolve(__dirname, "../..");

function runChild(env: Record<string, string>): Promise<Record<string, unknown>> {
  return new Promise((resolve, reject) => {
    const child = spawn(process.execPath, ["--import", "tsx", "app/test/children/contend-child.ts"], {
      cwd: ROOT,
      env: { ...process.env, MAIL_FLUSH_INTERVAL_MS: "0", ...env },
      stdio: ["ignore", "pipe", "pipe"],
    });
    let out = "";
    let err = "";
    child.stdout!.on("data", (b: Buffer) => (out += b.toString()));
    child.stderr!.on("data", (b: Buffer) => (err += b.toString()));
    child.on("exit", () => {
      const line = out.trim().split("\n").pop() ?? "";
      try {
        resolve(JSON.parse(line));
      } catch {
        reject(new Error(`child said ${JSON.stringify(out)} ${err.slice(-500)}`));
      }
    });
  });
}

function sourceFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = path.join(dir, name);
    if (statSync(p).isDirectory()) return name === "node_modules" || name === "migrations" ? [] : sourceFiles(p);
    return /\.(ts|tsx|mjs)$/.test(name) ? [p] : [];
  });
}

describe("on a Galera cluster (npm run test:cluster)", () => {
  afterAll(() => closeDb());

  test("the cluster's nodes are given (CLUSTER_NODE_URLS: two or more)", () => {
    expect(nodeUrls.length).toBeGreaterThanOrEqual(2);
  });

  test("every table has a primary key and uses InnoDB (Galera replicates only InnoDB rows, keyed)", async () => {
    const tables = (await getPool().query(`
      SELECT t.TABLE_NAME AS name, t.ENGINE AS engine,
             (SELECT COUNT(*) FROM information_schema.TABLE_CONSTRAINTS c
               WHERE c.TABLE_SCHEMA = t.TABLE_SCHEMA AND c.TABLE_NAME = t.TABLE_NAME AND c.CONSTRAINT_TYPE = 'PRIMARY KEY') AS pk
      FROM information_schema.TABLES t
      WHERE t.TABLE_SCHEMA = DATABASE() AND t.TABLE_TYPE = 'BASE TABLE'`)) as { name: string; engine: string; pk: number }[];
    expect(tables.length).toBeGreaterThan(10);
    expect(tables.filter((t) => Number(t.pk) !== 1).map((t) => t.name)).toEqual([]);
    expect(tables.filter((t) => t.engine !== "InnoDB").map((t) => t.name)).toEqual([]);
  });

  test("no statement Galera refuses or does not replicate (LOCK TABLES, GET_LOCK, MyISAM/Aria tables)", () => {
    const offenders = [...sourceFiles(path.join(ROOT, "app")), ...sourceFiles(path.join(ROOT, "db"))]
      .filter((f) => !f.endsWith("cluster.test.ts"))
      .filter((f) => /\bLOCK\s+TABLES\b|\bGET_LOCK\s*\(|ENGINE\s*=\s*(MyISAM|Aria)/i.test(readFileSync(f, "utf8")));
    expect(offenders).toEqual([]);
  });

  test("rate-limit upsert from two nodes at once: every hit counted once, each caller sees its own count", async () => {
    const bucket = `galera:${Date.now().toString(36)}`;
    const startAt = String(Date.now() + 2500);
    const [a, b] = await Promise.all(
      nodeUrls.slice(0, 2).map((url) => runChild({ DATABASE_URL: url, MODE: "ratelimit", BUCKET: bucket, HITS: "40", START_AT: startAt })),
    );
    expect(a.error ?? b.error).toBeUndefined();
    const seen = [...(a.hits as number[]), ...(b.hits as number[])].sort((x, y) => x - y);
    // 80 hits in all: the counts 1…80, each seen by exactly one caller.
    expect(seen).toEqual(Array.from({ length: 80 }, (_, i) => i + 1));
    const rows = (await getPool().query("SELECT SUM(hits) AS n FROM rate_limits WHERE bucket = ?", [bucket])) as { n: number }[];
    expect(Number(rows[0].n)).toBe(80);
  }, 120_000);

  describe("outbox claimed from two nodes at once", () => {
    let box: RunningMailbox;
    const tag = `gal${Date.now().toString(36)}`;
    beforeAll(async () => {
      box = await startMailbox({ smtpPort: 0, webPort: 0, dir: mkdtempSync(path.join(os.tmpdir(), "dm-galera-mail-")) });
    });
    afterAll(async () => {
      await db().delete(outbox).where(like(outbox.toAddress, `%.${tag}@example.test`));
      await box?.close();
    });

    test("every message is delivered exactly once", async () => {
      const n = 30;
      await db()
        .insert(outbox)
        .values(Array.from({ length: n }, (_, i) => ({ toAddress: `m${i}.${tag}@example.test`, subject: `cluster ${i}`, textBody: "t", htmlBody: "<p>t</p>" })));
      const startAt = String(Date.now() + 2500);
      const outs = await Promise.all(
        nodeUrls.slice(0, 2).map((url) => runChild({ DATABASE_URL: url, MODE: "outbox", SMTP_URL: `smtp://127.0.0.1:${box.smtpPort}`, START_AT: startAt })),
      );
      for (const o of outs) expect(o.error).toBeUndefined();
      const mine = box.store.list({ limit: 1000 }).filter((m) => m.to.some((t) => t.endsWith(`.${tag}@example.test`)));
      expect(mine.length).toBe(n);
      expect(new Set(mine.map((m) => m.to.join(","))).size).toBe(n);
      const rows = await db().select().from(outbox).where(like(outbox.toAddress, `%.${tag}@example.test`));
      expect(rows.filter((r) => r.sentAt === null)).toEqual([]);
      expect(rows.every((r) => r.attempts === 1)).toBe(true);
    }, 120_000);
  });
});
