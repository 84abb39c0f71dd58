// Stored uploads that never became a revision: a rejected import removes its upload at once, and
// pending uploads older than a day are swept (each new upload sweeps, so no timer is needed).
import { and, eq, lt, sql } from "drizzle-orm";
import { db } from "@db/client.server";
import { uploads } from "@db/schema";
import { data } from "react-router";
import { getOwnLibraryForWrite, type Viewer } from "./libraries.server";

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

/** An upload's row without its bytes (the mapping page reads those only when its analysis is not cached). */
export async function getUploadMeta(viewer: Viewer, libraryId: number, uploadId: number) {
  const lib = await getOwnLibraryForWrite(viewer, libraryId);
  const [u] = await db()
    .select({ id: uploads.id, filename: uploads.filename, sizeBytes: uploads.sizeBytes, sha256: uploads.sha256, source: uploads.source })
    .from(uploads)
    .where(and(eq(uploads.id, uploadId), eq(uploads.libraryId, lib.id)));
  if (!u) throw data("No such upload in this library.", { status: 404 });
  return { lib, upload: u };
}

/** The stored bytes of an upload (already checked to belong to the viewer's library). */
export async function uploadBytes(uploadId: number): Promise<Uint8Array> {
  const [u] = await db().select({ content: uploads.content }).from(uploads).where(eq(uploads.id, uploadId));
  return u?.content ?? new Uint8Array();
}
