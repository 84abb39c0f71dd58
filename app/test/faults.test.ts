// Faults: the database goes away mid-import and mid-request. Nothing partial is written, the app
// answers 503 (page or problem+json) instead of 500, and it recovers by itself when the database is back.
// The app runs as its own process (the production build) behind a TCP relay to MariaDB that the test cuts.
import net from "node:net";
import { spawn, type ChildProcess } from "node:child_process";
import { mkdtempSync, writeFileSync, existsSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { curvePoints, curveSets, libraries, libraryRevisions, pumpModels } from "@db/schema";
import { createLibrary } from "~/lib/libraries";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { freePort, makeMember } from "./harness";
import { makeBigCsv } from "../../fixtures/csv/make-big";

const ROOT = path.resolve(__dirname, "../..");
const built = existsSync(path.join(ROOT, "build/server/index.js"));

/** A TCP relay to the real database that can be cut (every socket destroyed, listener closed) and restored. */
function relay(target: { host: string; port: number }) {
  const sockets = new Set<net.Socket>();
  let server: net.Server | null = null;
  let port = 0;
  const open = () =>
    new Promise<number>((resolve) => {
      server = net.createServer((client) => {
        const upstream = net.connect(target.port, target.host);
        sockets.add(client).add(upstream);
        client.pipe(upstream).pipe(client);
        const drop = () => {
          client.destroy();
          upstream.destroy();
          sockets.delete(client);
          sockets.delete(upstream);
        };
        client.on("error", drop).on("close", drop);
        upstream.on("error", drop).on("close", drop);
      });
      server.listen(port, "127.0.0.1", () => {
        port = (server!.address() as net.AddressInfo).port;
        resolve(port);
      });
    });
  const cut = () =>
    new Promise<void>((resolve) => {
      for (const s of sockets) s.destroy();
      sockets.clear();
      if (server) server.close(() => resolve());
      else resolve();
      server = null;
    });
  return { open, cut, get port() { return port; } };
}

const dbUrl = new URL(process.env.DATABASE_URL ?? "mariadb://x@127.0.0.1:3307/x");
const target = { host: dbUrl.hostname, port: Number(dbUrl.port || 3306) };
const viaRelay = (p: number) => {
  const u = new URL(dbUrl.toString());
  u.port = String(p);
  return u.toString();
};

async function waitFor(check: () => Promise<boolean>, ms: number) {
  const until = Date.now() + ms;
  while (Date.now() < until) {
    if (await check().catch(() => false)) return true;
    await new Promise((r) => setTimeout(r, 200));
  }
  return false;
}

function runChild(env: Record<string, string>, onLine: (line: string, child: ChildProcess) => void): Promise<{ code: number | null; out: string }> {
  return new Promise((resolve) => {
    const child = spawn(process.execPath, ["--import", "tsx", "app/test/children/import-child.ts"], { cwd: ROOT, env: { ...process.env, ...env }, stdio: ["ignore", "pipe", "pipe"] });
    let out = "";
    child.stdout!.on("data", (b: Buffer) => {
      out += b.toString();
      for (const line of b.toString().split("\n").filter(Boolean)) onLine(line, child);
    });
    child.stderr!.on("data", (b: Buffer) => (out += b.toString()));
    child.on("exit", (code) => resolve({ code, out }));
  });
}

async function libraryRows(libId: number) {
  const revs = await db().select().from(libraryRevisions).where(eq(libraryRevisions.libraryId, libId));
  const models = revs.length ? await db().select().from(pumpModels).where(eq(pumpModels.revisionId, revs[0].id)) : [];
  const sets = revs.length ? await db().select().from(curveSets).where(eq(curveSets.revisionId, revs[0].id)) : [];
  const pts = sets.length ? await db().select({ id: curvePoints.id }).from(curvePoints).where(eq(curvePoints.curveSetId, sets[0].id)) : [];
  const [lib] = await db().select().from(libraries).where(eq(libraries.id, libId));
  return { revisions: revs.length, models: models.length, sets: sets.length, points: pts.length, current: lib.currentRevisionId };
}

let csvPath = "";
beforeAll(() => {
  const dir = mkdtempSync(path.join(os.tmpdir(), "dm-faults-"));
  csvPath = path.join(dir, "big.csv");
  writeFileSync(csvPath, makeBigCsv({ points: 20_000 }));
});
afterAll(() => closeDb());

// Each case spawns an importer and waits for MariaDB to roll back 20 000 rows: generous time-outs
// (hang guards, not timings) so a busy machine does not fail them.
describe("an import interrupted before COMMIT leaves nothing behind", { timeout: 60_000 }, () => {
  test("the importing process is killed", async () => {
    const d = await makeMember("distributor");
    const libId = await createLibrary({ userId: d.userId, workspace: { id: d.workspaceId, name: "w", slug: "w", plan: "free" }, role: "distributor" }, { name: "killed", description: "" });
    const r = await runChild({ LIB_ID: String(libId), USER_ID: d.userId, WORKSPACE_ID: String(d.workspaceId), CSV_PATH: csvPath }, (line, child) => {
      if (line === "before-commit") child.kill("SIGKILL");
    });
    expect(r.out).toContain("before-commit");
    expect(r.out).not.toContain("committed");
    // MariaDB rolls back the open transaction of a vanished client.
    expect(await waitFor(async () => (await libraryRows(libId)).revisions === 0, 10_000)).toBe(true);
    expect(await libraryRows(libId)).toEqual({ revisions: 0, models: 0, sets: 0, points: 0, current: null });
  });

  test("the database connection is cut", async () => {
    const d = await makeMember("distributor");
    const libId = await createLibrary({ userId: d.userId, workspace: { id: d.workspaceId, name: "w", slug: "w", plan: "free" }, role: "distributor" }, { name: "cut", description: "" });
    const link = relay(target);
    const port = await link.open();
    const r = await runChild({ DATABASE_URL: viaRelay(port), LIB_ID: String(libId), USER_ID: d.userId, WORKSPACE_ID: String(d.workspaceId), CSV_PATH: csvPath }, (line) => {
      if (line === "before-commit") void link.cut();
    });
    expect(r.out).toContain("failed:");
    expect(await waitFor(async () => (await libraryRows(libId)).revisions === 0, 10_000)).toBe(true);
    expect((await libraryRows(libId)).points).toBe(0);
  });
});

describe.runIf(built)("the app while the database is away (production build behind a relay)", () => {
  let app: ChildProcess;
  let base = "";
  const link = relay(target);
  let token = "";
  let cookie = "";
  beforeAll(async () => {
    const port = await link.open();
    const e = await makeMember("engineer");
    token = (await createApiToken({ userId: e.userId, workspaceId: e.workspaceId, name: "faults", scope: "read" })).token;
    cookie = e.cookie;
    const appPort = await freePort();
    base = `http://127.0.0.1:${appPort}`;
    app = spawn(process.execPath, ["app/serve.mjs", "build/server/index.js"], {
      cwd: ROOT,
      env: { ...process.env, DATABASE_URL: viaRelay(port), PORT: String(appPort), HOST: "127.0.0.1", NODE_ENV: "production", ACCESS_LOG: "0", DB_ACQUIRE_TIMEOUT_MS: "1500", APP_URL: base, MAIL_FLUSH_INTERVAL_MS: "0" },
      stdio: "ignore",
    });
    expect(await waitFor(async () => (await fetch(`${base}/healthz`)).status === 200, 15_000)).toBe(true);
  }, 30_000);
  afterAll(async () => {
    app?.kill("SIGTERM");
    await link.cut();
  });

  test("database gone: /healthz 503 db down, /livez still 200, a page 503, the API 503 problem+json — then it recovers by itself", async () => {
    expect((await fetch(`${base}/account`, { headers: { cookie } })).status).toBe(200);
    await link.cut();
    const h = await fetch(`${base}/healthz`);
    expect(h.status).toBe(503);
    expect(await h.json()).toMatchObject({ db: "down" });
    // Liveness never asks the database: the process is alive, so /livez stays 200.
    const live = await fetch(`${base}/livez`);
    expect(live.status).toBe(200);
    expect(await live.json()).toMatchObject({ status: "ok" });
    const page = await fetch(`${base}/account`, { headers: { cookie } });
    expect(page.status).toBe(503);
    expect(await page.text()).toContain("Temporarily unavailable");
    const api = await fetch(`${base}/api/v1/libraries`, { headers: { authorization: `Bearer ${token}` } });
    expect(api.status).toBe(503);
    expect(api.headers.get("content-type")).toBe("application/problem+json");
    await link.open(); // same port
    expect(await waitFor(async () => (await fetch(`${base}/healthz`)).status === 200, 15_000)).toBe(true);
    expect((await fetch(`${base}/account`, { headers: { cookie } })).status).toBe(200);
    expect((await fetch(`${base}/api/v1/libraries`, { headers: { authorization: `Bearer ${token}` } })).status).toBe(200);
  }, 60_000);
});
