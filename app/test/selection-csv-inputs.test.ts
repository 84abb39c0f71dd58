// The selection CSV carries what the selection was judged on: the engineer's note under the title and the system inputs
// (duty, its tolerance, levels, liquid, suction, operation) as an `inputs` section, in SI as the file's other figures. It
// carried neither (the report and the JSON did). Check values: the inputs as entered below (invented system), water's
// density at 20 °C about 998.2 kg/m³ (IAPWS, from memory).
import { afterAll, beforeAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createLibrary, listModels } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, selectCandidate, systemWorkbench } from "~/lib/projects";
import { defaultSystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, viewerOfUser } from "~/lib/projects/test-kit";
import { makeMember, type TestMember } from "./harness";
import { selectionPages } from "./selection-pages";
import { probePumpCsv } from "./probe-pump";
import { UNIT_SYSTEMS, type Quantity } from "~/engine";
import { qt } from "~/engine/quantityText";
import { renderUnits, SI_UNITS } from "~/lib/shared/units";

afterAll(() => closeDb());

const M3H = 1 / 3600;
let m: TestMember;
let selection = 0;
beforeAll(async () => {
  m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  const lib = await createLibrary(v, { name: "CSV probes", description: "" });
  await importCsvText(v, lib, probePumpCsv("Inputs probe 40"), "inputs.csv");
  const setId = (await listModels(v, lib))[0].curves[0].id;
  const project = await createProject(v, { name: "CSV inputs", site: "", description: "" });
  const id = await createSystem(v, project, "Inputs", { ...defaultSystemInput(), staticLow: 19, staticHigh: 20, duty: { flow: 30 * M3H, head: 20.5 }, flowTolerance: { minus: 0.025, plus: 0.125 }, npshMargin: 1.3 });
  const added = await addCandidate(v, id, setId);
  if (!added.ok) throw new Error(added.reason);
  selection = await selectCandidate(v, (await systemWorkbench(v, id)).candidates[0].id, "Inputs probe", "Checked with the site team.\nValve V3 to stay open.");
});

test("the note under the title, on one line; the inputs section with the duty, its tolerance, levels, liquid and NPSH margin", async () => {
  const { csv } = await selectionPages(m, selection);
  expect(csv[1][0]).toBe("# Note: Checked with the site team. / Valve V3 to stay open.");
  const inputs = new Map(csv.filter((r) => r[0] === "inputs").map((r) => [r[1], [r[2], r[3]]]));
  expect(Number(inputs.get("duty_flow")![0])).toBeCloseTo(30 / 3600, 12);
  expect(inputs.get("duty_flow")![1]).toBe("m3/s");
  expect(inputs.get("duty_head")).toEqual(["20.5", "m"]);
  expect(inputs.get("duty_flow_tolerance_minus")).toEqual(["0.025", "1"]);
  expect(inputs.get("duty_flow_tolerance_plus")).toEqual(["0.125", "1"]);
  expect(inputs.get("static_head_low")).toEqual(["19", "m"]);
  expect(inputs.get("static_head_high")).toEqual(["20", "m"]);
  expect(inputs.get("liquid")).toEqual(["water", ""]);
  expect(Number(inputs.get("density")![0])).toBeCloseTo(998.2, 0);
  expect(inputs.get("npsh_margin_wanted")).toEqual(["1.3", "1"]);
  expect(inputs.get("tariff_per_kwh")![1]).toMatch(/\/kWh$/);
});

test("the header names the units: numbers in SI by column, texts in the SI preset's display units it renders them with, every unit a text uses among them", async () => {
  // The CSV wrote no units line: its columns name SI (flow_m3s) while its texts (verdict rule, warnings, steps) are rendered
  // in m³/h, kPa, kW (the export route's renderDeep with SI_UNITS); the JSON's `units` says so (SELECTION_JSON_UNITS).
  const { csv } = await selectionPages(m, selection);
  const head = csv.slice(0, csv.findIndex((r) => r.length === 1 && r[0] === "")); // the comment lines before the first blank
  const units = head.find((r) => /^# Units/.test(r[0]))?.[0] ?? "";
  expect(units).toMatch(/^# Units: numbers in SI, each column's unit in its header .* Texts .* write quantities in the SI preset's display units: flow m³\/h, head m, pressure kPa, power kW, /);
  for (const q of Object.keys(UNIT_SYSTEMS.SI) as Quantity[]) expect(units, q).toContain(renderUnits(qt(q, 1), SI_UNITS).replace(/^[\d\u202f.e+−-]+ ?/, "")); // each quantity's unit as the texts render it
  const texts = csv.filter((r) => r[0] === "figures" && r[3] === "").map((r) => r[2]).join(" ");
  const used = [...texts.matchAll(/\d (m³\/h|m³\/s|kPa|Pa|kW|W|mm|m)\b/g)].map((x) => x[1]);
  expect(used).toContain("m³/h"); // the case: a text in m³/h beside the flow_m3s columns
  for (const u of used) expect(units, u).toMatch(new RegExp(` ${u.replace(/[/]/g, "\\/")}[,.]`));
});
