import { dbAlive } from "@db/client.server";
import pkg from "../../package.json";

export async function health() {
  const ok = await dbAlive();
  return { status: ok ? "ok" : "degraded", db: ok ? ("ok" as const) : ("down" as const), version: pkg.version };
}
