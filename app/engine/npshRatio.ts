// An NPSH margin ratio NPSHa / NPSHr at its thresholds (1 and the wanted ratio): the one comparison and the one way it is
// written. Display and judging helpers, not part of the engine's public face (index.ts): import this file by path.
import { fmtNumExact, LIMIT_ROUNDING } from "./quantityText.ts";

/**
 * Whether an NPSH margin ratio NPSHa / NPSHr is below a threshold (1, or the wanted ratio): below it by more than the
 * app's one allowance at a judged limit, 1 part in 10⁸ of it (limitText.ts `LIMIT_ROUNDING`); within it the ratio is at
 * the threshold (decision "npshzero", the ratio's edge). A ratio the division makes a rounding error short of the rule
 * (NPSHa 3.3 m / NPSHr 3 m = 1.0999999999999999 against the wanted 1.1) was judged a low margin and read "1.10000000 is
 * below the required 1.1"; further out than the allowance it prints apart at 9 significant digits ("1.09999998").
 * The one comparison of the status (figures.ts `npshStatus`), the search's NPSH cut and score (search.ts) and its words (searchExplain.ts).
 * @param ratio NPSHa / NPSHr (dimensionless, finite)
 * @param threshold 1 or the wanted ratio (dimensionless, > 0)
 */
export function npshRatioBelow(ratio: number, threshold: number): boolean {
  return ratio < threshold * (1 - LIMIT_ROUNDING);
}

/**
 * An NPSH margin ratio as written beside its thresholds (1 and the wanted ratio): two decimals, more while it would read
 * as one of them though judged apart from it ({@link npshRatioBelow}); a ratio within 1 part in 10⁸ of a threshold is
 * judged at it and reads as it ("1.10", not "1.10000000" for 3.3 m / 3 m). Every surface's ratio goes through this
 * (lib/projects/npsh-ratio.ts `marginRatioText`, the search's words, the staged steps). "—" without a ratio.
 * @param ratio NPSHa / NPSHr (dimensionless), null or absent where none
 * @param requiredMargin the wanted ratio (dimensionless; null or absent: 1 alone)
 */
export function npshRatioText(ratio: number | null | undefined, requiredMargin?: number | null): string {
  const thresholds = requiredMargin != null && Number.isFinite(requiredMargin) ? [1, requiredMargin] : [1];
  const at = ratio == null || !Number.isFinite(ratio) ? undefined : thresholds.find((t) => Math.abs(ratio - t) <= t * LIMIT_ROUNDING);
  return fmtNumExact(at ?? ratio, thresholds, 2);
}
