// The selection's JSON export is a documented shape (selection-export.server.ts `SELECTION_JSON_KEYS`): what the report
// shows, the frozen inputs and results, the cautions and the units — never the stored record spread out (it carried the
// project's, system's, library's, revision's and curve set's internal ids, and any key a stored document held), and nothing
// of another workspace. Over every demo selection (app/cli/seed.ts, seeded into the test database), and a selection frozen
// in an older shape with keys the export must not pass on. Real route module, guards and MariaDB.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq, inArray } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { selections, workspaces } from "@db/schema";
import { DEMO_WORKSPACES } from "~/cli/seed";
import { SELECTION_JSON_FORMAT, SELECTION_JSON_KEYS } from "~/lib/projects";
import * as selectionJson from "~/routes/selections.$id.export-json";
import { call, makeMember, makeWorkspace } from "./harness";
import { frozenFixture, storeSelection } from "./fieldcheck-fixture";

afterAll(() => closeDb());

/** Key names that are the record's bookkeeping, never the reader's: ids, who made it, workspaces, accounts. */
const INTERNAL = /^(id|.*Id|.*Ids|createdBy|updatedBy|userId|workspace.*|email|passwordHash|slug|plan|stripe.*)$/;

const FITTING_KIND = "system.input.runs[].fittings[].id";

/** Every key path of a JSON value ("pump.library.name"; array items as "[]"). */
function keyPaths(x: unknown, at = ""): string[] {
  if (Array.isArray(x)) return x.flatMap((y) => keyPaths(y, `${at}[]`));
  if (x && typeof x === "object") return Object.entries(x).flatMap(([k, y]) => [`${at}${at ? "." : ""}${k}`, ...keyPaths(y, `${at}${at ? "." : ""}${k}`)]);
  return [];
}

async function exported(id: number, cookie: string): Promise<Record<string, unknown>> {
  const r = await call(selectionJson.loader as never, { path: `/selections/${id}/export.json`, cookie, params: { id: String(id) } });
  expect(r.status, `selection ${id}`).toBe(200);
  return (typeof r.body === "string" ? JSON.parse(r.body) : r.body) as Record<string, unknown>;
}

function expectDocumented(body: Record<string, unknown>, what: string) {
  const sub = (o: unknown) => Object.keys((o ?? {}) as object);
  expect(Object.keys(body), what).toEqual([...SELECTION_JSON_KEYS.top]);
  expect(sub(body.project), what).toEqual([...SELECTION_JSON_KEYS.project]);
  expect(sub(body.system), what).toEqual([...SELECTION_JSON_KEYS.system]);
  expect(sub(body.pump), what).toEqual([...SELECTION_JSON_KEYS.pump]);
  expect(sub((body.pump as { library: unknown }).library), what).toEqual([...SELECTION_JSON_KEYS.library]);
  // A fitting's `id` is its kind in the engine's fittings table ("elbow-90-standard"), an input, not a record's id.
  const internal = keyPaths(body).filter((p) => p !== FITTING_KIND && INTERNAL.test(p.split(".").at(-1)!.replace(/\[\]$/, "")));
  const runs = ((body.system as { input: { runs?: { fittings?: { id: unknown }[] }[] } }).input.runs ?? []).flatMap((r) => r.fittings ?? []);
  for (const k of runs) expect(k.id, what).toMatch(/^[a-z0-9-]+$/);
  expect(internal, what).toEqual([]);
  expect(body.format).toBe(SELECTION_JSON_FORMAT);
  expect(body.caution).toMatch(/licensed engineer/);
  expect(body.units).toMatch(/^Numbers in SI/);
}

describe("every demo selection", () => {
  let demo: { id: number; workspaceId: number }[] = [];
  let others: { id: number; name: string; slug: string }[] = [];
  beforeAll(async () => {
    const slugs = DEMO_WORKSPACES.map((w) => w.slug);
    const ws = await db().select({ id: workspaces.id, name: workspaces.name, slug: workspaces.slug }).from(workspaces).where(inArray(workspaces.slug, slugs));
    others = ws;
    demo = await db().select({ id: selections.id, workspaceId: selections.workspaceId }).from(selections).where(inArray(selections.workspaceId, ws.map((w) => w.id)));
  });

  test("exports only the documented keys, no internal id, and no other workspace's name, slug or id", async () => {
    expect(demo.length).toBeGreaterThan(0); // the test database is seeded with the demo (db/cli.mjs)
    const cookies = new Map<number, string>();
    for (const s of demo) {
      if (!cookies.has(s.workspaceId)) cookies.set(s.workspaceId, (await makeMember("engineer", s.workspaceId)).cookie);
      const body = await exported(s.id, cookies.get(s.workspaceId)!);
      expectDocumented(body, `selection ${s.id}`);
      const text = JSON.stringify(body);
      for (const w of others.filter((w) => w.id !== s.workspaceId)) {
        expect(text, `selection ${s.id} names workspace ${w.slug}`).not.toContain(w.name);
        expect(text, `selection ${s.id} names workspace ${w.slug}`).not.toContain(`"${w.slug}"`);
      }
      expect(body.reference).toBe(`DM-${String(s.id).padStart(5, "0")}`);
    }
  });
});

describe("a selection frozen in an older shape, with keys the export must not pass on", () => {
  test("still exports, in the documented shape, the stray keys left out", async () => {
    const ws = await makeWorkspace();
    const m = await makeMember("engineer", ws.id);
    const f = frozenFixture();
    // Frozen before energy, currency and the library's revision were kept; and stray bookkeeping a stored document might hold.
    const { energy: _e, currency: _c, ...old } = f as typeof f & { energy?: unknown; currency?: unknown };
    const doc = { ...old, workspaceId: 987654321, createdBy: "someone", pump: { ...old.pump, library: { traced: null }, workspaceId: 987654321 } };
    const { selectionId } = await storeSelection(ws.id, m.userId, doc as never, "Old shape");
    const [row] = await db().select({ frozenJson: selections.frozenJson }).from(selections).where(eq(selections.id, selectionId));
    expect(JSON.parse(row.frozenJson)).toHaveProperty("workspaceId", 987654321); // stored as it was
    const body = await exported(selectionId, m.cookie);
    expectDocumented(body, "old shape");
    expect(body.energy).toBeNull();
    expect((body.pump as { library: unknown }).library).toEqual({ name: null, revision: null, traced: null });
    expect((body.project as { name: string }).name).toBe("Old shape project");
    expect(JSON.stringify(body)).not.toContain("987654321");
  });
});
