// What a duty cycle says at each step (cycle-notes.ts): product rules. The cycle here is written by hand, as a
// selection frozen before warnings named their step would hold it (a warning without `parameter`).
import { describe, expect, it } from "vitest";
import { cycleNoteLines, cycleWarnings, stepVerdict, stepWarnings } from "./cycle-notes";

const step = (flowFraction: number, hours: number, status: "ok" | "beyond-curve" | "control-below-system" | "below-speed-range" | "no-power-data", message: string) => ({ flowFraction, hours, status, message });
const cycle = {
  steps: [step(1, 1000, "ok", "full speed, throttled"), step(0.25, 2000, "control-below-system", "the control curve gives 5 m"), step(0.5, 500, "no-power-data", "the curve has no efficiency or power at 10 m³/h")],
  warnings: [
    { code: "motor-very-light-load", parameter: "profile[0]", message: "at 100 % flow the motor runs at 9.5 % load" },
    { code: "motor-very-light-load", message: "at 50 % flow the motor runs at 8.0 % load" }, // frozen before warnings named their step
    { code: "cycle-incomplete", message: "some steps … are missing from the total" },
  ],
};

describe("cycle notes", () => {
  it("a step not met or not computed says which; an ok step says nothing", () => {
    expect(cycle.steps.map(stepVerdict)).toEqual(["", "not met", "not computed"]);
    expect(stepVerdict({ status: "beyond-curve" })).toBe("not met");
    expect(stepVerdict({ status: "below-speed-range" })).toBe("not met");
  });
  it("a warning naming its step goes to that step; one naming none goes under the table; the incomplete warning is left to the totals' mark", () => {
    expect(stepWarnings(cycle, 0)).toEqual(["at 100 % flow the motor runs at 9.5 % load"]);
    expect(stepWarnings(cycle, 1)).toEqual([]);
    expect(cycleWarnings(cycle)).toEqual(["at 50 % flow the motor runs at 8.0 % load"]);
    expect(cycleWarnings({ steps: [] })).toEqual([]); // a cycle without warnings (frozen before they existed)
  });
  it("the printed lines name each step by its flow and hours, in step order, then the other warnings", () => {
    expect(cycleNoteLines(cycle)).toEqual([
      "Step at 100 % flow, 1000 h: at 100 % flow the motor runs at 9.5 % load.",
      "Step at 25 % flow, 2000 h: not met — the control curve gives 5 m.",
      "Step at 50 % flow, 500 h: not computed — the curve has no efficiency or power at 10 m³/h.",
      "At 50 % flow the motor runs at 8.0 % load.",
    ]);
  });
});
