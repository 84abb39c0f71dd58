// HTTP benchmarks on loopback (run by `npm run bench`, which sets DATABASE_URL and builds the app):
//  1. the calc API (POST /api/v1/calc/pipe-loss, token caller, through the whole app server) against a
//     bare node:http server doing the same JSON → engine → JSON, same run, same autocannon settings;
//  2. the pump-search page of a system with 10 000 curve sets in the libraries open to the workspace.
// Bounded: fixed durations, loopback only, everything it starts is stopped at the end.
import http from "node:http";
import { spawn } from "node:child_process";
import path from "node:path";
import { fileURLToPath } from "node:url";
import autocannon from "autocannon";
import { runCalc } from "~/lib/calc-api";
import { TOKEN_CACHE_MS } from "~/lib/auth/token-cache.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { startSession } from "~/lib/auth/session.server";
import { bigLibraryCsv } from "~/test/big-library";
import { createLibrary, getUpload, importUpload, storeUpload, updateLibrary, analyseStored } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, listCandidates, selectCandidate } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput } from "~/lib/projects/hydraulics";
import { makeMember } from "~/test/harness";
import { runAsScript } from "./run-script";
import { cpuMs } from "./measure";

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");
const BODY = JSON.stringify({ flow_m3s: 0.1, diameter_m: 0.2, length_m: 100, roughness_m: 0.00026, temperature_c: 15.6 });
const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = 32;

type Load = { label: string; rps: number; p50: number; p99: number; errors: number; non2xx: number; requests: number };

async function load(label: string, url: string, headers: Record<string, string>, opts: { method?: "GET" | "POST"; body?: string; connections?: number; duration?: number } = {}): Promise<Load> {
  const r = await autocannon({ url, method: opts.method ?? "POST", headers, body: opts.body, connections: opts.connections ?? CONNECTIONS, duration: opts.duration ?? SECONDS });
  return { label, rps: r.requests.average, p50: r.latency.p50, p99: r.latency.p99, errors: r.errors + r.timeouts, non2xx: r.non2xx, requests: r.requests.total };
}

function bareServer(): Promise<{ url: string; close: () => Promise<void> }> {
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c) => chunks.push(c));
    req.on("end", () => {
      const out = runCalc("pipe-loss", JSON.parse(Buffer.concat(chunks).toString("utf8")));
      res.writeHead(out.ok ? 200 : 400, { "Content-Type": "application/json" });
      res.end(JSON.stringify(out.ok ? out.body : out.errors));
    });
  });
  return new Promise((resolve) =>
    server.listen(0, "127.0.0.1", () => {
      const port = (server.address() as { port: number }).port;
      resolve({ url: `http://127.0.0.1:${port}`, close: () => new Promise((r) => server.close(() => r())) });
    }),
  );
}

/**
 * The built app server on loopback. With `accessLog`, the server's own time per request (its access
 * log: from the request reaching Express to the last byte handed to the socket) is collected in `served`.
 */
export async function appServer(
  port: number,
  opts: { accessLog?: boolean } = {},
): Promise<{ url: string; pid: number; close: () => Promise<void>; served: { path: string; status: number; ms: number }[] }> {
  // BENCH_SERVER_NODE_ARGS: extra Node flags for the app server (e.g. "--cpu-prof --cpu-prof-dir=/tmp/prof" to profile it).
  const nodeArgs = (process.env.BENCH_SERVER_NODE_ARGS ?? "").split(" ").filter(Boolean);
  const child = spawn(process.execPath, [...nodeArgs, "app/serve.mjs", "build/server/index.js"], {
    cwd: ROOT,
    env: { ...process.env, PORT: String(port), HOST: "127.0.0.1", NODE_ENV: "production", ACCESS_LOG: opts.accessLog ? "1" : "0", APP_URL: `http://127.0.0.1:${port}`, MAIL_FLUSH_INTERVAL_MS: "0" },
    stdio: ["ignore", opts.accessLog ? "pipe" : "ignore", "inherit"],
  });
  const served: { path: string; status: number; ms: number }[] = [];
  if (opts.accessLog) {
    let rest = "";
    child.stdout!.setEncoding("utf8").on("data", (chunk: string) => {
      const lines = (rest + chunk).split("\n");
      rest = lines.pop()!;
      for (const line of lines) {
        const m = /^[A-Z]+ (\S+) (\d+) ([\d.]+) ms$/.exec(line);
        if (m) served.push({ path: m[1], status: Number(m[2]), ms: Number(m[3]) });
      }
    });
  }
  const url = `http://127.0.0.1:${port}`;
  let up = false;
  for (let i = 0; i < 200 && !up && child.exitCode === null; i++) {
    try {
      up = (await fetch(`${url}/healthz`)).ok;
    } catch {}
    if (!up) await new Promise((r) => setTimeout(r, 100));
  }
  if (!up) {
    child.kill("SIGKILL");
    throw new Error("the app server did not start (is the app built? npm run bench builds it)");
  }
  return {
    url,
    pid: child.pid!,
    served,
    close: () =>
      new Promise((r) => {
        if (child.exitCode !== null || child.signalCode !== null) return r(); // already gone: no exit event to wait for
        child.once("exit", () => r());
        child.kill("SIGTERM");
      }),
  };
}

/**
 * Server CPU per request, from the server's own CPU clock over `n` requests (8 in flight): unlike
 * requests per second this does not depend on what else the machine is doing.
 */
async function cpuPerRequest(pid: number, send: () => Promise<unknown>, n = 600): Promise<number> {
  for (let i = 0; i < 50; i++) await send();
  const c0 = cpuMs(pid);
  let i = 0;
  await Promise.all(Array.from({ length: 8 }, async () => { while (i++ < n) await send(); }));
  return (cpuMs(pid) - c0) / n;
}

export async function timed(url: string, cookie: string, n: number) {
  const times: number[] = [];
  for (let i = 0; i < n; i++) {
    const t0 = performance.now();
    const res = await fetch(url, { headers: { cookie } });
    await res.text();
    if (!res.ok) throw new Error(`${url} answered ${res.status}`);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return { mean: times.reduce((s, x) => s + x, 0) / n, p50: times[Math.floor(n / 2)], max: times[n - 1] };
}

export async function runHttpBench() {
  const eng = await makeMember("engineer");
  const { token } = await createApiToken({ userId: eng.userId, workspaceId: eng.workspaceId, name: "bench", scope: "read" });
  const bare = await bareServer();
  const app = await appServer(3900 + Math.floor(Math.random() * 50));
  const out: string[] = [];
  try {
    // Warm both up, then measure.
    await load("warm", `${bare.url}/`, { "content-type": "application/json" }, { body: BODY, duration: 2 });
    await load("warm", `${app.url}/api/v1/calc/pipe-loss`, { "content-type": "application/json", authorization: `Bearer ${token}` }, { body: BODY, duration: 2 });
    const b = await load("bare node:http (same calculation)", `${bare.url}/`, { "content-type": "application/json" }, { body: BODY });
    const a = await load("calc API, POST /api/v1/calc/pipe-loss", `${app.url}/api/v1/calc/pipe-loss`, { "content-type": "application/json", authorization: `Bearer ${token}` }, { body: BODY });
    // Liveness through the same router (no database): the calculators go through Express and React
    // Router like every route (issue 15, "one way in"); their goal is ≥ 0.8× this.
    await load("warm", `${app.url}/livez`, {}, { method: "GET", duration: 2 });
    const l = await load("GET /livez (router, no database)", `${app.url}/livez`, {}, { method: "GET" });
    out.push(`HTTP on loopback, ${CONNECTIONS} connections, ${SECONDS} s each (autocannon)`);
    out.push("");
    out.push(`${"".padEnd(40)} ${"req/s".padStart(9)} ${"p50 ms".padStart(8)} ${"p99 ms".padStart(8)} ${"errors".padStart(7)} ${"non-2xx".padStart(8)}`);
    for (const r of [b, l, a]) out.push(`${r.label.padEnd(40)} ${r.rps.toFixed(0).padStart(9)} ${String(r.p50).padStart(8)} ${String(r.p99).padStart(8)} ${String(r.errors).padStart(7)} ${String(r.non2xx).padStart(8)}`);
    out.push(`ratio calc API / bare: ${(a.rps / b.rps).toFixed(2)} (goal ≥ 0.4; p99 goal < 25 ms)`);
    out.push(`ratio calc API / GET /livez (req/s above): ${(a.rps / l.rps).toFixed(2)}`);
    const calcSend = () => fetch(`${app.url}/api/v1/calc/pipe-loss`, { method: "POST", headers: { "content-type": "application/json", authorization: `Bearer ${token}` }, body: BODY }).then((r) => r.arrayBuffer());
    const livezSend = () => fetch(`${app.url}/livez`).then((r) => r.arrayBuffer());
    const cpuLivez = await cpuPerRequest(app.pid, livezSend);
    const cpuCalc = await cpuPerRequest(app.pid, calcSend);
    out.push(`server CPU per request: GET /livez ${cpuLivez.toFixed(2)} ms, calc API ${cpuCalc.toFixed(2)} ms`);
    out.push(`throughput ratio calc / livez by server CPU: ${(cpuLivez / cpuCalc).toFixed(2)} (goal ≥ 0.8; the token is verified once per ${TOKEN_CACHE_MS / 1000} s, auth/token-cache.server.ts)`);
    out.push("");

    // The search page against 10 000 curve sets.
    const dist = await makeMember("distributor", eng.workspaceId);
    const viewer = { userId: dist.userId, workspace: { id: eng.workspaceId, name: "bench", slug: "bench", plan: "free" as const }, role: "distributor" as const };
    const libId = await createLibrary(viewer, { name: "Bench 10k", description: "" });
    const t0 = performance.now();
    const csv = bigLibraryCsv();
    const uploadId = await storeUpload(viewer, libId, new File([csv], "bench-10k.csv", { type: "text/csv" }));
    const { text, lib } = await getUpload(viewer, libId, uploadId);
    const imported = await importUpload(viewer, libId, uploadId, analyseStored(text, lib).mapping);
    await updateLibrary(viewer, libId, { name: "Bench 10k", description: "", visibility: "workspace" });
    const importS = (performance.now() - t0) / 1000;
    const ev = { userId: eng.userId, workspace: { id: eng.workspaceId, name: "bench", slug: "bench", plan: "free" as const }, role: "engineer" as const };
    const projectId = await createProject(ev, { name: "Bench", site: "", description: "" });
    const input = { ...defaultSystemInput(), duty: { flow: 40 / 3600, head: 35 } };
    const systemId = await createSystem(ev, projectId, "Bench system", input);
    const firstSet = (await import("~/lib/libraries")).libraryCurves;
    const sets = await firstSet(ev, libId);
    for (const s of sets.slice(0, 3)) await addCandidate(ev, systemId, s.id, DEFAULT_ADJUSTMENT);
    const cookie = (await startSession(eng.userId, new Request("http://127.0.0.1/"))).split(";")[0];
    await timed(`${app.url}/systems/${systemId}/search`, cookie, 2);
    const search = await timed(`${app.url}/systems/${systemId}/search`, cookie, 10);
    const page = await timed(`${app.url}/systems/${systemId}`, cookie, 10);
    out.push(`Libraries open to the workspace: ${imported.curves} curve sets, ${imported.points} points (imported in ${importS.toFixed(1)} s)`);
    out.push(`${"".padEnd(40)} ${"mean ms".padStart(9)} ${"p50 ms".padStart(8)} ${"max ms".padStart(8)}`);
    out.push(`${"GET /systems/:id/search (10 000 sets)".padEnd(40)} ${search.mean.toFixed(0).padStart(9)} ${search.p50.toFixed(0).padStart(8)} ${search.max.toFixed(0).padStart(8)}`);
    out.push(`${"GET /systems/:id (3 candidates)".padEnd(40)} ${page.mean.toFixed(0).padStart(9)} ${page.p50.toFixed(0).padStart(8)} ${page.max.toFixed(0).padStart(8)}`);
    const selId = await selectCandidate(ev, (await listCandidates(ev, systemId)).readable[0].id, "Bench selection", "");
    const sel = await load("GET /selections/:id (report page)", `${app.url}/selections/${selId}`, { cookie }, { method: "GET", connections: 8 });
    out.push("");
    out.push(`${"".padEnd(40)} ${"req/s".padStart(9)} ${"p50 ms".padStart(8)} ${"p99 ms".padStart(8)} ${"errors".padStart(7)} ${"non-2xx".padStart(8)}`);
    out.push(`${sel.label.padEnd(40)} ${sel.rps.toFixed(0).padStart(9)} ${String(sel.p50).padStart(8)} ${String(sel.p99).padStart(8)} ${String(sel.errors).padStart(7)} ${String(sel.non2xx).padStart(8)}   (8 connections, ${SECONDS} s)`);
  } finally {
    await app.close();
    await bare.close();
  }
  return out.join("\n");
}

runAsScript(import.meta.url, runHttpBench);
