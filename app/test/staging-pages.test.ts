// Pumps in parallel staged by demand (engine dutyStaging.ts: each step runs the fewest duty pumps that meet it, common
// practice, from memory): the system page, the selection report (screen and print) and the selection's CSV say how many
// run at each step ("1 of 2") and state the rule; a single pump's pages have neither. Real route modules and MariaDB; an
// invented pump (the energy fixture's: 36 m³/h at 15.5 m, curve end 55 m³/h at 7 m). Check values: one pump's curve
// ends at 55 m³/h, so 25 % of a 72 m³/h duty (18 m³/h) is within one pump's reach and 90 % (64.8 m³/h) is not (hand arithmetic).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createLibrary, listModels } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, selectCandidate, systemWorkbench } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type Adjustment, type SystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, viewerOfUser } from "~/lib/projects/test-kit";
import SystemPage, * as systemPage from "~/routes/systems.$id";
import { call, makeMember } from "./harness";
import { renderPage } from "./render-page";
import { csvHeader, selectionPages, textOf, type SelectionPages } from "./selection-pages";

const PUMP_CSV = [
  "model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct",
  ...[[5, 21.8, 30], [10, 21.5, 45], [20, 20, 62], [30, 17.5, 72], [36, 15.5, 74], [45, 12, 70], [55, 7, 60]].map(([q, h, e]) => `Stager 50,end-suction,DN50,2900,200,${q},${h},${e}`),
].join("\n");
const RULE = "Pumps in parallel staged by demand: each step runs the fewest duty pumps that meet it with their motors within rating (else within rating × service factor, else overloaded, said at the step; common practice, from memory); standby pumps never run";
const base = defaultSystemInput();
const input: SystemInput = { ...base, duty: { flow: 72 / 3600, head: 12 }, energy: { ...base.energy!, profile: [{ flowFraction: 0.25, hours: 3000 }, { flowFraction: 0.9, hours: 1000 }] } };
const got = {} as Record<"pair" | "single", { system: string; pages: SelectionPages }>;

beforeAll(async () => {
  const m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  const libId = await createLibrary(v, { name: "Staged pumps", description: "" });
  await importCsvText(v, libId, PUMP_CSV, "stager.csv");
  const setId = (await listModels(v, libId))[0].curves[0].id;
  const project = await createProject(v, { name: "Staging", site: "", description: "" });
  const adjs: Record<"pair" | "single", Adjustment> = { pair: { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1, motorRating: 3000 }, single: { ...DEFAULT_ADJUSTMENT, motorRating: 3000 } };
  for (const name of ["pair", "single"] as const) {
    const systemId = await createSystem(v, project, `Loop ${name}`, input);
    const added = await addCandidate(v, systemId, setId, adjs[name]);
    if (!added.ok) throw new Error(added.reason);
    const sys = await call(systemPage.loader as never, { path: `/systems/${systemId}`, cookie: m.cookie, params: { id: String(systemId) } });
    expect(sys.status).toBe(200);
    const system = textOf(renderPage("/systems/:id", SystemPage, `/systems/${systemId}`, sys.body));
    const id = await selectCandidate(v, (await systemWorkbench(v, systemId)).candidates[0].id, `Loop ${name}`, "");
    got[name] = { system, pages: await selectionPages(m, id) };
  }
});
afterAll(() => closeDb());

/** The cells of the step rows of the screen's duty-cycle table (its first table body after the caption). */
const stepRows = (html: string) => {
  const body = /aria-label="Duty cycle of[^"]*"[\s\S]*?<tbody>([\s\S]*?)<\/tbody>/.exec(html)![1];
  return [...body.matchAll(/<tr class="border-t border-slate-100">([\s\S]*?)<\/tr>/g)].map((r) => [...r[1].matchAll(/<td[^>]*>([\s\S]*?)<\/td>/g)].map((c) => textOf(c[1])));
};

describe("2 pumps in parallel (+1 standby): pumps running at each step, and the rule", () => {
  test("the system page: a Pumps running column, 1 of 2 at 25 % and 2 of 2 at 90 %, and the rule among the assumptions", () => {
    const t = got.pair.system;
    expect(t).toMatch(/Flow % Pumps running Flow Head Speed/);
    expect(t).toMatch(/25 % 1 of 2 /);
    expect(t).toMatch(/90 % 2 of 2 /);
    expect(t).toContain(`${RULE}.`);
    expect(t).toMatch(/for the pumps running at each step \(“Pumps running”\), staged by demand; standby pumps never run/);
  });

  test("the report: the column on screen, and the printed line with each step's pumps and the rule", () => {
    const { html, text } = got.pair.pages;
    expect(stepRows(html).map((r) => r[1])).toEqual(["1 of 2", "2 of 2"]);
    expect(text).toContain(`${RULE}.`);
    const printed = textOf(/data-testid="pumps-running-print"[^>]*>([\s\S]*?)<\/p>/.exec(html)?.[1] ?? "");
    expect(printed).toBe(`Pumps running: 25 % flow, 3000 h: 1 of 2; 90 % flow, 1000 h: 2 of 2 (${RULE}).`);
  });

  test("the CSV: pumps_running per step, one pump's shaft power beside the running pumps', and the rule as an assumption", () => {
    const { csv } = got.pair.pages;
    const head = csvHeader(csv, "duty_cycle");
    expect(head.slice(0, 3)).toEqual(["section", "step", "pumps_running"]);
    expect(head).toEqual(expect.arrayContaining(["shaft_power_pumps_running_w", "shaft_power_per_pump_w", "electrical_input_pumps_running_w"]));
    const steps = csv.filter((r) => r[0] === "duty_cycle");
    expect(steps.map((r) => r[2])).toEqual(["1 of 2", "2 of 2"]);
    const col = (name: string) => head.indexOf(name);
    expect(Number(steps[0][col("shaft_power_per_pump_w")])).toBeCloseTo(Number(steps[0][col("shaft_power_pumps_running_w")]), 6); // one pump running
    expect(Number(steps[1][col("shaft_power_per_pump_w")])).toBeCloseTo(Number(steps[1][col("shaft_power_pumps_running_w")]) / 2, 6); // two equal pumps
    expect(csv.some((r) => r[0] === "figures" && /^cycle_assumption_\d+$/.test(r[1]) && r[2] === `${RULE}.`)).toBe(true);
    expect(csv.some((r) => r[0].startsWith("# 2 pumps in parallel + 1 standby:") && r[0].includes("the duty cycle of the pumps running at each step (pumps_running, staged by demand"))).toBe(true);
  });
});

describe("one pump: as before", () => {
  test("no Pumps running column or field and no staging rule on the page, the report or the CSV", () => {
    const { system, pages } = got.single;
    for (const t of [system, pages.text, pages.csvText]) {
      expect(t).not.toMatch(/Pumps running|pumps_running/);
      expect(t).not.toContain(RULE);
    }
    expect(stepRows(pages.html)[0][1]).toMatch(/m³\/h$/); // the second column is still the flow
  });
});
