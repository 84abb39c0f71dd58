// NPSH at a staged duty-cycle step (verdict-staged-npsh.ts) wherever the verdict is a headline: the system page's candidates
// table and chart label, the systems read API (`result.verdictStagedNpsh`), the report's verdict line, the selection CSV
// (`verdict_staged_npsh`) and JSON (`verdictStagedNpsh`). Two pumps in parallel staged by demand, one running alone at a
// 50 % step: its NPSHa / NPSHr is below 1 there (cavitation risk; hand ratio in verdict-staged-npsh.test.ts); at a 20 %
// step it is above the wanted 1.1 and nothing is said. Rule: common practice (staging-npsh.ts). Invented pump (the energy
// fixture's, with an invented NPSHr column).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createLibrary, listModels, type Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, selectCandidate, systemWorkbench } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type SystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, viewerOfUser } from "~/lib/projects/test-kit";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import * as selectionJson from "~/routes/selections.$id.export-json";
import SystemPage, * as systemPage from "~/routes/systems.$id";
import { call, makeMember, type TestMember } from "./harness";
import { renderPage } from "./render-page";
import { selectionPages, textOf } from "./selection-pages";

afterAll(() => closeDb());

const M3H = 1 / 3600;
const CSV = [
  "model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,npshr_m",
  ...[[5, 21.8, 30, 1.2], [10, 21.5, 45, 1.3], [20, 20, 62, 1.6], [30, 17.5, 72, 2.0], [36, 15.5, 74, 2.4], [45, 12, 70, 3.2], [55, 7, 60, 4.5]].map((r) => `Stager 50,end-suction,DN50,2900,200,${r.join(",")}`),
].join("\n");
const base = defaultSystemInput();
const sysAt = (f: number): SystemInput => ({ ...base, suctionStaticHead: -7.8, duty: { flow: 72 * M3H, head: 12 }, energy: { ...base.energy!, profile: [{ flowFraction: 1, hours: 2000 }, { flowFraction: f, hours: 1000 }] } });

let m: TestMember;
let v: Viewer;
let token = "";
const systems = { short: 0, ok: 0 };
const selections = { short: 0, ok: 0 };
beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  const lib = await createLibrary(v, { name: "Staged NPSH", description: "" });
  await importCsvText(v, lib, CSV, "staged-npsh.csv");
  const setId = (await listModels(v, lib))[0].curves[0].id;
  const project = await createProject(v, { name: "Staged NPSH surfaces", site: "", description: "" });
  for (const [k, f] of [["short", 0.5], ["ok", 0.2]] as const) {
    systems[k] = await createSystem(v, project, `Staged ${k}`, sysAt(f));
    const added = await addCandidate(v, systems[k], setId, { ...DEFAULT_ADJUSTMENT, motorRating: 3000, arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 });
    if (!added.ok) throw new Error(added.reason);
    selections[k] = await selectCandidate(v, (await systemWorkbench(v, systems[k])).candidates[0].id, `Staged ${k}`, "");
  }
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
});

const LINE = /^(but|and) at a duty-cycle step with fewer pumps running \(staged by demand\): NPSH at 50 % flow, 1 of 2 pumps running: .*NPSHa [\d.]+ m at the step's whole flow .* \/ NPSHr [\d.]+ m of one pump at its share = 0\.\d+, below 1, NPSHa below NPSHr: cavitation risk \(common practice: NPSHa \/ NPSHr at least the wanted 1\.1;/;

describe("NPSH short at a staged step qualifies the verdict on every headline; nothing where the step keeps its margin", () => {
  test("the system page: the candidates table's verdict line and the chart's label", async () => {
    for (const k of ["short", "ok"] as const) {
      const sys = await call(systemPage.loader as never, { path: `/systems/${systems[k]}`, cookie: m.cookie, params: { id: String(systems[k]) } });
      expect(sys.status).toBe(200);
      const html = renderPage("/systems/:id", SystemPage, `/systems/${systems[k]}`, sys.body);
      const cell = /data-testid="verdict-\d+-staged-npsh"[^>]*>([\s\S]*?)<\/span>/.exec(html);
      if (k === "short") {
        expect(textOf(cell?.[1] ?? "")).toMatch(new RegExp(`^— ${LINE.source.slice(1)}`));
        expect(textOf(html)).toMatch(/NPSH cavitation risk at 50 % flow, 1 of 2 pumps running/); // the chart's label (short form)
      } else expect(cell).toBeNull();
    }
  });

  test("systems read API: result.verdictStagedNpsh; null at the 20 % step", async () => {
    for (const k of ["short", "ok"] as const) {
      const r = await call(apiSystem.loader as never, { path: `/api/v1/systems/${systems[k]}`, params: { id: String(systems[k]) }, headers: { authorization: `Bearer ${token}` } });
      expect(r.status).toBe(200);
      const res = (r.body as { candidates: { result: { verdictStagedNpsh: string | null } }[] }).candidates[0].result;
      if (k === "short") expect(res.verdictStagedNpsh).toMatch(/NPSH at 50 % flow, 1 of 2 pumps running: .*cavitation risk/);
      else expect(res.verdictStagedNpsh).toBeNull();
    }
  });

  test("the report's verdict line, the CSV's verdict_staged_npsh and the JSON's verdictStagedNpsh", async () => {
    const short = await selectionPages(m, selections.short);
    expect(short.html).toMatch(/data-testid="report-verdict-staged-npsh"/);
    expect(short.csv.find((r) => r[1] === "verdict_staged_npsh")?.[2]).toMatch(LINE);
    const ok = await selectionPages(m, selections.ok);
    expect(ok.html).not.toMatch(/report-verdict-staged-npsh/);
    expect(ok.csv.find((r) => r[1] === "verdict_staged_npsh")?.[2] ?? "").toBe("");
    const json = await call(selectionJson.loader as never, { path: `/selections/${selections.short}/export.json`, cookie: m.cookie, params: { id: String(selections.short) } });
    const body = (typeof json.body === "string" ? JSON.parse(json.body) : json.body) as { verdictStagedNpsh: string | null };
    expect(body.verdictStagedNpsh).toMatch(LINE);
  });
});
