/**
 * Power headers that name the motor's electrical input power (P1), not the pump's shaft power (P2).
 * The importer's power field is shaft power: P2 = P1 × motor efficiency (× drive efficiency), so P1 read
 * as P2 overstates it (a small wet-rotor circulator's P1 can be about twice its P2, common practice), the
 * efficiency derived from it comes out too low and the motor is sized too large. Such a column is left
 * unmapped ("ignore") and checkMapping says why (notShaftPowerMessage with INPUT_POWER).
 * Pump data sheets write P1 for the electrical input and P2 for the shaft power (common practice);
 * "absorbed power" / "power absorbed" alone is the pump's shaft power there (common practice), unless the
 * header also says electrical; so is a motor's output ("Motor output kW": what the motor's shaft gives the pump's).
 * A motor's rated output ("Rated motor output kW", "Nennleistung Motor", "Motor rating kW") is its size: left out too, with its own message (RATED_MOTOR_POWER).
 * A motor's power with no word for input, output or rating ("Motor power", "Motor kW", "Motorleistung") is taken to be its rating,
 * as in vendor catalogues, and a rated power with no motor word ("Rated power kW", "Nennleistung", "Rated power P2") a rating too: both assumed, left
 * out, and said so with the other readings (inputPowerKind "motor", namesRatedPower; what is said of them is in rated-power.ts).
 * Pure: no Node or DOM APIs. Patterns run on the normalised, lower-case header.
 */

/** "P1", "P 1", "P₁" (NFKC folds the subscript): the electrical input in pump data sheets. */
const P1 = /\bp\s*-?\s*1\b/;
/** Words that name the pump's shaft power outright: P2, shaft, brake (BHP, bkW), Welle(n), arbre. */
const SHAFT = /\bp\s*-?\s*2\b|shaft|\bbrake\b|\bbhp\b|\bbkw\b|welle|\barbre\b/;
/** Words that name the electrical side outright: electrical, "el.", kWel, kWe, Pel, wire, mains, supply, consumption, drawn. */
const ELECTRICAL_WORDS =
  /\belec|elektr|électr|\bel\b|\bkw\s*-?\s*el\b|\bkwe\b|\bp\s*-?\s*el\b|\bwire\b|\bmains\b|\bsupply\b|\bgrid\b|consum|verbrauch|consommation|\bdrawn?\b/;
/**
 * The motor words ("Motor kW", "Motorleistung", "moteur"): not the pump's shaft power unless the header names the motor's output.
 * inputPowerKind tells the electrical input (with P1, input or electrical words) from a rating (named or, with no such word, assumed).
 */
const MOTOR = /\bmot(?:or|eur)|\bmot\b/;
/** Electrical words and the motor words. */
const ELECTRICAL = new RegExp(`${ELECTRICAL_WORDS.source}|${MOTOR.source}`);
/**
 * A motor's output: the power its shaft gives the pump's shaft, which is the pump's shaft power (P2, definition): "Motor output kW",
 * "motor output power", "Motor power output", "Output of motor", "Motorabgabeleistung", "Puissance utile moteur" (from memory).
 * Not a rated or nominal output ("Rated motor output", "Nennleistung Motor"): that is the motor's size, one figure for every
 * point rather than the power at each (common practice), and stays with the motor words of ELECTRICAL, as before.
 */
const MOTOR_OUTPUT = /\bmot(?:or|eur)?\b.*\b(?:output|utile)\b|\b(?:output|utile)\b.*\bmot(?:or|eur)?\b|\bmotor\s*-?\s*abgabe|abgabeleistung.*\bmot(?:or|eur)?\b/;
const RATED = /\brated\b|\bnominal|\bnameplate\b|\bnenn|\bbemessung/;
/** "Motornennleistung", "Bemessungsleistung": the rating inside one German word. */
const NENNLEISTUNG = /nennleistung|bemessungsleistung/;
/** Beside a motor word, "rating" and "size" name its rating too ("Motor rating kW", "Motor size kW"). */
const MOTOR_RATING = /\brating\b|\bsize\b/;
const namesRating = (norm: string) => RATED.test(norm) || NENNLEISTUNG.test(norm);
/** P2, shaft or brake words, or a motor's (not rated) output. */
const namesShaft = (norm: string) => SHAFT.test(norm) || (MOTOR_OUTPUT.test(norm) && !namesRating(norm) && !MOTOR_RATING.test(norm));
/** The pump's own power input (the power its driver transmits to it: shaft power, ISO 9906 wording, from memory). */
const PUMP_INPUT = /\bpump\s+(?:power\s+)?input\b|\binput\s+(?:power\s+)?(?:to|of)\s+(?:the\s+)?pump\b/;
/** "input" in English, German (Eingangsleistung, Leistungsaufnahme) and French (puissance d'entrée). */
const INPUT = /\binput\b|\bin-put\b|eingang|aufnahme|entrée|\bentree\b/;

/** Electrical power written as one word, which the power field's own words do not catch: "kWel", "kWe", "Pel". */
export const ELECTRICAL_POWER_WORD = /\bkw\s*-?\s*el\b|\bkwe\b|\bp\s*-?\s*el\b/;

/** True when a power header (already normalised) names P1, P2/shaft/brake or the electrical side: then it names no hydraulic power. */
export function namesShaftOrElectrical(norm: string): boolean {
  return P1.test(norm) || namesShaft(norm) || ELECTRICAL.test(norm);
}

/**
 * True when a power header (already normalised) names the electrical input power rather than shaft power.
 * P1 decides first; then P2/shaft/brake words and a motor's output; then electrical words; then the pump's own power input; then "input".
 */
export function namesInputPower(norm: string): boolean {
  if (P1.test(norm)) return true;
  if (namesShaft(norm)) return false;
  if (ELECTRICAL.test(norm)) return true;
  if (PUMP_INPUT.test(norm)) return false;
  return INPUT.test(norm);
}

/**
 * Of a header that namesInputPower, with a motor word and neither P1, "input" nor an electrical word: "rated-motor" when it names
 * the rating ("Rated motor output kW", "Nennleistung Motor", "Motor rated power", "Nominal motor power", "Motornennleistung",
 * "Motor rating kW", "Motor size kW"), else "motor" ("Motor power", "Motor kW", "Motorleistung", "Puissance moteur"): taken to be
 * the rating too, as vendor catalogues write it, but assumed (rated-power.ts says so with the other readings). Any other header is
 * "input" (P1). A rating is the motor's size, one figure for every point (common practice).
 */
export function inputPowerKind(norm: string): "input" | "rated-motor" | "motor" {
  if (!MOTOR.test(norm) || P1.test(norm) || INPUT.test(norm) || ELECTRICAL_WORDS.test(norm)) return "input";
  return namesRating(norm) || MOTOR_RATING.test(norm) ? "rated-motor" : "motor";
}

/**
 * A rating word that names the condition the curve is drawn at, not the power: "Shaft power at rated speed", "P2 @ nominal rpm",
 * "Leistung bei Nenndrehzahl" are the power at each point of the curve at that speed (frequency, voltage), not a rating.
 */
const RATED_CONDITION = /\b(?:rated|nominal|nameplate)\s*-?\s*(?:speed|rpm|frequency|freq|voltage)\b|\b(?:nenn|bemessungs)\s*-?\s*(?:drehzahl|frequenz|spannung)/g;

/**
 * True when a power header (already normalised) names a rated, nominal or nameplate power ("Rated power kW", "Nominal power",
 * "Nennleistung", "Bemessungsleistung", "Rated output kW", and with a shaft word too: "Rated power P2", "Rated shaft power",
 * "P2 rated", "Rated absorbed power", "Nenn-Wellenleistung") and no P1, input (other than the pump's own input) or electrical
 * word: a rating, one figure for all points (the shaft power at the rated duty, or the motor's size), assumed (rated-power.ts).
 * A header reaching here with a motor word has a shaft word too ("Rated motor shaft power"): input-power kinds go first.
 * "P2", "Shaft power" (no rating word) and "Shaft power at rated speed" (a condition, RATED_CONDITION) stay shaft power.
 */
export function namesRatedPower(norm: string): boolean {
  const n = norm.replace(RATED_CONDITION, " ");
  return namesRating(n) && !P1.test(n) && !ELECTRICAL_WORDS.test(n) && (!INPUT.test(n) || PUMP_INPUT.test(n));
}

/** A power column that is not the pump's shaft power: what its header names, and why reading it as P2 misleads. */
export type NotShaftPower = {
  /** What the header names, e.g. "the motor's electrical input power (P1)". */
  names: string;
  /** Said after `names` when the column is left out (or ""). */
  leftOut: string;
  /** The values as the user would recognise them, e.g. "P1". */
  values: string;
  /** Why P2 taken from it is wrong, with the numbers. */
  why: string;
  /** What the mapping page says beside the column (before ": left out" or ": see the problems below"). */
  note: string;
};

/**
 * The warning for a column whose header names a power that is not shaft power (`kind`).
 * `mapped`: the column is mapped to power all the same (a user's or a saved mapping); otherwise it was left out.
 * `efficiency`: the header of the mapped pump efficiency column, or null.
 */
export function notShaftPowerMessage(kind: NotShaftPower, header: string, mapped: boolean, efficiency: string | null): string {
  if (mapped)
    return (
      `“${header}” is mapped to shaft power, but its header names ${kind.names}. ${kind.why}. ` +
      `If its values are ${kind.values}, set the column to “— ignore —” (API: field "ignore"); keep it only if they are the pump's shaft power.`
    );
  return (
    `“${header}” is left unmapped: its header names ${kind.names}${kind.leftOut}. ${kind.why}. ${shaftPowerSource(efficiency)} ` +
    `If its values are the pump's shaft power after all, choose “Shaft power” for the column.`
  );
}

/** The motor's electrical input power (P1). */
export const INPUT_POWER: NotShaftPower = {
  names: "the motor's electrical input power (P1)",
  leftOut: "",
  values: "P1",
  note: "electrical input power (P1), not the shaft power (P2) the importer reads",
  why:
    "Dutymark's power is the pump's shaft power (P2), and P2 = P1 × motor efficiency (× drive efficiency): P1 read as P2 overstates it " +
    "(a small wet-rotor circulator's P1 can be about twice its P2), so efficiencies worked out from it come out too low and the motor is sized too large",
};

/** A motor's rated output (inputPowerKind): its size, the same figure on every row, not the shaft power at each point. */
export const RATED_MOTOR_POWER: NotShaftPower = {
  names: "the motor's rated output (its size)",
  leftOut: ": one figure for all points, not a power at each point",
  values: "the motor's rating",
  note: "the motor's rated output (its size, one figure for all points), not the shaft power (P2) at each point",
  why:
    "Dutymark's power is the pump's shaft power (P2) at each point of the curve; a motor's rating is the size of the motor fitted, written " +
    "the same on every row (a 7.5 kW motor reads 7.5 at shutoff and at the last point), so read as P2 every point would draw the full rating " +
    "and efficiencies worked out from it would be wrong (common practice: the motor is sized above the pump's highest shaft power)",
};

/**
 * Where a file's shaft power comes from once a power column that is not shaft power is left out.
 * `efficiency`: the header of the mapped pump efficiency column, or null.
 */
export function shaftPowerSource(efficiency: string | null): string {
  return efficiency
    ? `Shaft power is worked out from the pump efficiency column “${efficiency}” instead (P2 = ρ·g·Q·H / η).`
    : `The file has no shaft power (P2) or pump efficiency column, so its curves carry no power figures (shaft power, motor size, energy): add a P2 or a pump efficiency column for them.`;
}
