// Which run of a posted editor form keeps a pipe table or size the catalogue does not list now (old data), and on which
// bore. The stored document decides (decision "storedattack": nothing posted marks a run as stored), by the table and size
// themselves, not by the run's place in the post (helper "formkeep"): the editor's run K is the stored run K on the page's
// own post, but a post whose runs moved — a run before it left out by a script, or removed and saved from another tab
// since the page was loaded — read the stored run K of another run, and refused the unchanged size ("Pick a size from this
// pipe table."). Each stored run gives its size to one posted run at most, so an unlisted size is never added to a system
// nor spread to a second run. Pure (the server and the browser's live reading).
import { sizeListed, storedSizeNote, type PipeRunInput } from "./system-input";
import { SHOWN_PRECISION } from "./run-ranges";

type FormLike = { get(name: string): FormDataEntryValue | null };

/**
 * The stored run each posted run on an unlisted table and size keeps them from, by form position (`run.N.`): first each at
 * its own position where the stored run there holds that very table and size (the page's post, as before), then each
 * left, in form order, to the first stored run not yet given that holds them. Runs ticked "remove on save" take none.
 * A posted run missing from the map is refused at its size as any unlisted size.
 */
export function storedSizesKept(f: FormLike, runCount: number, stored: readonly PipeRunInput[]): Map<number, PipeRunInput> {
  const posted: { at: number; table: string; nominal: string }[] = [];
  for (let i = 0; i < runCount; i++) {
    const p = `run.${i}.`;
    const table = (f.get(`${p}table`) ?? "").toString();
    const nominal = (f.get(`${p}nominal`) ?? "").toString();
    if (f.get(`${p}remove`) == null && table && nominal && !sizeListed(table, nominal)) posted.push({ at: i, table, nominal });
  }
  const holds = (k: number, p: (typeof posted)[number]) => !!stored[k] && stored[k].pipeTable === p.table && stored[k].nominal === p.nominal && !!storedSizeNote(stored[k]);
  const given = new Set<number>();
  const out = new Map<number, PipeRunInput>();
  const give = (p: (typeof posted)[number], k: number) => {
    out.set(p.at, stored[k]);
    given.add(k);
  };
  for (const p of posted) if (holds(p.at, p)) give(p, p.at);
  for (const p of posted) {
    if (out.has(p.at)) continue;
    const k = stored.findIndex((_, j) => !given.has(j) && holds(j, p));
    if (k >= 0) give(p, k);
  }
  return out;
}

/**
 * The bore of a run kept on a size the catalogue does not list now: the stored one (m, full precision, from the stored
 * document) where the inner diameter field still shows it to its five significant digits (system-form.ts `show`), else
 * the one typed.
 */
export function storedBoreOr(stored: number, typed: number | null): number | null {
  if (typed == null || !(stored > 0) || !Number.isFinite(stored)) return typed;
  return Math.abs(typed - stored) <= SHOWN_PRECISION * stored ? stored : typed;
}
