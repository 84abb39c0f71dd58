// Load profile, control and life-cycle cost through the services and the system page, against the
// real MariaDB with the demo libraries (npm test seeds them). Check values: the engine's own results
// (app/engine/dutyCycle.test.ts and lifeCycleCost.test.ts hold the hand calculations) recomputed here
// from the figures the page shows, and the EN 16297-1 profile shares (from memory) for the default.
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb, db } from "@db/client.server";
import { workspaces } from "@db/schema";
import { type Viewer } from "../libraries";
import { addCandidate, createProject, createSystem, systemWorkbench } from "./projects.server";
import { getSelection, selectCandidate } from "./selections.server";
import { searchForSystem } from "./search.server";
import { defaultSystemInput, type SystemInput } from "./hydraulics";
import { readSystemForm } from "./system-form";
import { lifeCycleCost } from "~/engine";
import { call, makeMember, type TestMember } from "~/test/harness";
import * as systemPage from "~/routes/systems.$id";
import { SI_UNITS } from "~/lib/shared/units";
import { M3H, viewerOfUser } from "./test-kit";

afterAll(() => closeDb());

let m: TestMember;
let eng: Viewer;
let systemId: number;
let candidateId: number;

beforeAll(async () => {
  m = await makeMember("admin");
  await db().update(workspaces).set({ plan: "network", currency: "GBP" }).where(eq(workspaces.id, m.workspaceId));
  eng = await viewerOfUser(m.userId);
  const input: SystemInput = { ...defaultSystemInput(), mode: "closed-loop", controlHead: 0, staticLow: 0, staticHigh: 0, duty: { flow: 60 * M3H, head: 20 }, hoursPerYear: 5000 };
  input.runs = input.runs.map((r) => ({ ...r, diameter: 0.125, length: r.side === "discharge" ? 400 : 5 }));
  systemId = await createSystem(eng, await createProject(eng, { name: "Energy", site: "", description: "" }), "Heating loop", input);
  const found = await searchForSystem(eng, systemId);
  const pick = found.results.find((r) => r.verdict?.status === "meets") ?? found.results[0];
  const added = await addCandidate(eng, systemId, pick.curveSetId);
  if (!added.ok) throw new Error(added.reason);
  candidateId = added.id;
});

describe("duty cycle and life-cycle cost on the workbench", () => {
  test("without a profile, the common-practice circulator profile is used, labelled, over the system's hours", async () => {
    const b = await systemWorkbench(eng, systemId);
    const e = b.candidates[0].energy!;
    expect(e.profileSource).toBe("common-practice");
    expect(e.profileLabel).toMatch(/common practice/i);
    expect(e.cycle!.steps.map((s) => [s.flowFraction, s.hours])).toEqual([[1, 300], [0.75, 750], [0.5, 1750], [0.25, 2200]]); // 6/15/35/44 % of 5000 h
    expect(e.cycle!.totalHours).toBe(5000);
    // The total is the sum of the steps shown; the LCC is the engine's present value of that energy.
    expect(e.cycle!.annualEnergyKWh).toBeCloseTo(e.cycle!.steps.reduce((s, x) => s + (x.energyKWh ?? 0), 0), 9);
    const ref = lifeCycleCost({ purchasePrice: null, annualEnergyKWh: e.cycle!.annualEnergyKWh, tariffPerKWh: b.system.input.tariffPerKWh, years: 15, escalation: 0.03, discountRate: 0.05 });
    expect(e.lcc!.total).toBeCloseTo(ref.total, 6);
    expect(e.lcc!.purchaseGiven).toBe(false);
  });

  test("a VFD on the system curve uses less energy than fixed speed throttled (same pump, same profile)", async () => {
    const fixed = (await systemWorkbench(eng, systemId)).candidates[0].energy!.cycle!;
    const s = (await systemWorkbench(eng, systemId)).system;
    const vfd = (await systemWorkbench(eng, systemId, { ...s.input, energy: { ...s.input.energy!, control: "system-curve" } })).candidates[0].energy!.cycle!;
    expect(fixed.mode).toBe("fixed-speed");
    expect(vfd.mode).toBe("system-curve");
    expect(vfd.steps[3].speedRatio!).toBeLessThan(1);
    expect(vfd.annualEnergyKWh).toBeLessThan(fixed.annualEnergyKWh);
  });

  test("the system form reads the profile, control and LCC fields; bad values come back on their fields", async () => {
    const s = (await systemWorkbench(eng, systemId)).system;
    const form = new Map<string, string>([
      ["name", "Heating loop"], ["mode", "closed-loop"], ["temperature", "20"], ["staticLow", "0"], ["staticHigh", "0"], ["suctionSurfacePressure", "101.325"],
      ["dutyFlow", "60"], ["dutyHead", "20"], ["hoursPerYear", "5000"], ["tariffPerKWh", "0.2"], ["runCount", "1"],
      ["run.0.side", "discharge"], ["run.0.diameter", "125"], ["run.0.length", "400"], ["run.0.material", "steel"],
      ["energy.control", "proportional-pressure"], ["energy.profileKind", "user"],
      ["energy.step.0.pct", "100"], ["energy.step.0.hours", "1000"], ["energy.step.1.pct", "50"], ["energy.step.1.hours", "3000"],
      ["energy.years", "20"], ["energy.escalation", "2.5"], ["energy.discount", "6"],
    ]);
    const f = { get: (k: string) => form.get(k) ?? null };
    const r = readSystemForm(f, SI_UNITS);
    expect(r.errors).toEqual({});
    expect(r.input!.energy).toEqual({ control: "proportional-pressure", profile: [{ flowFraction: 1, hours: 1000 }, { flowFraction: 0.5, hours: 3000 }], years: 20, escalation: 0.025, discountRate: 0.06 });
    form.set("energy.step.1.pct", "170");
    form.set("energy.years", "0");
    form.set("energy.step.2.hours", "12");
    const bad = readSystemForm(f, SI_UNITS);
    expect(bad.input).toBeNull();
    expect(Object.keys(bad.errors).sort()).toEqual(["energy.step.1.pct", "energy.step.2.pct", "energy.years"]);
    expect(s.input.energy!.control).toBe("fixed-speed");
  });

  test("the purchase price is set and cleared through the page's action, counted in the LCC, and frozen with a selection", async () => {
    const post = (price: string) => call(systemPage.action as never, { path: `/systems/${systemId}`, cookie: m.cookie, params: { id: String(systemId) }, form: { intent: "price", candidateId: String(candidateId), purchasePrice: price } });
    expect((await post("abc")).body).toMatchObject({ errors: { [`price.${candidateId}`]: expect.stringMatching(/number/) } });
    expect((await post("-5")).body).toMatchObject({ errors: { [`price.${candidateId}`]: expect.any(String) } });
    // The workspace's currency (GBP, set above) decides the decimals a price may have: the action reads it.
    expect((await post("12.505")).body).toMatchObject({ errors: { [`price.${candidateId}`]: "GBP prices are kept to 2 decimals here: 12.505 has more." } });
    await post("2 450,50");
    const e = (await systemWorkbench(eng, systemId)).candidates[0].energy!;
    expect(e.purchasePrice).toBe(2450.5);
    expect(e.lcc!.total).toBeCloseTo(2450.5 + e.lcc!.energyPresentValue, 6);
    expect(e.lcc!.cumulative[0]).toBe(2450.5);
    const sel = await getSelection(eng, await selectCandidate(eng, candidateId, "With LCC", ""));
    expect(sel.frozen.energy!.lcc!.total).toBeCloseTo(e.lcc!.total, 6);
    await post("");
    expect((await systemWorkbench(eng, systemId)).candidates[0].energy!.purchasePrice).toBeNull();
  });
});
