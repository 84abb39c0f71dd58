// Sends the queued checks when there is a network: one multipart POST per check to
// /field/selections/:id/checks with its device id, the workspace it was entered in and the phone's time
// it was taken. A dropped answer is simply sent again (the server records each id once); a conflict or a
// refusal stays on the phone, shown, never merged; a check entered in another workspace than the session's
// now stays waiting until the session is back there.
import { tooLargeText } from "~/lib/fieldchecks/photo-limits";
import { allQueued, deleteQueued, putQueued, type QueuedCheck } from "./queue";

export type Sent = { clientId: string; id: number; duplicate: boolean };

type Answer = {
  id?: number;
  duplicate?: boolean;
  conflict?: string;
  latest?: { id: number; version: number } | null;
  otherWorkspace?: string;
  code?: string;
  errors?: Record<string, string>;
  detail?: string;
} | null;

/** The workspace a check was entered in: kept with it, or (checks kept before it was) its owner's "userId/workspaceId". */
export const queuedWorkspaceId = (check: QueuedCheck): string => (check.workspace ? String(check.workspace.id) : (check.owner.split("/")[1] ?? ""));

/** A device-made id: a random UUID (secure contexts), else 128 random bits in hex. */
export function deviceId(): string {
  if (typeof crypto.randomUUID === "function") return crypto.randomUUID();
  return Array.from(crypto.getRandomValues(new Uint8Array(16)), (b) => b.toString(16).padStart(2, "0")).join("");
}

async function sendOne(check: QueuedCheck, opts: { ignoreConflict?: boolean; reIded?: boolean } = {}): Promise<Sent | null> {
  const body = new FormData();
  for (const [key, value] of Object.entries(check.fields)) body.append(key, value);
  body.set("clientId", check.clientId);
  body.set("pageWorkspaceId", queuedWorkspaceId(check));
  body.set("takenAt", check.createdAt);
  if (!opts.ignoreConflict) body.set("basedOn", check.basedOn);
  for (const photo of check.photos) body.append("photos", new File([photo.blob], photo.name, { type: photo.type }));
  let res: Response;
  try {
    res = await fetch(`/field/selections/${check.selectionId}/checks`, { method: "POST", body, headers: { Accept: "application/json" }, credentials: "same-origin" });
  } catch {
    return null; // no network: stays waiting
  }
  const answer = (await res.json().catch(() => null)) as Answer;
  const kept = { ...check, message: undefined, latest: undefined, refusedFor: undefined };
  if (res.ok && answer?.id) {
    await deleteQueued(check.clientId);
    return { clientId: check.clientId, id: answer.id, duplicate: !!answer.duplicate };
  }
  if (res.status === 409 && answer?.otherWorkspace) {
    await putQueued({ ...kept, status: "waiting", message: answer.otherWorkspace }); // sent again once the session is back there
  } else if (res.status === 409 && answer?.code === "client-id-taken" && !opts.reIded) {
    // Another user's check has this device id, so this one was not recorded under it: the same check under a new id.
    const renamed = { ...kept, clientId: deviceId(), status: "waiting" as const };
    await putQueued(renamed);
    await deleteQueued(check.clientId);
    return sendOne(renamed, { ...opts, reIded: true });
  } else if (res.status === 409 && answer?.conflict) {
    await putQueued({ ...kept, status: "conflict", message: answer.conflict, latest: answer.latest ?? null });
  } else if (res.status === 413 || (res.status === 422 && answer?.errors?.photos)) {
    await putQueued({ ...kept, status: "refused", refusedFor: "photos", message: res.status === 413 ? tooLargeText() : answer!.errors!.photos });
  } else if (res.status >= 400 && res.status < 500 && res.status !== 408 && res.status !== 429) {
    const message = answer?.errors ? Object.values(answer.errors).join(" ") : (answer?.detail ?? `The server refused this check (${res.status}).`);
    await putQueued({ ...kept, status: "refused", message });
  }
  return null; // 5xx, 408, 429: try again later
}

let running: Promise<Sent[]> | null = null;

/** Sends every waiting check of `owner` (one run at a time); answers what the server recorded. */
export function sendWaiting(owner: string): Promise<Sent[]> {
  running ??= (async () => {
    const sent: Sent[] = [];
    try {
      const queued = (await allQueued()).sort((a, b) => a.createdAt.localeCompare(b.createdAt));
      for (const check of queued) {
        if (check.status !== "waiting" || check.owner !== owner) continue;
        const done = await sendOne(check);
        if (done) sent.push(done);
      }
    } finally {
      running = null;
    }
    return sent;
  })();
  return running;
}

/** After the contractor has looked at the conflict: record against the selection as it is now. */
export const sendDespiteConflict = (check: QueuedCheck) => sendOne({ ...check, status: "waiting" }, { ignoreConflict: true });

/** The amended version was amended meanwhile: record these readings as an amendment of the latest version instead. */
export const sendAsAmendmentOfLatest = (check: QueuedCheck) =>
  check.latest ? sendOne({ ...check, status: "waiting", fields: { ...check.fields, amends: String(check.latest.id) } }) : Promise.resolve(null);

/** Refused for its photos: send the readings without them (the photos are not kept once it is recorded). */
export const sendWithoutPhotos = (check: QueuedCheck) => sendOne({ ...check, status: "waiting", photos: [] });
