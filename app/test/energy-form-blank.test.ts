// The system form's tariff escalation and discount rate left blank mean 0 %/year (none), as the form's hint says, through
// the page's action (a form post) — they kept a value that was not typed (the example 3 % and 5 %). Check values: the
// form's own hint (DutyCycleFieldset.tsx) and the life-cycle cost's rates line (lccRatesText) on what is stored.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { type Viewer } from "~/lib/libraries";
import { createProject, createSystem, systemWorkbench } from "~/lib/projects";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { viewerOfUser } from "~/lib/projects/test-kit";
import * as systemPage from "~/routes/systems.$id";
import { call, makeMember, type TestMember } from "./harness";

afterAll(() => closeDb());
let m: TestMember;
let v: Viewer;
let systemId = 0;
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  systemId = await createSystem(v, await createProject(v, { name: "Blank rates", site: "", description: "" }), "Loop", defaultSystemInput());
});

const FORM = {
  intent: "save", name: "Heating loop", mode: "closed-loop", temperature: "20", staticLow: "0", staticHigh: "0", suctionSurfacePressure: "101.325",
  dutyFlow: "60", dutyHead: "20", hoursPerYear: "5000", tariffPerKWh: "0.2", runCount: "1",
  "run.0.side": "discharge", "run.0.diameter": "125", "run.0.length": "400", "run.0.material": "steel",
  "energy.control": "fixed-speed", "energy.profileKind": "common-practice", "energy.years": "20",
};
const save = (o: Record<string, string>) => call(systemPage.action as never, { path: `/systems/${systemId}`, cookie: m.cookie, params: { id: String(systemId) }, form: { ...FORM, ...o } });
const stored = async () => (await systemWorkbench(v, systemId)).system.input.energy!;

describe("blank tariff escalation and discount rate", () => {
  test("typed, they are stored; blank, each means 0 %/year (none), not the value kept before nor the example", async () => {
    expect((await save({ "energy.escalation": "2.5", "energy.discount": "6" })).body).toMatchObject({ saved: true });
    expect(await stored()).toMatchObject({ escalation: 0.025, discountRate: 0.06 });
    expect((await save({ "energy.escalation": "", "energy.discount": "" })).body).toMatchObject({ saved: true });
    expect(await stored()).toMatchObject({ escalation: 0, discountRate: 0 });
    expect((await save({ "energy.escalation": "2.5", "energy.discount": "" })).body).toMatchObject({ saved: true });
    expect(await stored()).toMatchObject({ escalation: 0.025, discountRate: 0 });
  });
  test("Years blank: 15, the default the hint states, not the 20 stored (helper \"formedge\"); typed: as typed", async () => {
    expect((await save({ "energy.years": "20" })).body).toMatchObject({ saved: true });
    expect((await stored()).years).toBe(20);
    expect((await save({ "energy.years": "" })).body).toMatchObject({ saved: true });
    expect((await stored()).years).toBe(15);
  });
  test("a rate outside its range is refused at its field with the range, nothing saved (helper \"formedge\")", async () => {
    const r = await save({ "energy.escalation": "100.5", "energy.discount": "-1" });
    expect((r.body as { errors: Record<string, string> }).errors).toEqual({
      "energy.escalation": "Tariff escalation is too high: it takes from −50 % to 100 % a year, not 100.5 %; check the value.",
      "energy.discount": "Discount rate is too low: it takes from 0 % to 100 % a year, not −1.0 %; check the value.",
    });
    expect((await stored()).years).toBe(15); // the save before
  });
});
