/**
 * Power headers with two readings, which the importer does not guess between:
 * - "P_w" / "Pw": the water (hydraulic) power P_w = ρ·g·Q·H in pump literature (w for water, common practice), or a
 *   power in W ("P" with its unit) — the shaft power if so. Normalising turns "P_w" into "p w", the same text as
 *   "P (W)", so the symbol is looked for on the header as written (brackets kept), where "P (W)" and "P [W]" are a
 *   power in watts, not the symbol.
 * - "Förderleistung": in German pump usage the flow capacity (Förderstrom) or the useful hydraulic output power
 *   (from memory); neither is the pump's shaft power.
 * A unit word written apart settles them (units-in-headers.ts decides it): "P_w (kW)", "Pw [W]" are the water power
 * (the w is then the subscript, not the unit: left out with the hydraulic power's warning); "Förderleistung m³/h" is a
 * flow (mapped to flow), "Förderleistung kW" the hydraulic power. With no unit word the column is left unmapped
 * ("ignore") and checkMapping names both readings (ambiguousPowerMessage) for the user to choose.
 * Pure: no Node or DOM APIs.
 */
import { shaftPowerSource } from "./input-power";

/** The symbol P_w on the header as written (lower-case, NFKC, braces dropped): "P_w", "P_W", "Pw", "PW", "P_{w}". */
const WATER_POWER_SYMBOL = /(?<![\p{L}\p{N}])p\s*_\s*w(?![\p{L}\p{N}])|(?<![\p{L}\p{N}])pw(?![\p{L}\p{N}])/u;

/** "Förderleistung" (also spelt Foerderleistung) on the normalised, lower-case header. */
export const FOERDERLEISTUNG = /f(?:ö|oe)rderleistung/;

/** The header with the symbol P_w taken out (to look for a unit word written apart), or null when it has none. */
export function withoutWaterPowerSymbol(header: string): string | null {
  const text = header.normalize("NFKC").toLowerCase().replace(/[{}]/g, "");
  const m = text.match(WATER_POWER_SYMBOL);
  return m ? text.slice(0, m.index) + " " + text.slice(m.index! + m[0].length) : null;
}

/** A header word with two readings, for ambiguousPowerMessage and the mapping page. */
export type AmbiguousPower = {
  /** The word as the rule names it. */
  word: string;
  /** Each reading and what the user chooses for it. */
  readings: string;
  /** The rule that would have settled it: a unit word written apart. */
  rule: string;
  /** One reading is the pump's shaft power, so a column mapped to power is the user's answer, not a mistake. */
  shaftPowerReading: boolean;
  /** One reading is the flow, so the column is named whenever the file has no flow column either. */
  flowReading: boolean;
  /** Said on the mapping page beside the column (before ": left out…"). */
  note: string;
};

/** "P_w" / "Pw": water power or a power in W. */
export const WATER_POWER_OR_WATTS: AmbiguousPower = {
  word: "P_w",
  readings:
    "the water (hydraulic) power P_w = ρ·g·Q·H (the w for water, common in pump literature), which is not the pump's shaft power (P2 = P_w / η): " +
    "then leave the column out (“— ignore —”); or a power in W: if the values are the pump's shaft power in watts, choose “Shaft power” and the unit W",
  rule: "“P_w” or “Pw” is read as the water power only with a unit word written apart (“P_w (kW)”, “Pw [W]”), and “P (W)” as a power in W",
  shaftPowerReading: true,
  flowReading: false,
  note: "“P_w”: the water (hydraulic) power, or a power in W?",
};

/** "Förderleistung": flow capacity or useful hydraulic power. */
export const FLOW_OR_USEFUL_POWER: AmbiguousPower = {
  word: "Förderleistung",
  readings:
    "the flow capacity (Förderstrom): then choose “Flow” and its unit; or the useful hydraulic output power ρ·g·Q·H, which is not the pump's shaft power " +
    "(P2 = P_hyd / η): then leave the column out (“— ignore —”)",
  rule: "“Förderleistung” is read as flow only with a flow unit in the header (m³/h, l/s, gpm…), and as the hydraulic power with a power unit (kW, W, hp)",
  shaftPowerReading: false,
  flowReading: true,
  note: "“Förderleistung”: the flow, or the useful (hydraulic) power? Neither is the shaft power (P2) the importer reads.",
};

/**
 * The warning for a column whose header has two readings. `mapped`: the column is mapped to power all the same.
 * `efficiency`: the header of the mapped pump efficiency column, or null; `hasPower`: a column is mapped to power.
 */
export function ambiguousPowerMessage(a: AmbiguousPower, header: string, mapped: boolean, efficiency: string | null, hasPower: boolean): string {
  if (mapped)
    return (
      `“${header}” is mapped to shaft power, but “${a.word}” is either ${a.readings}. Neither is the pump's shaft power. ` +
      `Rule: ${a.rule}.`
    );
  return (
    `“${header}” is left unmapped: “${a.word}” can be read two ways and the header has no unit word that settles it. It is either ${a.readings}. ` +
    `Rule: ${a.rule}.` +
    (hasPower ? "" : ` Until you choose, the column is not read. ${shaftPowerSource(efficiency)}`)
  );
}
