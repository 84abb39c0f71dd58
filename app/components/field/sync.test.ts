// The phone's queue sends each check for the workspace it was entered in, and keeps it waiting while the
// session works in another one (the server's 409 { staleWorkspace }). Pure parts of sync.ts, no IndexedDB.
// Check values: our own rule (a check is recorded for the workspace whose page it was entered on).
import { describe, expect, test } from "vitest";
import { afterAnswer, checkBody, ownerWorkspaceId } from "./sync";
import type { QueuedCheck } from "./queue";

const queued = (fields: Record<string, string>, owner = "u_abc123/42"): QueuedCheck => ({
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
    const body = checkBody(queued({ flow: "12" }));
    expect(body.get("pageWorkspaceId")).toBe("42");
    expect(body.get("clientId")).toBe("device-id-0001");
    expect(body.get("basedOn")).toBe("f".repeat(32));
  });

  test("the owner's workspace is sent even when the fields say another (one value, the owner's)", () => {
    const body = checkBody(queued({ flow: "12", pageWorkspaceId: "42" }, "u_abc123/42"));
    expect(body.getAll("pageWorkspaceId")).toEqual(["42"]);
    expect(ownerWorkspaceId("user/with/slashes/9")).toBe("9");
  });

  test("sent despite a conflict: no fingerprint", () => {
    expect(checkBody(queued({}), { ignoreConflict: true }).get("basedOn")).toBeNull();
  });
});

describe("what the queue does with the answer", () => {
  test("409 staleWorkspace: the check waits (sent again later), with the server's words", () => {
    const words = "Nothing was changed: this page was for the workspace “A”, and you are now working in “B” (switched in another tab or window). Reload the page and try again.";
    expect(afterAnswer(409, false, { staleWorkspace: words })).toEqual({ kind: "later", message: words });
  });

  test("409 conflict: kept as a conflict; 400: refused; 201: recorded; 503: later", () => {
    expect(afterAnswer(409, false, { conflict: "changed" })).toEqual({ kind: "keep", status: "conflict", message: "changed" });
    expect(afterAnswer(400, false, { errors: { pageWorkspaceId: "older page" } })).toEqual({ kind: "keep", status: "refused", message: "older page" });
    expect(afterAnswer(201, true, { id: 5 })).toEqual({ kind: "recorded", id: 5, duplicate: false });
    expect(afterAnswer(503, false, null)).toEqual({ kind: "later" });
  });
});
