// Recording a check (or an amendment: a new version of its chain) with its photos, exactly once per device-made id, and
// the engineer's notice by e-mail. The check itself is worked out by the pure `evaluate.ts` (which the phone also runs
// offline). A check is never edited: an amendment is a new version of its chain.
import { createHash } from "node:crypto";
import { desc, eq } from "drizzle-orm";
import { data } from "react-router";
import { db, withTransaction } from "@db/client.server";
import { fieldCheckPhotos, fieldChecks } from "@db/schema";
import type { Viewer } from "../libraries";
import { evaluateCheck } from "./evaluate";
import type { CheckFields, Readings } from "./form";
import { PhotoRejected, type PhotoIn } from "./photos.server";
import { photoProblem } from "./photo-limits";
import { checkTimes } from "./taken-at";
import { notifyEngineer } from "./notify.server";
import { fmtUtc } from "../shared/format";
import { fieldSelection, notFound } from "./access.server";

type CheckRow = typeof fieldChecks.$inferSelect;

export type NewCheck = {
  readings: Readings;
  fields: CheckFields;
  notes: string;
  gradeId: string;
  amends?: number | null;
  /** Id made on the device (e.g. a UUID): the same id recorded twice gives the first check back. */
  clientId?: string | null;
  /** The selection's fingerprint the device worked against; a different one now is a conflict. */
  basedOn?: string | null;
  /** The phone's clock when the readings were taken (kept beside the server's time of recording); null when not sent. */
  takenAt?: Date | null;
};

/**
 * The selection changed since the device opened it (`current`: its fingerprint now), or the version being amended was
 * amended meanwhile (`latest`: the chain's latest version, which the user may amend instead): shown, never merged.
 */
export class CheckConflict extends Error {
  constructor(
    message: string,
    readonly current: string,
    readonly latest: { id: number; version: number } | null = null,
  ) {
    super(message);
  }
}

/** A device-made id: 8 to 64 letters, digits, `-` or `_` (a UUID fits). */
export const CLIENT_ID = /^[A-Za-z0-9_-]{8,64}$/;

/**
 * The check already recorded under this device id, if any: the same user's, in the same workspace and selection only.
 * Anyone else's is a 409 (`code: "client-id-taken"`, the phone sends again under a new id) that never names that check:
 * answered as a duplicate, the other phone would delete readings that were never recorded. A retry needs only its id:
 * its stored documents are not read here, so a damaged one (its own page says so) never turns the phone's retry into a
 * 500 that the queue would send again and again.
 */
async function checkByClientId(viewer: Viewer, selectionId: number, clientId: string) {
  const [row] = await db()
    .select({ id: fieldChecks.id, workspaceId: fieldChecks.workspaceId, selectionId: fieldChecks.selectionId, createdBy: fieldChecks.createdBy })
    .from(fieldChecks)
    .where(eq(fieldChecks.clientId, clientId));
  if (!row) return null;
  if (row.workspaceId !== viewer.workspace.id || row.selectionId !== selectionId || row.createdBy !== viewer.userId)
    throw data({ detail: "That check id is already used by another check: this one was not recorded under it. Send it again under a new id.", code: "client-id-taken" }, { status: 409 });
  return { id: row.id, result: null, mail: null, duplicate: true as const };
}

function isDuplicateKey(e: unknown): boolean {
  for (let x = e as { errno?: number; code?: string; cause?: unknown } | undefined, i = 0; x && i < 4; x = x.cause as typeof x, i++) {
    if (x.errno === 1062 || x.code === "ER_DUP_ENTRY") return true;
  }
  return false;
}

/**
 * Records a check (or an amendment: a new version of the amended check's chain) with its photos,
 * in one transaction, then tells the engineer of the selection by e-mail. With a device id the
 * check is recorded exactly once: a retry (even one racing the first) answers the first check
 * with `duplicate: true`, no second row, no second e-mail.
 */
export async function recordFieldCheck(
  viewer: Viewer,
  selectionId: number,
  input: NewCheck,
  photos: PhotoIn[] = [],
  opts: { notify?: boolean; /** The selection as `fieldSelection` read it for this viewer (the form read it first). */ selection?: Awaited<ReturnType<typeof fieldSelection>> } = {},
) {
  const sel = opts.selection?.id === selectionId ? opts.selection : await fieldSelection(viewer, selectionId);
  const clientId = input.clientId ?? null;
  if (clientId !== null && !CLIENT_ID.test(clientId)) throw data("The check id made on the device is not valid.", { status: 400 });
  if (clientId !== null) {
    const earlier = await checkByClientId(viewer, sel.id, clientId);
    if (earlier) return earlier;
  }
  if (input.basedOn && input.basedOn !== sel.fingerprint)
    throw new CheckConflict("The selection changed after this phone opened it: the readings were not recorded against the new one. Open the selection again, look at what changed and enter the check again if it still applies.", sel.fingerprint);
  let amended: CheckRow | null = null;
  if (input.amends) {
    const [row] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, input.amends));
    if (!row || row.selectionId !== sel.id) throw notFound("field check");
    if (row.workspaceId !== viewer.workspace.id) throw data("Only the workspace that recorded a check may amend it.", { status: 403 });
    amended = row;
  }
  const result = evaluateCheck(sel.frozen, input.readings, input.gradeId);
  const id = await withTransaction(async (tx) => {
    let chainId: number | null = null;
    let version = 1;
    let carried: (typeof fieldCheckPhotos.$inferSelect)[] = [];
    if (amended) {
      chainId = amended.chainId ?? amended.id;
      // Lock the chain's first version so two amendments cannot take the same number, then read its latest (locking: the
      // newest committed row). Only the latest may be amended: a new version built from an older one would drop the
      // readings and photos of the versions after it from the chain's latest record (a phone that opened it offline).
      await tx.select({ id: fieldChecks.id }).from(fieldChecks).where(eq(fieldChecks.id, chainId)).for("update");
      const [latest] = await tx
        .select({ id: fieldChecks.id, version: fieldChecks.version, createdAt: fieldChecks.createdAt })
        .from(fieldChecks)
        .where(eq(fieldChecks.chainId, chainId))
        .orderBy(desc(fieldChecks.version))
        .limit(1)
        .for("update");
      if (latest && latest.id !== amended.id) throw amendedMeanwhile(amended, latest);
      version = (latest?.version ?? amended.version) + 1;
      carried = await tx.select().from(fieldCheckPhotos).where(eq(fieldCheckPhotos.fieldCheckId, amended.id));
      const tooMany = photoProblem(photos.map((p) => ({ name: p.filename, size: p.bytes.length })), carried.length);
      if (tooMany) throw new PhotoRejected(tooMany);
    }
    const [{ id }] = await tx
      .insert(fieldChecks)
      .values({
        selectionId: sel.id,
        chainId,
        version,
        workspaceId: viewer.workspace.id,
        createdBy: viewer.userId,
        readingsJson: JSON.stringify({ readings: input.readings, fields: input.fields }),
        resultJson: JSON.stringify(result),
        verdict: result.verdict,
        grade: result.grade.id,
        notes: input.notes,
        clientId,
        takenAt: input.takenAt ?? null,
      })
      .$returningId();
    if (!chainId) await tx.update(fieldChecks).set({ chainId: id }).where(eq(fieldChecks.id, id));
    for (const p of carried) await tx.insert(fieldCheckPhotos).values({ fieldCheckId: id, filename: p.filename, contentType: p.contentType, sizeBytes: p.sizeBytes, sha256: p.sha256, content: p.content });
    for (const p of photos)
      await tx.insert(fieldCheckPhotos).values({ fieldCheckId: id, filename: p.filename, contentType: p.contentType, sizeBytes: p.bytes.length, sha256: createHash("sha256").update(p.bytes).digest("hex"), content: p.bytes });
    return id;
  }).catch(async (e) => {
    // Two copies of one device's check raced: the other one won; answer with it.
    if (clientId !== null && isDuplicateKey(e)) return null;
    throw e;
  });
  if (id === null) {
    const winner = await checkByClientId(viewer, sel.id, clientId!);
    if (winner) return winner;
    throw new Error("duplicate device id but no check found");
  }
  let mail = null;
  if (opts.notify !== false) {
    const [{ createdAt }] = await db().select({ createdAt: fieldChecks.createdAt }).from(fieldChecks).where(eq(fieldChecks.id, id));
    mail = await notifyEngineer(viewer, sel, id, result, amended ? "amended" : "new", checkTimes(input.takenAt ?? null, createdAt, sel.createdAt));
  }
  return { id, result, mail, duplicate: false as const };
}

/** The amended version is no longer the chain's latest: the conflict, naming both versions, with the latest to amend instead. */
function amendedMeanwhile(amended: CheckRow, latest: { id: number; version: number; createdAt: Date }): CheckConflict {
  return new CheckConflict(
    `Not recorded: check ${amended.id} (version ${amended.version}) was amended meanwhile: version ${latest.version} (check ${latest.id}), recorded ${fmtUtc(latest.createdAt)}. ` +
      `Recorded as an amendment of version ${amended.version}, these readings would have replaced version ${latest.version}'s, and its photos, as the latest record. ` +
      `Look at version ${latest.version}; if these readings still apply, record them as its amendment (version ${latest.version + 1}).`,
    "",
    { id: latest.id, version: latest.version },
  );
}
