/**
 * Unit words a header may carry that the importer does not read for the column's field: a pressure
 * for head, a mass flow or cubic feet for flow, metric horsepower for power, Hz or % for speed...
 * Such a header must never fall back to the field's default unit: it becomes a mapping error that
 * names the header, the word found and the units the field takes (units-in-headers.ts builds it).
 * Also the gallon markers: "gpm" is the US gallon (NIST SP 811) unless the header says imperial.
 * Pure: no Node or DOM APIs. Patterns run on the normalised, lower-case header (normaliseHeader).
 */
import type { NumericField } from "./units-in-headers";

/** A pattern as one whole token: not glued to a letter or digit on either side ("in" but not "inlet"). */
export function tok(src: string): RegExp {
  return new RegExp(`(?<![\\p{L}\\p{N}])(?:${src})(?![\\p{L}\\p{N}])`, "u");
}

// ---------- gallons per minute ----------

/** Gallons per minute in any spelling: gpm, USgpm, Igpm, gal/min, gal (imp)/min, gallons per minute. */
export const GALLONS_PER_MINUTE = /gpm|gal(?:lons?)?\.?\s*(?:(?:us|u\.s\.|imp\.?|imperial|uk|brit\.?)\s*)?(?:\/|per)\s*min/;
/** Imperial (UK) gallon, in any word order: "Imp. gpm", "Flow GPM (Imp)", "gpm (UK)", "Igpm". */
export const IMPERIAL_MARK = tok("imp\\.?|imperial|uk|brit\\.?|british|igpm|ukgpm|impgpm");
/** US gallon, said outright: "US gpm", "USgpm", "U.S. gal/min". */
export const US_MARK = tok("us|u\\.s\\.?|usg|usgpm");

// ---------- refused words ----------

export interface RefusedWord {
  /** Lower-case as found in the normalised header (the caller finds the original spelling). */
  word: string;
  /** Why the importer cannot simply convert it, when there is more to say than "not a unit it reads". */
  why: string | null;
}

interface Rule {
  re: RegExp;
  why: string | null;
}

const PRESSURE_WHY =
  "a pressure becomes a head only with the liquid's density (H = Δp / (ρ·g)), which the file does not give";
const MASS_WHY = "a mass flow becomes a volume flow only with the liquid's density, which the file does not give";
const HZ_WHY =
  "a supply frequency is not a shaft speed: n = 120·f / p rpm for a motor of p poles, less slip (50 Hz on 2 poles is 3000 rpm before slip), and the file gives neither";
const PERCENT_SPEED_WHY = "a speed in % of a rated speed needs that rated speed, which the file does not give";

const PRESSURE: Rule = { re: tok("k?pa|mpa|hpa|m?bar[ag]?|psi[gad]?|kgf?\\s*/\\s*cm2|kp\\s*/\\s*cm2|atm|mm\\s*hg|in\\.?\\s*hg|torr"), why: PRESSURE_WHY };
const OTHER_LENGTH: Rule = { re: tok("mm|cm|dm|km|in\\.?|inch(?:es)?|inwc|inh2o|yds?|yards?|fu(?:ß|ss)|füße|fuesse|pieds?|pies|zoll"), why: null };

/** A curve's speed written as a frequency or a share of rated speed next to a point column: "H@50Hz", "Q 60 Hz", "H@90%". */
const FREQUENCY_QUALIFIER: Rule = { re: /\d+(?:[.,]\d+)?\s*(?:hz|hertz)(?![a-z])/, why: HZ_WHY };
const PERCENT_QUALIFIER: Rule = { re: /\d+(?:[.,]\d+)?\s*%/, why: PERCENT_SPEED_WHY };

/** Checked before the field's own units (a word that also holds one of them, or a marker that changes its meaning). */
const BEFORE: Partial<Record<NumericField, Rule[]>> = {
  flow: [FREQUENCY_QUALIFIER, PERCENT_QUALIFIER],
  // "Min flow % BEP": a share of a flow the file need not give (a figure per curve, in a flow unit, is what the importer reads).
  minflow: [FREQUENCY_QUALIFIER, { re: /%|\bpercent\b|\bpct\b/, why: "a minimum flow in % of the BEP flow needs that BEP flow: write the maker's figure as a flow" }],
  head: [FREQUENCY_QUALIFIER, PERCENT_QUALIFIER],
  npshr: [FREQUENCY_QUALIFIER], // not "%": "NPSH 3%" is the NPSHr at a 3 % head drop
  efficiency: [FREQUENCY_QUALIFIER],
  power: [
    FREQUENCY_QUALIFIER,
    PERCENT_QUALIFIER,
    {
      re: tok("metric\\s*hp|hp\\s*metric|hp\\s*\\(?metric\\)?|mhp"),
      why: "metric horsepower is 735.49875 W (75 kgf·m/s), not the 745.69987 W of the hp the importer reads",
    },
  ],
};

/** Flow units the importer does not read: a mass flow, or a volume flow in units it has no factor for. */
const OTHER_FLOW: Rule[] = [
  { re: tok("kg\\s*/\\s*(?:s|sec|min|h|hr)|t\\s*/\\s*h|tph|tonnes?\\s*/\\s*h|lbs?\\s*/\\s*(?:s|sec|min|h|hr)"), why: MASS_WHY },
  {
    re: tok(
      "cfm|cfs|cfh|ft3\\s*/\\s*(?:s|sec|min|h|hr)|cu\\.?\\s*ft|gph|gpd|mgd|gal(?:lons?)?\\.?\\s*(?:/|per)\\s*(?:s|sec|h|hr|d|day)|bbl\\s*/\\s*(?:d|day|h|hr)|bpd|bph|ml\\s*/\\s*(?:s|sec|min|h|hr)|l\\s*/\\s*d(?:ay)?|m3\\s*/\\s*(?:week|month|a|y|yr)",
    ),
    why: null,
  },
];

/** Checked when the header names none of the field's own units. */
const AFTER: Record<NumericField, Rule[]> = {
  head: [PRESSURE, OTHER_LENGTH],
  npshr: [PRESSURE, OTHER_LENGTH],
  flow: OTHER_FLOW,
  minflow: OTHER_FLOW,
  power: [
    { re: tok("ps|cv|ch"), why: "metric horsepower (PS, CV, ch) is 735.49875 W (75 kgf·m/s), not the 745.69987 W of the hp the importer reads" },
    { re: tok("kva|va"), why: "an apparent electrical power is not the pump's shaft power" },
    { re: tok("mw|gw|btu\\s*/\\s*h(?:r)?|kcal\\s*/\\s*h|ft\\.?\\s*lbf?\\s*/\\s*s"), why: null },
  ],
  speed: [
    { re: tok("hz|hertz"), why: HZ_WHY },
    { re: /%|\bpercent\b|\bpct\b/, why: PERCENT_SPEED_WHY },
    { re: tok("rad\\s*/\\s*s|rps|r\\s*/\\s*s|rev\\s*/\\s*s|1\\s*/\\s*s|s-1"), why: null },
  ],
  impeller: [{ re: tok("cm|dm|ft|feet|foot|zoll"), why: null }],
  efficiency: [],
};

function first(rules: Rule[] | undefined, norm: string): RefusedWord | null {
  for (const r of rules ?? []) {
    const m = norm.match(r.re);
    if (m) return { word: m[0].trim(), why: r.why };
  }
  return null;
}

/** A refused word that overrides any unit the header also names (checked first). */
export function refusedBefore(field: NumericField, norm: string): RefusedWord | null {
  if ((field === "flow" || field === "minflow") && GALLONS_PER_MINUTE.test(norm)) {
    const imp = norm.match(IMPERIAL_MARK);
    const us = norm.match(US_MARK);
    if (imp && us)
      return {
        word: `${us[0]} … ${imp[0]}`,
        why: "the header names both the US gallon (3.785411784 L, NIST SP 811) and the imperial gallon (4.54609 L, Weights and Measures Act 1985), which is 20.1 % larger",
      };
  }
  return first(BEFORE[field], norm);
}

/** A refused word in a header that names none of the field's own units. */
export function refusedAfter(field: NumericField, norm: string): RefusedWord | null {
  return first(AFTER[field], norm);
}

/**
 * The mapping page's note beside a column read in US gpm from a header that names neither gallon ("gpm", "gal/min"): the
 * US gallon is assumed (NIST SP 811), and the imperial gallon (Weights and Measures Act 1985) is 20.1 % larger. Null when
 * the header says which gallon, when the unit is not US gpm, or when the user chose it.
 */
export function gallonAssumedNote(header: string, unit: string | null, unitSource: string | undefined): string | null {
  const norm = header.normalize("NFKC").toLowerCase().replace(/[[\]{}()_]/g, " "); // as normaliseHeader, for these words
  if (unit !== "gpm" || unitSource === "user" || !GALLONS_PER_MINUTE.test(norm) || US_MARK.test(norm) || IMPERIAL_MARK.test(norm)) return null;
  return "US gallon assumed (3.785411784 L); if the file's gallons are imperial (4.54609 L, 20.1 % larger), choose imp gpm";
}
