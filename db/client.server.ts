// The one way code talks to MariaDB: a `mariadb` connector pool under drizzle-orm/mysql-proxy.
// drizzle has no native adapter for the `mariadb` package; mysql-proxy hands us (sql, params, method).
// mysql-proxy's own db.transaction() throws, so `withTransaction` below is the transaction helper.
import * as mariadb from "mariadb";
import { drizzle, type MySqlRemoteDatabase } from "drizzle-orm/mysql-proxy";
import * as schema from "./schema";

export type Db = MySqlRemoteDatabase<typeof schema>;

let pool: mariadb.Pool | null = null;
let rootDb: Db | null = null;

export function databaseUrl(): string {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set (npm start / npm test set it; see README, Configuration)");
  return url;
}

function poolConfig(url: string): mariadb.PoolConfig {
  const u = new URL(url);
  return {
    host: u.hostname || "127.0.0.1",
    port: u.port ? Number(u.port) : 3306,
    user: decodeURIComponent(u.username),
    password: decodeURIComponent(u.password),
    database: u.pathname.replace(/^\//, ""),
    connectionLimit: Number(process.env.DB_POOL_SIZE ?? 10),
    acquireTimeout: Number(process.env.DB_ACQUIRE_TIMEOUT_MS ?? 5000),
    connectTimeout: 3000,
    // Numbers as numbers, dates as strings (drizzle parses them), see DEVELOPERS.md "Decisions".
    dateStrings: true,
    insertIdAsNumber: true,
    bigIntAsNumber: true,
    checkNumberRange: true,
    timezone: "+00:00",
    permitLocalInfile: true,
    multipleStatements: false,
  };
}

export function getPool(): mariadb.Pool {
  if (!pool) {
    pool = mariadb.createPool(poolConfig(databaseUrl()));
    // An open pool keeps the process alive: end it when the server is asked to stop.
    const end = () => {
      const p = pool;
      pool = null;
      rootDb = null;
      p?.end().catch(() => {});
    };
    process.once("SIGTERM", end);
    process.once("SIGINT", end);
  }
  return pool;
}

type Queryable = Pick<mariadb.Connection, "query"> | Pick<mariadb.Pool, "query">;

function proxyFor(target: () => Queryable) {
  return async (sql: string, params: unknown[], method: "all" | "execute") => {
    const q = target();
    if (method === "all") {
      const rows = await q.query({ sql, rowsAsArray: true }, params);
      return { rows: rows as unknown[] };
    }
    const result = await q.query(sql, params);
    return { rows: [result] as unknown[] };
  };
}

/** The drizzle instance over the pool (autocommit; each statement may use another connection). */
export function db(): Db {
  if (!rootDb) rootDb = drizzle(proxyFor(() => getPool()), { schema }) as Db;
  return rootDb;
}

/**
 * Runs `fn` inside one transaction on one pooled connection: BEGIN, then COMMIT when `fn`
 * resolves, ROLLBACK when it throws (the error is rethrown). The connection is always released.
 * Every multi-row write goes through here.
 */
export async function withTransaction<T>(fn: (tx: Db, conn: mariadb.PoolConnection) => Promise<T>): Promise<T> {
  const conn = await getPool().getConnection();
  try {
    await conn.beginTransaction();
    const tx = drizzle(proxyFor(() => conn), { schema }) as Db;
    try {
      const out = await fn(tx, conn);
      await conn.commit();
      return out;
    } catch (err) {
      await conn.rollback().catch(() => {});
      throw err;
    }
  } finally {
    await conn.release();
  }
}

/** True when the database answers a trivial query within `timeoutMs`. */
export async function dbAlive(timeoutMs = 1500): Promise<boolean> {
  try {
    const p = getPool();
    await Promise.race([
      p.query({ sql: "SELECT 1", timeout: timeoutMs }),
      new Promise((_, rej) => setTimeout(() => rej(new Error("timeout")), timeoutMs)),
    ]);
    return true;
  } catch {
    return false;
  }
}

export async function closeDb(): Promise<void> {
  const p = pool;
  pool = null;
  rootDb = null;
  if (p) await p.end();
}
