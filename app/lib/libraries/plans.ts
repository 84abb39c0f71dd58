// The plan gate: which libraries a viewer sees and how. Pure (no database): the library list, the
// search, the systems API and the field pages all ask the same two functions.
import { can } from "../auth/permissions";
import type { Viewer } from "../auth/viewer.server";
import type { WorkspaceInfo } from "../auth/guards.server";

/** The paid plan opens every shared library (see the plans issue); the free plan lists them locked. */
export function planOpensShared(plan: WorkspaceInfo["plan"]): boolean {
  return plan === "network";
}

export type Access = "owner" | "open" | "locked";

/** A candidate's curve stays in view while its library is the workspace's own or a shared one the plan opens (selections keep frozen copies). */
export function candidateCurveOpen(viewer: Viewer, lib: { workspaceId: number; visibility: string }): boolean {
  return lib.workspaceId === viewer.workspace.id || (lib.visibility === "shared" && planOpensShared(viewer.workspace.plan));
}

/** How `viewer` may see `lib`: owner (full; private only for authors), open (shared and the plan allows), locked (listed, no curves), or null (invisible). */
export function accessTo(viewer: Viewer, lib: { workspaceId: number; visibility: string }): Access | null {
  if (!can(viewer.role, "library.read")) return null;
  if (lib.workspaceId === viewer.workspace.id) {
    if (lib.visibility === "private" && !can(viewer.role, "library.write")) return null;
    return "owner";
  }
  if (lib.visibility !== "shared") return null;
  return planOpensShared(viewer.workspace.plan) ? "open" : "locked";
}
