// Several candidates at once, from one search: the ticked rows of the search page (`<curveSetId>:<method>`)
// are read by `PicksSchema` and added by `addCandidates` in one transaction. A curve already on the
// system is skipped; one the viewer may not use (another workspace's library, a shared library the plan
// does not open) refuses the whole request before anything is written.
import { eq } from "drizzle-orm";
import { data } from "react-router";
import * as v from "valibot";
import { withTransaction } from "@db/client.server";
import { candidates, systems } from "@db/schema";
import { DEFAULT_ADJUSTMENT, type Adjustment } from "./hydraulics";
import { type Viewer } from "../libraries";
import { assertOpenCurveSets, getSystem, MAX_CANDIDATES, openCandidates } from "./projects.server";

/** At most this many ticked rows in one request (the search shows fewer; anything more is not a person ticking). */
export const MAX_PICKS = 20;

type Method = Adjustment["method"];
const METHODS: Record<string, Method> = { direct: "none", none: "none", trim: "trim", speed: "speed" };

/** One ticked row: `<curveSetId>:<direct|none|trim|speed>` → the curve set and the adjustment method. */
const Pick = v.pipe(
  v.string("Each ticked pump is an id and a method."),
  v.regex(/^\d{1,15}:(direct|none|trim|speed)$/, "Each ticked pump is an id and a method."),
  v.transform((x) => {
    const [id, method] = x.split(":");
    return { curveSetId: Number(id), method: METHODS[method] };
  }),
);

/** The `add` values of the search form: 1 to MAX_PICKS ticked rows. */
export const PicksSchema = v.pipe(
  v.array(v.unknown()),
  v.minLength(1, "Tick at least one pump."),
  v.maxLength(MAX_PICKS, `Tick at most ${MAX_PICKS} pumps at once.`),
  v.array(Pick),
);
export type Picks = v.InferOutput<typeof PicksSchema>;

export type AddManyResult = { ok: true; added: number; skipped: number } | { ok: false; reason: string };

/**
 * Adds the picked curves as candidates of a system, all or nothing: curves already on the system (or
 * ticked twice) are skipped, the rest are written in one transaction, and only if the system then has
 * at most MAX_CANDIDATES.
 */
export async function addCandidates(viewer: Viewer, systemId: number, picks: Picks): Promise<AddManyResult> {
  if (picks.length === 0 || picks.length > MAX_PICKS) throw data(`Tick between 1 and ${MAX_PICKS} pumps.`, { status: 400 });
  const s = await getSystem(viewer, systemId);
  await assertOpenCurveSets(viewer, [...new Set(picks.map((p) => p.curveSetId))]);
  return withTransaction(async (tx) => {
    await tx.select({ id: systems.id }).from(systems).where(eq(systems.id, s.id)).for("update");
    const existing = await tx.select({ curveSetId: candidates.curveSetId }).from(candidates).where(eq(candidates.systemId, s.id));
    const taken = new Set(existing.map((c) => c.curveSetId));
    const fresh: Picks = [];
    for (const p of picks) {
      if (taken.has(p.curveSetId)) continue;
      taken.add(p.curveSetId);
      fresh.push(p);
    }
    const skipped = picks.length - fresh.length;
    if (existing.length + fresh.length > MAX_CANDIDATES) {
      return { ok: false as const, reason: `At most ${MAX_CANDIDATES} candidates: the system has ${existing.length}, and ${fresh.length} more were ticked. Tick fewer or remove some first.` };
    }
    if (fresh.length) {
      await tx.insert(candidates).values(fresh.map((p) => ({ systemId: s.id, curveSetId: p.curveSetId, adjustmentJson: JSON.stringify({ ...DEFAULT_ADJUSTMENT, method: p.method }) })));
    }
    return { ok: true as const, added: fresh.length, skipped };
  });
}

/**
 * The curve sets on a system that its candidates list shows (the same rows and plan gate as `listCandidates`), in one
 * query and without reading their curves: the search page marks these rows and counts them. Nothing for a
 * system outside the viewer's workspace.
 */
export async function candidateSetIds(viewer: Viewer, systemId: number): Promise<number[]> {
  return (await openCandidates(viewer, systemId)).map((r) => r.c.curveSetId);
}
