// Not-a-number spellings typed into every field the duty cycle and life-cycle cost read — a step's flow and hours, the
// years, both rates, the operating hours, the tariff and a candidate's purchase price — posted by hand to the system page
// (no JavaScript): each is a 400 naming its field, never a 5xx, nothing stored, and the page after it shows no NaN or
// Infinity. A guard (it passed before this audit too, helper "lccedges"). Check values: the forms' own refusal words
// (shared/decimal.ts, lcc-ranges.ts; product rules), a year's 8784 h (366 × 24, common practice).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { candidates as candidatesTable, systems as systemsTable } from "@db/schema";
import { createLibrary, listModels, type Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, setCandidatePrice, systemWorkbench } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type SystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, viewerOfUser } from "~/lib/projects/test-kit";
import { editorPost } from "./editor-post";
import { makeMember, type TestMember } from "./harness";
import { send, wrongAnswer } from "./route-table";

afterAll(() => closeDb());

const M3H = 1 / 3600;
// Invented pump (the energy fixture's curve shape).
const CSV = [
  "model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct",
  ...[[5, 21.8, 30], [10, 21.5, 45], [20, 20, 62], [30, 17.5, 72], [36, 15.5, 74], [45, 12, 70], [55, 7, 60]].map((r) => `Nanless 50,end-suction,DN50,2900,200,${r.join(",")}`),
].join("\n");
const base: SystemInput = { ...defaultSystemInput(), duty: { flow: 30 * M3H, head: 12 }, hoursPerYear: 6000, tariffPerKWh: 0.2 };

let m: TestMember;
let v: Viewer;
let sysId = 0;
let candId = 0;
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  const lib = await createLibrary(v, { name: "No NaN", description: "" });
  await importCsvText(v, lib, CSV, "nan.csv");
  const setId = (await listModels(v, lib))[0].curves[0].id;
  const project = await createProject(v, { name: "No NaN", site: "", description: "" });
  sysId = await createSystem(v, project, "No NaN", base);
  const added = await addCandidate(v, sysId, setId, { ...DEFAULT_ADJUSTMENT, motorRating: 3000 });
  if (!added.ok) throw new Error(added.reason);
  candId = (await systemWorkbench(v, sysId)).candidates[0].id;
  await setCandidatePrice(v, candId, 123456);
});

const post = (fields: Record<string, string>) =>
  send({ path: "systems/:id", file: "routes/systems.$id.tsx" }, { who: "owner", cookie: m.cookie, headers: { "content-type": "application/x-www-form-urlencoded" } }, { params: { id: String(sysId) }, method: "POST", body: new URLSearchParams(fields).toString() });
const form = (energy: Record<string, string>, top: Record<string, string> = {}): Record<string, string> => ({
  ...editorPost(base, "No NaN"),
  ...top,
  "energy.control": "proportional-pressure", "energy.profileKind": "user", "energy.step.0.pct": "100", "energy.step.0.hours": "8784", "energy.years": "15", "energy.escalation": "3", "energy.discount": "5", ...energy,
});
const stored = async () => (await db().select().from(systemsTable).where(eq(systemsTable.id, sysId)))[0].inputJson;
const price = async () => (await db().select().from(candidatesTable).where(eq(candidatesTable.id, candId)))[0].purchasePriceCents;
const SPELLINGS = ["NaN", "Infinity", "-Infinity", "1e999", "∞"];
const NOT_A_NUMBER = /\bNaN\b|Infinity|∞/;

describe("each field refuses each spelling by name: 400, nothing stored", () => {
  const cases: [string, (x: string) => Record<string, string>, string][] = [
    ["a step's flow", (x) => form({ "energy.step.0.pct": x }), "energy.step.0.pct"],
    ["a step's hours", (x) => form({ "energy.step.0.hours": x }), "energy.step.0.hours"],
    ["years", (x) => form({ "energy.years": x }), "energy.years"],
    ["tariff escalation", (x) => form({ "energy.escalation": x }), "energy.escalation"],
    ["discount rate", (x) => form({ "energy.discount": x }), "energy.discount"],
    ["operating hours", (x) => form({}, { hoursPerYear: x }), "hoursPerYear"],
    ["tariff", (x) => form({}, { tariffPerKWh: x }), "tariffPerKWh"],
  ];
  test.each(cases.flatMap(([name, f, key]) => SPELLINGS.map((x) => [name, x, f, key] as const)))("%s %j", async (_name, x, f, key) => {
    const before = await stored();
    const a = await post(f(x));
    expect(wrongAnswer(a, { api: false, refusal: true })).toBeNull();
    expect(a.status).toBe(400);
    const errors = (JSON.parse(a.text) as { errors: Record<string, string> }).errors;
    expect(Object.keys(errors)).toContain(key);
    expect(errors[key].replace(/“[^”]*”/g, "“…”")).not.toMatch(NOT_A_NUMBER); // no computed NaN in the words: the spelling appears only quoted as typed
    expect(await stored()).toBe(before);
  });
  test.each(SPELLINGS)("purchase price %j: 400 on the candidate's price field, the price kept", async (x) => {
    const a = await post({ intent: "price", candidateId: String(candId), purchasePrice: x });
    expect(wrongAnswer(a, { api: false, refusal: true })).toBeNull();
    expect(a.status).toBe(400);
    expect(Object.keys((JSON.parse(a.text) as { errors: Record<string, string> }).errors)).toEqual([`price.${candId}`]);
    expect(await price()).toBe(123456);
  });
});
