// Applies the committed drizzle-kit migrations in db/migrations to DATABASE_URL.
// Run by `npm start` and `npm test` (through db/cli.mjs), or alone: `npx tsx db/migrate.ts`.
import path from "node:path";
import { fileURLToPath } from "node:url";
import { migrate } from "drizzle-orm/mysql-proxy/migrator";
import { closeDb, db, getPool } from "./client.server";

export async function runMigrations(): Promise<number> {
  const folder = path.join(path.dirname(fileURLToPath(import.meta.url)), "migrations");
  let applied = 0;
  await migrate(
    db(),
    async (queries) => {
      const conn = await getPool().getConnection();
      try {
        for (const q of queries) {
          await conn.query(q);
          applied++;
        }
      } finally {
        await conn.release();
      }
    },
    { migrationsFolder: folder },
  );
  return applied;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === path.resolve(process.argv[1])) {
  runMigrations()
    .then((n) => {
      process.stderr.write(`[db] migrations: ${n === 0 ? "up to date" : `${n} statements applied`}\n`);
      return closeDb();
    })
    .catch(async (err) => {
      process.stderr.write(`[db] migration failed: ${err?.stack ?? err}\n`);
      await closeDb().catch(() => {});
      process.exit(1);
    });
}
