// The search's rows where NPSHa at the duty is just above zero, at zero and just below it, through the read API
// (GET /api/v1/systems/:id/search): no row that passes (meets the duty, oversized) reads as a plain pass. A pump with an
// NPSHr at the duty is left out at NPSHa ≤ 0 (the engine judges NPSHa as zero there); a pump that publishes no NPSHr is
// kept (the note says it cavitates there too), and its row's verdictNpsh says either its cavitation risk (NPSHa ≤ 0 at a
// point it runs at) or "NPSH not checked" with the flows (it read null: a plain "meets the duty" on its line).
// Check values: the rule "NPSHa at or below zero: cavitation risk whatever the pump" and "NPSH judged wherever the pump
// runs" (common practice); NPSHa moves one for one with the suction static head (NPSHa = (p − p_v)/(ρg) + z − h_f,
// Karassik's Pump Handbook, from memory), so the systems are set from one system's NPSHa read through the service. Pumps:
// the invented NPSH probes (app/test/npsh-probe.ts), with and without their NPSHr column.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { searchForSystem } from "~/lib/projects";
import { npshProbeSide, npshProbeSystem, probeSearchApi, type NpshProbeSide } from "./npsh-probe";

afterAll(() => closeDb());

type Row = { model: string; verdict: { status: string } | null; verdictNpsh: string | null; npsh: { status: string } | null; figures: { npshRequired: number | null } };
type Answer = { npshaAtDuty: number; npshaNote: string | null; stats: { rejectedByNpsh: number }; results: Row[] };
type Side = NpshProbeSide;

const side = npshProbeSide;
const read = (s: Side, id: number) => probeSearchApi<Answer>(s, id);
/** Systems whose NPSHa at the duty is each offset (m): the suction static head moved from a probe's by the difference. */
async function atNpsha(s: Side, offsets: number[]): Promise<number[]> {
  const a0 = (await searchForSystem(s.v, await npshProbeSystem(s.v, s.projectId, 0))).npshaAtDuty!;
  return Promise.all(offsets.map((o) => npshProbeSystem(s.v, s.projectId, o - a0)));
}
const PASSES = ["meets", "oversized"];
const OFFSETS = [0.001, 0, -0.001]; // m: just above zero, at zero (to the rounding of the sum), just below

let withNpshr: Side, withoutNpshr: Side;
beforeAll(async () => {
  [withNpshr, withoutNpshr] = await Promise.all([side(true), side(false)]);
});

describe("NPSHa at the duty around zero: no row is a plain pass", () => {
  test("pumps without NPSHr: kept, and every row that passes says why its NPSH is no pass (cavitation risk or not checked)", async () => {
    let passing = 0;
    for (const id of await atNpsha(withoutNpshr, OFFSETS)) {
      const a = await read(withoutNpshr, id);
      expect(a.results.length).toBeGreaterThan(0);
      for (const r of a.results) {
        if (!r.verdict || !PASSES.includes(r.verdict.status)) continue;
        passing++;
        expect(r.verdictNpsh, `${r.model} at NPSHa ${a.npshaAtDuty} m`).toMatch(/cavitation risk|NPSH not checked: the curve publishes no NPSHr at /);
        if (a.npshaAtDuty <= 0) expect(a.npshaNote).toMatch(/no pump can run there without cavitating/);
      }
    }
    expect(passing).toBeGreaterThan(0); // the probes meet the duty (a sweep that judged nothing would prove nothing)
  });
  test("pumps with NPSHr: every one left out at NPSHa ≤ 0; just above zero, left out too (NPSHr 1.5 m and more above 1 mm)", async () => {
    for (const [i, id] of (await atNpsha(withNpshr, OFFSETS)).entries()) {
      const a = await read(withNpshr, id);
      expect(a.results, `offset ${OFFSETS[i]}`).toEqual([]);
      expect(a.stats.rejectedByNpsh).toBe(2);
    }
  });
});
