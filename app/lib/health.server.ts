import { dbAlive } from "@db/client.server";
import pkg from "../../package.json";

/** Readiness: the process answers and the database does (GET /healthz). */
export async function health() {
  const ok = await dbAlive();
  return { status: ok ? "ok" : "degraded", db: ok ? ("ok" as const) : ("down" as const), version: pkg.version };
}

/** Liveness: the process answers; no database query (GET /livez). */
export function liveness() {
  return { status: "ok" as const, version: pkg.version, uptime: Math.round(process.uptime()) };
}

/** Whether the database answers within `timeoutMs` (the root middleware asks after a 500). */
export function databaseAlive(timeoutMs?: number): Promise<boolean> {
  return dbAlive(timeoutMs);
}
