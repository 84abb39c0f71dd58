// Read API for systems against the real MariaDB: GET /api/v1/systems/:id (the live preview's view of
// the stored system) and GET /api/v1/systems/:id/search (ranked results with adjustment and figures).
// Check values: identities with the services the pages use (same numbers), the product's own rules
// (workspace scoping, problem+json) and the affinity laws (speed = ratio × curve speed, common practice).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import type { Viewer } from "~/lib/libraries";
import { addCandidate, createProject, createSystem, saveSystem, systemWorkbench } from "~/lib/projects";
import { searchForSystem } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, type SystemInput } from "~/lib/projects/hydraulics";
import { workbenchApiView, workbenchView } from "~/lib/projects/workbench-view";
import { searchResultView } from "~/lib/projects/search-view";
import { call, makeMember, type TestMember } from "./harness";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import * as apiSearch from "~/routes/api.v1.systems.$id.search";
import * as apiPreview from "~/routes/api.v1.systems.$id.preview";
import { renderDeep, SI_UNITS } from "~/lib/shared/units";
import { boosterInput, demoLibrary, viewerOfUser } from "~/lib/projects/test-kit";

afterAll(() => closeDb());

let m: TestMember;
let other: TestMember;
let v: Viewer;
let token = "";
let otherToken = "";
let systemId = 0;
let noDutyId = 0;
const LIB = "API systems pumps";
const booster = boosterInput;

beforeAll(async () => {
  m = await makeMember("admin");
  other = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  await demoLibrary(v, LIB);
  const p = await createProject(v, { name: "API", site: "", description: "" });
  systemId = await createSystem(v, p, "Booster", booster());
  noDutyId = await createSystem(v, p, "No duty", { ...defaultSystemInput(), duty: null } as SystemInput);
  const found = await searchForSystem(v, systemId);
  const added = await addCandidate(v, systemId, found.results[0].curveSetId, { ...DEFAULT_ADJUSTMENT, method: "speed" });
  if (!added.ok) throw new Error(added.reason);
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
  otherToken = (await createApiToken({ userId: other.userId, workspaceId: other.workspaceId, name: "r", scope: "read" })).token;
});

const get = (fn: unknown, path: string, id: string, t = token) =>
  call(fn as never, { path, params: { id }, headers: { authorization: `Bearer ${t}` } });

describe("GET /api/v1/systems/:id", () => {
  test("input, evaluation and candidates: the workbench's own numbers (same view as the preview)", async () => {
    const r = await get(apiSystem.loader, `/api/v1/systems/${systemId}`, String(systemId));
    expect(r.status).toBe(200);
    const body = r.body as ReturnType<typeof workbenchView> & { input: SystemInput; system: { id: number; name: string } };
    expect(body.system).toMatchObject({ id: systemId, name: "Booster" });
    expect(body.input.duty).toEqual({ flow: 40 / 3600, head: 38 });
    // A token's API answers in SI: the view's quantity tokens written out in SI units; the API's view adds verdictNpsh
    // and leaves out margin ratios where NPSHa ≤ 0 (systems-api-npsh.test.ts).
    const expected = renderDeep(JSON.parse(JSON.stringify(workbenchApiView(workbenchView(await systemWorkbench(v, systemId))))), SI_UNITS);
    expect(JSON.stringify(body)).not.toContain("⟦");
    expect(body.evaluation).toEqual(expected.evaluation);
    expect(body.candidates).toEqual(expected.candidates);
    expect(body.candidates).toHaveLength(1);
    const c = body.candidates[0];
    expect(c.library).toBe(LIB);
    // Speed solved so the demanding edge of the system band delivers the duty flow (our rule since the band verdict), then
    // set at the next whole rpm up (setting-step.ts): at least the duty flow there, and the solved ratio beside the one set.
    const band = (c.result as { band?: { flow: number | null }[] }).band ?? [];
    expect(Math.min(...band.map((b) => b.flow ?? Infinity))).toBeGreaterThanOrEqual(40 / 3600);
    expect(Math.min(...band.map((b) => b.flow ?? Infinity))).toBeLessThan((40 / 3600) * 1.01); // one rpm more: far under 1 % more flow (common practice)
    const { ratio, solvedRatio } = c.result as { ratio: number; solvedRatio: number };
    expect(ratio).toBeGreaterThanOrEqual(solvedRatio);
    // Each candidate carries the engine's verdict (issue 13: meets/short/oversized/outside-catalogue/no-operating-point).
    expect(c.result).toEqual(expected.candidates[0].result);
    const verdict = (c.result as { verdict?: { status: string; rule: string; reasons: string[] } }).verdict;
    expect(["meets", "short", "oversized", "outside-catalogue", "no-operating-point"]).toContain(verdict?.status);
    expect(verdict!.rule.length).toBeGreaterThan(0);
  });

  test("bad id → 400, unknown id → 404, another workspace's token → 404; all problem+json; POST → 405", async () => {
    const bad = await get(apiSystem.loader, "/api/v1/systems/abc", "abc");
    expect(bad.status).toBe(400);
    expect(bad.headers.get("content-type")).toBe("application/problem+json");
    const missing = await get(apiSystem.loader, "/api/v1/systems/999999999", "999999999");
    expect(missing.status).toBe(404);
    expect(missing.headers.get("content-type")).toBe("application/problem+json");
    const foreign = await get(apiSystem.loader, `/api/v1/systems/${systemId}`, String(systemId), otherToken);
    expect(foreign.status).toBe(404);
    expect(foreign.headers.get("content-type")).toBe("application/problem+json");
    expect(JSON.stringify(foreign.body)).not.toContain("Booster");
    const noToken = await call(apiSystem.loader as never, { path: `/api/v1/systems/${systemId}`, params: { id: String(systemId) } });
    expect(noToken.status).toBe(401);
    const post = await call(apiSystem.action as never, { path: `/api/v1/systems/${systemId}`, params: { id: String(systemId) }, method: "POST", headers: { authorization: `Bearer ${token}` } });
    expect(post.status).toBe(405);
  });
});

describe("POST /api/v1/systems/:id/preview: the static heads' order", () => {
  const preview = (input: SystemInput) =>
    call(apiPreview.action as never, {
      path: `/api/v1/systems/${systemId}/preview`, params: { id: String(systemId) }, method: "POST",
      headers: { authorization: `Bearer ${token}`, "content-type": "application/json" }, body: JSON.stringify({ input }),
    });

  test("high level below low (30 m then 26 m, open) → 400 problem+json at staticHigh naming both, the editor's words (was 200: only the form refused it)", async () => {
    const r = await preview({ ...booster(), staticLow: 30, staticHigh: 26 });
    expect(r.status).toBe(400);
    expect(r.headers.get("content-type")).toBe("application/problem+json");
    const errors = (r.body as { errors: { field: string; message: string }[] }).errors;
    // The editor's message (system-form.ts, via staticHighBelowLow), written out in SI for a token.
    expect(errors).toEqual([{ field: "input.staticHigh", pointer: "/input/staticHigh", message: expect.stringMatching(/^The static head at high level, 26(\.0+)? m, is below the one at low level, 30(\.0+)? m: high level is the most lift/) }]);
    // Control: the same band the right way round, one level, and a closed loop (its static heads unused) all preview.
    expect((await preview({ ...booster(), staticLow: 26, staticHigh: 30 })).status).toBe(200);
    expect((await preview({ ...booster(), staticLow: 28, staticHigh: 28 })).status).toBe(200);
    expect((await preview({ ...booster(), mode: "closed-loop", controlHead: 5, staticLow: 30, staticHigh: 26 })).status).toBe(200);
  });

  test("a system stored with high below low still reads, least to most (the same curve as the band typed in order); saving one now is refused", async () => {
    const p = await createProject(v, { name: "Swapped band", site: "", description: "" });
    const swapped = await createSystem(v, p, "Swapped", { ...booster(), staticLow: 30, staticHigh: 26 });
    const ordered = await createSystem(v, p, "Ordered", booster());
    const a = await get(apiSystem.loader, `/api/v1/systems/${swapped}`, String(swapped));
    const b = await get(apiSystem.loader, `/api/v1/systems/${ordered}`, String(ordered));
    expect(a.status).toBe(200);
    expect((a.body as { evaluation: unknown }).evaluation).toEqual((b.body as { evaluation: unknown }).evaluation);
    await expect(saveSystem(v, swapped, "Swapped", { ...booster(), staticLow: 30, staticHigh: 26 })).rejects.toThrow(/is below the one at low level/);
  });
});

describe("GET /api/v1/systems/:id/search", () => {
  test("results with modelId, curveSetId, label, library, adjustment, verdict and figures; the same ranking as the search page", async () => {
    const r = await get(apiSearch.loader, `/api/v1/systems/${systemId}/search`, String(systemId));
    expect(r.status).toBe(200);
    const body = r.body as { results: ReturnType<typeof searchResultView>[]; duty: unknown };
    const page = await searchForSystem(v, systemId);
    expect(body.results.map((x) => x.curveSetId)).toEqual(page.results.map((x) => x.curveSetId));
    expect(body.results.length).toBeGreaterThan(0);
    let unknownSeen = 0;
    for (const [i, x] of body.results.entries()) {
      const p = page.results[i];
      expect(x).toMatchObject({ rank: p.rank, curveSetId: p.curveSetId, label: p.label, library: LIB });
      expect(typeof x.modelId).toBe("number");
      expect(["none", "speed", "trim"]).toContain(x.adjustment.kind);
      expect(x.adjustment.kind).toBe(p.method === "direct" ? "none" : p.method);
      expect(x.adjustment.ratio).toBe(p.ratio);
      expect(x.adjustment.directRule).toMatch(/^(Direct|Not direct): .* to duty head × 1\.05 = /); // the direct rule with its numbers, tokens rendered (common practice: 5 % over the duty head)
      expect(x.adjustment.directRule).not.toContain("⟦");
      if (x.adjustment.kind === "speed" && x.curve.speed !== null) expect(x.adjustment.speed!).toBeCloseTo(x.curve.speed * x.adjustment.ratio, 6); // affinity laws
      if (x.adjustment.kind === "trim" && x.curve.impellerDiameter !== null) expect(x.adjustment.diameter!).toBeCloseTo(x.curve.impellerDiameter * x.adjustment.ratio, 9);
      if (x.adjustment.kind === "none") expect(x.adjustment.ratio).toBe(1);
      expect(x.figures.headAtDuty).toBeGreaterThanOrEqual(38 * 0.999); // meets the duty head (search rule)
      expect(x.figures.efficiency).toBe(p.efficiency);
      const pv = (p as { verdict?: unknown }).verdict;
      expect(pv).toBeDefined();
      expect(x.verdict).toEqual(renderDeep(JSON.parse(JSON.stringify(pv)), SI_UNITS));
      expect(["meets", "short", "oversized", "outside-catalogue", "no-operating-point"]).toContain((x.verdict as { status: string }).status);
      // NPSH over the band as the page's row says it, the points not judged included (product rule: an "unknown" names them).
      expect(x.npsh?.unjudged).toEqual(p.npsh?.unjudged ?? []);
      if (x.npsh?.status === "unknown") unknownSeen++;
    }
    // Control: the booster's first page holds a pump whose NPSH over the band is unknown for a point not judged.
    expect(unknownSeen).toBeGreaterThan(0);
  });

  test("method filter; an unknown method → 400; a system without duty → no results and a message", async () => {
    const speedOnly = await get(apiSearch.loader, `/api/v1/systems/${systemId}/search?method=speed`, String(systemId));
    expect(speedOnly.status).toBe(200);
    const rs = (speedOnly.body as { results: { adjustment: { kind: string } }[] }).results;
    expect(rs.length).toBeGreaterThan(0);
    expect(rs.every((x) => x.adjustment.kind === "speed")).toBe(true);
    const bad = await get(apiSearch.loader, `/api/v1/systems/${systemId}/search?method=Direct`, String(systemId));
    expect(bad.status).toBe(400);
    expect(bad.headers.get("content-type")).toBe("application/problem+json");
    const none = await get(apiSearch.loader, `/api/v1/systems/${noDutyId}/search`, String(noDutyId));
    expect(none.status).toBe(200);
    expect(none.body).toMatchObject({ results: [], message: expect.stringContaining("duty") });
  });

  test("bad id → 400, another workspace's token → 404 (problem+json), never 500", async () => {
    expect((await get(apiSearch.loader, "/api/v1/systems/-1/search", "-1")).status).toBe(400);
    const foreign = await get(apiSearch.loader, `/api/v1/systems/${systemId}/search`, String(systemId), otherToken);
    expect(foreign.status).toBe(404);
    expect(foreign.headers.get("content-type")).toBe("application/problem+json");
  });
});

describe("searchResultView (pure)", () => {
  const base = {
    id: "7", rank: 1, label: "X", method: "trim" as const, ratio: 0.9, speed: 2900, diameter: 0.171, headAtDuty: 30, efficiency: 0.7,
    bepRatio: 1, inPor: true, npshr: 2, npshMargin: 3, shaftPower: 5000, score: 0.6, reason: "r", warnings: [{ code: "w", message: "trim approx" }],
    curveSetId: 7, modelId: 3, model: "X", type: "inline", size: "DN50", library: "L", setSpeed: 2900, setDiameter: 0.19, verdict: null, npsh: null,
    ratioNote: null, directRule: "Not direct: (invented words)", operatingPoint: null, atTypedDuty: { ratio: 0.92, speed: 2900, diameter: 0.175, efficiency: 0.68, shaftPower: 5200, bepRatio: 0.9, inPor: true },
  };
  test("maps method → adjustment.kind and passes a verdict through when the result has one, else null", () => {
    expect(searchResultView(base)).toMatchObject({ modelId: 3, library: "L", verdict: null,
      adjustment: { kind: "trim", ratio: 0.9, speed: 2900, diameter: 0.171 }, warnings: ["trim approx"] });
    const verdict = { status: "meets", rule: "r", reasons: ["x"] };
    expect(searchResultView({ ...base, method: "direct", ratio: 1, verdict, library: "Own", modelId: 9 }).adjustment.kind).toBe("none");
    expect(searchResultView({ ...base, verdict, library: "Own", modelId: 9 })).toMatchObject({ verdict, library: "Own", modelId: 9 });
  });
  test("verdictNpsh: what NPSH says against the verdict on its line, flipping with the status (none when ok)", () => {
    // Rule: NPSHa / NPSHr below 1 is a cavitation risk (common practice); the figures are made up.
    const verdict = { status: "meets", rule: "r", reasons: ["x"] };
    const point = (ratio: number) => ({ at: "least lift, new pipe", flow: 0.01, available: 2 * ratio, required: 2, marginRatio: ratio });
    const npsh = (ratio: number) => ({ status: ratio < 1 ? "cavitation-risk" : ratio < 1.1 ? "low-margin" : "ok", marginRatio: ratio, at: "least lift, new pipe", available: 2 * ratio, rule: "r", requiredMargin: 1.1, judgedAt: [point(ratio)] });
    expect(searchResultView({ ...base, verdict, npsh: npsh(1.2) }).verdictNpsh).toBeNull();
    expect(searchResultView({ ...base, verdict, npsh: npsh(0.81) }).verdictNpsh).toBe("but NPSHa ⟦head|1.62|zero:2⟧ below NPSHr ⟦head|2|1.62⟧ at least lift, new pipe (NPSHa / NPSHr 0.81, below 1): cavitation risk");
    expect(searchResultView({ ...base, verdict: null, npsh: npsh(0.81) }).verdictNpsh).toBeNull();
  });
  test("passes the band's NPSH judgement through (its NPSHa null when a stored one lacks it), null without", () => {
    expect(searchResultView(base).npsh).toBeNull();
    const npsh = { status: "cavitation-risk", marginRatio: 0.81, at: "least lift, new pipe", rule: "r", judgedAt: [] };
    expect(searchResultView({ ...base, npsh }).npsh).toEqual({ status: "cavitation-risk", marginRatio: 0.81, at: "least lift, new pipe", available: null, rule: "r", unjudged: [] });
  });
  test("an NPSH left unknown names its points not judged, with why (npshOverBand's rule; the search row says the same)", () => {
    const unjudged = [{ at: "least lift, new pipe", why: "no operating point" }];
    const npsh = { status: "unknown", marginRatio: 1.5, at: "design point", available: 6, rule: "r", judgedAt: [], unjudged };
    expect(searchResultView({ ...base, npsh }).npsh).toEqual({ status: "unknown", marginRatio: 1.5, at: "design point", available: 6, rule: "r", unjudged });
  });
});
