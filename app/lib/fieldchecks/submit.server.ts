// A submitted check form → a recorded check. One reading of the form for both ways in: the page's
// own form (no JavaScript: answered by a redirect) and the phone's send queue (answered in JSON).
import { EngineInputError } from "~/engine";
import { formId } from "../shared/forms.server";
import type { Viewer } from "../libraries";
import { evaluateCheck } from "./evaluate";
import { gradeById } from "./frozen-curve";
import { parseCheckFields, type CheckFields } from "./form";
import { PhotoRejected, readPhotos } from "./photos.server";
import { CheckConflict, CLIENT_ID, fieldSelection, recordFieldCheck } from "./records.server";
import { readTakenAt } from "./taken-at";
import { checkedHeadRefusal, headRefusal } from "./head-check";

/** Form fields that say how to record, not what was read (never stored among the readings). */
const CONTROL_FIELDS = ["amends", "gradeId", "notes", "clientId", "basedOn", "photos", "takenAt", "pageWorkspaceId"] as const;

export type SubmitOutcome =
  | { ok: true; id: number; duplicate: boolean }
  | { ok: false; status: 400 | 422; errors: Record<string, string>; fields: CheckFields }
  | { ok: false; status: 409; conflict: string; latest: { id: number; version: number } | null; selectionChanged: boolean; fields: CheckFields };

/** Validates the form, reads the photos and records the check (once per device id). */
export async function submitCheckForm(viewer: Viewer, selectionId: number, form: FormData): Promise<SubmitOutcome> {
  const raw: Record<string, string> = {};
  for (const [key, value] of form.entries()) if (typeof value === "string") raw[key] = value;
  // The selection first: the liquid it pumps decides the temperatures the form takes (read once, handed on).
  const selection = await fieldSelection(viewer, selectionId);
  const parsed = parseCheckFields(raw, selection.frozen.system.input.fluid);
  const fields: CheckFields = { ...parsed.fields };
  delete fields.photos;
  const errors: Record<string, string> = parsed.ok ? {} : { ...parsed.errors };
  const gradeId = raw.gradeId && gradeById(raw.gradeId) ? raw.gradeId : null;
  if (!gradeId) errors.gradeId = "Choose a tolerance grade from the table.";
  const clientId = raw.clientId ? raw.clientId : null;
  if (clientId !== null && !CLIENT_ID.test(clientId)) errors._form = "The check id made on the device is not valid.";
  const amends = raw.amends ? formId(form, "amends") : null;
  const taken = readTakenAt(raw.takenAt);
  if (!taken.ok) errors._form = taken.message;
  // Gauges that give no head (suction above discharge…) are misread: refused at the field, never recorded as a failing pump.
  const noHead = parsed.ok ? headRefusal(parsed.readings, selection.frozen.system.input, parsed.fields) : null;
  if (noHead) errors.dPressure = noHead;
  if (!parsed.ok || Object.keys(errors).length) return { ok: false, status: 400, errors, fields };
  // Where the flow is inferred from the curve (no flow meter, a smaller discharge pipe), the check's own head decides.
  if (parsed.readings.flow === null) {
    try {
      const noCheckedHead = checkedHeadRefusal(evaluateCheck(selection.frozen, parsed.readings, gradeId!).delivered.head, parsed.readings, parsed.fields);
      if (noCheckedHead) return { ok: false, status: 400, errors: { dPressure: noCheckedHead }, fields };
    } catch (e) {
      if (e instanceof EngineInputError) return { ok: false, status: 422, errors: { _form: `These readings cannot be worked out: ${e.message}.` }, fields };
      throw e;
    }
  }

  const readingFields: CheckFields = { ...fields };
  for (const key of CONTROL_FIELDS) delete readingFields[key];
  try {
    const photos = await readPhotos(form.getAll("photos"));
    const recorded = await recordFieldCheck(
      viewer,
      selectionId,
      { readings: parsed.readings, fields: readingFields, notes: parsed.notes, gradeId: gradeId!, amends, clientId, basedOn: raw.basedOn || null, takenAt: taken.ok ? taken.takenAt : null },
      photos,
      { selection },
    );
    return { ok: true, id: recorded.id, duplicate: recorded.duplicate };
  } catch (e) {
    if (e instanceof PhotoRejected) return { ok: false, status: 422, errors: { photos: e.message }, fields };
    if (e instanceof EngineInputError) return { ok: false, status: 422, errors: { _form: `These readings cannot be worked out: ${e.message}.` }, fields };
    // `current` (the selection's fingerprint now) is set only when the selection changed since the device opened it.
    if (e instanceof CheckConflict) return { ok: false, status: 409, conflict: e.message, latest: e.latest, selectionChanged: e.current !== "", fields };
    throw e;
  }
}
