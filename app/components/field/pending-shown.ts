// The verdict the phone's queue shows for a check it keeps ("On this phone", PendingChecks.tsx): the readings worked out
// again with the engine the phone has now (local-check.ts `checkOnPhone`, against the selection the check was kept for),
// beside the verdict kept when it was saved where the two differ — "outside tolerance against grade 2B when saved on
// 2026-12-04; today: within tolerance" — each with its rule and numbers (listed-verdict.ts). Pure.
import { listedVerdict, type FrozenSelection, type ListedVerdict, type Verdict } from "~/lib/fieldchecks";
import type { UnitChoice } from "~/lib/shared/units";
import { checkOnPhone } from "./local-check";
import type { QueuedCheck } from "./queue";

/**
 * What the queue shows of one kept check's verdict.
 * @param c the kept check (its fields as typed, the verdict kept, and the selection it was kept for where it carries it)
 * @param page the selection this page shows, used for a check kept before checks carried theirs when it is the same one (fingerprint)
 * @param units the reader's units (for a refusal's words)
 */
export function pendingShown(c: QueuedCheck, page: { fingerprint: string; frozen: FrozenSelection } | null, units: UnitChoice): ListedVerdict {
  const grade = c.local.grade ?? c.fields.gradeId ?? "";
  const keptRule = c.local.rule ?? ([c.local.cross, c.local.note].filter(Boolean).join(" ") || null);
  const stored = { verdict: c.local.verdict as Verdict, grade, savedAt: c.createdAt, result: null, rule: keptRule };
  const frozen = c.frozen ?? (page && page.fingerprint === c.basedOn ? page.frozen : null);
  if (!frozen) return listedVerdict(stored, null, "not worked out again on this page: the selection's own field page does");
  const today = checkOnPhone(c.fields, frozen, units);
  if (!today.ok) return listedVerdict(stored, null, `the phone's rules today refuse these readings: ${Object.values(today.errors).join(" ")}`);
  return listedVerdict(stored, { verdict: today.local.verdict as Verdict, rule: today.local.rule ?? "" });
}
