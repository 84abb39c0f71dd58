// The field checks of one selection, for the engineer's selection page: who recorded each and when,
// what the pump delivered, and the verdict with the tolerance rule it was judged by. Only for the
// selection's own workspace (contractors of a shared project see them on the field pages instead).
import { data } from "react-router";
import type { Viewer } from "../libraries";
import { checkHistory } from "./records.server";
import { gradeRule } from "./form";

export async function checksOfSelection(viewer: Viewer, selectionId: number) {
  const history = await checkHistory(viewer, selectionId);
  if (!history.selection.own) throw data("No such selection in this workspace.", { status: 404 });
  return history.checks.map((c) => {
    return {
      id: c.id,
      version: c.version,
      superseded: c.superseded,
      createdAt: c.createdAt,
      byName: c.byName,
      byWorkspace: c.byWorkspace,
      flow: c.result.delivered.flow,
      head: c.result.delivered.head,
      flowSource: c.result.engine.flowSource,
      verdict: c.verdict,
      rule: gradeRule(c.result.grade),
    };
  });
}
