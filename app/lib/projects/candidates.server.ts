// Several candidates at once, from one search: the ticked rows of the search page (`<curveSetId>:<method>`, and for
// pumps in parallel or series `:<parallel|series>:<duty pumps>:<standby pumps>`: the arrangement the row was judged in,
// stored as the candidate's adjustment, search-arrangement.ts) are read by `PicksSchema` and added by `addCandidates` in one transaction. A curve already on the
// system is skipped; one the viewer may not use (another workspace's library, a shared library the plan
// does not open) refuses the whole request before anything is written.
import { eq } from "drizzle-orm";
import { data } from "react-router";
import * as v from "valibot";
import { withTransaction } from "@db/client.server";
import { candidates, systems } from "@db/schema";
import { type Adjustment } from "./hydraulics";
import { arrangementAdjustment, pickArrangement, SEARCH_MAX_PUMPS, SEARCH_MIN_PUMPS, SINGLE_PUMP } from "./search-arrangement";
import { type Viewer } from "../libraries";
import { assertOpenCurveSets, getSystem, MAX_CANDIDATES, openCandidates } from "./projects.server";

/** At most this many ticked rows in one request (the search shows fewer; anything more is not a person ticking). */
export const MAX_PICKS = 20;

type Method = Adjustment["method"];
const METHODS: Record<string, Method> = { direct: "none", none: "none", trim: "trim", speed: "speed" };

const ARRANGEMENT = `A ticked pump's arrangement is parallel or series, ${SEARCH_MIN_PUMPS} to ${SEARCH_MAX_PUMPS} duty pumps and 0 to the duty pumps on standby (in parallel only).`;

/**
 * One ticked row: `<curveSetId>:<direct|none|trim|speed>[:<parallel|series>:<duty pumps>:<standby pumps>]` → the curve
 * set, the adjustment method and the arrangement (one pump without it).
 */
const Pick = v.pipe(
  v.string("Each ticked pump is an id and a method."),
  v.regex(/^\d{1,15}:(direct|none|trim|speed)(:[a-z]{1,10}:\d{1,2}:\d{1,2})?$/, "Each ticked pump is an id and a method."),
  v.check((x) => x.split(":").length === 2 || typeof pickArrangement(...(x.split(":").slice(2) as [string, string, string])) !== "string", ARRANGEMENT),
  v.transform((x) => {
    const [id, method, ...arr] = x.split(":");
    const a = arr.length ? pickArrangement(arr[0], arr[1], arr[2]) : SINGLE_PUMP;
    return { curveSetId: Number(id), method: METHODS[method], arrangement: typeof a === "string" ? SINGLE_PUMP : a };
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
      await tx.insert(candidates).values(fresh.map((p) => ({ systemId: s.id, curveSetId: p.curveSetId, adjustmentJson: JSON.stringify(arrangementAdjustment(p.method, p.arrangement)) })));
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
