// Selections: a candidate frozen with everything needed to print or check it later (system inputs,
// curve points, library revision, adjustment, results, energy), scoped to the caller's workspace.
import { and, desc, eq } from "drizzle-orm";
import { data } from "react-router";
import { db } from "@db/client.server";
import { curveSets, libraries, libraryRevisions, projects, pumpModels, selections, systems, uploads } from "@db/schema";
import { tracedOrigin } from "../tracer/sniff";
import type { Viewer } from "../libraries";
import { readStoredSelection, type FrozenSelection } from "./stored-selection";
import { problemErrors, problemsSummary, type DocProblem } from "./stored-doc";
import { ownCandidate, ownRow, storedAdjustmentRefusal, systemWorkbench } from "./projects.server";
import { selectionTitle, type UnitChoice } from "./labels";
import { workspaceCurrency } from "../workspaces";

export const SELECTION_FORMAT = "dutymark-selection/1";

/** The longest title and note a selection keeps, in characters (Unicode code points, as MariaDB's `varchar` counts them: db/schema.ts). */
export const SELECTION_TITLE_MAX = 200;
export const SELECTION_NOTE_MAX = 2000;

/** `text` cut to `max` characters at a code point, never between the two halves of a surrogate pair (which would be stored as U+FFFD or "?"). */
const clip = (text: string, max: number) => (text.length <= max ? text : Array.from(text).slice(0, max).join(""));

/**
 * Freezes a candidate: system inputs, curve points, library revision, adjustment and every result (title: `selectionTitle`).
 * The title and note as typed, cut to `SELECTION_TITLE_MAX` and `SELECTION_NOTE_MAX` characters.
 */
export async function selectCandidate(viewer: Viewer, candidateId: number, title: string, note: string, units?: UnitChoice) {
  const c = await ownCandidate(viewer, candidateId);
  const bench = await systemWorkbench(viewer, c.systemId);
  const unreadable = bench.needsReview.find((x) => x.id === c.id);
  if (unreadable) throw storedAdjustmentRefusal(unreadable); // never frozen as published on one pump in its place
  const cand = bench.candidates.find((x) => x.id === c.id);
  if (!cand || !cand.result) throw data("This candidate cannot be evaluated on the system; fix the inputs first.", { status: 409 });
  const [rev] = await db()
    .select({
      revisionId: curveSets.revisionId, number: libraryRevisions.number, note: libraryRevisions.note, uploadId: uploads.id, uploadSource: uploads.source,
      libraryId: libraries.id, libraryName: libraries.name, modelType: pumpModels.type, modelSize: pumpModels.nominalSize,
    })
    .from(curveSets)
    .innerJoin(libraryRevisions, eq(libraryRevisions.id, curveSets.revisionId))
    .leftJoin(uploads, eq(uploads.id, libraryRevisions.uploadId))
    .innerJoin(libraries, eq(libraries.id, libraryRevisions.libraryId))
    .innerJoin(pumpModels, eq(pumpModels.id, curveSets.modelId))
    .where(eq(curveSets.id, c.curveSetId));
  const frozen = {
    format: SELECTION_FORMAT,
    frozenAt: new Date().toISOString(),
    project: { id: bench.system.projectId, name: bench.system.projectName },
    system: { id: bench.system.id, name: bench.system.name, input: bench.system.input },
    systemCurve: bench.evaluation,
    pump: {
      label: cand.label,
      model: cand.model,
      type: rev?.modelType ?? "",
      size: rev?.modelSize ?? "",
      // A traced revision's source and caution go with the report and the CSV (null: not traced).
      library: { id: rev?.libraryId, name: rev?.libraryName, revision: rev?.number, revisionId: rev?.revisionId, traced: rev ? tracedOrigin(rev.note, rev.uploadId != null ? { source: rev.uploadSource } : null) : null },
      curveSetId: c.curveSetId,
      speed: cand.set.speed,
      impellerDiameter: cand.set.impellerDiameter,
      minFlow: cand.set.minFlow, // the maker's minimum continuous flow as imported (null: none recorded)
      points: cand.set.points,
    },
    adjustment: cand.adjustment,
    result: cand.result,
    energy: cand.energy,
    flowMax: bench.flowMax,
    // The tariff's and the costs' currency, kept even where the pump has no operating point (no figures carry it then).
    currency: await workspaceCurrency(viewer.workspace.id),
  };
  const [{ id }] = await db()
    .insert(selections)
    .values({
      systemId: bench.system.id,
      projectId: bench.system.projectId,
      workspaceId: viewer.workspace.id,
      curveSetId: c.curveSetId,
      revisionId: rev?.revisionId ?? null,
      title: clip(selectionTitle(title, cand.label, units), SELECTION_TITLE_MAX),
      note: clip(note, SELECTION_NOTE_MAX),
      frozenJson: JSON.stringify(frozen),
      createdBy: viewer.userId,
    })
    .$returningId();
  return id;
}

export type { FrozenSelection } from "./stored-selection";

/**
 * The refusal of a selection whose frozen document cannot be read (409, never half-rendered): `detail` says so and names
 * where it is wrong, `errors` what. The report page shows `detail`; the exports and the field pages' queue answer problem+json.
 */
export function storedSelectionRefusal(s: { id: number; title: string }, problems: readonly DocProblem[]) {
  const detail =
    `The stored selection "${s.title}" (report DM-${String(s.id).padStart(5, "0")}) cannot be read: its frozen document does not pass the checks ` +
    `(${problemsSummary(problems)}), so nothing of it is shown, exported or checked against — no numbers from a damaged record. ` +
    "The record itself is kept as it is; select the pump again from its system to make a new report.";
  return data({ detail, errors: problemErrors(problems) }, { status: 409 });
}

/** A selection row's frozen document as stored, or the refusal (409) when it does not pass `FrozenSelectionSchema`. */
export function frozenOf(s: { id: number; title: string; frozenJson: string }): FrozenSelection {
  const r = readStoredSelection(s.frozenJson);
  if (!r.ok) throw storedSelectionRefusal(s, r.problems);
  return r.frozen;
}

/** The selection with its frozen document; refuses (409, `storedSelectionRefusal`) when that document cannot be read. */
export async function getSelection(viewer: Viewer, selectionId: number) {
  const s = await ownRow(viewer, selections, selectionId, "selection");
  return { ...s, frozen: frozenOf(s) };
}

export async function listSelections(viewer: Viewer, filter: { projectId?: number; systemId?: number } = {}) {
  const conds = [eq(selections.workspaceId, viewer.workspace.id)];
  if (filter.projectId) conds.push(eq(selections.projectId, filter.projectId));
  if (filter.systemId) conds.push(eq(selections.systemId, filter.systemId));
  const rows = await db()
    .select({ id: selections.id, title: selections.title, systemId: selections.systemId, projectId: selections.projectId, createdAt: selections.createdAt, systemName: systems.name, projectName: projects.name })
    .from(selections)
    .innerJoin(systems, eq(systems.id, selections.systemId))
    .innerJoin(projects, eq(projects.id, selections.projectId))
    .where(and(...conds))
    .orderBy(desc(selections.id));
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}
