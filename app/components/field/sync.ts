// Sends the queued checks when there is a network: one multipart POST per check to
// /field/selections/:id/checks with its device id. A dropped answer is simply sent again (the
// server records each id once); a conflict or a refusal stays on the phone, shown, never merged.
// Each check goes for the workspace it was entered in (its owner's): while the session works in
// another one (switched in another tab), the server refuses it and it waits here.
import { allQueued, deleteQueued, putQueued, type QueuedCheck } from "./queue";

export type Sent = { clientId: string; id: number; duplicate: boolean };

/** The workspace a queued check was entered in: its owner is "userId/workspaceId". */
export const ownerWorkspaceId = (owner: string) => owner.slice(owner.lastIndexOf("/") + 1);

/**
 * The POST body of a queued check: its fields, device id, fingerprint (unless sent despite a conflict), photos, and
 * the workspace it was entered in — from its owner, so that checks kept before the form carried that field go too.
 */
export function checkBody(check: QueuedCheck, opts: { ignoreConflict?: boolean } = {}): FormData {
  const body = new FormData();
  for (const [key, value] of Object.entries(check.fields)) body.append(key, value);
  body.set("clientId", check.clientId);
  body.set("pageWorkspaceId", ownerWorkspaceId(check.owner));
  if (!opts.ignoreConflict) body.set("basedOn", check.basedOn);
  for (const photo of check.photos) body.append("photos", new File([photo.blob], photo.name, { type: photo.type }));
  return body;
}

export type Answer = { id?: number; duplicate?: boolean; conflict?: string; staleWorkspace?: string; errors?: Record<string, string>; detail?: string } | null;

/** What the phone does with the server's answer: forget the check (recorded), keep it in another state, or send it again later. */
export function afterAnswer(status: number, ok: boolean, answer: Answer): { kind: "recorded"; id: number; duplicate: boolean } | { kind: "keep"; status: QueuedCheck["status"]; message: string } | { kind: "later"; message?: string } {
  if (ok && answer?.id) return { kind: "recorded", id: answer.id, duplicate: !!answer.duplicate };
  // Entered in another workspace than the session's now: it waits, and goes once the phone works there again.
  if (status === 409 && answer?.staleWorkspace) return { kind: "later", message: answer.staleWorkspace };
  if (status === 409 && answer?.conflict) return { kind: "keep", status: "conflict", message: answer.conflict };
  if (status >= 400 && status < 500 && status !== 408 && status !== 429) {
    const message = answer?.errors ? Object.values(answer.errors).join(" ") : (answer?.detail ?? `The server refused this check (${status}).`);
    return { kind: "keep", status: "refused", message };
  }
  return { kind: "later" }; // 5xx, 408, 429: try again later
}

async function sendOne(check: QueuedCheck, opts: { ignoreConflict?: boolean } = {}): Promise<Sent | null> {
  let res: Response;
  try {
    res = await fetch(`/field/selections/${check.selectionId}/checks`, { method: "POST", body: checkBody(check, opts), headers: { Accept: "application/json" }, credentials: "same-origin" });
  } catch {
    return null; // no network: stays waiting
  }
  const answer = (await res.json().catch(() => null)) as Answer;
  const next = afterAnswer(res.status, res.ok, answer);
  if (next.kind === "recorded") {
    await deleteQueued(check.clientId);
    return { clientId: check.clientId, id: next.id, duplicate: next.duplicate };
  }
  if (next.kind === "keep") await putQueued({ ...check, status: next.status, message: next.message });
  else if (next.message) await putQueued({ ...check, status: "waiting", message: next.message });
  return null;
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
