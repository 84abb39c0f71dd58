// The field checks of one selection, for the engineer's selection page: who recorded each, when it was taken and recorded,
// what the pump delivered, and the verdict with the tolerance rule it was judged by: today's, with the stored one beside it
// where they differ (listed-verdict.ts). Only for the
// selection's own workspace (contractors of a shared project see them on the field pages instead):
// it takes the selection as `getSelection` opened it for the viewer (limited to their workspace), so the
// page reads the selection once. A check whose stored record cannot be read keeps its row, with what is wrong.
import type { getSelection } from "../projects/selections.server";
import { checksOf } from "./records.server";
import { gradeRule } from "./form";
import { powerGradeSummary } from "./power-grade";
import { unreadableCheckText } from "./stored-check";
import { verdictNote } from "./result";
import { crossSummary } from "./cross";
import { frozenForToday } from "./today.server";

export async function checksOfSelection(selection: Awaited<ReturnType<typeof getSelection>>) {
  return (await checksOf(selection.id, frozenForToday(selection.frozenJson, selection.frozen))).map((c) => {
    const base = { id: c.id, version: c.version, superseded: c.superseded, createdAt: c.createdAt, times: c.times, byName: c.byName, byWorkspace: c.byWorkspace };
    if (!c.readable) return { ...base, readable: false as const, unreadable: unreadableCheckText(c) };
    return {
      ...base,
      readable: true as const,
      flow: c.result.delivered.flow,
      head: c.result.delivered.head,
      flowSource: c.result.engine.flowSource,
      verdict: c.verdict,
      rule: gradeRule(c.result.grade),
      /** The verdict's numbers on flow and head: each arm of the tolerance cross with its allowance (quantity tokens), or null. */
      cross: crossSummary(c.result),
      /** The grade's power and efficiency limits: met or not with their numbers, or why not judged. */
      power: powerGradeSummary(c.result),
      /** Why no verdict where a flow was measured, or that it was judged on the published part of the curve only (the page's note; quantity tokens), or null. */
      note: verdictNote(c.result),
      /** Today's verdict on the check's own readings where it differs from the stored one (judged-today.ts), or null. */
      today: c.shown.today,
      /** The verdict the list shows: today's with its rule and numbers, the stored one beside it where they differ (listed-verdict.ts). */
      shown: c.shown,
    };
  });
}
