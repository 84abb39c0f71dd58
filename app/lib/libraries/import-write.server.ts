// Writes an import plan (import-plan.ts) as a new revision of a library, in one transaction: all of
// it or none. Models, curve sets and points go in with LOAD DATA LOCAL INFILE from memory on the
// transaction's connection (bulk-load.server.ts); ids are read back by revision (no reliance on
// consecutive auto-increment values, which Galera's interleaved mode does not give). Foreign-key
// checks are off for those loads only (one round trip each way), because every key in them was
// read back from rows this same transaction wrote.
//
// Progress goes to the `imports` row (import-progress.server.ts) from the pool, outside the
// transaction, as the points are streamed: other requests see it while the import runs.
import { eq, sql } from "drizzle-orm";
import { withTransaction } from "@db/client.server";
import { libraries, libraryRevisions, pumpModels, uploads } from "@db/schema";
import { TRACE_CAUTION } from "../tracer/sniff";
import { bulkLoad, bulkText, withoutKeyChecks } from "./bulk-load.server";
import { planPart, pointLines, setLines, type ImportPlan, type Lines, type PlanPart } from "./import-plan";
import type { ProgressSink } from "./import-progress.server";

export type ImportResult = { revisionId: number; number: number; models: number; curves: number; points: number; skipped: number };

/** Points per piece of LOAD DATA text (and per progress step). */
export const POINTS_PER_PIECE = 5000;

export async function writeImport(
  args: { libraryId: number; uploadId: number; userId: string | null; plan: ImportPlan; note: string },
  hooks: { beforeCommit?: () => Promise<void>; progress?: ProgressSink } = {},
): Promise<ImportResult> {
  const { libraryId, uploadId, plan } = args;
  const curves = plan.setModel.length;
  return withTransaction(async (tx, conn) => {
    // Serialise imports of one library (revision numbers) without blocking others.
    await tx.select({ id: libraries.id }).from(libraries).where(eq(libraries.id, libraryId)).for("update");
    const [{ n }] = await tx
      .select({ n: sql<number>`COALESCE(MAX(${libraryRevisions.number}), 0)` })
      .from(libraryRevisions)
      .where(eq(libraryRevisions.libraryId, libraryId));
    const number = Number(n) + 1;
    // A traced upload (issue 20) records where it came from and that it is approximate.
    const [upload] = await tx.select({ source: uploads.source }).from(uploads).where(eq(uploads.id, uploadId));
    const note = args.note.trim();
    const fullNote = upload?.source ? `${upload.source}. ${TRACE_CAUTION}${note ? ` ${note}` : ""}` : args.note;
    const [{ id: revisionId }] = await tx
      .insert(libraryRevisions)
      .values({
        libraryId,
        number,
        uploadId,
        note: fullNote.slice(0, 500),
        modelCount: plan.models.length,
        curveCount: curves,
        pointCount: plan.points,
        skippedCount: plan.skipped,
        createdBy: args.userId || null,
      })
      .$returningId();
    await withoutKeyChecks(conn, async () => {
      const modelRows = plan.models.map((m) => [
        revisionId,
        m.name.slice(0, 160),
        m.type.slice(0, 80),
        m.size.slice(0, 60),
        m.ratedSpeed,
        m.impellerMin,
        m.impellerMax,
        m.notes.slice(0, 1000),
      ]);
      await bulkLoad(conn, "pump_models", ["revision_id", "name", "type", "nominal_size", "rated_speed", "impeller_min", "impeller_max", "notes"], bulkText(modelRows), modelRows.length);
      const modelIds = new Map((await tx.select({ id: pumpModels.id, name: pumpModels.name }).from(pumpModels).where(eq(pumpModels.revisionId, revisionId))).map((r) => [r.name, r.id]));
      for (const m of plan.models) if (!modelIds.has(m.name.slice(0, 160))) throw new Error(`import: model ${m.name} was not written`);
      // the worker's lines (made while the transaction got here), else the same lines made here
      const workerSets = usable(plan.lines && (await plan.lines.sets), curves);
      const setPrefix = (i: number) => `${modelIds.get(plan.models[plan.setModel[i]].name.slice(0, 160))}\t${revisionId}`;
      const setText = workerSets ? () => withIds(workerSets, oneEach(curves), setPrefix, SETS_PER_PIECE) : () => linesHere(plan, "sets", setPrefix, SETS_PER_PIECE);
      await bulkLoad(conn, "curve_sets", ["model_id", "revision_id", "speed", "impeller_diameter", "flow_min", "flow_max", "head_max", "head_min", "point_count", "min_flow"], setText, curves);
      // Curve sets come back in insertion order (ascending id within this revision).
      // (plain rows as arrays: 10 000 ids without an object each)
      const setIds = ((await conn.query({ sql: "SELECT id FROM curve_sets WHERE revision_id = ? ORDER BY id", rowsAsArray: true }, [revisionId])) as [number][]).map((r) => r[0]);
      if (setIds.length !== curves) throw new Error(`import: expected ${curves} curve sets, found ${setIds.length}`);
      const workerPoints = usable(plan.lines && (await plan.lines.points), plan.points);
      const setId = (i: number) => String(setIds[i]);
      const points = workerPoints
        ? () => withIds(workerPoints, plan.starts, setId, POINTS_PER_PIECE, hooks.progress)
        : () => linesHere(plan, "points", setId, POINTS_PER_PIECE, hooks.progress);
      await bulkLoad(conn, "curve_points", ["curve_set_id", "seq", "flow", "head", "efficiency", "power", "npshr"], points, plan.points);
    });
    await tx
      .update(libraries)
      .set({ currentRevisionId: revisionId, mappingJson: JSON.stringify(plan.mapping) })
      .where(eq(libraries.id, libraryId));
    await hooks.beforeCommit?.(); // fault injection for tests: a throw here must leave nothing behind
    return { revisionId, number, models: plan.models.length, curves, points: plan.points, skipped: plan.skipped };
  });
}

const SETS_PER_PIECE = 2000;

/**
 * The LOAD DATA text of the curve sets or of the points when the worker's lines are not there: the same lines, made
 * by the same functions (import-plan.ts setLines / pointLines), here a piece at a time — the curve sets of about
 * `perPiece` lines, so the stream hands each piece to the server while the next is made (the event loop is never
 * held for long) — with `prefix(set)` put in front of each line by withIds, and the lines so far to `progress` after each piece.
 */
export function* linesHere(
  plan: PlanPart,
  part: "sets" | "points",
  prefix: (set: number) => string,
  perPiece: number,
  progress?: ProgressSink,
): Generator<Uint8Array> {
  const sets = plan.starts.length - 1;
  const firstLine = part === "points" ? (i: number) => plan.starts[i] : (i: number) => i;
  for (let g = 0; g < sets; ) {
    let h = g;
    while (h < sets && firstLine(h) - firstLine(g) < perPiece) h++;
    const piece = planPart(plan, g, h);
    const lines = part === "points" ? pointLines(piece) : setLines(piece);
    yield* withIds(lines, part === "points" ? piece.starts : oneEach(h - g), (i) => prefix(g + i), Infinity);
    progress?.(firstLine(h));
    g = h;
  }
}

/** Line starts of `groups` groups of one line each. */
const oneEach = (groups: number) => Int32Array.from({ length: groups + 1 }, (_, i) => i);

/** The worker's lines when they are there and one per row expected. */
const usable = (lines: Lines | null | undefined, rows: number) => (lines && lines.ends.length === rows + 1 ? lines : null);

/**
 * LOAD DATA bytes from the worker's lines (import-plan.ts Lines): each line of group g — lines
 * [starts[g], starts[g + 1]), the last entry of `starts` being the number of lines — gets prefix(g)
 * in front, byte by byte: no number is formatted here. Pieces of whole groups, about `perPiece`
 * lines each, each reporting the lines so far to `progress`.
 */
export function* withIds(lines: Lines, starts: ArrayLike<number>, prefix: (group: number) => string, perPiece: number, progress?: ProgressSink): Generator<Uint8Array> {
  const { bytes, ends } = lines;
  const groups = starts.length - 1;
  const texts: string[] = [];
  let g = 0;
  while (g < groups) {
    // the groups of this piece, and the room their lines take with their prefixes
    let h = g;
    let room = 0;
    for (; h < groups && starts[h] - starts[g] < perPiece; h++) {
      texts[h - g] = prefix(h);
      room += ends[starts[h + 1]] - ends[starts[h]] + (starts[h + 1] - starts[h]) * texts[h - g].length;
    }
    const piece = Buffer.allocUnsafe(room);
    let o = 0;
    for (let i = g; i < h; i++) {
      const text = texts[i - g];
      for (let k = starts[i]; k < starts[i + 1]; k++) {
        for (let d = 0; d < text.length; d++) piece[o++] = text.charCodeAt(d);
        for (let x = ends[k], e = ends[k + 1]; x < e; x++) piece[o++] = bytes[x];
      }
    }
    yield piece;
    progress?.(starts[h]);
    g = h;
  }
}
