// Units per quantity (issue 17): the account action stores a preset and per-quantity picks, the
// loaders return them, bad ids are refused with a message (never a 500), and the pages' text with
// quantities comes out in the chosen units (the system page's loader; the preview API for a session,
// SI for a token). Check values: unit factors from NIST SP 811 (1 ft = 0.3048 m, 1 US gal = 3.785411784 L).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createProject, createSystem } from "~/lib/projects";
import { defaultSystemInput, type SystemInput } from "~/lib/projects/hydraulics";
import type { Viewer } from "~/lib/libraries";
import { requireMember } from "~/lib/auth/guards.server";
import { BASE, call, makeMember, userRow, type TestMember } from "./harness";
import * as accountRoute from "~/routes/account";
import * as systemRoute from "~/routes/systems.$id";
import * as previewApi from "~/routes/api.v1.systems.$id.preview";

afterAll(() => closeDb());

let m: TestMember;
let systemId = 0;
// The default system: its typed duty head (15 m) differs from the system's head at the duty flow, so the duty check
// message carries a flow and heads.
const input = (): SystemInput => defaultSystemInput();

beforeAll(async () => {
  m = await makeMember("engineer");
  const v: Viewer = { userId: m.userId, workspace: { id: m.workspaceId, name: "U", slug: "u", plan: "free" }, role: "engineer" };
  const p = await createProject(v, { name: "Units", site: "", description: "" });
  systemId = await createSystem(v, p, "Default", input());
});

const profile = (extra: Record<string, string>) =>
  call(accountRoute.action as never, { path: "/account", cookie: m.cookie, form: { intent: "profile", name: "Una Units", unitSystem: "SI", ...extra } });

describe("account: units per quantity", () => {
  test("the action stores the preset and the picks; the loader and the session return them", async () => {
    const r = await profile({ "unit.flow": "L/s", "unit.head": "", "unit.pressure": "psi", "unit.power": "kW" });
    expect(r.status).toBe(200);
    expect((r.body as { notice: string }).notice).toBe("Profile saved.");
    expect(JSON.parse((await userRow(m.userId)).units)).toEqual({ flow: "L/s", pressure: "psi", power: "kW" });
    const page = await call(accountRoute.loader as never, { path: "/account", cookie: m.cookie });
    expect((page.body as { user: { unitSystem: string; overrides: object } }).user).toMatchObject({ unitSystem: "SI", overrides: { flow: "L/s", pressure: "psi", power: "kW" } });
    const me = await requireMember(new Request(`${BASE}/`, { headers: { cookie: m.cookie } }));
    expect(me.user.units).toMatchObject({ flow: "L/s", head: "m", pressure: "psi", power: "kW", diameter: "mm" });
  });

  test("a unit that is not one of its quantity's is refused with a message, not stored", async () => {
    await profile({ "unit.flow": "gpm" });
    const bad = await profile({ "unit.flow": "furlong/s" });
    expect(bad.status).toBe(400);
    expect((bad.body as { errors: Record<string, string> }).errors["unit.flow"]).toMatch(/not a unit of flow/);
    const wrongQuantity = await profile({ "unit.head": "psi" });
    expect(wrongQuantity.status).toBe(400);
    expect(JSON.parse((await userRow(m.userId)).units)).toEqual({ flow: "gpm" });
    const preset = await profile({ unitSystem: "metric" });
    expect(preset.status).toBe(400);
  });

  test("the US preset with one pick: the system page's duty check comes in those units", async () => {
    await profile({ unitSystem: "US", "unit.head": "m" });
    const page = await call(systemRoute.loader as never, { path: `/systems/${systemId}`, cookie: m.cookie, params: { id: String(systemId) } });
    expect(page.status).toBe(200);
    const view = (page.body as { view: { evaluation: { dutyCheck: { message: string; governs: string } } } }).view;
    expect(JSON.stringify(view)).not.toContain("⟦");
    // Duty 0.01 m³/s = 158.5 US gpm (1 US gal = 3.785411784 L, NIST SP 811); heads stay in m as picked.
    expect(view.evaluation.dutyCheck.message).toMatch(/^The typed duty head 15\.0 m differs by \d+\.\d % from the system's head at 159 gpm: \d+\.\d m at /);
    expect(view.evaluation.dutyCheck.message).not.toMatch(/m³\/h| ft\b/);
  });

  test("the preview API speaks the session user's units (a token's answer is SI: systems-api.test.ts)", async () => {
    await profile({ unitSystem: "SI", "unit.flow": "L/s", "unit.head": "ft" });
    const r = await call(previewApi.action as never, {
      path: `/api/v1/systems/${systemId}/preview`,
      cookie: m.cookie,
      params: { id: String(systemId) },
      headers: { "content-type": "application/json", origin: BASE },
      body: JSON.stringify({ input: input() }),
    });
    expect(r.status).toBe(200);
    const text = JSON.stringify(r.body);
    expect(text).not.toContain("⟦");
    // 0.01 m³/s = 10.0 L/s; 15 m = 49.2 ft (1 ft = 0.3048 m, NIST SP 811).
    expect((r.body as { evaluation: { dutyCheck: { message: string } } }).evaluation.dutyCheck.message).toMatch(/^The typed duty head 49\.2 ft differs by .* at 10\.0 L\/s: /);
  });
});
