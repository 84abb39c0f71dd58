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
 * The UK gallon is defined as 4.54609 L exactly by the Weights and Measures Act 1985 (SP 811 lists 4.546 09 E-03 m³).
 * Metric flow units are exact by the SI's own definitions: 1 L = 1e-3 m³, 1 min = 60 s, 1 h = 3600 s, 1 d = 86 400 s.
 *
 * A unit word the field does not take (head in kPa, flow in kg/s, power in PS, speed in Hz) is never
 * replaced by the default: guessHeader reports it (unit-words.ts holds the words) and checkMapping
 * makes it a mapping error until the user chooses the column's unit.
 */
import { refusedAfter, refusedBefore, tok, GALLONS_PER_MINUTE, IMPERIAL_MARK, type RefusedWord } from "./unit-words";
import { ELECTRICAL_POWER_WORD, inputPowerKind, namesInputPower, namesRatedPower } from "./input-power";
import { HYDRAULIC_POWER_WORD, namesHydraulicPower } from "./hydraulic-power";
import { PER_UNIT } from "./per-unit";
import { FOERDERLEISTUNG, withoutWaterPowerSymbol } from "./ambiguous-power";
import type { PowerKind } from "./power-kinds";
import { exponentFlowUnit, withoutExponentFlow } from "./flow-exponents";

export const NUMERIC_FIELDS = ["speed", "impeller", "flow", "head", "efficiency", "power", "npshr", "minflow"] as const;
export const TEXT_FIELDS = ["model", "type", "size", "notes"] as const;
/** `minflow`: the maker's minimum continuous flow of a curve set (one figure per curve, in a flow unit: min-flow.ts). */
export const FIELDS = ["model", "speed", "impeller", "flow", "head", "efficiency", "power", "npshr", "minflow", "type", "size", "notes", "ignore"] as const;

export type NumericField = (typeof NUMERIC_FIELDS)[number];
export type TextField = (typeof TEXT_FIELDS)[number];
export type Field = (typeof FIELDS)[number];

export const FLOW_UNITS = ["m3/h", "m3/s", "m3/min", "m3/d", "l/s", "l/min", "l/h", "gpm", "imp gpm"] as const;
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
  speed: SPEED_UNITS, impeller: DIAMETER_UNITS, flow: FLOW_UNITS, head: LENGTH_UNITS, efficiency: EFFICIENCY_UNITS, power: POWER_UNITS, npshr: LENGTH_UNITS, minflow: FLOW_UNITS,
};

/** Unit assumed when a header carries none (efficiency is decided from the data instead, see mapping.ts). */
export const DEFAULT_UNIT: Record<NumericField, Unit> = { speed: "rpm", impeller: "mm", flow: "m3/h", head: "m", efficiency: "%", power: "kW", npshr: "m", minflow: "m3/h" };

export const FT = 0.3048;
export const INCH = 0.0254;
export const US_GALLON = 3.785411784e-3; // m³
export const UK_GALLON = 4.54609e-3; // m³
export const LBF = 4.4482216152605; // N
export const HP = 550 * FT * LBF; // W, 745.69987158227022

/** Multiply a value in `unit` by this to get SI (see file header for targets). */
const FLOW_FACTORS: Partial<Record<Unit, number>> = {
  "m3/h": 1 / 3600, "m3/s": 1, "m3/min": 1 / 60, "m3/d": 1 / 86400, "l/s": 1e-3, "l/min": 1e-3 / 60, "l/h": 1e-3 / 3600, gpm: US_GALLON / 60, "imp gpm": UK_GALLON / 60,
};

/** Multiply a value in `unit` by this to get SI (see file header for targets). */
export const SI_FACTOR: Record<NumericField, Partial<Record<Unit, number>>> = {
  flow: FLOW_FACTORS,
  minflow: FLOW_FACTORS, // the maker's minimum flow: a flow
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
    // "@50Hz", "@90%": a frequency or a share of rated speed, neither a speed in rpm nor a diameter (unit-words.ts refuses it)
    if (!m[2] && /^\s*(?:hz|hertz|%)/.test(rest.slice(m.index! + m[0].length))) return false;
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
  ["power", /power|\bp[12]\b|\bbhp\b|\bb?kw\b|\bhp\b|^p\b|\bpwr\b|leistung|puissance/],
  ["speed", /speed|\brpm\b|^n\b|1\/min|min-1|min⁻¹|drehzahl|vitesse/],
  ["impeller", /impeller|diam|\bdia\b|\btrim\b|laufrad|ø|⌀|^d2?(?![a-z0-9à-ÿ])/], // "d", "D2"; not "débit" (\b ends a word before é)
  ["flow", /flow|^q\b|\bq\b|capacity|\bvolume|förderstrom|durchfluss|débit|\bgpm\b|\b(?:i|us|uk)gpm\b|gal\s*\/\s*min|m3\/|l\/s|l\/min|l\/h\b|\blps\b|\blpm\b|\blph\b|\bcmh\b/],
  ["head", /head|^h\b|\bh\b|\btdh\b|\blift\b|förderhöhe|hauteur/],
  ["type", /\btype\b|\bcategory\b|bauart/],
  ["size", /\bsize\b|\bdn\b|connection|flange/],
  ["notes", /note|comment|remark/],
  ["model", /model|\bpump\b|\bname\b|series|product|article|\bitem\b|baureihe|modell/],
];

/**
 * Columns that look like a point field but are not the pump's: NPSH available, NPSH margin or ratio
 * (not the pump's NPSHr), the efficiency of the motor, the drive or the whole set (not the pump's), and the
 * motor's power factor (cos φ, PF: a ratio, which read as power in the default kW made 0.85 into 850 W).
 * They are left unmapped ("ignore"), as an unknown column is.
 */
const NOT_THE_PUMPS: RegExp[] = [
  /npsh\s*-?\s*a(?![a-z])|npsh.*(?:avail|margin|marge|ratio|reserve|verfüg|vorhanden|dispon|anlage)/,
  /(?:\beff|efficiency|η|\beta\b|wirkungsgrad|rendement).*(?:motor|moteur|\bmot\b|overall|\btotal\b|wire|\bw2w\b|combined|\bset\b|\bunit\b|system|drive|\bvfd\b|\bvsd\b|gesamt|aggregat|\bglobal\b|\bges\b)|(?:motor|moteur|\bmot\b|overall|\btotal\b|wire|\bw2w\b|combined|\bset\b|\bunit\b|system|drive|\bvfd\b|\bvsd\b|gesamt|aggregat|\bglobal\b|\bges\b).*(?:\beff|efficiency|η|\beta\b|wirkungsgrad|rendement)/,
  /power\s*-?\s*factor|\bcos\s*(?:φ|phi)|\bpf\b|leistungsfaktor|facteur\s+de\s+puissance/,
];

/**
 * A maker's minimum (continuous, stable) flow: one figure per curve, read before FIELD_RULES' flow ("Min flow m³/h", "Minimum
 * continuous flow", "Qmin", "Q_min", "min_flow_m3h", "MCSF", "Mindestförderstrom", "débit minimum").
 */
const MIN_FLOW = /\bmin(?:imum|\.)?\s*(?:(?:continuous|cont\.?|stable|allowable|allowed)\s*)*(?:flow|capacity|q)\b|\bflow\s*min(?:imum)?\b|\bq\s*-?\s*min\b|\bmcs?f\b|mindest\s*-?\s*(?:förderstrom|durchfluss|fördermenge|menge)|débit\s*min/;

function fieldWords(norm: string): Field {
  if (NOT_THE_PUMPS.some((re) => re.test(norm))) return "ignore";
  if (MIN_FLOW.test(norm)) return "minflow";
  if (FOERDERLEISTUNG.test(norm) && (detectUnit("flow", norm) ?? refusedAfter("flow", norm)) !== null) return "flow"; // ambiguous-power.ts
  const words = withoutExponentFlow(norm); // "L·min⁻¹", "m3·h-1": no speed, no head; alone, flow as "m3/h" is (flow-exponents.ts)
  for (const [field, re] of FIELD_RULES) if (re.test(words)) return field;
  return words !== norm ? "flow" : "ignore";
}

export type { PowerKind } from "./power-kinds";

/** A unit word for power written in a (normalised) header, read or refused: it settles the headers of ambiguous-power.ts. */
const namesPowerUnit = (norm: string) => (detectUnit("power", norm) ?? refusedAfter("power", norm)) !== null;

/**
 * The power a (normalised) header names when it is not shaft power (input-power.ts, hydraulic-power.ts, per-unit.ts, ambiguous-power.ts,
 * rated-power.ts), else null. A rated power is a rating before any hydraulic reading of its words ("Rated output kW" is a nameplate figure).
 */
function powerKindWords(norm: string): PowerKind | null {
  const field = fieldWords(norm);
  if (field === "power" && PER_UNIT.test(norm)) return "per-unit";
  if ((field === "power" || (field === "ignore" && ELECTRICAL_POWER_WORD.test(norm))) && namesInputPower(norm)) return inputPowerKind(norm);
  if (field === "power" && FOERDERLEISTUNG.test(norm)) return namesPowerUnit(norm) ? "hydraulic" : "flow-or-hydraulic";
  if (field === "power" && namesRatedPower(norm)) return "rated";
  if ((field === "power" || (field === "ignore" && HYDRAULIC_POWER_WORD.test(norm))) && namesHydraulicPower(norm)) return "hydraulic";
  return null;
}

/** The field a (normalised) header names; a power header naming the electrical input (P1) or the hydraulic power is left unmapped. */
export function detectField(norm: string): Field {
  return powerKindWords(norm) ? "ignore" : fieldWords(norm);
}

/**
 * "P_w"/"Pw" on the header as written (normalising makes "P_w" the "p w" of "P (W)") of a power or unknown column ("Series PW"
 * stays a model): the water power with a power unit written apart, else ambiguous.
 */
function waterPowerKind(header: string): PowerKind | null {
  const rest = withoutWaterPowerSymbol(header);
  if (rest === null || !["power", "ignore"].includes(fieldWords(extractQualifier(normaliseHeader(header)).rest))) return null;
  return namesPowerUnit(extractQualifier(normaliseHeader(rest)).rest) ? "hydraulic" : "water-or-watts";
}

/**
 * The power `header` names when it reads as power but is not the pump's shaft power: "input" (P1, "Input power",
 * "kW el"...), "rated-motor" ("Rated motor output kW"), a rating assumed ("motor": "Motor kW"; "rated": "Rated power kW"), "hydraulic" ("Hydraulic power", "Output power", "Phyd", "Pw (kW)"...), "per-unit" ("P.U."),
 * or a word with two readings ("water-or-watts": "P_w"; "flow-or-hydraulic": "Förderleistung"); null otherwise.
 * guessHeader leaves such a column unmapped and checkMapping says why (powerKindMessage, power-kinds.ts).
 */
export function headerPowerKind(header: string): PowerKind | null {
  const norm = normaliseHeader(header);
  return waterPowerKind(header) ?? powerKindWords(norm) ?? powerKindWords(extractQualifier(norm).rest);
}

/** True when `header` reads as power but names the motor's electrical input power (P1): see headerPowerKind. */
export function headerNamesInputPower(header: string): boolean {
  return headerPowerKind(header) === "input";
}

/** A litre as headers write it: l, lit, ltr, liter(s), litre(s), or dm3 (1 dm³ = 1 L, SI Brochure). */
const LITRE = String.raw`(?:\b(?:l|lit|ltr|liters?|litres?)|(?<![a-z])dm3)\s*\/\s*`;
const LITRES_PER_S = new RegExp(String.raw`${LITRE}s(ec)?\b|\blps\b|\bls\b`);
const LITRES_PER_MIN = new RegExp(String.raw`${LITRE}min\b|\blpm\b`);
const LITRES_PER_H = new RegExp(String.raw`${LITRE}h(r|our)?\b|\blph\b`);

/** Unit written in the (normalised, qualifier-free) header for this field, or null when none is written (or a refused word overrides it). */
export function detectUnit(field: Field, norm: string): Unit | null {
  if (field !== "ignore" && (NUMERIC_FIELDS as readonly string[]).includes(field) && refusedBefore(field as NumericField, norm)) return null;
  switch (field) {
    case "flow":
    case "minflow":
      if (exponentFlowUnit(norm)) return exponentFlowUnit(norm); // "l·s⁻¹", "m3.h-1" (flow-exponents.ts)
      // m3 not inside dm3 (a cubic decimetre is a litre, SI Brochure: read below as l/…); m3s, ls as our format spells units (flow_m3h)
      if (/(?<![a-z])m3\s*\/\s*s(ec)?\b|\bm3s\b/.test(norm)) return "m3/s";
      if (/(?<![a-z])(?:m3|cu\.?\s*m|cbm)\s*\/\s*h|\bcmh\b|\bm3h\b/.test(norm)) return "m3/h";
      if (/(?<![a-z])m3\s*\/\s*min\b/.test(norm)) return "m3/min";
      if (/(?<![a-z])m3\s*\/\s*(?:d|day)\b/.test(norm)) return "m3/d";
      // gallons: the US gallon unless the header says imperial, in any word order (the refusal above catches both at once)
      if (GALLONS_PER_MINUTE.test(norm)) return IMPERIAL_MARK.test(norm) ? "imp gpm" : "gpm";
      if (LITRES_PER_S.test(norm)) return "l/s";
      if (LITRES_PER_MIN.test(norm)) return "l/min";
      if (LITRES_PER_H.test(norm)) return "l/h";
      return null;
    case "head":
    case "npshr":
      if (/\bft\b|\bfeet\b|\bfoot\b|'|\bft\s*h2o\b|\bftwc\b|\bfth2o\b/.test(norm)) return "ft";
      if (/\bm\b|\bmeters?\b|\bmetres?\b|\bmwc\b|\bmlc\b|\bm\s*h2o\b|\bmh2o\b|\bmws\b|\bmce\b|\bmca\b|\bmfl\b/.test(norm)) return "m";
      return null;
    case "impeller":
      if (/\bmm\b/.test(norm)) return "mm";
      if (/\bin\b\.?|\binch(es)?\b|"/.test(norm)) return "in";
      if (/\bm\b/.test(norm)) return "m";
      return null;
    case "efficiency":
      if (/%|percent|\bpct\b/.test(norm)) return "%";
      if (/fraction|^[^a-z0-9]*-[^a-z0-9]*$|\s-\s*$|0\.\.1/.test(norm) || PER_UNIT.test(norm)) return "fraction";
      return null;
    case "power":
      if (/\bb?kw\b/.test(norm)) return "kW"; // bkW: brake (shaft) kilowatts
      if (/\bb?hp\b/.test(norm)) return "hp";
      if (/\bw\b|\bwatts?\b/.test(norm)) return "W";
      return null;
    case "speed":
      return tok("rpm|upm|1\\s*/\\s*min|min-1|(?:r|u|tr|rev)\\s*/\\s*min").test(norm) ? "rpm" : null;
    default:
      return null;
  }
}

/** A unit word in a header that the field does not take: the word as written, and the units the field takes. */
export interface UnitRefusal {
  field: NumericField;
  /** The word as the header writes it ("kPa", "GPM … Imp"). */
  word: string;
  accepts: readonly Unit[];
  why: string | null;
}

const FIELD_WORD: Record<NumericField, string> = {
  flow: "flow",
  head: "head",
  npshr: "NPSHr",
  efficiency: "efficiency",
  power: "power",
  speed: "speed",
  impeller: "impeller diameter",
  minflow: "the maker's minimum flow",
};

/** The word as the header spells it (the match was made on the lower-case normalised text). */
function asWritten(header: string, word: string): string {
  const keep = header.normalize("NFKC").replace(/[\u2011-\u2015\u2212]/g, "-").replace(/\^/g, "").replace(/[[\]{}()_]/g, " ").replace(/\s+/g, " ");
  const at = keep.toLowerCase().indexOf(word);
  return at < 0 || keep.length !== keep.toLowerCase().length ? word : keep.slice(at, at + word.length);
}

function refusal(field: NumericField, header: string, norm: string): UnitRefusal | null {
  let r: RefusedWord | null = refusedBefore(field, norm);
  if (!r && detectUnit(field, norm) === null) r = refusedAfter(field, norm);
  if (!r) return null;
  const word = r.word.includes(" … ") ? r.word.split(" … ").map((w) => asWritten(header, w)).join(" … ") : asWritten(header, r.word);
  return { field, word, accepts: UNITS_BY_FIELD[field], why: r.why };
}

/**
 * The unit word of `header` that a column mapped to `field` cannot take, or null. checkMapping calls it for
 * every numeric column whose unit the user has not chosen: a refused word is a mapping error, never a default.
 */
export function headerUnitRefusal(header: string, field: Field): UnitRefusal | null {
  if (!(NUMERIC_FIELDS as readonly string[]).includes(field)) return null;
  const norm = normaliseHeader(header);
  const { qualifier, rest } = extractQualifier(norm);
  const pointField = field === "flow" || field === "head" || field === "efficiency" || field === "power" || field === "npshr" || field === "minflow";
  return refusal(field as NumericField, header, qualifier && pointField ? rest : norm);
}

/** The mapping error's text: the header, the word found, the units the field takes, and what to do. */
export function refusalMessage(header: string, r: UnitRefusal): string {
  return (
    `“${header}” gives the unit “${r.word}”, which the importer does not read for ${FIELD_WORD[r.field]} (it reads ${r.accepts.join(", ")})` +
    (r.why ? `: ${r.why}` : "") +
    `. Convert the column in the file to one of those units, or, if its values are already in one of them, choose that unit for the column` +
    ` (mapping page: the column's unit; API: unitSource "user").`
  );
}

export interface HeaderGuess {
  field: Field;
  unit: Unit | null;
  /** true when the unit was read from the header text; false when it is a default or left to the data. */
  unitFromHeader: boolean;
  qualifier: BlockQualifier | null;
  /** A unit word the field does not take: then `unit` is only the field's default and checkMapping reports it. */
  refused: UnitRefusal | null;
  /** The header names the electrical input power (P1), not shaft power: left unmapped, and checkMapping says why. */
  inputPower: boolean;
  /** The header names the hydraulic power (ρ·g·Q·H), not shaft power: left unmapped, and checkMapping says why. */
  hydraulicPower: boolean;
  /** Any power that is not read as shaft power (headerPowerKind): left unmapped, and checkMapping says why. */
  powerKind: PowerKind | null;
}

/** Guess field, unit and wide-layout qualifier from one header cell. */
export function guessHeader(header: string): HeaderGuess {
  const unmapped = (kind: PowerKind | null, field: Field = "ignore"): HeaderGuess =>
    ({ field, unit: null, unitFromHeader: false, qualifier: null, refused: null, inputPower: kind === "input", hydraulicPower: kind === "hydraulic", powerKind: kind });
  const water = waterPowerKind(header);
  if (water) return unmapped(water);
  const norm = normaliseHeader(header);
  const { qualifier, rest } = extractQualifier(norm);
  let field = detectField(rest);
  // "Head 250mm", "Q@2900" and "Qmin 250mm" are of one curve; a qualifier on a speed/impeller column would be odd, drop it.
  const q = field === "flow" || field === "head" || field === "efficiency" || field === "power" || field === "npshr" || field === "minflow" ? qualifier : null;
  const base = q ? rest : norm;
  if (!q) field = detectField(norm);
  if (field === "ignore" || (TEXT_FIELDS as readonly string[]).includes(field)) return unmapped(field === "ignore" ? headerPowerKind(header) : null, field);
  const nf = field as NumericField;
  const refused = refusal(nf, header, base);
  const unit = refused ? null : detectUnit(nf, base);
  return { field, unit: unit ?? DEFAULT_UNIT[nf], unitFromHeader: unit !== null, qualifier: q, refused, inputPower: false, hydraulicPower: false, powerKind: null };
}
