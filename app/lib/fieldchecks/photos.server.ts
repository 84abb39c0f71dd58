// Field-check photos: uploaded files checked by their first bytes, size and count; read back
// through the check they belong to (so a photo is open exactly where its check is).
import { and, eq } from "drizzle-orm";
import { data } from "react-router";
import { db } from "@db/client.server";
import { fieldCheckPhotos } from "@db/schema";
import { photoProblem } from "./photo-limits";
import { getFieldCheck } from "./records.server";
import type { Viewer } from "../libraries";

export class PhotoRejected extends Error {}

/** Content type from the file's first bytes (JPEG, PNG, WebP only); the client's claim is ignored. */
export function sniffImage(bytes: Uint8Array): "image/jpeg" | "image/png" | "image/webp" | null {
  const b = bytes;
  if (b.length >= 3 && b[0] === 0xff && b[1] === 0xd8 && b[2] === 0xff) return "image/jpeg";
  if (b.length >= 8 && [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a].every((x, i) => b[i] === x)) return "image/png";
  if (b.length >= 12 && String.fromCharCode(...b.slice(0, 4)) === "RIFF" && String.fromCharCode(...b.slice(8, 12)) === "WEBP") return "image/webp";
  return null;
}

export type PhotoIn = { filename: string; contentType: string; bytes: Buffer };

/**
 * Checks uploaded files: count, size each and together (photo-limits.ts, as the phone did before queueing), then
 * type by magic bytes. Empty file inputs are skipped.
 */
export async function readPhotos(files: FormDataEntryValue[], already = 0): Promise<PhotoIn[]> {
  const chosen = files.filter((f): f is File => f instanceof File && !(f.size === 0 && !f.name));
  const empty = chosen.find((f) => f.size === 0);
  if (empty) throw new PhotoRejected(`${empty.name} is empty.`);
  const problem = photoProblem(chosen, already);
  if (problem) throw new PhotoRejected(problem);
  const out: PhotoIn[] = [];
  for (const f of chosen) {
    const bytes = Buffer.from(await f.arrayBuffer());
    const type = sniffImage(bytes);
    if (!type) throw new PhotoRejected(`${f.name} is not a JPEG, PNG or WebP image.`);
    // eslint-disable-next-line no-control-regex -- control characters are exactly what is stripped
    const name = (f.name.split(/[\\/]/).pop() ?? "photo").replace(/[\u0000-\u001f\u007f"]/g, "").slice(0, 200) || "photo";
    out.push({ filename: name, contentType: type, bytes });
  }
  return out;
}

export async function getPhoto(viewer: Viewer, checkId: number, photoId: number) {
  await getFieldCheck(viewer, checkId);
  const [p] = await db()
    .select()
    .from(fieldCheckPhotos)
    .where(and(eq(fieldCheckPhotos.id, photoId), eq(fieldCheckPhotos.fieldCheckId, checkId)));
  if (!p) throw data("No such photo open to this workspace.", { status: 404 });
  return p;
}
