// Issue 17, item 5 ("Comparing"), through the route loaders against the real MariaDB:
//  - the engineer's selection page lists that selection's field checks (and only its own), for
//    members of the selection's workspace only;
//  - system and project pages tell a member whose role cannot write (a viewer) that they can only view.
// Expected values: our product rules; the checks' numbers are hand-worked on the fixture's straight-line curve.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { fluidAt } from "~/engine";
import { parseCheckFields } from "~/lib/fieldchecks";
import { recordFieldCheck } from "~/lib/fieldchecks/records.server";
import type { Viewer } from "~/lib/libraries";
import { call, makeMember, type TestMember } from "./harness";
import { fieldsForHead, storeSelection } from "./fieldcheck-fixture";
import * as selectionPage from "~/routes/selections.$id";
import * as systemPage from "~/routes/systems.$id";
import * as projectPage from "~/routes/projects.$id";

const RHO20 = fluidAt({ kind: "water" }, 20).density;
const viewerOf = (m: TestMember): Viewer => ({ userId: m.userId, workspace: { id: m.workspaceId, name: "W", slug: "w", plan: "free" }, role: m.role });
const readings = (head: number) => {
  const r = parseCheckFields(fieldsForHead(head, RHO20, { flow: "0.012" }), { kind: "water" });
  if (!r.ok) throw new Error(JSON.stringify(r.errors));
  return r.readings;
};

let engineer: TestMember;
let viewer: TestMember;
let outsider: TestMember;
let sel: Awaited<ReturnType<typeof storeSelection>>;
let passId: number;
let failId: number;
let otherCheckId: number;

beforeAll(async () => {
  engineer = await makeMember("engineer");
  viewer = await makeMember("viewer", engineer.workspaceId);
  outsider = await makeMember("admin");
  sel = await storeSelection(engineer.workspaceId, engineer.userId, undefined, "Checks listed");
  const other = await storeSelection(engineer.workspaceId, engineer.userId, undefined, "Other selection");
  // The fixture's curve is H = 40 − 1000·Q (m, m³/s): at Q = 0.012 m³/s it gives 28 m. A reading of 28 m is on the
  // curve (within grade 2B); 40 m is 43 % above it (outside 2B: head +5 % at most, ISO 9906:2012, from memory).
  passId = (await recordFieldCheck(viewerOf(engineer), sel.selectionId, { readings: readings(28), fields: {}, notes: "", gradeId: "2B" }, [], { notify: false })).id;
  failId = (await recordFieldCheck(viewerOf(engineer), sel.selectionId, { readings: readings(40), fields: {}, notes: "", gradeId: "2B" }, [], { notify: false })).id;
  otherCheckId = (await recordFieldCheck(viewerOf(engineer), other.selectionId, { readings: readings(28), fields: {}, notes: "", gradeId: "2B" }, [], { notify: false })).id;
});
afterAll(() => closeDb());

type Row = { id: number; verdict: string; flow: number | null; head: number; rule: string; power: string; byName: string; createdAt: string };

describe("field checks on the engineer's selection page", () => {
  test("the selection's checks, newest first, with delivered flow and head, verdict and its rule; none of another selection", async () => {
    const r = await call(selectionPage.loader as never, { path: `/selections/${sel.selectionId}`, cookie: engineer.cookie, params: { id: String(sel.selectionId) } });
    expect(r.status).toBe(200);
    const rows = (r.body as { fieldChecks: Row[] }).fieldChecks;
    expect(rows.map((c) => c.id)).toEqual([failId, passId]);
    expect(rows.map((c) => c.id)).not.toContain(otherCheckId);
    expect(rows.map((c) => c.verdict)).toEqual(["fail", "pass"]);
    expect(rows[1].flow).toBeCloseTo(0.012, 9);
    expect(rows[1].head).toBeCloseTo(28, 6);
    expect(rows[0].head).toBeCloseTo(40, 6);
    expect(rows[0].rule).toMatch(/^2B: flow −\d+\/\+\d+ %, head −\d+\/\+\d+ %, power ≤ \+\d+ %, efficiency ≥ −\d+ % of the curve's \(ISO 9906/);
    expect(rows[0].power).toBe("Power and efficiency were not judged against grade 2B: no power was recorded, so the verdict is on flow and head only."); // our rule: power-grade.ts
    expect(rows[0].byName).toBe("Tester engineer");
  });

  test("a viewer of the same workspace sees them too; a member of another workspace gets 404 and no check", async () => {
    const v = await call(selectionPage.loader as never, { path: `/selections/${sel.selectionId}`, cookie: viewer.cookie, params: { id: String(sel.selectionId) } });
    expect((v.body as { fieldChecks: Row[] }).fieldChecks.length).toBe(2);
    const o = await call(selectionPage.loader as never, { path: `/selections/${sel.selectionId}`, cookie: outsider.cookie, params: { id: String(sel.selectionId) } });
    expect(o.status).toBe(404);
    expect(JSON.stringify(o.body)).not.toContain("fieldChecks");
  });
});

describe("read-only look for members whose role cannot write", () => {
  for (const [page, mod, path] of [
    ["system", systemPage, () => `/systems/${sel.systemId}`],
    ["project", projectPage, () => `/projects/${sel.projectId}`],
  ] as const) {
    test(`${page} page: a viewer gets canWrite false and their role; an engineer canWrite true`, async () => {
      const id = String(page === "system" ? sel.systemId : sel.projectId);
      const v = await call(mod.loader as never, { path: path(), cookie: viewer.cookie, params: { id } });
      expect(v.status).toBe(200);
      expect(v.body).toMatchObject({ canWrite: false, role: "viewer" });
      const e = await call(mod.loader as never, { path: path(), cookie: engineer.cookie, params: { id } });
      expect(e.body).toMatchObject({ canWrite: true, role: "engineer" });
    });
  }
});
