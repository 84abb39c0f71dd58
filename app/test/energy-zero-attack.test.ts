// The load profile's 0 % flow steps and blank rates, posted by hand to the system page's action (decision "storedattack"):
// every spelling of zero the forms' reader takes ("-0", "0e0", " 0 ", "0,0", "00", "−0") is stored as 0 (never −0); a
// profile of only 0 % steps (every hour at zero demand) gives totals of 0 kWh and 0 a year, a life-cycle cost of the
// purchase price alone and no NaN or Infinity on the system page, the report or the CSV; rows past the form's 8 are
// refused with the limit, never dropped unsaid; steps adding past 8784 h are refused at the step's hours. Never a 5xx,
// nothing stored on a refusal. Check values: a year's hours (366 × 24 = 8784 h, a leap year), 0 % flow = no demand, pump
// stopped, 0 kWh (dutyCycle.ts `no-demand`); LCC with no energy = the purchase price (lifeCycleCost.ts, common practice).
// Invented pump (the energy fixture's curve shape).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { systems as systemsTable } from "@db/schema";
import { createLibrary, listModels, type Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, selectCandidate, setCandidatePrice, systemWorkbench } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type SystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, viewerOfUser } from "~/lib/projects/test-kit";
import SystemPage, * as systemPage from "~/routes/systems.$id";
import { editorPost } from "./editor-post";
import { call, makeMember, type TestMember } from "./harness";
import { renderPage } from "./render-page";
import { selectionPages, textOf } from "./selection-pages";
import { send, wrongAnswer } from "./route-table";

afterAll(() => closeDb());

const M3H = 1 / 3600;
const CSV = [
  "model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct",
  ...[[5, 21.8, 30], [10, 21.5, 45], [20, 20, 62], [30, 17.5, 72], [36, 15.5, 74], [45, 12, 70], [55, 7, 60]].map((r) => `Idler 50,end-suction,DN50,2900,200,${r.join(",")}`),
].join("\n");
const base: SystemInput = { ...defaultSystemInput(), duty: { flow: 30 * M3H, head: 12 }, hoursPerYear: 6000, tariffPerKWh: 0.2 };

let m: TestMember;
let v: Viewer;
const sys = { single: 0, parallel: 0 };
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  const lib = await createLibrary(v, { name: "Zero demand", description: "" });
  await importCsvText(v, lib, CSV, "zero-demand.csv");
  const setId = (await listModels(v, lib))[0].curves[0].id;
  const project = await createProject(v, { name: "Zero demand", site: "", description: "" });
  for (const k of ["single", "parallel"] as const) {
    sys[k] = await createSystem(v, project, `Zero ${k}`, base);
    const added = await addCandidate(v, sys[k], setId, { ...DEFAULT_ADJUSTMENT, motorRating: 3000, ...(k === "parallel" ? { arrangement: "parallel", dutyPumps: 2, standbyPumps: 0 } : {}) });
    if (!added.ok) throw new Error(added.reason);
    await setCandidatePrice(v, (await systemWorkbench(v, sys[k])).candidates[0].id, 123456);
  }
});

/** The editor's form for the stored system, as posted unchanged, with the energy fields given. */
const form = (input: SystemInput, energy: Record<string, string>): Record<string, string> => ({
  ...editorPost(input, "Zero"),
  "energy.control": "fixed-speed", "energy.profileKind": "user", "energy.years": "15", "energy.escalation": "", "energy.discount": "", ...energy,
});
const steps = (rows: [string, string][]) => Object.fromEntries(rows.flatMap(([pct, h], i) => [[`energy.step.${i}.pct`, pct], [`energy.step.${i}.hours`, h]]));
const storedJson = async (id: number) => (await db().select().from(systemsTable).where(eq(systemsTable.id, id)))[0].inputJson;
const post = (id: number, fields: Record<string, string>) =>
  send({ path: "systems/:id", file: "routes/systems.$id.tsx" }, { who: "owner", cookie: m.cookie, headers: { "content-type": "application/x-www-form-urlencoded" } }, { params: { id: String(id) }, method: "POST", body: new URLSearchParams(fields).toString() });
const NOT_A_NUMBER = /\bNaN\b|Infinity|undefined|−0 |-0 /;

describe("spellings of zero", () => {
  test.each(["-0", "0e0", " 0 ", "0,0", "00", "\u22120", "+0", "0.000", "-0e5"])("flow %j at 8760 h: stored as 0 % (never −0), the page clean", async (zero) => {
    const a = await post(sys.single, form(base, steps([[zero, "8760"]])));
    expect(wrongAnswer(a, { api: false, refusal: false })).toBeNull();
    expect(JSON.parse(a.text)).toMatchObject({ saved: true });
    const stored = JSON.parse(await storedJson(sys.single)) as SystemInput;
    expect(stored.energy!.profile).toEqual([{ flowFraction: 0, hours: 8760 }]);
    expect(Object.is(stored.energy!.profile![0].flowFraction, -0)).toBe(false);
    const hours = await post(sys.single, form(base, steps([["50", zero]])));
    expect(JSON.parse(hours.text)).toMatchObject({ saved: true });
    expect((JSON.parse(await storedJson(sys.single)) as SystemInput).energy!.profile).toEqual([{ flowFraction: 0.5, hours: 0 }]);
  });
});

describe("a profile of only 0 % steps: every hour at zero demand", () => {
  for (const k of ["single", "parallel"] as const) {
    test(`${k}: 0 kWh, 0 a year, LCC = the purchase price, no NaN on the page, the report or the CSV`, async () => {
      const a = await post(sys[k], form(base, steps([["0", "6000"], ["0,0", "2760"]])));
      expect(JSON.parse(a.text)).toMatchObject({ saved: true });
      const bench = await systemWorkbench(v, sys[k]);
      const e = bench.candidates[0].energy!;
      expect(e.cycle!.steps.map((s) => s.status)).toEqual(["no-demand", "no-demand"]);
      expect(e.cycle!.annualEnergyKWh).toBe(0);
      expect(e.annualCost).toBe(0);
      expect(e.lcc!.total).toBe(1234.56); // purchase price alone
      expect(JSON.stringify(e)).not.toMatch(/null,"energyKWh":NaN|NaN|Infinity/);
      const page = await call(systemPage.loader as never, { path: `/systems/${sys[k]}`, cookie: m.cookie, params: { id: String(sys[k]) } });
      expect(page.status).toBe(200);
      const text = textOf(renderPage("/systems/:id", SystemPage, `/systems/${sys[k]}`, page.body));
      expect(text).toMatch(/stopped, no demand/);
      expect(text.match(NOT_A_NUMBER)?.[0] ?? null, text.slice(Math.max(0, text.search(NOT_A_NUMBER) - 200), text.search(NOT_A_NUMBER) + 100)).toBeNull();
      const sel = await selectCandidate(v, bench.candidates[0].id, `Zero ${k}`, "");
      const r = await selectionPages(m, sel);
      expect(r.text.match(NOT_A_NUMBER)?.[0] ?? null, r.text.slice(Math.max(0, r.text.search(NOT_A_NUMBER) - 200), r.text.search(NOT_A_NUMBER) + 100)).toBeNull();
      expect(r.csvText).not.toMatch(/\bNaN\b|Infinity|undefined/);
    });
  }
});

describe("more rows than the form has, and hours past a year: refused, nothing stored", () => {
  test("24 steps of 0 % (365 h each, 8760 h): refused with the limit of 8 steps (was: rows 9–24 dropped unsaid, 2920 h stored)", async () => {
    const before = await storedJson(sys.single);
    const a = await post(sys.single, form(base, steps(Array.from({ length: 24 }, (): [string, string] => ["0", "365"]))));
    expect(wrongAnswer(a, { api: false, refusal: false })).toBeNull();
    const body = JSON.parse(a.text) as { errors: Record<string, string>; saved?: boolean };
    expect(body.saved).toBeUndefined();
    expect(body.errors["energy.profileKind"]).toMatch(/at most 8 steps/i);
    expect(await storedJson(sys.single)).toBe(before);
  });
  test("one row past the 8 with a value, the rest blank: refused too; blank rows past 8 are nothing", async () => {
    const before = await storedJson(sys.single);
    const a = await post(sys.single, form(base, { ...steps([["0", "100"]]), "energy.step.8.pct": "0", "energy.step.8.hours": "" }));
    expect(JSON.parse(a.text).errors["energy.profileKind"]).toMatch(/at most 8 steps/i);
    expect(await storedJson(sys.single)).toBe(before);
    const ok = await post(sys.single, form(base, { ...steps([["0", "100"]]), "energy.step.8.pct": " ", "energy.step.9.hours": "" }));
    expect(JSON.parse(ok.text)).toMatchObject({ saved: true });
  });
  test.each([
    ["two 0 % steps of 5000 h", [["0", "5000"], ["0", "5000"]], 1],
    ["one step of 8784.01 h", [["0", "8784.01"]], 0],
    ["8 steps of 1098.001 h", Array.from({ length: 8 }, () => ["0", "1098.001"]), 7],
  ] as [string, [string, string][], number][])("%s: refused at that step's hours, with the year's 8784 h", async (_, rows, at) => {
    const before = await storedJson(sys.single);
    const a = await post(sys.single, form(base, steps(rows)));
    expect(wrongAnswer(a, { api: false, refusal: false })).toBeNull();
    expect(JSON.parse(a.text).errors[`energy.step.${at}.hours`]).toMatch(/8\u202f784 h/);
    expect(await storedJson(sys.single)).toBe(before);
  });
  test("8 steps adding to 8784 h exactly: taken", async () => {
    const a = await post(sys.single, form(base, steps(Array.from({ length: 8 }, () => ["0", "1098"]))));
    expect(JSON.parse(a.text)).toMatchObject({ saved: true });
  });
});
