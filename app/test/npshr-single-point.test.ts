// A curve set whose NPSHr column carries a single point (3.2 m at 150 m³/h, the rest blank), stored through the importer,
// searched and added as a candidate. The rule (npshr-reach.ts, decision "npshone"): a single published NPSHr point is
// judged nowhere — one point is no curve to read NPSHr off at another flow — in the search's index (the engine builds no
// NPSHr curve from it: the pump is never left out, nor passed, on NPSH at the duty) and in the workbench alike, and both
// say the same words with its numbers: "NPSH not checked: the curve publishes NPSHr at one flow only (3.20 m at 150 m³/h):
// one point is no curve to read it at …". Before, both ignored the point but said "the curve publishes no NPSHr at …
// 150.1 m³/h (most lift, new pipe)", as if it published none. The duty is the published flow itself, where the search
// judges NPSHr at the duty, and NPSHa there is set just below and above NPSHr and 1.1 × NPSHr: a pump with the same curve
// and a whole NPSHr column (3.2 m at 150 m³/h too) is left out below NPSHr and its margin crosses 1.1 there, the
// single-point pump's words never move. Check values: the rules "NPSHa / NPSHr below 1: cavitation risk, at least the
// wanted 1.1" and "NPSHr read off the published curve, never beyond it" (common practice); NPSHa moves one for one with
// the suction static head (NPSHa = (p − p_v)/(ρg) + z − h_f, Karassik's Pump Handbook, from memory). Invented pumps.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { createLibrary, listModels, updateLibrary, type Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, searchForSystem, systemWorkbench } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type SystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, M3H, viewerOfUser } from "~/lib/projects/test-kit";
import { npshNoteOf } from "~/components/workbench";
import { SI_UNITS } from "~/lib/shared/units";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import * as apiSearch from "~/routes/api.v1.systems.$id.search";
import * as searchPage from "~/routes/systems.$id.search";
import { call, makeMember, type TestMember } from "./harness";
import { loadedPage, plainHtml } from "./render-page";

afterAll(() => closeDb());

const FLOWS = [0, 30, 60, 90, 120, 150, 180, 210, 240]; // m³/h
const head = (q: number) => 45 - 6 * (q / 100) ** 2; // m: 31.50 m at 150 m³/h
const eta = (q: number) => (q === 0 ? 0 : 0.75 * (q / 130) * (2 - q / 130));
const NPSHR = 3.2; // m at 150 m³/h, both pumps
const WHOLE = [1.5, 1.6, 1.8, 2.2, 2.7, NPSHR, 4.0, 5.0, 6.2]; // m
const rows = (model: string, npshr: (i: number) => number | "") => FLOWS.map((q, i) => `${model},end-suction,DN100,2900,200,${q},${head(q).toFixed(2)},${(eta(q) * 100).toFixed(1)},${npshr(i)}`);
const CSV = ["model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,npshr_m",
  ...rows("Single point", (i) => (FLOWS[i] === 150 ? NPSHR : "")), ...rows("Whole column", (i) => WHOLE[i])].join("\n");
/** Static lift 20–24 m, 150 mm runs, duty 150 m³/h at 31 m: the search meets it as published (31.5 m there), at the published NPSHr's flow; the band runs at 161–182 m³/h (meets). */
const systemAt = (suctionStaticHead: number): SystemInput => {
  const input: SystemInput = { ...defaultSystemInput(), staticLow: 20, staticHigh: 24, suctionStaticHead, duty: { flow: 150 * M3H, head: 31 } };
  input.runs = input.runs.map((r) => ({ ...r, diameter: 0.15 }));
  return input;
};
/** The words for the single point, rendered in SI: its NPSHr and flow, then the flows the pump runs at. */
const SINGLE = /^but NPSH not checked: the curve publishes NPSHr at one flow only \(3\.20 m at 150 m³\/h\): one point is no curve to read it at \d+ m³\/h \(design point\), \d+ m³\/h \(least lift, new pipe\), \d+ m³\/h \(least lift, aged pipe\), \d+(\.\d)? m³\/h \(most lift, new pipe\), \d+(\.\d)? m³\/h \(most lift, aged pipe\)$/;

type Row = { model: string; adjustment: { kind: string }; verdict: { status: string } | null; verdictNpsh: string | null; npsh: { status: string; unjudged: { at: string; why: string }[] } | null; figures: { npshRequired: number | null; npshMargin: number | null } };
type SearchAnswer = { npshaAtDuty: number; stats: { rejectedByNpsh: number }; results: Row[] };

let m: TestMember;
let v: Viewer;
let token = "";
let project = 0;
let single = 0;
/** NPSHa at the duty (m) → its system's id, the single-point pump its candidate. */
const systems = new Map<number, number>();
const TARGETS = [NPSHR * (1 - 1e-3), NPSHR * (1 + 1e-3), 1.1 * NPSHR * (1 - 1e-3), 1.1 * NPSHR * (1 + 1e-3)]; // m

beforeAll(async () => {
  m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  const lib = await createLibrary(v, { name: "One NPSHr point", description: "" });
  await importCsvText(v, lib, CSV, "single-npshr.csv");
  await updateLibrary(v, lib, { name: "One NPSHr point", description: "", visibility: "workspace" });
  single = (await listModels(v, lib)).find((x) => x.name === "Single point")!.curves[0].id;
  project = await createProject(v, { name: "Single NPSHr point", site: "", description: "" });
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
  const a0 = (await searchForSystem(v, await createSystem(v, project, "Probe", systemAt(0)))).npshaAtDuty!;
  for (const t of TARGETS) {
    const id = await createSystem(v, project, `NPSHa ${t} m`, systemAt(t - a0));
    const added = await addCandidate(v, id, single, DEFAULT_ADJUSTMENT);
    if (!added.ok) throw new Error(added.reason);
    systems.set(t, id);
  }
});

const searchApi = async (id: number) => {
  const r = await call(apiSearch.loader as never, { path: `/api/v1/systems/${id}/search`, params: { id: String(id) }, headers: { authorization: `Bearer ${token}` } });
  expect(r.status).toBe(200);
  return r.body as SearchAnswer;
};
const systemApiNote = async (id: number) => {
  const r = await call(apiSystem.loader as never, { path: `/api/v1/systems/${id}`, params: { id: String(id) }, headers: { authorization: `Bearer ${token}` } });
  expect(r.status).toBe(200);
  return (r.body as { candidates: { result: { verdictNpsh: string | null } }[] }).candidates[0].result.verdictNpsh;
};

describe("a single published NPSHr point: judged nowhere, the search row and the workbench say the same words", () => {
  test("NPSHa at the duty is where it was set (the systems straddle NPSHr and 1.1 × NPSHr)", async () => {
    for (const t of TARGETS) expect((await searchApi(systems.get(t)!)).npshaAtDuty).toBeCloseTo(t, 9);
  });

  test("the search keeps it on both sides of NPSHr and of 1.1 × NPSHr, with no NPSHr at the duty; the whole-column pump is left out below NPSHr", async () => {
    for (const t of TARGETS) {
      const a = await searchApi(systems.get(t)!);
      const row = a.results.find((r) => r.model === "Single point");
      expect(row, `NPSHa ${t} m`).toBeDefined();
      expect(row!.adjustment.kind).toBe("none"); // as published: judged at the duty flow itself, the published point's
      expect(row!.figures.npshRequired).toBeNull();
      expect(row!.figures.npshMargin).toBeNull();
      const whole = a.results.find((r) => r.model === "Whole column");
      if (t < NPSHR) {
        expect(whole, `NPSHa ${t} m`).toBeUndefined(); // the control flips: NPSHa / NPSHr 0.999 at the duty, left out
        expect(a.stats.rejectedByNpsh).toBe(1);
      } else {
        expect(whole!.figures.npshRequired).toBeCloseTo(NPSHR, 9);
        expect(whole!.figures.npshMargin! < 1.1).toBe(t < 1.1 * NPSHR); // and its margin crosses 1.1 where NPSHa does
        expect(a.stats.rejectedByNpsh).toBe(0);
      }
    }
  });

  test("its search row, the candidates table and the systems API carry the same words, with 3.20 m at 150 m³/h (old code: 'the curve publishes no NPSHr at …')", async () => {
    for (const t of TARGETS) {
      const id = systems.get(t)!;
      const row = (await searchApi(id)).results.find((r) => r.model === "Single point")!;
      const cand = (await systemWorkbench(v, id)).candidates[0];
      const table = npshNoteOf(cand.result, SI_UNITS);
      expect(row.verdict?.status).toBe("meets"); // a pass: "not checked" qualifies it
      expect(cand.result?.verdict?.status).toBe("meets");
      expect(table, `NPSHa ${t} m`).toMatch(SINGLE);
      expect(row.verdictNpsh).toBe(table);
      expect(await systemApiNote(id)).toBe(table);
      expect(row.npsh?.status).toBe("unknown");
      expect(cand.result?.npsh.status).toBe("unknown");
      expect(row.npsh?.unjudged.map((u) => u.why)).toEqual(Array(5).fill("NPSHr published at one flow only"));
    }
  });

  test("the search page's row says it on the verdict's line", async () => {
    const id = systems.get(TARGETS[0])!;
    const html = plainHtml((await loadedPage(m, searchPage, "/systems/:id/search", `/systems/${id}/search`, { id: String(id) })).html);
    const lines = [...html.matchAll(/data-testid="search-verdict-\d+-npsh"[^>]*>(.*?)<\/span>/gs)].map((x) => x[1].replace(/<[^>]+>/g, "").replace(/^ — /, ""));
    expect(lines.filter((l) => SINGLE.test(l))).toHaveLength(1);
  });
});
