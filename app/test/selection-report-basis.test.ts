// Pumps in parallel or series: the report, its printed lines and the CSV name each power figure's basis. Shaft power,
// electrical input and energy are worked out for all duty pumps together; the largest power on the curve, the motor
// (rating, overload check, load) and its suggestion are one pump's. Shown bare side by side, "Shaft power 10.6 kW" read
// as on a 7.5 kW motor marked non-overloading. A single pump reads as before. Real route modules and MariaDB; the
// Tallowmere demo curves (invented, fixtures/demo/); the expected texts are built here from the frozen figures with the
// page's own formatter, so what is checked is which basis each figure is shown with and that per pump = total ÷ duty pumps
// (identical pumps share the duty equally: common practice). The chart draws the combined curve: its power panel, tables and
// legend name the same basis.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { addCandidate, createProject, createSystem, getSelection, searchForSystem, selectCandidate, setCandidatePrice } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, type Adjustment } from "~/lib/projects/hydraulics";
import type { FrozenSelection } from "~/lib/projects/stored-selection";
import { boosterInput, demoLibrary, viewerOfUser } from "~/lib/projects/test-kit";
import { fmtPower, renderDeep, SI_UNITS } from "~/lib/shared/units";
import { formatValue } from "~/components/chart/format";
import { makeMember, type TestMember } from "./harness";
import { csvFigures, csvHeader, figureCell, selectionPages, textOf, type SelectionPages } from "./selection-pages";

afterAll(() => closeDb());

const ARRANGEMENTS: Record<"single" | "parallel" | "series", Adjustment> = {
  single: DEFAULT_ADJUSTMENT,
  parallel: { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 },
  series: { ...DEFAULT_ADJUSTMENT, arrangement: "series", dutyPumps: 2 },
};
let m: TestMember;
const got = {} as Record<keyof typeof ARRANGEMENTS, { f: FrozenSelection; pages: SelectionPages }>;

beforeAll(async () => {
  m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  await demoLibrary(v, "Basis pumps");
  const project = await createProject(v, { name: "Power basis", site: "", description: "" });
  // The pump the booster's search ranks first, alone and 2 + 1 in parallel on the booster, 2 in series on a booster with
  // 30 m more static lift (the tests' first control checks that the pumps run there: a shaft power at the operating point).
  const setId = (await searchForSystem(v, await createSystem(v, project, "Booster", boosterInput()))).results[0].curveSetId;
  const high = { ...boosterInput(), staticLow: 56, staticHigh: 60, duty: { flow: boosterInput().duty!.flow, head: 68 } };
  for (const [name, adj] of Object.entries(ARRANGEMENTS) as [keyof typeof ARRANGEMENTS, Adjustment][]) {
    const systemId = await createSystem(v, project, `Booster ${name}`, name === "series" ? high : boosterInput());
    const added = await addCandidate(v, systemId, setId, adj);
    if (!added.ok) throw new Error(added.reason);
    await setCandidatePrice(v, added.id, 300_000); // 3000.00 in the workspace's currency, as entered for the candidate as offered
    const id = await selectCandidate(v, added.id, `Booster ${name}`, "");
    got[name] = { f: renderDeep((await getSelection(v, id)).frozen, SI_UNITS), pages: await selectionPages(m, id) };
  }
});

const p = (w: number | null | undefined) => fmtPower(SI_UNITS, w);

describe.each(["parallel", "series"] as const)("2 pumps in %s: every power figure names its basis", (name) => {
  test("the figures table (screen and print): shaft power and electrical input per pump and for the 2 duty pumps; largest power and motor per pump", () => {
    const { f, pages } = got[name];
    const fig = f.result.figures!;
    expect(fig.shaftPower).toBeGreaterThan(0); // control: the pumps run on the system (an operating point)
    expect(figureCell(pages.html, "Shaft power")).toBe(`${p(fig.shaftPower! / 2)} per pump, ${p(fig.shaftPower)} for 2 duty pumps`);
    expect(figureCell(pages.html, "Largest power on curve")).toBe(`${p(fig.maxPower)} per pump`);
    expect(figureCell(pages.html, "Electrical input")).toBe(`${p(fig.motor!.electricalPower! / 2)} per pump, ${p(fig.motor!.electricalPower)} for 2 duty pumps`);
    const motor = figureCell(pages.html, "Motor");
    expect(motor).toMatch(new RegExp(`^${p(fig.motor!.rating).replace(".", "\\.")} \\(suggested\\) on each pump · `));
    expect(motor).toMatch(/ % load per pump at the operating point/);
    // The suggestion's "duty" is the per-pump shaft power shown above it, never the total.
    expect(/\(duty ([\d.]+ kW)\)/.exec(motor)?.[1]).toBe(p(fig.shaftPower! / 2));
    expect(motor).toContain("Suggested per pump (each pump has its own motor)");
    const band = figureCell(pages.html, "Shaft power over the band");
    expect(band).toMatch(/ per pump, .* for 2 duty pumps$/);
    expect(figureCell(pages.html, "Energy per year at the operating point × 4000 h/yr (electrical, every running hour there)")).toMatch(/ kWh for 2 duty pumps$/);
  });

  test("the printed energy line says whose it is: the 2 duty pumps in series, the pumps running at each step in parallel (staged by demand)", () => {
    const printed = /data-testid="energy-print"[^>]*>([\s\S]*?)<\/p>/.exec(got[name].pages.html)?.[1];
    expect(printed).toBeTruthy();
    const whose = name === "parallel" ? "the pumps running at each step" : "2 duty pumps together";
    expect(textOf(printed!)).toMatch(new RegExp(`^Energy per year, ${whose}, over \\d+ steps, \\d+ h/yr: `));
  });

  test("the CSV: a basis column on the figures, per-pump rows beside the totals, and the curve, band and cycle powers named as totals", () => {
    const { f, pages } = got[name];
    const fig = f.result.figures!;
    expect(csvHeader(pages.csv, "figures")).toEqual(["section", "figure", "value", "unit", "basis"]);
    const rows = csvFigures(pages.csv);
    const total = "2 duty pumps together";
    expect(rows.get("shaft_power")?.slice(1)).toEqual(["W", total]);
    expect(Number(rows.get("shaft_power")?.[0])).toBeCloseTo(fig.shaftPower!, 3);
    expect(rows.get("shaft_power_per_pump")?.slice(1)).toEqual(["W", "per pump"]);
    expect(Number(rows.get("shaft_power_per_pump")?.[0])).toBeCloseTo(fig.shaftPower! / 2, 3);
    expect(Number(rows.get("electrical_input_per_pump")?.[0])).toBeCloseTo(fig.motor!.electricalPower! / 2, 3);
    for (const perPump of ["max_power_on_curve", "motor_non_overloading", "motor_rating", "motor_suggested", "motor_suggestion_basis", "efficiency", "npsh_required"]) expect(rows.get(perPump)?.[2], perPump).toBe("per pump");
    for (const together of ["operating_flow", "hydraulic_power", "electrical_input", "annual_energy_electrical", "annual_cost"]) expect(rows.get(together)?.[2], together).toBe(total);
    for (const s of ["pump_curve", "band"]) expect(csvHeader(pages.csv, s), s).toContain("shaft_power_all_duty_pumps_w");
    // The duty cycle's powers: all duty pumps' in series; in parallel the pumps running at each step (staged by demand, engine dutyStaging.ts).
    const cyclePowers = name === "series" ? ["shaft_power_all_duty_pumps_w", "electrical_input_all_duty_pumps_w"] : ["pumps_running", "shaft_power_pumps_running_w", "shaft_power_per_pump_w", "electrical_input_pumps_running_w"];
    expect(csvHeader(pages.csv, "duty_cycle")).toEqual(expect.arrayContaining(cyclePowers));
    expect(pages.csv.some((r) => r[0].startsWith(`# 2 pumps in ${name}`))).toBe(true);
  });
});

/** The report's chart as read: its power panel's title, each copy of its tables (screen "Table view", then the printed one:
 * the curves table's power column and the points table's power header, the operating point's power there) and the legend. */
function chartPower(html: string) {
  const title = /<g data-frame="power"><text[^>]*>(.*?)<\/text>/.exec(html)?.[1];
  const tables = html.split('data-tables=""').slice(1).map((t) => {
    const points = t.slice(t.indexOf('data-table="points"'));
    const heads = (part: string) => [...part.matchAll(/<th[^>]*scope="col"[^>]*>(.*?)<\/th>/g)].map((m) => textOf(m[1]));
    const opRow = /— operating point<\/th>((?:<td[^>]*>.*?<\/td>){5})/.exec(points)?.[1] ?? "";
    return {
      curvePower: heads(t.slice(0, t.indexOf('data-table="points"'))).filter((h) => h.startsWith("Power")),
      pointsPower: heads(points).filter((h) => h.startsWith("Power")),
      opPower: textOf([...opRow.matchAll(/<td[^>]*>(.*?)<\/td>/g)][3]?.[1] ?? ""),
    };
  });
  return { title: title && textOf(title), tables, legend: textOf(html.slice(html.indexOf('data-legend=""'))) };
}

describe.each(["parallel", "series"] as const)("2 pumps in %s: the chart names its power's basis", (name) => {
  test("power panel, the screen and printed tables and the legend: shaft power of the 2 duty pumps together, the figure shown being the total", () => {
    const { f, pages } = got[name];
    const c = chartPower(pages.html);
    expect(c.title).toBe("Shaft power, 2 duty pumps together (kW)");
    expect(c.tables).toHaveLength(2); // screen "Table view" and the printed copy
    for (const t of c.tables) {
      expect(t.curvePower).toEqual(["Power, 2 duty pumps together (kW)"]);
      expect(t.pointsPower).toEqual(["Power, 2 duty pumps together (kW)"]);
      // What it labels is the total: the figures' shaft power (all duty pumps, hydraulics.ts), in kW (1 kW = 1000 W, SI).
      expect(t.opPower).toBe(formatValue(f.result.figures!.shaftPower! / 1000));
    }
    expect(c.legend).toContain(`${formatValue(f.result.figures!.shaftPower! / 1000)} kW (2 duty pumps together)`);
  });
});

describe("a single pump reads as before", () => {
  test("chart: power panel and tables without a basis", () => {
    const c = chartPower(got.single.pages.html);
    expect(c.title).toBe("Shaft power (kW)");
    for (const t of c.tables) expect([...t.curvePower, ...t.pointsPower]).toEqual(["Power (kW)", "Power (kW)"]);
  });
  test("report: bare figures, no basis words", () => {
    const { f, pages } = got.single;
    expect(figureCell(pages.html, "Shaft power")).toBe(p(f.result.figures!.shaftPower));
    expect(figureCell(pages.html, "Largest power on curve")).toBe(p(f.result.figures!.maxPower));
    expect(pages.text).not.toMatch(/per pump|duty pumps|on each pump/);
  });
  test("CSV: four columns on the figures, no per-pump rows, powers as before", () => {
    const { pages } = got.single;
    expect(csvHeader(pages.csv, "figures")).toEqual(["section", "figure", "value", "unit"]);
    expect([...csvFigures(pages.csv).keys()].filter((k) => k.endsWith("_per_pump"))).toEqual([]);
    expect(csvHeader(pages.csv, "band")).toContain("shaft_power_w");
    expect(pages.csvText).not.toMatch(/all_duty_pumps|per pump/);
  });
});

describe("the purchase price says what it covers", () => {
  test("several pumps: all of them, standby included; one pump: as before", () => {
    expect(figureCell(got.parallel.pages.html, "Purchase price")).toMatch(/^3000\.00 .* for all 2 pumps in parallel \+ 1 standby$/);
    expect(figureCell(got.series.pages.html, "Purchase price")).toMatch(/^3000\.00 .* for all 2 pumps in series$/);
    expect(figureCell(got.single.pages.html, "Purchase price")).not.toMatch(/for all/);
  });
});
