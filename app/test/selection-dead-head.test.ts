// A selection whose pump dead-heads (its shut-off head only balances the system's static head at zero flow): the report's
// "Duty and result" says there is no delivery, as the candidates table's Crossing cell does, and its added pressure is at
// zero flow. It read "0.000 m³/h at 30.0 m", a bare operating point. Check values: common practice (a pump at its shut-off
// head against an equal static head delivers nothing); an invented pump, head 30 − 0.008 Q² m (Q in m³/h), 30 m shut-off.
import { afterAll, beforeAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createLibrary, listModels } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, selectCandidate, systemWorkbench } from "~/lib/projects";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, viewerOfUser } from "~/lib/projects/test-kit";
import { makeMember, type TestMember } from "./harness";
import { selectionPages } from "./selection-pages";
import { probePumpCsv } from "./probe-pump";

afterAll(() => closeDb());

const M3H = 1 / 3600;
const CSV = probePumpCsv("Shutoff probe 40");

let m: TestMember;
const selections: Record<"dead" | "runs", number> = { dead: 0, runs: 0 };
beforeAll(async () => {
  m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  const lib = await createLibrary(v, { name: "Shut-off probes", description: "" });
  await importCsvText(v, lib, CSV, "shutoff.csv");
  const setId = (await listModels(v, lib))[0].curves[0].id;
  const project = await createProject(v, { name: "Dead-head", site: "", description: "" });
  for (const [k, stat] of [["dead", 30], ["runs", 20]] as const) {
    const id = await createSystem(v, project, `Static ${stat} m`, { ...defaultSystemInput(), staticLow: stat, staticHigh: stat, duty: { flow: 10 * M3H, head: stat + 1 } });
    const added = await addCandidate(v, id, setId);
    if (!added.ok) throw new Error(added.reason);
    selections[k] = await selectCandidate(v, (await systemWorkbench(v, id)).candidates[0].id, `Static ${stat} m`, "");
  }
});

test("static head equal to the shut-off head: 'dead-head … no delivery' in Duty and result, the added pressure at zero flow", async () => {
  const { html, text } = await selectionPages(m, selections.dead);
  expect(html).toMatch(/data-testid="report-operating">dead-head at 30\.0 m: no delivery \(/);
  expect(text).toMatch(/Operating point \(design curve\) dead-head at 30\.0 m: no delivery \(the shut-off head only balances the system's at zero flow\)/);
  expect(text).toMatch(/Pump added pressure \d+ kPa at zero flow \(shut-off\)/);
});

test("a pump that runs (static 20 m): the operating point as before, no dead-head words", async () => {
  const { html, text } = await selectionPages(m, selections.runs);
  expect(html).toMatch(/data-testid="report-operating">\d+\.\d+ m³\/h at \d+\.\d+ m</);
  // Labelled as the candidates table's rows are: the design curve's point, not the band's demanding edge the verdict judges.
  expect(text).toMatch(/Duty and result Duty point \d+\.\d+ m³\/h at \d+\.\d+ m Operating point \(design curve\) \d+\.\d+ m³\/h at \d+\.\d+ m Pump added pressure/);
  expect(text).not.toMatch(/dead-head|at zero flow \(shut-off\)/);
});
