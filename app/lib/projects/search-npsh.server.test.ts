// The search judges NPSH as the workbench does: at the design point and at each corner of the system's
// band, the lowest margin deciding. A pump with a fine margin at the duty can cavitate at the band's
// least-lift corner (more flow, more NPSHr): it is ranked after the pumps that do not, and says why.
// Check values: common practice (NPSHa below NPSHr is a cavitation risk); the two pumps are made up
// for these tests (fictional "Probe" curves, app/test/npsh-probe.ts), their NPSHr curves chosen far apart at high flow.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { searchForSystem } from "./search.server";
import type { Viewer } from "../libraries";
import { viewerOfUser } from "./test-kit";
import { makeMember } from "~/test/harness";
import { npshProbeProject, npshProbeSystem } from "~/test/npsh-probe";

afterAll(() => closeDb());

let v: Viewer;
let projectId: number;
beforeAll(async () => {
  const m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  projectId = await npshProbeProject(v);
});

async function search(suctionStaticHead: number) {
  const r = await searchForSystem(v, await npshProbeSystem(v, projectId, suctionStaticHead));
  const row = (model: string) => r.results.find((x) => x.model === model)!;
  return { r, a: row("Probe A"), b: row("Probe B") };
}

describe("search: NPSH over the band's corners decides the rank, not the duty alone", () => {
  test("a pump fine at the duty but cavitating at least lift ranks after one that does not, and says why", async () => {
    const { r, a, b } = await search(2);
    expect(a.verdict?.status).toBe("meets");
    expect(b.verdict?.status).toBe("meets");
    expect(a.score).toBeGreaterThan(b.score); // the engine's duty-point score prefers A (more efficient)
    expect(a.npshMargin!).toBeGreaterThan(1.1); // and at the duty its NPSH looks fine
    expect(a.npsh?.status).toBe("cavitation-risk");
    expect(a.npsh?.at).toBe("least lift, new pipe");
    expect(a.npsh!.marginRatio!).toBeLessThan(1);
    expect(b.npsh?.status).toBe("ok");
    expect(r.results.map((x) => x.model)).toEqual(["Probe B", "Probe A"]);
    expect(a.reason).toMatch(/^#2 of 2: .*below #1 because it has a cavitation risk on the band \(NPSHa \/ NPSHr 0\.\d+ at least lift, new pipe\) where #1 is "meets the duty"$/);
    expect(a.reason).toMatch(/NPSH margin at duty \d\.\d+/); // the duty figure is named as such
  });

  test("the rank flips where NPSHa at that corner crosses the pump's NPSHr there", async () => {
    const { a } = await search(2);
    const corner = a.npsh!.judgedAt!.find((p) => p.at === a.npsh!.at)!;
    // NPSHa moves one for one with the suction static head; the flows (and so NPSHr) do not.
    const crossing = 2 + (corner.required! - corner.available!);
    const below = await search(crossing - 0.01);
    const above = await search(crossing + 0.01);
    expect(below.a.npsh?.status).toBe("cavitation-risk");
    expect(below.r.results[0].model).toBe("Probe B");
    expect(above.a.npsh?.status).toBe("low-margin"); // above 1, still below the wanted 1.1 (defaultSystemInput)
    expect(above.r.results[0].model).toBe("Probe A"); // back to the engine's order: a low margin is judged, not demoted
  });

  test("pumps left out for NPSH at the duty are counted, with NPSHa there", async () => {
    const fine = await search(2);
    expect(fine.r.stats!.rejectedByNpsh).toBe(0);
    const deep = await search(-6); // NPSHa at the duty ≈ 10.3 − 6 − losses: below Probe A's NPSHr there, above B's
    expect(deep.r.stats!.rejectedByNpsh).toBe(1);
    expect(deep.r.results.map((x) => x.model)).toEqual(["Probe B"]);
    expect(deep.r.npshaAtDuty!).toBeCloseTo(fine.r.npshaAtDuty! - 8, 6);
  });
});
