// One recorded check open to the viewer (through its selection): its row, its stored record read against its schemas,
// who recorded it, its photos and its chain's versions, and its readings judged under today's rules (judged-today.ts).
import { eq } from "drizzle-orm";
import { db } from "@db/client.server";
import { fieldCheckPhotos, fieldChecks, users, workspaces } from "@db/schema";
import { readStoredSelection } from "../projects/stored-selection";
import { judgedToday } from "./judged-today";
import type { Viewer } from "../libraries";
import type { Readings } from "./form";
import { readStoredCheck } from "./stored-check";
import { MAX_PROBLEMS_LISTED } from "../projects/stored-doc";
import { checkTimes } from "./taken-at";
import { fieldSelectionRecord, notFound } from "./access.server";

/** A check open to the viewer (through its selection), with its selection. */
export async function getFieldCheck(viewer: Viewer, checkId: number) {
  const [row] = await db().select().from(fieldChecks).where(eq(fieldChecks.id, checkId));
  if (!row) throw notFound("field check");
  // The check carries its own stored result: its page does not read the selection's frozen document.
  let sel: Omit<Awaited<ReturnType<typeof fieldSelectionRecord>>, "record">;
  let frozenJson: string;
  try {
    const { record, ...rest } = await fieldSelectionRecord(viewer, row.selectionId);
    sel = rest;
    frozenJson = record.frozenJson;
  } catch {
    throw notFound("field check");
  }
  const [by] = row.createdBy ? await db().select({ name: users.name, email: users.email }).from(users).where(eq(users.id, row.createdBy)) : [];
  const [ws] = await db().select({ name: workspaces.name }).from(workspaces).where(eq(workspaces.id, row.workspaceId));
  const photos = await db()
    .select({ id: fieldCheckPhotos.id, filename: fieldCheckPhotos.filename, contentType: fieldCheckPhotos.contentType, sizeBytes: fieldCheckPhotos.sizeBytes })
    .from(fieldCheckPhotos)
    .where(eq(fieldCheckPhotos.fieldCheckId, row.id))
    .orderBy(fieldCheckPhotos.id);
  const chain = await db()
    .select({ id: fieldChecks.id, version: fieldChecks.version, verdict: fieldChecks.verdict, createdAt: fieldChecks.createdAt })
    .from(fieldChecks)
    .where(eq(fieldChecks.chainId, row.chainId ?? row.id))
    .orderBy(fieldChecks.version);
  // Its stored documents are read against their schemas: one that fails is said, never shown with numbers (no 500 either).
  const stored = readStoredCheck(row);
  // The same readings judged under today's rules (judged-today.ts), said beside the stored verdict where they differ; only
  // where the selection's frozen document reads (the page shows the check from its own record either way).
  const frozen = stored.ok ? readStoredSelection(frozenJson) : null;
  const today = stored.ok && frozen?.ok ? judgedToday(frozen.frozen, stored.readings as Readings, row.grade, row.verdict) : null;
  return {
    check: row,
    judgedToday: today,
    selection: sel,
    ...(stored.ok
      ? { readable: true as const, readings: stored.readings, fields: stored.fields, result: stored.result }
      : { readable: false as const, problems: stored.problems.slice(0, MAX_PROBLEMS_LISTED), problemCount: stored.problems.length }),
    recordedBy: by?.name || by?.email || "a former member",
    recordedIn: ws?.name ?? "",
    mayAmend: row.workspaceId === viewer.workspace.id,
    photos,
    versions: chain.map((c) => ({ ...c, createdAt: c.createdAt.toISOString() })),
    latest: chain.length ? chain[chain.length - 1].id === row.id : true,
    times: checkTimes(row.takenAt, row.createdAt, sel.createdAt),
  };
}
