// A drooping curve's notes at a drive's step (engine stepDroop.ts) reach the step they name: the step table
// (CandidateEnergy.tsx) and the selection CSV's column read `stepWarnings`, the printed report `cycleNoteLines`.
// Check values: an invented drooping curve (not any maker's), 40 m at shut-off, peak 46 m at 36 m³/h; an invented system
// 30 m static + friction to 36 m at 80 m³/h under system-curve control; the rules common practice (stepDroop.ts).
import { describe, expect, it } from "vitest";
import { createPumpCurve, dutyCycleEnergy } from "~/engine";
import { inSI } from "~/engine/quantityText";
import { STEP_NO_START, STEP_RISING_BRANCH } from "~/engine/stepDroop";
import { cycleNoteLines, stepWarnings } from "./cycle-notes";

const M3H = 1 / 3600;
const curve = createPumpCurve({ points: ([[0, 40, 0], [18, 44, 0.45], [36, 46, 0.62], [60, 42, 0.72], [90, 33, 0.74], [120, 20, 0.65]] as const).map(([q, h, e]) => ({ flow: q * M3H, head: h, efficiency: e })) });
const QD = 80 * M3H;
const r = dutyCycleEnergy({ curve, systemHead: (q) => 30 + (6 * q * q) / (QD * QD), designFlow: QD, mode: "system-curve", profile: [{ flowFraction: 0.125, hours: 1000 }, { flowFraction: 1, hours: 500 }],
  density: 1000, motor: { rating: 15000, efficiency: 0.9 }, driveEfficiency: 0.97 });

describe("a drooping curve's step notes where the cycle's step notes are shown", () => {
  it("both notes at the 12.5 % step (83.9 % speed, 10 m³/h left of 30.2 m³/h; 28.1 m below 30 m), none at full flow", () => {
    const notes = (code: string) => r.warnings.filter((w) => w.code === code).map((w) => inSI(w.message));
    const [rising] = notes(STEP_RISING_BRANCH), [noStart] = notes(STEP_NO_START);
    expect(rising).toContain("at 13 % flow the pump runs at 83.9 % speed, 10.0 m³/h: left of the drooping curve's peak at this speed, 32.3 m at 30.2 m³/h");
    expect(noStart).toContain("its shut-off head 40.0 m slows to 28.1 m (× 83.9 % squared, affinity laws), below the system's head at zero flow, 30.0 m");
    expect(stepWarnings(r, 0).map(inSI)).toEqual(expect.arrayContaining([rising, noStart]));
    expect(stepWarnings(r, 1).map(inSI).filter((w) => w === rising || w === noStart)).toEqual([]);
    const lines = cycleNoteLines(r).map(inSI);
    expect(lines).toContain(`Step at 13 % flow, 1000 h: ${rising}.`);
    expect(lines).toContain(`Step at 13 % flow, 1000 h: ${noStart}.`);
  });
});
