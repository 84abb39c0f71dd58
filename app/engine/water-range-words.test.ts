// Water's tabulated range (fluids.ts, 0–100 °C: the range the correlations are checked over against python3-iapws) is
// refused outside; the refusal's temperature reads apart from the end it is outside: 100.04 °C printed "100 °C" beside
// "cover … 100 °C" and -0.004 °C "-0.004 °C" is kept apart from 0. Check values by construction (the range's own ends).
import { describe, expect, it } from "vitest";
import { waterProperties } from "./fluids.ts";
import { inSI } from "./quantityText.ts";
import { EngineInputError } from "./errors.ts";

const refusal = (t: number): string | null => {
  try {
    waterProperties(t);
    return null;
  } catch (e) {
    if (e instanceof EngineInputError) return inSI(e.message);
    throw e;
  }
};

describe("water outside 0–100 °C: the refusal's temperature never reads as the range's end", () => {
  it("just above 100 °C and just below 0 °C are refused, the value printed apart from the end", () => {
    const hot = refusal(100.04);
    expect(hot).toMatch(/\(got 100\.04 °C\)/);
    const cold = refusal(-0.004);
    expect(cold).toMatch(/\(got −0\.004 °C\)/);
  });
  it("the ends themselves are taken (the flip is at the end, both sides)", () => {
    expect(refusal(100)).toBeNull();
    expect(refusal(0)).toBeNull();
    expect(refusal(100.0000001)).not.toBeNull();
  });
});
