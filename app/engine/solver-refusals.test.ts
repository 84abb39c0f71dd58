/**
 * The operating-point solver's public functions (operatingPoint.ts, multiple.ts, system.ts) refuse what is no curve or no
 * system with a stated EngineInputError naming the input — never a bare TypeError ("Cannot use 'in' operator to search for
 * 'head' in null"), which a caller shows as a crash or a 500 — and never return NaN. Check values: the inputs' names, as the
 * functions document them; a finite answer for a good curve beside each refusal (the flip).
 */
import { describe, expect, it } from "vitest";
import { combinePumps, EngineInputError, fluidAt, flowPerPump, operatingPointInSystem, solveOperatingPoint, systemHeadFunction } from "./index.ts";

const good = { points: [{ flow: 0, head: 40 }, { flow: 0.01, head: 35 }, { flow: 0.02, head: 25 }] };
const spec = { fluid: fluidAt({ kind: "water" }, 20), staticHead: 30, discharge: [{ length: 100, diameter: 0.1, roughness: 4.5e-5 }] };
const notACurve: unknown[] = [null, undefined, 5, "curve", true];

const refusal = (f: () => unknown) => {
  try {
    const r = f();
    return `answered ${JSON.stringify(r)?.slice(0, 80)}`;
  } catch (e) {
    return e instanceof EngineInputError ? `refused ${e.message}` : `crashed ${(e as Error).constructor.name}: ${(e as Error).message}`;
  }
};

describe("no curve, no system: a stated refusal", () => {
  it.each(notACurve.map((x) => [String(x), x]))("curve %s", (_, x) => {
    const c = x as typeof good;
    // old code: "crashed TypeError: Cannot use 'in' operator to search for 'head' in null" (and in 5, "curve", true)
    for (const f of [() => solveOperatingPoint(c, () => 20), () => operatingPointInSystem(c, spec), () => combinePumps(c, { mode: "parallel", duty: 2 }), () => flowPerPump(0.01, { mode: "parallel", duty: 2 }, c ?? 5 as unknown as typeof good)])
      expect(refusal(f)).toBe("refused curve: is required");
  });
  it.each(notACurve.map((x) => [String(x), x]))("system %s", (_, x) => {
    const s = x as typeof spec;
    expect(refusal(() => operatingPointInSystem(good, s))).toBe("refused system: is required");
    expect(refusal(() => systemHeadFunction(s))).toBe("refused system: is required");
  });
  it("the flip: a good curve and system answer with finite numbers", () => {
    const op = operatingPointInSystem(good, spec);
    expect(op.status).toBe("ok");
    expect(Number.isFinite(op.flow) && Number.isFinite(op.head)).toBe(true);
    expect(Number.isFinite(systemHeadFunction(spec)(0.01))).toBe(true);
  });
});
