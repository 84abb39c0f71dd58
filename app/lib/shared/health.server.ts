import { connectionLostWithin, dbAlive } from "@db/client.server";
import pkg from "../../../package.json";

/** Readiness: the process answers and the database does (GET /healthz). */
export async function health() {
  const ok = await dbAlive();
  return { status: ok ? "ok" : "degraded", db: ok ? ("ok" as const) : ("down" as const), version: pkg.version };
}

/** Liveness: the process answers; no database query (GET /livez). */
export function liveness() {
  return { status: "ok" as const, version: pkg.version, uptime: Math.round(process.uptime()) };
}

/**
 * Whether a request that failed with 500 failed because of the database: a query lost its
 * connection in the last few seconds (a cluster node went away; the pool moves to the next one),
 * or the database does not answer now.
 */
export async function databaseTrouble(timeoutMs: number): Promise<boolean> {
  return connectionLostWithin(5000) || !(await dbAlive(timeoutMs));
}
