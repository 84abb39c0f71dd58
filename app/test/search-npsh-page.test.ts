// The search page as rendered: the NPSH column is judged over the band (range, lowest and where, status) with the
// rule under the table; pumps left out for NPSH at the duty are counted with NPSHa there; a custom liquid gives the
// equivalent water duty searched (ANSI/HI 9.6.7), or why none, and says each verdict is the liquid's. Real route module, guards and MariaDB
// (app/test/harness.ts); the two pumps are invented (app/test/npsh-probe.ts). Check values: our product rules
// (search.server.ts rankClass) and common practice (NPSHa below NPSHr: cavitation risk).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import type { Viewer } from "~/lib/libraries";
import { viewerOfUser } from "~/lib/projects/test-kit";
import * as searchPage from "~/routes/systems.$id.search";
import { makeMember, type TestMember } from "./harness";
import { loadedPage } from "./render-page";
import { npshProbeProject, npshProbeSystem } from "./npsh-probe";

afterAll(() => closeDb());

let m: TestMember;
let v: Viewer;
let projectId = 0;
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  projectId = await npshProbeProject(v);
});

const pageHtml = async (id: number) => (await loadedPage(m, searchPage, "/systems/:id/search", `/systems/${id}/search`, { id: String(id) })).html;

const text = (html: string, testId: string) => (new RegExp(`data-testid="${testId}[^"]*"[^>]*>(.*?)</(td|p)>`, "s").exec(html)?.[1] ?? "").replace(/<[^>]+>/g, "");

describe("the search page's NPSH", () => {
  test("the column is judged over the band, the cavitating pump says where and ranks second; the rule is under the table", async () => {
    const html = await pageHtml(await npshProbeSystem(v, projectId, 2));
    const cells = [...html.matchAll(/data-testid="search-npsh-\d+"[^>]*>(.*?)<\/td>/gs)].map((x) => x[1].replace(/<[^>]+>/g, ""));
    expect(cells).toHaveLength(2);
    expect(cells[1]).toMatch(/^0\.\d+ – \d\.\d+ — lowest 0\.\d+ at least lift, new pipe \(cavitation-risk\)$/); // Probe A, second
    expect(cells[0]).toMatch(/— lowest \d\.\d+ at least lift, new pipe \(ok\)$/); // Probe B, first
    expect(text(html, "search-npsh-rule")).toMatch(/^NPSH margin over the band: NPSHa \/ NPSHr at least 1\.1 at the design point and at each corner of the band/);
    expect(text(html, "search-stats")).not.toMatch(/left out because their NPSHr/);
    expect(html).not.toContain('data-testid="search-npsha"'); // NPSHa at the duty above zero: no note
    expect(html).not.toContain('data-testid="search-liquid"');
  });

  test("pumps left out for NPSH at the duty are counted with NPSHa there", async () => {
    const html = await pageHtml(await npshProbeSystem(v, projectId, -6));
    expect(text(html, "search-stats")).toMatch(/ · 1 left out because their NPSHr at the duty is above the NPSHa there \(\d\.\d+ m\)/);
  });

  test("the cavitating pump's verdict is qualified on its line by NPSH over the band, with NPSHa, NPSHr and where", async () => {
    const html = await pageHtml(await npshProbeSystem(v, projectId, 2));
    const notes = [...html.matchAll(/data-testid="search-verdict-\d+-npsh"[^>]*>(.*?)<\/span>/gs)].map((x) => x[1].replace(/<[^>]+>/g, ""));
    expect(notes).toHaveLength(1); // Probe A only (Probe B's NPSH is ok: no note)
    expect(notes[0]).toMatch(/^ — (but|and) NPSHa \d+\.\d+ m below NPSHr \d+\.\d+ m at least lift, new pipe \(NPSHa \/ NPSHr 0\.\d+, below 1\): cavitation risk$/);
  });

  test("NPSHa at the duty at or below zero: the pumps left out are counted as no pump can run there, not by their NPSHr", async () => {
    // 20 °C water under one standard atmosphere holds about 10.3 m (common practice): a 12 m suction lift leaves NPSHa below zero.
    const html = await pageHtml(await npshProbeSystem(v, projectId, -12));
    expect(text(html, "search-stats")).toMatch(/ · 2 left out for NPSH at the duty \(NPSHa there at or below zero: see below\)/);
    expect(text(html, "search-npsha")).toMatch(/^NPSHa at the duty is −\d\.\d+ m, at or below zero: no pump can run there without cavitating, whatever its NPSHr\. 2 pumps with an NPSHr at the duty were left out for it/);
    expect(text(html, "search-stats")).not.toMatch(/their NPSHr at the duty is above/);
  });

  test("a custom liquid: the page gives the equivalent water duty searched, its factors and rule, and each verdict on the liquid", async () => {
    // A light oil (invented figures: 870 kg/m³, 0.05 Pa·s = 57.5 cSt, 100 Pa vapour pressure): B inside 1–40 at 2900 rpm for
    // this duty (ANSI/HI 9.6.7 from memory; hand values of the method in app/engine/viscous.test.ts).
    const html = await pageHtml(await npshProbeSystem(v, projectId, 5, { kind: "custom", name: "Test oil", density: 870, dynamicViscosity: 0.05, vaporPressure: 100 }));
    const line = text(html, "search-liquid");
    expect(line).toMatch(/^Searched for Test oil \(ν 57 cSt\) at the equivalent water duty of ANSI\/HI 9\.6\.7 \(from memory\): 2900 rpm: B = \d\.\d\d, C_Q 0\.\d{3}, C_H 0\.\d{3}, C_η 0\.\d{3} → water duty 1\d\d(\.\d)? m³\/h at \d\d(\.\d+)? m\./);
    expect(line).toMatch(/judged on Test oil, on the pump's own curve corrected for viscosity where ANSI\/HI 9\.6\.7 applies .* a row that does not meet the duty there ranks after those that do/);
    expect(line).toMatch(/Rule: ANSI\/HI 9\.6\.7 selection for a viscous duty .*Q_W = Q_vis \/ C_Q, H_W = H_vis \/ C_H/);
    expect(line).not.toMatch(/Ranked on the water curves/);
  });

  test("a liquid whose B is above 40 keeps the water ranking, and the page says so", async () => {
    // Invented: 900 kg/m³, 10 Pa·s (11 111 cSt): B above 40 at 2900 rpm for this duty (ANSI/HI 9.6.7 from memory).
    const html = await pageHtml(await npshProbeSystem(v, projectId, 5, { kind: "custom", name: "Tar", density: 900, dynamicViscosity: 10, vaporPressure: 100 }));
    expect(text(html, "search-liquid")).toMatch(/^No equivalent water duty of ANSI\/HI 9\.6\.7 \(from memory\) for Tar \(ν 11111 cSt\): 2900 rpm: B = \d\d\.\d\d, above 40: outside the method, so ranked on the water curves at the duty itself as before .* Ranked on the water curves: the "why this rank" figures are each pump's on water\./);
  });
});
