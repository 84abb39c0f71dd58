// The phone's send queue (sync.ts) against the server's answers: what it sends (`checkBody`) and what it does
// with each answer (`afterAnswer`), pure; then whole runs with the IndexedDB queue kept in memory and fetch
// answering as the route does (its answers are proved against MariaDB in
// app/lib/fieldchecks/sync-guards.server.test.ts, taken-at.server.test.ts and
// app/test/stale-workspace-other-forms.test.ts). Each check is sent for the workspace it was entered in and
// waits while the session works in another one (the server's 409 { staleWorkspace }).
// Check values: our own rules (a check is recorded for the workspace whose page it was entered on, once per
// device id and user; photo limits from photo-limits.ts).
import { beforeEach, describe, expect, test, vi } from "vitest";
import type { QueuedCheck } from "./queue";

const store = vi.hoisted(() => new Map<string, unknown>());
vi.mock("./queue", () => ({
  putQueued: async (c: { clientId: string }) => void store.set(c.clientId, c),
  deleteQueued: async (id: string) => void store.delete(id),
  allQueued: async () => [...store.values()],
}));
const { addSent, afterAnswer, checkBody, ownerWorkspaceId, sendAsAmendmentOfLatest, sendDespiteConflict, sendWaiting, sendWithoutPhotos } = await import("./sync");

type Sent = { url: string; body: FormData };
let sent: Sent[] = [];
let answers: (() => Response)[] = [];
const json = (status: number, body: unknown) => () => new Response(JSON.stringify(body), { status, headers: { "content-type": "application/json" } });

beforeEach(() => {
  store.clear();
  sent = [];
  answers = [];
  vi.stubGlobal("fetch", async (url: string, init: { body: FormData }) => {
    sent.push({ url, body: init.body });
    const next = answers.shift();
    if (!next) throw new Error("no answer prepared");
    return next();
  });
});

function queued(extra: Partial<QueuedCheck> = {}): QueuedCheck {
  return {
    clientId: "phone-0000-aaaa",
    owner: "user-1/41",
    selectionId: 7,
    selectionTitle: "Boiler feed",
    basedOn: "f".repeat(32),
    fields: { dPressure: "280", notes: "at handover" },
    photos: [{ name: "gauges.jpg", type: "image/jpeg", blob: new Blob([new Uint8Array([0xff, 0xd8, 0xff])]) }],
    createdAt: "2026-12-03T09:14:05.120Z",
    local: { verdict: "pass", verdictText: "within tolerance", flow: 0.012, head: 28 },
    status: "waiting",
    ...extra,
  };
}
const stored = (id = "phone-0000-aaaa") => store.get(id) as QueuedCheck | undefined;

describe("the phone's send queue", () => {
  test("a check carries the workspace of its owner ('userId/workspaceId') and the device's time it was taken", async () => {
    store.set("phone-0000-aaaa", queued());
    answers.push(json(201, { id: 90, duplicate: false }));
    expect(await sendWaiting("user-1/41")).toEqual([{ clientId: "phone-0000-aaaa", id: 90, duplicate: false }]);
    expect(sent[0].body.get("pageWorkspaceId")).toBe("41");
    expect(sent[0].body.get("takenAt")).toBe("2026-12-03T09:14:05.120Z");
    expect(store.size).toBe(0);
  });

  test("the session has moved to another workspace (409): the check stays waiting, with the server's words, never 'refused'", async () => {
    store.set("phone-0000-aaaa", queued());
    const words = "Nothing was changed: this page was for the workspace “Lowmoor Services”, and you are now working in “Harrow Vell” (switched in another tab or window). Reload the page and try again.";
    answers.push(json(409, { staleWorkspace: words }));
    expect(await sendWaiting("user-1/41")).toEqual([]);
    expect(stored()).toMatchObject({ status: "waiting", message: words });
    // Back in Lowmoor, the next run sends it and the words go with it.
    answers.push(json(201, { id: 92, duplicate: false }));
    expect(await sendWaiting("user-1/41")).toHaveLength(1);
    expect(store.size).toBe(0);
  });

  test("an amendment of a version amended meanwhile is a conflict the user resolves by amending the latest version", async () => {
    store.set("phone-0000-aaaa", queued({ fields: { dPressure: "280", amends: "55" } }));
    answers.push(json(409, { conflict: "Not recorded: check 55 (version 1) was amended meanwhile: version 2 (check 60) …", latest: { id: 60, version: 2 } }));
    await sendWaiting("user-1/41");
    const c = stored()!;
    expect(c).toMatchObject({ status: "conflict", latest: { id: 60, version: 2 } });
    answers.push(json(201, { id: 61, duplicate: false }));
    expect(await sendAsAmendmentOfLatest(c)).toEqual({ clientId: "phone-0000-aaaa", id: 61, duplicate: false });
    expect(sent[1].body.get("amends")).toBe("60");
    expect(sent[1].body.get("basedOn")).toBe("f".repeat(32)); // a changed selection is still caught
    expect(store.size).toBe(0);
  });

  test("held because an older page's script did not say its workspace: sent again after the reload with its own fingerprint", async () => {
    // The route's 409 to a check without its workspace (OLDER_SCRIPT in field.selections.$id.checks.ts): no `code`.
    store.set("phone-0000-aaaa", queued());
    answers.push(json(409, { conflict: "Not recorded: this check was kept by an older copy of this page, which did not say which workspace it was entered in. Reload the page …", latest: null }));
    await sendWaiting("user-1/41");
    const c = stored()!;
    expect(c.status).toBe("conflict");
    expect(c.selectionChanged).toBeUndefined();
    answers.push(json(201, { id: 95, duplicate: false }));
    expect(await sendDespiteConflict(c)).toMatchObject({ id: 95 });
    expect(sent[1].body.get("basedOn")).toBe("f".repeat(32)); // a change of the selection meanwhile is still caught
    expect(sent[1].body.get("pageWorkspaceId")).toBe("41");
    // Kept so by an older script (no marker at all): the same, with its fingerprint.
    store.set("phone-0000-bbbb", queued({ clientId: "phone-0000-bbbb", status: "conflict", message: "Not recorded: …" }));
    answers.push(json(201, { id: 96, duplicate: false }));
    await sendDespiteConflict(stored("phone-0000-bbbb")!);
    expect(sent[2].body.get("basedOn")).toBe("f".repeat(32));
  });

  test("the selection changed (409 code selection-changed): 'as it is now' records without the old fingerprint", async () => {
    store.set("phone-0000-aaaa", queued());
    answers.push(json(409, { conflict: "The selection changed after this phone opened it: …", latest: null, code: "selection-changed" }));
    await sendWaiting("user-1/41");
    const c = stored()!;
    expect(c).toMatchObject({ status: "conflict", selectionChanged: true });
    answers.push(json(201, { id: 97, duplicate: false }));
    expect(await sendDespiteConflict(c)).toMatchObject({ id: 97 });
    expect(sent[1].body.get("basedOn")).toBeNull();
  });

  test("refused for its photos (413 from the body limit, or 422 naming the photos): marked so, and sent again without them", async () => {
    store.set("phone-0000-aaaa", queued());
    answers.push(() => new Response("<html>too large</html>", { status: 413, headers: { "content-type": "text/html" } }));
    await sendWaiting("user-1/41");
    expect(stored()).toMatchObject({ status: "refused", refusedFor: "photos" });
    expect(stored()!.message).toMatch(/at most 11\.5 MB in one check/);
    answers.push(json(201, { id: 93, duplicate: false }));
    expect(await sendWithoutPhotos(stored()!)).toMatchObject({ id: 93 });
    expect(sent[1].body.getAll("photos")).toHaveLength(0);
    expect(store.size).toBe(0);
    store.set("phone-0000-aaaa", queued());
    answers.push(json(422, { errors: { photos: "gauges.jpg is not a JPEG, PNG or WebP image." } }));
    await sendWaiting("user-1/41");
    expect(stored()).toMatchObject({ status: "refused", refusedFor: "photos", message: "gauges.jpg is not a JPEG, PNG or WebP image." });
  });

  test("a device id another user recorded (409 client-id-taken): the check is sent again under a new id, never deleted as sent", async () => {
    store.set("phone-0000-aaaa", queued());
    answers.push(json(409, { title: "Conflict", status: 409, detail: "That check id is already used by another check.", code: "client-id-taken" }));
    answers.push(json(201, { id: 94, duplicate: false }));
    const done = await sendWaiting("user-1/41");
    expect(done).toHaveLength(1);
    expect(done[0].id).toBe(94);
    expect(done[0].clientId).not.toBe("phone-0000-aaaa");
    expect(sent[1].body.get("clientId")).toBe(done[0].clientId);
    expect(store.size).toBe(0);
  });
});

/** A kept check with the fields and owner given and no photos (the pure tests below). */
const pure = (fields: Record<string, string>, owner = "u_abc123/42"): QueuedCheck => ({
  clientId: "device-id-0001",
  owner,
  selectionId: 7,
  selectionTitle: "Pump 1",
  basedOn: "f".repeat(32),
  fields,
  photos: [],
  createdAt: "2026-12-03T10:00:00.000Z",
  local: { verdict: "pass", verdictText: "pass", flow: 0.01, head: 20 },
  status: "waiting",
});

describe("what the queue sends", () => {
  test("a check kept before the form carried the page's workspace goes with its owner's workspace", () => {
    const body = checkBody(pure({ flow: "12" }));
    expect(body.get("pageWorkspaceId")).toBe("42");
    expect(body.get("clientId")).toBe("device-id-0001");
    expect(body.get("basedOn")).toBe("f".repeat(32));
  });

  test("the owner's workspace is sent even when the fields say another (one value, the owner's)", () => {
    const body = checkBody(pure({ flow: "12", pageWorkspaceId: "42" }, "u_abc123/42"));
    expect(body.getAll("pageWorkspaceId")).toEqual(["42"]);
    expect(ownerWorkspaceId("user/with/slashes/9")).toBe("9");
  });

  test("sent despite a conflict: no fingerprint", () => {
    expect(checkBody(pure({}), { ignoreConflict: true }).get("basedOn")).toBeNull();
  });
});

describe("what the queue does with the answer", () => {
  test("409 staleWorkspace: the check waits (sent again later), with the server's words", () => {
    const words = "Nothing was changed: this page was for the workspace “A”, and you are now working in “B” (switched in another tab or window). Reload the page and try again.";
    expect(afterAnswer(409, false, { staleWorkspace: words })).toEqual({ kind: "later", message: words });
  });

  test("409 conflict: kept as a conflict; 400: refused; 201: recorded; 503: later", () => {
    expect(afterAnswer(409, false, { conflict: "changed" })).toEqual({ kind: "keep", status: "conflict", message: "changed" });
    expect(afterAnswer(409, false, { conflict: "changed", latest: null, code: "selection-changed" })).toEqual({ kind: "keep", status: "conflict", message: "changed", selectionChanged: true });
    expect(afterAnswer(400, false, { errors: { gradeId: "Choose a tolerance grade from the table." } })).toEqual({ kind: "keep", status: "refused", message: "Choose a tolerance grade from the table." });
    expect(afterAnswer(201, true, { id: 5 })).toEqual({ kind: "recorded", id: 5, duplicate: false });
    expect(afterAnswer(503, false, null)).toEqual({ kind: "later" });
  });

  test("409 with the chain's latest version, 409 client-id-taken, 413 and 422 for the photos: each kept for what the contractor can do", () => {
    const latest = { id: 60, version: 2 };
    expect(afterAnswer(409, false, { conflict: "amended meanwhile", latest })).toEqual({ kind: "keep", status: "conflict", message: "amended meanwhile", latest });
    expect(afterAnswer(409, false, { code: "client-id-taken", detail: "That check id is already used by another check." })).toEqual({ kind: "new-id" });
    expect(afterAnswer(413, false, null)).toMatchObject({ kind: "keep", status: "refused", refusedFor: "photos" });
    expect(afterAnswer(422, false, { errors: { photos: "gauges.jpg is not a JPEG, PNG or WebP image." } })).toEqual({
      kind: "keep",
      status: "refused",
      message: "gauges.jpg is not a JPEG, PNG or WebP image.",
      refusedFor: "photos",
    });
  });
});

describe("the sent list", () => {
  test("callers of one run (page load, network back) list each recorded check once", async () => {
    const a = { clientId: "c-1", id: 34, duplicate: false };
    const b = { clientId: "c-2", id: 35, duplicate: false };
    let list = addSent([], [a, b]);
    list = addSent(list, [a, b]); // a second caller of the same run
    list = addSent(list, [{ ...a, duplicate: true }]); // a retry answered "duplicate"
    expect(list).toEqual([a, b]);
  });
});
