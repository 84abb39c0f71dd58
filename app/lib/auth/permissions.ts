// The one permission map: role × action → allowed. Shared by the server (guards decide) and the UI
// (which only hides what a role cannot do). Tests sweep the whole table (permissions.test.ts).
import { ROLES, type Role } from "../shared/constants";
export { ROLES, type Role };

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Admin — people, plan and billing",
  engineer: "Engineer — projects, systems, selections",
  distributor: "Distributor — pump libraries",
  contractor: "Contractor — field checks",
  viewer: "Viewer — read only",
};

export const PERMISSIONS = {
  "workspace.read": ["admin", "engineer", "distributor", "contractor", "viewer"],
  "workspace.rename": ["admin"],
  "members.manage": ["admin"],
  /** Accept or decline a project another workspace offers this one (it opens that project's selections to every member). */
  "shares.decide": ["admin"],
  "billing.manage": ["admin"],
  "billing.read": ["admin", "engineer", "distributor", "contractor", "viewer"],
  "project.read": ["admin", "engineer", "contractor", "viewer"],
  "project.write": ["admin", "engineer"],
  "selection.write": ["admin", "engineer"],
  "library.read": ["admin", "engineer", "distributor", "viewer"],
  "library.write": ["admin", "distributor"],
  "library.publish": ["admin", "distributor"],
  "fieldcheck.read": ["admin", "engineer", "contractor", "viewer"],
  "fieldcheck.write": ["admin", "contractor", "engineer"],
  "calc.use": ["admin", "engineer", "distributor", "contractor", "viewer"],
} as const satisfies Record<string, readonly Role[]>;

export type Permission = keyof typeof PERMISSIONS;

export function can(role: Role | null | undefined, permission: Permission): boolean {
  if (!role) return false;
  return (PERMISSIONS[permission] as readonly Role[]).includes(role);
}

/** API tokens with read scope may only use permissions that change nothing. */
export const READ_ONLY_PERMISSIONS: ReadonlySet<Permission> = new Set<Permission>([
  "workspace.read",
  "billing.read",
  "project.read",
  "library.read",
  "fieldcheck.read",
  "calc.use",
]);

export function isRole(x: unknown): x is Role {
  return typeof x === "string" && (ROLES as readonly string[]).includes(x);
}
