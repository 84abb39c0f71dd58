// The search's arrangement read from the page's query, the read API's and a ticked row's value (search-arrangement.ts),
// and one pump's share of the duty the engine ranks at. Check values: the share rule (flow / N in parallel, head / N in
// series: identical pumps share the duty equally, common practice), the candidate's own bounds (candidate-input.ts:
// 1–8 duty pumps, 0–8 standby) and the note style of search-filters.ts (the value quoted, the rule, what is done instead).
import { describe, expect, test } from "vitest";
import * as v from "valibot";
import { PicksSchema } from "./candidates.server";
import { DEFAULT_ADJUSTMENT } from "./candidate-input";
import { arrangementAdjustment, arrangementKey, arrangementRule, dutyShare, pickSuffix, readArrangement, SINGLE_PUMP } from "./search-arrangement";
import { readSearchFilters } from "./search-filters";
import { SI_UNITS } from "../shared/units";

const page = (q: Record<string, string>) => readSearchFilters({ type: "", size: "", speed: "", maxPower: "", method: [], beyond: false, ...q }, SI_UNITS);

describe("the page's arrangement filter", () => {
  test("the form's defaults (one pump, 2, 0) and no arrangement at all: one pump, no note", () => {
    for (const q of [{} as Record<string, string>, { arrangement: "single", pumps: "2", standby: "0" }, { arrangement: "", pumps: "", standby: "" }]) {
      const r = page(q);
      expect(r.filters.arrangement).toBeUndefined();
      expect(r.arrangement).toEqual(SINGLE_PUMP);
      expect(r.notes).toEqual([]);
    }
  });
  test("duty pumps in parallel with standby, in series; a blank count is 2", () => {
    expect(page({ arrangement: "parallel", pumps: "3", standby: "1" }).filters.arrangement).toEqual({ arrangement: "parallel", dutyPumps: 3, standbyPumps: 1 });
    expect(page({ arrangement: "series", pumps: "2", standby: "0" }).filters.arrangement).toEqual({ arrangement: "series", dutyPumps: 2, standbyPumps: 0 });
    expect(page({ arrangement: "parallel", pumps: " " }).filters.arrangement).toEqual({ arrangement: "parallel", dutyPumps: 2, standbyPumps: 0 });
    expect(page({ arrangement: "parallel", pumps: "8", standby: "8" }).notes).toEqual([]); // the candidate's bound: 8 duty pumps
  });
  test("odd values are set aside, each named with its rule and what the search does instead", () => {
    const cases: [Record<string, string>, string, unknown][] = [
      [{ arrangement: "ring" }, "Unknown arrangement “ring” (the search knows single, parallel and series), so one pump is searched.", undefined],
      [{ arrangement: "parallel", pumps: "1" }, "Duty pumps must be at least 2 (a whole number from 2 to 8): “1” is too few, so one pump is searched.", undefined],
      [{ arrangement: "parallel", pumps: "9" }, "Duty pumps must be at most 8 (a whole number from 2 to 8): “9” is too many, so one pump is searched.", undefined],
      [{ arrangement: "series", pumps: "2.5" }, "Duty pumps must be a whole number from 2 to 8, written in digits: “2.5” is not, so one pump is searched.", undefined],
      [{ arrangement: "parallel", pumps: "2", standby: "3" }, "Standby pumps (at most the duty pumps) must be at most 2 (a whole number from 0 to 2): “3” is too many, so no standby pump is counted.", { arrangement: "parallel", dutyPumps: 2, standbyPumps: 0 }],
      [{ arrangement: "parallel", pumps: "2", standby: "-1" }, "Standby pumps (at most the duty pumps) must be a whole number from 0 to 2, written in digits: “-1” is not, so no standby pump is counted.", { arrangement: "parallel", dutyPumps: 2, standbyPumps: 0 }],
      [{ arrangement: "series", pumps: "3", standby: "1" }, "Standby pumps “1” are counted with pumps in parallel only, so 3 duty pumps in series are searched without standby.", { arrangement: "series", dutyPumps: 3, standbyPumps: 0 }],
      [{ arrangement: "single", standby: "2" }, "Standby pumps “2” are counted with pumps in parallel only, so one pump is searched.", undefined],
    ];
    for (const [q, note, filter] of cases) {
      const r = page(q);
      expect(r.notes, JSON.stringify(q)).toEqual([note]); // old code: [] (no arrangement read)
      expect(r.filters.arrangement, JSON.stringify(q)).toEqual(filter);
    }
  });
});

describe("the read API's reading: an odd or unused value is a problem naming its parameter", () => {
  test("problems by field", () => {
    const fields = (q: Record<string, string>) => readArrangement(q, { api: true }).problems.map((p) => p.field);
    expect(fields({ pumps: "2" })).toEqual(["pumps"]); // a count without an arrangement of several pumps
    expect(fields({ arrangement: "single", standby: "0" })).toEqual(["standby"]);
    expect(fields({ arrangement: "series", standby: "0" })).toEqual(["standby"]); // standby pumps: parallel only
    expect(fields({ arrangement: "Parallel" })).toEqual(["arrangement"]);
    expect(fields({ arrangement: "parallel", pumps: "0x2" })).toEqual(["pumps"]);
    expect(fields({ arrangement: "parallel", pumps: "2", standby: "0" })).toEqual([]);
    expect(readArrangement({ pumps: "2" }, { api: true }).problems[0].rule).toBe('"pumps" is read with arrangement=parallel or arrangement=series only');
  });
});

describe("one pump's share of the duty, the verdict's key and adjustment", () => {
  const duty = { flow: 0.09, head: 36 };
  test("flow / N in parallel, head / N in series, the duty itself for one pump (common practice)", () => {
    expect(dutyShare(duty, { arrangement: "parallel", dutyPumps: 3, standbyPumps: 1 })).toEqual({ flow: 0.03, head: 36 });
    expect(dutyShare(duty, { arrangement: "series", dutyPumps: 2, standbyPumps: 0 })).toEqual({ flow: 0.09, head: 18 });
    expect(dutyShare(duty, undefined)).toEqual(duty);
    expect(arrangementRule(duty, undefined)).toBeNull();
    expect(arrangementRule(duty, { arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 })).toMatch(/^Searched for 2 duty pumps in parallel \+ 1 standby: each pump is ranked at its share of the duty, ⟦flow\|0\.045⟧ \(the duty flow ⟦flow\|0\.09⟧ \/ 2\) at ⟦head\|36⟧ — the ranking's approximation \(common practice/);
  });
  test("each arrangement its own kept verdict and its own adjustment; one pump as before", () => {
    const keys = [undefined, { arrangement: "parallel", dutyPumps: 2, standbyPumps: 0 }, { arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 }, { arrangement: "series", dutyPumps: 2, standbyPumps: 0 }, { arrangement: "parallel", dutyPumps: 3, standbyPumps: 0 }] as const;
    expect(new Set(keys.map((k) => arrangementKey(k))).size).toBe(keys.length);
    expect(arrangementKey(undefined)).toBe(""); // one pump: the key as it was
    expect(arrangementAdjustment("speed", undefined)).toEqual({ ...DEFAULT_ADJUSTMENT, method: "speed" });
    expect(arrangementAdjustment("trim", { arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 })).toEqual({ ...DEFAULT_ADJUSTMENT, method: "trim", arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 });
  });
});

describe("a ticked row's value carries its arrangement (PicksSchema)", () => {
  test("read back as the row's arrangement; without it, one pump", () => {
    const a = { arrangement: "parallel", dutyPumps: 2, standbyPumps: 1 } as const;
    expect(v.parse(PicksSchema, [`12:speed${pickSuffix(a)}`, "13:direct"])).toEqual([
      { curveSetId: 12, method: "speed", arrangement: a },
      { curveSetId: 13, method: "none", arrangement: SINGLE_PUMP },
    ]);
    expect(pickSuffix(undefined)).toBe("");
  });
  test("an arrangement outside the rules is refused, with the rule", () => {
    for (const bad of ["12:speed:parallel:9:0", "12:speed:parallel:1:0", "12:speed:parallel:2:3", "12:speed:series:2:1", "12:speed:ring:2:0", "12:speed:parallel:2"]) {
      const r = v.safeParse(PicksSchema, [bad]);
      expect(r.success, bad).toBe(false);
    }
    expect(v.safeParse(PicksSchema, ["12:speed:parallel:9:0"]).issues?.[0].message).toBe("A ticked pump's arrangement is parallel or series, 2 to 8 duty pumps and 0 to the duty pumps on standby (in parallel only).");
  });
});
