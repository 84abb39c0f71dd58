// Backup round trip with Debian's mariadb-dump and mariadb client (db/backup.mjs), on the scratch
// database npm test creates (DATABASE_URL_SCRATCH): a marker written, backed up, changed, restored.
import { mkdtempSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, expect, test } from "vitest";
import * as mariadb from "mariadb";
// @ts-expect-error plain ESM module without types
import { backup, restore } from "../../db/backup.mjs";

const url = process.env.DATABASE_URL_SCRATCH ?? process.env.DATABASE_URL!;
const base = new URL(url);
const conn = () => mariadb.createConnection({ host: base.hostname, port: Number(base.port), user: decodeURIComponent(base.username), password: decodeURIComponent(base.password), database: base.pathname.slice(1) });
const table = `backup_probe_${Date.now().toString(36)}`;

afterAll(async () => {
  const c = await conn();
  await c.query(`DROP TABLE IF EXISTS ${table}`);
  await c.end();
});

test("npm run db:backup / db:restore round trip restores every row, blobs included", async () => {
  const c = await conn();
  await c.query(`CREATE TABLE ${table} (id INT PRIMARY KEY, note VARCHAR(40), data BLOB)`);
  await c.query(`INSERT INTO ${table} VALUES (1, 'before backup ✓', x'00ff10'), (2, 'second', NULL)`);
  const file = path.join(mkdtempSync(path.join(os.tmpdir(), "dm-backup-")), "db.sql");
  const b = await backup(url, file);
  expect(b.bytes).toBeGreaterThan(1000);
  await c.query(`UPDATE ${table} SET note = 'changed after backup' WHERE id = 1`);
  await c.query(`DELETE FROM ${table} WHERE id = 2`);
  await c.end();
  const r = await restore(url, file);
  expect(r.droppedTables).toBeGreaterThanOrEqual(1); // the database's tables were replaced
  const c2 = await conn();
  const rows = await c2.query(`SELECT id, note, HEX(data) AS hex FROM ${table} ORDER BY id`);
  await c2.end();
  expect(rows.map((x: { id: number; note: string; hex: string | null }) => [x.id, x.note, x.hex])).toEqual([
    [1, "before backup ✓", "00FF10"],
    [2, "second", null],
  ]);
});
