// The systems read API (GET /api/v1/systems/:id and POST …/preview) carries the verdict's NPSH qualifier (`verdictNpsh`,
// as the search API and every page that shows the verdict) and no NPSH margin ratio where NPSHa ≤ 0 (null, as the
// selection CSV leaves it blank: NPSHa / NPSHr ≤ 0 means nothing, DEVELOPERS.md "npshenergy" and "followups").
// Check values: the rule "NPSHa ≤ 0: cavitation risk whatever the pump's NPSHr" (common practice); water's vapour pressure at
// 100 °C about one standard atmosphere (steam tables, from memory), so with the suction surface at the pump NPSHa < 0; the
// qualifier's text is verdict-npsh.ts's own (identity). Pumps: the Tallowmere demo library (invented data).
import { createElement } from "react";
import { renderToString } from "react-dom/server";
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { SystemsApiDocs } from "~/components/api-docs-systems";
import { closeDb } from "@db/client.server";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import { addCandidate, createProject, createSystem, searchForSystem } from "~/lib/projects";
import { DEFAULT_ADJUSTMENT, type SystemInput } from "~/lib/projects/hydraulics";
import { verdictNpshNote } from "~/lib/projects/verdict-npsh";
import { call, makeMember } from "./harness";
import * as apiSystem from "~/routes/api.v1.systems.$id";
import * as apiPreview from "~/routes/api.v1.systems.$id.preview";
import { renderUnits, SI_UNITS } from "~/lib/shared/units";
import { boosterInput, demoLibrary, viewerOfUser } from "~/lib/projects/test-kit";

afterAll(() => closeDb());

type Point = { npshAvailable?: number | null; npshMarginRatio: number | null; npshRequired?: number | null };
type ApiCandidate = { result: { verdict: { status: string } | null; verdictNpsh?: string | null; npsh: Parameters<typeof verdictNpshNote>[1] & { judgedAt?: { available: number | null; marginRatio: number | null }[] }; figures: Point | null; band: Point[] } };

let token = "";
let boilingId = 0;
let coldId = 0;
/** The booster at 100 °C with the suction surface level with the pump (NPSHa below zero at every flow). */
const boiling = (): SystemInput => ({ ...boosterInput(), temperatureC: 100, suctionStaticHead: 0 });

beforeAll(async () => {
  const m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  await demoLibrary(v, "API NPSH pumps");
  const p = await createProject(v, { name: "API NPSH", site: "", description: "" });
  coldId = await createSystem(v, p, "Booster 20 °C", boosterInput());
  boilingId = await createSystem(v, p, "Booster 100 °C", boiling());
  const found = await searchForSystem(v, coldId);
  for (const id of [coldId, boilingId]) {
    const added = await addCandidate(v, id, found.results[0].curveSetId, { ...DEFAULT_ADJUSTMENT, method: "speed" });
    if (!added.ok) throw new Error(added.reason);
  }
  token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
});

const auth = () => ({ authorization: `Bearer ${token}` });
async function read(id: number): Promise<ApiCandidate> {
  const r = await call(apiSystem.loader as never, { path: `/api/v1/systems/${id}`, params: { id: String(id) }, headers: auth() });
  expect(r.status).toBe(200);
  return (r.body as { candidates: ApiCandidate[] }).candidates[0];
}
async function preview(id: number, input: SystemInput): Promise<ApiCandidate> {
  const r = await call(apiPreview.action as never, { path: `/api/v1/systems/${id}/preview`, method: "POST", params: { id: String(id) }, headers: { ...auth(), "content-type": "application/json" }, body: JSON.stringify({ input }) });
  expect(r.status).toBe(200);
  return (r.body as { candidates: ApiCandidate[] }).candidates[0];
}

/** Every NPSH point of a candidate as the API gives it: figures, the band's edges and the judged points. */
function points(c: ApiCandidate): { available: number | null | undefined; ratio: number | null; required?: number | null }[] {
  const r = c.result;
  return [
    ...(r.figures ? [{ available: r.figures.npshAvailable, ratio: r.figures.npshMarginRatio, required: r.figures.npshRequired }] : []),
    ...r.band.map((b) => ({ available: b.npshAvailable, ratio: b.npshMarginRatio, required: b.npshRequired })),
    ...(r.npsh.judgedAt ?? []).map((p) => ({ available: p.available, ratio: p.marginRatio })),
  ];
}

describe("NPSH in the systems read API where NPSHa ≤ 0 (the booster at 100 °C, suction surface at the pump)", () => {
  for (const [name, get] of [["GET /api/v1/systems/:id", () => read(boilingId)], ["POST …/preview", () => preview(coldId, boiling())]] as const) {
    test(`${name}: verdictNpsh beside the verdict, the qualifier's own text`, async () => {
      const c = await get();
      expect(c.result.verdict).not.toBeNull();
      expect(c.result.npsh.status).toBe("cavitation-risk");
      const note = renderUnits(verdictNpshNote(c.result.verdict, c.result.npsh) ?? "", SI_UNITS);
      expect(note).toMatch(/NPSHa −\d+\.\d+ m, at or below zero, at .*: cavitation risk whatever the pump's NPSHr$/);
      expect(c.result.verdictNpsh).toBe(note);
    });
    test(`${name}: no margin ratio where NPSHa ≤ 0 (null, as the CSV's blank), NPSHa kept`, async () => {
      const ps = points(await get());
      // The case: points with NPSHr published, where the old answer held NPSHa / NPSHr below zero.
      expect(ps.filter((p) => p.available != null && p.available <= 0 && (p.required ?? 0) > 0).length).toBeGreaterThan(0);
      for (const p of ps) if (p.available != null && p.available <= 0) expect(p.ratio).toBeNull();
    });
  }
  test("the flip at 20 °C: NPSHa above zero keeps its ratios; verdictNpsh null when NPSH is ok, else the qualifier", async () => {
    const c = await read(coldId);
    const ps = points(c).filter((p) => p.available != null && p.available > 0 && (p.required ?? 0) > 0);
    expect(ps.length).toBeGreaterThan(0);
    for (const p of ps) expect(p.ratio).toBeGreaterThan(0);
    const note = verdictNpshNote(c.result.verdict, c.result.npsh);
    expect(c.result.verdictNpsh).toBe(note == null ? null : renderUnits(note, SI_UNITS));
  });
});

describe("the /api page names every key of a candidate's result.npsh the read API sends", () => {
  // The read API sends result.npsh as judged, with npshrPublished and its column (the published NPSHr points kept with a
  // result, helper "npshtrim"); the page's candidates[] row said only "npsh (NPSH over the band)".
  /** Every key path of a JSON value ("npshrPublished.column[].flow"). */
  const keyPaths = (x: unknown, at = ""): string[] =>
    Array.isArray(x) ? x.flatMap((y) => keyPaths(y, `${at}[]`))
    : x && typeof x === "object" ? Object.entries(x).flatMap(([k, y]) => [`${at}${at ? "." : ""}${k}`, ...keyPaths(y, `${at}${at ? "." : ""}${k}`)]) : [];
  const docs = () => renderToString(createElement(SystemsApiDocs, { Code: ({ children }: { children: string }) => createElement("pre", null, children), pageRows: 25, judged: 80 }))
    .replace(/<!-- -->/g, "").replace(/<[^>]+>/g, "").replace(/&#x27;/g, "'").replace(/\s+/g, " ");
  test("GET /api/v1/systems/:id: npshrPublished with its column of published points (flow m³/s, NPSHr m), as the result keeps it", async () => {
    const n = (await read(coldId)).result.npsh as { npshrPublished?: { from: number; to: number; points: number; column?: { flow: number; npshr: number }[] } | null };
    const pub = n.npshrPublished!;
    expect(pub.column!.length).toBe(pub.points);
    expect([pub.column![0].flow, pub.column!.at(-1)!.flow]).toEqual([pub.from, pub.to]);
  });
  test("each key, and npshrPublished's own, in the docs' candidates[] row", async () => {
    const sent = [...new Set(keyPaths((await read(coldId)).result.npsh).map((p) => p.split(".").at(-1)!.replace(/\[\]$/, "")))];
    const text = docs();
    const row = /npsh \(NPSH over the band.*?\), warnings,/.exec(text)?.[0] ?? "";
    expect(sent).toEqual(expect.arrayContaining(["npshrPublished", "column", "npshr", "judgedAt", "unjudged"])); // control: what is sent
    expect(sent.filter((k) => !new RegExp(`\\b${k}\\b`).test(row))).toEqual([]);
    expect(row).toMatch(/npshrPublished: the NPSHr one pump's curve publishes, as run .* column \[\{ flow \(m³\/s\), npshr \(m\) \}\]/);
  });
});
