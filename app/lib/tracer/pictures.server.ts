// Datasheet pictures for the curve tracer (issue 20): kept byte for byte with their SHA-256, within
// the CSV uploads' size limit, type found from the bytes. The traced CSV becomes an ordinary upload
// (same mapping page, same checks, same import into a new revision) carrying its source line.
import { createHash } from "node:crypto";
import { and, desc, eq } from "drizzle-orm";
import { data } from "react-router";
import { db } from "@db/client.server";
import { tracePictures } from "@db/schema";
import { getOwnLibraryForWrite, insertUpload, MAX_UPLOAD_BYTES, UploadRejected, type Viewer } from "~/lib/libraries";
import { sniffPicture, tracedSource } from "./sniff";

export const MAX_PICTURE_BYTES = MAX_UPLOAD_BYTES;
/** The traced CSV is small (a few curves × 15 points); anything bigger did not come from the page. */
export const MAX_TRACED_CSV_BYTES = 512 * 1024;

/** Checks size and type (magic bytes); keeps the original bytes with their SHA-256. */
export async function storePicture(viewer: Viewer, libraryId: number, file: File): Promise<number> {
  const lib = await getOwnLibraryForWrite(viewer, libraryId);
  const name = file.name || "picture";
  if (file.size === 0) throw new UploadRejected(`${name} is empty.`);
  if (file.size > MAX_PICTURE_BYTES) throw new UploadRejected(`${name} is ${(file.size / 1048576).toFixed(1)} MB; the limit is ${MAX_PICTURE_BYTES / 1048576} MB.`);
  const bytes = Buffer.from(await file.arrayBuffer());
  const type = sniffPicture(bytes);
  if (!type) throw new UploadRejected(`${name} is not a PDF, PNG or JPEG file.`);
  const sha256 = createHash("sha256").update(bytes).digest("hex");
  const [{ id }] = await db()
    .insert(tracePictures)
    .values({ libraryId: lib.id, filename: name.slice(0, 255), contentType: type, sizeBytes: bytes.length, sha256, content: bytes, createdBy: viewer.userId || null })
    .$returningId();
  return id;
}

const META = { id: tracePictures.id, filename: tracePictures.filename, contentType: tracePictures.contentType, sizeBytes: tracePictures.sizeBytes, sha256: tracePictures.sha256, createdAt: tracePictures.createdAt };

export async function listPictures(viewer: Viewer, libraryId: number) {
  const lib = await getOwnLibraryForWrite(viewer, libraryId);
  const rows = await db().select(META).from(tracePictures).where(eq(tracePictures.libraryId, lib.id)).orderBy(desc(tracePictures.id)).limit(50);
  return { lib, pictures: rows };
}

export async function getPicture(viewer: Viewer, libraryId: number, pictureId: number) {
  const lib = await getOwnLibraryForWrite(viewer, libraryId);
  const [p] = await db().select(META).from(tracePictures).where(and(eq(tracePictures.id, pictureId), eq(tracePictures.libraryId, lib.id)));
  if (!p) throw data("No such picture in this library.", { status: 404 });
  return { lib, picture: p };
}

export async function pictureBytes(viewer: Viewer, libraryId: number, pictureId: number) {
  const { picture } = await getPicture(viewer, libraryId, pictureId);
  const [row] = await db().select({ content: tracePictures.content }).from(tracePictures).where(eq(tracePictures.id, picture.id));
  return { picture, content: row?.content ?? Buffer.alloc(0) };
}

/**
 * Keeps the traced points (our CSV, written by the page) as an upload of the library with its
 * source line; the caller sends the user to the upload's mapping page, where the same checks and
 * the same import as for any CSV apply. `note`: the page's word on what it did not trace (the peak
 * inside the innermost contour, peak.ts), kept in the source line and so in the revision's note.
 */
export async function storeTracedCsv(viewer: Viewer, libraryId: number, pictureId: number, csv: string, page: number | null, note = ""): Promise<number> {
  const { lib, picture } = await getPicture(viewer, libraryId, pictureId);
  const bytes = Buffer.from(csv, "utf8");
  if (bytes.length === 0 || !csv.trim()) throw new UploadRejected("Nothing was traced yet.");
  if (bytes.length > MAX_TRACED_CSV_BYTES) throw new UploadRejected(`The traced points are ${(bytes.length / 1024).toFixed(0)} kB; the limit is ${MAX_TRACED_CSV_BYTES / 1024} kB.`);
  const p = picture.contentType === "application/pdf" && page != null && Number.isInteger(page) && page >= 1 && page <= 100000 ? page : null;
  const base = picture.filename.replace(/\.[a-z0-9]{1,5}$/i, "").replace(/[^\w.-]+/g, "-").slice(0, 120) || "picture";
  return insertUpload(viewer, lib.id, `traced-${base}${p ? `-p${p}` : ""}.csv`, bytes, { source: tracedSource(picture.filename, picture.contentType, p, note), tracePictureId: picture.id });
}
