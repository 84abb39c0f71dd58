// Uploads: a CSV kept byte for byte with its SHA-256 (size, type and encoding checked first), read
// back for the mapping page, and the ones that never became a revision: a rejected import removes its upload at once, and
// pending uploads older than a day are swept (each new upload sweeps, so no timer is needed).
import { createHash } from "node:crypto";
import { and, desc, eq, lt, sql } from "drizzle-orm";
import { affectedRows, db } from "@db/client.server";
import { uploads } from "@db/schema";
import { data } from "react-router";
import type { Viewer } from "../auth/viewer.server";
import { decodeBytes, looksBinary, looksUtf16WithoutBom } from "../import";
import { fmtInt } from "../shared/format";
import { getOwnLibraryForWrite } from "./libraries.server";

export const MAX_UPLOAD_BYTES = 20 * 1024 * 1024;

/** A file's name as a refusal names it: at most 120 characters (a name of any length is never echoed whole). */
const named = (file: File) => (file.name.length > 120 ? `${file.name.slice(0, 117)}…` : file.name) || "The file";

/** A size in MB (MiB) with its bytes, so a refused size never reads as the limit: "20.0 MB (20,971,521 bytes)". */
const sizeText = (bytes: number, decimals: number) => `${(bytes / 1048576).toFixed(decimals)} MB (${fmtInt(bytes)} bytes)`;

export const PENDING_UPLOAD_TTL_HOURS = 24;

const notInRevision = sql`${uploads.id} NOT IN (SELECT upload_id FROM library_revisions WHERE upload_id IS NOT NULL)`;

/** Removes one upload of `libraryId` unless a revision was imported from it. Returns whether a row went. */
export async function discardUpload(libraryId: number, uploadId: number): Promise<boolean> {
  return affectedRows(await db().delete(uploads).where(and(eq(uploads.id, uploadId), eq(uploads.libraryId, libraryId), notInRevision))) > 0;
}

/** Deletes uploads that were never imported and are older than PENDING_UPLOAD_TTL_HOURS. */
export async function sweepPendingUploads(now = new Date()): Promise<number> {
  const before = new Date(now.getTime() - PENDING_UPLOAD_TTL_HOURS * 3_600_000);
  return affectedRows(await db().delete(uploads).where(and(lt(uploads.createdAt, before), notInRevision)));
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

/** Uploads of this library not yet imported (newest first). */
export async function pendingUploads(libraryId: number) {
  const rows = await db()
    .select({ id: uploads.id, filename: uploads.filename, sizeBytes: uploads.sizeBytes, createdAt: uploads.createdAt })
    .from(uploads)
    .where(and(eq(uploads.libraryId, libraryId), sql`${uploads.id} NOT IN (SELECT upload_id FROM library_revisions WHERE library_id = ${libraryId} AND upload_id IS NOT NULL)`))
    .orderBy(desc(uploads.id));
  return rows;
}

export class UploadRejected extends Error {}

const TEXT_TYPES = new Set(["text/csv", "text/plain", "application/csv", "application/vnd.ms-excel", "text/tab-separated-values", ""]);

/** Checks size, type and encoding; keeps the original bytes with their SHA-256. */
export async function storeUpload(viewer: Viewer, libraryId: number, file: File): Promise<number> {
  const lib = await getOwnLibraryForWrite(viewer, libraryId);
  if (file.size === 0) throw new UploadRejected(`${named(file)} is empty.`);
  if (file.size > MAX_UPLOAD_BYTES) throw new UploadRejected(`${named(file)} is ${sizeText(file.size, 1)}; the limit is ${sizeText(MAX_UPLOAD_BYTES, 0)}.`);
  if (!/\.(csv|txt|tsv)$/i.test(file.name) || !TEXT_TYPES.has(file.type)) {
    throw new UploadRejected(`${named(file)} is not a CSV file (expected .csv, .tsv or .txt).`);
  }
  const bytes = Buffer.from(await file.arrayBuffer());
  if (looksUtf16WithoutBom(bytes))
    throw new UploadRejected(`${named(file)} looks like UTF-16 text without a byte-order mark (every other byte is 0), which cannot be told from binary data: save it as UTF-8, or as UTF-16 with its byte-order mark, and upload it again.`);
  if (looksBinary(bytes)) throw new UploadRejected(`${named(file)} looks like a binary file, not CSV text.`);
  return insertUpload(viewer, lib.id, file.name, bytes);
}

/** Keeps bytes as an upload of the library with their SHA-256 (the caller checked the library and the bytes). */
export async function insertUpload(viewer: Viewer, libraryId: number, filename: string, bytes: Buffer, traced: { source: string; tracePictureId: number } | null = null): Promise<number> {
  const sha256 = createHash("sha256").update(bytes).digest("hex");
  await sweepPendingUploads(); // uploads never imported within a day go (issue 14)
  const [{ id }] = await db()
    .insert(uploads)
    .values({ libraryId, filename: filename.slice(0, 255), sizeBytes: bytes.length, sha256, content: bytes, createdBy: viewer.userId || null, ...(traced ?? {}) })
    .$returningId();
  return id;
}

export async function getUpload(viewer: Viewer, libraryId: number, uploadId: number) {
  const lib = await getOwnLibraryForWrite(viewer, libraryId);
  const [u] = await db()
    .select()
    .from(uploads)
    .where(and(eq(uploads.id, uploadId), eq(uploads.libraryId, lib.id)));
  if (!u) throw data("No such upload in this library.", { status: 404 });
  // decoded only when asked (the import and the API never decode a big file on the main thread)
  let decoded: ReturnType<typeof decodeBytes> | null = null;
  return {
    lib,
    upload: u,
    get decoded() {
      return (decoded ??= decodeBytes(u.content));
    },
    get text() {
      return this.decoded.text;
    },
  };
}
