// What the phone does with the form before it keeps a check to send: the same reading of the fields as the server's
// (`parseCheckFields`, the grade, `headRefusal` — readings that give the pump a total head at or below zero refused at the
// discharge reading with the head they give, submit.server.ts), then the check worked out on the phone with the same engine
// (`evaluateCheck`). A check the server would refuse is never queued: the contractor sees the field error on site. Pure.
import { checkedHeadRefusal, crossSummary, evaluateCheck, gradeById, headRefusal, parseCheckFields, verdictNote, verdictRule, type FrozenSelection } from "~/lib/fieldchecks";
import { renderUnits, type UnitChoice } from "~/lib/shared/units";
import type { QueuedCheck } from "./queue";

export type LocalCheck = { ok: true; local: QueuedCheck["local"] } | { ok: false; errors: Record<string, string> };

/**
 * The form's fields read as the server reads them, and the check worked out on the phone, or the field errors.
 * @param raw the form's text fields as typed (units in their own fields)
 * @param frozen the selection the check is against (SI)
 * @param units the reader's units, for a message worked out here
 * @param photoError the photos' problem as the server holds them (photo-limits.ts), or null
 */
export function checkOnPhone(raw: Record<string, string>, frozen: FrozenSelection, units: UnitChoice, photoError: string | null = null): LocalCheck {
  const parsed = parseCheckFields(raw, frozen.system.input.fluid);
  const found: Record<string, string> = parsed.ok ? {} : { ...parsed.errors };
  if (!gradeById(raw.gradeId ?? "")) found.gradeId = "Choose a tolerance grade from the table.";
  if (photoError) found.photos = photoError;
  // Gauges that give no head (suction above discharge…) are misread: the server's own refusal, at the same field.
  const noHead = parsed.ok ? headRefusal(parsed.readings, frozen.system.input, parsed.fields) : null;
  if (noHead) found.dPressure = noHead;
  if (!parsed.ok || Object.keys(found).length) return { ok: false, errors: found };
  try {
    const result = evaluateCheck(frozen, parsed.readings, raw.gradeId);
    // The flow inferred from the curve: the check's own head at or below zero is the server's refusal too (submit.server.ts).
    const noCheckedHead = parsed.readings.flow === null ? checkedHeadRefusal(result.delivered.head, parsed.readings, parsed.fields) : null;
    if (noCheckedHead) return { ok: false, errors: { dPressure: noCheckedHead } };
    // The verdict with its grade, rule and numbers (or why there is none), as the server's lists say it.
    const local = { verdict: result.verdict, verdictText: result.verdictText, flow: result.delivered.flow, head: result.delivered.head, grade: result.grade.id, cross: crossSummary(result), note: verdictNote(result), rule: verdictRule(result) };
    return { ok: true, local };
  } catch (e) {
    return { ok: false, errors: { _form: `These readings cannot be worked out: ${renderUnits(e instanceof Error ? e.message : String(e), units)}.` } };
  }
}
