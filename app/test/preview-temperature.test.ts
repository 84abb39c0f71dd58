// POST /api/v1/systems/:id/preview with a temperature outside the liquid's range (decision "inputedge"). Water at 150 °C
// was answered 200 with a `systemError` ("water properties cover 0.000 °C–100 °C …") where the editor refused the same
// temperature at its field; now a 400 problem+json at /input/temperatureC in the editor's words (temperature-range.ts).
// Water: 0 °C to 100 °C, the range the engine computes its properties for (IAPWS formulations, engine fluids.ts); a
// user-defined liquid: −50 °C to 300 °C (our rule, the schema's plausibility bounds). Each end tested on both sides.
// Through the route's action against MariaDB.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createProject, createSystem } from "~/lib/projects";
import { boosterInput, viewerOfUser } from "~/lib/projects/test-kit";
import { readSystemForm, systemFormValues } from "~/lib/projects/system-form";
import { renderUnits, SI_UNITS } from "~/lib/shared/units";
import * as apiPreview from "~/routes/api.v1.systems.$id.preview";
import { call, makeMember } from "./harness";

afterAll(() => closeDb());

let token = "";
let id = 0;
beforeAll(async () => {
  const m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  id = await createSystem(v, await createProject(v, { name: "Preview temperature", site: "", description: "" }), "Warm", boosterInput());
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
});

const OIL = { kind: "custom", name: "Thermal oil", density: 900, dynamicViscosity: 0.01, vaporPressure: 0 };
async function preview(temperatureC: number, fluid: unknown = { kind: "water" }) {
  const r = await call(apiPreview.action as never, { path: `/api/v1/systems/${id}/preview`, params: { id: String(id) }, method: "POST", headers: { authorization: `Bearer ${token}`, "content-type": "application/json" }, body: JSON.stringify({ input: { ...boosterInput(), fluid, temperatureC } }) });
  return { status: r.status, type: r.headers.get("content-type"), body: r.body as { errors?: { pointer: string; message: string }[]; systemError?: string | null } };
}
/** The editor's refusal of the same temperature, typed in °C (the form the page posts for the stored input). */
function editorSays(temperatureC: number, custom = false): string | undefined {
  const fields = systemFormValues(boosterInput(), SI_UNITS);
  const form = new Map<string, string>(Object.entries({ ...fields, name: "Warm", runCount: "0", temperature: String(temperatureC), fluidKind: custom ? "custom" : "water", fluidName: "Thermal oil", density: "900", viscosity: "10", vaporPressure: "0" }).map(([k, v]) => [k, String(v)]));
  return readSystemForm({ get: (k) => form.get(k) ?? null }, SI_UNITS).errors.temperature;
}

describe("water: 0 °C to 100 °C, either side of each end", () => {
  it("99.99 °C and 0.01 °C are answered (200, no systemError)", async () => {
    for (const t of [99.99, 0.01, 0, 100]) {
      const r = await preview(t);
      expect(r.status, String(t)).toBe(200);
      expect(r.body.systemError ?? null, String(t)).toBeNull();
    }
  });
  it("100.01 °C and −0.01 °C are refused at /input/temperatureC in the editor's words (were 200 with a systemError)", async () => {
    for (const t of [100.01, -0.01, 150]) {
      const r = await preview(t);
      expect(r.status, String(t)).toBe(400);
      expect(r.type).toBe("application/problem+json");
      expect(r.body.errors!.map((e) => e.pointer), String(t)).toEqual(["/input/temperatureC"]);
      const message = r.body.errors![0].message;
      expect(message).toBe(renderUnits(editorSays(t)!, SI_UNITS));
      expect(message).toContain("it takes from 0 °C to 100 °C (water's properties are computed for this range only"); // "0 °C", not "0.000 °C"
    }
    expect((await preview(100.01)).body.errors![0].message).toMatch(/, not 100\.01 °C; check the value and its unit\.$/);
  });
});

describe("a user-defined liquid: −50 °C to 300 °C, either side of each end", () => {
  it("299.99 °C and −49.99 °C are answered; 300.01 °C and −50.01 °C refused at the field with the range and the value", async () => {
    expect((await preview(299.99, OIL)).status).toBe(200);
    expect((await preview(-49.99, OIL)).status).toBe(200);
    const hot = await preview(300.01, OIL);
    expect(hot.status).toBe(400);
    expect(hot.body.errors).toEqual([{ field: "input.temperatureC", pointer: "/input/temperatureC", message: "Temperature is too high: it takes from −50 °C to 300 °C, not 300.01 °C; check the value and its unit." }]); // was "Temperature above 300 °C?"
    const cold = await preview(-50.01, OIL); // "−50 °C", "−50.01 °C": "-" before the true minus (helper "numtext")
    expect(cold.body.errors![0].message).toBe("Temperature is too low: it takes from −50 °C to 300 °C, not −50.01 °C; check the value and its unit.");
    expect(editorSays(300.01, true)).toBe(hot.body.errors![0].message);
  });
});
