// Helpers for route-level integration tests: real MariaDB, real guards, real route modules,
// called the way React Router calls them (loader/action with a Request).
import net from "node:net";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { spawn } from "node:child_process";
import { eq } from "drizzle-orm";
import { db } from "@db/client.server";
import { memberships, users, workspaces } from "@db/schema";
import { hashPassword, startSession } from "~/lib/auth/session.server";
import { newUserId } from "~/lib/auth/accounts.server";
import { slugify } from "~/lib/workspaces";
import type { Role } from "~/lib/auth/permissions";

export const BASE = "http://127.0.0.1:3999";
let seq = 0;
const uniq = () => `${Date.now().toString(36)}${(seq++).toString(36)}${Math.random().toString(36).slice(2, 6)}`;
let pw: Promise<string> | null = null;

export async function makeWorkspace(name = `Test WS ${uniq()}`, plan: "free" | "network" = "free") {
  const [{ id }] = await db().insert(workspaces).values({ name, slug: `${slugify(name)}-${uniq()}`, plan }).$returningId();
  return { id, name };
}

export type TestMember = { userId: string; email: string; cookie: string; workspaceId: number; role: Role };

/** A verified user with `role` in a workspace (a new one unless given), signed in. */
export async function makeMember(role: Role, workspaceId?: number): Promise<TestMember> {
  const wsId = workspaceId ?? (await makeWorkspace()).id;
  const userId = newUserId();
  const email = `t-${uniq()}@example.test`;
  pw ??= hashPassword("correct horse battery");
  await db().insert(users).values({ id: userId, email, name: `Tester ${role}`, passwordHash: await pw, emailVerified: true, currentWorkspaceId: wsId });
  await db().insert(memberships).values({ workspaceId: wsId, userId, role });
  const setCookie = await startSession(userId, new Request(BASE));
  return { userId, email, cookie: setCookie.split(";")[0], workspaceId: wsId, role };
}

export async function userRow(userId: string) {
  const [u] = await db().select().from(users).where(eq(users.id, userId));
  return u;
}

export type CallResult = { status: number; body: unknown; location: string | null; headers: Headers };

type RouteFn = (args: { request: Request; params: Record<string, string>; context: unknown }) => unknown;

/** Calls a loader or action; thrown and returned Responses / data() results come back alike. */
export async function call(
  fn: RouteFn | undefined,
  opts: { path: string; method?: string; cookie?: string; form?: Record<string, string>; params?: Record<string, string>; headers?: Record<string, string>; body?: BodyInit },
): Promise<CallResult> {
  if (!fn) throw new Error("route has no such function");
  const headers = new Headers(opts.headers);
  if (opts.cookie) headers.set("cookie", opts.cookie);
  let body: BodyInit | undefined = opts.body;
  if (opts.form) body = new URLSearchParams(opts.form);
  const request = new Request(BASE + opts.path, { method: opts.method ?? (body ? "POST" : "GET"), headers, body });
  let out: unknown;
  try {
    out = await fn({ request, params: opts.params ?? {}, context: {} });
  } catch (thrown) {
    out = thrown;
  }
  return normalise(out);
}

async function normalise(out: unknown): Promise<CallResult> {
  if (out instanceof Response) {
    const text = await out.text();
    let body: unknown = text;
    try {
      body = JSON.parse(text);
    } catch {}
    return { status: out.status, body, location: out.headers.get("location"), headers: out.headers };
  }
  if (out && typeof out === "object" && (out as { type?: string }).type === "DataWithResponseInit") {
    const d = out as { data: unknown; init?: ResponseInit | null };
    const h = new Headers(d.init?.headers);
    return { status: d.init?.status ?? 200, body: d.data, location: h.get("location"), headers: h };
  }
  if (out instanceof Error) throw out;
  return { status: 200, body: out, location: null, headers: new Headers() };
}

/** A port the OS says is free now (never a fixed one: other checkouts may run beside this one). */
export const freePort = () =>
  new Promise<number>((resolve, reject) => {
    const srv = net.createServer();
    srv.once("error", reject);
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });

/** The project's root (the built app lives in build/). */
export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../.."); // vitest and tsx (ESM) alike

export type BuiltApp = { base: string; port: number; stderr: () => string; stop: () => void };

/**
 * The built app (app/serve.mjs on build/server/index.js, as npm start runs it) on a free loopback port, with
 * `env` over this process's environment, once its /healthz answers 200 (else it is stopped and this throws).
 * What it writes to stderr is kept (React Router logs request errors there).
 */
export async function startBuiltApp(env: Record<string, string> = {}, opts: { port?: number; healthy?: number } = {}): Promise<BuiltApp> {
  const port = opts.port ?? (await freePort());
  const base = `http://127.0.0.1:${port}`;
  const app = spawn(process.execPath, ["app/serve.mjs", "build/server/index.js"], {
    cwd: ROOT,
    env: { ...process.env, PORT: String(port), HOST: "127.0.0.1", NODE_ENV: "production", ACCESS_LOG: "0", MAIL_FLUSH_INTERVAL_MS: "0", ...env },
    stdio: ["ignore", "ignore", "pipe"],
  });
  let err = "";
  app.stderr?.on("data", (b) => (err += b));
  const built: BuiltApp = { base, port, stderr: () => err, stop: () => void app.kill("SIGTERM") };
  const until = Date.now() + (opts.healthy ?? 20_000);
  while (Date.now() < until && app.exitCode === null) {
    if ((await fetch(`${base}/healthz`).catch(() => null))?.status === 200) return built;
    await new Promise((r) => setTimeout(r, 200));
  }
  built.stop();
  throw new Error(`the app did not start${err ? `: ${err.slice(0, 500)}` : ""}`);
}
