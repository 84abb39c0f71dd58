// A crafted post against the stored-size rule (decision "oldedge", "storedattack"): the editor keeps a run on a pipe table or
// size the catalogue does not list now only where the system's stored document holds that table and size, on one run each
// (the run at its own position first; helper "formkeep": by the size, not the position — stored-size-moved.test.ts), on its
// stored bore unless one was typed over it. The server decides from the stored document, never from fields the page
// posts: made-up tables and sizes, another run's stored size, 10 kB strings, control characters and odd bores are refused
// at the field as any unlisted size ("Pick a size from this pipe table."), never a 5xx, never stored. Through the route's
// action (harness `call`) and through the root middleware (route-table `send`, `wrongAnswer`).
// Check values: the engine's catalogue (pipes.ts: Steel, Schedule 40 lists 1/2 to 24, no "30"; 4 at 102.26 mm; no table
// "steel-sch30"); bores invented (0.7 m, 0.1023 m).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { systems } from "@db/schema";
import type { Viewer } from "~/lib/libraries";
import { createSystem } from "~/lib/projects";
import { tableRun, type PipeRunInput, type SystemInput } from "~/lib/projects/hydraulics";
import { systemFormValues } from "~/lib/projects/system-form";
import { boosterInput, demoProjectFixture } from "~/lib/projects/test-kit";
import { SI_UNITS } from "~/lib/shared/units";
import * as systemPage from "~/routes/systems.$id";
import { call, type TestMember } from "./harness";
import { send, wrongAnswer } from "./route-table";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
let projectId = 0;
beforeAll(async () => void ({ m, v, projectId } = await demoProjectFixture("Stored size attack pumps", "Stored size attack")));

const listed = tableRun("discharge", "Listed main", "steel-sch40", "4", "steel", 120);
const unlisted: PipeRunInput = { ...tableRun("discharge", "Old main", "steel-sch40", "4", "steel", 120), nominal: "30", diameter: 0.7 };
const gone: PipeRunInput = { ...tableRun("discharge", "Gone main", "steel-sch40", "4", "steel", 120), pipeTable: "steel-sch30", diameter: 0.1023 };

async function stored(systemId: number): Promise<string> {
  const [row] = await db().select().from(systems).where(eq(systems.id, systemId));
  return row.inputJson;
}

/** The editor's form for `input` as the page posts it unchanged, with the hidden stored marks the page used to post. */
function pageForm(input: SystemInput): Record<string, string> {
  const f = systemFormValues(input, SI_UNITS);
  const out: Record<string, string> = {
    intent: "save", name: "Attacked", fluidKind: "water", temperature: f.temperature, mode: f.mode, staticLow: f.staticLow, staticHigh: f.staticHigh,
    suctionSurfacePressure: f.suctionSurfacePressure, suctionStaticHead: f.suctionStaticHead, dutyFlow: f.dutyFlow, dutyHead: f.dutyHead,
    npshMargin: f.npshMargin, runCount: String(f.runs.length),
  };
  f.runs.forEach((r, i) => {
    const p = `run.${i}.`;
    Object.assign(out, { [`${p}side`]: r.side, [`${p}name`]: r.name, [`${p}table`]: r.table, [`${p}nominal`]: r.nominal, [`${p}diameter`]: r.diameter, [`${p}length`]: r.length, [`${p}material`]: r.material, [`${p}materialShown`]: r.materialShown });
    // The marks the page posted before (decision "oldedge"): an attacker may still send them; they decide nothing now.
    if (r.stored) Object.assign(out, { [`${p}storedTable`]: r.stored.table, [`${p}storedNominal`]: r.stored.nominal, [`${p}storedBore`]: String(input.runs[i].diameter) });
  });
  return out;
}

const save = (systemId: number, form: Record<string, string>) => call(systemPage.action as never, { path: `/systems/${systemId}`, params: { id: String(systemId) }, cookie: m.cookie, form });
const errorsOf = (body: unknown) => (body as { errors: Record<string, string> }).errors;
const REFUSED = "Pick a size from this pipe table.";

describe("the stored document decides, not the posted marks", () => {
  test("a made-up table and size with the hidden marks that name them: refused, nothing stored (was: kept, 'made-up' stored with the bore posted)", async () => {
    const id = await createSystem(v, projectId, "Listed only", { ...boosterInput(), runs: [listed] });
    const before = await stored(id);
    for (const [table, nominal, bore] of [["made-up", "X", "0.5"], ["steel-sch40", "30", "0.7"], ["steel-sch30", "4", "0.1023"]]) {
      const form = { ...pageForm({ ...boosterInput(), runs: [listed] }), "run.0.table": table, "run.0.nominal": nominal, "run.0.diameter": String(+bore * 1000), "run.0.storedTable": table, "run.0.storedNominal": nominal, "run.0.storedBore": bore };
      const a = await save(id, form);
      expect(a.status, `${table} ${nominal}`).toBe(400); // a field refused: 400, the page with its errors
      expect(errorsOf(a.body), `${table} ${nominal}`).toEqual({ "run.0.nominal": REFUSED });
      expect(await stored(id)).toBe(before);
    }
  });

  test("another run's stored size posted on this run: refused (was: kept on the listed run)", async () => {
    const input = { ...boosterInput(), runs: [unlisted, listed] };
    const id = await createSystem(v, projectId, "Two runs", input);
    const before = await stored(id);
    const form = { ...pageForm(input), "run.1.table": "steel-sch40", "run.1.nominal": "30", "run.1.diameter": "700", "run.1.storedTable": "steel-sch40", "run.1.storedNominal": "30", "run.1.storedBore": "0.7" };
    const a = await save(id, form);
    expect(errorsOf(a.body)).toEqual({ "run.1.nominal": REFUSED });
    expect(await stored(id)).toBe(before);
  });

  test.each([
    ["an unlisted size", unlisted],
    ["a table gone from the catalogue", gone],
  ])("%s as stored: kept, the stored bore to the last digit, whatever the marks say or without them", async (_, run) => {
    const input = { ...boosterInput(), runs: [run] };
    const id = await createSystem(v, projectId, `Kept ${run.pipeTable} ${run.nominal}`, input);
    const page = pageForm(input);
    const markless = Object.fromEntries(Object.entries(page).filter(([k]) => !/\.stored/.test(k)));
    for (const marks of <Record<string, string>[]>[{}, { "run.0.storedBore": "NaN" }, { "run.0.storedBore": "Infinity" }, { "run.0.storedBore": "1e400" }, { "run.0.storedBore": "-0.7" }, { "run.0.storedBore": String(run.diameter * 1.00005) }, { "run.0.storedTable": "x", "run.0.storedNominal": "y" }]) {
      const a = await save(id, { ...markless, ...marks });
      expect(errorsOf(a.body), JSON.stringify(marks)).toEqual({});
      const r = (JSON.parse(await stored(id)) as SystemInput).runs[0];
      expect({ t: r.pipeTable, n: r.nominal, d: r.diameter }, JSON.stringify(marks)).toEqual({ t: run.pipeTable, n: run.nominal, d: run.diameter });
    }
    // A bore typed over the stored one is kept with the stored size.
    const a = await save(id, { ...page, "run.0.diameter": "650" });
    expect(errorsOf(a.body)).toEqual({});
    expect((JSON.parse(await stored(id)) as SystemInput).runs[0]).toMatchObject({ pipeTable: run.pipeTable, nominal: run.nominal, diameter: 0.65 });
  });

  test("a storedBore alone, on a listed size or a typed bore: no effect (the table's or the typed bore is stored)", async () => {
    const input = { ...boosterInput(), runs: [listed] };
    const id = await createSystem(v, projectId, "Bore alone", input);
    await save(id, { ...pageForm(input), "run.0.storedBore": "0.5" });
    expect((JSON.parse(await stored(id)) as SystemInput).runs[0].diameter).toBe(listed.diameter);
    await save(id, { ...pageForm(input), "run.0.table": "", "run.0.nominal": "", "run.0.diameter": "100", "run.0.storedBore": "0.5" });
    expect((JSON.parse(await stored(id)) as SystemInput).runs[0]).toMatchObject({ pipeTable: "", nominal: "", diameter: 0.1 });
  });
});

describe("hostile values in the table, size and marks, through the root middleware: a refusal at the field, never a 5xx, never stored", () => {
  const K10 = "x".repeat(10 * 1024);
  const CTRL = "steel-sch40\u0000\u0007\u001b[2J\r\n";
  const HOSTILE: [string, Record<string, string>][] = [
    ["10 kB table and size, marks the same", { "run.0.table": K10, "run.0.nominal": K10, "run.0.storedTable": K10, "run.0.storedNominal": K10, "run.0.storedBore": "0.7" }],
    ["10 kB marks only", { "run.0.storedTable": K10, "run.0.storedNominal": K10, "run.0.storedBore": K10 }],
    ["control characters in the table, marks the same", { "run.0.table": CTRL, "run.0.nominal": "30", "run.0.storedTable": CTRL, "run.0.storedNominal": "30", "run.0.storedBore": "0.7" }],
    ["control characters in the size, marks the same", { "run.0.table": "steel-sch40", "run.0.nominal": "30\u0000", "run.0.storedTable": "steel-sch40", "run.0.storedNominal": "30\u0000", "run.0.storedBore": "0.7" }],
    ["a stored size nearly equal (trailing space)", { "run.0.table": "steel-sch40", "run.0.nominal": "30 ", "run.0.storedTable": "steel-sch40", "run.0.storedNominal": "30 ", "run.0.storedBore": "0.7" }],
    ...["NaN", "Infinity", "-Infinity", "1e400", "-0.7", "0", "0x1", ""].map((b): [string, Record<string, string>] => [`storedBore "${b}" with a made-up size`, { "run.0.table": "steel-sch40", "run.0.nominal": "31", "run.0.diameter": "700", "run.0.storedTable": "steel-sch40", "run.0.storedNominal": "31", "run.0.storedBore": b }]),
  ];
  test.each(HOSTILE)("%s", async (_, fields) => {
    const input = { ...boosterInput(), runs: [unlisted] };
    const id = await createSystem(v, projectId, "Hostile", input);
    const before = await stored(id);
    const body = new URLSearchParams({ ...pageForm(input), ...fields }).toString();
    const a = await send({ path: "systems/:id", file: "routes/systems.$id.tsx" }, { who: "owner", cookie: m.cookie, headers: { "content-type": "application/x-www-form-urlencoded" } }, { params: { id: String(id) }, method: "POST", body });
    expect(wrongAnswer(a, { api: false, refusal: false })).toBeNull();
    // The table and size posted are not the stored run's (30 on Schedule 40, at 0.7 m): refused at the size field.
    if ("run.0.table" in fields) {
      expect(JSON.parse(a.text).errors["run.0.nominal"]).toBe(REFUSED);
      expect(await stored(id)).toBe(before);
    }
    // Whatever the marks said, the run is the stored one.
    const r = (JSON.parse(await stored(id)) as SystemInput).runs[0];
    expect({ t: r.pipeTable, n: r.nominal, d: r.diameter }).toEqual({ t: unlisted.pipeTable, n: unlisted.nominal, d: unlisted.diameter });
  });
});
