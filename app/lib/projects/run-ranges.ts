// The ranges a pipe run's numbers take, and the one way a refusal of one is worded: the field, then the range it takes in
// the unit it is read in (quantity tokens, rendered by whoever shows the words: the editor in the user's units, the API in
// the caller's). Pure: the schema (system-input.ts), the editor's form (system-form.ts) and the preview API say the same.
import { PIPE_TABLES, type Quantity } from "~/engine";
import { fmtNumExact, LIMIT_ROUNDING, qtBound, qtSent } from "~/engine/quantityText";
import { MAX_MAGNITUDE } from "../shared/decimal";
import { groupThousands, numberAsTyped } from "../shared/format";

/** A number's range: its field's label, quantity (null: a plain number), ends in SI, and why an end is where it is. */
export type NumberRange = { label: string; q: Quantity | null; min: number; max: number; why?: string };

/** Relative rounding of a value shown in a field at five significant digits (system-form.ts `show`, with room). */
export const SHOWN_PRECISION = 1e-4;

// The smallest inner diameter any pipe table of the catalogue lists (engine pipes.ts, pipesDN.ts; EN 10255 medium DN6 today).
const smallest = PIPE_TABLES.flatMap((t) => t.sizes.map((s) => ({ table: t.name, nominal: s.nominal, bore: s.innerDiameter }))).reduce((a, b) => (b.bore < a.bore ? b : a));

/** Smallest inner diameter an entered run takes, m: the catalogue's smallest bore (a fitting's fT is taken at 1 mm at the least, fittings.ts). */
export const MIN_BORE = smallest.bore;
/** Largest inner diameter of any run, m (our rule: past it, a unit was mistaken). */
export const MAX_BORE = 5;
/** Longest run, m (1000 km; our rule). */
export const MAX_RUN_LENGTH = 1e6;
/** Largest absolute roughness, new or aged, m (50 mm; our rule). */
export const MAX_ROUGHNESS = 0.05;
/** Largest extra ΣK of a run (dimensionless; our rule). */
export const MAX_EXTRA_K = 1e4;

export const BORE_RANGE: NumberRange = { label: "Inner diameter", q: "diameter", min: MIN_BORE, max: MAX_BORE, why: `the smallest bore a pipe table of the catalogue lists: ${smallest.table} ${smallest.nominal}` };
export const LENGTH_RANGE: NumberRange = { label: "Length", q: "length", min: 0, max: MAX_RUN_LENGTH };
export const ROUGHNESS_RANGE: NumberRange = { label: "Roughness", q: "roughness", min: 0, max: MAX_ROUGHNESS };
export const AGED_ROUGHNESS_RANGE: NumberRange = { ...ROUGHNESS_RANGE, label: "Aged roughness" };
export const EXTRA_K_RANGE: NumberRange = { label: "Extra ΣK", q: null, min: 0, max: MAX_EXTRA_K };

/**
 * Whether an entered run's bore is taken: from the catalogue's smallest bore, less the rounding of a field showing it (a
 * stored 6.2 mm shown as 0.24409 in reads back a hair below), to MAX_BORE. The editor and the preview API hold to it;
 * a stored document is read without its lower end (a system saved before it still computes, with the engine's warnings).
 */
export const boreTaken = (d: number) => d >= MIN_BORE * (1 - SHOWN_PRECISION) && d <= MAX_BORE;

/**
 * Whether `x` (SI) is inside `r`, to 1 part in 10⁸ of the end (engine quantityText.ts `LIMIT_ROUNDING`): an end typed as the
 * refusal shows it in another unit comes back a hair outside after the conversion (0.036 m³/h is 9.999999999999999e-6
 * m³/s), and is taken; a number refused prints apart from the end beside it in every unit (at 1 part in 10⁹ a duty flow
 * 2 parts in 10⁹ under 1e-5 m³/s was refused as "Sent: 0.158503231 gpm" beside "from 0.158503231 gpm").
 */
export const inside = (r: NumberRange, x: number) => x >= r.min - LIMIT_ROUNDING * Math.abs(r.min) && x <= r.max + LIMIT_ROUNDING * Math.abs(r.max);

/**
 * "from A to B (why)": the ends as tokens, each told apart from `value` where it would read the same, their whole parts
 * grouped in thousands by spaces ("from 0 to 1 000 000 m"; `qtBound`, `groupThousands`), each rounded inward where the
 * unit shown would round it outside (1000 km: "3 280 839 ft"), so an end typed back as printed is taken (decision "inputedge").
 */
export function rangeText(r: NumberRange, value?: number | null): string {
  const against = value != null && Number.isFinite(value) && Math.abs(value) <= MAX_MAGNITUDE ? [value] : [];
  // Zero needs no unit ("from 0 to 50 mm"), but 0 °C does: it is 32 °F.
  const end = (x: number, side: "min" | "max") => (r.q && (x !== 0 || r.q === "temperature") ? qtBound(r.q, x, against, side) : numberAsTyped(x));
  return `from ${end(r.min, "min")} to ${end(r.max, "max")}${r.why ? ` (${r.why})` : ""}`;
}

/**
 * The number refused, grouped as the ends are and told apart from the end it is past: ", not 2 000 000 m"; nothing for a
 * number past the form's magnitude (the editor's stand-in for one that would overflow in SI; its field shows it as typed).
 */
function notText(r: NumberRange, value: number): string {
  if (!(Math.abs(value) <= MAX_MAGNITUDE)) return "";
  const end = value < r.min ? r.min : r.max;
  return `, not ${r.q ? qtSent(r.q, value, [end]) : groupThousands(fmtNumExact(value, [end], undefined, false, true).replace("-", "−"))}`;
}

/**
 * The refusal of a value outside `r` (null or not finite: not a number), naming the field, the range it takes and the
 * number refused: "Length is too high: it takes from 0 to 1 000 000 m, not 2 000 000 m; check the value and its unit."
 */
export function outOfRange(r: NumberRange, value: number | null): string {
  if (value === null || !Number.isFinite(value)) return `${r.label} must be a number; it takes ${rangeText(r)}.`;
  return `${r.label} is too ${value < r.min ? "low" : "high"}: it takes ${rangeText(r, value)}${notText(r, value)}; check the value${r.q ? " and its unit" : ""}.`;
}
