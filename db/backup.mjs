// `npm run db:backup [-- FILE]` and `npm run db:restore -- FILE`: a logical backup with Debian's
// mariadb-dump and its restore with the mariadb client, for DATABASE_URL (or the local npm start
// database). A restore first drops every table of the target database, then loads the file.
import { spawn } from "node:child_process";
import { createReadStream, createWriteStream, mkdirSync, statSync } from "node:fs";
import path from "node:path";

function args(url) {
  const u = new URL(url);
  return {
    database: u.pathname.replace(/^\//, ""),
    conn: ["--no-defaults", `--host=${u.hostname}`, `--port=${u.port || 3306}`, `--user=${decodeURIComponent(u.username)}`, `--password=${decodeURIComponent(u.password)}`, "--protocol=TCP"],
  };
}

function run(cmd, argv, { stdin, stdout } = {}) {
  return new Promise((resolve, reject) => {
    const child = spawn(cmd, argv, { stdio: [stdin ? "pipe" : "ignore", stdout ? "pipe" : "inherit", "pipe"] });
    let err = "";
    child.stderr.on("data", (b) => (err += b));
    if (stdin) stdin.pipe(child.stdin);
    if (stdout) child.stdout.pipe(stdout);
    child.on("error", reject);
    child.on("exit", (code) => (code === 0 ? resolve() : reject(new Error(`${cmd} exited ${code}: ${err.trim()}`))));
  });
}

export async function backup(url, file) {
  const { database, conn } = args(url);
  mkdirSync(path.dirname(file), { recursive: true });
  const out = createWriteStream(file);
  // --single-transaction: a consistent snapshot of InnoDB tables without locking the app out.
  await run("mariadb-dump", [...conn, "--single-transaction", "--skip-lock-tables", "--routines", "--hex-blob", "--add-drop-table", database], { stdout: out });
  await new Promise((r) => out.end(r));
  return { file, bytes: statSync(file).size };
}

export async function restore(url, file) {
  const { database, conn } = args(url);
  const list = [];
  await new Promise((resolve, reject) => {
    const c = spawn("mariadb", [...conn, "--batch", "--skip-column-names", "-e", "SHOW TABLES", database], { stdio: ["ignore", "pipe", "inherit"] });
    c.stdout.on("data", (b) => list.push(...b.toString().split("\n").filter(Boolean)));
    c.on("exit", (code) => (code === 0 ? resolve() : reject(new Error("could not list tables"))));
  });
  if (list.length) {
    const drop = `SET FOREIGN_KEY_CHECKS=0; ${list.map((t) => `DROP TABLE IF EXISTS \`${t.replace(/`/g, "")}\`;`).join(" ")} SET FOREIGN_KEY_CHECKS=1;`;
    await run("mariadb", [...conn, "-e", drop, database]);
  }
  await run("mariadb", [...conn, database], { stdin: createReadStream(file) });
  return { file, droppedTables: list.length };
}
