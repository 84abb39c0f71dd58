// A stored run on a size the catalogue does not list now, posted back after a run before it was removed (helper
// "formkeep"). The editor matched such a run to the stored document by its place in the post (`run.N.` against the stored
// run N): the page's own post (the removed run ticked "remove on save", so its run keeps its number) went through, but a
// post with the first run left out — a script sending the runs it keeps, or a page loaded before another tab removed that
// run and saved — read the stored run N of another run and refused the unchanged size ("Pick a size from this pipe
// table."). Now the table and size themselves are matched to the stored runs (stored-sizes.ts), one stored run to one
// posted run at most, so the size never spreads to a second run. Through the route's action against MariaDB.
// Check values: the engine's catalogue (pipes.ts: Steel, Schedule 40 lists 1/2 to 24 — no "30" —, 4 at 102.26 mm);
// bores invented (0.7 m).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { systems } from "@db/schema";
import type { Viewer } from "~/lib/libraries";
import { createProject, createSystem } from "~/lib/projects";
import { tableRun, type PipeRunInput, type SystemInput } from "~/lib/projects/hydraulics";
import { boosterInput, viewerOfUser } from "~/lib/projects/test-kit";
import * as systemPage from "~/routes/systems.$id";
import { editorPost } from "./editor-post";
import { call, makeMember, type TestMember } from "./harness";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
let projectId = 0;
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  projectId = await createProject(v, { name: "Stored size moved", site: "", description: "" });
});

const listed = tableRun("discharge", "Listed main", "steel-sch40", "4", "steel", 120);
const unlisted: PipeRunInput = { ...tableRun("discharge", "Old main", "steel-sch40", "4", "steel", 80), nominal: "30", diameter: 0.7 };
const REFUSED = "Pick a size from this pipe table.";

async function storedRunsOf(id: number): Promise<PipeRunInput[]> {
  const [row] = await db().select().from(systems).where(eq(systems.id, id));
  return (JSON.parse(row.inputJson) as SystemInput).runs;
}

/** The editor's form for `runs` as the page posts them unchanged, numbered from 0 in the order given. */
const pageForm = (runs: PipeRunInput[]): Record<string, string> => editorPost({ ...boosterInput(), runs }, "Moved");

const save = (id: number, form: Record<string, string>) => call(systemPage.action as never, { path: `/systems/${id}`, params: { id: String(id) }, cookie: m.cookie, form });
const errorsOf = (a: { body: unknown }) => (a.body as { errors: Record<string, string> }).errors;
const sizes = (runs: PipeRunInput[]) => runs.map((r) => [r.name, r.pipeTable, r.nominal, r.diameter]);

describe("two runs, the second on a size the catalogue does not list; the first removed", () => {
  test("control: the page's own post, the first ticked “remove on save” — kept (worked before too)", async () => {
    const id = await createSystem(v, projectId, "Remove ticked", { ...boosterInput(), runs: [listed, unlisted] });
    const a = await save(id, { ...pageForm([listed, unlisted]), "run.0.remove": "on" });
    expect(errorsOf(a)).toEqual({});
    expect(sizes(await storedRunsOf(id))).toEqual([["Old main", "steel-sch40", "30", 0.7]]);
  });

  test("a post that leaves the first run out (a script): the second keeps its size and bore, no refusal (was “Pick a size…” at run.0)", async () => {
    const id = await createSystem(v, projectId, "Left out", { ...boosterInput(), runs: [listed, unlisted] });
    const a = await save(id, pageForm([unlisted]));
    expect(errorsOf(a)).toEqual({});
    expect(sizes(await storedRunsOf(id))).toEqual([["Old main", "steel-sch40", "30", 0.7]]);
  });

  test("a page loaded before another tab removed the first run: its post keeps the size (was “Pick a size…” at run.1)", async () => {
    const id = await createSystem(v, projectId, "Other tab", { ...boosterInput(), runs: [listed, unlisted] });
    const stale = pageForm([listed, unlisted]);
    expect(errorsOf(await save(id, { ...stale, "run.0.remove": "on" }))).toEqual({}); // the other tab's save
    const a = await save(id, stale); // the first run posted again, the second where it was
    expect(errorsOf(a)).toEqual({});
    expect(sizes(await storedRunsOf(id))).toEqual([["Listed main", "steel-sch40", "4", listed.diameter], ["Old main", "steel-sch40", "30", 0.7]]);
  });

  test("the size is kept on one run only: posted on both runs where one is stored with it, the second is refused, nothing saved", async () => {
    const id = await createSystem(v, projectId, "Spread", { ...boosterInput(), runs: [unlisted] });
    const before = await storedRunsOf(id);
    const a = await save(id, pageForm([unlisted, { ...unlisted, name: "Copy" }]));
    expect(errorsOf(a)).toEqual({ "run.1.nominal": REFUSED });
    expect(await storedRunsOf(id)).toEqual(before);
    // Posted on the listed run's place too: the run at the stored run's own place keeps it, the other is refused.
    const id2 = await createSystem(v, projectId, "Spread after", { ...boosterInput(), runs: [listed, unlisted] });
    expect(errorsOf(await save(id2, pageForm([unlisted, unlisted])))).toEqual({ "run.0.nominal": REFUSED });
  });
});
