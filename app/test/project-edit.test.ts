// The project page's edit form says what is wrong in words, as the create form does (FreeText in
// forms.server.ts): at the limit it saves, one character over it refuses with the limit named and
// writes nothing. Real MariaDB, the route's own action. Limits: our product rules (site 200, description 2000).
import { afterAll, beforeAll, expect, test } from "vitest";
import { closeDb } from "@db/client.server";
import { createProject, getProject } from "~/lib/projects";
import { call, makeMember, type TestMember } from "./harness";
import * as projectPage from "~/routes/projects.$id";

let engineer: TestMember;
let projectId: number;
beforeAll(async () => {
  engineer = await makeMember("engineer");
  const v = { userId: engineer.userId, workspace: { id: engineer.workspaceId, name: "W", slug: "w", plan: "free" as const }, role: "engineer" as const };
  projectId = await createProject(v, { name: "Edit limits", site: "Old site", description: "" });
});
afterAll(() => closeDb());

const edit = (site: string, description = "") =>
  call(projectPage.action as never, { path: `/projects/${projectId}`, cookie: engineer.cookie, params: { id: String(projectId) }, form: { intent: "edit", name: "Edit limits", site, description } });
const stored = async () => getProject({ userId: engineer.userId, workspace: { id: engineer.workspaceId, name: "W", slug: "w", plan: "free" }, role: "engineer" }, projectId);

test("site: 200 characters save, 201 are refused with the limit named and nothing written", async () => {
  expect((await edit("s".repeat(200))).status).toBe(200);
  expect((await stored()).site).toBe("s".repeat(200));
  const r = await edit("t".repeat(201));
  expect(r.status).toBe(400);
  expect(JSON.stringify(r.body)).toContain("Keep the site under 200 characters.");
  expect((await stored()).site).toBe("s".repeat(200));
});

test("description: 2001 characters are refused with the limit named", async () => {
  const r = await edit("Site", "d".repeat(2001));
  expect(r.status).toBe(400);
  expect(JSON.stringify(r.body)).toContain("Keep the description under 2000 characters.");
});
