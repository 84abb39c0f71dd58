/**
 * Fields, units and SI factors, and reading them from header text.
 * Pure: no Node or DOM APIs.
 *
 * SI targets: flow m³/s, head m, NPSHr m, impeller diameter m, efficiency fraction 0..1,
 * power W, speed rpm (kept in rpm: the affinity laws only need ratios).
 *
 * Factors are exact by definition (NIST SP 811, Appendix B):
 *   1 ft = 0.3048 m; 1 in = 0.0254 m; 1 US gal = 3.785411784 L (so 1 gpm = 6.30901964e-5 m³/s);
 *   1 UK (imperial) gal = 4.54609 L; 1 lbf = 4.4482216152605 N;
 *   1 hp (550 ft·lbf/s) = 550 × 0.3048 × 4.4482216152605 W = 745.69987158227022 W (SP 811 lists 7.456 999 E+02).
 */

export const NUMERIC_FIELDS = ["speed", "impeller", "flow", "head", "efficiency", "power", "npshr"] as const;
export const TEXT_FIELDS = ["model", "type", "size", "notes"] as const;
export const FIELDS = ["model", "speed", "impeller", "flow", "head", "efficiency", "power", "npshr", "type", "size", "notes", "ignore"] as const;

export type NumericField = (typeof NUMERIC_FIELDS)[number];
export type TextField = (typeof TEXT_FIELDS)[number];
export type Field = (typeof FIELDS)[number];

export const FLOW_UNITS = ["m3/h", "m3/s", "l/s", "l/min", "gpm", "imp gpm"] as const;
export const LENGTH_UNITS = ["m", "ft"] as const;
export const DIAMETER_UNITS = ["mm", "in", "m"] as const;
export const EFFICIENCY_UNITS = ["%", "fraction"] as const;
export const POWER_UNITS = ["kW", "W", "hp"] as const;
export const SPEED_UNITS = ["rpm"] as const;

export type FlowUnit = (typeof FLOW_UNITS)[number];
export type LengthUnit = (typeof LENGTH_UNITS)[number];
export type DiameterUnit = (typeof DIAMETER_UNITS)[number];
export type EfficiencyUnit = (typeof EFFICIENCY_UNITS)[number];
export type PowerUnit = (typeof POWER_UNITS)[number];
export type SpeedUnit = (typeof SPEED_UNITS)[number];
export type Unit = FlowUnit | LengthUnit | DiameterUnit | EfficiencyUnit | PowerUnit | SpeedUnit;

export const UNITS_BY_FIELD: Record<NumericField, readonly Unit[]> = {
  speed: SPEED_UNITS,
  impeller: DIAMETER_UNITS,
  flow: FLOW_UNITS,
  head: LENGTH_UNITS,
  efficiency: EFFICIENCY_UNITS,
  power: POWER_UNITS,
  npshr: LENGTH_UNITS,
};

/** Unit assumed when a header carries none (efficiency is decided from the data instead, see mapping.ts). */
export const DEFAULT_UNIT: Record<NumericField, Unit> = {
  speed: "rpm",
  impeller: "mm",
  flow: "m3/h",
  head: "m",
  efficiency: "%",
  power: "kW",
  npshr: "m",
};

export const FT = 0.3048;
export const INCH = 0.0254;
export const US_GALLON = 3.785411784e-3; // m³
export const UK_GALLON = 4.54609e-3; // m³
export const LBF = 4.4482216152605; // N
export const HP = 550 * FT * LBF; // W, 745.69987158227022

/** Multiply a value in `unit` by this to get SI (see file header for targets). */
export const SI_FACTOR: Record<NumericField, Partial<Record<Unit, number>>> = {
  flow: { "m3/h": 1 / 3600, "m3/s": 1, "l/s": 1e-3, "l/min": 1e-3 / 60, gpm: US_GALLON / 60, "imp gpm": UK_GALLON / 60 },
  head: { m: 1, ft: FT },
  npshr: { m: 1, ft: FT },
  impeller: { mm: 1e-3, in: INCH, m: 1 },
  efficiency: { "%": 0.01, fraction: 1 },
  power: { kW: 1000, W: 1, hp: HP },
  speed: { rpm: 1 },
};

export function unitAllowed(field: Field, unit: string | null | undefined): boolean {
  if (field === "ignore" || (TEXT_FIELDS as readonly string[]).includes(field)) return unit == null;
  return unit != null && (UNITS_BY_FIELD[field as NumericField] as readonly string[]).includes(unit);
}

export function toSI(field: NumericField, unit: Unit, value: number): number {
  const f = SI_FACTOR[field][unit];
  if (f === undefined) throw new Error(`unit ${unit} does not fit ${field}`);
  return value * f;
}

/** Lower-case, fold superscripts (m³ → m3), unify brackets and spacing. */
export function normaliseHeader(header: string): string {
  return header
    .normalize("NFKC")
    .toLowerCase()
    .replace(/[\u2011-\u2015\u2212]/g, "-") // dashes and minus signs
    .replace(/\^/g, "")
    .replace(/[[\]{}()]/g, " ")
    .replace(/[_]+/g, " ")
    .replace(/\s+/g, " ")
    .trim();
}

// ---------- block qualifiers (wide layout) ----------

export interface BlockQualifier {
  speed?: number;
  impeller?: number;
  impellerUnit?: DiameterUnit;
}

const SPEED_WORD = "(?:rpm|1/min|min-1|min⁻¹|r/min)";

/**
 * Find a per-curve qualifier written in a header, e.g. "Head 250mm", "H@2900", "Q @ 1450 rpm",
 * "Head Ø230", "H (n=2900)". Returns the qualifier and the header with it removed.
 * A bare number after "@" is read as a speed when ≥ 600, else as a diameter in mm
 * (impeller diameters are rarely above 600 mm; pump speeds rarely below 600 rpm).
 */
export function extractQualifier(norm: string): { qualifier: BlockQualifier | null; rest: string } {
  const q: BlockQualifier = {};
  let rest = norm;
  const take = (re: RegExp, apply: (m: RegExpMatchArray) => boolean) => {
    const m = rest.match(re);
    if (m && apply(m)) rest = (rest.slice(0, m.index) + " " + rest.slice(m.index! + m[0].length)).replace(/\s+/g, " ").trim();
  };
  const num = (s: string) => Number(s.replace(",", "."));
  // "@ 2900", "@2900 rpm", "@250mm", "@ 9.5 in"
  take(new RegExp(`@\\s*(\\d+(?:[.,]\\d+)?)\\s*(${SPEED_WORD}|mm|in\\b|"|m\\b)?`), (m) => {
    const value = num(m[1]);
    const unit = m[2];
    if (unit === "mm" || unit === "in" || unit === '"' || unit === "m") {
      q.impeller = value;
      q.impellerUnit = unit === '"' ? "in" : (unit as DiameterUnit);
    } else if (unit || value >= 600) q.speed = value;
    else {
      q.impeller = value;
      q.impellerUnit = "mm";
    }
    return true;
  });
  if (q.speed === undefined) {
    take(new RegExp(`(?:\\bn\\s*=\\s*)(\\d{3,5})(?:\\s*${SPEED_WORD})?|(\\d{3,5})\\s*${SPEED_WORD}`), (m) => {
      q.speed = Number(m[1] ?? m[2]);
      return true;
    });
  }
  if (q.impeller === undefined) {
    take(/(?:ø|⌀|\bd\s*=\s*)\s*(\d+(?:[.,]\d+)?)\s*(mm|in\b|")?|(\d+(?:[.,]\d+)?)\s*(mm|in\b|")/, (m) => {
      const value = num(m[1] ?? m[3]);
      const unit = m[2] ?? m[4] ?? "mm";
      q.impeller = value;
      q.impellerUnit = unit === '"' ? "in" : (unit as DiameterUnit);
      return true;
    });
  }
  return { qualifier: q.speed !== undefined || q.impeller !== undefined ? q : null, rest };
}

// ---------- field and unit from header text ----------

const FIELD_RULES: Array<[Exclude<Field, "ignore">, RegExp]> = [
  ["npshr", /npsh/],
  ["efficiency", /\beff|efficiency|\beta\b|η|wirkungsgrad|rendement/],
  ["power", /power|\bp[12]\b|\bbhp\b|\bkw\b|\bhp\b|^p\b|\bpwr\b|leistung|puissance/],
  ["speed", /speed|\brpm\b|^n\b|1\/min|min-1|min⁻¹|drehzahl|vitesse/],
  ["impeller", /impeller|diam|\bdia\b|\btrim\b|laufrad|ø|⌀|^d2?\b/],
  ["flow", /flow|^q\b|\bq\b|capacity|\bvolume|förderstrom|durchfluss|débit|\bgpm\b|m3\/|l\/s|l\/min|\blps\b|\blpm\b|\bcmh\b/],
  ["head", /head|^h\b|\bh\b|\btdh\b|\blift\b|förderhöhe|hauteur/],
  ["type", /\btype\b|\bcategory\b|bauart/],
  ["size", /\bsize\b|\bdn\b|connection|flange/],
  ["notes", /note|comment|remark/],
  ["model", /model|\bpump\b|\bname\b|series|product|article|\bitem\b|baureihe|modell/],
];

export function detectField(norm: string): Field {
  for (const [field, re] of FIELD_RULES) if (re.test(norm)) return field;
  return "ignore";
}

/** Unit written in the (normalised, qualifier-free) header for this field, or null when none is written. */
export function detectUnit(field: Field, norm: string): Unit | null {
  switch (field) {
    case "flow":
      if (/m3\s*\/\s*s(ec)?\b/.test(norm)) return "m3/s";
      if (/m3\s*\/\s*h|\bcmh\b|\bm3h\b/.test(norm)) return "m3/h";
      if (/\bimp(erial)?\.?\s*gpm|\bigpm\b|\buk\s*gpm/.test(norm)) return "imp gpm";
      if (/gpm\b|gal\s*\/\s*min/.test(norm)) return "gpm";
      if (/\bl\s*\/\s*s(ec)?\b|\blps\b/.test(norm)) return "l/s";
      if (/\bl\s*\/\s*min\b|\blpm\b/.test(norm)) return "l/min";
      return null;
    case "head":
    case "npshr":
      if (/\bft\b|\bfeet\b|\bfoot\b|'/.test(norm)) return "ft";
      if (/\bm\b|\bmeters?\b|\bmetres?\b|\bmwc\b|\bmlc\b/.test(norm)) return "m";
      return null;
    case "impeller":
      if (/\bmm\b/.test(norm)) return "mm";
      if (/\bin\b\.?|\binch(es)?\b|"/.test(norm)) return "in";
      if (/\bm\b/.test(norm)) return "m";
      return null;
    case "efficiency":
      if (/%|percent|\bpct\b/.test(norm)) return "%";
      if (/fraction|^[^a-z0-9]*-[^a-z0-9]*$|\s-\s*$|p\.u\.|0\.\.1/.test(norm)) return "fraction";
      return null;
    case "power":
      if (/\bkw\b/.test(norm)) return "kW";
      if (/\bb?hp\b/.test(norm)) return "hp";
      if (/\bw\b|\bwatts?\b/.test(norm)) return "W";
      return null;
    case "speed":
      return "rpm";
    default:
      return null;
  }
}

export interface HeaderGuess {
  field: Field;
  unit: Unit | null;
  /** true when the unit was read from the header text; false when it is a default or left to the data. */
  unitFromHeader: boolean;
  qualifier: BlockQualifier | null;
}

/** Guess field, unit and wide-layout qualifier from one header cell. */
export function guessHeader(header: string): HeaderGuess {
  const norm = normaliseHeader(header);
  const { qualifier, rest } = extractQualifier(norm);
  let field = detectField(rest);
  // "Head 250mm" and "Q@2900" are points of one curve; a qualifier on a speed/impeller column would be odd, drop it.
  const q = field === "flow" || field === "head" || field === "efficiency" || field === "power" || field === "npshr" ? qualifier : null;
  const base = q ? rest : norm;
  if (!q) field = detectField(norm);
  if (field === "ignore" || (TEXT_FIELDS as readonly string[]).includes(field)) {
    return { field, unit: null, unitFromHeader: false, qualifier: null };
  }
  const nf = field as NumericField;
  const unit = detectUnit(nf, base);
  return { field, unit: unit ?? DEFAULT_UNIT[nf], unitFromHeader: unit !== null, qualifier: q };
}
