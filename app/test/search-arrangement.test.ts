// The search for pumps in parallel or series (search-arrangement.ts, search-judge.ts): the engine ranks one pump at its
// share of the duty, each row's verdict is the arrangement's (evaluateCandidate with its adjustment), Add stores that
// adjustment, the read API takes the same parameters, and the page works as plain GET and POST forms. Real MariaDB, the
// routes' own loaders and actions. Check values: the Tallowmere demo curves (invented, fixtures/demo/tallowmere.csv: the
// largest curve ends at 309.55 m³/h, so no single one reaches 320 m³/h); identity with evaluateCandidate and with the
// workbench (the same verdict); the share rule (flow / N in parallel, common practice); the staged-start note of the
// invented drooping pump (droop-pump.ts; text as verdict-start-surfaces.test.ts reads it: pump 1 alone holds 41.2 m, above
// the 40 m shut-off head, and delivers 50.8 m³/h at most lift, aged pipe — common practice, from memory).
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { curvesOfRevisions, searchableRevisions, type Viewer } from "~/lib/libraries";
import { catalogueOf, createProject, createSystem, searchForSystem, systemWorkbench } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, type Adjustment, type SystemInput } from "~/lib/projects/hydraulics";
import { demoLibrary, M3H, viewerOfUser } from "~/lib/projects/test-kit";
import { verdictStartNote } from "~/lib/projects/verdict-start";
import { renderDeep, SI_UNITS } from "~/lib/shared/units";
import * as apiSearch from "~/routes/api.v1.systems.$id.search";
import * as searchPage from "~/routes/systems.$id.search";
import { call, makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";
import { importDroopPump } from "./droop-pump";

afterAll(() => closeDb());

const TWO = { arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 } as const;
const PARALLEL2: Adjustment = { ...DEFAULT_ADJUSTMENT, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 };
const NOTE = "but started one after another (duty/standby staging) the duty is not met: at most lift, aged pipe pump 2 of 2 cannot open its check valve against the 41.2 m pump 1 holds (above its shut-off head 40.0 m), so only 1 delivers, 50.8 m³/h, below the duty 54.0 m³/h; the verdict assumes the 2 started together";

/** 320 m³/h at 35 m, 31–33 m static through 250 mm runs (the system's head at the duty: 34.8 m at most lift, aged pipe). */
function big(): SystemInput {
  const base = defaultSystemInput();
  return { ...base, staticLow: 31, staticHigh: 33, runs: base.runs.map((r) => ({ ...r, diameter: 0.25 })), duty: { flow: 320 * M3H, head: 35 } };
}
const droopSys = (staticLow: number, staticHigh: number): SystemInput => ({ ...defaultSystemInput(), staticLow, staticHigh, duty: { flow: 54 * M3H, head: 40 } });

let m: TestMember;
let v: Viewer;
let token = "";
let project = 0;
let bigId = 0;
let a1Id = 0;
let flipId = 0;
let droopSet = 0;
const sets = new Map<number, Parameters<typeof evaluateCandidate>[1] & Parameters<typeof catalogueOf>[0]>();
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  await demoLibrary(v, "Tallowmere arrangement");
  droopSet = await importDroopPump(v);
  project = await createProject(v, { name: "Arrangements", site: "", description: "" });
  bigId = await createSystem(v, project, "320 m³/h", big());
  a1Id = await createSystem(v, project, "Droop A1", droopSys(36, 37));
  flipId = await createSystem(v, project, "Droop flip", droopSys(30, 32));
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
  for (const s of await curvesOfRevisions((await searchableRevisions(v)).open.map((o) => o.revisionId))) sets.set(s.id, s);
}, 60_000);

const methodOf = (x: string): Adjustment["method"] => (x === "direct" ? "none" : (x as Adjustment["method"]));
const statuses = (rows: { verdict: { status: string } | null }[]) => rows.map((r) => r.verdict?.status ?? "none");

describe("a duty no single demo pump meets, two in parallel do", () => {
  test("one pump: none meets — every curve ends before 320 m³/h", async () => {
    const csv = readFileSync("fixtures/demo/tallowmere.csv", "utf8").trim().split("\n").slice(1);
    expect(Math.max(...csv.map((l) => Number(l.split(",")[5])))).toBe(309.55); // m³/h: the demo file's largest flow
    const res = await searchForSystem(v, bigId, { allowBeyondCatalogue: true });
    expect(res.stats!.matched).toBe(0); // the engine: none reaches the duty as one pump
    expect(statuses(res.results)).not.toContain("meets");
    expect(res.arrangement).toMatchObject({ arrangement: "single", dutyPumps: 1, rule: null });
  });

  test("2 in parallel (+1 standby): ranked at 160 m³/h each, rows that meet, each verdict the arrangement's", async () => {
    const res = await searchForSystem(v, bigId, { arrangement: TWO });
    expect(res.arrangement.searchedDuty!.flow / M3H).toBeCloseTo(160, 9); // 320 / 2 (the share rule)
    expect(res.arrangement.searchedDuty!.head).toBe(35);
    const meets = res.results.filter((r) => r.verdict?.status === "meets");
    expect(meets.length).toBeGreaterThan(0); // old code: none (the arrangement was not read)
    for (const r of res.results) {
      const set = sets.get(r.curveSetId)!;
      const e = evaluateCandidate(big(), set, { ...PARALLEL2, method: methodOf(r.method) }, { catalogue: catalogueOf(set) });
      expect(r.verdict).toEqual(e.verdict); // the arrangement's verdict, exactly
      expect(r.arrangement).toEqual(TWO);
      expect(r.reason).toMatch(/^#\d+ of \d+: at one pump's share of the typed duty \(2 duty pumps in parallel \+ 1 standby\), ⟦flow\|0\.0444444⟧ at ⟦head\|35⟧, where it is ranked/);
    }
    for (const r of meets) {
      // The flip: the same pump, method and setting alone on the system does not meet the duty.
      const set = sets.get(r.curveSetId)!;
      expect(evaluateCandidate(big(), set, { ...DEFAULT_ADJUSTMENT, method: methodOf(r.method) }, { catalogue: catalogueOf(set) }).verdict?.status).not.toBe("meets");
      // Combined and per pump: the operating point together on the design curve, each pump half its flow; the power likewise.
      expect(r.operatingPoint!.flow).toBeGreaterThanOrEqual(320 * M3H); // meets: −0 % below the duty (default tolerance)
      expect(r.perPump!.flow).toBeCloseTo(r.operatingPoint!.flow / 2, 12);
      expect(r.perPump!.head).toBe(r.operatingPoint!.head);
      expect(r.shaftPowerPerPump! * 2).toBeCloseTo(r.shaftPower!, 6);
    }
  });
});

describe("2 in series: ranked at half the duty head, each verdict the arrangement's", () => {
  test("54 m³/h at 80 m, 74–76 m static", async () => {
    const input: SystemInput = { ...defaultSystemInput(), staticLow: 74, staticHigh: 76, duty: { flow: 54 * M3H, head: 80 } };
    const id = await createSystem(v, project, "Series", input);
    const series = { arrangement: "series", dutyPumps: 2, standbyPumps: 0 } as const;
    const res = await searchForSystem(v, id, { arrangement: series, allowBeyondCatalogue: true });
    expect(res.arrangement.searchedDuty).toEqual({ flow: 54 * M3H, head: 40 }); // 80 m / 2 (the share rule)
    expect(res.results.length).toBeGreaterThan(0);
    for (const r of res.results) {
      const set = sets.get(r.curveSetId)!;
      expect(r.verdict).toEqual(evaluateCandidate(input, set, { ...DEFAULT_ADJUSTMENT, ...series, method: methodOf(r.method) }, { catalogue: catalogueOf(set) }).verdict);
      if (!r.operatingPoint) continue;
      expect(r.perPump).toEqual({ flow: r.operatingPoint.flow, head: r.operatingPoint.head / 2 }); // the head shared, the flow through both
    }
    expect(statuses(res.results)).toContain("meets");
  });
});

describe("staged starts on a search row (the drooping pump, 2 in parallel)", () => {
  const droopRow = async (id: number, arrangement?: typeof TWO) => {
    const row = (await searchForSystem(v, id, { allowBeyondCatalogue: true, arrangement })).results.find((x) => x.curveSetId === droopSet);
    expect(row).toBeDefined();
    return row!;
  };
  test("A1: the row carries the candidate's shortfall and note; one pump first (its verdict kept) changes nothing", async () => {
    const single = await droopRow(a1Id); // kept first under its own key
    expect(single.stagedStart).toEqual([]);
    const row = await droopRow(a1Id, TWO);
    expect(row.method).toBe("direct");
    const e = evaluateCandidate(droopSys(36, 37), sets.get(droopSet)!, PARALLEL2, { catalogue: catalogueOf(sets.get(droopSet)!) });
    expect(row.stagedStart).toEqual(e.stagedStart); // old code: [] (one pump judged, or its kept verdict)
    expect(row.stagedStart).toHaveLength(1);
    expect(renderDeep(verdictStartNote(row.verdict, row.stagedStart), SI_UNITS)).toBe(NOTE);
  });
  test("the flip (30–32 m static): pump 2 starts, no shortfall, no note", async () => {
    const row = await droopRow(flipId, TWO);
    expect(row.verdict).not.toBeNull();
    expect(row.stagedStart).toEqual([]);
    expect(verdictStartNote(row.verdict, row.stagedStart)).toBeNull();
  });
  test("the read API's row and the page's verdict line say it", async () => {
    const api = await call(apiSearch.loader as never, { path: `/api/v1/systems/${a1Id}/search?arrangement=parallel&pumps=2&standby=1`, params: { id: String(a1Id) }, headers: { authorization: `Bearer ${token}` } });
    expect(api.status).toBe(200);
    const row = (api.body as { results: { curveSetId: number; verdictStart: string | null }[] }).results.find((x) => x.curveSetId === droopSet);
    expect(row?.verdictStart).toBe(NOTE);
    const html = await pageHtml(a1Id, "?arrangement=parallel&pumps=2&standby=1");
    expect(new RegExp(`data-testid="search-verdict-${droopSet}-start"[^>]*>([\\s\\S]*?)</span>`).exec(html)?.[1].replace(/<[^>]+>/g, "")).toBe(` — ${NOTE}`);
  });
});

const pageHtml = async (id: number, query: string) =>
  (await loadedPage(m, searchPage, "/systems/:id/search", `/systems/${id}/search${query}`, { id: String(id) })).html;

describe("the search page without JavaScript", () => {
  type Loaded = { filterNotes: string[]; filters: { arrangement: unknown }; arrangement: { rule: string | null }; results: { curveSetId: number; pick: string; verdict: { status: string } | null }[] };
  const load = async (query: string) => {
    const r = await call(searchPage.loader as never, { path: `/systems/${bigId}/search${query}`, params: { id: String(bigId) }, cookie: m.cookie });
    expect(r.status).toBe(200);
    return r.body as Loaded;
  };
  test("the GET form's fields: arrangement, duty pumps, standby; the rows' figures per pump and together", async () => {
    const d = await load("?arrangement=parallel&pumps=2&standby=1");
    expect(d.filters.arrangement).toEqual({ arrangement: "parallel", pumps: "2", standby: "1" });
    expect(d.arrangement.rule).toMatch(/^Searched for 2 duty pumps in parallel \+ 1 standby: each pump is ranked at its share of the duty, 160 m³\/h \(the duty flow 320 m³\/h \/ 2\) at 35\.0 m/);
    const row = d.results.find((r) => r.verdict?.status === "meets")!;
    expect(row.pick).toBe(`${row.curveSetId}:${(await searchForSystem(v, bigId, { arrangement: TWO })).results.find((x) => x.curveSetId === row.curveSetId)!.method}:parallel:2:1`);
    const html = await pageHtml(bigId, "?arrangement=parallel&pumps=2&standby=1");
    const form = /<form [^>]*action="\/systems\/\d+\/search" method="get">([\s\S]*?)<\/form>/.exec(html)?.[1] ?? "";
    expect(form).toMatch(/<select name="arrangement"[^>]*>[\s\S]*<option value="parallel" selected="">duty pumps in parallel<\/option>/);
    expect(form).toMatch(/<input [^>]*name="pumps" value="2"\/>/);
    expect(form).toMatch(/<input [^>]*name="standby" value="1"\/>/);
    expect(html).toContain("<th>Efficiency (each pump)</th>");
    const cell = (id: string) => new RegExp(`data-testid="${id}"[^>]*>(.*?)</(td|div|p)>`, "s").exec(html)?.[1] ?? "";
    expect(cell(`search-power-${row.curveSetId}`)).toMatch(/^\d+\.\d+ kW per pump, \d+\.\d+ kW for 2 duty pumps$/);
    expect(cell(`search-arrangement-${row.curveSetId}`)).toMatch(/^2 duty pumps in parallel \+ 1 standby: together \d+ m³\/h at \d+\.\d m \(design curve\), each pump \d+ m³\/h at \d+\.\d m$/);
    expect(html).toContain(`value="${row.pick}"`); // the Add button and the tick carry the arrangement
    expect(cell("search-figures-rule").replace(/<[^>]+>/g, "")).toMatch(/The rank is the search's score at one pump's share of the typed duty \(2 duty pumps in parallel \+ 1 standby\), 160 m³\/h at 35\.0 m;/);
  });
  test("one pump (the form's defaults): no arrangement line, power as before", async () => {
    const html = await pageHtml(a1Id, "?arrangement=single&pumps=2&standby=0");
    expect(html).not.toContain('data-testid="search-arrangement-');
    expect(html).not.toContain('data-testid="search-arrangement-rule"');
    expect(html).toContain("<th>Efficiency</th>");
  });
  test("odd values: named in a note, one pump searched", async () => {
    const d = await load("?arrangement=parallel&pumps=12");
    expect(d.filterNotes).toEqual(["Duty pumps must be at most 8 (a whole number from 2 to 8): “12” is too many, so one pump is searched."]);
    expect(d.arrangement.rule).toBeNull();
  });
});

describe("Add keeps the arrangement: the candidate opens with the search row's verdict", () => {
  const post = (id: number, body: [string, string][]) => call(searchPage.action as never, { path: `/systems/${id}/search`, method: "POST", params: { id: String(id) }, cookie: m.cookie, body: new URLSearchParams(body) });
  const workbenchRow = async (id: number, curveSetId: number) => (await systemWorkbench(v, id)).candidates.find((c) => c.curveSetId === curveSetId)!;

  test("the row's Add (`one`)", async () => {
    const id = await createSystem(v, project, "Add one", big());
    const row = (await searchForSystem(v, id, { arrangement: TWO })).results.find((r) => r.verdict?.status === "meets")!;
    const r = await post(id, [["one", `${row.curveSetId}:${row.method}:parallel:2:1`]]);
    expect(r.status).toBe(302);
    const c = await workbenchRow(id, row.curveSetId);
    expect(c.adjustment).toEqual({ ...PARALLEL2, method: methodOf(row.method) }); // old code: one pump (arrangement single)
    expect(c.result!.verdict).toEqual(row.verdict); // the same verdict the row showed
    expect(c.result!.stagedStart).toEqual(row.stagedStart);
    expect(c.result!.operating).toEqual(row.operatingPoint);
    expect(c.result!.figures!.shaftPower).toBe(row.shaftPower);
  });
  test("Add the ticked pumps (`add`), the drooping pump's shortfall kept too", async () => {
    const id = await createSystem(v, project, "Add many", droopSys(36, 37));
    const rows = (await searchForSystem(v, id, { arrangement: TWO, allowBeyondCatalogue: true })).results;
    const droop = rows.find((r) => r.curveSetId === droopSet)!;
    const other = rows.find((r) => r.curveSetId !== droopSet)!;
    const r = await post(id, [["add", `${droop.curveSetId}:${droop.method}:parallel:2:1`], ["add", `${other.curveSetId}:${other.method}:parallel:2:1`], ["intent", "add-many"]]);
    expect(r.status).toBe(302);
    for (const row of [droop, other]) {
      const c = await workbenchRow(id, row.curveSetId);
      expect(c.adjustment).toMatchObject({ arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 });
      expect(c.result!.verdict).toEqual(row.verdict);
      expect(c.result!.stagedStart).toEqual(row.stagedStart);
    }
    expect((await workbenchRow(id, droopSet)).result!.stagedStart).toHaveLength(1);
  });
  test("an arrangement outside the rules is a 400 naming the field; nothing added", async () => {
    const id = await createSystem(v, project, "Add odd", big());
    for (const [field, value] of [["one", `${droopSet}:direct:parallel:9:0`], ["add", `${droopSet}:direct:series:2:1`]]) {
      const r = await post(id, [[field, value]]);
      expect(r.status, value).toBe(400);
      expect((r.body as { errors: Record<string, string> }).errors[field]).toMatch(/^A ticked pump's arrangement is parallel or series/);
    }
    expect((await systemWorkbench(v, id)).candidates).toEqual([]);
  });
});

describe("the read API's arrangement parameters", () => {
  const get = (id: number, query: string) => call(apiSearch.loader as never, { path: `/api/v1/systems/${id}/search${query}`, params: { id: String(id) }, headers: { authorization: `Bearer ${token}` } });
  test("accepted: the arrangement searched, each result's adjustment and its figures per pump and together", async () => {
    const r = await get(bigId, "?arrangement=parallel&pumps=2&standby=1&method=speed");
    expect(r.status).toBe(200);
    type Row = { verdict: { status: string } | null; adjustment: Record<string, unknown>; figures: { operatingPoint: { flow: number } | null; perPump: { flow: number } | null; shaftPower: number | null; shaftPowerPerPump: number | null } };
    const body = r.body as { arrangement: Record<string, unknown>; results: Row[] };
    expect(body.arrangement).toMatchObject({ arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 });
    expect((body.arrangement.searchedDuty as { flow: number }).flow / M3H).toBeCloseTo(160, 9);
    expect(body.arrangement.rule).toMatch(/^Searched for 2 duty pumps in parallel \+ 1 standby/);
    const meets = body.results.filter((x) => x.verdict?.status === "meets");
    expect(meets.length).toBeGreaterThan(0);
    for (const x of meets) {
      expect(x.adjustment).toMatchObject({ kind: "speed", arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 });
      expect(x.figures.perPump!.flow * 2).toBeCloseTo(x.figures.operatingPoint!.flow, 12);
      expect(x.figures.shaftPowerPerPump! * 2).toBeCloseTo(x.figures.shaftPower!, 6);
    }
    const one = (await get(bigId, "")).body as { arrangement: Record<string, unknown> };
    expect(one.arrangement).toMatchObject({ arrangement: "single", dutyPumps: 1, standbyPumps: 0, rule: null });
  });
  test("odd values refused by name: 400 problem+json", async () => {
    const cases: [string, string][] = [
      ["?arrangement=ring", 'Query parameter "arrangement": Unknown arrangement “ring” (the search knows single, parallel and series).'],
      ["?arrangement=parallel&pumps=9", 'Query parameter "pumps": Duty pumps must be at most 8 (a whole number from 2 to 8): “9” is too many.'],
      ["?arrangement=series&pumps=1", 'Query parameter "pumps": Duty pumps must be at least 2 (a whole number from 2 to 8): “1” is too few.'],
      ["?pumps=2", 'Query parameter "pumps": "pumps" is read with arrangement=parallel or arrangement=series only.'],
      ["?arrangement=series&pumps=2&standby=1", 'Query parameter "standby": Standby pumps “1” are counted with pumps in parallel only.'],
      ["?arrangement=parallel&pumps=2&standby=3", 'Query parameter "standby": Standby pumps (at most the duty pumps) must be at most 2 (a whole number from 0 to 2): “3” is too many.'],
      ["?arrangement=parallel&arrangement=series", 'The query parameter "arrangement" is given more than once: give it once.'],
      ["?pump=2", "Unknown query parameter \"pump\": this address takes page, arrangement, pumps, standby, method. Answers are in SI units (see /api)."],
    ];
    for (const [q, detail] of cases) {
      const r = await get(bigId, q);
      expect(r.status, q).toBe(400); // old code: 400 "Unknown query parameter" for each of them, 200 for none
      expect(r.headers.get("content-type"), q).toMatch(/^application\/problem\+json/);
      expect((r.body as { detail: string }).detail, q).toBe(detail);
    }
  });
});
