// What a recorded field check stores as its result (computed once at submission by
// evaluate.ts, recorded by records.server.ts): a plain type shared by the server and the components that show it.
import type { FieldCheckResult } from "~/engine";
import type { Verdict } from "./form";
import type { PowerGrade } from "./power-grade";
import { PUBLISHED_PART } from "./curve-ends";

/** The stored result's format label (evaluate.ts writes it into every result). */
export const FIELD_CHECK_FORMAT = "dutymark-fieldcheck/1";

/** How the note of a check marginal within its readings' uncertainty begins (evaluate.ts): the point that meets the grade and the uncertainty. */
export const MARGINAL_NOTE = "At the tolerance limit:";

export type Pt = { flow: number; y: number };

export type CheckResult = {
  format: string;
  /** The grade judged; `powerAbove` and `efficiencyBelow` are missing from results recorded before they were judged. */
  grade: { id: string; flow: readonly [number, number]; head: readonly [number, number]; powerAbove?: number; efficiencyBelow?: number; source: string };
  verdict: Verdict;
  verdictText: string;
  message: string;
  engine: FieldCheckResult;
  fluid: { name: string; density: number };
  /** rpm: the curve's rated speed, the selection's design speed, the measured speed; ratio measured / rated. */
  speed: { rated: number | null; design: number | null; measured: number | null; rescaled: boolean; designRatio: number | null };
  /** Gauge pressures on one reference (gauge), Pa, and the head uncertainty, m. */
  gauges: { suction: number; discharge: number; headUncertainty: number; assumedAtmosphere: boolean };
  /** Per-pump design duty, m³/s and m (from the system's duty, or the selection's operating point). */
  duty: { flow: number; head: number } | null;
  delivered: { flow: number | null; head: number };
  /** Fractions: measured vs the rescaled curve and vs the design duty. */
  deviation: { curveFlow: number | null; curveHead: number | null; dutyFlow: number | null; dutyHead: number | null };
  power: { input: number | null; hydraulic: number | null; overall: number | null; shaft: number | null; pump: number | null; curve: number | null } | null;
  /** The grade's power and efficiency limits: judged, or why not. Missing from results recorded before they were judged (read as "not judged"). */
  powerGrade?: PowerGrade;
  hints: string[];
  warnings: string[];
  chart: { selected: Pt[]; measured: Pt[]; selectedEff: Pt[]; measuredEff: Pt[]; system: Pt[] | null; flowMax: number; band: { low: number | null; high: number | null } | null; selectedLabel: string; measuredLabel: string };
};

/**
 * What the check says beside its verdict, as a note it made (quantity tokens): why there is no tolerance verdict where a flow
 * was measured ("No tolerance verdict: …": the speed outside the affinity range, a liquid with no curve, a flow outside the
 * published curve that the cross does not reach), or that it was judged on the published part of the curve only
 * (curve-ends.ts); null otherwise. Read by the selection's list of checks, the checks' CSV and the e-mail, so they say what the page says.
 */
export function verdictNote(r: Pick<CheckResult, "warnings">): string | null {
  return r.warnings.find((w) => w.startsWith("No tolerance verdict:") || w.startsWith(PUBLISHED_PART)) ?? null;
}
