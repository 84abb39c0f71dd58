// A selection's frozen document (selections.frozen_json) read honestly: parsed and checked on every read against
// `FrozenSelectionSchema` — the parts the report, the exports and the field pages read, with their types (and the system
// inputs and adjustment against their own schemas, which the field check computes with — the system input with the rules it
// was frozen under, `FrozenSystemInputSchema`). A document that fails (edited in
// the database, cut off, not JSON) is named, never half-rendered: the services refuse it (409, `storedSelectionRefusal`
// in selections.server.ts). Extra keys are allowed and kept: a document that passes is handed on as stored, so the JSON
// export and the field check's fingerprint are what was frozen. Pure.
import * as v from "valibot";
import type { Quantity } from "~/engine";
import { VERDICT_STATUSES } from "~/engine";
import { AdjustmentSchema } from "./candidate-input";
import { FrozenSystemInputSchema } from "./system-input";
import { INPUT_ITEMS, INPUT_LABELS, INPUT_QUANTITIES } from "./stored-input";
import { readStoredDoc, type DocProblem, type DocWords } from "./stored-doc";
import type { Adjustment, CurvePointsIn, evaluateCandidate, evaluateSystem, SystemInput } from "./hydraulics";
import type { CandidateEnergy } from "./energy";

/**
 * The library revision a selection's curve came from. `traced`: the source ("traced from <file>, page N") and the
 * tracer's caution when the revision was imported from a traced picture, null when it was not; absent in selections
 * frozen before it was kept (then unknown).
 */
export type FrozenLibrary = { id?: number; name?: string; revision?: number; revisionId?: number; traced?: { source: string; caution: string } | null };

/** A selection as frozen (selections.server.ts `selectCandidate`): everything its report, exports and field checks read. */
export type FrozenSelection = {
  format: string;
  frozenAt: string;
  project: { id: number; name: string };
  system: { id: number; name: string; input: SystemInput };
  systemCurve: ReturnType<typeof evaluateSystem> | null;
  /** `minFlow`: the maker's minimum continuous flow of the curve set, m³/s (null: none recorded; absent in selections frozen before it was kept). */
  pump: { label: string; model: string; type: string; size: string; library: FrozenLibrary; curveSetId: number; speed: number | null; impellerDiameter: number | null; minFlow?: number | null; points: CurvePointsIn };
  adjustment: Adjustment;
  result: ReturnType<typeof evaluateCandidate>;
  /** Duty-cycle energy and life-cycle cost (selections frozen before them have none). */
  energy?: CandidateEnergy | null;
  flowMax: number;
  /** The workspace's currency when frozen (selections frozen before it was kept have none: `selectionCurrency`). */
  currency?: string;
};

const num = v.pipe(v.number(), v.finite());
/** A number the engine may not have had (JSON writes NaN as null): null or a finite number. */
const numOrNull = v.nullable(num);
const nullishNum = v.nullish(num);
const str = v.string();
const strings = v.array(str);
const obj = v.looseObject;

const CurvePoint = obj({ flow: num, head: num, efficiency: nullishNum, power: nullishNum, npshr: nullishNum });
const SystemCurve = obj({
  flows: v.array(num),
  design: v.array(numOrNull),
  low: v.array(numOrNull),
  high: v.array(numOrNull),
  pressure: v.array(numOrNull),
  dutyFlow: num,
  runs: v.array(obj({ name: str, side: str, velocity: num, reynolds: num, frictionFactor: num, regime: str, headLoss: num, warnings: strings })),
  warnings: strings,
  fluid: obj({ density: num, kinematicViscosity: num, vaporPressure: num }),
  npsha: v.array(obj({ flow: num, y: numOrNull })),
  dutyCheck: v.nullish(obj({ message: str, governs: str, differs: v.boolean() })),
});
const Motor = obj({
  rating: nullishNum, ratingSource: v.nullish(str), suggestedRating: nullishNum, suggestionBasis: v.optional(str), efficiency: nullishNum, efficiencySource: v.optional(str),
  ieClass: v.optional(str), driveEfficiency: nullishNum, driveSource: v.nullish(str), electricalPower: nullishNum, annualEnergyKWh: nullishNum, annualCost: nullishNum, currency: v.optional(str),
});
const Figures = obj({
  efficiency: nullishNum, hydraulicPower: nullishNum, shaftPower: nullishNum, bepFlow: nullishNum, bepHead: nullishNum, bepRatio: nullishNum, inPor: v.nullish(v.boolean()),
  npshAvailable: nullishNum, npshRequired: nullishNum, npshMarginRatio: nullishNum, npshStatus: v.nullish(str), maxPower: nullishNum, motorLimit: nullishNum,
  nonOverloading: v.nullish(v.boolean()), motorCheck: v.nullish(str), motorLoadAtDuty: nullishNum, annualEnergyKWh: nullishNum, annualCost: nullishNum, motor: v.optional(Motor),
});
const Result = obj({
  status: str,
  message: str,
  ratio: num,
  solvedRatio: nullishNum,
  ratioNote: v.nullish(str),
  speed: nullishNum,
  diameter: nullishNum,
  curve: v.array(CurvePoint),
  operating: v.nullable(obj({ flow: num, head: num })),
  allIntersections: v.optional(v.array(obj({ flow: num, head: num }))),
  figures: v.nullable(Figures),
  por: v.nullish(obj({ minFlow: num, maxFlow: num })),
  /** NPSHa and NPSHr at each edge: absent in selections frozen before they were kept. */
  band: v.optional(v.array(obj({ edge: str, flow: numOrNull, head: numOrNull, efficiency: numOrNull, shaftPower: numOrNull, npshMarginRatio: numOrNull, npshAvailable: nullishNum, npshRequired: nullishNum, reason: v.nullable(str), pumpFlow: nullishNum }))),
  npsh: v.optional(obj({
    status: str, marginRatio: numOrNull, at: v.nullable(str), rule: str, available: nullishNum,
    /** The wanted NPSHa / NPSHr: absent in selections frozen before it was kept. */
    requiredMargin: v.optional(num),
    /** Absent in selections frozen before the band's four corners were judged. */
    judgedAt: v.optional(v.array(obj({ at: str, flow: numOrNull, pumpFlow: nullishNum, available: numOrNull, required: numOrNull, marginRatio: numOrNull }))),
    /** The points the rule could not judge, with why (the report, the CSV's npsh_not_judged_at): absent in selections frozen before it was kept. */
    unjudged: v.optional(v.array(obj({ at: str, why: str }))),
    /** Where one pump's NPSHr is published (npshr-reach.ts): null none, absent in selections frozen before it was kept. */
    npshrPublished: v.nullish(obj({ from: num, to: num, points: num, single: numOrNull, pumps: num, column: v.optional(v.array(obj({ flow: num, npshr: num }))) })),
  })),
  /** The maker's minimum flow against the duty (verdict-min-flow.ts): null without a figure, absent in selections frozen before it was kept. */
  minFlow: v.nullish(obj({ published: num, method: v.picklist(["none", "speed", "trim"]), ratio: num, atPump: num, dutyFlow: numOrNull, running: num, dutyPerPump: numOrNull, below: v.boolean() })),
  /** Absent in selections frozen before verdicts; null without a duty. */
  verdict: v.optional(v.nullable(obj({ status: v.picklist(VERDICT_STATUSES), rule: str, reasons: strings, edge: v.nullish(str) }))),
  warnings: strings,
});
const Step = obj({
  flowFraction: num, hours: num, flow: num, head: numOrNull, speedRatio: numOrNull, efficiency: numOrNull, shaftPower: numOrNull, loadFraction: nullishNum,
  motorEfficiency: numOrNull, driveEfficiency: numOrNull, electricalPower: numOrNull, energyKWh: numOrNull, status: str, message: str,
  // Pumps in parallel staged by demand (engine dutyStaging.ts): absent in cycles frozen before, and in every other cycle.
  pumpsRunning: v.optional(num), dutyPumps: v.optional(num), pumpShaftPower: v.optional(numOrNull),
});
const Energy = obj({
  control: str,
  controlLabel: str,
  profileSource: str,
  profileLabel: str,
  cycle: v.nullable(obj({ mode: v.optional(str), steps: v.array(Step), totalHours: num, annualEnergyKWh: num, complete: v.boolean(), setpointHead: nullishNum, warnings: v.optional(v.array(obj({ message: str, parameter: v.nullish(str), code: v.nullish(str) }))) })),
  cycleError: v.nullable(str),
  annualCost: numOrNull,
  purchasePrice: numOrNull,
  lcc: v.nullable(obj({ purchase: num, purchaseGiven: v.boolean(), yearly: v.array(obj({ year: num, energyCost: num, presentValue: num })), energyPresentValue: num, total: num, cumulative: v.array(num), source: str, escalation: v.optional(num), discountRate: v.optional(num), warnings: v.optional(v.array(obj({ message: str, parameter: v.nullish(str), code: v.nullish(str) }))) })),
  costMissing: v.nullish(str),
  /** Beside the life-cycle cost: priced steps outside the allowable flow range (lcc-range-note.ts); absent in selections frozen before. */
  lccRangeNote: v.nullish(str),
  assumptions: strings,
});

/** The frozen document as the report, the exports and the field pages read it. */
export const FrozenSelectionSchema = obj({
  format: str,
  frozenAt: v.pipe(str, v.isoTimestamp("The date it was frozen is not a date and time.")),
  project: obj({ id: num, name: str }),
  /** The input under the rules it was frozen under (`FrozenSystemInputSchema`): a rule added since never refuses what was signed. */
  system: obj({ id: num, name: str, input: FrozenSystemInputSchema }),
  systemCurve: v.nullable(SystemCurve),
  pump: obj({
    label: str, model: str, type: str, size: str,
    library: obj({ id: v.optional(num), name: v.optional(str), revision: v.optional(num), revisionId: v.optional(num), traced: v.nullish(obj({ source: str, caution: str })) }),
    curveSetId: num, speed: numOrNull, impellerDiameter: numOrNull, minFlow: nullishNum,
    points: v.pipe(v.array(CurvePoint), v.minLength(2, "A pump curve needs at least 2 points.")),
  }),
  adjustment: AdjustmentSchema,
  result: Result,
  /** Absent in selections frozen before load profiles. */
  energy: v.nullish(Energy),
  flowMax: num,
  /** The workspace's currency when frozen (ISO 4217); absent in selections frozen before it was kept, where `result.figures.motor.currency` holds it if the pump had an operating point. */
  currency: v.optional(str),
});

const LABELS: Record<string, string> = {
  ...INPUT_LABELS,
  format: "format", frozenAt: "date frozen", project: "project", system: "system", input: "inputs", systemCurve: "system curve", pump: "pump",
  label: "label", model: "model", traced: "traced curve data", source: "source", caution: "caution", type: "type", size: "size", library: "library", revision: "revision", curveSetId: "curve id", speed: "speed",
  impellerDiameter: "impeller diameter", points: "curve points", adjustment: "adjustment", method: "adjusted by", ratio: "ratio", arrangement: "pumps",
  dutyPumps: "duty pumps", standbyPumps: "standby pumps", motorRating: "motor rating", serviceFactor: "service factor", ieClass: "motor efficiency class",
  result: "result", curve: "curve as used", operating: "operating point", figures: "figures at the operating point", band: "band", verdict: "verdict",
  reasons: "reasons", npsh: "NPSH over the band", energy: "energy over the duty cycle", cycle: "duty cycle", steps: "steps", lcc: "life-cycle cost",
  flowMax: "flow range", flows: "flows", design: "design curve", low: "low-level curve", high: "high-level curve", npsha: "NPSH available",
  speedRatio: "speed", shaftPower: "shaft power", motorEfficiency: "motor efficiency", driveEfficiency: "drive efficiency", electricalPower: "electrical input", pumpsRunning: "pumps running", pumpShaftPower: "one pump's shaft power",
  minFlow: "maker's minimum flow", published: "as published", atPump: "one pump's minimum as run", dutyPerPump: "duty per running pump", running: "pumps running", below: "below it",
  judgedAt: "points NPSH is judged at", unjudged: "points NPSH could not judge", why: "why", pumpFlow: "one pump's flow", npshrPublished: "NPSHr as published",
  from: "first flow", to: "last flow", single: "its one NPSHr", pumps: "pumps running together", requiredMargin: "NPSH margin wanted", npshAvailable: "NPSH available", npshRequired: "NPSH required", energyKWh: "energy", annualEnergyKWh: "energy per year", totalHours: "hours in total", complete: "complete", assumptions: "assumptions", currency: "currency", lccRangeNote: "life-cycle cost's note on steps outside the allowable flow range",
};
// An item replaces its list's name: so the list's name is in the item's words where it says more than "point".
const ITEMS: Record<string, string> = {
  ...INPUT_ITEMS, judgedAt: "NPSH point", unjudged: "NPSH point not judged", points: "curve point", curve: "curve as used, point", band: "band edge", steps: "step", reasons: "reason", yearly: "year",
  flows: "flows, point", design: "design curve, point", low: "low-level curve, point", high: "high-level curve, point", npsha: "NPSH available, point",
};
const QUANTITIES: Record<string, Quantity> = { ...INPUT_QUANTITIES, motorRating: "power", impellerDiameter: "diameter" };
const WORDS: DocWords = { whole: "the frozen selection", labels: LABELS, items: ITEMS, quantities: QUANTITIES };

/** The currency of a selection's tariff and costs: the figures' where the pump had an operating point, else the one frozen with it; "" when neither was kept. */
export const selectionCurrency = (f: FrozenSelection): string => f.result.figures?.motor?.currency || f.currency || "";

export type StoredSelection = { ok: true; frozen: FrozenSelection } | { ok: false; problems: DocProblem[] };

/** The frozen document as stored when it passes `FrozenSelectionSchema`, else what is wrong with it. */
export function readStoredSelection(json: string): StoredSelection {
  const r = readStoredDoc(json, FrozenSelectionSchema, WORDS);
  return r.ok ? { ok: true, frozen: r.raw as FrozenSelection } : { ok: false, problems: r.problems };
}
