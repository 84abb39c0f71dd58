// Sends the queued checks when there is a network: one multipart POST per check to
// /field/selections/:id/checks with its device id. A dropped answer is simply sent again (the
// server records each id once); a conflict or a refusal stays on the phone, shown, never merged.
import { allQueued, deleteQueued, putQueued, type QueuedCheck } from "./queue";

export type Sent = { clientId: string; id: number; duplicate: boolean };

async function sendOne(check: QueuedCheck, opts: { ignoreConflict?: boolean } = {}): Promise<Sent | null> {
  const body = new FormData();
  for (const [key, value] of Object.entries(check.fields)) body.append(key, value);
  body.set("clientId", check.clientId);
  if (!opts.ignoreConflict) body.set("basedOn", check.basedOn);
  for (const photo of check.photos) body.append("photos", new File([photo.blob], photo.name, { type: photo.type }));
  let res: Response;
  try {
    res = await fetch(`/field/selections/${check.selectionId}/checks`, { method: "POST", body, headers: { Accept: "application/json" }, credentials: "same-origin" });
  } catch {
    return null; // no network: stays waiting
  }
  const answer = (await res.json().catch(() => null)) as { id?: number; duplicate?: boolean; conflict?: string; errors?: Record<string, string>; detail?: string } | null;
  if (res.ok && answer?.id) {
    await deleteQueued(check.clientId);
    return { clientId: check.clientId, id: answer.id, duplicate: !!answer.duplicate };
  }
  if (res.status === 409 && answer?.conflict) {
    await putQueued({ ...check, status: "conflict", message: answer.conflict });
  } else if (res.status >= 400 && res.status < 500 && res.status !== 408 && res.status !== 429) {
    const message = answer?.errors ? Object.values(answer.errors).join(" ") : (answer?.detail ?? `The server refused this check (${res.status}).`);
    await putQueued({ ...check, status: "refused", message });
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
