// Projects, systems and candidates (selections: selections.server.ts). Every read and write is scoped to the caller's
// workspace; ids from elsewhere answer 404, never data.
import { and, asc, eq, inArray, isNull, isNotNull, count } from "drizzle-orm";
import { data } from "react-router";
import * as v from "valibot";
import { affectedRows as affected, db, withTransaction } from "@db/client.server";
import { candidates, curveSets, libraries, libraryRevisions, projects, selections, systems } from "@db/schema";
import { workspaceCurrency } from "../workspaces";
import {
  AdjustmentSchema,
  DEFAULT_ADJUSTMENT,
  defaultSystemInput,
  evaluateCandidate,
  evaluateSystem,
  flowMaxOf,
  fluidOf,
  systemSpec,
  candidatesFlowMax,
  SystemInputEntrySchema,
  type Adjustment,
  type SystemInput,
} from "./hydraulics";
import { candidateEnergy, type CandidateEnergy } from "./energy";
import { curvesOfRevisions, candidateCurveOpen, searchableRevisions, type LibraryCurveSet, type Viewer } from "../libraries";
import { candidateLabel } from "./labels";
import { editorInput, readStoredInput, type InputProblem } from "./stored-input";
import { MAX_PROBLEMS_LISTED, problemErrors, problemPlaces, problemsSummary, type DocProblem } from "./stored-doc";
import { adjustFormValues, readStoredAdjustment } from "./stored-adjustment";

export const MAX_CANDIDATES = 6;
const notFound = (what: string) => data(`No such ${what} in this workspace.`, { status: 404 });

/** The row of a workspace-owned table (projects, selections) with this id in the viewer's workspace, else a 404 naming `what`. */
export async function ownRow<T extends typeof projects | typeof selections>(viewer: Viewer, table: T, id: number, what: string): Promise<T["$inferSelect"]> {
  const t = table as typeof projects; // both tables have id and workspaceId; drizzle's select() wants one table type
  const [row] = await db().select().from(t).where(and(eq(t.id, id), eq(t.workspaceId, viewer.workspace.id)));
  if (!row) throw notFound(what);
  return row as T["$inferSelect"];
}

// ── Projects ────────────────────────────────────────────────────────────────────────────────
export async function listProjects(viewer: Viewer, opts: { archived?: boolean } = {}) {
  const rows = await db()
    .select()
    .from(projects)
    .where(and(eq(projects.workspaceId, viewer.workspace.id), opts.archived ? isNotNull(projects.archivedAt) : isNull(projects.archivedAt)))
    .orderBy(asc(projects.name));
  const ids = rows.map((p) => p.id);
  const counts = ids.length
    ? await db()
        .select({ projectId: systems.projectId, n: count() })
        .from(systems)
        .where(and(inArray(systems.projectId, ids), isNull(systems.archivedAt)))
        .groupBy(systems.projectId)
    : [];
  const sel = ids.length
    ? await db().select({ projectId: selections.projectId, n: count() }).from(selections).where(inArray(selections.projectId, ids)).groupBy(selections.projectId)
    : [];
  return rows.map((p) => ({
    id: p.id,
    name: p.name,
    site: p.site,
    description: p.description,
    archived: p.archivedAt != null,
    systems: Number(counts.find((c) => c.projectId === p.id)?.n ?? 0),
    selections: Number(sel.find((c) => c.projectId === p.id)?.n ?? 0),
    createdAt: p.createdAt.toISOString(),
  }));
}

export async function getProject(viewer: Viewer, projectId: number) {
  return ownRow(viewer, projects, projectId, "project");
}

export async function createProject(viewer: Viewer, input: { name: string; site: string; description: string }) {
  const [{ id }] = await db()
    .insert(projects)
    .values({ ...input, workspaceId: viewer.workspace.id, createdBy: viewer.userId })
    .$returningId();
  return id;
}

export async function updateProject(viewer: Viewer, projectId: number, input: { name: string; site: string; description: string }) {
  const p = await getProject(viewer, projectId);
  await db().update(projects).set(input).where(eq(projects.id, p.id));
}

export async function setProjectArchived(viewer: Viewer, projectId: number, archived: boolean) {
  const p = await getProject(viewer, projectId);
  await db()
    .update(projects)
    .set({ archivedAt: archived ? new Date() : null })
    .where(eq(projects.id, p.id));
}

/** Copies a project with its systems and candidates (not its selections), in one transaction. */
export async function copyProject(viewer: Viewer, projectId: number) {
  const p = await getProject(viewer, projectId);
  return withTransaction(async (tx) => {
    const [{ id }] = await tx
      .insert(projects)
      .values({ workspaceId: p.workspaceId, name: `${p.name} (copy)`.slice(0, 160), site: p.site, description: p.description, createdBy: viewer.userId })
      .$returningId();
    const sys = await tx.select().from(systems).where(and(eq(systems.projectId, p.id), isNull(systems.archivedAt)));
    for (const s of sys) {
      const [{ id: newSys }] = await tx.insert(systems).values({ projectId: id, workspaceId: s.workspaceId, name: s.name, inputJson: s.inputJson }).$returningId();
      const cands = await tx.select().from(candidates).where(eq(candidates.systemId, s.id));
      if (cands.length) await tx.insert(candidates).values(cands.map((c) => ({ systemId: newSys, curveSetId: c.curveSetId, adjustmentJson: c.adjustmentJson, purchasePriceCents: c.purchasePriceCents })));
    }
    return id;
  });
}

// ── Systems ─────────────────────────────────────────────────────────────────────────────────
/** A system row in the viewer's workspace with its project's name, else a 404; its stored input is not read. */
async function systemRecord(viewer: Viewer, systemId: number) {
  const [row] = await db()
    .select({ s: systems, projectName: projects.name, projectId: projects.id })
    .from(systems)
    .innerJoin(projects, eq(projects.id, systems.projectId))
    .where(and(eq(systems.id, systemId), eq(systems.workspaceId, viewer.workspace.id)));
  if (!row) throw notFound("system");
  return { ...row.s, projectName: row.projectName };
}

/**
 * The refusal of anything computed from a stored input that does not pass the schema (409, never the default system in its
 * place): `detail` names where it is wrong, `errors` what (quantity tokens, rendered by the API in the caller's units).
 */
export function storedInputRefusal(name: string, problems: readonly InputProblem[]) {
  const detail =
    `The stored inputs of the system "${name}" do not pass the system checks (${problemsSummary(problems)}), ` +
    "so nothing is computed from them: no system curve, operating point, search or verdict. Open the system page to see what is wrong, fix it and save.";
  return data({ detail, errors: problemErrors(problems) }, { status: 409 });
}

export async function listSystems(viewer: Viewer, projectId: number) {
  const p = await getProject(viewer, projectId);
  const rows = await db()
    .select()
    .from(systems)
    .where(and(eq(systems.projectId, p.id), isNull(systems.archivedAt)))
    .orderBy(asc(systems.name));
  return rows.map((s) => {
    const r = readStoredInput(s.inputJson);
    const needsReview = r.ok ? null : { problems: r.problems.length, places: problemPlaces(r.problems, 3) };
    return { id: s.id, name: s.name, duty: r.ok ? r.input.duty : null, mode: r.ok ? r.input.mode : null, needsReview, updatedAt: s.updatedAt.toISOString() };
  });
}

/** The system with its stored input; refuses (409, `storedInputRefusal`) when that input does not pass the schema. */
export async function getSystem(viewer: Viewer, systemId: number) {
  const row = await systemRecord(viewer, systemId);
  const r = readStoredInput(row.inputJson);
  if (!r.ok) throw storedInputRefusal(row.name, r.problems);
  return { ...row, input: r.input };
}

export async function createSystem(viewer: Viewer, projectId: number, name: string, input: SystemInput = defaultSystemInput()) {
  const p = await getProject(viewer, projectId);
  const [{ id }] = await db()
    .insert(systems)
    .values({ projectId: p.id, workspaceId: p.workspaceId, name, inputJson: JSON.stringify(input) })
    .$returningId();
  return id;
}

/**
 * A system's stored document as the editor shows it (one that does not pass the schema as `editorInput` reads it): what
 * the editor's form is read against (`readSystemForm`) — only a table or size the catalogue does not list now that a stored
 * run holds is kept, and a post without the energy fields keeps the stored ones; the server's word, not a posted field.
 * The preview API reads its runs (preview-input.ts).
 */
export async function storedForEditor(viewer: Viewer, systemId: number): Promise<SystemInput> {
  const r = readStoredInput((await systemRecord(viewer, systemId)).inputJson);
  return r.ok ? r.input : editorInput(r.raw);
}

export async function saveSystem(viewer: Viewer, systemId: number, name: string, input: SystemInput) {
  const s = await systemRecord(viewer, systemId); // saving is how a stored input that no longer passes is fixed
  await db().update(systems).set({ name, inputJson: JSON.stringify(v.parse(SystemInputEntrySchema, input)), updatedAt: new Date() }).where(eq(systems.id, s.id));
}

/** Copies the stored document as it is (one that does not pass the schema stays in need of review in the copy). */
export async function copySystem(viewer: Viewer, systemId: number) {
  const s = await systemRecord(viewer, systemId);
  return withTransaction(async (tx) => {
    const [{ id }] = await tx.insert(systems).values({ projectId: s.projectId, workspaceId: s.workspaceId, name: `${s.name} (copy)`.slice(0, 160), inputJson: s.inputJson }).$returningId();
    const cands = await tx.select().from(candidates).where(eq(candidates.systemId, s.id));
    if (cands.length) await tx.insert(candidates).values(cands.map((c) => ({ systemId: id, curveSetId: c.curveSetId, adjustmentJson: c.adjustmentJson, purchasePriceCents: c.purchasePriceCents })));
    return id;
  });
}

export async function archiveSystem(viewer: Viewer, systemId: number) {
  const s = await systemRecord(viewer, systemId);
  await db().update(systems).set({ archivedAt: new Date() }).where(eq(systems.id, s.id));
  return s.projectId;
}

// ── Candidates ──────────────────────────────────────────────────────────────────────────────
/**
 * Refuses (404, nothing written) unless every curve set exists and its library is open to the viewer. A candidate
 * may keep an older revision of an open library: the library must be open, not the revision current.
 */
export async function assertOpenCurveSets(viewer: Viewer, ids: number[]) {
  const rows = await db()
    .select({ id: curveSets.id, libraryId: libraryRevisions.libraryId })
    .from(curveSets)
    .innerJoin(libraryRevisions, eq(libraryRevisions.id, curveSets.revisionId))
    .where(inArray(curveSets.id, ids));
  if (rows.length !== ids.length) throw data("No such pump curve.", { status: 404 });
  const { open } = await searchableRevisions(viewer);
  const openLibs = new Set(open.map((o) => o.libraryId));
  if (rows.some((r) => !openLibs.has(r.libraryId))) throw data("No such pump curve in your reach.", { status: 404 });
}

export type CandidateView = {
  id: number;
  curveSetId: number;
  label: string;
  model: string;
  library: string;
  adjustment: Adjustment;
  set: LibraryCurveSet;
  /** Purchase price, integer cents of the workspace's currency (null: not given). */
  purchasePriceCents: number | null;
};

/**
 * A system's candidates in the order added, each with its curve set's revision and library, keeping only those whose
 * library the viewer may still use; nothing for a system outside the viewer's workspace. One query, no curves read:
 * `listCandidates` reads the curves of these, the search page (`candidateSetIds`) marks their rows.
 */
export async function openCandidates(viewer: Viewer, systemId: number) {
  const all = await db()
    .select({ c: candidates, revisionId: curveSets.revisionId, libraryName: libraries.name, libraryWorkspaceId: libraries.workspaceId, libraryVisibility: libraries.visibility })
    .from(candidates)
    .innerJoin(systems, eq(systems.id, candidates.systemId))
    .innerJoin(curveSets, eq(curveSets.id, candidates.curveSetId))
    .innerJoin(libraryRevisions, eq(libraryRevisions.id, curveSets.revisionId))
    .innerJoin(libraries, eq(libraries.id, libraryRevisions.libraryId))
    .where(and(eq(candidates.systemId, systemId), eq(systems.workspaceId, viewer.workspace.id)))
    .orderBy(asc(candidates.id));
  // The plan gate: a candidate from another workspace's library (added while on the paid plan) shows no
  // curve once the plan no longer opens it, or once its owner stops sharing it. Selections keep their frozen copy.
  return all.filter((r) => candidateCurveOpen(viewer, { workspaceId: r.libraryWorkspaceId, visibility: r.libraryVisibility }));
}

/**
 * A candidate whose stored adjustment does not pass the schema (stored-adjustment.ts): never evaluated as published on one
 * pump in its place. It is kept out of the chart, the comparison, the energy panel and selection; the system page lists it
 * with its problems and the adjust form filled with the stored values (`form`, never computed with) to fix it, or removes it.
 */
export type CandidateNeedingReview = Omit<CandidateView, "adjustment" | "set"> & { count: number; problems: DocProblem[]; form: Adjustment };

/** A system's candidates (`openCandidates`): those whose stored adjustment passes the schema, and those needing review. */
export async function listCandidates(viewer: Viewer, systemId: number): Promise<{ readable: CandidateView[]; needsReview: CandidateNeedingReview[] }> {
  const s = await systemRecord(viewer, systemId);
  const rows = await openCandidates(viewer, s.id);
  if (rows.length === 0) return { readable: [], needsReview: [] };
  const sets = await curvesOfRevisions([...new Set(rows.map((r) => r.revisionId))], rows.map((r) => r.c.curveSetId));
  const readable: CandidateView[] = [];
  const needsReview: CandidateNeedingReview[] = [];
  for (const r of rows) {
    const set = sets.find((x) => x.id === r.c.curveSetId);
    if (!set) continue;
    const base = { id: r.c.id, curveSetId: r.c.curveSetId, label: candidateLabel(set), model: set.model, library: r.libraryName, purchasePriceCents: r.c.purchasePriceCents ?? null };
    const adj = readStoredAdjustment(r.c.adjustmentJson);
    if (adj.ok) readable.push({ ...base, adjustment: adj.adjustment, set });
    else needsReview.push({ ...base, count: adj.problems.length, problems: adj.problems.slice(0, MAX_PROBLEMS_LISTED), form: adjustFormValues(adj.raw) });
  }
  return { readable, needsReview };
}

/** The refusal of anything computed from a candidate whose stored adjustment does not pass the schema (409, never the default adjustment). */
export function storedAdjustmentRefusal(c: Pick<CandidateNeedingReview, "label" | "count" | "problems">) {
  const detail =
    `The stored adjustment of the candidate "${c.label}" does not pass the checks (${problemsSummary(c.problems, c.count)}), ` +
    "so it is not evaluated, compared or selected. Open the system page to see what is wrong: apply its adjustment again, or remove it.";
  return data({ detail, errors: problemErrors(c.problems) }, { status: 409 });
}

export async function addCandidate(viewer: Viewer, systemId: number, curveSetId: number, adjustment: Adjustment = DEFAULT_ADJUSTMENT) {
  const s = await getSystem(viewer, systemId);
  await assertOpenCurveSets(viewer, [curveSetId]);
  return withTransaction(async (tx) => {
    await tx.select({ id: systems.id }).from(systems).where(eq(systems.id, s.id)).for("update");
    const existing = await tx.select({ id: candidates.id, curveSetId: candidates.curveSetId }).from(candidates).where(eq(candidates.systemId, s.id));
    if (existing.some((c) => c.curveSetId === curveSetId)) return { ok: false as const, reason: "That curve is already a candidate." };
    if (existing.length >= MAX_CANDIDATES) return { ok: false as const, reason: `At most ${MAX_CANDIDATES} candidates: remove one first.` };
    const [{ id }] = await tx.insert(candidates).values({ systemId: s.id, curveSetId, adjustmentJson: JSON.stringify(adjustment) }).$returningId();
    return { ok: true as const, id };
  });
}

export async function ownCandidate(viewer: Viewer, candidateId: number) {
  const [row] = await db()
    .select({ c: candidates })
    .from(candidates)
    .innerJoin(systems, eq(systems.id, candidates.systemId))
    .where(and(eq(candidates.id, candidateId), eq(systems.workspaceId, viewer.workspace.id)));
  if (!row) throw notFound("candidate");
  return row.c;
}

export async function removeCandidate(viewer: Viewer, candidateId: number) {
  const c = await ownCandidate(viewer, candidateId);
  const r = await db().delete(candidates).where(eq(candidates.id, c.id));
  return affected(r) === 1;
}

export async function adjustCandidate(viewer: Viewer, candidateId: number, adjustment: Adjustment) {
  const c = await ownCandidate(viewer, candidateId);
  await db().update(candidates).set({ adjustmentJson: JSON.stringify(v.parse(AdjustmentSchema, adjustment)) }).where(eq(candidates.id, c.id));
}

/**
 * The system with every candidate evaluated on it (the page's and the report's numbers). Refuses (409) when the stored
 * input does not pass the schema, unless `inputOverride` (the preview's unsaved inputs) replaces it.
 */
export async function systemWorkbench(viewer: Viewer, systemId: number, inputOverride?: SystemInput) {
  const system = inputOverride ? { ...(await systemRecord(viewer, systemId)), input: inputOverride } : await getSystem(viewer, systemId);
  return workbenchOf(viewer, system);
}

/**
 * The system page: the workbench when the stored input passes the schema; else `review` (its problems) and the stored
 * values as the editor can show them (`editorInput`), with nothing computed from them.
 */
export async function systemPage(viewer: Viewer, systemId: number) {
  const row = await systemRecord(viewer, systemId);
  const r = readStoredInput(row.inputJson);
  if (r.ok) {
    const bench = await workbenchOf(viewer, { ...row, input: r.input });
    return { system: bench.system, bench, review: null };
  }
  return { system: { ...row, input: editorInput(r.raw) }, bench: null, review: { count: r.problems.length, problems: r.problems.slice(0, MAX_PROBLEMS_LISTED) } };
}

async function workbenchOf(viewer: Viewer, system: Awaited<ReturnType<typeof systemRecord>> & { input: SystemInput }) {
  const { readable: cands, needsReview } = await listCandidates(viewer, system.id);
  const flowMax = flowMaxOf(system.input, candidatesFlowMax(cands));
  let evaluation: ReturnType<typeof evaluateSystem> | null = null;
  let systemError: string | null = null;
  try {
    evaluation = evaluateSystem(system.input, { flowMax });
  } catch (e) {
    systemError = e instanceof Error ? e.message : String(e);
  }
  const currency = await workspaceCurrency(viewer.workspace.id);
  const evaluated = cands.map((c) => {
    try {
      const result = evaluateCandidate(system.input, c.set, c.adjustment, { catalogue: catalogueOf(c.set), currency });
      return { ...c, result, energy: energyOf(system.input, { adjustment: c.adjustment, result }, c.purchasePriceCents), error: null as string | null };
    } catch (e) {
      return { ...c, result: null, energy: null as CandidateEnergy | null, error: e instanceof Error ? e.message : String(e) };
    }
  });
  return { system, evaluation, systemError, candidates: evaluated, needsReview, flowMax };
}

/** Duty-cycle energy and life-cycle cost of an evaluated candidate (app/lib/projects/energy.ts). */
function energyOf(input: SystemInput, c: Parameters<typeof candidateEnergy>[3], priceCents: number | null): CandidateEnergy | null {
  try {
    return candidateEnergy(input, systemSpec(input), fluidOf(input).density, c, priceCents);
  } catch {
    return null; // inputs the engine refuses: the candidate's own error already says why
  }
}

/** Sets or clears a candidate's purchase price (integer cents; null clears). */
export async function setCandidatePrice(viewer: Viewer, candidateId: number, cents: number | null) {
  const c = await ownCandidate(viewer, candidateId);
  await db().update(candidates).set({ purchasePriceCents: cents }).where(eq(candidates.id, c.id));
}

/** What the model publishes (for the verdict's catalogue rule). */
export const catalogueOf = (s: Pick<LibraryCurveSet, "impellerMin" | "impellerMax" | "ratedSpeed">) => ({
  impellerMin: s.impellerMin ?? null,
  impellerMax: s.impellerMax ?? null,
  ratedSpeed: s.ratedSpeed ?? null,
});
