// The "new library" and "new project" forms (one `createAsMember` in guards.server.ts): a role without the
// write permission is refused (403) and nothing is written, a bad name answers 400 with the field's error,
// a good form creates the record in the member's workspace and redirects to its page (a plain post without
// JavaScript follows that redirect). Real MariaDB, the routes' own actions. Roles: permissions.ts.
import { afterAll, beforeAll, describe, expect, test } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, db } from "@db/client.server";
import { libraries, projects } from "@db/schema";
import { call, makeMember, type TestMember } from "./harness";
import * as librariesPage from "~/routes/libraries";
import * as projectsPage from "~/routes/projects";

let admin: TestMember;
let contractor: TestMember;
beforeAll(async () => {
  admin = await makeMember("admin");
  contractor = await makeMember("contractor", admin.workspaceId);
});
afterAll(() => closeDb());

const cases = [
  { what: "library", path: "/libraries", action: librariesPage.action, table: libraries, form: { description: "" } },
  { what: "project", path: "/projects", action: projectsPage.action, table: projects, form: { site: "", description: "" } },
] as const;

describe.each(cases)("new $what form", ({ what, path, action, table, form }) => {
  const post = (who: TestMember, name: string) => call(action as never, { path, cookie: who.cookie, form: { ...form, name, pageWorkspaceId: String(who.workspaceId) } });
  const named = (name: string) => db().select({ id: table.id, workspaceId: table.workspaceId }).from(table).where(and(eq(table.name, name), eq(table.workspaceId, admin.workspaceId)));

  test("a contractor is refused and nothing is written", async () => {
    const name = `Refused ${what} ${Date.now()}`;
    expect((await post(contractor, name)).status).toBe(403);
    expect(await named(name)).toEqual([]);
  });

  test("an empty name answers 400 with the name's error", async () => {
    const r = await post(admin, "");
    expect(r.status).toBe(400);
    expect(Object.keys((r.body as { errors: Record<string, string> }).errors)).toEqual(["name"]);
  });

  test("a good form creates the record in the member's workspace and redirects to its page", async () => {
    const name = `New ${what} ${Date.now()}`;
    const r = await post(admin, name);
    const rows = await named(name);
    expect(rows).toHaveLength(1);
    expect(r.status).toBe(302);
    expect(r.location).toBe(`${path}/${rows[0].id}`);
  });
});
