// The search on a viscous custom liquid ranks on what each pump does on the liquid: the water curves are searched at the
// equivalent water duty (ANSI/HI 9.6.7's procedure for a viscous duty, from memory: B with the duty as the BEP, C_Q and C_H
// at 1.0 × Q_BEP, Q_W = Q/C_Q, H_W = H/C_H). Check values: the hand calculation in app/engine/viscous.test.ts (200 cSt at
// 100 m³/h, 2900 rpm: C_Q ≈ 0.908, within 1 % here as the duty head differs); the product's verdict rules (verdict.ts);
// the two pumps are made up for these tests (fictional "Visc probe" curves, app/test/visc-probe.ts).
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { searchForSystem } from "./search.server";
import { systemSearchView } from "./systems-api.server";
import { addCandidate, systemWorkbench } from "./projects.server";
import type { Viewer } from "../libraries";
import { M3H, viewerOfUser } from "./test-kit";
import { makeMember } from "~/test/harness";
import { OIL, viscInput, viscProbeProject, viscProbeSystem } from "~/test/visc-probe";
import { inSI } from "~/engine/quantityText";

afterAll(() => closeDb());

let v: Viewer;
let projectId: number;
beforeAll(async () => {
  const m = await makeMember("admin");
  v = await viewerOfUser(m.userId);
  projectId = await viscProbeProject(v);
});

const meetsOrOversized = (s: string | undefined) => s === "meets" || s === "oversized";

describe("search on a viscous liquid: ranked at the equivalent water duty", () => {
  test("as published only: the pump that meets on water but is short on the oil is no longer #1; the one that meets on the oil is", async () => {
    const id = await viscProbeSystem(v, projectId);
    // The premise: on the water curves at the oil's duty, "Visc probe Thin" (2 % above it on water) is the one pump met as
    // published (the old search's #1 and only row), and as published on the oil it is short.
    const head = viscInput(OIL()).duty!.head;
    const onWater = await searchForSystem(v, await viscProbeSystem(v, projectId, viscInput({ kind: "water" }, head), "Water twin (direct)"), { methods: ["direct"] });
    expect(onWater.results.map((x) => x.model)).toEqual(["Visc probe Thin"]);
    await addCandidate(v, id, onWater.results[0].curveSetId);
    const bench = await systemWorkbench(v, id);
    expect(bench.candidates[0].result?.verdict?.status).toBe("short");
    const r = await searchForSystem(v, id, { methods: ["direct"] });
    expect(r.results.length).toBeGreaterThan(0);
    expect(r.results[0].model).toBe("Visc probe Thick");
    expect(meetsOrOversized(r.results[0].verdict?.status)).toBe(true);
    // No row whose liquid verdict does not meet the duty ranks above one that does.
    const ok = r.results.map((x) => meetsOrOversized(x.verdict?.status));
    expect(ok.indexOf(false) === -1 || ok.lastIndexOf(true) < ok.indexOf(false)).toBe(true);
    const plan = r.liquidSearch!;
    expect(plan.ranksOnLiquid).toBe(true);
    expect(plan.groups).toHaveLength(1);
    const g = plan.groups[0];
    expect(g.speed).toBe(2900);
    expect(g.status).toBe("corrected");
    expect(g.factors!.flow).toBeCloseTo(0.908, 2); // hand value 0.90843 at 30 m (viscous.test.ts); B moves as H^0.0625
    expect(g.waterDuty.flow / M3H).toBeCloseTo(100 / g.factors!.flow, 6);
    expect(g.waterDuty.head).toBeCloseTo(r.system.input.duty!.head / g.factors!.head, 6);
    expect(inSI(plan.message)).toMatch(/2900 rpm: B = \d\.\d\d, C_Q 0\.9\d\d, C_H 0\.9\d\d, C_η 0\.\d{3} → water duty 1\d\d(\.\d+)? m³\/h at \d+(\.\d+)? m/);
    expect(plan.rule).toMatch(/Q_W = Q_vis \/ C_Q, H_W = H_vis \/ C_H/);
    // The rank's figures are the liquid's estimate: efficiency C_η × the water curve's at the water duty (78 % peak there, demo
    // probe); the row shows its verdict's own figures at the operating point on the corrected curve (search-row-judged.test.ts).
    expect(r.results[0].atTypedDuty.efficiency!).toBeCloseTo(0.78 * g.factors!.efficiency, 2);
  });

  test("the read API carries the plan", async () => {
    const id = await viscProbeSystem(v, projectId, undefined, "Oil line (API)");
    const view = await systemSearchView(v, id, { methods: ["direct"] });
    expect(view.liquidSearch?.groups[0].status).toBe("corrected");
    expect(view.results[0].model).toBe("Visc probe Thick");
  });

  test("B above 40 keeps the water ranking at the duty itself and says so", async () => {
    const head = viscInput(OIL()).duty!.head;
    // 8 Pa·s / 900 kg/m³ = 8889 cSt: B ≈ 0.4926 · 8889^0.5 ≈ 46 at this duty (hand, viscous.test.ts scaling), above 40.
    // Beyond the catalogue shown too: the system's own head (viscous friction) moves the solved trims, and so what is hidden.
    const thick = await searchForSystem(v, await viscProbeSystem(v, projectId, viscInput(OIL(8), head), "Tar line"), { allowBeyondCatalogue: true });
    const water = await searchForSystem(v, await viscProbeSystem(v, projectId, viscInput({ kind: "water" }, head), "Water twin"), { allowBeyondCatalogue: true });
    const g = thick.liquidSearch!.groups[0];
    expect(g.status).toBe("outside-method");
    expect(g.b!).toBeGreaterThan(40);
    expect(g.waterDuty).toEqual(thick.system.input.duty);
    expect(thick.liquidSearch!.ranksOnLiquid).toBe(false);
    expect(inSI(thick.liquidSearch!.message)).toMatch(/^No equivalent water duty .*: 2900 rpm: B = 4\d\.\d\d, above 40: outside the method, so ranked on the water curves at the duty itself as before/);
    expect(water.liquidSearch).toBeNull();
    // The same rows with the same scores as on water (the engine's figures at the typed duty; power only scaled by density).
    const rowsOf = (x: typeof water) => x.results.map((c) => [c.curveSetId, c.method, c.score.toFixed(12)].join(" ")).sort();
    expect(water.results.length).toBe(2);
    expect(rowsOf(thick)).toEqual(rowsOf(water));
  });
});

describe("search on a viscous liquid: a curve naming no speed", () => {
  test("is searched at the duty itself on its water figures and ranked after the rows estimated on the liquid, saying why", async () => {
    const w = await viewerOfUser((await makeMember("admin")).userId);
    const id = await viscProbeSystem(w, await viscProbeProject(w, { nameless: true }));
    const r = await searchForSystem(w, id, { methods: ["direct"] });
    expect(r.liquidSearch!.groups.map((g) => [g.speed, g.status])).toEqual([[2900, "corrected"], [null, "no-speed"]]);
    expect(r.results.map((x) => x.model)).toEqual(["Visc probe Thick", "Visc probe Nameless"]);
    const nameless = r.results[1];
    // Its verdict is the water curve's (no B without a speed: viscosity-check.ts), in the same class as #1's; its figures are water's.
    expect(nameless.verdict?.status).toBe(r.results[0].verdict?.status);
    expect(nameless.score).toBeGreaterThan(r.results[0].score);
    expect(nameless.reason).toMatch(/below #1 because its figures are the water curve's where #1's are estimated on Probe oil \(ANSI\/HI 9\.6\.7 equivalent water duty\)$/);
    expect(nameless.warnings.map((x) => x.message).join(" ")).toMatch(/names no speed, so B cannot be computed/);
    expect(inSI(r.liquidSearch!.message)).toMatch(/1 curve set naming no speed: B needs the speed, so searched at the duty itself on the water curves/);
  });

  test("pumps in parallel: the plan and the rows name one pump's share of the duty, never 'the duty itself' (it is not)", async () => {
    const w = await viewerOfUser((await makeMember("admin")).userId);
    const id = await viscProbeSystem(w, await viscProbeProject(w, { nameless: true }), undefined, "Oil line, two pumps");
    const r = await searchForSystem(w, id, { allowBeyondCatalogue: true, arrangement: { arrangement: "parallel", dutyPumps: 2, standbyPumps: 0 } });
    const plan = r.liquidSearch!;
    // The duty searched is one pump's: the typed flow / 2 at the typed head (search-arrangement.ts dutyShare, common practice).
    expect(plan.duty.flow).toBeCloseTo(r.system.input.duty!.flow / 2, 12);
    expect(plan.duty.head).toBe(r.system.input.duty!.head);
    const g = plan.groups.find((x) => x.status === "corrected")!;
    expect(g.waterDuty.flow).toBeCloseTo(plan.duty.flow / g.factors!.flow, 9); // Q_W = Q_vis / C_Q (ANSI/HI 9.6.7, from memory) of the share
    const share = "one pump's share of the duty (2 duty pumps in parallel: the duty flow / 2)";
    expect(plan.message).toContain(`ANSI/HI 9.6.7 (from memory) of ${share}:`);
    expect(plan.message).toContain(`B needs the speed, so searched at ${share} on the water curves`);
    expect(plan.message).not.toContain("the duty itself");
    const warnings = r.results.flatMap((x) => x.warnings.map((m) => m.message)).join(" ");
    expect(warnings).toContain(`figures on the water curve at ${share} (the curve names no speed`);
    expect(warnings).not.toContain("the duty itself");
  });
});
