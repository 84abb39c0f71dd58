// How the search fills its places (pure). Two filters act on a row only after its verdict is judged: the max shaft power
// (on the power at the operating point the verdict judged) and the outside-catalogue verdict (hidden unless asked for). A
// row they leave out takes no place: the search judges on down the ranking until SEARCH_EVALUATED rows are kept, the
// ranking ends or SEARCH_FILL_JUDGED are judged, and says when the list was cut, why and with its numbers.

/** Rows kept at most: the places of the list (the engine ranks; the verdict and the filters after it decide). */
export const SEARCH_EVALUATED = 80;
/**
 * Pumps judged at most to fill the SEARCH_EVALUATED places when rows are left out after judging (above the max shaft
 * power, or outside the catalogue and hidden): a tight power limit or a ranking led by pumps outside the catalogue leaves
 * out many of the best-ranked pumps; the search goes on down the ranking until the places are filled, the ranking ends or
 * this many are judged (then the page and the API say the list was cut).
 */
export const SEARCH_FILL_JUDGED = SEARCH_EVALUATED * 4;
/** The max shaft power filter's cap: the same as every filter's (SEARCH_FILL_JUDGED), under its first name. */
export const SEARCH_POWER_JUDGED = SEARCH_FILL_JUDGED;

/** How one judging pass ended: pumps judged, rows kept, distinct curves ranked, and what the engine returned of what it matched. */
export type FillCount = { judged: number; kept: number; groups: number; returned: number; matched: number };

/**
 * Cut: the places were not all filled, yet pumps that may pass were left unjudged — the judging stopped at
 * SEARCH_FILL_JUDGED with curves still ranked, or the engine matched more sets than it returned (its `limit`).
 */
export function listCut(c: FillCount): boolean {
  const filled = c.kept >= SEARCH_EVALUATED;
  const more = c.judged < c.groups || c.matched > c.returned;
  return !filled && more;
}

/** What the max shaft power filter did: the limit (W), pumps judged (of `atMost`) and left out above it, and whether the list was cut with some left out. */
export type PowerFilterOutcome = { limit: number; judged: number; atMost: number; overPower: number; cut: boolean };

export function powerFilterOutcome(limit: number, c: FillCount, overPower: number): PowerFilterOutcome {
  return { limit, judged: c.judged, atMost: SEARCH_FILL_JUDGED, overPower, cut: overPower > 0 && listCut(c) };
}

/**
 * What hiding the pumps outside the catalogue did: pumps judged (of `atMost`), rows kept for the `places`, pumps hidden
 * as outside the catalogue, whether the list was cut with some hidden, and then a sentence with those numbers (else null).
 */
export type CatalogueFilterOutcome = { judged: number; atMost: number; kept: number; places: number; outsideCatalogue: number; cut: boolean; message: string | null };

export function catalogueFilterOutcome(c: FillCount, outsideCatalogue: number): CatalogueFilterOutcome {
  const cut = outsideCatalogue > 0 && listCut(c);
  const message = cut
    ? `list cut: a pump whose verdict is "outside the catalogue" (a trim or speed the model does not publish) is hidden and fills none of the ${SEARCH_EVALUATED} places, so the search judged the ranked pumps in turn and stopped after ${c.judged} (${SEARCH_FILL_JUDGED} at most), ${outsideCatalogue} of them outside the catalogue, with ${c.kept} of the places filled; pumps further down the ranking that would pass are not shown`
    : null;
  return { judged: c.judged, atMost: SEARCH_FILL_JUDGED, kept: c.kept, places: SEARCH_EVALUATED, outsideCatalogue, cut, message };
}
