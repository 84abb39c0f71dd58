// POST /api/v1/systems/:id/preview attacked by a caller who does not own the data (helper "formedge"). The preview stores
// nothing but computes on what it is sent: a pipe table or size the catalogue does not list was computed as if real (200),
// a listed size on another bore too, a bore of 1e-9 m as well. Now it refuses them with problem+json naming the field as a
// JSON pointer (and as the dot path the route always gave), a size with the sizes its table lists; it still takes all
// the editor sends — a run stored on a table or size the catalogue no longer lists, posted back as the editor reads it
// (system-form.ts `readSystemForm` against the stored runs, decision "storedattack"), also after a run before it is
// removed. Every answer is small: 10 000 broken runs gave an 11 MB list of errors. Check values: the engine's catalogue
// (pipes.ts: Steel, Schedule 40 lists 1/2 to 24, 4 at 102.26 mm, no "7" or "DN100"; pipesDN.ts: EN 10255 medium DN6,
// 6.2 mm, the smallest bore of every table); our rules (system-input.ts: at most 40 runs, 1000 km, strings of 40 and 20).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createProject, createSystem } from "~/lib/projects";
import { newRun, tableRun, type PipeRunInput, type SystemInput } from "~/lib/projects/hydraulics";
import { readSystemForm, systemFormValues } from "~/lib/projects/system-form";
import { boosterInput, viewerOfUser } from "~/lib/projects/test-kit";
import { SI_UNITS } from "~/lib/shared/units";
import { PIPE_TABLES } from "~/engine";
import * as apiPreview from "~/routes/api.v1.systems.$id.preview";
import { call, makeMember } from "./harness";

afterAll(() => closeDb());

const unlisted: PipeRunInput = { ...tableRun("discharge", "Old main", "steel-sch40", "4", "steel", 120), nominal: "30", diameter: 0.7 };
const gone: PipeRunInput = { ...tableRun("discharge", "Gone main", "steel-sch40", "4", "steel", 120), pipeTable: "steel-sch30", diameter: 0.1023 };
const oldSystem = (): SystemInput => ({ ...boosterInput(), runs: [newRun("suction", "Suction"), unlisted, gone] });

let token = "";
let plainId = 0;
let oldId = 0;
let otherId = 0;
beforeAll(async () => {
  const m = await makeMember("admin");
  const o = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  const vo = await viewerOfUser(o.userId);
  const p = await createProject(v, { name: "Preview attack", site: "", description: "" });
  plainId = await createSystem(v, p, "Plain", boosterInput());
  oldId = await createSystem(v, p, "Old sizes", oldSystem());
  // Another workspace's system, stored with the same unlisted sizes: its runs must not open them to this caller.
  otherId = await createSystem(vo, await createProject(vo, { name: "Theirs", site: "", description: "" }), "Theirs", oldSystem());
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
});

const postRaw = (id: string, body: string) =>
  call(apiPreview.action as never, { path: `/api/v1/systems/${id}/preview`, params: { id }, method: "POST", headers: { authorization: `Bearer ${token}`, "content-type": "application/json" }, body });
const post = (input: unknown, id = plainId) => postRaw(String(id), JSON.stringify({ input }));
type Err = { field: string; pointer: string; message: string };
const errorsOf = (r: { body: unknown }) => (r.body as { errors: Err[] }).errors;
const withRun = (over: Record<string, unknown>, base = boosterInput()) => ({ ...base, runs: [{ ...base.runs[0], ...over }, ...base.runs.slice(1)] });
const SCH40 = PIPE_TABLES.find((t) => t.id === "steel-sch40")!;

describe("a table or size the catalogue does not list", () => {
  test("an unknown table → 400 at /input/runs/0/pipeTable, listing the tables (was 200, computed)", async () => {
    const r = await post(withRun({ pipeTable: "made-up", nominal: "4", diameter: 0.1 }));
    expect(r.status).toBe(400);
    expect(r.headers.get("content-type")).toBe("application/problem+json");
    expect(errorsOf(r)).toEqual([{ field: "input.runs.0.pipeTable", pointer: "/input/runs/0/pipeTable", message: expect.stringMatching(/^The catalogue has no pipe table "made-up": its tables are steel-sch40, steel-sch80, .*iso4427-pe100-sdr17, en545-ductile; or send "" with "" as nominal for a typed inner diameter\.$/) }]);
  });
  test("a size its table does not list, or another table's size → 400 at …/nominal with the table's sizes (was 200)", async () => {
    for (const nominal of ["7", "DN100", "4 ", "x".repeat(20)]) {
      const r = await post(withRun({ pipeTable: "steel-sch40", nominal, diameter: 0.1 }));
      expect(r.status, nominal).toBe(400);
      expect(errorsOf(r), nominal).toEqual([{ field: "input.runs.0.nominal", pointer: "/input/runs/0/nominal", message: `Steel, Schedule 40 lists no size ${JSON.stringify(nominal)}: its sizes are ${SCH40.sizes.map((s) => s.nominal).join(", ")}.` }]);
    }
  });
  test("a table without a size, or a size without a table → 400 at the empty one (the editor sends both or neither)", async () => {
    expect(errorsOf(await post(withRun({ pipeTable: "steel-sch40", nominal: "" })))).toEqual([{ field: "input.runs.0.nominal", pointer: "/input/runs/0/nominal", message: expect.stringMatching(/^A pipe table needs its size: Steel, Schedule 40 lists 1\/2, 3\/4, .*, 24; or send "" as pipeTable for a typed inner diameter\.$/) }]);
    expect(errorsOf(await post(withRun({ pipeTable: "", nominal: "4" })))).toEqual([{ field: "input.runs.0.pipeTable", pointer: "/input/runs/0/pipeTable", message: expect.stringMatching(/^A size needs its pipe table \(one of steel-sch40, .*\); or send "" as nominal for a typed inner diameter\.$/) }]);
  });
  test("a listed size on a bore not the table's → 400 at …/diameter with the table's bore (was 200, computed on the bore sent)", async () => {
    const r = await post(withRun({ pipeTable: "steel-sch40", nominal: "4", diameter: 0.5 }));
    expect(errorsOf(r)).toEqual([{ field: "input.runs.0.diameter", pointer: "/input/runs/0/diameter", message: "Steel, Schedule 40 4 has an inner diameter of 102 mm in the catalogue, not 500 mm: send the table's bore (the editor takes it), or \"\" as pipeTable and nominal for a typed inner diameter." }]);
    // Control: the table's own bore, and a typed bore with neither, are taken.
    expect((await post(withRun({ pipeTable: "steel-sch40", nominal: "4", diameter: SCH40.sizes.find((s) => s.nominal === "4")!.innerDiameter }))).status).toBe(200);
    expect((await post(withRun({ pipeTable: "", nominal: "", diameter: 0.5 }))).status).toBe(200);
  });
  test("a material or fitting the catalogue does not have → 400 at its field (was 200: computed, or the engine's error as the result)", async () => {
    const r = await post(withRun({ material: "unobtainium", fittings: [{ id: "gate-valve-open", count: 1 }, { id: "nope", count: 2 }] }));
    expect(errorsOf(r)).toEqual([
      { field: "input.runs.0.material", pointer: "/input/runs/0/material", message: expect.stringMatching(/^The catalogue has no material "unobtainium": its materials are steel, /) },
      { field: "input.runs.0.fittings.1.id", pointer: "/input/runs/0/fittings/1/id", message: expect.stringMatching(/^The catalogue has no fitting "nope": its fittings are elbow-90-standard, .*, exit\.$/) },
    ]);
  });
  test("every table's first and last size as the editor reads them is taken", async () => {
    for (const t of PIPE_TABLES) {
      for (const s of [t.sizes[0], t.sizes[t.sizes.length - 1]]) {
        const r = await post(withRun(tableRun("suction", "S", t.id, s.nominal, t.material, 5)));
        expect(r.status, `${t.id} ${s.nominal}`).toBe(200);
      }
    }
  });
});

describe("what the editor sends for a system stored on sizes the catalogue no longer lists", () => {
  const form = (input: SystemInput, extra: Record<string, string> = {}) => {
    const f = systemFormValues(input, SI_UNITS);
    const out: Record<string, string> = { name: "Old", fluidKind: "water", temperature: f.temperature, mode: f.mode, staticLow: f.staticLow, staticHigh: f.staticHigh, suctionSurfacePressure: f.suctionSurfacePressure, suctionStaticHead: f.suctionStaticHead, dutyFlow: f.dutyFlow, dutyHead: f.dutyHead, npshMargin: f.npshMargin, runCount: String(f.runs.length) };
    f.runs.forEach((r, i) => Object.assign(out, { [`run.${i}.side`]: r.side, [`run.${i}.name`]: r.name, [`run.${i}.table`]: r.table, [`run.${i}.nominal`]: r.nominal, [`run.${i}.diameter`]: r.diameter, [`run.${i}.length`]: r.length, [`run.${i}.material`]: r.material, [`run.${i}.materialShown`]: r.materialShown }));
    const m = new Map(Object.entries({ ...out, ...extra }));
    const read = readSystemForm({ get: (k) => m.get(k) ?? null }, SI_UNITS, input);
    expect(read.errors).toEqual({});
    return read.input!;
  };
  test("unchanged, on another bore, and with the run before them removed: all taken (the editor's live preview)", async () => {
    expect((await post(form(oldSystem()), oldId)).status).toBe(200);
    expect((await post(form(oldSystem(), { "run.1.diameter": "650" }), oldId)).status).toBe(200);
    const removed = form(oldSystem(), { "run.0.remove": "on" });
    expect(removed.runs.map((x) => x.nominal)).toEqual(["30", "4"]); // the stored sizes moved up one place
    expect((await post(removed, oldId)).status).toBe(200);
  });
  test("the same sizes on a system not stored with them, or on another workspace's system that is: refused / 404", async () => {
    const input = form(oldSystem());
    const r = await post(input, plainId);
    expect(r.status).toBe(400);
    expect(errorsOf(r).map((e) => e.pointer)).toEqual(["/input/runs/1/nominal", "/input/runs/2/pipeTable"]);
    const theirs = await post(input, otherId);
    expect(theirs.status).toBe(404);
    expect(JSON.stringify(theirs.body)).not.toMatch(/steel|Theirs|nominal/);
  });
});

describe("shapes and sizes a caller may send", () => {
  test("10 kB strings and numbers where text belongs: one message per field, naming it and its limit (was valibot's words)", async () => {
    const long = errorsOf(await post(withRun({ pipeTable: "x".repeat(10240), nominal: "y".repeat(10240), name: "z".repeat(10240) })));
    expect(long).toEqual([
      { field: "input.runs.0.name", pointer: "/input/runs/0/name", message: "A run's name is text of at most 80 characters." },
      { field: "input.runs.0.pipeTable", pointer: "/input/runs/0/pipeTable", message: "Pipe table is text of at most 40 characters: a table of the catalogue, or \"\" for a typed inner diameter." },
      { field: "input.runs.0.nominal", pointer: "/input/runs/0/nominal", message: "Nominal size is text of at most 20 characters: a size of the pipe table, or \"\" for a typed inner diameter." },
    ]);
    const typed = errorsOf(await post(withRun({ pipeTable: 5, nominal: 4, material: [] })));
    expect(typed.map((e) => [e.pointer, e.message.split(" is text")[0]])).toEqual([["/input/runs/0/pipeTable", "Pipe table"], ["/input/runs/0/nominal", "Nominal size"], ["/input/runs/0/material", "Material"]]);
  });
  test("lengths of 1e400 (Infinity in JSON), −1 and 2e6 m: one message each, with the range (was three on one field)", async () => {
    const r = await postRaw(String(plainId), JSON.stringify({ input: withRun({ length: "__X__" }) }).replace('"__X__"', "1e400"));
    expect(errorsOf(r)).toEqual([{ field: "input.runs.0.length", pointer: "/input/runs/0/length", message: "Length must be a number; it takes from 0 to 1\u202f000\u202f000 m." }]);
    expect(errorsOf(await post(withRun({ length: 2e6 })))[0].message).toBe("Length is too high: it takes from 0 to 1\u202f000\u202f000 m, not 2\u202f000\u202f000 m; check the value and its unit.");
    expect(errorsOf(await post(withRun({ length: -1 })))[0].message).toBe("Length is too low: it takes from 0 to 1\u202f000\u202f000 m, not −1.00 m; check the value and its unit.");
    expect((await postRaw(String(plainId), '{"input":{"runs":[{"length":NaN}]}}')).status).toBe(400); // not JSON
  });
  test("a bore of 1e-9 m or 6.1 mm → 400 at …/diameter with the range; 6.2 mm (the catalogue's smallest) taken", async () => {
    for (const d of [1e-9, 0.0061]) {
      const e = errorsOf(await post(withRun({ diameter: d, roughness: 0, agedRoughness: 0 })));
      expect(e).toEqual([{ field: "input.runs.0.diameter", pointer: "/input/runs/0/diameter", message: expect.stringMatching(/^Inner diameter is too low: it takes from 6\.2 mm to 5\u202f000 mm \(the smallest bore a pipe table of the catalogue lists: Steel tube EN 10255, medium \(M\) DN6\), not [0-9.]+ mm; check the value and its unit\.$/) }]);
    }
    expect((await post(withRun({ diameter: 0.0062, roughness: 0, agedRoughness: 0 }))).status).toBe(200);
  });
  test("10 000 runs, whole or broken: 'At most 40 pipe runs.' before any run is read; 40 broken runs: 25 of their errors listed (was 11 MB)", async () => {
    for (const run of [boosterInput().runs[0], {}]) {
      const r = await post({ ...boosterInput(), runs: Array.from({ length: 10000 }, () => run) });
      expect(errorsOf(r)).toEqual([{ field: "input.runs", pointer: "/input/runs", message: "At most 40 pipe runs." }]);
    }
    const broken = await post({ ...boosterInput(), runs: Array.from({ length: 40 }, () => ({})) });
    expect(broken.status).toBe(400);
    expect(errorsOf(broken)).toHaveLength(25);
    expect(errorsOf(broken)[0]).toEqual({ field: "input.runs.0.side", pointer: "/input/runs/0/side", message: "A pipe run is an object with side, name, pipeTable, nominal, diameter, material, roughness, agedRoughness, length, fittings and extraK." });
    expect((broken.body as { detail: string }).detail).toBe("The system inputs are not valid: 440 problems, the first 25 listed.");
    expect(JSON.stringify(broken.body).length).toBeLessThan(8000);
  });
  test("malformed ids → 400; unknown id → 404; another workspace's → 404, whatever the body", async () => {
    for (const id of ["abc", "-1", "1e3", "0x10", "1.5", "99999999999999999999999"]) {
      const r = await postRaw(id, JSON.stringify({ input: boosterInput() }));
      expect(r.status, id).toBe(400);
      expect(r.headers.get("content-type")).toBe("application/problem+json");
    }
    expect((await post(boosterInput(), 999999999)).status).toBe(404);
    expect((await postRaw("0", JSON.stringify({ input: boosterInput() }))).status).toBe(404); // a well-formed id of no record
    for (const body of [boosterInput(), withRun({ pipeTable: "made-up", nominal: "4" }), { runs: "x" }]) {
      const r = await post(body, otherId);
      expect(r.status).toBe(404);
      expect(r.body).toEqual({ type: "about:blank", title: "Not Found", status: 404, detail: "No such resource in this workspace." });
    }
  });
});
