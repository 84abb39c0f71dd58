/**
 * The kinds of power header the importer does not read as the pump's shaft power (P2), and what it says of each: the
 * warning checkMapping gives (powerKindMessage) and the note the mapping page shows beside the column (powerKindNote).
 * The words are in input-power.ts, hydraulic-power.ts, per-unit.ts and ambiguous-power.ts (rated-power.ts: the ratings assumed); units-in-headers.ts
 * decides a header's kind (headerPowerKind). Pure: no Node or DOM APIs.
 */
import { INPUT_POWER, notShaftPowerMessage, RATED_MOTOR_POWER, type NotShaftPower } from "./input-power";
import { HYDRAULIC_POWER } from "./hydraulic-power";
import { PER_UNIT_POWER } from "./per-unit";
import { ambiguousPowerMessage, FLOW_OR_USEFUL_POWER, WATER_POWER_OR_WATTS, type AmbiguousPower } from "./ambiguous-power";
import { assumedPowerMessage, MOTOR_POWER, RATED_POWER, type AssumedPower } from "./rated-power";

/**
 * A power header that is not read as shaft power: the motor's electrical input (P1), a motor's rated output (its size), the
 * hydraulic power (ρ·g·Q·H), a per-unit ratio, a word with two readings ("P_w": water power or watts; "Förderleistung": flow or
 * useful power), or a rating assumed ("motor": "Motor kW", taken to be the motor's rated output; "rated": "Rated power kW").
 */
export type PowerKind = "input" | "rated-motor" | "motor" | "rated" | "hydraulic" | "per-unit" | "water-or-watts" | "flow-or-hydraulic";

const NOT_SHAFT: Partial<Record<PowerKind, NotShaftPower>> = { input: INPUT_POWER, "rated-motor": RATED_MOTOR_POWER, hydraulic: HYDRAULIC_POWER, "per-unit": PER_UNIT_POWER };
const AMBIGUOUS: Partial<Record<PowerKind, AmbiguousPower>> = { "water-or-watts": WATER_POWER_OR_WATTS, "flow-or-hydraulic": FLOW_OR_USEFUL_POWER };
const ASSUMED: Partial<Record<PowerKind, AssumedPower>> = { motor: MOTOR_POWER, rated: RATED_POWER };

/** What the rest of the mapping holds: the pump efficiency column's header (or null), and whether power and flow are mapped. */
export type MappedElsewhere = { efficiency: string | null; hasPower: boolean; hasFlow: boolean };

/**
 * checkMapping's warning for a column of this kind mapped to `field`, or null when there is nothing to say: a column left
 * out is named when the file then has no power column (or, for a word that may be the flow, no flow column); a column
 * mapped to power is named unless shaft power is one of its readings (then mapping it so was the user's answer).
 */
export function powerKindMessage(kind: PowerKind, header: string, field: string, m: MappedElsewhere): string | null {
  const known = NOT_SHAFT[kind];
  const two = AMBIGUOUS[kind];
  const assumed = ASSUMED[kind];
  if (field === "power") {
    if (known) return notShaftPowerMessage(known, header, true, m.efficiency);
    if (assumed) return assumedPowerMessage(assumed, header, true, m.efficiency);
    return two && !two.shaftPowerReading ? ambiguousPowerMessage(two, header, true, m.efficiency, m.hasPower) : null;
  }
  if (field !== "ignore") return null;
  if (known) return m.hasPower ? null : notShaftPowerMessage(known, header, false, m.efficiency);
  if (assumed) return m.hasPower ? null : assumedPowerMessage(assumed, header, false, m.efficiency);
  return two && (!m.hasPower || (two.flowReading && !m.hasFlow)) ? ambiguousPowerMessage(two, header, false, m.efficiency, m.hasPower) : null;
}

/** The mapping page's note beside a column of this kind mapped to `field` (ignore or power), or null. */
export function powerKindNote(kind: PowerKind, field: string): string | null {
  if (field !== "ignore" && field !== "power") return null;
  const known = NOT_SHAFT[kind] ?? ASSUMED[kind];
  if (known) return `${known.note}: ${field === "ignore" ? "left out" : "see the problems below"}`;
  const two = AMBIGUOUS[kind];
  if (!two || (field === "power" && two.shaftPowerReading)) return null;
  return `${two.note} ${field === "ignore" ? "Left out until you choose" : "See the problems below"}`;
}
