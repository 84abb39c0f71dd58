// Imports as rows of `imports`: started, advanced per batch of points streamed, finished or failed.
// Written from the pool (autocommit), never inside the import's own transaction, so the upload page
// and the library page of any app process see how far an import got while it runs. A big import
// started from the mapping page runs in the background of the process that took the request; the
// browser is sent to the library page, which lists it with its progress (swr polls with JS; a
// refresh link without).
import { and, desc, eq, sql } from "drizzle-orm";
import { db } from "@db/client.server";
import { imports } from "@db/schema";
import type { ImportView } from "./import-view";

/** Called with the number of points handed to the server so far. */
export type ProgressSink = (pointsWritten: number) => void;

/** A running import whose row has not moved for this long has lost its process (its transaction went with it). */
export const STALE_AFTER_MS = 2 * 60_000;

export async function startImportRow(a: { libraryId: number; uploadId: number; userId: string | null; pointsTotal: number }): Promise<number> {
  const [{ id }] = await db()
    .insert(imports)
    .values({ libraryId: a.libraryId, uploadId: a.uploadId, pointsTotal: a.pointsTotal, createdBy: a.userId || null })
    .$returningId();
  return id;
}

/** A sink that writes progress at most one UPDATE at a time (the latest count wins); flush() waits for the last one. */
export function progressWriter(importId: number): { sink: ProgressSink; flush: () => Promise<void> } {
  let latest = 0;
  let written = 0;
  let running: Promise<void> | null = null;
  const pump = (): Promise<void> | null => {
    if (running || latest === written) return running;
    const n = latest;
    running = db()
      .update(imports)
      .set({ pointsWritten: n, updatedAt: sql`CURRENT_TIMESTAMP(3)` })
      .where(and(eq(imports.id, importId), eq(imports.status, "running")))
      .then(
        () => void (written = n),
        () => void (written = n), // progress is best effort: the import itself decides the outcome
      )
      .finally(() => {
        running = null;
        pump();
      });
    return running;
  };
  return {
    sink: (n) => {
      latest = n;
      pump();
    },
    flush: async () => {
      while (running) await running;
    },
  };
}

export async function finishImportRow(importId: number, r: { revisionId: number; number: number; points: number }) {
  await db()
    .update(imports)
    .set({ status: "done", pointsWritten: r.points, revisionId: r.revisionId, revisionNumber: r.number, updatedAt: sql`CURRENT_TIMESTAMP(3)` })
    .where(eq(imports.id, importId));
}

export async function failImportRow(importId: number, message: string) {
  await db()
    .update(imports)
    .set({ status: "failed", message: message.slice(0, 500), updatedAt: sql`CURRENT_TIMESTAMP(3)` })
    .where(eq(imports.id, importId));
}

export type { ImportView };

function view(r: typeof imports.$inferSelect, now = Date.now()): ImportView {
  const stale = r.status === "running" && now - r.updatedAt.getTime() > STALE_AFTER_MS;
  return {
    id: r.id,
    uploadId: r.uploadId,
    status: stale ? "stopped" : (r.status as ImportView["status"]),
    pointsTotal: r.pointsTotal,
    pointsWritten: r.pointsWritten,
    revisionNumber: r.revisionNumber,
    message: stale ? "No progress for a while: the server that ran it stopped. Nothing of it was kept; start it again." : r.message,
    createdAt: r.createdAt.toISOString(),
  };
}

/** The latest imports of a library (the caller checked the viewer may write to it). */
export async function recentImports(libraryId: number, limit = 5): Promise<ImportView[]> {
  const rows = await db().select().from(imports).where(eq(imports.libraryId, libraryId)).orderBy(desc(imports.id)).limit(limit);
  return rows.map((r) => view(r));
}

/** One import of a library, or null. */
export async function importOf(libraryId: number, importId: number): Promise<ImportView | null> {
  const [r] = await db().select().from(imports).where(and(eq(imports.id, importId), eq(imports.libraryId, libraryId)));
  return r ? view(r) : null;
}
