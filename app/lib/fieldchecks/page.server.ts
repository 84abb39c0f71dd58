// What the check page of one selection needs: the selection (with its frozen document, so the
// phone can work a check out offline, and its fingerprint for conflicts), its history, the
// prefilled form (or the amended check's fields).
import { data } from "react-router";
import { parseId } from "../shared/forms.server";
import type { Viewer } from "../libraries";
import type { UnitChoice } from "../shared/units";
import { blankFields, DEFAULT_GRADE, type CheckFields } from "./form";
import { checkHistory, getFieldCheck } from "./records.server";
import { unreadableCheckText } from "./stored-check";
import { crossSummary } from "./cross";
import { settingText, settingToken } from "../projects/setting-step";

export async function checkPage(viewer: Viewer, selectionId: number, unitSystem: UnitChoice, amendParam: string) {
  const history = await checkHistory(viewer, selectionId);
  const selection = history.selection;
  const frozen = selection.frozen;
  const pipeOn = (side: "suction" | "discharge") => frozen.system.input.runs.find((run) => run.side === side)?.diameter;
  let fields: CheckFields = {
    ...blankFields(unitSystem, { suction: pipeOn("suction"), discharge: pipeOn("discharge"), temperatureC: frozen.system.input.temperatureC }),
    gradeId: DEFAULT_GRADE,
  };
  let amends: { id: number; version: number; unreadable: boolean; latest: { id: number; version: number } | null } | null = null;
  const amendId = amendParam ? parseId(amendParam) : null;
  if (amendParam && amendId === null) throw data("Nothing lives at this address.", { status: 404 });
  if (amendId !== null) {
    const amended = await getFieldCheck(viewer, amendId);
    if (amended.check.selectionId !== selection.id) throw data("That check belongs to another selection.", { status: 404 });
    if (!amended.mayAmend) throw data("Only the workspace that recorded a check may amend it.", { status: 403 });
    // A check whose stored record cannot be read may still be amended (a new version with readings entered again): its form starts blank.
    if (amended.readable) fields = { ...amended.fields, gradeId: amended.check.grade, notes: amended.check.notes };
    // Only the chain's latest version may be amended (records.server.ts refuses an older one): the form says so first.
    const last = amended.versions[amended.versions.length - 1];
    amends = { id: amended.check.id, version: amended.check.version, unreadable: !amended.readable, latest: amended.latest || !last ? null : { id: last.id, version: last.version } };
  }
  const speedRatio = frozen.adjustment.method === "speed" ? (frozen.result?.ratio ?? 1) : 1;
  // The setting by the rule the report shows it with (setting-step.ts): whole rpm and whole mm, one decimal more off the
  // step (a selection frozen before settings were rounded up), never rounded to a speed the pump falls short at.
  const published = { speed: frozen.pump.speed, impellerDiameter: frozen.pump.impellerDiameter };
  const trimRatio = frozen.adjustment.method === "trim" ? (frozen.result?.ratio ?? 1) : 1;
  return {
    selection: {
      id: selection.id,
      title: selection.title,
      projectName: selection.projectName,
      systemName: selection.systemName,
      ownerWorkspace: selection.ownerWorkspace,
      own: selection.own,
      pump: frozen.pump.label,
      designSpeed: frozen.pump.speed != null ? frozen.pump.speed * speedRatio : null,
      designSpeedText: frozen.pump.speed != null ? settingText("speed", speedRatio, published) : null,
      /**
       * The trimmed impeller as set (a diameter token, in the reader's units once rendered), as the report's Adjustment writes
       * it: a trim is set in whole mm for every reader, so in inches the whole mm a site turns it to is beside it, "Ø7.44 in
       * [189 mm]" (setting-step.ts `settingToken`, stepToo); null when not trimmed.
       */
      impeller: frozen.adjustment.method === "trim" ? `trimmed to ${settingToken("trim", trimRatio, published, true)}${published.impellerDiameter ? "" : " of the curve's impeller"}` : null,
      duty: frozen.system.input.duty,
      arrangement: frozen.adjustment.arrangement,
      dutyPumps: frozen.adjustment.dutyPumps,
      fingerprint: selection.fingerprint,
      frozen: forTheField(frozen),
    },
    history: history.checks.map((check) => {
      const base = { id: check.id, version: check.version, superseded: check.superseded, createdAt: check.createdAt, times: check.times, byName: check.byName, byWorkspace: check.byWorkspace };
      if (!check.readable) return { ...base, readable: false as const, unreadable: unreadableCheckText(check) };
      return {
        ...base,
        readable: true as const,
        verdict: check.verdict,
        grade: check.grade,
        flow: check.result.delivered.flow,
        head: check.result.delivered.head,
        flowSource: check.result.engine.flowSource,
        /** The verdict's rule and numbers on flow and head (quantity tokens, rendered by the loader), or null. */
        cross: crossSummary(check.result),
        /** The verdict the list shows: today's with its rule and numbers, the stored one beside it where they differ (listed-verdict.ts). */
        shown: check.shown,
      };
    }),
    fields,
    amends,
  };
}

/**
 * What the field page and the phone need of a frozen selection to judge a check (offline too): the system, its
 * curve, the pump, the adjustment and the result. Not the duty cycle's energy, the purchase price or the life-cycle
 * cost: a contractor of another workspace reads this page, and the owner's commercial figures are not theirs.
 */
function forTheField<F extends { energy?: unknown; result: { figures: { annualCost: number | null; motor: { annualCost: number | null } } | null } }>(frozen: F): Omit<F, "energy"> {
  const { energy: _energy, ...rest } = frozen;
  const figures = rest.result.figures;
  // The yearly energy cost too (the owner's tariff): the energy in kWh stays, it is physics, not price.
  return figures ? { ...rest, result: { ...rest.result, figures: { ...figures, annualCost: null, motor: { ...figures.motor, annualCost: null } } } } : rest;
}
