// One selection, every surface that shows its conclusions: the candidates table on the system page, the report (screen
// and its printed lines), the selection CSV and JSON, the systems read API and its preview, the chart's label. Each
// figure is read off each surface and held to the same frozen value (after the reader's units and the surface's
// rounding), each verdict to the same words, so a surface that works a figure out on its own, or rounds one into its
// limit, fails here. Selections (real route modules, MariaDB): the demo curve TFS Meregate 80, 2900 rpm, Ø195 mm
// (fixtures/demo/tallowmere.csv, invented) on an open booster at 35–37 m static lift — alone; 2 + 1 standby in parallel
// (staged by demand); trimmed to the duty; on a drive following the system curve with a 0 h step and a 0 % step; for a
// US-units user; a duty 0.01 m³/h above what the demanding edge delivers (short) and one at it (meets); a pump with no
// operating point and a purchase price. Check values: the frozen selection itself (what is compared is the surfaces
// with it and with each other); the rules are the product's (engine verdict.ts, stepPor.ts; common practice).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { users } from "@db/schema";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { listModels } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, getSelection, selectCandidate, setCandidatePrice } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type Adjustment, type SystemInput } from "~/lib/projects/hydraulics";
import type { FrozenSelection } from "~/lib/projects/stored-selection";
import { pumpsBasis } from "~/lib/projects/power-basis";
import { demoLibrary, M3H, viewerOfUser } from "~/lib/projects/test-kit";
import { fmtFlow, fmtHead, fmtPct, fmtPower, renderDeep, renderUnits, SI_UNITS, US_UNITS, type UnitChoice } from "~/lib/shared/units";
import { verdictLabel } from "~/engine";
import { bepPositionText, dutyFlowText, loadText } from "~/components/candidate-figures";
import { cycleColumns, cycleHoursText } from "~/components/CandidateEnergy";
import { totalPowerText } from "~/components/power-text";
import { moneyText } from "~/components/energy-numbers";
import { adjustmentText } from "~/components/workbench";
import { lccRangeNoteOf, lccYears } from "~/lib/projects/energy";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import * as apiPreview from "~/routes/api.v1.systems.$id.preview";
import * as selJson from "~/routes/selections.$id.export-json";
import * as sysPage from "~/routes/systems.$id";
import { call, makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";
import { csvFigures, figureCell, selectionPages, textOf, type SelectionPages } from "./selection-pages";

afterAll(() => closeDb());

const booster = (): SystemInput => ({ ...defaultSystemInput(), staticLow: 35, staticHigh: 37, duty: { flow: 40 * M3H, head: 40 } });
const profile = (steps: [number, number][], control: "fixed-speed" | "system-curve" = "fixed-speed"): SystemInput["energy"] =>
  ({ control, profile: steps.map(([flowFraction, hours]) => ({ flowFraction, hours })), years: 12, escalation: 0.025, discountRate: 0.06 });

type Case = { input: SystemInput; adj: Adjustment; us?: boolean; priceCents?: number };
const CASES: Record<string, Case> = {
  single: { input: booster(), adj: DEFAULT_ADJUSTMENT, priceCents: 250_000 },
  parallel: { input: { ...booster(), duty: { flow: 70 * M3H, head: 42 } }, adj: { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 }, priceCents: 600_000 },
  trim: { input: { ...booster(), duty: { flow: 34 * M3H, head: 35 } }, adj: { ...DEFAULT_ADJUSTMENT, method: "trim" } },
  drive: { input: { ...booster(), duty: { flow: 34 * M3H, head: 35 }, energy: profile([[1, 1000], [0.7, 2500], [0.5, 0], [0, 500]], "system-curve") }, adj: { ...DEFAULT_ADJUSTMENT, method: "speed" }, priceCents: 199_999 },
  us: { input: { ...booster(), energy: profile([[1, 2000], [0.75, 0], [0, 1000], [0.5, 1500]]) }, adj: { ...DEFAULT_ADJUSTMENT, motorRating: 7500, serviceFactor: 1.15 }, us: true, priceCents: 123_456 },
  // The demanding edge (most lift, aged pipe) delivers 42.3526 m³/h (control below): a duty 0.0074 m³/h above it is short, one just below it meets.
  short: { input: { ...booster(), duty: { flow: 42.36 * M3H, head: 40 } }, adj: DEFAULT_ADJUSTMENT },
  meets: { input: { ...booster(), duty: { flow: 42.35 * M3H, head: 40 } }, adj: DEFAULT_ADJUSTMENT },
  // 26–28 m: the pump runs past its curve's end at both edges, no operating point, no figures to name a currency.
  none: { input: { ...booster(), staticLow: 26, staticHigh: 28 }, adj: DEFAULT_ADJUSTMENT, priceCents: 250_000 },
  // Trimmed, and oversized as published (its savings name a trim), for a US reader: the whole mm a site sets beside inches.
  trimUs: { input: { ...booster(), duty: { flow: 34 * M3H, head: 35 } }, adj: { ...DEFAULT_ADJUSTMENT, method: "trim" }, us: true },
  oversizedUs: { input: { ...booster(), duty: { flow: 34 * M3H, head: 35 } }, adj: DEFAULT_ADJUSTMENT, us: true },
  // A pressure difference of 1e-4 Pa (1e-7 kPa): tiny, not zero (the others have none at all).
  tinyDp: { input: { ...booster(), pressureDifference: 1e-4 }, adj: DEFAULT_ADJUSTMENT },
};

type Got = { f: FrozenSelection; units: UnitChoice; pages: SelectionPages; system: string; json: Record<string, unknown>; api: Record<string, unknown>; preview: Record<string, unknown>; currency: string; apiAsReader: Record<string, unknown> };
const got: Record<string, Got> = {};

beforeAll(async () => {
  const m = await makeMember("admin");
  const us = await makeMember("admin", m.workspaceId);
  await db().update(users).set({ unitSystem: "US" }).where(eq(users.id, us.userId));
  const v = await viewerOfUser(m.userId);
  const lib = await demoLibrary(v, "Surfaces pumps");
  const setId = (await listModels(v, lib)).find((x) => x.name === "TFS Meregate 80")!.curves.find((c) => c.speed === 2900 && c.impellerDiameter != null && Math.abs(c.impellerDiameter - 0.195) < 1e-9)!.id;
  const project = await createProject(v, { name: "Surfaces", site: "", description: "" });
  const token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
  const auth = { authorization: `Bearer ${token}` };
  for (const [name, c] of Object.entries(CASES)) {
    const who: TestMember = c.us ? us : m;
    const systemId = await createSystem(v, project, `System ${name}`, c.input);
    const added = await addCandidate(v, systemId, setId, c.adj);
    if (!added.ok) throw new Error(added.reason);
    if (c.priceCents) await setCandidatePrice(v, added.id, c.priceCents);
    const system = (await loadedPage(who, sysPage, "/systems/:id", `/systems/${systemId}`, { id: String(systemId) })).html;
    const api = await call(apiSystem.loader as never, { path: `/api/v1/systems/${systemId}`, params: { id: String(systemId) }, headers: auth });
    const preview = await call(apiPreview.action as never, { path: `/api/v1/systems/${systemId}/preview`, params: { id: String(systemId) }, method: "POST", headers: { ...auth, "content-type": "application/json" }, body: JSON.stringify({ input: c.input }) });
    // The read API as the reader (session: text in the reader's units; a token reads SI).
    const asReader = await call(apiSystem.loader as never, { path: `/api/v1/systems/${systemId}`, params: { id: String(systemId) }, cookie: who.cookie });
    expect([api.status, preview.status, asReader.status]).toEqual([200, 200, 200]);
    const id = await selectCandidate(v, added.id, `Selection ${name}`, "");
    const json = await call(selJson.loader as never, { path: `/selections/${id}/export.json`, cookie: who.cookie, params: { id: String(id) } });
    const f = (await getSelection(v, id)).frozen;
    got[name] = {
      f, units: c.us ? US_UNITS : SI_UNITS, pages: await selectionPages(who, id), system,
      json: (typeof json.body === "string" ? JSON.parse(json.body) : json.body) as Record<string, unknown>,
      api: (api.body as { candidates: Record<string, unknown>[] }).candidates[0], preview: (preview.body as { candidates: Record<string, unknown>[] }).candidates[0],
      currency: "EUR", // the workspace's (harness default)
      apiAsReader: (asReader.body as { candidates: Record<string, unknown>[] }).candidates[0],
    };
  }
}, 300_000);

const NAMES = Object.keys(CASES);
/** The CSV writes 10 significant digits (selection-export.server.ts): the same number to that precision. */
const near = (csv: string | undefined, want: number | null | undefined) => expect(Math.abs(Number(csv) - want!)).toBeLessThanOrEqual(Math.abs(want!) * 1e-9);
const res = (x: Record<string, unknown>) => x.result as FrozenSelection["result"] & Record<string, unknown>;

describe.each(NAMES)("%s: the verdict and its qualifiers read alike everywhere", (name) => {
  test("status: report, system page, CSV, JSON, read API, preview, chart label", () => {
    const g = got[name];
    const status = g.f.result.verdict!.status;
    if (name === "short") expect(status).toBe("short"); // controls: the two edge cases fall on either side of the rule
    if (name === "meets" || name === "single") expect(status).toBe("meets");
    expect(/data-testid="report-verdict" data-status="([^"]+)"/.exec(g.pages.html)?.[1]).toBe(status);
    expect(/data-testid="verdict-\d+" data-status="([^"]+)"/.exec(g.system)?.[1]).toBe(status);
    expect(csvFigures(g.pages.csv).get("verdict")?.[0]).toBe(status);
    expect((g.json.verdict as { status: string }).status).toBe(status);
    expect(res(g.api).verdict?.status).toBe(status);
    expect(res(g.preview).verdict?.status).toBe(status);
    // The chart's label: the pump's label, then the verdict's words (workbench.tsx candidateSeries), on the screen and in its printed table.
    expect(textOf(g.pages.html)).toContain(`${renderUnits(g.f.pump.label, g.units)}${adjustmentText({ adjustment: g.f.adjustment, result: renderDeep(g.f.result, g.units) }, g.units)} — ${verdictLabel(status)}`);
  });
  test("qualifiers (motor, NPSH, start, staged NPSH, minimum flow): the same words in SI in the CSV, JSON and read APIs", () => {
    const g = got[name];
    const rows = csvFigures(g.pages.csv);
    for (const [csv, key] of [["verdict_motor", "verdictMotor"], ["verdict_npsh", "verdictNpsh"], ["verdict_start", "verdictStart"], ["verdict_staged_npsh", "verdictStagedNpsh"], ["verdict_min_flow", "verdictMinFlow"]] as const) {
      const inJson = (g.json[key] as string | null) ?? "";
      expect(rows.get(csv)?.[0] ?? "", csv).toBe(inJson);
      expect(renderUnits((res(g.api)[key] as string | null) ?? "", SI_UNITS), key).toBe(inJson);
      expect(renderUnits((res(g.preview)[key] as string | null) ?? "", SI_UNITS), key).toBe(inJson);
      // On the report's verdict line in the reader's units: the JSON's words in SI are those rendered in SI.
      if (inJson) expect(renderUnits(inJson, SI_UNITS)).toBe(inJson);
    }
  });
});

describe.each(NAMES.filter((n) => n !== "none"))("%s: the figures read alike everywhere", (name) => {
  test("operating point, efficiency, BEP position: report and system page cells from the frozen figures; CSV, JSON and API the same numbers", () => {
    const g = got[name];
    const r = g.f.result, fig = r.figures!, rows = csvFigures(g.pages.csv);
    for (const [k, want] of [["operating_flow", r.operating!.flow], ["operating_head", r.operating!.head], ["efficiency", fig.efficiency], ["bep_ratio", fig.bepRatio], ["shaft_power", fig.shaftPower]] as const) near(rows.get(k)?.[0], want);
    for (const other of [res(g.api), res(g.preview), g.json.result as typeof r]) {
      expect(other.operating).toEqual(r.operating);
      expect(other.figures!.shaftPower).toBe(fig.shaftPower);
      expect(other.figures!.bepFlow).toBe(fig.bepFlow);
      expect(other.figures!.motor.rating).toBe(fig.motor.rating);
    }
    for (const page of [g.pages.html, g.system]) {
      expect(figureCell(page, "Operating flow (design curve)")).toBe(fmtFlow(g.units, r.operating!.flow));
      expect(figureCell(page, "Efficiency")).toBe(fmtPct(fig.efficiency));
      expect(figureCell(page, "Position vs BEP")).toBe(bepPositionText(fig.bepRatio!, fig.inPor));
    }
  });
  test("shaft power per pump and together, motor rating and load: the same on both tables, the CSV's per-pump rows its totals ÷ duty pumps", () => {
    const g = got[name];
    const fig = g.f.result.figures!, rows = csvFigures(g.pages.csv), b = pumpsBasis(g.f.adjustment);
    for (const page of [g.pages.html, g.system]) {
      expect(figureCell(page, "Shaft power")).toBe(totalPowerText(g.units, fig.shaftPower, b));
      const motor = figureCell(page, "Motor");
      expect(motor.startsWith(`${fmtPower(g.units, fig.motor.rating)} (`), motor).toBe(true);
      expect(motor).toContain(` · ${loadText(fig.motorLoadAtDuty, fig.motorLimit! / fig.motor.rating!)} load`);
      // The load beside the rating is one pump's shaft power over it (a total of several pumps is never set against one motor).
      expect(fig.motorLoadAtDuty! * fig.motor.rating!).toBeCloseTo(fig.shaftPower! / (b?.n ?? 1), 6);
    }
    if (b) near(rows.get("shaft_power_per_pump")?.[0], fig.shaftPower! / b.n);
    expect(Number(rows.get("motor_rating")?.[0])).toBe(fig.motor.rating);
  });
  test("the band's flows beside the verdict: the demanding edge printed on the same side of the duty as its value, on both tables and the report's duty row", () => {
    const g = got[name];
    const band = g.f.result.band!, edge = band.find((x) => x.edge === g.f.result.verdict!.edge)!;
    const duty = g.f.system.input.duty!.flow;
    const number = (t: string) => Number(/([\d.]+)/.exec(t)![1]);
    const dutyRow = /Duty point ([\d.]+ \S+) at/.exec(g.pages.text)![1];
    for (const page of [g.pages.html, g.system]) {
      const shown = figureCell(page, "Flow over the band").split(" – ");
      const edgeShown = shown[shown.length === 1 ? 0 : band.indexOf(edge)];
      // The verdict is short exactly when the edge is below the duty here (tolerance −0 %): so must the printed numbers be.
      const printedBelow = number(edgeShown) < number(dutyRow), printedSame = number(edgeShown) === number(dutyRow);
      expect(printedSame && edge.flow !== duty, `${edgeShown} beside a duty of ${dutyRow}`).toBe(false);
      expect(printedBelow, `${edgeShown} beside a duty of ${dutyRow}`).toBe(edge.flow! < duty);
    }
  });
});

describe.each(["single", "parallel", "drive", "us"])("%s: the duty cycle and the life-cycle cost read alike everywhere", (name) => {
  test("steps: hours and energy on the report's table as the CSV's rows; totals; the 0 h and 0 % steps", () => {
    const g = got[name];
    const cycle = g.f.energy!.cycle!, rows = csvFigures(g.pages.csv);
    const csvSteps = g.pages.csv.filter((r) => r[0] === "duty_cycle");
    expect(csvSteps).toHaveLength(cycle.steps.length);
    const head = g.pages.csv[g.pages.csv.indexOf(csvSteps[0]) - 1];
    csvSteps.forEach((r, i) => {
      expect(Number(r[head.indexOf("hours_h")])).toBe(cycle.steps[i].hours);
      near(r[head.indexOf("energy_kwh")], cycle.steps[i].energyKWh);
    });
    expect(Number(rows.get("cycle_total_hours")?.[0])).toBe(cycle.totalHours);
    near(rows.get("cycle_annual_energy_electrical")?.[0], cycle.annualEnergyKWh);
    const total = textOf(/data-testid="cycle-total-0"[^>]*>([\s\S]*?)<\/td>/.exec(g.pages.html)![1]);
    expect(total.startsWith(`${Math.round(cycle.annualEnergyKWh)} kWh · ${moneyText(g.f.energy!.annualCost, g.currency)}`), total).toBe(true);
    if (name === "drive" || name === "us") {
      expect(cycle.steps.some((s) => s.hours === 0 && s.flowFraction > 0)).toBe(true); // controls: a 0 h step and a 0 % step
      expect(cycle.steps.some((s) => s.flowFraction === 0 && s.status === "no-demand")).toBe(true);
      expect(csvSteps.find((r) => r[head.indexOf("flow_fraction")] === "0")?.[head.indexOf("status")]).toBe("stopped, no demand");
    }
  });
  test("every step's POR note judges against the BEP the figures name (Position vs BEP, the chart's BEP), at the step's speed", () => {
    const g = got[name];
    const cycle = g.f.energy!.cycle!, fig = g.f.result.figures!;
    const undo = g.f.energy!.control !== "fixed-speed" && g.f.adjustment.method === "speed" ? g.f.result.ratio : 1;
    let notes = 0;
    cycle.steps.forEach((s, i) => {
      const w = cycle.warnings.find((x) => x.parameter === `profile[${i}]` && "bepRatio" in x) as { bepRatio: number } | undefined;
      if (!w) return;
      notes++;
      expect(w.bepRatio, `step ${i + 1}`).toBeCloseTo(s.flow / (s.pumpsRunning ?? 1) / ((fig.bepFlow! / undo) * (s.speedRatio ?? 1)), 9);
    });
    expect(notes).toBeGreaterThan(0); // control: the cycles have steps off the BEP
  });
  test("life-cycle cost: total, years, rates and purchase price, the report's line as the CSV's figures, money in the CSV's currency", () => {
    const g = got[name];
    const lcc = g.f.energy!.lcc!, rows = csvFigures(g.pages.csv);
    near(rows.get("lcc_total_present_value")?.[0], lcc.total);
    expect(Number(rows.get("lcc_years")?.[0])).toBe(lcc.yearly.length);
    expect(Number(rows.get("lcc_tariff_escalation")?.[0])).toBe(lcc.escalation);
    expect(Number(rows.get("lcc_discount_rate")?.[0])).toBe(lcc.discountRate);
    expect(rows.get("lcc_total_present_value")?.[1]).toBe(g.currency);
    const shown = textOf(/data-testid="lcc-0"[^>]*>([\s\S]*?)<\/p>/.exec(g.pages.html)![1]);
    expect(shown).toContain(`Life-cycle cost over ${lccYears(lcc)}: ${moneyText(lcc.total, g.currency)} = purchase ${lcc.purchaseGiven ? moneyText(lcc.purchase, g.currency) : "not given (0)"}`);
    // Beside it, the priced steps outside the allowable flow range (lcc-range-note.ts), as the CSV's lcc_range_note says them.
    const range = lccRangeNoteOf(g.f.energy);
    const cell = `${moneyText(lcc.total, g.currency)} over ${lccYears(lcc)}${range ? ` — ▲ ${renderUnits(range, g.units)}` : ""}`;
    expect(rows.get("lcc_range_note")?.[0] ?? "").toBe(range ? renderUnits(range, SI_UNITS) : "");
    expect(figureCell(g.pages.html, "Life-cycle cost (present value)")).toBe(cell);
    expect(figureCell(g.system, "Life-cycle cost (present value)")).toBe(cell);
  });
});

describe("money is named in its currency wherever it is shown", () => {
  test("no operating point (no figures): the purchase price reads in the workspace's currency on both tables, as the CSV and the price form name it", () => {
    const g = got.none;
    expect(g.f.result.operating).toBeNull(); // control: nothing at the operating point names a currency
    expect(csvFigures(g.pages.csv).get("purchase_price")).toEqual(["2500", "EUR"]);
    expect(figureCell(g.pages.html, "Purchase price")).toBe("2500.00 EUR");
    expect(figureCell(g.system, "Purchase price")).toBe("2500.00 EUR");
    for (const page of [g.pages.text, textOf(g.system)]) expect(page).not.toContain("(currency not set)");
  });
});

describe("the band's flow beside a short verdict (rounding must not hide which side of the duty it lies)", () => {
  test("demanding edge 42.3526 m³/h (control), duty 42.36 m³/h: short, and the tables print 42.35 m³/h beside a duty of 42.36 m³/h", () => {
    const g = got.short;
    expect(g.f.result.band!.find((b) => b.edge === g.f.result.verdict!.edge)!.flow! / M3H).toBeCloseTo(42.3526, 4);
    expect(figureCell(g.pages.html, "Flow over the band")).toBe("50.2 m³/h – 42.35 m³/h");
    expect(figureCell(g.system, "Flow over the band")).toBe("50.2 m³/h – 42.35 m³/h");
    expect(g.pages.text).toContain("Duty point 42.36 m³/h at 40.0 m");
  });
  test("duty 42.35 m³/h: meets, the edge printed 42.353 m³/h beside a duty of 42.35 m³/h", () => {
    const g = got.meets;
    expect(figureCell(g.pages.html, "Flow over the band")).toBe("50.2 m³/h – 42.353 m³/h");
    expect(g.pages.text).toContain("Duty point 42.35 m³/h at 40.0 m");
  });
});

// Text on the pages is rendered in the reader's units from the frozen SI tokens; the US reader's figures above were built
// with the same units, so a table that converted one figure differently would fail there too.
test("the US reader's tables are in US units", () => {
  expect(figureCell(got.us.pages.html, "Operating flow (design curve)")).toMatch(/ gpm$/);
  expect(renderDeep("⟦flow|0.01⟧", US_UNITS)).toBe(fmtFlow(US_UNITS, 0.01));
});

describe("whose the duty cycle's energy is: one wording on every surface (pumps in parallel staged by demand)", () => {
  test("2 + 1 in parallel: the tables, the printed line, the methods and the CSV's basis say the pumps running at each step, never 'for 2 duty pumps'", () => {
    const g = got.parallel;
    const cycle = g.f.energy!.cycle!, rows = csvFigures(g.pages.csv), whose = "the pumps running at each step";
    expect(cycle.steps.some((st) => st.pumpsRunning === 1)).toBe(true); // control: one of the two runs alone at some step
    for (const page of [g.pages.html, g.system]) {
      expect(figureCell(page, `Energy per year over the duty cycle${cycleHoursText([cycle])}`)).toBe(`${cycleColumns(cycle).energy.total} kWh for ${whose}`);
      // At the operating point both duty pumps run: that total stays theirs (control: the wording is the cycle's alone).
      expect(figureCell(page, `Energy per year at the operating point × 4000 h/yr (electrical, every running hour there)`)).toMatch(/ kWh for 2 duty pumps$/);
    }
    expect(textOf(/data-testid="energy-print"[^>]*>([\s\S]*?)<\/p>/.exec(g.pages.html)![1])).toContain(`Energy per year, ${whose}, over ${cycle.steps.length} steps`);
    expect(g.pages.text).toContain(`and over the duty cycle for ${whose} (staged by demand)`); // the report's methods
    for (const k of ["cycle_annual_energy_electrical", "cycle_energy_cost_per_year", "lcc_energy_present_value"]) expect(rows.get(k)?.[2], k).toBe(whose);
    expect(rows.get("purchase_price")?.[2]).toBe("all 2 pumps in parallel + 1 standby");
    expect(rows.get("lcc_total_present_value")?.[2]).toBe(`purchase: all 2 pumps in parallel + 1 standby; energy: ${whose}`);
    expect(rows.get("annual_energy_electrical")?.[2]).toBe("2 duty pumps together");
  });
});

/** The chart's tables as rendered: the screen's "Table view" and the printed copy (DutyChart.tsx), each as its text and its points rows' cells. */
const chartTables = (html: string) => html.split('data-tables=""').slice(1).map((t) => {
  const part = t.slice(0, t.indexOf("</div>"));
  const points = part.slice(part.indexOf('data-table="points"'));
  const rows = [...points.matchAll(/<tr><th[^>]*scope="row">((?:(?!<\/th>).)*)<\/th>((?:<td[^>]*>(?:(?!<\/td>).)*<\/td>)+)<\/tr>/g)].map((m) => [textOf(m[1]), ...[...m[2].matchAll(/<td[^>]*>(.*?)<\/td>/g)].map((c) => textOf(c[1]))]);
  return { text: textOf(part), rows };
});
const legendOf = (html: string) => textOf(html.slice(html.indexOf('data-legend=""'), html.indexOf("data-table-view")));
const numberPart = (text: string) => text.split(" ")[0];

describe("the chart reads as the tables: the unit-aware formatters, the duty apart from the flows delivered against it", () => {
  test("short by 0.0074 m³/h: the legend and both chart tables print the duty 42.36 m³/h, as the report's duty row, never 42.4", () => {
    const g = got.short;
    expect(g.f.result.verdict!.status).toBe("short"); // control
    const want = dutyFlowText(SI_UNITS, g.f.system.input.duty!.flow, g.f.result.band!.map((b) => b.flow));
    expect(want).toBe("42.36 m³/h");
    for (const page of [g.pages.html, g.system]) {
      expect(legendOf(page)).toContain(`Duty point ${want} at 40.0 m`);
      const tables = chartTables(page);
      expect(tables).toHaveLength(2);
      for (const t of tables) expect(t.rows.find((r) => r[0] === "Duty point (required)")?.slice(1, 3)).toEqual(["42.36", "40.0"]);
    }
  });
  test.each(["us", "trimUs"])("%s: a US reader's chart tables and legend are in US units, each number as the candidates table prints it", (name) => {
    const g = got[name];
    const r = g.f.result, fig = r.figures!, u = US_UNITS;
    const label = `${renderUnits(g.f.pump.label, u)}${adjustmentText({ adjustment: g.f.adjustment, result: renderDeep(r, u) }, u)} — ${verdictLabel(r.verdict!.status)}`;
    for (const page of [g.pages.html, g.system]) {
      const tables = chartTables(page);
      expect(tables).toHaveLength(2);
      for (const t of tables) {
        expect(t.text).toMatch(/Flow \(gpm\)/); // control: the table is there, in US units
        expect(t.text, "an SI unit word in a US reader's chart table").not.toMatch(/m³\/h|kPa|\bkW\b|\bmm\b| m\b|\(m\)/);
        const op = t.rows.find((x) => x[0] === `1. ${label} — operating point`)!;
        expect(op.slice(1, 4)).toEqual([numberPart(fmtFlow(u, r.operating!.flow)), numberPart(fmtHead(u, r.operating!.head)), numberPart(fmtPct(fig.efficiency))]);
        const duty = t.rows.find((x) => x[0] === "Duty point (required)")!;
        expect(duty[1]).toBe(numberPart(dutyFlowText(u, g.f.system.input.duty!.flow, r.band!.map((b) => b.flow))));
      }
      expect(legendOf(page)).toContain(`${fmtFlow(u, r.operating!.flow)} at ${fmtHead(u, r.operating!.head)} · η ${fmtPct(fig.efficiency)}`);
      expect(legendOf(page)).not.toMatch(/m³\/h|kPa|\bkW\b|\bmm\b| m\b/);
    }
  });
});

/** The report's "Pressure difference" as printed. */
const pressureDifference = (html: string) => textOf(/<dt[^>]*>Pressure difference<\/dt>(?:<!--.*?-->)*<dd[^>]*>(.*?)<\/dd>/.exec(html)![1]);

describe("the report's pressure difference: none reads 0, a tiny one never reads as zero", () => {
  test("zero (SI and US): '0 kPa', '0 psi', not a rounded '0.000'", () => {
    expect(got.single.f.system.input.pressureDifference).toBe(0); // control
    expect(pressureDifference(got.single.pages.html)).toBe("0 kPa");
    expect(pressureDifference(got.us.pages.html)).toBe("0 psi");
  });
  test("1e-4 Pa: 1.00e-7 kPa, not zero, as every number too small for its decimals (helper \"numtext\")", () => {
    const shown = pressureDifference(got.tinyDp.pages.html);
    expect(shown).toBe("1.00e-7 kPa"); // 1e-4 Pa = 1e-7 kPa (SI prefixes); was "0.0000001 kPa" where a plain token read "1.00e-7 kPa"
    expect(Number(numberPart(shown))).toBeGreaterThan(0);
  });
});

describe("a trim is set in whole mm: a US reader sees the whole mm wherever the rounding to it is said", () => {
  const mmOf = (g: Got) => Math.round(g.f.result.diameter! * 1000);
  test("SI: the Adjustment cell, the notes, CSV, JSON and the read API write the diameter in mm alone", () => {
    const g = got.trim;
    const mm = mmOf(g);
    expect(g.f.result.diameter! * 1000).toBeCloseTo(mm, 6); // control: whole mm, rounded up (setting-step.ts)
    for (const page of [g.pages.html, g.system]) expect(figureCell(page, "Adjustment")).toMatch(new RegExp(`^trimmed to Ø${mm} mm \\(solved Ø[\\d.]+ mm, rounded up to keep the duty\\)$`));
    const note = csvFigures(g.pages.csv).get("ratio_note")![0];
    expect(note).toContain(`set and judged at Ø${mm} mm: rounded up to the next whole mm`);
    expect(note).not.toContain("[");
    expect((g.json.result as { ratioNote: string }).ratioNote).toBe(note);
    expect(res(g.api).ratioNote).toBe(note);
  });
  test.each(["trimUs", "oversizedUs"])("%s: every text saying 'whole mm' shows the whole mm beside inches (table, report, read API as the reader); CSV and JSON in SI", (name) => {
    const g = got[name];
    const texts = { system: textOf(g.system), report: g.pages.text, api: JSON.stringify(g.apiAsReader) };
    for (const [where, text] of Object.entries(texts)) {
      const at = [...text.matchAll(/whole mm/g)].map((m) => m.index!);
      expect(at.length, where).toBeGreaterThan(0); // control: the rounding is said there
      for (const i of at) expect(text.slice(Math.max(0, i - 160), i), `${where}: …${text.slice(i - 160, i + 8)}`).toMatch(/Ø[\d.]+ in \[\d+ mm\]/);
    }
    if (name === "trimUs") {
      const mm = mmOf(g);
      for (const page of [g.pages.html, g.system]) expect(figureCell(page, "Adjustment")).toMatch(new RegExp(`^trimmed to Ø[\\d.]+ in \\[${mm} mm\\] \\(solved Ø[\\d.]+ in \\[[\\d.]+ mm\\], rounded up to keep the duty\\)$`));
      expect(csvFigures(g.pages.csv).get("ratio_note")![0]).toContain(`set and judged at Ø${mm} mm: rounded up to the next whole mm`);
    } else {
      expect(g.f.result.verdict!.status).toBe("oversized"); // control: its savings name a trim "the next whole mm up"
      expect(csvFigures(g.pages.csv).get("verdict_reason_1")?.[0] ?? "").not.toContain(" in [");
    }
  });
});
