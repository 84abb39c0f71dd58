// Stored uploads that never became a revision: a rejected import removes its upload at once, and
// pending uploads older than a day are swept (each new upload sweeps, so no timer is needed).
import { and, eq, lt, sql } from "drizzle-orm";
import { db } from "@db/client.server";
import { uploads } from "@db/schema";

export const PENDING_UPLOAD_TTL_HOURS = 24;

const notInRevision = sql`${uploads.id} NOT IN (SELECT upload_id FROM library_revisions WHERE upload_id IS NOT NULL)`;

/** Removes one upload of `libraryId` unless a revision was imported from it. Returns whether a row went. */
export async function discardUpload(libraryId: number, uploadId: number): Promise<boolean> {
  const r = (await db()
    .delete(uploads)
    .where(and(eq(uploads.id, uploadId), eq(uploads.libraryId, libraryId), notInRevision))) as unknown as [{ affectedRows?: number }];
  return (r?.[0]?.affectedRows ?? 0) > 0;
}

/** Deletes uploads that were never imported and are older than PENDING_UPLOAD_TTL_HOURS. */
export async function sweepPendingUploads(now = new Date()): Promise<number> {
  const before = new Date(now.getTime() - PENDING_UPLOAD_TTL_HOURS * 3_600_000);
  const r = (await db().delete(uploads).where(and(lt(uploads.createdAt, before), notInRevision))) as unknown as [{ affectedRows?: number }];
  return r?.[0]?.affectedRows ?? 0;
}
