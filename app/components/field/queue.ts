// The phone's send queue for field checks, in IndexedDB: every check entered with JavaScript is
// kept here first (photos as Blobs), shown as "waiting to send", and removed only once the server
// has answered with the recorded check. Browser only.
import type { CheckFields, FrozenSelection } from "~/lib/fieldchecks";

export type QueuedPhoto = { name: string; type: string; blob: Blob };

export type QueuedCheck = {
  /** Made on the device (crypto.randomUUID); the server records each id once. */
  clientId: string;
  /** The signed-in user and workspace that entered it ("userId/workspaceId"): only they send it. */
  owner: string;
  selectionId: number;
  selectionTitle: string;
  /** The selection's fingerprint when the form was opened (a change is a conflict on sync). */
  basedOn: string;
  fields: CheckFields;
  photos: QueuedPhoto[];
  /** The phone's clock when the check was kept (the readings were taken): sent as `takenAt`. */
  createdAt: string;
  /** What the phone worked out with the engine, shown until the server's own result is in. */
  local: {
    verdict: string;
    verdictText: string;
    flow: number | null;
    head: number;
    /** The grade judged, and the verdict's rule and numbers (cross.ts `crossSummary`) or why there is none (`verdictNote`), quantity tokens; missing from checks kept before. */
    grade?: string;
    cross?: string | null;
    note?: string | null;
    /** The verdict's rule and numbers in one paragraph (listed-verdict.ts `verdictRule`); missing from checks kept before. */
    rule?: string;
  };
  /**
   * The selection as the phone worked the check out against (the fingerprint `basedOn`): the queue works the readings out
   * again with the engine the phone has today, on every page (pending-verdict.ts). Missing from checks kept before.
   */
  frozen?: FrozenSelection;
  /** "waiting" with a `message`: not sent for a reason that passes (the session is in another workspace). */
  status: "waiting" | "conflict" | "refused";
  message?: string;
  /** A conflict because the amended version was amended meanwhile: the chain's latest, which may be amended instead. */
  latest?: { id: number; version: number } | null;
  /**
   * A conflict because the selection changed since the form was opened (the server's `code: "selection-changed"`): only
   * this one may be recorded against the selection as it is now, without its fingerprint.
   */
  selectionChanged?: boolean;
  /** Refused for its photos (too large, or not images): it may be sent again without them. */
  refusedFor?: "photos";
};

const DB_NAME = "dutymark-field";
const STORE = "checks";

function open(): Promise<IDBDatabase> {
  return new Promise((resolve, reject) => {
    const req = indexedDB.open(DB_NAME, 1);
    req.onupgradeneeded = () => req.result.createObjectStore(STORE, { keyPath: "clientId" });
    req.onsuccess = () => resolve(req.result);
    req.onerror = () => reject(req.error);
  });
}

async function run<T>(mode: IDBTransactionMode, work: (store: IDBObjectStore) => IDBRequest<T>): Promise<T> {
  const db = await open();
  try {
    return await new Promise<T>((resolve, reject) => {
      const tx = db.transaction(STORE, mode);
      const req = work(tx.objectStore(STORE));
      tx.oncomplete = () => resolve(req.result);
      tx.onerror = () => reject(tx.error);
      tx.onabort = () => reject(tx.error);
    });
  } finally {
    db.close();
  }
}

export const putQueued = (check: QueuedCheck) => run("readwrite", (s) => s.put(check)).then(() => undefined);
export const deleteQueued = (clientId: string) => run("readwrite", (s) => s.delete(clientId)).then(() => undefined);
export const allQueued = () => run<QueuedCheck[]>("readonly", (s) => s.getAll() as IDBRequest<QueuedCheck[]>);
