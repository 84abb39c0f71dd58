// The typed duty head against the system's own head at the duty flow (the duty check shown beside the duty), and
// where the system needs no pump head there, why: its parts with their numbers. Pure.
import { systemHead, systemHeadFunction, type prepareSystem, type SystemCase } from "~/engine";
import { fmtPctSignedExact, pastAbove, qt } from "~/engine/quantityText";
import { GOVERNING_CASE, governingName } from "./candidate-judgement";
import type { SystemInput } from "./system-input";

export type DutyCheck = {
  typedHead: number;
  /** System head at the duty flow on the design curve (nominal level, new pipe) and at the governing edge, m. */
  designHead: number;
  governingHead: number;
  governingEdge: string;
  /** (typed − governing)/governing, fraction; null where the system needs no pump head there (governing ≤ 0: downhill). */
  difference: number | null;
  /** More than 3 % apart (common practice: a duty read off a different curve). */
  differs: boolean;
  message: string;
  /** Which head each solve uses, in words. */
  governs: string;
};

/** Typed duty head against the system at the duty flow; 3 % threshold (common practice). */
export const DUTY_HEAD_THRESHOLD = 0.03;

type Prepared = ReturnType<typeof prepareSystem>;

/**
 * Why a system needs no pump head at a flow (its head there ≤ 0), from its parts at the governing edge: the sum with
 * each part's number, then what drives the flow — gravity where the static head is below zero (the discharge surface
 * below the suction surface), the pressure difference where it is below zero (the discharge surface's pressure below
 * the suction surface's), or both.
 */
export function noHeadNeeded(input: Pick<SystemInput, "mode" | "pressureDifference">, prepared: Prepared, flow: number, which: SystemCase = GOVERNING_CASE): { sum: string; cause: string } {
  const h = systemHead(prepared, flow, which);
  const losses = h.suctionLoss + h.dischargeLoss;
  if (input.mode === "closed-loop") {
    return { sum: `control head ${qt("head", h.fixedHead)} + pipe losses ${qt("head", losses)} = ${qt("head", h.head)}`, cause: "With no control head to hold and no pipe loss at this flow, the loop takes" };
  }
  // The parts that are there (a zero static head or pressure difference is left out of the sum).
  const parts = [
    h.staticHead !== 0 ? `static head ${qt("head", h.staticHead)}` : "",
    input.pressureDifference !== 0 ? `pressure difference ${qt("pressure", input.pressureDifference)} (${qt("head", h.fixedHead)} of liquid)` : "",
    `pipe losses ${qt("head", losses)}`,
  ].filter(Boolean);
  const sum = `${parts.join(" + ")} = ${qt("head", h.head)}`;
  const gravity = h.staticHead < 0, pressure = h.fixedHead < 0;
  const cause = gravity && pressure
    ? "Gravity (the discharge surface below the suction surface) and the lower pressure on the discharge surface together deliver"
    : pressure
    ? `The pressure difference (the discharge surface's pressure ${qt("pressure", -input.pressureDifference)} below the suction surface's), more than the static head and the losses, delivers`
    : gravity
    ? "Gravity (the discharge surface below the suction surface) delivers"
    : "The system's heads deliver";
  return { sum, cause };
}

/**
 * `noHeadNeeded` as one clause to go on after a colon: "static head -3.00 m + pipe losses 0.75 m = -2.25 m; gravity (the
 * discharge surface below the suction surface) delivers <what>" — for the texts that say no pump head is needed (the
 * speed/trim note, the duty cycle's step).
 * @param what what is delivered, in words ("the duty flow", "this flow")
 */
export function noHeadClause(input: Pick<SystemInput, "mode" | "pressureDifference">, prepared: Prepared, flow: number, what: string, which: SystemCase = GOVERNING_CASE): string {
  const { sum, cause } = noHeadNeeded(input, prepared, flow, which);
  return `${sum}; ${cause.charAt(0).toLowerCase()}${cause.slice(1)} ${what} without a pump`;
}

export function dutyCheckOf(input: SystemInput, prepared: Prepared): DutyCheck | null {
  if (!input.duty) return null;
  const designHead = systemHeadFunction(prepared)(input.duty.flow);
  const governingHead = systemHeadFunction(prepared, GOVERNING_CASE)(input.duty.flow);
  const edge = governingName(input.mode);
  // Downhill (the system's head at the duty flow ≤ 0): no pump head is needed, so a percentage of it means nothing.
  const downhill = governingHead <= 0;
  const difference = downhill ? null : (input.duty.head - governingHead) / governingHead;
  // Past 3 % by more than 1 part in 10⁸ (LIMIT_ROUNDING; within it, at 3 %), so a difference called past prints apart from it.
  const differs = difference === null || pastAbove(Math.abs(difference), DUTY_HEAD_THRESHOLD);
  const q = qt("flow", input.duty.flow);
  const none = downhill ? noHeadNeeded(input, prepared, input.duty.flow) : null;
  const message = none
    ? `The system needs no pump head at ${q}: its head there at ${edge} is ${none.sum}, not above zero (${qt("head", designHead)} on the design curve). ${none.cause} the duty flow without a pump; the typed duty head ${qt("head", input.duty.head)} is more than the system uses. Check the levels and surface pressures, or whether a pump is needed at this flow.`
    : differs
    ? `The typed duty head ${qt("head", input.duty.head)} differs by ${fmtPctSignedExact(difference, [DUTY_HEAD_THRESHOLD])} from the system's head at ${q}: ${qt("head", governingHead)} at ${edge} (${qt("head", designHead)} on the design curve). More than 3 % apart: check the duty or the pipe runs.`
    : `The typed duty head ${qt("head", input.duty.head)} agrees within 3 % with the system's ${qt("head", governingHead)} at ${q} (${edge}).`;
  const governs = `Speed and trim solves and the verdicts use the system's head at the duty flow (${qt("head", governingHead)}, ${edge}); the pump search uses the typed duty head (${qt("head", input.duty.head)}).`;
  return { typedHead: input.duty.head, designHead, governingHead, governingEdge: edge, difference, differs, message, governs };
}
