// Sends the queued checks when there is a network: one multipart POST per check to
// /field/selections/:id/checks with its device id and the phone's time it was taken. A dropped answer is
// simply sent again (the server records each id once per user); a conflict or a refusal stays on the phone,
// shown, never merged. Each check goes for the workspace it was entered in (its owner's): while the session
// works in another one (switched in another tab), the server refuses it and it waits here.
import { tooLargeText } from "~/lib/fieldchecks/photo-limits";
import { allQueued, deleteQueued, putQueued, type QueuedCheck } from "./queue";

export type Sent = { clientId: string; id: number; duplicate: boolean };

/** The workspace a queued check was entered in: its owner is "userId/workspaceId". */
export const ownerWorkspaceId = (owner: string) => owner.slice(owner.lastIndexOf("/") + 1);

/** A device-made id: a random UUID (secure contexts), else 128 random bits in hex. */
export function deviceId(): string {
  if (typeof crypto.randomUUID === "function") return crypto.randomUUID();
  return Array.from(crypto.getRandomValues(new Uint8Array(16)), (b) => b.toString(16).padStart(2, "0")).join("");
}

/**
 * The POST body of a queued check: its fields, device id, the phone's time it was kept (`takenAt`), fingerprint
 * (unless sent despite a conflict), photos, and the workspace it was entered in — from its owner, so that checks
 * kept before the form carried that field go too.
 */
export function checkBody(check: QueuedCheck, opts: { ignoreConflict?: boolean } = {}): FormData {
  const body = new FormData();
  for (const [key, value] of Object.entries(check.fields)) body.append(key, value);
  body.set("clientId", check.clientId);
  body.set("pageWorkspaceId", ownerWorkspaceId(check.owner));
  body.set("takenAt", check.createdAt);
  if (!opts.ignoreConflict) body.set("basedOn", check.basedOn);
  for (const photo of check.photos) body.append("photos", new File([photo.blob], photo.name, { type: photo.type }));
  return body;
}

export type Answer = {
  id?: number;
  duplicate?: boolean;
  conflict?: string;
  latest?: { id: number; version: number } | null;
  staleWorkspace?: string;
  code?: string;
  errors?: Record<string, string>;
  detail?: string;
} | null;

export type Next =
  | { kind: "recorded"; id: number; duplicate: boolean }
  | { kind: "keep"; status: QueuedCheck["status"]; message: string; latest?: { id: number; version: number }; selectionChanged?: true; refusedFor?: "photos" }
  | { kind: "later"; message?: string }
  | { kind: "new-id" };

/**
 * What the phone does with the server's answer: forget the check (recorded), keep it in another state (a conflict,
 * with the chain's latest version when that is why; refused, for its photos when that is why), send it again under a
 * new device id (another user's check has this one), or send it again later.
 */
export function afterAnswer(status: number, ok: boolean, answer: Answer): Next {
  if (ok && answer?.id) return { kind: "recorded", id: answer.id, duplicate: !!answer.duplicate };
  // Entered in another workspace than the session's now: it waits, and goes once the phone works there again.
  if (status === 409 && answer?.staleWorkspace) return { kind: "later", message: answer.staleWorkspace };
  // Another user's check has this device id, so this one was not recorded under it.
  if (status === 409 && answer?.code === "client-id-taken") return { kind: "new-id" };
  // A conflict: the amended version was amended meanwhile (`latest`), the selection changed (`code`), or, without either,
  // it was held for another reason (an older page's script that did not say its workspace: a reload resolves it).
  if (status === 409 && answer?.conflict)
    return {
      kind: "keep",
      status: "conflict",
      message: answer.conflict,
      ...(answer.latest ? { latest: answer.latest } : {}),
      ...(answer.code === "selection-changed" ? { selectionChanged: true as const } : {}),
    };
  // The body limit (413, before any JSON) or a photo the server would not take: it may go again without them.
  if (status === 413) return { kind: "keep", status: "refused", message: tooLargeText(), refusedFor: "photos" };
  if (status === 422 && answer?.errors?.photos) return { kind: "keep", status: "refused", message: answer.errors.photos, refusedFor: "photos" };
  if (status >= 400 && status < 500 && status !== 408 && status !== 429) {
    const message = answer?.errors ? Object.values(answer.errors).join(" ") : (answer?.detail ?? `The server refused this check (${status}).`);
    return { kind: "keep", status: "refused", message };
  }
  return { kind: "later" }; // 5xx, 408, 429: try again later
}

async function sendOne(check: QueuedCheck, opts: { ignoreConflict?: boolean; reIded?: boolean } = {}): Promise<Sent | null> {
  let res: Response;
  try {
    res = await fetch(`/field/selections/${check.selectionId}/checks`, { method: "POST", body: checkBody(check, opts), headers: { Accept: "application/json" }, credentials: "same-origin" });
  } catch {
    return null; // no network: stays waiting
  }
  const answer = (await res.json().catch(() => null)) as Answer;
  const next = afterAnswer(res.status, res.ok, answer);
  // What an earlier answer said of it goes: the check is kept with this answer's words only.
  const kept = { ...check, message: undefined, latest: undefined, selectionChanged: undefined, refusedFor: undefined };
  if (next.kind === "recorded") {
    await deleteQueued(check.clientId);
    return { clientId: check.clientId, id: next.id, duplicate: next.duplicate };
  }
  if (next.kind === "new-id" && !opts.reIded) {
    // The same check under a new id, sent once more (a second clash is kept as refused, below).
    const renamed = { ...kept, clientId: deviceId(), status: "waiting" as const };
    await putQueued(renamed);
    await deleteQueued(check.clientId);
    return sendOne(renamed, { ...opts, reIded: true });
  }
  if (next.kind === "new-id") {
    await putQueued({ ...kept, status: "refused", message: answer?.detail ?? `The server refused this check (${res.status}).` });
  } else if (next.kind === "keep") {
    await putQueued({ ...kept, status: next.status, message: next.message, latest: next.latest, selectionChanged: next.selectionChanged, refusedFor: next.refusedFor });
  } else if (next.message) await putQueued({ ...kept, status: "waiting", message: next.message });
  return null;
}

/**
 * The "sent from this phone" list with `done` added once: every caller of a run (the page's load, the network coming
 * back, a button) gets the same run's answer, so the same check must not be listed once per caller.
 */
export function addSent(list: readonly Sent[], done: readonly Sent[]): Sent[] {
  const out = [...list];
  for (const d of done) if (!out.some((x) => x.clientId === d.clientId || x.id === d.id)) out.push(d);
  return out;
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

/**
 * After the contractor has looked at the conflict. The selection changed (the server said so): record against the
 * selection as it is now, without the fingerprint. Any other conflict (held because an older page's script did not say
 * its workspace, or kept so by such a script): sent again with its own fingerprint, since the reload resolved only the
 * workspace, so a change of the selection meanwhile is still caught (and then offers "as it is now").
 */
export const sendDespiteConflict = (check: QueuedCheck) => sendOne({ ...check, status: "waiting" }, { ignoreConflict: check.selectionChanged === true });

/** The amended version was amended meanwhile: record these readings as an amendment of the latest version instead. */
export const sendAsAmendmentOfLatest = (check: QueuedCheck) =>
  check.latest ? sendOne({ ...check, status: "waiting", fields: { ...check.fields, amends: String(check.latest.id) } }) : Promise.resolve(null);

/** Refused for its photos: send the readings without them (the photos are not kept once it is recorded). */
export const sendWithoutPhotos = (check: QueuedCheck) => sendOne({ ...check, status: "waiting", photos: [] });
