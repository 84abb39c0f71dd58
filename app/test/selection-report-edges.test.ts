// A selection's report and its exports at their edges, read as the engineer who signs it: the duty flow tolerance stated
// under "System inputs" as the verdict's rule states it (it was rounded to whole percent beside the rule's −2.5 %), and the
// JSON export carrying the caution, the units of everything it holds, and its headline verdict as the report and the CSV
// read it — what NPSH and a staged start say against it, and a selection frozen before verdicts told apart from one with
// no duty point (both were `verdict: null`). Real route modules and MariaDB (harness.ts, selection-pages.ts).
// Pumps: the Tallowmere demo curves and the invented drooping pump of droop-pump.ts (40 m shut-off, 41.9 m peak).
// Check values: our product rules (engine verdict.ts's tolerance text; the CSV's verdict figures) and common practice
// (a pump starts against a closed check valve; NPSHa at or below zero is a cavitation risk whatever the pump).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { selections } from "@db/schema";
import type { Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, getSelection, searchForSystem, selectCandidate } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type Adjustment, type SystemInput } from "~/lib/projects/hydraulics";
import type { FrozenSelection } from "~/lib/projects/stored-selection";
import { boosterInput, demoLibrary, viewerOfUser } from "~/lib/projects/test-kit";
import { renderDeep, SI_UNITS } from "~/lib/shared/units";
import * as selectionJson from "~/routes/selections.$id.export-json";
import * as systemPage from "~/routes/systems.$id";
import { workspaceCurrency } from "~/lib/workspaces";
import { call, makeMember, type TestMember } from "./harness";
import { importDroopPump } from "./droop-pump";
import { csvFigures, figureCell, selectionPages, textOf } from "./selection-pages";

afterAll(() => closeDb());

const M3H = 1 / 3600;
let m: TestMember;
let v: Viewer;
let project = 0;
let tallowmere = 0;
let droop = 0;

beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  await demoLibrary(v, "Edge pumps");
  project = await createProject(v, { name: "Report edges", site: "", description: "" });
  tallowmere = (await searchForSystem(v, await createSystem(v, project, "Donor", boosterInput()))).results[0].curveSetId;
  droop = await importDroopPump(v);
});

/** A selection of curve set `setId` on `input` with `adj`: its id and frozen document in SI. */
async function select(name: string, input: SystemInput, adj: Adjustment = DEFAULT_ADJUSTMENT, setId = tallowmere) {
  const systemId = await createSystem(v, project, name, input);
  const added = await addCandidate(v, systemId, setId, adj);
  if (!added.ok) throw new Error(added.reason);
  const id = await selectCandidate(v, added.id, name, "");
  return { id, f: renderDeep((await getSelection(v, id)).frozen, SI_UNITS) as FrozenSelection };
}

type JsonExport = Record<string, unknown> & { result: FrozenSelection["result"] };
async function jsonOf(id: number): Promise<JsonExport> {
  const r = await call(selectionJson.loader as never, { path: `/selections/${id}/export.json`, cookie: m.cookie, params: { id: String(id) } });
  expect(r.status).toBe(200);
  return r.body as JsonExport;
}

describe("the duty flow tolerance under System inputs", () => {
  test("−2.5 %/+12.5 % is stated as the verdict's rule states it, never rounded to −3 %/+13 % beside it", async () => {
    const { id, f } = await select("Tolerance", { ...boosterInput(), flowTolerance: { minus: 0.025, plus: 0.125 } });
    const pages = await selectionPages(m, id);
    const rule = f.result.verdict?.rule ?? "";
    expect(rule + (f.result.verdict?.reasons.join(" ") ?? "")).toContain("tolerance −2.5 %/+12.5 %"); // control: the engine's words
    expect(pages.text).toContain("duty flow tolerance −2.5 %/+12.5 %"); // old code: "duty flow tolerance −3 %/+13 %"
    expect(pages.text).not.toMatch(/tolerance −3 %\/\+13 %/);
  });
});

describe("the JSON export", () => {
  test("carries the caution and names the units of every kind of number it holds", async () => {
    const { id } = await select("JSON units", boosterInput());
    const body = await jsonOf(id);
    expect(body.caution).toMatch(/design guidance.*certified data, local codes and a licensed engineer/); // old code: no caution
    const units = String(body.units);
    for (const u of ["m3/s", "Pa", "W", "kg/m3", "temperatureC °C", "kWh", "rpm", "money in `currency`"]) expect(units, u).toContain(u);
    expect((body.system as { input: { temperatureC: number } }).input.temperatureC).toBe(20); // control: °C as the units say (defaultSystemInput)
    expect((body.pump as { speed: number }).speed).toBe(2900); // control: rpm as the units say (tallowmere.csv)
    expect(body.currency).toBe(await workspaceCurrency(m.workspaceId)); // the money's currency, named at the top
  });

  test("NPSHa below zero: verdictNpsh says what the report's headline and the CSV's verdict_npsh say", async () => {
    const { id, f } = await select("JSON NPSH", { ...boosterInput(), suctionStaticHead: -12 });
    expect(f.result.npsh?.status).toBe("cavitation-risk"); // control: 12 m suction lift on water at 20 °C
    const body = await jsonOf(id);
    const csv = csvFigures((await selectionPages(m, id)).csv).get("verdict_npsh")?.[0];
    expect(csv).toMatch(/NPSHa −[\d.]+ m, at or below zero, .*cavitation risk/); // control
    expect(body.verdictNpsh).toBe(csv); // old code: absent
    expect(body.verdictStart).toBeNull();
  });

  test("two drooping pumps in parallel started one after another: verdictStart says what the CSV's verdict_start says", async () => {
    const input: SystemInput = { ...defaultSystemInput(), staticLow: 36, staticHigh: 37, duty: { flow: 54 * M3H, head: 38.5 } };
    const { id, f } = await select("JSON staged", input, { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2 }, droop);
    expect(f.result.verdict?.status).toBe("meets"); // control: both together meet the duty
    const body = await jsonOf(id);
    const csv = csvFigures((await selectionPages(m, id)).csv).get("verdict_start")?.[0];
    expect(csv).toMatch(/^but started one after another .*cannot open its check valve/); // control
    expect(body.verdictStart).toBe(csv); // old code: absent
  });

  test("a selection frozen before verdicts has no verdict; one without a duty point has verdict null, as the report and CSV tell them apart", async () => {
    const noDuty = await select("JSON no duty", { ...boosterInput(), duty: null });
    const none = await jsonOf(noDuty.id);
    expect(none.verdict).toBeNull();
    expect(csvFigures((await selectionPages(m, noDuty.id)).csv).get("verdict")?.[0]).toBe("no duty point set"); // control

    const before = await select("JSON before verdicts", boosterInput());
    const [row] = await db().select().from(selections).where(eq(selections.id, before.id));
    const frozen = JSON.parse(row.frozenJson);
    delete frozen.result.verdict; // as frozen before verdicts were kept
    await db().update(selections).set({ frozenJson: JSON.stringify(frozen) }).where(eq(selections.id, before.id));
    const pages = await selectionPages(m, before.id);
    expect(pages.text).toContain("no verdict was frozen with this report"); // control: the headline
    // The figures table's Verdict row and the chart's label say the same, never "no duty point set" (the duty is 40 m³/h at 38 m).
    expect(figureCell(pages.html, "Verdict")).toMatch(/^not judged: selected before Dutymark judged candidates/); // old code: "no duty point set: nothing to judge"
    expect(pages.text).not.toMatch(/no duty point set|no duty to judge/); // old code: both (table and chart label)
    expect(pages.text).toMatch(/ — not judged( — |$)/); // the chart's label
    expect(csvFigures(pages.csv).get("verdict")?.[0]).toBe("not judged (selected before verdicts existed)"); // control
    const old = await jsonOf(before.id);
    expect("verdict" in old).toBe(false); // old code: verdict null, which reads "no duty point set"
    expect("verdict" in old.result).toBe(false);
  });
});

describe("a long title and note with characters outside the BMP, selected through the system page's form", () => {
  test("are cut at 200 and 2000 characters whole: an emoji at the cut is kept or left out, never stored half (U+FFFD, '?')", async () => {
    const systemId = await createSystem(v, project, "Long names", boosterInput());
    const added = await addCandidate(v, systemId, tallowmere, DEFAULT_ADJUSTMENT);
    if (!added.ok) throw new Error(added.reason);
    // 199 letters and an emoji (two UTF-16 units, one character) are the 200 characters a title keeps (db/schema.ts varchar(200)).
    const title = `${"Ω".repeat(199)}😀 and more`;
    const note = `${"n".repeat(1999)}🚰 and more`;
    const r = await call(systemPage.action as never, { path: `/systems/${systemId}`, cookie: m.cookie, params: { id: String(systemId) }, form: { intent: "select", candidateId: String(added.id), title, note } });
    expect(r.status).toBe(302);
    const id = Number(r.location?.split("/").pop());
    const [row] = await db().select().from(selections).where(eq(selections.id, id));
    expect(row.title).toBe(`${"Ω".repeat(199)}😀`); // old code: "ΩΩ…Ω\uFFFD" (the emoji's first half, replaced)
    expect(row.note).toBe(`${"n".repeat(1999)}🚰`); // old code: "nn…n?"
    const pages = await selectionPages(m, id);
    expect(pages.csv[0][2]).toBe(row.title); // the CSV's first line carries the title whole
    expect(pages.text).toContain(`${"Ω".repeat(199)}😀`);
  });
});

describe("a pump with no operating point (the drooping pump against 41–42 m static, above its 40 m shut-off head)", () => {
  test("the tariff and the CSV's money columns still name the workspace's currency (no figures carry it then)", async () => {
    const input: SystemInput = { ...defaultSystemInput(), staticLow: 41, staticHigh: 42, duty: { flow: 36 * M3H, head: 41.5 } };
    const { id, f } = await select("No operating point", input, DEFAULT_ADJUSTMENT, droop);
    expect(f.result.operating).toBeNull(); // control
    expect(f.result.figures).toBeNull(); // control: nothing else holds the currency
    const currency = await workspaceCurrency(m.workspaceId);
    expect(currency).toMatch(/^[A-Z]{3}$/); // control
    const pages = await selectionPages(m, id);
    expect(pages.text).toContain(`4000 h/year at 0.2 ${currency} per kWh`); // old code: "at 0.2 per kWh" (defaultSystemInput: 4000 h, 0.2 per kWh)
    expect(csvFigures(pages.csv).get("annual_cost")?.[1]).toBe(currency); // old code: "currency"
    expect((await jsonOf(id)).currency).toBe(currency);
  });
});

/** A booster selection frozen now, then its frozen document changed by `change` in MariaDB: as frozen before a rule was kept. */
async function frozenBefore(name: string, change: (frozen: { result: Record<string, unknown> & { npsh?: Record<string, unknown> } }) => void) {
  const { id } = await select(name, boosterInput());
  const [row] = await db().select().from(selections).where(eq(selections.id, id));
  const frozen = JSON.parse(row.frozenJson);
  change(frozen);
  await db().update(selections).set({ frozenJson: JSON.stringify(frozen) }).where(eq(selections.id, id));
  return selectionPages(m, id);
}
const methods = (html: string) => textOf(/<h2[^>]*>Methods and assumptions<\/h2>([\s\S]*?)<\/section>/.exec(html)?.[1] ?? "");

describe("Methods and assumptions of a selection frozen before today's rules say what it was judged on", () => {
  test("today's: the corners and the demanding edge (control)", async () => {
    const said = methods((await frozenBefore("Methods now", () => {})).html);
    expect(said).toContain("judged at the design point and at each corner of the band");
    expect(said).toContain("Verdict: judged at the band's demanding edge");
  });
  test("before the corners were kept (npsh.judgedAt absent): the band's two edges, as its table reads them", async () => {
    const said = methods((await frozenBefore("Methods edges", (f) => { delete f.result.npsh!.judgedAt; })).html);
    expect(said).toContain("judged at the design point and at the band's two edges (selected before its four corners were judged)"); // old code: "…at each corner of the band"
    expect(said).not.toContain("at each corner of the band");
  });
  test("before NPSH over the band and verdicts (npsh and verdict absent): the design point only, and no verdict", async () => {
    const pages = await frozenBefore("Methods before", (f) => { delete f.result.npsh; delete f.result.verdict; });
    expect(pages.text).toContain("no verdict was frozen with this report"); // control: the headline
    const said = methods(pages.html);
    expect(said).toContain("judged at the design point only (selected before NPSH was judged over the band)"); // old code: "…at each corner of the band …, the lowest deciding"
    expect(said).toContain("Verdict: none was frozen with this selection"); // old code: "Verdict: judged at the band's demanding edge …"
    expect(said).not.toContain("demanding edge");
  });
});
