// One message per cause (decision "systexts"): a duty flow in the laminar–turbulent transition is said once per run — by
// the system's band text, which names the duty flow and its Re — not again as the run's one-flow warning at the duty.
// Check values: Re = 4Q/(π·D·ν) (definition), transition 2000–4000 (common practice); water at 20 °C, ν ≈ 1.00e-6 m²/s
// (IAPWS, from memory); the default system's two 100 mm runs (defaultSystemInput).
import { describe, expect, it } from "vitest";
import { defaultSystemInput, evaluateSystem } from "./hydraulics";
import { inSI } from "~/engine/quantityText";

const at = (flow: number) => evaluateSystem({ ...defaultSystemInput(), duty: { flow, head: 12 } });
const inTransition = (xs: readonly string[]) => xs.map(inSI).filter((w) => /laminar–turbulent transition/.test(w));

describe("a duty flow in the transition: the band text once per run, no one-flow warning beside it", () => {
  it("0.2 L/s (Re ≈ 2540 in 100 mm): each run's warnings say nothing of the transition; the system's name each run's band with the duty's Re", () => {
    const e = at(0.0002);
    expect(e.runs.map((r) => r.regime)).toEqual(["transition", "transition"]); // control
    for (const r of e.runs) expect(inTransition(r.warnings)).toEqual([]); // old code: ["Re = 2538 is in the laminar–turbulent transition (2000–4000); …"]
    const band = inTransition(e.warnings);
    expect(band).toHaveLength(2);
    for (const [i, name] of ["Suction line", "Rising main"].entries())
      expect(band[i]).toMatch(new RegExp(`^${name}: flows from .* the duty flow 0\\.720 m³/h \\(Re = 25\\d\\d\\) is in it\\. At Re = 25\\d\\d \\(the duty\\)`));
  });
  it("the flip: the curve drawn only to 0.36 m³/h, below the band (Re 2000 at 0.57 m³/h): no band text, so the run keeps its one-flow warning — the cause still said once", () => {
    const e = evaluateSystem({ ...defaultSystemInput(), duty: { flow: 0.0002, head: 12 }, flowMax: 0.0001 });
    expect(inTransition(e.warnings)).toEqual([]);
    for (const r of e.runs) expect(inTransition(r.warnings)).toEqual([expect.stringMatching(/^Re = 25\d\d is in the laminar–turbulent transition \(2000–4000\)/)]);
  });
  it("control: 0.5 L/s (Re ≈ 6300, turbulent): no run says it is in the transition, nor the system that the duty is", () => {
    const e = at(0.0005);
    expect(e.runs.map((r) => r.regime)).toEqual(["turbulent", "turbulent"]);
    for (const r of e.runs) expect(inTransition(r.warnings)).toEqual([]);
    expect(inTransition(e.warnings).join(" ")).not.toMatch(/is in it/);
  });
});
