// The oversized verdict's "speed to the duty" saving says how its speed was set, as the candidate's own note does
// (setting-step.ts): rounded up to the next whole rpm, or, where that would pass the published curve's speed, the curve's
// own speed. Check values: the rounding rule (whole rpm, common practice for a drive's set point) on the demo's invented
// Meregate 150 curve, with its speed stated as 2900.4 rpm so that the next whole rpm (2901) lies past it.
import { describe, expect, it } from "vitest";
import { generateDemo } from "../../../fixtures/demo/generate";
import { demoCurveSI } from "~/test/demo-curves";
import { demoSystems } from "../../cli/demo-systems";
import { DEFAULT_ADJUSTMENT, defaultSystemInput, evaluateCandidate, tableRun, type SystemInput } from "./hydraulics";
import { inSI } from "~/engine/quantityText";

const meregate = generateDemo().flatMap((d) => d.curves).find((c) => c.model.includes("Meregate 150") && c.speed === 2900 && c.impellerMm === 195)!;
/** The demo's "CHW secondary loop" (invented) with 6 in steel runs, as candidate-verdict.test.ts's `chw()`, discharge length in m. */
const system = (dischargeLength: number): SystemInput => ({
  ...demoSystems().find((d) => d.system === "CHW secondary loop")!.input,
  runs: [
    tableRun("suction", "Header to pump", "steel-sch40", "6", "steel", 12, [{ id: "elbow-90-standard", count: 3 }]),
    tableRun("discharge", "Riser", "steel-sch40", "6", "steel", dischargeLength, [{ id: "elbow-90-standard", count: 16 }, { id: "swing-check", count: 1 }], 4),
  ],
  duty: { flow: 100 / 3600, head: 20 },
  npshMargin: defaultSystemInput().npshMargin,
});
/** 600 m of discharge: the pump as published meets this system on its curve (at 180 m it runs past the curve's end). */
const base = system(600);

/** The system with its duty a share `f` of what the pump as published delivers at the demanding edge, no tolerance above it. */
function oversizedBy(set: ReturnType<typeof demoCurveSI>, f: number): SystemInput {
  const probe = evaluateCandidate(base, set, DEFAULT_ADJUSTMENT);
  const edge = probe.band.find((b) => b.edge === probe.verdict!.edge)!;
  return { ...base, duty: { flow: edge.flow! * f, head: base.duty!.head }, flowTolerance: { minus: 0, plus: 0 } };
}
const speedSaving = (set: ReturnType<typeof demoCurveSI>, f: number) => {
  const r = evaluateCandidate(oversizedBy(set, f), set, DEFAULT_ADJUSTMENT);
  expect(r.verdict!.status).toBe("oversized");
  return inSI(r.verdict!.reasons.join(" ")).match(/Speed to the duty \([^)]*\)\)/)?.[0] ?? "";
};

describe("the speed saving says how its speed was set", () => {
  it("solved below a whole rpm: the next whole rpm up", () => {
    expect(speedSaving(demoCurveSI(meregate), 0.9)).toMatch(/\(\d+ rpm, the next whole rpm up\)\)$/);
  });
  it("a curve stated at 2900.4 rpm, the duty 0.005 % below what it delivers (solved ≈ 2900.3 rpm): the curve's own speed, said so", () => {
    const set = { ...demoCurveSI(meregate), speed: 2900.4 };
    expect(speedSaving(set, 0.99995)).toMatch(/\(2900\.4 rpm, the published curve's: rounding up would pass it\)\)$/);
  });
});
