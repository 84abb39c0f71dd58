// Deleting a datasheet picture of the curve tracer. A picture some upload was traced from is the provenance of the
// revision that upload became ("the original is kept … beside the revisions it leads to"), so it is kept; a picture
// nothing was traced from (a wrong file, a trial) can go, so that up to 20 MB each do not pile up unseen.
import { and, count, eq } from "drizzle-orm";
import { data } from "react-router";
import { db, withTransaction } from "@db/client.server";
import { tracePictures, uploads } from "@db/schema";
import { getOwnLibraryForWrite, type Viewer } from "~/lib/libraries";

/** How many uploads of the library were traced from each picture (id → count; absent: none), and how many pictures it keeps. */
export async function pictureUse(libraryId: number): Promise<{ traced: Map<number, number>; pictures: number }> {
  const [rows, [{ n }]] = await Promise.all([
    db().select({ id: uploads.tracePictureId, n: count() }).from(uploads).where(eq(uploads.libraryId, libraryId)).groupBy(uploads.tracePictureId),
    db().select({ n: count() }).from(tracePictures).where(eq(tracePictures.libraryId, libraryId)),
  ]);
  return { traced: new Map(rows.filter((r) => r.id != null).map((r) => [r.id!, Number(r.n)])), pictures: Number(n) };
}

export type PictureDeletion = { deleted: true; filename: string } | { deleted: false; reason: string };

/**
 * Deletes a picture of the viewer's own library unless an upload was traced from it (then refused, saying how many).
 * Another workspace's library or picture: 404, as every tracer route. One transaction: the check and the delete.
 */
export async function deletePicture(viewer: Viewer, libraryId: number, pictureId: number): Promise<PictureDeletion> {
  const lib = await getOwnLibraryForWrite(viewer, libraryId);
  return withTransaction(async (tx) => {
    const [p] = await tx
      .select({ id: tracePictures.id, filename: tracePictures.filename })
      .from(tracePictures)
      .where(and(eq(tracePictures.id, pictureId), eq(tracePictures.libraryId, lib.id)))
      .for("update");
    if (!p) throw data("No such picture in this library.", { status: 404 });
    const [{ n }] = await tx.select({ n: count() }).from(uploads).where(eq(uploads.tracePictureId, p.id));
    if (Number(n) > 0)
      return { deleted: false, reason: `${p.filename} is kept: ${n} upload${Number(n) === 1 ? " was" : "s were"} traced from it, and it is the source the revisions made from ${Number(n) === 1 ? "it" : "them"} name.` };
    await tx.delete(tracePictures).where(eq(tracePictures.id, p.id));
    return { deleted: true, filename: p.filename };
  });
}
