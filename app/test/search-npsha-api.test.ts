// NPSHa at the duty in the systems search read API (GET /api/v1/systems/:id/search) and on the search page: the API
// carries `npshaAtDuty` (m, SI, the true value, negative allowed) and `npshaNote`; the page says the note whenever NPSHa at
// the duty is at or below zero, also when no pump was left out for it (every pump without NPSHr). Both sides of zero,
// 1 mm apart, through the route. Check values: the rule "NPSHa at or below zero: no pump runs there without cavitating,
// whatever its NPSHr" (common practice); NPSHa moves one for one with the suction static head (its definition: NPSHa =
// surface pressure head − vapour pressure head + suction static head − suction losses, Karassik's Pump Handbook, from
// memory), so the systems 1 mm either side of zero are set from one system's NPSHa read through the API. Pumps: the
// invented NPSH probes (app/test/npsh-probe.ts), with and without an NPSHr column.
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { searchForSystem } from "~/lib/projects";
import * as searchPage from "~/routes/systems.$id.search";
import { SystemsApiDocs } from "~/components/api-docs-systems";
import { loadedPage } from "./render-page";
import { npshProbeSide, npshProbeSystem, probeSearchApi, type NpshProbeSide } from "./npsh-probe";

afterAll(() => closeDb());

type Side = NpshProbeSide;
type SearchAnswer = { npshaAtDuty: number | null; npshaNote: string | null; stats: { rejectedByNpsh: number; matched: number }; results: unknown[] };

const side = npshProbeSide;

const apiRead = (s: Side, id: number) => probeSearchApi<SearchAnswer>(s, id);

async function pageStats(s: Side, id: number) {
  const { html } = await loadedPage(s.m, searchPage, "/systems/:id/search", `/systems/${id}/search`, { id: String(id) });
  const text = (testId: string) => (new RegExp(`data-testid="${testId}"[^>]*>(.*?)</p>`, "s").exec(html)?.[1] ?? "").replace(/<[^>]+>/g, "");
  return { stats: text("search-stats"), note: text("search-npsha"), html };
}

/** Systems whose NPSHa at the duty is `offset` m (1 mm either side of zero): the suction static head moved from a probe's (the service's NPSHa). */
async function atNpsha(s: Side, offsets: number[]): Promise<number[]> {
  const a0 = (await searchForSystem(s.v, await npshProbeSystem(s.v, s.projectId, 0))).npshaAtDuty;
  expect(a0).not.toBeNull();
  return Promise.all(offsets.map((o) => npshProbeSystem(s.v, s.projectId, o - a0!)));
}

let withNpshr: Side;
let withoutNpshr: Side;
beforeAll(async () => {
  [withNpshr, withoutNpshr] = await Promise.all([side(true), side(false)]);
});

describe("NPSHa at the duty, pumps with an NPSHr (both probes left out on either side of zero)", () => {
  test("the API gives npshaAtDuty as it is, 1 mm above zero and 1 mm below; the note only at or below zero", async () => {
    const [above, below] = await atNpsha(withNpshr, [0.001, -0.001]);
    const a = await apiRead(withNpshr, above);
    expect(a.npshaAtDuty).toBeCloseTo(0.001, 9);
    expect(a.npshaNote).toBeNull();
    expect(a.stats.rejectedByNpsh).toBe(2); // NPSHr 1.5 m and more at the duty, above 0.001 m
    const b = await apiRead(withNpshr, below);
    expect(b.npshaAtDuty).toBeCloseTo(-0.001, 9); // the true value, not the 0 the search judges against
    expect(b.stats.rejectedByNpsh).toBe(2);
    expect(b.npshaNote).toMatch(/^NPSHa at the duty is −0\.001\d* m, at or below zero: no pump can run there without cavitating, whatever its NPSHr\. 2 pumps with an NPSHr at the duty were left out for it; a pump without one is not ruled out by it, and cavitates there too\.$/);
  });

  test("the page: NPSHa just above zero counts the pumps by their NPSHr, no note; at or below zero the note carries the count", async () => {
    const [above, below] = await atNpsha(withNpshr, [0.001, -0.001]);
    const a = await pageStats(withNpshr, above);
    expect(a.stats).toMatch(/ · 2 left out because their NPSHr at the duty is above the NPSHa there \((0\.001\d* m|(<|&lt;) 0\.001 m)\)/); // 1 mm to within rounding: a hair below it reads "< 0.001 m" (decision "npshzero")
    expect(a.html).not.toContain('data-testid="search-npsha"');
    const b = await pageStats(withNpshr, below);
    expect(b.note).toMatch(/^NPSHa at the duty is −0\.001\d* m, at or below zero: no pump can run there without cavitating, whatever its NPSHr\. 2 pumps with an NPSHr at the duty were left out for it/);
    expect(b.stats).not.toMatch(/their NPSHr at the duty is above/);
    expect(b.stats).toMatch(/ · 2 left out for NPSH at the duty \(NPSHa there at or below zero: see below\)/);
  });
});

describe("NPSHa at the duty, no pump with an NPSHr (none left out)", () => {
  test("the API: the note where NPSHa is at or below zero, though no pump was left out; none just above", async () => {
    const [above, below] = await atNpsha(withoutNpshr, [0.001, -0.001]);
    const a = await apiRead(withoutNpshr, above);
    expect(a.npshaAtDuty).toBeCloseTo(0.001, 9);
    expect(a.npshaNote).toBeNull();
    const b = await apiRead(withoutNpshr, below);
    expect(b.stats.rejectedByNpsh).toBe(0);
    expect(b.results.length).toBeGreaterThan(0);
    expect(b.npshaAtDuty).toBeCloseTo(-0.001, 9);
    expect(b.npshaNote).toMatch(/^NPSHa at the duty is −0\.001\d* m, at or below zero: no pump can run there without cavitating, whatever its NPSHr\. A pump without an NPSHr at the duty is not ruled out by it, and cavitates there too\.$/);
  });

  test("the page says it with its number, though nothing was left out (it said nothing at the duty)", async () => {
    const [above, below] = await atNpsha(withoutNpshr, [0.001, -0.001]);
    expect((await pageStats(withoutNpshr, above)).html).not.toContain('data-testid="search-npsha"');
    const b = await pageStats(withoutNpshr, below);
    expect(b.note).toMatch(/^NPSHa at the duty is −0\.001\d* m, at or below zero: no pump can run there without cavitating, whatever its NPSHr\. A pump without an NPSHr at the duty is not ruled out by it, and cavitates there too\.$/);
    expect(b.stats).not.toMatch(/left out/);
  });
});

describe("the /api page's systems section", () => {
  test("names npshaAtDuty and npshaNote, and says what rejectedByNpsh counts where NPSHa at the duty is at or below zero", () => {
    const html = renderToString(createElement(SystemsApiDocs, { Code: ({ children }: { children: string }) => createElement("pre", null, children), pageRows: 25, judged: 80 }))
      .replace(/<!-- -->/g, "").replace(/<[^>]+>/g, "").replace(/\s+/g, " ");
    expect(html).toMatch(/rejectedByNpsh \(left out for NPSH at the duty: NPSHa \/ NPSHr there below 1, .* where NPSHa at the duty is at or below zero the search judges it as zero, so every pump with an NPSHr there is left out whatever its value\)/);
    expect(html).toMatch(/npshaAtDuty is NPSHa at the duty flow in m, the true value \(below zero/);
    expect(html).toMatch(/npshaNote, where it is at or below zero, says that no pump can run there without cavitating/);
  });
});
