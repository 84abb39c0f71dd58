// The viewer: who asks (user id), in which workspace (with its plan) and with which role. Every
// service that reads or writes workspace data takes one; routes build it from the guard's member.
import type { ApiCaller, Member, WorkspaceInfo } from "./guards.server";
import type { Role } from "./permissions";

export type Viewer = { userId: string; workspace: WorkspaceInfo; role: Role };

export const viewerOf = (m: Member): Viewer => ({ userId: m.user.id, workspace: m.workspace, role: m.role });
/** The viewer an API caller (token or session) acts as. */
export const viewerOfApi = (c: ApiCaller): Viewer => ({ userId: c.userId, workspace: c.workspace, role: c.role });
