// When the search's list counts as cut, and which filter says so (search-fill.ts, pure). Check values: our product rules
// (SEARCH_EVALUATED places, SEARCH_FILL_JUDGED judged at most); the counts are invented.
import { describe, expect, test } from "vitest";
import { catalogueFilterOutcome, listCut, powerFilterOutcome, SEARCH_EVALUATED, SEARCH_FILL_JUDGED, type FillCount } from "./search-fill";

const count = (c: Partial<FillCount>): FillCount => ({ judged: SEARCH_FILL_JUDGED, kept: 10, groups: 500, returned: 640, matched: 900, ...c });

describe("listCut", () => {
  test("places filled: never cut", () => expect(listCut(count({ kept: SEARCH_EVALUATED }))).toBe(false));
  test("places not filled, ranked curves left unjudged at the cap: cut", () => expect(listCut(count({}))).toBe(true));
  test("places not filled, the ranking judged to its end and the engine returned all it matched: not cut (nothing more passes)", () =>
    expect(listCut(count({ judged: 120, groups: 120, returned: 130, matched: 130 }))).toBe(false));
  test("places not filled, the ranking judged to its end but the engine matched more than it returned: cut", () =>
    expect(listCut(count({ judged: 120, groups: 120, returned: 130, matched: 131 }))).toBe(true));
});

describe("each filter says the cut only where it left rows out", () => {
  test("power: cut with rows above the limit; a cut caused by hidden outside-catalogue rows alone is not the power filter's", () => {
    expect(powerFilterOutcome(1100, count({}), 5)).toEqual({ limit: 1100, judged: SEARCH_FILL_JUDGED, atMost: SEARCH_FILL_JUDGED, overPower: 5, cut: true });
    expect(powerFilterOutcome(1100, count({}), 0).cut).toBe(false);
  });
  test("catalogue: cut with its numbers in words; none hidden, nothing said", () => {
    const o = catalogueFilterOutcome(count({ kept: 16 }), 304);
    expect(o).toMatchObject({ judged: SEARCH_FILL_JUDGED, atMost: SEARCH_FILL_JUDGED, kept: 16, places: SEARCH_EVALUATED, outsideCatalogue: 304, cut: true });
    expect(o.message).toBe(`list cut: a pump whose verdict is "outside the catalogue" (a trim or speed the model does not publish) is hidden and fills none of the ${SEARCH_EVALUATED} places, so the search judged the ranked pumps in turn and stopped after ${SEARCH_FILL_JUDGED} (${SEARCH_FILL_JUDGED} at most), 304 of them outside the catalogue, with 16 of the places filled; pumps further down the ranking that would pass are not shown`);
    expect(catalogueFilterOutcome(count({}), 0)).toMatchObject({ cut: false, message: null });
    expect(catalogueFilterOutcome(count({ kept: SEARCH_EVALUATED }), 40)).toMatchObject({ cut: false, message: null });
  });
});
