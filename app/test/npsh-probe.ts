// Two invented pumps for judging NPSH over a system's band (fictional "Probe" curves): A is the more efficient, its
// NPSHr climbing steeply past 120 m³/h; B is less efficient with a flat NPSHr. On the system below, A looks fine at the
// duty and cavitates at the band's least-lift corner for a low suction head. Used by the search's NPSH tests.
import { createLibrary, updateLibrary, type Viewer } from "~/lib/libraries";
import { createProject, createSystem } from "~/lib/projects/projects.server";
import { defaultSystemInput, type SystemInput } from "~/lib/projects/hydraulics";
import { importCsvText, M3H, viewerOfUser } from "~/lib/projects/test-kit";
import { createApiToken } from "~/lib/auth/api-tokens.server";
import * as apiSearch from "~/routes/api.v1.systems.$id.search";
import { expect } from "vitest";
import { call, makeMember, type TestMember } from "./harness";

const FLOWS = [0, 30, 60, 90, 120, 150, 180, 210, 240]; // m³/h
const head = (q: number) => 45 - 6 * (q / 100) ** 2; // m
const eta = (q: number, peak: number) => (q === 0 ? 0 : peak * (q / 130) * (2 - q / 130));
const NPSHR_A = [1.5, 1.6, 1.8, 2.2, 5.0, 9, 14, 20, 26]; // m
const NPSHR_B = [1.5, 1.6, 1.8, 2.0, 2.3, 2.6, 3.0, 3.4, 3.8]; // m
const rows = (model: string, peak: number, npshr: number[]) =>
  FLOWS.map((q, i) => `${model},end-suction,DN100,2900,200,${q},${head(q).toFixed(2)},${(eta(q, peak) * 100).toFixed(1)},${npshr[i]}`);
export const NPSH_PROBE_CSV = ["model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct,npshr_m", ...rows("Probe A", 0.75, NPSHR_A), ...rows("Probe B", 0.7, NPSHR_B)].join("\n");
/** The same two curves published without an NPSHr column ("Probe C", "Probe D"): the search has no NPSHr to judge at the duty. */
export const NPSH_PROBE_NO_NPSHR_CSV = ["model,type,size,speed_rpm,impeller_mm,flow_m3h,head_m,efficiency_pct",
  ...[...rows("Probe C", 0.75, NPSHR_A), ...rows("Probe D", 0.7, NPSHR_B)].map((r) => r.slice(0, r.lastIndexOf(",")))].join("\n");

/** A workspace library of the two probes (with `npshr: false`, the curves without NPSHr) and a project to put systems in. */
export async function npshProbeProject(v: Viewer, opts: { npshr?: boolean } = {}): Promise<number> {
  const lib = await createLibrary(v, { name: "NPSH probes", description: "" });
  await importCsvText(v, lib, opts.npshr === false ? NPSH_PROBE_NO_NPSHR_CSV : NPSH_PROBE_CSV);
  await updateLibrary(v, lib, { name: "NPSH probes", description: "", visibility: "workspace" });
  return createProject(v, { name: "NPSH on the band", site: "", description: "" });
}

/** Static lift 20–28 m, 150 mm runs, duty 140 m³/h at 32.5 m; only the suction static head varies (it moves NPSHa, not the flows). */
export function npshProbeSystem(v: Viewer, projectId: number, suctionStaticHead: number, fluid?: SystemInput["fluid"]): Promise<number> {
  const input: SystemInput = { ...defaultSystemInput(), staticLow: 20, staticHigh: 28, suctionStaticHead, duty: { flow: 140 * M3H, head: 32.5 } };
  if (fluid) input.fluid = fluid;
  input.runs = input.runs.map((r) => ({ ...r, diameter: 0.15 }));
  return createSystem(v, projectId, `Suction ${suctionStaticHead} m`, input);
}

/** An admin of a new workspace, its probes' project (`npshr: false`: the curves without NPSHr) and a read token. */
export type NpshProbeSide = { m: TestMember; v: Viewer; projectId: number; token: string };
export async function npshProbeSide(npshr: boolean): Promise<NpshProbeSide> {
  const m = await makeMember("admin");
  const v = await viewerOfUser(m.userId);
  const projectId = await npshProbeProject(v, { npshr });
  const token = (await createApiToken({ userId: m.userId, workspaceId: m.workspaceId, name: "r", scope: "read" })).token;
  return { m, v, projectId, token };
}

/** The search API's answer for system `id`, read with the side's token (200 expected). */
export async function probeSearchApi<T>(s: NpshProbeSide, id: number): Promise<T> {
  const r = await call(apiSearch.loader as never, { path: `/api/v1/systems/${id}/search`, params: { id: String(id) }, headers: { authorization: `Bearer ${s.token}` } });
  expect(r.status).toBe(200);
  return r.body as T;
}
