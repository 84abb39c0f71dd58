// Workspaces, their members and invitations.
export * from "./workspaces.server";
export * from "./invitations.server";
