// Migration 0013_share_consent on shares made before it: they were open to their workspace already, so they must come
// out accepted (nobody recorded as having decided), while a share made after it starts pending. The statements of the
// committed migration file run on a temporary copy of project_shares as migration 0004 created it (the same CREATE
// TABLE, renamed), on one connection of the test database; the foreign-key statement is left out (MariaDB keeps no
// foreign keys on temporary tables). Expected values: decision "shareconsent" (DEVELOPERS.md).
import { readdirSync, readFileSync } from "node:fs";
import { afterAll, expect, test } from "vitest";
import { closeDb, getPool } from "@db/client.server";

afterAll(() => closeDb());

const DIR = "db/migrations";
const statements = (file: string) =>
  readFileSync(`${DIR}/${file}`, "utf8")
    .split("--> statement-breakpoint")
    .map((s) => s.trim())
    .filter(Boolean);
const fileOf = (prefix: string) => readdirSync(DIR).find((f) => f.startsWith(prefix))!;

test("0013 leaves the shares made before it accepted, with no decider, and a share made after it pending", async () => {
  const temp = `ps_before_0013_${Date.now().toString(36)}`;
  const create = statements(fileOf("0004_")).find((s) => s.startsWith("CREATE TABLE `project_shares`"));
  expect(create).toBeDefined();
  const conn = await getPool().getConnection();
  try {
    await conn.query(create!.replace("CREATE TABLE `project_shares`", `CREATE TEMPORARY TABLE \`${temp}\``));
    await conn.query(`INSERT INTO \`${temp}\` (project_id, workspace_id, created_by) VALUES (1, 2, NULL), (3, 4, NULL)`);
    const migration = statements(fileOf("0013_"));
    for (const s of migration.filter((x) => !/FOREIGN KEY/.test(x))) await conn.query(s.replaceAll("`project_shares`", `\`${temp}\``));
    const before = (await conn.query(`SELECT project_id AS p, state, decided_by AS by_, decided_at AS at_ FROM \`${temp}\` ORDER BY id`)) as { p: number; state: string; by_: string | null; at_: Date | null }[];
    expect(before.map((r) => [Number(r.p), r.state, r.by_, r.at_])).toEqual([
      [1, "accepted", null, null],
      [3, "accepted", null, null],
    ]);
    await conn.query(`INSERT INTO \`${temp}\` (project_id, workspace_id, created_by) VALUES (5, 6, NULL)`);
    const [after] = (await conn.query(`SELECT state FROM \`${temp}\` WHERE project_id = 5`)) as { state: string }[];
    expect(after.state).toBe("pending");
  } finally {
    await conn.query(`DROP TEMPORARY TABLE IF EXISTS \`${temp}\``).catch(() => {});
    await conn.release();
  }
});
