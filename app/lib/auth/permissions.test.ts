import { describe, expect, test } from "vitest";
import { can, PERMISSIONS, READ_ONLY_PERMISSIONS, ROLES, type Permission, type Role } from "./permissions";

// The expected table, written out by hand from the product brief's roles (our own product rules):
// Y = allowed. Reading it row by row is the review.
const EXPECTED: Record<Permission, Record<Role, boolean>> = {
  "workspace.read": { admin: true, engineer: true, distributor: true, contractor: true, viewer: true },
  "workspace.rename": { admin: true, engineer: false, distributor: false, contractor: false, viewer: false },
  "members.manage": { admin: true, engineer: false, distributor: false, contractor: false, viewer: false },
  "shares.decide": { admin: true, engineer: false, distributor: false, contractor: false, viewer: false },
  "billing.manage": { admin: true, engineer: false, distributor: false, contractor: false, viewer: false },
  "billing.read": { admin: true, engineer: true, distributor: true, contractor: true, viewer: true },
  "project.read": { admin: true, engineer: true, distributor: false, contractor: true, viewer: true },
  "project.write": { admin: true, engineer: true, distributor: false, contractor: false, viewer: false },
  "selection.write": { admin: true, engineer: true, distributor: false, contractor: false, viewer: false },
  "library.read": { admin: true, engineer: true, distributor: true, contractor: false, viewer: true },
  "library.write": { admin: true, engineer: false, distributor: true, contractor: false, viewer: false },
  "library.publish": { admin: true, engineer: false, distributor: true, contractor: false, viewer: false },
  "fieldcheck.read": { admin: true, engineer: true, distributor: false, contractor: true, viewer: true },
  "fieldcheck.write": { admin: true, engineer: true, distributor: false, contractor: true, viewer: false },
  "calc.use": { admin: true, engineer: true, distributor: true, contractor: true, viewer: true },
};

describe("permission map (role × action)", () => {
  test("covers every permission and nothing else", () => {
    expect(Object.keys(PERMISSIONS).sort()).toEqual(Object.keys(EXPECTED).sort());
  });
  for (const p of Object.keys(EXPECTED) as Permission[]) {
    for (const r of ROLES) {
      test(`${r} ${EXPECTED[p][r] ? "may" : "may not"} ${p}`, () => {
        expect(can(r, p)).toBe(EXPECTED[p][r]);
      });
    }
  }
  test("no role, no permission", () => {
    expect(can(null, "workspace.read")).toBe(false);
  });
  test("viewers only hold read-only permissions", () => {
    const viewerCan = (Object.keys(EXPECTED) as Permission[]).filter((p) => can("viewer", p));
    expect(viewerCan.every((p) => READ_ONLY_PERMISSIONS.has(p))).toBe(true);
  });
});
