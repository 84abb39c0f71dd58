// The NPSH margin ratio NPSHa / NPSHr as every surface gives it: none where NPSHa ≤ 0. There the ratio means nothing
// (zero or negative) and NPSHa, given beside it, decides: a cavitation risk whatever the pump (common practice; decision
// "npshtruth"). The evaluation computes no such ratio now (engine `npshMarginRatio`); a selection frozen before it holds
// the negative ratios then computed, and every reader of a stored result (systems API, selection CSV and JSON) passes it
// through here. A ratio just above zero reads "< 0.01" (`marginRatioText`). Pure.
import { npshRatioText } from "~/engine/npshRatio";

/** Below this an NPSH margin ratio above zero reads "< 0.01" (dimensionless): at the ratios' two decimals it would read 0.00, the NPSHa-at-zero case. */
export const RATIO_SHOWN_FLOOR = 0.01;

/**
 * An NPSH margin ratio NPSHa / NPSHr as every surface writes it: two decimals, with more while it would read as 1 or the
 * wanted ratio it is judged against ("1.0996", not "1.10"); above zero and below 0.01, "< 0.01" — never an exponent
 * ("4.44e-16") nor "0.00": the status beside it (cavitation risk) and NPSHa and NPSHr on their own decide, the ratio's
 * digits there say nothing more (decision "searchnpsh").
 * @param ratio NPSHa / NPSHr (dimensionless; null or absent: "—")
 * @param requiredMargin the wanted ratio (dimensionless; absent in selections frozen before it was kept: then only 1)
 */
export function marginRatioText(ratio: number | null | undefined, requiredMargin: number | null | undefined): string {
  if (ratio != null && ratio > 0 && ratio < RATIO_SHOWN_FLOOR) return `< ${RATIO_SHOWN_FLOOR}`;
  return npshRatioText(ratio, requiredMargin);
}

/**
 * A ratio as shown: null where NPSHa is at or below zero, else the ratio as given.
 * @param ratio NPSHa / NPSHr (dimensionless), null or absent where none
 * @param available NPSHa at the same point, m (null or absent: not known, the ratio kept)
 */
export const ratioShown = (ratio: number | null | undefined, available: number | null | undefined): number | null =>
  available != null && available <= 0 ? null : (ratio ?? null);

type RatioCarrier = {
  figures?: { npshMarginRatio?: number | null; npshAvailable?: number | null } | null;
  band?: { npshMarginRatio?: number | null; npshAvailable?: number | null }[] | null;
  npsh?: { judgedAt?: { marginRatio: number | null; available: number | null }[] | null } | null;
};

/**
 * A candidate's result (live or frozen) with no ratio where NPSHa ≤ 0: the figures at the operating point, the band's
 * edges and the points NPSH was judged at; everything else as given.
 * @param r the result (SI)
 */
export function resultRatiosShown<T extends RatioCarrier>(r: T): T {
  return {
    ...r,
    ...(r.figures ? { figures: { ...r.figures, npshMarginRatio: ratioShown(r.figures.npshMarginRatio, r.figures.npshAvailable) } } : {}),
    ...(r.band ? { band: r.band.map((b) => ({ ...b, npshMarginRatio: ratioShown(b.npshMarginRatio, b.npshAvailable) })) } : {}),
    ...(r.npsh?.judgedAt ? { npsh: { ...r.npsh, judgedAt: r.npsh.judgedAt.map((p) => ({ ...p, marginRatio: ratioShown(p.marginRatio, p.available) })) } } : {}),
  };
}
