// Bulk writes with MariaDB's LOAD DATA LOCAL INFILE, fed from memory through the `mariadb`
// connector's per-query `infileStreamFactory` (no temporary file). It runs on the caller's
// connection, so inside withTransaction it is part of that one transaction: a rollback (or a
// vanished client) removes the loaded rows with everything else. The pool must allow
// `permitLocalInfile` (db/client.server.ts) and the server must run with local_infile=1.
import { Readable } from "node:stream";
import { setImmediate as yieldToLoop } from "node:timers/promises";
import type { PoolConnection } from "mariadb";

export type BulkValue = number | string | null;

const TABLE_OR_COLUMN = /^[a-z_][a-z0-9_]*$/;

/** One field in LOAD DATA's default text format (tab-separated, backslash escapes, \N for NULL). */
export function bulkField(x: BulkValue): string {
  if (x === null) return "\\N";
  if (typeof x === "number") {
    if (!Number.isFinite(x)) throw new Error(`bulk load: ${x} cannot be stored`);
    return String(x); // shortest round-trip form; MariaDB reads it back to the same double
  }
  return x.replace(/[\\\t\n\r\0]/g, (c) => (c === "\\" ? "\\\\" : c === "\t" ? "\\t" : c === "\n" ? "\\n" : c === "\r" ? "\\r" : "\\0"));
}

/** Rows → the LOAD DATA text (one line per row). */
export function bulkText(rows: readonly (readonly BulkValue[])[]): string {
  let out = "";
  for (const r of rows) {
    let line = "";
    for (let i = 0; i < r.length; i++) line += (i ? "\t" : "") + bulkField(r[i]);
    out += line + "\n";
  }
  return out;
}

/**
 * LOAD DATA LOCAL INFILE of `text` (see bulkText) into `table` (`columns` in order).
 * Returns the number of rows the server reports; throws when it differs from `expected` or when the
 * server reports warnings (a truncated or converted value would otherwise pass silently).
 */
/** The LOAD DATA text as one string, or as pieces (text, or bytes already UTF-8) made while the server is already reading (formatting overlaps the load). */
export type BulkSource = string | (() => Iterable<string | Uint8Array>);

export async function bulkLoad(
  conn: PoolConnection,
  table: string,
  columns: string[],
  text: BulkSource,
  expected: number,
  opts: { keysCheckedByCaller?: boolean } = {},
): Promise<number> {
  if (!TABLE_OR_COLUMN.test(table) || !columns.every((c) => TABLE_OR_COLUMN.test(c))) throw new Error("bulk load: bad identifier");
  if (expected === 0) return 0;
  // keysCheckedByCaller: every foreign key in `text` was just read back from rows this same
  // transaction wrote, so the per-row FK lookups are skipped for the load (restored right after).
  if (opts.keysCheckedByCaller) await conn.query("SET SESSION foreign_key_checks = 0");
  let failed = false;
  try {
    return await load(conn, table, columns, text, expected);
  } catch (e) {
    failed = true;
    throw e;
  } finally {
    // restore; when the load already failed (e.g. the connection was cut), keep that error
    if (opts.keysCheckedByCaller)
      await conn.query("SET SESSION foreign_key_checks = 1").catch((e: unknown) => {
        if (!failed) throw e;
      });
  }
}

/**
 * Runs `fn` with foreign-key checks off on `conn` (one statement each way), for loads whose every
 * key the caller read back from rows the same transaction wrote. Restored even when `fn` fails
 * (unless the connection itself is gone: then the first error stands).
 */
export async function withoutKeyChecks<T>(conn: PoolConnection, fn: () => Promise<T>): Promise<T> {
  await conn.query("SET SESSION foreign_key_checks = 0");
  let failed = false;
  try {
    return await fn();
  } catch (e) {
    failed = true;
    throw e;
  } finally {
    await conn.query("SET SESSION foreign_key_checks = 1").catch((e: unknown) => {
      if (!failed) throw e;
    });
  }
}

async function load(conn: PoolConnection, table: string, columns: string[], text: BulkSource, expected: number): Promise<number> {
  const name = `dutymark-${table}.tsv`;
  const r = (await conn.query({
    sql: `LOAD DATA LOCAL INFILE '${name}' INTO TABLE ${table} CHARACTER SET utf8mb4 FIELDS TERMINATED BY '\\t' ESCAPED BY '\\\\' LINES TERMINATED BY '\\n' (${columns.join(", ")})`,
    infileStreamFactory: (path: string) => {
      if (path !== name) throw new Error(`bulk load: unexpected file ${path}`);
      if (typeof text === "string") return Readable.from([Buffer.from(text, "utf8")]);
      const pieces = text();
      // One piece per turn of the event loop: a stream read in flowing mode would otherwise pull
      // every piece of a sync generator in one go (seconds for 200 000 points, nothing else served).
      return Readable.from((async function* () {
        for (const piece of pieces) {
          yield typeof piece === "string" ? Buffer.from(piece, "utf8") : Buffer.from(piece.buffer, piece.byteOffset, piece.byteLength);
          await yieldToLoop();
        }
      })());
    },
  })) as { affectedRows: number; warningStatus?: number };
  if (r.affectedRows !== expected) throw new Error(`bulk load into ${table}: ${r.affectedRows} rows loaded, ${expected} expected`);
  if (r.warningStatus) throw new Error(`bulk load into ${table}: the server reported ${r.warningStatus} warning(s)`);
  return r.affectedRows;
}
