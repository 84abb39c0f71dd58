import type { Member } from "./guards.server";
import type { Viewer } from "../libraries.server";

export const viewerOf = (m: Member): Viewer => ({ userId: m.user.id, workspace: m.workspace, role: m.role });
