// The body of POST /api/v1/systems/:id/preview read as the editor's own input (helper "formedge"). Pure.
// The entry rules (`SystemInputEntrySchema`), then the catalogue: a run names a pipe table and size the catalogue lists,
// on the table's bore — or none, for a typed inner diameter — as the editor's form only ever sends; a table or size the
// catalogue no longer lists is taken where a run of the stored system is stored with it (the editor keeps such a run,
// system-form.ts `readSystemForm`, decision "storedattack"). Each refusal names its field as a JSON pointer (RFC 6901)
// and as the dot path the route always gave; one per field, at most PREVIEW_ERRORS_LISTED of them.
import * as v from "valibot";
import { FITTINGS, MATERIALS, PIPE_TABLES } from "~/engine";
import { LIMIT_ROUNDING, qtPair } from "~/engine/quantityText";
import { MAX_RUNS, storedSizeNote, SystemInputEntrySchema, type PipeRunInput, type SystemInput } from "./system-input";
import { previewMessage } from "./preview-words";

/** Most refusals listed in one answer (the calculators' MAX_ERRORS): 40 broken runs give hundreds. */
export const PREVIEW_ERRORS_LISTED = 25;

export type PreviewProblem = { field: string; pointer: string; message: string };
export type PreviewRead = { ok: true; input: SystemInput } | { ok: false; errors: PreviewProblem[]; count: number };

/** RFC 6901: a path of keys as a JSON pointer ("~" → "~0", "/" → "~1"). */
export const jsonPointer = (path: readonly (string | number)[]) => path.map((k) => `/${String(k).replace(/~/g, "~0").replace(/\//g, "~1")}`).join("");

const problem = (path: readonly (string | number)[], message: string): PreviewProblem => ({ field: path.join("."), pointer: jsonPointer(path), message });

const BodySchema = v.object({ input: SystemInputEntrySchema }, "The body must be a JSON object: { input: {…} }.");

const TABLE_IDS = PIPE_TABLES.map((t) => t.id).join(", ");
const MATERIAL_IDS = MATERIALS.map((m) => m.id).join(", ");
const FITTING_IDS = FITTINGS.map((f) => f.id).join(", ");
const sizesOf = (t: (typeof PIPE_TABLES)[number]) => t.sizes.map((s) => s.nominal).join(", ");

/**
 * What is wrong with the runs' catalogue sizes, each at its field: a table without a size or a size without a table; a table
 * or size the catalogue does not list, unless a run of the stored system (`stored`, as the editor shows it) is stored with
 * that very table and size; a listed size on a bore other than the table's (the editor takes the table's); a material or
 * fitting the catalogue does not have (the editor offers only the catalogue's; the engine stopped at an unknown fitting).
 */
export function catalogueProblems(runs: readonly PipeRunInput[], stored: readonly PipeRunInput[]): PreviewProblem[] {
  // Stored runs on a table or size the catalogue does not list: by table and size, wherever the run sits now (a run ticked
  // "remove on save" before it moves it up one place in the editor's input).
  const kept = new Set(stored.filter((r) => storedSizeNote(r)).map((r) => JSON.stringify([r.pipeTable, r.nominal])));
  const out: PreviewProblem[] = [];
  runs.forEach((r, i) => {
    const at = (key: string, message: string) => out.push(problem(["input", "runs", i, key], message));
    if (!MATERIALS.some((m) => m.id === r.material)) at("material", `The catalogue has no material ${JSON.stringify(r.material)}: its materials are ${MATERIAL_IDS}.`);
    r.fittings.forEach((f, k) => {
      if (!FITTINGS.some((x) => x.id === f.id)) out.push(problem(["input", "runs", i, "fittings", k, "id"], `The catalogue has no fitting ${JSON.stringify(f.id)}: its fittings are ${FITTING_IDS}.`));
    });
    if (!r.pipeTable && !r.nominal) return; // a typed inner diameter
    const table = PIPE_TABLES.find((t) => t.id === r.pipeTable);
    if (!r.pipeTable) return at("pipeTable", `A size needs its pipe table (one of ${TABLE_IDS}); or send "" as nominal for a typed inner diameter.`);
    if (!r.nominal && table) return at("nominal", `A pipe table needs its size: ${table.name} lists ${sizesOf(table)}; or send "" as pipeTable for a typed inner diameter.`);
    if (kept.has(JSON.stringify([r.pipeTable, r.nominal]))) return;
    if (!table) return at("pipeTable", `The catalogue has no pipe table ${JSON.stringify(r.pipeTable)}: its tables are ${TABLE_IDS}; or send "" with "" as nominal for a typed inner diameter.`);
    const size = table.sizes.find((s) => s.nominal === r.nominal);
    if (!size) return at("nominal", `${table.name} lists no size ${JSON.stringify(r.nominal)}: its sizes are ${sizesOf(table)}.`);
    if (Math.abs(size.innerDiameter - r.diameter) > LIMIT_ROUNDING * size.innerDiameter) { // as system-input.ts: further off, the bores print apart
      const [sent, own] = qtPair("diameter", r.diameter, size.innerDiameter);
      at("diameter", `${table.name} ${size.nominal} has an inner diameter of ${own} in the catalogue, not ${sent}: send the table's bore (the editor takes it), or "" as pipeTable and nominal for a typed inner diameter.`);
    }
  });
  return out;
}

/**
 * The preview's body against the entry rules and the catalogue: the input, or its problems (one per field, in the order
 * found; at most PREVIEW_ERRORS_LISTED, `count` all of them). More runs than MAX_RUNS are refused before any run is read.
 */
export function readPreviewBody(body: unknown, stored: readonly PipeRunInput[]): PreviewRead {
  const runs = (body as { input?: { runs?: unknown } } | null)?.input?.runs;
  if (Array.isArray(runs) && runs.length > MAX_RUNS) return { ok: false, errors: [problem(["input", "runs"], `At most ${MAX_RUNS} pipe runs.`)], count: 1 };
  const parsed = v.safeParse(BodySchema, body);
  let found: PreviewProblem[];
  if (parsed.success) {
    found = catalogueProblems(parsed.output.input.runs, stored);
    if (found.length === 0) return { ok: true, input: parsed.output.input };
  } else {
    const seen = new Map<string, PreviewProblem>();
    for (const i of parsed.issues) {
      const path = (i.path ?? []).map((x) => x.key as string | number);
      const p = problem(path, previewMessage(i, path)); // valibot's wording in plain words, ranges as the editor's (preview-words.ts)
      if (!seen.has(p.pointer)) seen.set(p.pointer, p);
    }
    found = [...seen.values()];
  }
  return { ok: false, errors: found.slice(0, PREVIEW_ERRORS_LISTED), count: found.length };
}
