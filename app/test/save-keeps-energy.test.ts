// The system editor's save with no energy fields (helper "formkeep"): a post without `energy.control` — an older page, a
// script, the system or duty section posted alone — reset the stored load profile, control mode, life-cycle years and
// rates to the defaults (fixed speed, the common-practice profile, 15 years, 3 %/5 %): the form was read with no stored
// settings to keep. Now it is read against the stored document (`storedForEditor`), so the stored settings are kept; a
// post that carries the energy fields still sets them (blank years and rates: 15 years, 0 %, as the form's hint says).
// Through the route's action against MariaDB. Check values: invented settings (a user profile of two steps, 20 years,
// 2 % escalation, 4 % discount); the defaults are DEFAULT_ENERGY_SETTINGS (energy.ts).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { systems } from "@db/schema";
import type { Viewer } from "~/lib/libraries";
import { createProject, createSystem } from "~/lib/projects";
import type { SystemInput } from "~/lib/projects/hydraulics";
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
  projectId = await createProject(v, { name: "Energy kept", site: "", description: "" });
});

const SETTINGS: SystemInput["energy"] = {
  control: "proportional-pressure",
  profile: [{ flowFraction: 1, hours: 1000 }, { flowFraction: 0.5, hours: 3000 }],
  years: 20,
  escalation: 0.02,
  discountRate: 0.04,
};

async function storedInput(id: number): Promise<SystemInput> {
  const [row] = await db().select().from(systems).where(eq(systems.id, id));
  return JSON.parse(row.inputJson) as SystemInput;
}

/** The editor's fields for `input` without any energy.* field (what an older page or a script posts). */
const formWithoutEnergy = (input: SystemInput, name = "Kept"): Record<string, string> => editorPost(input, name);

const save = (id: number, form: Record<string, string>) => call(systemPage.action as never, { path: `/systems/${id}`, params: { id: String(id) }, cookie: m.cookie, form });

describe("a save without the energy fields", () => {
  test("keeps the stored load profile, control, 20 years and 2 %/4 % (was: fixed speed, no profile, 15 years, 3 %/5 %)", async () => {
    const input: SystemInput = { ...boosterInput(), energy: SETTINGS };
    const id = await createSystem(v, projectId, "Energy set", input);
    const form = formWithoutEnergy(input, "Energy set, renamed");
    expect(Object.keys(form).some((k) => k.startsWith("energy."))).toBe(false);
    const a = await save(id, form);
    expect((a.body as { errors: Record<string, string> }).errors).toEqual({});
    expect((a.body as { notice: string }).notice).toBe("System saved.");
    const back = await storedInput(id);
    expect(back.energy).toEqual(SETTINGS);
    const [row] = await db().select().from(systems).where(eq(systems.id, id));
    expect(row.name).toBe("Energy set, renamed"); // the post was saved, not refused
  });

  test("a post that carries the energy fields still sets them: blank years and rates are 15 years and 0 % (the hint's rule)", async () => {
    const input: SystemInput = { ...boosterInput(), energy: SETTINGS };
    const id = await createSystem(v, projectId, "Energy posted", input);
    const form = { ...formWithoutEnergy(input), "energy.control": "fixed-speed", "energy.profileKind": "common-practice", "energy.years": "", "energy.escalation": "", "energy.discount": "" };
    expect((await save(id, form)).body).toMatchObject({ errors: {} });
    expect((await storedInput(id)).energy).toEqual({ control: "fixed-speed", profile: null, years: 15, escalation: 0, discountRate: 0 });
  });

  test("a system stored before the energy settings (no `energy` in its document) keeps reading with the defaults", async () => {
    const { energy: _, ...old } = boosterInput();
    const id = await createSystem(v, projectId, "Energy never set", old as SystemInput);
    expect((await save(id, formWithoutEnergy(boosterInput()))).body).toMatchObject({ errors: {} });
    expect((await storedInput(id)).energy).toEqual({ control: "fixed-speed", profile: null, years: 15, escalation: 0.03, discountRate: 0.05 });
  });
});
