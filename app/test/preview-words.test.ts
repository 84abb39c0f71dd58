// POST /api/v1/systems/:id/preview: the refusals of the fields outside the pipe runs in plain words (helper "formkeep").
// They had valibot's wording — "Invalid type: Expected (\"open\" | \"closed-loop\") but received \"x\"", "Invalid key:
// Expected \"staticLow\" but received undefined", "Invalid length: Expected <=60 but received 100" — and a static head or
// duty took any number below 10¹² SI. Now each names its field in words, what it takes and what was sent, with its JSON
// pointer; a static head or the duty is refused as the editor refuses it, its range in the caller's units (SI here:
// duty-ranges.ts, common practice, from memory). Through the route's action against MariaDB.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createProject, createSystem } from "~/lib/projects";
import { boosterInput, viewerOfUser } from "~/lib/projects/test-kit";
import * as apiPreview from "~/routes/api.v1.systems.$id.preview";
import { call, makeMember } from "./harness";

afterAll(() => closeDb());

let token = "";
let id = 0;
beforeAll(async () => {
  const m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  id = await createSystem(v, await createProject(v, { name: "Preview words", site: "", description: "" }), "Plain", boosterInput());
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
});

type Err = { field: string; pointer: string; message: string };
async function refused(input: unknown): Promise<Err[]> {
  const r = await call(apiPreview.action as never, { path: `/api/v1/systems/${id}/preview`, params: { id: String(id) }, method: "POST", headers: { authorization: `Bearer ${token}`, "content-type": "application/json" }, body: JSON.stringify({ input }) });
  expect(r.status).toBe(400);
  expect(r.headers.get("content-type")).toBe("application/problem+json");
  return (r.body as { errors: Err[] }).errors;
}
const without = (key: string) => Object.fromEntries(Object.entries(boosterInput()).filter(([k]) => k !== key));

describe("fields outside the runs, in plain words with their pointers", () => {
  test("a kind of system that is none of the two: its words, the two it takes, what was sent", async () => {
    expect(await refused({ ...boosterInput(), mode: "x" })).toEqual([{ field: "input.mode", pointer: "/input/mode", message: 'System kind (open or closed loop) must be "open" or "closed-loop". Sent: "x".' }]);
    expect(await refused(without("mode"))).toEqual([{ field: "input.mode", pointer: "/input/mode", message: 'System kind (open or closed loop) is missing: send "open" or "closed-loop".' }]);
  });
  test("a static head left out: the editor's range words (was “Invalid key: Expected \"staticLow\" but received undefined”)", async () => {
    expect(await refused(without("staticLow"))).toEqual([{ field: "input.staticLow", pointer: "/input/staticLow", message: "Static head at low level is missing; it takes from −1\u202f000 m to 3\u202f000 m." }]);
    expect(await refused({ ...boosterInput(), staticLow: "ten" })).toEqual([{ field: "input.staticLow", pointer: "/input/staticLow", message: 'Static head at low level must be a number; it takes from −1\u202f000 m to 3\u202f000 m. Sent: "ten".' }]);
  });
  test("a duty that is no object, a duty without its head, a duty past its range", async () => {
    expect(await refused({ ...boosterInput(), duty: "x" })).toEqual([{ field: "input.duty", pointer: "/input/duty", message: 'Duty point must be a group of values or empty (null). Sent: "x".' }]);
    expect(await refused({ ...boosterInput(), duty: { flow: 0.01 } })).toEqual([{ field: "input.duty.head", pointer: "/input/duty/head", message: "Duty head is missing; it takes from 0.1 m to 5\u202f000 m." }]);
    expect(await refused({ ...boosterInput(), duty: { flow: 1e6, head: 20 } })).toEqual([
      { field: "input.duty.flow", pointer: "/input/duty/flow", message: "Duty flow is too high: it takes from 0.036 m³/h to 360\u202f000 m³/h, not 3\u202f600\u202f000\u202f000 m³/h; check the value and its unit." },
    ]);
  });
  test("a liquid's name too long, a flow tolerance without its parts", async () => {
    const fluid = { kind: "custom", name: "x".repeat(100), density: 1000, dynamicViscosity: 0.001, vaporPressure: 2000 };
    expect(await refused({ ...boosterInput(), fluid })).toEqual([{ field: "input.fluid.name", pointer: "/input/fluid/name", message: "Fluid, name must be at most 60 characters long. Sent: 100 characters." }]);
    expect(await refused({ ...boosterInput(), flowTolerance: {} })).toEqual([
      { field: "input.flowTolerance.minus", pointer: "/input/flowTolerance/minus", message: "Duty flow tolerance, below the duty is missing: send a number." },
      { field: "input.flowTolerance.plus", pointer: "/input/flowTolerance/plus", message: "Duty flow tolerance, above the duty is missing: send a number." },
    ]);
  });
  test("an empty input: every field missing, none in valibot's words", async () => {
    const all = await refused({});
    expect(all.map((e) => e.pointer)).toEqual(["/input/fluid", "/input/temperatureC", "/input/mode", "/input/staticLow", "/input/staticHigh", "/input/pressureDifference", "/input/controlHead", "/input/suctionSurfacePressure", "/input/suctionStaticHead", "/input/runs", "/input/duty", "/input/flowMax", "/input/hoursPerYear", "/input/tariffPerKWh", "/input/npshMargin"]);
    expect(all.filter((e) => /^Invalid |Expected|received/.test(e.message))).toEqual([]);
    expect(all.find((e) => e.pointer === "/input/temperatureC")!.message).toBe("Temperature is missing: send a number.");
    expect(all.find((e) => e.pointer === "/input/duty")!.message).toBe("Duty point is missing: send a group of values or empty (null).");
  });
});
